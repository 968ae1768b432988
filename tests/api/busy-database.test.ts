/**
 * SQLite in write-ahead-log mode with a busy timeout: while another connection holds the write
 * lock, reads are answered and a write answers 503 "busy, try again" (with Retry-After) after the
 * timeout instead of a 500 with an empty body; once the lock is released the same write succeeds.
 * The same on PostgreSQL (lock_timeout) with another connection holding the fuel table's lock.
 */
import Database from "better-sqlite3";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

vi.hoisted(() => {
  // A short busy timeout keeps the test fast; production waits 5 s (lib/db/busy-timeout.ts).
  process.env.STOKE_DB_BUSY_TIMEOUT_MS = "150";
});

import { tempDb, type TempDb } from "../db/temp-db";
import { jsonRequest as req } from "./seeded-api";

let t: TempDb;
let fuels: typeof import("../../app/api/fuels/route");

beforeAll(async () => {
  t = await tempDb();
  process.env.DATABASE_URL = t.url;
  fuels = await import("../../app/api/fuels/route");
});
afterAll(async () => {
  const { db } = await import("../../lib/db/client");
  await db().$disconnect();
  await t?.cleanup();
});

describe.skipIf(process.env.STOKE_TEST_PG_URL)("a SQLite database locked by another process", () => {
  it("is in WAL mode", () => {
    const other = new Database(t.file, { readonly: true });
    expect(other.pragma("journal_mode", { simple: true })).toBe("wal");
    other.close();
  });

  it("answers reads, refuses a write with 503 and a message, then takes the write once the lock is gone", async () => {
    const gas = { name: "Locked-out gas", definition: { composition: { CH4: 1 } } };
    const other = new Database(t.file);
    other.exec("BEGIN IMMEDIATE"); // holds the write lock
    try {
      expect((await fuels.GET(req("/api/fuels"))).status).toBe(200);
      const r = await fuels.POST(req("/api/fuels", "POST", gas));
      expect(r.status).toBe(503);
      expect(r.headers.get("retry-after")).toBe("2");
      expect((await r.json()).error).toMatch(/busy.*Try again/s);
    } finally {
      other.exec("ROLLBACK");
      other.close();
    }
    expect((await fuels.POST(req("/api/fuels", "POST", gas))).status).toBe(201);
  });
});

describe.skipIf(!process.env.STOKE_TEST_PG_URL)("a PostgreSQL table locked by another connection", () => {
  it("answers reads, refuses a write with 503 and a message, then takes the write once the lock is gone", async () => {
    const gas = { name: "Locked-out gas", definition: { composition: { CH4: 1 } } };
    const other = new pg.Client({ connectionString: t.url });
    await other.connect();
    await other.query("BEGIN");
    await other.query('LOCK TABLE "Fuel" IN EXCLUSIVE MODE'); // reads pass, writes wait
    try {
      expect((await fuels.GET(req("/api/fuels"))).status).toBe(200);
      const r = await fuels.POST(req("/api/fuels", "POST", gas));
      expect(r.status).toBe(503);
      expect((await r.json()).error).toMatch(/busy.*Try again/s);
    } finally {
      await other.query("ROLLBACK");
      await other.end();
    }
    expect((await fuels.POST(req("/api/fuels", "POST", gas))).status).toBe(201);
  });
});
