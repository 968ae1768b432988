/**
 * API tokens expire, through the route handlers on a temp SQLite file in team mode: issued with a
 * lifetime (the default when none is chosen, a shorter one when chosen), refused with 401 naming
 * the expiry once it has passed, listed with the expiry and marked when expired; a lifetime out of
 * range answers 400 naming `lifetimeDays` and stores nothing.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { TempDb } from "../db/temp-db";
import { TOKEN_LIFETIME_DEFAULT_DAYS, TOKEN_LIFETIME_MAX_DAYS } from "../../lib/schemas/accounts";
import { teamRequest, teamServerDatabase, type TeamRequestOptions } from "./team-request";

let t: TempDb;
const saved = { ...process.env };
type H = (req: Request, ctx?: { params: Promise<Record<string, string>> }) => Promise<Response>;
let r: Record<"session" | "tokens" | "fuels", Record<string, H>>;
const PASSWORD = "correct horse battery staple";
const base = "http://localhost";
const DAY_MS = 24 * 3600 * 1000;
let admin = "";
let editorId = 0;

const req = (path: string, opts: TeamRequestOptions = {}) => teamRequest(base, path, opts);

beforeAll(async () => {
  t = await teamServerDatabase();
  r = {
    session: await import("../../app/api/session/route"),
    tokens: await import("../../app/api/tokens/route"),
    fuels: await import("../../app/api/fuels/route"),
  } as unknown as typeof r;
  const { createAccount } = await import("../../lib/services/accounts");
  for (const role of ["editor", "admin"] as const) {
    const a = await createAccount(t.client, { email: `${role}@example.org`, role, password: PASSWORD });
    if (!a.ok) throw new Error(a.message);
    if (role === "editor") editorId = a.value.id;
  }
  const res = await r.session.POST(req("/api/session", { method: "POST", body: { email: "admin@example.org", password: PASSWORD } }));
  expect(res.status).toBe(200);
  admin = (res.headers.get("set-cookie") ?? "").split(";")[0];
});
afterAll(async () => {
  process.env = saved;
  const { db } = await import("../../lib/db/client");
  await db().$disconnect();
  await t.cleanup();
});

async function issue(body: Record<string, unknown>): Promise<Response> {
  return r.tokens.POST(req("/api/tokens", { method: "POST", cookie: admin, body: { accountId: editorId, ...body } }));
}

describe("API token lifetimes", () => {
  it("the lifetime defaults to 90 days, at most 365", () => {
    // The issue that asked for expiry: "default … e.g. 90 days; a maximum, e.g. 365 days".
    expect(TOKEN_LIFETIME_DEFAULT_DAYS).toBe(90);
    expect(TOKEN_LIFETIME_MAX_DAYS).toBe(365);
  });

  it("is issued with the default lifetime, or a shorter one the admin chooses; the list shows each expiry", async () => {
    const before = Date.now();
    const plain = await issue({ tokenName: "nightly import" });
    expect(plain.status).toBe(201);
    const p = await plain.json();
    const shortRes = await issue({ tokenName: "one-off audit", lifetimeDays: 7 });
    expect(shortRes.status).toBe(201);
    const s = await shortRes.json();
    const after = Date.now();
    for (const [out, days] of [
      [p, TOKEN_LIFETIME_DEFAULT_DAYS],
      [s, 7],
    ] as const) {
      const at = Date.parse(out.expiresAt);
      expect(at).toBeGreaterThanOrEqual(before + days * DAY_MS);
      expect(at).toBeLessThanOrEqual(after + days * DAY_MS);
      const row = await t.client.apiToken.findUniqueOrThrow({ where: { id: out.id } });
      expect(row.expiresAt.toISOString()).toBe(out.expiresAt);
      // The token works until then, and its use is noted.
      expect((await r.fuels.GET(req("/api/fuels", { bearer: out.token }))).status).toBe(200);
      expect((await t.client.apiToken.findUniqueOrThrow({ where: { id: out.id } })).lastUsedAt).not.toBeNull();
    }
    const list = (await (await r.tokens.GET(req("/api/tokens", { cookie: admin }))).json()).tokens;
    expect(list.find((x: { id: number }) => x.id === s.id)).toMatchObject({ expiresAt: s.expiresAt, expired: false });
    // The change log says how long it is valid.
    const log = await t.client.changeLog.findFirstOrThrow({ where: { entity: "token", entityId: s.id } });
    expect(log.summary).toMatch(/valid 7 days until \d{4}-\d\d-\d\d \d\d:\d\d UTC/);
  });

  it("is refused after its expiry with 401 naming the expiry, and listed as expired", async () => {
    const out = await (await issue({ tokenName: "short-lived" })).json();
    expect((await r.fuels.GET(req("/api/fuels", { bearer: out.token }))).status).toBe(200);
    const past = new Date("2026-01-05T08:30:00Z");
    await t.client.apiToken.update({ where: { id: out.id }, data: { expiresAt: past } });
    const refused = await r.fuels.GET(req("/api/fuels", { bearer: out.token }));
    expect(refused.status).toBe(401);
    expect((await refused.json()).error).toBe(
      "The API token expired on 2026-01-05 08:30 UTC; an admin can issue a new one on the Accounts page.",
    );
    // Writes too.
    const write = await r.fuels.POST(
      req("/api/fuels", { method: "POST", bearer: out.token, body: { name: "Late gas", definition: { composition: { CH4: 1 } } } }),
    );
    expect(write.status).toBe(401);
    expect(await t.client.fuel.count({ where: { name: "Late gas" } })).toBe(0);
    const list = (await (await r.tokens.GET(req("/api/tokens", { cookie: admin }))).json()).tokens;
    expect(list.find((x: { id: number }) => x.id === out.id)).toMatchObject({ expiresAt: past.toISOString(), expired: true });
  });

  it("is refused from the instant of its expiry on an injected clock, accepted the millisecond before", async () => {
    const { issueToken } = await import("../../lib/services/accounts");
    const { authorize } = await import("../../lib/services/access");
    const issuedAt = new Date("2030-03-01T00:00:00Z");
    const out = await issueToken(t.client, { accountId: editorId, tokenName: "clocked", lifetimeDays: 30 }, issuedAt);
    if (!out.ok) throw new Error(out.message);
    expect(out.value.expiresAt).toBe("2030-03-31T00:00:00.000Z");
    const at = (iso: string) => authorize(t.client, "team", "viewer", { sessionKey: null, bearer: out.value.token }, new Date(iso));
    expect((await at("2030-03-30T23:59:59.999Z")).ok).toBe(true);
    const d = await at("2030-03-31T00:00:00.000Z");
    expect(d).toMatchObject({ ok: false, status: 401 });
    expect(d.ok ? "" : d.message).toMatch(/expired on 2030-03-31 00:00 UTC/);
  });

  it("a lifetime that is not a whole number of days from 1 to 365 answers 400 naming lifetimeDays; nothing is stored", async () => {
    const count = await t.client.apiToken.count();
    for (const [bad, says] of [
      [0, /at least 1 day/],
      [-5, /at least 1 day/],
      [TOKEN_LIFETIME_MAX_DAYS + 1, /at most 365 days/],
      [1.5, /whole number of days/],
      ["30", /whole number of days/],
      [null, /whole number of days/],
    ] as const) {
      const res = await issue({ tokenName: "too long", lifetimeDays: bad });
      expect(res.status, String(bad)).toBe(400);
      const body = await res.json();
      expect(Object.keys(body.fieldErrors ?? {}), String(bad)).toEqual(["lifetimeDays"]);
      expect(body.fieldErrors.lifetimeDays, String(bad)).toMatch(says);
    }
    expect(await t.client.apiToken.count()).toBe(count);
    // The longest allowed is accepted.
    expect((await issue({ tokenName: "yearly", lifetimeDays: TOKEN_LIFETIME_MAX_DAYS })).status).toBe(201);
  });
});
