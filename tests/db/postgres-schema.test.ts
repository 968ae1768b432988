/**
 * The PostgreSQL side of the schema: the derived Prisma schema is in sync with prisma/schema.prisma,
 * every SQLite migration has its PostgreSQL twin, and (when STOKE_TEST_PG_URL names a server, as in
 * `.ci/run`) the runner applies the twins once, records them as Prisma does, and two runners
 * started together on one empty database apply each migration once.
 */
import fs from "node:fs";
import path from "node:path";
import pg from "pg";
import { describe, expect, it } from "vitest";
import { derivePostgresSchema, POSTGRES_SCHEMA_PATH, SQLITE_SCHEMA_PATH } from "../../lib/db/postgres-schema";
import { defaultMigrationsDir, migratePostgres, readMigrations, sha256Hex } from "../../lib/db/migrate";
import { createPostgresDatabase, testPostgresServer } from "./temp-db";
import { createClient } from "../../lib/db/client";

describe("PostgreSQL schema and migrations", () => {
  it("prisma/postgres/schema.prisma is what prisma/schema.prisma derives to (run npm run generate when not)", () => {
    const derived = derivePostgresSchema(fs.readFileSync(SQLITE_SCHEMA_PATH, "utf8"));
    expect(fs.readFileSync(POSTGRES_SCHEMA_PATH, "utf8")).toBe(derived);
    expect(derived).toMatch(/datasource db \{\s*provider = "postgresql"/);
    expect(derived).toMatch(/output\s*=\s*"\.\.\/\.\.\/lib\/db\/generated-pg"/);
    expect(derived).not.toMatch(/"sqlite"/);
  });

  it("refuses to derive from a schema that is not SQLite's", () => {
    expect(() => derivePostgresSchema('datasource db {\n  provider = "mysql"\n}\n')).toThrow(/provider = "sqlite"/);
  });

  it("every SQLite migration has a PostgreSQL twin of the same name, and no twin lacks its SQLite original", () => {
    const sqlite = readMigrations(defaultMigrationsDir("sqlite"), "sqlite").map((m) => m.name);
    const postgres = readMigrations(defaultMigrationsDir("postgresql"), "postgresql").map((m) => m.name);
    expect(sqlite.length).toBeGreaterThan(0);
    expect(postgres).toEqual(sqlite);
  });

  it("the PostgreSQL migrations use PostgreSQL's types, not SQLite's", () => {
    for (const m of readMigrations(defaultMigrationsDir("postgresql"), "postgresql")) {
      expect(m.sql, m.name).not.toMatch(/AUTOINCREMENT|\bDATETIME\b|\bREAL\b/);
    }
  });

  it("the lock files name their providers", () => {
    expect(() => readMigrations(defaultMigrationsDir("postgresql"), "sqlite")).toThrow(/for "postgresql", not sqlite/);
    expect(fs.readFileSync(path.join(defaultMigrationsDir("postgresql"), "migration_lock.toml"), "utf8")).toMatch(
      /provider = "postgresql"/,
    );
  });
});

describe.skipIf(!testPostgresServer)("PostgreSQL migration runner (STOKE_TEST_PG_URL)", () => {
  it("applies every twin once and records it in _prisma_migrations with the file's SHA-256", async () => {
    const { url, drop } = await createPostgresDatabase(testPostgresServer!);
    try {
      const all = readMigrations(defaultMigrationsDir("postgresql"), "postgresql");
      const first = await migratePostgres({ databaseUrl: url });
      expect(first.applied).toEqual(all.map((m) => m.name));
      const second = await migratePostgres({ databaseUrl: url });
      expect(second.applied).toEqual([]);
      expect(second.alreadyApplied).toEqual(all.map((m) => m.name));
      const c = new pg.Client({ connectionString: url });
      await c.connect();
      const { rows } = await c.query(`SELECT * FROM "_prisma_migrations" ORDER BY migration_name`);
      await c.end();
      expect(rows.map((r) => r.migration_name)).toEqual(all.map((m) => m.name));
      for (const r of rows) {
        const m = all.find((x) => x.name === r.migration_name)!;
        // Prisma's checksum is the SHA-256 of the migration file, hex (common practice of its migrate engine).
        expect(r.checksum).toBe(sha256Hex(m.sql));
        expect(r.finished_at).toBeInstanceOf(Date);
        expect(r.applied_steps_count).toBe(1);
      }
    } finally {
      await drop();
    }
  });

  it("two runners started together on one empty database apply each migration once", async () => {
    const { url, drop } = await createPostgresDatabase(testPostgresServer!);
    try {
      const [a, b] = await Promise.all([migratePostgres({ databaseUrl: url }), migratePostgres({ databaseUrl: url })]);
      const n = readMigrations(defaultMigrationsDir("postgresql"), "postgresql").length;
      expect(a.applied.length + b.applied.length).toBe(n);
      expect(a.applied.length === 0 || b.applied.length === 0).toBe(true);
    } finally {
      await drop();
    }
  });

  it("rolls back a failing migration and records nothing for it", async () => {
    const { url, drop } = await createPostgresDatabase(testPostgresServer!);
    const dir = fs.mkdtempSync(path.join(process.env.TMPDIR ?? "/tmp", "stoke-pgmig-"));
    try {
      fs.cpSync(defaultMigrationsDir("postgresql"), dir, { recursive: true });
      fs.mkdirSync(path.join(dir, "99990101000000_broken"));
      fs.writeFileSync(path.join(dir, "99990101000000_broken", "migration.sql"), 'CREATE TABLE "X" (id INTEGER);\nTHIS IS NOT SQL;\n');
      await expect(migratePostgres({ databaseUrl: url, migrationsDir: dir })).rejects.toThrow(/99990101000000_broken failed/);
      const c = new pg.Client({ connectionString: url });
      await c.connect();
      const names = (await c.query(`SELECT migration_name FROM "_prisma_migrations"`)).rows.map((r) => r.migration_name);
      const x = await c.query(`SELECT to_regclass('"X"') AS t`);
      await c.end();
      expect(names).not.toContain("99990101000000_broken");
      expect(x.rows[0].t).toBeNull();
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
      await drop();
    }
  });

  it("20261202120000_api_token_expiry gives earlier tokens 90 days from the migration, in UTC whatever the session's time zone", async () => {
    const { url, drop } = await createPostgresDatabase(testPostgresServer!);
    const NAME = "20261202120000_api_token_expiry";
    const dir = fs.mkdtempSync(path.join(process.env.TMPDIR ?? "/tmp", "stoke-pgmig-"));
    try {
      fs.cpSync(defaultMigrationsDir("postgresql"), dir, { recursive: true });
      const names = readMigrations(dir, "postgresql").map((m) => m.name);
      for (const later of names.slice(names.indexOf(NAME))) fs.rmSync(path.join(dir, later), { recursive: true });
      await migratePostgres({ databaseUrl: url, migrationsDir: dir });
      const c = new pg.Client({ connectionString: url });
      await c.connect();
      await c.query(
        `INSERT INTO "Account" ("email", "displayName", "role", "passwordHash", "updatedAt") VALUES ('a@example.org', '', 'admin', 'h', '2026-11-01 09:00:00')`,
      );
      await c.query(`INSERT INTO "ApiToken" ("accountId", "name", "tokenHash", "prefix") VALUES (1, 'old', 'hash1', 'stk_abcdef')`);
      await c.end();
      // A server whose sessions run in another time zone than UTC.
      const zoned = `${url}${url.includes("?") ? "&" : "?"}options=${encodeURIComponent("-c TimeZone=America/New_York")}`;
      const t0 = Date.now();
      const applied = (await migratePostgres({ databaseUrl: zoned })).applied;
      expect(applied).toEqual(names.slice(names.indexOf(NAME)));
      const t1 = Date.now();
      const client = createClient(url);
      const row = await client.apiToken.findFirstOrThrow();
      await client.$disconnect();
      // 90 days: the default lifetime when the migration was written (TOKEN_LIFETIME_DEFAULT_DAYS).
      const DAYS_90_MS = 90 * 24 * 3600 * 1000;
      expect(row.expiresAt.getTime()).toBeGreaterThanOrEqual(t0 - 1000 + DAYS_90_MS);
      expect(row.expiresAt.getTime()).toBeLessThanOrEqual(t1 + 1000 + DAYS_90_MS);
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
      await drop();
    }
  });
});
