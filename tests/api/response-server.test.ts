/**
 * The server's response cache (app/_server/serve.ts `cachingHandler`) over a real HTTP socket, with
 * a stand-in for Next's handler that counts how often it is asked: a repeated GET is answered
 * without it; a committed change to the database makes it answer again; requests arriving while a
 * response is being made share it; a failing handler answers 500 and is asked again next time;
 * what may not be stored is not; writes always pass.
 */
import http from "node:http";
import type { AddressInfo } from "node:net";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { tempDb, type TempDb } from "../db/temp-db";
import { ResponseCache } from "../../lib/services/response-cache";

let t: TempDb;
let server: http.Server;
let base = "";
let made = 0;
let behaviour: "page" | "slow" | "fail" | "cookie" | "missing" = "page";
let cache: ResponseCache;

type Handler = (req: http.IncomingMessage, res: http.ServerResponse) => Promise<void>;

/** Stands in for Next: answers the page with a count of how often it was made. */
const fakeNext: Handler = async (req, res) => {
  made++;
  const n = made;
  if (behaviour === "fail") throw new Error("the page failed to render");
  if (behaviour === "slow") await new Promise((r) => setTimeout(r, 150));
  if (behaviour === "missing") {
    res.writeHead(404, { "content-type": "text/html" });
    res.end("not here");
    return;
  }
  const headers: Record<string, string> = { "content-type": "text/html; charset=utf-8" };
  if (behaviour === "cookie") headers["set-cookie"] = "a=b";
  res.writeHead(200, headers);
  res.write(`<p>${req.method} ${req.url} `);
  res.end(`made ${n}</p>`);
};

beforeAll(async () => {
  t = await tempDb();
  process.env.DATABASE_URL = t.url;
  const { cachingHandler } = await import("../../app/_server/serve");
  cache = new ResponseCache(1024 * 1024);
  const serve = cachingHandler(fakeNext, cache);
  server = http.createServer((req, res) => {
    serve(req, res).catch(() => {
      if (!res.headersSent) res.writeHead(500);
      res.end("failed");
    });
  });
  await new Promise<void>((r) => server.listen(0, "127.0.0.1", r));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterAll(async () => {
  await new Promise((r) => server.close(r));
  const { db } = await import("../../lib/db/client");
  await db().$disconnect();
  await t.cleanup();
});
beforeEach(() => {
  behaviour = "page";
});

async function get(path: string, init: RequestInit = {}) {
  const res = await fetch(base + path, init);
  return { status: res.status, cache: res.headers.get("x-stoke-cache"), body: await res.text() };
}

describe("the server's response cache", () => {
  it("answers a repeated GET without making it again, with the same bytes", async () => {
    const before = made;
    const a = await get("/fuels");
    const b = await get("/fuels");
    expect(a.cache).toBe("miss");
    expect(b).toEqual({ status: 200, cache: "hit", body: a.body });
    expect(made).toBe(before + 1);
  });

  it("makes the page again after a committed change to the database", async () => {
    const a = await get("/plants");
    expect((await get("/plants")).cache).toBe("hit");
    await t.client.fuel.create({ data: { name: "Revision test gas", kind: "gas", definition: "{}" } });
    const b = await get("/plants");
    expect(b.cache).toBe("miss");
    expect(b.body).not.toBe(a.body);
  });

  it("lets requests that arrive while a page is being made share that one answer", async () => {
    behaviour = "slow";
    const before = made;
    const answers = await Promise.all(Array.from({ length: 5 }, () => get("/studies")));
    expect(made).toBe(before + 1);
    expect(new Set(answers.map((a) => a.body)).size).toBe(1);
    expect(answers.filter((a) => a.cache === "shared")).toHaveLength(4);
  });

  it("answers 500 when the page fails and asks again next time", async () => {
    behaviour = "fail";
    expect((await get("/trash")).status).toBe(500);
    behaviour = "page";
    const again = await get("/trash");
    expect(again.status).toBe(200);
    expect(again.cache).toBe("miss");
  });

  it("stores neither an answer with Set-Cookie nor one other than 200", async () => {
    behaviour = "cookie";
    await get("/accounts-like");
    expect((await get("/accounts-like")).cache).toBe("miss");
    behaviour = "missing";
    await get("/fuels/999999");
    expect((await get("/fuels/999999")).cache).toBe("miss");
  });

  it("passes writes and uncached paths straight on", async () => {
    const before = made;
    expect((await get("/api/fuels/export")).cache).toBe("pass");
    expect((await get("/api/fuels/export")).cache).toBe("pass");
    expect((await get("/fuels", { method: "POST", body: "{}" })).cache).toBe("pass");
    expect(made).toBe(before + 3);
  });

  it("keeps a separate answer per query string and per cookie", async () => {
    await get("/studies/1?metric=co2");
    expect((await get("/studies/1?metric=cost")).cache).toBe("miss");
    expect((await get("/studies/1?metric=co2")).cache).toBe("hit");
    expect((await get("/studies/1?metric=co2", { headers: { cookie: "stoke_units=us" } })).cache).toBe("miss");
  });
});
