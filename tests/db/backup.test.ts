/**
 * Backup and restore: a backup taken while the database is open and being written holds what was
 * committed; a restore brings exactly that back (fuels, quotes, plants, studies) after later changes,
 * through the npm commands; a restore refuses a file that is not a sound Stoke database and leaves
 * the database as it was. On PostgreSQL (STOKE_TEST_PG_URL) the same through pg_dump/pg_restore.
 */
import { execFile } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { promisify } from "node:util";
import Database from "better-sqlite3";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { backupDatabase, restoreDatabase } from "../../lib/db/backup";
import { createClient, type Db } from "../../lib/db/client";
import { seedIfEmpty } from "../../seed/index";
import { tempDb, type TempDb } from "./temp-db";

const run = promisify(execFile);

/** Everything a user stored, as comparable text. */
async function snapshot(db: Db): Promise<string> {
  const [fuels, quotes, plants, studies, scenarios] = await Promise.all([
    db.fuel.findMany({ orderBy: { id: "asc" } }),
    db.priceQuote.findMany({ orderBy: { id: "asc" } }),
    db.plant.findMany({ orderBy: { id: "asc" } }),
    db.study.findMany({ orderBy: { id: "asc" } }),
    db.scenario.findMany({ orderBy: { id: "asc" } }),
  ]);
  return JSON.stringify({ fuels, quotes, plants, studies, scenarios });
}

let t: TempDb;
beforeAll(async () => {
  t = await tempDb();
  await seedIfEmpty(t.client);
});
afterAll(async () => {
  await t?.cleanup();
});

describe("database backup and restore", () => {
  it("a backup taken while the database is open restores exactly what was stored then, through npm run db:backup / db:restore", async () => {
    const before = await snapshot(t.client);
    const file = path.join(t.dir, "backup", "stoke.backup");
    const env = { ...process.env, DATABASE_URL: t.url };
    const b = await run("npm", ["run", "-s", "db:backup", "--", file], { env });
    expect(b.stdout).toMatch(/Backed up/);
    expect(fs.statSync(file).size).toBeGreaterThan(0);
    // Later changes: a new fuel, a deleted quote.
    await t.client.fuel.create({ data: { name: "Added after the backup", kind: "gas", definition: '{"composition":{"CH4":1}}' } });
    const q = await t.client.priceQuote.findFirstOrThrow({
      where: { scenarios: { none: {} }, revisionUses: { none: {} }, supersededBy: { none: {} } },
    });
    await t.client.priceQuote.delete({ where: { id: q.id } });
    expect(await snapshot(t.client)).not.toBe(before);
    await t.client.$disconnect(); // a restore is made with the server stopped
    const r = await run("npm", ["run", "-s", "db:restore", "--", file], { env });
    expect(r.stdout).toMatch(/Restored/);
    const after = createClient(t.url);
    try {
      expect(await snapshot(after)).toBe(before);
    } finally {
      await after.$disconnect();
    }
  }, 60_000);

  it.skipIf(process.env.STOKE_TEST_PG_URL)(
    "refuses a file that is not a Stoke database, or from a newer Stoke, and leaves the database as it was",
    async () => {
      const c = createClient(t.url);
      const before = await snapshot(c);
      await c.$disconnect();
      const text = path.join(t.dir, "not-a-db.backup");
      fs.writeFileSync(text, "hello, I am not a database\n".repeat(100));
      await expect(restoreDatabase(text, t.url)).rejects.toThrow(/not a SQLite database|cannot be opened/);
      const empty = path.join(t.dir, "empty.db");
      new Database(empty).exec("CREATE TABLE x (a INTEGER)");
      await expect(restoreDatabase(empty, t.url)).rejects.toThrow(/not a Stoke database/);
      const newer = path.join(t.dir, "newer.backup");
      await backupDatabase(newer, t.url);
      const n = new Database(newer);
      n.prepare(
        `INSERT INTO "_prisma_migrations" (id, checksum, migration_name, started_at, finished_at, applied_steps_count) VALUES ('x', 'x', '99990101000000_future', '2099-01-01', '2099-01-01', 1)`,
      ).run();
      n.close();
      await expect(restoreDatabase(newer, t.url)).rejects.toThrow(/newer Stoke.*99990101000000_future/);
      const c2 = createClient(t.url);
      try {
        expect(await snapshot(c2)).toBe(before);
      } finally {
        await c2.$disconnect();
      }
    },
  );
});
