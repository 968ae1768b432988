/**
 * The response cache's rules (lib/services/response-cache.ts): what may be cached, what the key
 * holds, the size bound, one making per key. The served behaviour (hit after miss, a change seen at
 * once) is checked against the running server in tests/browser/response-cache.test.ts.
 */
import { describe, expect, it } from "vitest";
import {
  cacheablePath,
  cookiesBut,
  replayHeaders,
  ResponseCache,
  responseCacheBytes,
  responseKey,
  storable,
  type KeyParts,
  type StoredResponse,
} from "../../lib/services/response-cache";

const base: KeyParts = {
  method: "GET",
  url: "/studies/1",
  headers: { host: "127.0.0.1:3000", "accept-encoding": "gzip" },
  cookies: "",
  actor: { name: "local user", accountId: null, role: "admin" },
  dataRevision: 7,
};
const key = (p: Partial<KeyParts>, volatile = "idle", day = "2026-12-02") => responseKey({ ...base, ...p }, volatile, day);
const stored = (bytes: number): StoredResponse => ({ status: 200, headers: { "content-type": "text/html" }, body: Buffer.alloc(bytes) });

describe("what may be cached", () => {
  it("pages but the sign-in page; API reads made from the database; never exports, jobs, sessions or tokens", () => {
    for (const p of [
      "/",
      "/fuels",
      "/fuels/3",
      "/studies/1",
      "/studies/1/sweep",
      "/trash",
      "/api/fuels",
      "/api/fuels/3",
      "/api/studies/2/results",
    ])
      expect({ p, ok: cacheablePath(p) }).toEqual({ p, ok: true });
    for (const p of [
      "/sign-in",
      "/_next/static/chunks/a.js",
      "/api/fuels/export",
      "/api/studies/1/export",
      "/api/studies/1/uncertainty/jobs/abc",
      "/api/session",
      "/api/tokens",
      "/api/accounts",
    ])
      expect({ p, ok: cacheablePath(p) }).toEqual({ p, ok: false });
  });

  it("answers 200 of HTML or JSON without Set-Cookie only", () => {
    expect(storable(200, { "content-type": "text/html; charset=utf-8" })).toBe(true);
    expect(storable(200, { "content-type": "application/json" })).toBe(true);
    expect(storable(200, { "content-type": "text/html", "set-cookie": ["a=b"] })).toBe(false);
    expect(storable(404, { "content-type": "text/html" })).toBe(false);
    expect(storable(307, { "content-type": "text/html" })).toBe(false);
    expect(storable(200, { "content-type": "text/csv" })).toBe(false);
  });

  it("replays the response's own headers, not the connection's", () => {
    const h = replayHeaders({
      "content-type": "text/html",
      vary: "rsc",
      "content-length": "5",
      connection: "keep-alive",
      date: "x",
      "transfer-encoding": "chunked",
    });
    expect(h).toEqual({ "content-type": "text/html", vary: "rsc" });
  });
});

describe("the key", () => {
  it("changes with the path, query, each varying header, cookie, actor, data revision, memory state and day", () => {
    const k = key({});
    const changed = [
      key({ url: "/studies/2" }),
      key({ url: "/studies/1?metric=co2" }),
      key({ headers: { ...base.headers, host: "other:3000" } }),
      key({ headers: { ...base.headers, "accept-encoding": "br" } }),
      key({ headers: { ...base.headers, rsc: "1" } }),
      key({ headers: { ...base.headers, "next-router-state-tree": "%5B%5D" } }),
      key({ cookies: "stoke_units=si" }),
      key({ actor: { name: "a@example.org", accountId: 2, role: "viewer" } }),
      key({ actor: { name: "a@example.org", accountId: 2, role: "editor" } }),
      key({ dataRevision: 8 }),
      key({}, "running"),
      key({}, "idle", "2026-12-03"),
    ];
    for (const c of changed) expect(c).not.toBe(k);
    expect(new Set(changed).size).toBe(changed.length);
    expect(key({})).toBe(k);
  });

  it("does not change with headers Next does not vary by", () => {
    expect(key({ headers: { ...base.headers, "user-agent": "x" } })).toBe(key({}));
  });

  it("keeps every cookie but the session's, in a fixed order", () => {
    expect(cookiesBut("b=2; stoke_session=abc; a=1", "stoke_session")).toBe("a=1; b=2");
    expect(cookiesBut(undefined, "stoke_session")).toBe("");
  });
});

describe("the store", () => {
  it("drops the least recently used entries beyond its size in bytes", () => {
    const c = new ResponseCache(1000);
    c.set("a", stored(400));
    c.set("b", stored(400));
    expect(c.get("a")).toBeDefined(); // a is now the most recent
    c.set("c", stored(400));
    expect(c.get("b")).toBeUndefined();
    expect(c.get("a")).toBeDefined();
    expect(c.get("c")).toBeDefined();
    expect(c.sizeBytes).toBe(800);
    c.set("huge", stored(2000));
    expect(c.get("huge")).toBeUndefined();
    expect(c.sizeBytes).toBe(800);
  });

  it("makes a response once while others wait for it, and keeps only what is storable", async () => {
    const c = new ResponseCache(10_000);
    let makes = 0;
    let release!: () => void;
    const gate = new Promise<void>((r) => (release = r));
    const first = c.fill("k", async () => {
      makes++;
      await gate;
      return stored(10);
    });
    expect(c.pending("k")).toBeDefined();
    const waiting = c.pending("k")!;
    release();
    expect((await first)?.body.length).toBe(10);
    expect((await waiting)?.body.length).toBe(10);
    expect(makes).toBe(1);
    expect(c.pending("k")).toBeUndefined();
    expect(c.get("k")).toBeDefined();
    await c.fill("n", async () => null);
    expect(c.get("n")).toBeUndefined();
  });

  it("reads its size from STOKE_RESPONSE_CACHE_MB and refuses a bad one by name", () => {
    expect(responseCacheBytes(undefined)).toBe(64 * 1024 * 1024);
    expect(responseCacheBytes("0")).toBe(0);
    expect(responseCacheBytes("1.5")).toBe(1.5 * 1024 * 1024);
    expect(() => responseCacheBytes("lots")).toThrow(/STOKE_RESPONSE_CACHE_MB/);
    expect(() => responseCacheBytes("-1")).toThrow(/STOKE_RESPONSE_CACHE_MB/);
  });
});
