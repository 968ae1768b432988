import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import Database from "better-sqlite3";
import { afterAll, describe, expect, it } from "vitest";
import { defaultMigrationsDir, migrateSqlite, readMigrations, sha256Hex } from "../../lib/db/migrate";
import { databaseTarget } from "../../lib/db/paths";
import { createClient } from "../../lib/db/client";

const dirs: string[] = [];
function tmp(): string {
  const d = fs.mkdtempSync(path.join(os.tmpdir(), "stoke-mig-"));
  dirs.push(d);
  return d;
}
afterAll(() => {
  for (const d of dirs) fs.rmSync(d, { recursive: true, force: true });
});

describe("migration runner", () => {
  it("creates the file and its folder, applies every migration once, records it as Prisma does", () => {
    const file = path.join(tmp(), "nested", "a.db");
    const first = migrateSqlite({ databaseUrl: `file:${file}` });
    const all = readMigrations().map((m) => m.name);
    expect(all.length).toBeGreaterThan(0);
    expect(first.applied).toEqual(all);
    const second = migrateSqlite({ databaseUrl: `file:${file}` });
    expect(second.applied).toEqual([]);
    expect(second.alreadyApplied).toEqual(all);

    const db = new Database(file, { readonly: true });
    const rows = db.prepare(`SELECT * FROM "_prisma_migrations" ORDER BY migration_name`).all() as Record<string, unknown>[];
    db.close();
    expect(rows.map((r) => r.migration_name)).toEqual(all);
    for (const r of rows) {
      const sql = fs.readFileSync(path.join("prisma", "migrations", String(r.migration_name), "migration.sql"), "utf8");
      // Prisma's checksum is the SHA-256 of the migration file, hex (common practice of its migrate engine).
      expect(r.checksum).toBe(sha256Hex(sql));
      expect(r.finished_at).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{3}\+00:00$/);
      expect(r.applied_steps_count).toBe(1);
      expect(r.rolled_back_at).toBeNull();
    }
  });

  it("refuses a migration that was edited after it was applied", () => {
    const dir = tmp();
    const migDir = path.join(dir, "migrations");
    fs.cpSync(path.join("prisma", "migrations"), migDir, { recursive: true });
    const url = `file:${path.join(dir, "b.db")}`;
    migrateSqlite({ databaseUrl: url, migrationsDir: migDir });
    const first = readMigrations(migDir)[0];
    fs.appendFileSync(path.join(migDir, first.name, "migration.sql"), "\n-- edited\n");
    expect(() => migrateSqlite({ databaseUrl: url, migrationsDir: migDir })).toThrow(/modified after it was applied/);
  });

  it("rolls back a failing migration and records nothing for it", () => {
    const dir = tmp();
    const migDir = path.join(dir, "migrations");
    fs.cpSync(path.join("prisma", "migrations"), migDir, { recursive: true });
    fs.mkdirSync(path.join(migDir, "99990101000000_broken"));
    fs.writeFileSync(path.join(migDir, "99990101000000_broken", "migration.sql"), 'CREATE TABLE "X" (id INTEGER);\nTHIS IS NOT SQL;\n');
    const file = path.join(dir, "c.db");
    expect(() => migrateSqlite({ databaseUrl: `file:${file}`, migrationsDir: migDir })).toThrow(/99990101000000_broken failed/);
    const db = new Database(file, { readonly: true });
    const names = (db.prepare(`SELECT migration_name FROM "_prisma_migrations"`).all() as { migration_name: string }[]).map(
      (r) => r.migration_name,
    );
    const x = db.prepare(`SELECT name FROM sqlite_master WHERE name = 'X'`).get();
    db.close();
    expect(names).not.toContain("99990101000000_broken");
    expect(x).toBeUndefined();
  });

  it("reads DATABASE_URL forms", () => {
    expect(databaseTarget("file:./data/x.db")).toMatchObject({ provider: "sqlite", file: path.resolve("data/x.db") });
    expect(databaseTarget("postgresql://u@h/db").provider).toBe("postgresql");
    expect(databaseTarget("")).toMatchObject({ provider: "sqlite", file: path.resolve("data/stoke.db") });
    expect(() => databaseTarget("mysql://x")).toThrow(/neither/);
    // A PostgreSQL URL gives a client on the pg adapter; it connects only when first used.
    expect(typeof createClient("postgresql://u@h/db").fuel.findMany).toBe("function");
  });
});

describe("migration 20261202120000_api_token_expiry", () => {
  it("gives the API tokens issued before it the default lifetime of 90 days from the migration, readable by the client", async () => {
    const NAME = "20261202120000_api_token_expiry";
    const before = path.join(tmp(), "migrations");
    fs.cpSync(defaultMigrationsDir("sqlite"), before, { recursive: true });
    const all = readMigrations().map((m) => m.name);
    for (const later of all.slice(all.indexOf(NAME))) fs.rmSync(path.join(before, later), { recursive: true });
    const file = path.join(tmp(), "tokens.db");
    migrateSqlite({ databaseUrl: `file:${file}`, migrationsDir: before });
    const raw = new Database(file);
    raw
      .prepare(
        `INSERT INTO "Account" ("email", "displayName", "role", "passwordHash", "updatedAt") VALUES ('a@example.org', '', 'admin', 'h', '2026-11-01T09:00:00.000+00:00')`,
      )
      .run();
    raw
      .prepare(
        `INSERT INTO "ApiToken" ("accountId", "name", "tokenHash", "prefix", "createdAt", "lastUsedAt") VALUES (1, 'old', 'hash1', 'stk_abcdef', '2026-11-01T10:00:00.000+00:00', NULL)`,
      )
      .run();
    raw.close();
    const t0 = Date.now();
    expect(migrateSqlite({ databaseUrl: `file:${file}` }).applied).toContain(NAME);
    const t1 = Date.now();
    const client = createClient(`file:${file}`);
    const row = await client.apiToken.findFirstOrThrow();
    await client.$disconnect();
    expect(row.createdAt.toISOString()).toBe("2026-11-01T10:00:00.000Z");
    // 90 days: the default lifetime when the migration was written (TOKEN_LIFETIME_DEFAULT_DAYS).
    const DAYS_90_MS = 90 * 24 * 3600 * 1000;
    expect(row.expiresAt.getTime()).toBeGreaterThanOrEqual(Math.floor(t0 / 1000) * 1000 + DAYS_90_MS);
    expect(row.expiresAt.getTime()).toBeLessThanOrEqual(t1 + DAYS_90_MS);
  });
});
