/**
 * Team mode through the route handlers on a temp SQLite file with STOKE_MODE=team: sign-in required,
 * the three roles, sessions that end on sign-out / role change / password change, API tokens, the
 * Host list, the change log's before and after, and the trash (restore, purge).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { TempDb } from "../db/temp-db";
import { teamRequest, teamServerDatabase, type TeamRequestOptions } from "./team-request";

let t: TempDb;
const saved = { ...process.env };
/** A route handler as Next calls it: the request, and the route's parameters. */
type H = (req: Request, ctx?: { params: Promise<Record<string, string>> }) => Promise<Response>;
type Routes = Record<
  | "session"
  | "fuels"
  | "fuel"
  | "prices"
  | "exportLib"
  | "accounts"
  | "account"
  | "tokens"
  | "token"
  | "trash"
  | "restore"
  | "purge"
  | "history"
  | "plants",
  Record<string, H>
>;
let r: Routes;

const PASSWORD = "correct horse battery staple";
const ids: Record<string, number> = {};

beforeAll(async () => {
  t = await teamServerDatabase();
  const routes = {
    session: await import("../../app/api/session/route"),
    fuels: await import("../../app/api/fuels/route"),
    fuel: await import("../../app/api/fuels/[id]/route"),
    prices: await import("../../app/api/fuels/[id]/prices/route"),
    exportLib: await import("../../app/api/fuels/export/route"),
    accounts: await import("../../app/api/accounts/route"),
    account: await import("../../app/api/accounts/[id]/route"),
    tokens: await import("../../app/api/tokens/route"),
    token: await import("../../app/api/tokens/[id]/route"),
    trash: await import("../../app/api/trash/route"),
    restore: await import("../../app/api/trash/[kind]/[id]/restore/route"),
    purge: await import("../../app/api/trash/[kind]/[id]/purge/route"),
    history: await import("../../app/api/history/[kind]/[id]/route"),
    plants: await import("../../app/api/plants/route"),
  };
  r = routes as unknown as Routes;
  const { createAccount } = await import("../../lib/services/accounts");
  for (const role of ["viewer", "editor", "admin"] as const) {
    const a = await createAccount(t.client, { email: `${role}@example.org`, role, password: PASSWORD });
    if (!a.ok) throw new Error(a.message);
    ids[role] = a.value.id;
  }
});
afterAll(async () => {
  process.env = saved;
  const { db } = await import("../../lib/db/client");
  await db().$disconnect();
  await t.cleanup();
});

const base = "http://localhost";
const ctx = (p: Record<string, string | number>) => ({
  params: Promise.resolve(Object.fromEntries(Object.entries(p).map(([k, v]) => [k, String(v)]))),
});

const req = (path: string, opts: TeamRequestOptions = {}) => teamRequest(base, path, opts);

/** A plain steam boiler burning fuel `fuelId` (the plant form's fields; invented figures). */
const boiler = (name: string, fuelId: number) => ({
  name,
  equipmentType: "steam-boiler",
  ratedInput_kW: 1000,
  operatingHours: 6000,
  averageLoadFraction: 0.7,
  stackTemperatureC: 160,
  flueO2DryPercent: 3,
  combustionAirC: 20,
  radiationLossPercent: 1,
  condensing: false,
  baselineFuelId: fuelId,
});

/** Signs in and answers the Cookie header to send (name=sealed value). */
async function signIn(email: string, password = PASSWORD): Promise<string> {
  const res = await r.session.POST(req("/api/session", { method: "POST", body: { email, password } }));
  expect(res.status, await res.clone().text()).toBe(200);
  const set = res.headers.get("set-cookie") ?? "";
  return set.split(";")[0];
}

const gas = (name: string) => ({ name, definition: { composition: { CH4: 0.9, C2H6: 0.1 } } });

describe("team mode: signing in", () => {
  it("answers 401 to the API without a session, for reads and writes", async () => {
    const get = await r.fuels.GET(req("/api/fuels"));
    expect(get.status).toBe(401);
    expect(get.headers.get("www-authenticate")).toMatch(/^Bearer/);
    expect((await get.json()).error).toMatch(/Sign in/);
    expect((await r.fuels.POST(req("/api/fuels", { method: "POST", body: gas("X") }))).status).toBe(401);
    // A cookie that was not sealed with the secret is no session.
    expect((await r.fuels.GET(req("/api/fuels", { cookie: "stoke_session=forged" }))).status).toBe(401);
  });

  it("sets a sealed, http-only, same-site cookie; a wrong password answers 401 without saying which part was wrong", async () => {
    const res = await r.session.POST(req("/api/session", { method: "POST", body: { email: "viewer@example.org", password: PASSWORD } }));
    const set = res.headers.get("set-cookie") ?? "";
    expect(set).toMatch(/^stoke_session=Fe26\.2\*/); // iron-session's sealed format
    expect(set).toMatch(/HttpOnly/);
    expect(set).toMatch(/SameSite=Lax/);
    // Plain HTTP to a loopback host: Secure would make the browser drop it; any other host gets Secure.
    expect(set).not.toMatch(/Secure/);
    const wrong = await r.session.POST(
      req("/api/session", { method: "POST", body: { email: "viewer@example.org", password: "not the password" } }),
    );
    expect(wrong.status).toBe(401);
    const unknown = await r.session.POST(
      req("/api/session", { method: "POST", body: { email: "nobody@example.org", password: PASSWORD } }),
    );
    expect(unknown.status).toBe(401);
    expect((await wrong.json()).error).toBe((await unknown.json()).error);
  });

  it("slows failed sign-ins: after five failures in a row even the right password waits (429, Retry-After)", async () => {
    const { createAccount } = await import("../../lib/services/accounts");
    await createAccount(t.client, { email: "target@example.org", role: "viewer", password: PASSWORD });
    for (let i = 0; i < 5; i++) {
      const res = await r.session.POST(
        req("/api/session", { method: "POST", body: { email: "target@example.org", password: `guess ${i}` } }),
      );
      expect(res.status).toBe(401);
    }
    const locked = await r.session.POST(req("/api/session", { method: "POST", body: { email: "target@example.org", password: PASSWORD } }));
    expect(locked.status).toBe(429);
    expect(Number(locked.headers.get("retry-after"))).toBeGreaterThan(0);
    const lockedBody = await locked.json();
    expect(lockedBody.error).toMatch(/Too many failed sign-ins/);
    // An e-mail without an account is slowed the same way, so the answer does not tell them apart.
    for (let i = 0; i < 5; i++) {
      const res = await r.session.POST(
        req("/api/session", { method: "POST", body: { email: "ghost@example.org", password: `guess ${i}` } }),
      );
      expect(res.status).toBe(401);
    }
    const ghost = await r.session.POST(req("/api/session", { method: "POST", body: { email: "ghost@example.org", password: PASSWORD } }));
    expect(ghost.status).toBe(429);
    expect((await ghost.json()).error).toBe(lockedBody.error.replace(/\d+ s/, `${ghost.headers.get("retry-after")} s`));
  });
});

describe("team mode: roles", () => {
  it("a viewer reads and exports but cannot write (403 naming the editor role)", async () => {
    const viewer = await signIn("viewer@example.org");
    expect((await r.fuels.GET(req("/api/fuels", { cookie: viewer }))).status).toBe(200);
    expect((await r.exportLib.GET(req("/api/fuels/export?format=json", { cookie: viewer }))).status).toBe(200);
    const res = await r.fuels.POST(req("/api/fuels", { method: "POST", body: gas("Viewer gas"), cookie: viewer }));
    expect(res.status).toBe(403);
    const body = await res.json();
    expect(body.error).toMatch(/needs the editor role/);
    expect(body.needs).toBe("editor");
    expect(await t.client.fuel.count({ where: { name: "Viewer gas" } })).toBe(0);
    expect((await r.accounts.GET(req("/api/accounts", { cookie: viewer }))).status).toBe(403);
  });

  it("an editor writes, moves to the trash and restores, but cannot purge or manage accounts (403 naming admin)", async () => {
    const editor = await signIn("editor@example.org");
    const created = await r.fuels.POST(req("/api/fuels", { method: "POST", body: gas("Editor gas"), cookie: editor }));
    expect(created.status).toBe(201);
    const id = (await created.json()).id;
    ids.editorGas = id;
    expect((await r.fuel.DELETE(req(`/api/fuels/${id}`, { method: "DELETE", cookie: editor }), ctx({ id }))).status).toBe(200);
    // In the trash: gone from look-ups, lists and exports.
    expect((await r.fuel.GET(req(`/api/fuels/${id}`, { cookie: editor }), ctx({ id }))).status).toBe(404);
    const list = await (await r.fuels.GET(req("/api/fuels", { cookie: editor }))).json();
    expect(JSON.stringify(list)).not.toContain("Editor gas");
    const exported = await (await r.exportLib.GET(req("/api/fuels/export?format=json", { cookie: editor }))).text();
    expect(exported).not.toContain("Editor gas");
    const trash = await (await r.trash.GET(req("/api/trash", { cookie: editor }))).json();
    expect(trash.items).toEqual([expect.objectContaining({ kind: "fuel", id, name: "Editor gas", deletedBy: "editor@example.org" })]);
    // Its name stays taken while it is in the trash.
    const again = await r.fuels.POST(req("/api/fuels", { method: "POST", body: gas("Editor gas"), cookie: editor }));
    expect(again.status).toBe(409);
    expect((await again.json()).error).toMatch(/in the trash/);

    const purge = await r.purge.POST(req(`/api/trash/fuel/${id}/purge`, { method: "POST", cookie: editor }), ctx({ kind: "fuel", id }));
    expect(purge.status).toBe(403);
    expect((await purge.json()).error).toMatch(/needs the admin role/);
    expect((await r.accounts.POST(req("/api/accounts", { method: "POST", cookie: editor, body: {} }))).status).toBe(403);

    const restored = await r.restore.POST(
      req(`/api/trash/fuel/${id}/restore`, { method: "POST", cookie: editor }),
      ctx({ kind: "fuel", id }),
    );
    expect(restored.status).toBe(200);
    expect((await r.fuel.GET(req(`/api/fuels/${id}`, { cookie: editor }), ctx({ id }))).status).toBe(200);
  });

  it("an admin purges from the trash; the fuel is gone for good and a restore then finds nothing", async () => {
    const editor = await signIn("editor@example.org");
    const admin = await signIn("admin@example.org");
    const id = ids.editorGas;
    expect((await r.fuel.DELETE(req(`/api/fuels/${id}`, { method: "DELETE", cookie: editor }), ctx({ id }))).status).toBe(200);
    const purge = await r.purge.POST(req(`/api/trash/fuel/${id}/purge`, { method: "POST", cookie: admin }), ctx({ kind: "fuel", id }));
    expect(purge.status).toBe(200);
    expect(await t.client.fuel.count({ where: { id } })).toBe(0);
    const restore = await r.restore.POST(
      req(`/api/trash/fuel/${id}/restore`, { method: "POST", cookie: admin }),
      ctx({ kind: "fuel", id }),
    );
    expect(restore.status).toBe(404);
  });

  it("the existing delete rule stays: a fuel a plant burns is refused (409), also while that plant is in the trash", async () => {
    const editor = await signIn("editor@example.org");
    const f = await (await r.fuels.POST(req("/api/fuels", { method: "POST", body: gas("Plant gas"), cookie: editor }))).json();
    const plant = boiler("Trash boiler", f.id);
    const p = await r.plants.POST(req("/api/plants", { method: "POST", body: plant, cookie: editor }));
    expect(p.status, await p.clone().text()).toBe(201);
    const plantId = (await p.json()).id;
    expect((await r.fuel.DELETE(req(`/api/fuels/${f.id}`, { method: "DELETE", cookie: editor }), ctx({ id: f.id }))).status).toBe(409);
    const plantRoute = (await import("../../app/api/plants/[id]/route")) as unknown as Record<string, H>;
    expect(
      (await plantRoute.DELETE(req(`/api/plants/${plantId}`, { method: "DELETE", cookie: editor }), ctx({ id: plantId }))).status,
    ).toBe(200);
    const res = await r.fuel.DELETE(req(`/api/fuels/${f.id}`, { method: "DELETE", cookie: editor }), ctx({ id: f.id }));
    expect(res.status).toBe(409);
    expect((await res.json()).error).toMatch(/Trash boiler \(in the trash\)/);
  });
});

describe("team mode: sessions end", () => {
  it("on sign-out (that session only), on a role change and on a password change (every session of the account)", async () => {
    const { createAccount } = await import("../../lib/services/accounts");
    const a = await createAccount(t.client, { email: "moving@example.org", role: "editor", password: PASSWORD });
    if (!a.ok) throw new Error(a.message);
    const admin = await signIn("admin@example.org");
    const one = await signIn("moving@example.org");
    const two = await signIn("moving@example.org");
    const three = await signIn("moving@example.org");
    const ok = async (cookie: string) => (await r.fuels.GET(req("/api/fuels", { cookie }))).status;

    const out = await r.session.DELETE(req("/api/session", { method: "DELETE", cookie: one }));
    expect(out.headers.get("set-cookie")).toMatch(/Max-Age=0/);
    expect(await ok(one)).toBe(401);
    expect(await ok(two)).toBe(200);

    const demote = await r.account.PATCH(
      req(`/api/accounts/${a.value.id}`, { method: "PATCH", cookie: admin, body: { role: "viewer" } }),
      ctx({ id: a.value.id }),
    );
    expect(demote.status).toBe(200);
    expect(await ok(two)).toBe(401);
    expect(await ok(three)).toBe(401);

    const four = await signIn("moving@example.org");
    expect(await ok(four)).toBe(200);
    const NEW = "a different long passphrase";
    const reset = await r.account.PATCH(
      req(`/api/accounts/${a.value.id}`, { method: "PATCH", cookie: admin, body: { password: NEW } }),
      ctx({ id: a.value.id }),
    );
    expect(reset.status).toBe(200);
    expect(await ok(four)).toBe(401);
    expect(
      (await r.session.POST(req("/api/session", { method: "POST", body: { email: "moving@example.org", password: PASSWORD } }))).status,
    ).toBe(401);
    const five = await signIn("moving@example.org", NEW);
    expect(await ok(five)).toBe(200);

    const disable = await r.account.PATCH(
      req(`/api/accounts/${a.value.id}`, { method: "PATCH", cookie: admin, body: { disabled: true } }),
      ctx({ id: a.value.id }),
    );
    expect(disable.status).toBe(200);
    expect(await ok(five)).toBe(401);
    expect(
      (await r.session.POST(req("/api/session", { method: "POST", body: { email: "moving@example.org", password: NEW } }))).status,
    ).toBe(401);
  });

  it("the last enabled admin cannot demote or disable itself (409)", async () => {
    const admin = await signIn("admin@example.org");
    const res = await r.account.PATCH(
      req(`/api/accounts/${ids.admin}`, { method: "PATCH", cookie: admin, body: { role: "editor" } }),
      ctx({ id: ids.admin }),
    );
    expect(res.status).toBe(409);
    expect((await res.json()).fieldErrors.role).toMatch(/last enabled admin/);
  });
});

describe("team mode: API tokens", () => {
  it("an admin issues a token; it writes without a session or same-origin Origin, with its account's role; stored hashed; revoked it stops", async () => {
    const admin = await signIn("admin@example.org");
    const issued = await r.tokens.POST(
      req("/api/tokens", { method: "POST", cookie: admin, body: { accountId: ids.editor, tokenName: "nightly import" } }),
    );
    expect(issued.status).toBe(201);
    const { token, id } = await issued.json();
    expect(token).toMatch(/^stk_[A-Za-z0-9_-]{43}$/);
    const row = await t.client.apiToken.findUniqueOrThrow({ where: { id } });
    expect(row.tokenHash).not.toContain(token.slice(4, 20));
    expect(row.tokenHash).toMatch(/^[0-9a-f]{64}$/);

    const write = await r.fuels.POST(
      req("/api/fuels", { method: "POST", bearer: token, body: gas("Token gas"), headers: { origin: "http://elsewhere.example" } }),
    );
    expect(write.status).toBe(201);
    // A cookie from another site without a token is still refused.
    const editor = await signIn("editor@example.org");
    const csrf = await r.fuels.POST(
      req("/api/fuels", { method: "POST", cookie: editor, body: gas("Forged gas"), headers: { origin: "http://elsewhere.example" } }),
    );
    expect(csrf.status).toBe(403);
    // A viewer's token cannot write.
    const vt = await (
      await r.tokens.POST(req("/api/tokens", { method: "POST", cookie: admin, body: { accountId: ids.viewer, tokenName: "reports" } }))
    ).json();
    expect((await r.fuels.GET(req("/api/fuels", { bearer: vt.token }))).status).toBe(200);
    expect((await r.fuels.POST(req("/api/fuels", { method: "POST", bearer: vt.token, body: gas("Viewer token gas") }))).status).toBe(403);
    // Unknown and revoked tokens: 401.
    expect((await r.fuels.GET(req("/api/fuels", { bearer: `${token.slice(0, -2)}xx` }))).status).toBe(401);
    expect((await r.token.DELETE(req(`/api/tokens/${id}`, { method: "DELETE", cookie: admin }), ctx({ id }))).status).toBe(200);
    expect((await r.fuels.GET(req("/api/fuels", { bearer: token }))).status).toBe(401);
  });
});

describe("Host on the allowed list", () => {
  it("answers 421 naming the host for one not on the list, in team and personal mode; STOKE_ALLOWED_HOSTS adds names", async () => {
    const admin = await signIn("admin@example.org");
    const evil = await r.fuels.GET(req("/api/fuels", { cookie: admin, headers: { host: "rebound.example:3000" } }));
    expect(evil.status).toBe(421);
    expect((await evil.json()).error).toMatch(/rebound\.example:3000.*STOKE_ALLOWED_HOSTS/);
    expect((await r.fuels.GET(req("/api/fuels", { cookie: admin, headers: { host: "127.0.0.1:3000" } }))).status).toBe(200);
    process.env.PORT = "3000";
    try {
      expect((await r.fuels.GET(req("/api/fuels", { cookie: admin, headers: { host: "localhost:3001" } }))).status).toBe(421);
      expect((await r.fuels.GET(req("/api/fuels", { cookie: admin, headers: { host: "localhost:3000" } }))).status).toBe(200);
      process.env.STOKE_ALLOWED_HOSTS = "stoke.plant.example";
      expect((await r.fuels.GET(req("/api/fuels", { cookie: admin, headers: { host: "stoke.plant.example" } }))).status).toBe(200);
      expect((await r.fuels.GET(req("/api/fuels", { cookie: admin, headers: { host: "localhost:3000" } }))).status).toBe(421);
      process.env.STOKE_MODE = "personal";
      expect((await r.fuels.GET(req("/api/fuels", { headers: { host: "rebound.example" } }))).status).toBe(421);
    } finally {
      process.env.STOKE_MODE = "team";
      delete process.env.PORT;
      delete process.env.STOKE_ALLOWED_HOSTS;
    }
  });
});

describe("change log", () => {
  it("records who changed what with the record before and after, shown as the fields that differ", async () => {
    const editor = await signIn("editor@example.org");
    const f = await (
      await r.fuels.POST(req("/api/fuels", { method: "POST", body: { ...gas("Logged gas"), notes: "first" }, cookie: editor }))
    ).json();
    const upd = await r.fuel.PUT(
      req(`/api/fuels/${f.id}`, { method: "PUT", cookie: editor, body: { ...gas("Logged gas"), notes: "second" } }),
      ctx({ id: f.id }),
    );
    expect(upd.status).toBe(200);
    const q = await r.prices.POST(
      req(`/api/fuels/${f.id}/prices`, {
        method: "POST",
        cookie: editor,
        body: { amount: 40, currency: "EUR", unit: "MWh", energyBasis: "gross", validFrom: "2026-01-01" },
      }),
      ctx({ id: f.id }),
    );
    expect(q.status, await q.clone().text()).toBe(201);
    const viewer = await signIn("viewer@example.org");
    const h = await (await r.history.GET(req(`/api/history/fuel/${f.id}`, { cookie: viewer }), ctx({ kind: "fuel", id: f.id }))).json();
    expect(h.total).toBe(3);
    const [quote, update, create] = h.entries;
    expect(create).toMatchObject({ actor: "editor@example.org", entity: "fuel", action: "create", before: null });
    expect(create.after).toMatchObject({ name: "Logged gas", notes: "first", definition: { composition: { CH4: 0.9, C2H6: 0.1 } } });
    expect(update).toMatchObject({
      action: "update",
      before: expect.objectContaining({ notes: "first" }),
      after: expect.objectContaining({ notes: "second" }),
    });
    expect(update.differences).toEqual([{ path: "notes", before: "first", after: "second" }]);
    expect(quote).toMatchObject({
      entity: "quote",
      action: "create",
      after: expect.objectContaining({ amount: 40, currency: "EUR", unit: "MWh" }),
    });
    expect(Date.parse(create.at)).toBeLessThanOrEqual(Date.parse(quote.at));
    // Account history is for admins.
    const acc = await r.history.GET(
      req(`/api/history/account/${ids.viewer}`, { cookie: viewer }),
      ctx({ kind: "account", id: ids.viewer }),
    );
    expect(acc.status).toBe(403);
  });

  it("in personal mode the actor is the local user", async () => {
    process.env.STOKE_MODE = "personal";
    try {
      const f = await (await r.fuels.POST(req("/api/fuels", { method: "POST", body: gas("Local gas") }))).json();
      const h = await (await r.history.GET(req(`/api/history/fuel/${f.id}`), ctx({ kind: "fuel", id: f.id }))).json();
      expect(h.entries[0]).toMatchObject({ actor: "local user", action: "create" });
      // Personal mode deletes at once, as it always did, and says so in the log.
      const fuelRoute = (await import("../../app/api/fuels/[id]/route")) as unknown as Record<string, H>;
      expect((await fuelRoute.DELETE(req(`/api/fuels/${f.id}`, { method: "DELETE" }), ctx({ id: f.id }))).status).toBe(200);
      expect(await t.client.fuel.count({ where: { id: f.id } })).toBe(0);
      const after = await (await r.history.GET(req(`/api/history/fuel/${f.id}`), ctx({ kind: "fuel", id: f.id }))).json();
      expect(after.entries[0]).toMatchObject({
        actor: "local user",
        action: "delete",
        after: null,
        before: expect.objectContaining({ name: "Local gas" }),
      });
    } finally {
      process.env.STOKE_MODE = "team";
    }
  });
});

describe("team mode: one's own password", () => {
  it("needs the current password, then ends every session of the account", async () => {
    const { createAccount } = await import("../../lib/services/accounts");
    await createAccount(t.client, { email: "self@example.org", role: "viewer", password: PASSWORD });
    const pw = (await import("../../app/api/session/password/route")) as unknown as Record<string, H>;
    const one = await signIn("self@example.org");
    const two = await signIn("self@example.org");
    const wrong = await pw.POST(
      req("/api/session/password", {
        method: "POST",
        cookie: one,
        body: { currentPassword: "nope", newPassword: "a new long passphrase" },
      }),
    );
    expect(wrong.status).toBe(400);
    expect((await wrong.json()).fieldErrors.currentPassword).toBe("is wrong");
    const ok = await pw.POST(
      req("/api/session/password", {
        method: "POST",
        cookie: one,
        body: { currentPassword: PASSWORD, newPassword: "a new long passphrase" },
      }),
    );
    expect(ok.status).toBe(200);
    expect(ok.headers.get("set-cookie")).toMatch(/Max-Age=0/);
    for (const c of [one, two]) expect((await r.fuels.GET(req("/api/fuels", { cookie: c }))).status).toBe(401);
    await signIn("self@example.org", "a new long passphrase");
    // Without a session there is nobody to change.
    expect((await pw.POST(req("/api/session/password", { method: "POST", body: { currentPassword: "x", newPassword: "y" } }))).status).toBe(
      401,
    );
  });
});

describe("team mode: the trash for plants and studies", () => {
  it("a trashed study leaves lists and look-ups, keeps its plant from being deleted, comes back, and is purged before its plant can go", async () => {
    const editor = await signIn("editor@example.org");
    const admin = await signIn("admin@example.org");
    const studies = (await import("../../app/api/studies/route")) as unknown as Record<string, H>;
    const study = (await import("../../app/api/studies/[id]/route")) as unknown as Record<string, H>;
    const plantRoute = (await import("../../app/api/plants/[id]/route")) as unknown as Record<string, H>;
    const f = await (await r.fuels.POST(req("/api/fuels", { method: "POST", body: gas("Study gas"), cookie: editor }))).json();
    const f2 = await (await r.fuels.POST(req("/api/fuels", { method: "POST", body: gas("Other gas"), cookie: editor }))).json();
    const p = await r.plants.POST(
      req("/api/plants", {
        method: "POST",
        cookie: editor,
        body: boiler("Study boiler", f.id),
      }),
    );
    const plantId = (await p.json()).id;
    const body = {
      plantId,
      name: "Trash study",
      currency: "EUR",
      discountRatePercent: 8,
      horizonYears: 10,
      rankingMetric: "co2-per-useful-MJ",
      baseline: { name: "Today", fuelId: f.id },
      scenarios: [{ name: "Other", fuelId: f2.id }],
    };
    const created = await studies.POST(req("/api/studies", { method: "POST", cookie: editor, body }));
    expect(created.status, await created.clone().text()).toBe(201);
    const id = (await created.json()).id;
    const sctx = ctx({ id });

    expect((await study.DELETE(req(`/api/studies/${id}`, { method: "DELETE", cookie: editor }), sctx)).status).toBe(200);
    expect((await study.GET(req(`/api/studies/${id}`, { cookie: editor }), sctx)).status).toBe(404);
    expect(JSON.stringify(await (await studies.GET(req("/api/studies", { cookie: editor }))).json())).not.toContain("Trash study");
    const blocked = await plantRoute.DELETE(req(`/api/plants/${plantId}`, { method: "DELETE", cookie: editor }), ctx({ id: plantId }));
    expect(blocked.status).toBe(409);
    expect((await blocked.json()).error).toMatch(/"Trash study" \(in the trash\)/);
    // A second study of that name on the plant is refused while the first is in the trash.
    const twin = await studies.POST(req("/api/studies", { method: "POST", cookie: editor, body }));
    expect(twin.status).toBe(409);
    expect((await twin.json()).error).toMatch(/in the trash/);

    expect(
      (await r.restore.POST(req(`/api/trash/study/${id}/restore`, { method: "POST", cookie: editor }), ctx({ kind: "study", id }))).status,
    ).toBe(200);
    expect((await study.GET(req(`/api/studies/${id}`, { cookie: editor }), sctx)).status).toBe(200);

    expect((await study.DELETE(req(`/api/studies/${id}`, { method: "DELETE", cookie: editor }), sctx)).status).toBe(200);
    // Purge only takes what is in the trash.
    expect(
      (await r.purge.POST(req(`/api/trash/plant/${plantId}/purge`, { method: "POST", cookie: admin }), ctx({ kind: "plant", id: plantId })))
        .status,
    ).toBe(404);
    expect(
      (await r.purge.POST(req(`/api/trash/study/${id}/purge`, { method: "POST", cookie: admin }), ctx({ kind: "study", id }))).status,
    ).toBe(200);
    expect(await t.client.scenario.count({ where: { studyId: id } })).toBe(0);
    expect(
      (await plantRoute.DELETE(req(`/api/plants/${plantId}`, { method: "DELETE", cookie: editor }), ctx({ id: plantId }))).status,
    ).toBe(200);
    expect(
      (await r.purge.POST(req(`/api/trash/plant/${plantId}/purge`, { method: "POST", cookie: admin }), ctx({ kind: "plant", id: plantId })))
        .status,
    ).toBe(200);
    expect(await t.client.plant.count({ where: { id: plantId } })).toBe(0);

    const h = await (await r.history.GET(req(`/api/history/study/${id}`, { cookie: editor }), ctx({ kind: "study", id }))).json();
    expect(h.entries.map((e: { action: string; actor: string }) => `${e.action} ${e.actor}`)).toEqual([
      "purge admin@example.org",
      "trash editor@example.org",
      "restore editor@example.org",
      "trash editor@example.org",
      "create editor@example.org",
    ]);
    expect(h.entries[0].before).toMatchObject({
      name: "Trash study",
      scenarios: [expect.objectContaining({ name: "Today" }), expect.objectContaining({ name: "Other" })],
    });
  });
});
