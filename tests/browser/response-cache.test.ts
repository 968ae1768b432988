/**
 * The response cache against the running production server: a page asked for again is answered
 * from the cache, byte for byte; a change through the API shows on the next request; a quote added
 * to a fuel of the demo study changes its comparison page at once; cookies and navigation headers
 * get their own answers; exports are never cached.
 */
import { spawnSync } from "node:child_process";
import path from "node:path";
import { describe, expect, inject, it } from "vitest";
import { projectRoot } from "../support/next-server";

const base = inject("baseURL");
const DEMO_STUDY = "Hydrogen blending and biomethane"; // seed/demo.ts
const DEMO_GAS = "Pipeline natural gas"; // seed/demo.ts

async function get(
  path: string,
  headers: Record<string, string> = {},
): Promise<{ status: number; cache: string | null; body: string; type: string }> {
  const res = await fetch(base + path, { headers });
  return {
    status: res.status,
    cache: res.headers.get("x-stoke-cache"),
    body: await res.text(),
    type: res.headers.get("content-type") ?? "",
  };
}

async function send(method: string, path: string, body: unknown): Promise<Response> {
  return fetch(base + path, { method, headers: { "content-type": "application/json", origin: base }, body: JSON.stringify(body) });
}

describe("response cache", () => {
  it("answers a page asked for again from the cache with the same bytes", async () => {
    const first = await get("/fuels");
    const again = await get("/fuels");
    expect(first.status).toBe(200);
    expect(again.cache).toBe("hit");
    expect(again.body).toBe(first.body);
  });

  it("shows a fuel created, renamed and deleted through the API on the next request", async () => {
    await get("/api/fuels");
    expect((await get("/api/fuels")).cache).toBe("hit");
    const made = await send("POST", "/api/fuels", { name: "Cache test gas", definition: { composition: { CH4: 0.9, N2: 0.1 } } });
    expect(made.status).toBe(201);
    const id = ((await made.json()) as { id: number }).id;
    const listed = await get("/api/fuels");
    expect(listed.cache).toBe("miss");
    expect(listed.body).toContain('"Cache test gas"');
    await get(`/fuels/${id}`);
    const renamed = await send("PUT", `/api/fuels/${id}`, {
      name: "Cache test gas, renamed",
      definition: { composition: { CH4: 0.9, N2: 0.1 } },
    });
    expect(renamed.status).toBe(200);
    const page = await get(`/fuels/${id}`);
    expect(page.cache).toBe("miss");
    expect(page.body).toContain("Cache test gas, renamed");
    expect((await fetch(`${base}/api/fuels/${id}`, { method: "DELETE", headers: { origin: base } })).status).toBeLessThan(300);
    expect((await get("/api/fuels")).body).not.toContain("Cache test gas");
  });

  it("changes the comparison page at once when a quote is added to one of its fuels", async () => {
    const studies = JSON.parse((await get("/api/studies")).body) as { studies: { id: number; name: string }[] };
    const studyId = studies.studies.find((s) => s.name === DEMO_STUDY)!.id;
    const before = await get(`/studies/${studyId}`);
    expect((await get(`/studies/${studyId}`)).cache).toBe("hit");
    const fuels = JSON.parse((await get("/api/fuels")).body) as { fuels: { id: number; name: string }[] };
    const gas = fuels.fuels.find((f) => f.name === DEMO_GAS)!;
    const quote = await send("POST", `/api/fuels/${gas.id}/prices`, {
      amount: 987.65,
      currency: "EUR",
      unit: "MWh",
      energyBasis: "gross",
      validFrom: new Date().toISOString().slice(0, 10),
      supplier: "Cache test supplier",
    });
    expect(quote.status).toBe(201);
    const after = await get(`/studies/${studyId}`);
    expect(after.cache).toBe("miss");
    expect(after.body).not.toBe(before.body);
  });

  it("keeps separate answers for a different cookie and for a navigation request", async () => {
    const html = await get("/plants");
    const withCookie = await get("/plants", { cookie: "stoke_cache_test=1" });
    expect(withCookie.cache).not.toBe("hit");
    const rsc = await get("/plants", { rsc: "1" });
    expect(rsc.type).toMatch(/text\/x-component/);
    expect(rsc.body).not.toBe(html.body);
    const htmlAgain = await get("/plants");
    expect(htmlAgain.type).toMatch(/text\/html/);
    expect(htmlAgain.body).toBe(html.body);
  });

  it("never caches exports", async () => {
    expect((await get("/api/fuels/export")).cache).toBe("pass");
    expect((await get("/api/fuels/export")).cache).toBe("pass");
  });

  it("a server with an unusable cache size or port refuses to start and names the setting", () => {
    const file = path.join(projectRoot, "dist", "server", "serve.mjs"); // built by the global set-up
    for (const [name, value] of [
      ["STOKE_RESPONSE_CACHE_MB", "lots"],
      ["PORT", "99999"],
    ]) {
      const r = spawnSync(process.execPath, [file], {
        env: { ...process.env, NODE_ENV: "production", DATABASE_URL: "file:/nonexistent/never-opened.db", [name]: value },
        encoding: "utf8",
        timeout: 20_000,
      });
      expect(r.status).toBe(1);
      expect(r.stderr).toContain(name);
      expect(r.stderr).not.toMatch(/\n\s+at /); // one line, no stack
    }
  });
});
