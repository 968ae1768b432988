/**
 * What pages may offer each role (`allowedActions`, lib/services/access.ts), and that it agrees with
 * what the server then does: every request an action names is sent, as each role, to the real
 * route handler (API) or through the page gate (form pages) on a temp SQLite file in team mode.
 * An action a role is shown must never be refused; one it is not shown must be refused (403).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { TempDb } from "../db/temp-db";
import { teamServerDatabase } from "./team-request";
import { allowedActions, PAGE_ACTIONS, type PageAction } from "../../lib/services/access";
import { ROLES, type Role } from "../../lib/schemas/accounts";

let t: TempDb;
const saved = { ...process.env };
const PASSWORD = "correct horse battery staple";
const cookies: Partial<Record<Role, string>> = {};
const base = "http://localhost";
const ACTIONS = Object.keys(PAGE_ACTIONS) as PageAction[];

type H = (req: Request, ctx?: { params: Promise<Record<string, string>> }) => Promise<Response>;
/** Every API route module, loaded when first asked for. */
const ROUTES = import.meta.glob("../../app/api/**/route.ts");
/** The route module of a pattern like `/api/fuels/:id` (folders `[id]`), or null. */
async function routeModule(pattern: string): Promise<Record<string, H> | null> {
  const load = ROUTES[`../../app${pattern.replace(/:(\w+)/g, "[$1]")}/route.ts`];
  return load ? ((await load()) as Record<string, H>) : null;
}

beforeAll(async () => {
  t = await teamServerDatabase();
  const { createAccount } = await import("../../lib/services/accounts");
  const session = (await import("../../app/api/session/route")) as unknown as Record<string, H>;
  for (const role of ROLES) {
    const a = await createAccount(t.client, { email: `${role}@example.org`, role, password: PASSWORD });
    if (!a.ok) throw new Error(a.message);
    const res = await session.POST(
      new Request(`${base}/api/session`, {
        method: "POST",
        headers: { "content-type": "application/json", origin: base },
        body: JSON.stringify({ email: `${role}@example.org`, password: PASSWORD }),
      }),
    );
    expect(res.status).toBe(200);
    cookies[role] = (res.headers.get("set-cookie") ?? "").split(";")[0];
  }
});
afterAll(async () => {
  process.env = saved;
  const { db } = await import("../../lib/db/client");
  await db().$disconnect();
  await t.cleanup();
});

describe("allowedActions: what a page may offer", () => {
  it("personal mode offers every action, with or without a role", () => {
    for (const role of [null, ...ROLES]) expect(Object.values(allowedActions("personal", role)).every(Boolean)).toBe(true);
  });

  it("team mode: a viewer none, an editor all but purging and accounts, an admin all, nobody signed in none", () => {
    // The roles of the issue that introduced team mode: viewer reads and exports; editor changes
    // fuels, quotes, plants and studies and restores from the trash; admin also accounts and
    // deletion for good.
    const offered = (role: Role | null) => ACTIONS.filter((a) => allowedActions("team", role)[a]);
    expect(offered(null)).toEqual([]);
    expect(offered("viewer")).toEqual([]);
    expect(offered("editor")).toEqual(ACTIONS.filter((a) => a !== "purgeFromTrash" && a !== "manageAccounts"));
    expect(offered("admin")).toEqual(ACTIONS);
  });

  it("every request an action names exists: an API route handler with that method, or a page", async () => {
    const fs = await import("node:fs");
    for (const [action, requests] of Object.entries(PAGE_ACTIONS)) {
      for (const r of requests) {
        const [method, pattern] = r.split(" ");
        const dir = pattern.replace(/:(\w+)/g, "[$1]");
        if (method === "PAGE") {
          expect(fs.existsSync(`app${dir}/page.tsx`), `${action}: ${r}`).toBe(true);
        } else {
          const mod = await routeModule(pattern);
          expect(typeof mod?.[method], `${action}: ${r}`).toBe("function");
        }
      }
    }
  });
});

describe("allowedActions agrees with the server", () => {
  /** Ids that name nothing: an allowed request then answers 404 or 400, never changing anything. */
  const params = (pattern: string) =>
    Object.fromEntries([...pattern.matchAll(/:(\w+)/g)].map(([, name]) => [name, name === "kind" ? "fuel" : "987654"]));
  const fill = (pattern: string) => pattern.replace(/:(\w+)/g, (_, name: string) => params(pattern)[name]);

  for (const role of ROLES) {
    it(`as ${role}: a shown action's requests pass the gate, a hidden one's answer 403`, async () => {
      const { decide } = await import("../../app/_auth/gate");
      const allowed = allowedActions("team", role);
      const seen: string[] = [];
      for (const action of ACTIONS) {
        for (const r of PAGE_ACTIONS[action]) {
          const [method, pattern] = r.split(" ");
          const path = fill(pattern);
          let status: number;
          if (method === "PAGE") {
            const d = await decide(new Request(base + path, { headers: { cookie: cookies[role] as string } }), path);
            status = d.ok ? 200 : d.status;
          } else {
            const mod = (await routeModule(pattern)) as Record<string, H>;
            const write = method !== "GET";
            const res = await mod[method](
              new Request(base + path, {
                method,
                headers: {
                  cookie: cookies[role] as string,
                  origin: base,
                  ...(write ? { "content-type": "application/json" } : {}),
                },
                body: write && method !== "DELETE" ? "{}" : undefined,
              }),
              { params: Promise.resolve(params(pattern)) },
            );
            status = res.status;
          }
          seen.push(`${action} ${r} ${status}`);
          if (allowed[action]) expect([401, 403], `${role} ${action}: ${r}`).not.toContain(status);
        }
        // Hidden: at least one of its requests is refused for the role (403: signed in, not allowed).
        if (!allowed[action]) {
          const statuses = seen.filter((s) => s.startsWith(`${action} `)).map((s) => Number(s.split(" ").at(-1)));
          expect(statuses, `${role} ${action}`).toContain(403);
        }
      }
    });
  }

  it("nothing was changed by the probes: no fuel, plant, study, account or token was created", async () => {
    expect(await t.client.fuel.count()).toBe(0);
    expect(await t.client.plant.count()).toBe(0);
    expect(await t.client.study.count()).toBe(0);
    expect(await t.client.account.count()).toBe(3);
    expect(await t.client.apiToken.count()).toBe(0);
  });
});
