/**
 * Applies the committed migrations to the database DATABASE_URL names, in name order, each
 * inside its own transaction, and records each one in Prisma's own `_prisma_migrations` table
 * (same columns, sha256 checksum of the file, timestamps) so that Prisma's tooling on a machine
 * with its engines agrees with it. SQLite: prisma/migrations/<name>/migration.sql (better-sqlite3);
 * PostgreSQL: their twins in prisma/postgres/migrations/<same name>/migration.sql (pg), under an
 * advisory lock so that several app instances starting at once apply each migration once.
 *
 * Prisma 7's `migrate` commands need a native engine that cannot be downloaded here; this
 * runner needs none. It runs at server start (instrumentation.ts), from `npm run db:migrate`
 * and in the tests.
 */
import { createHash, randomUUID } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import Database from "better-sqlite3";
import pg from "pg";
import { databaseTarget } from "./paths";
import { DB_BUSY_TIMEOUT_MS } from "./busy-timeout";

export interface MigrationFile {
  name: string;
  sql: string;
  checksum: string;
}

export interface MigrateResult {
  file: string;
  applied: string[];
  alreadyApplied: string[];
}

const MIGRATIONS_TABLE_SQL = `CREATE TABLE IF NOT EXISTS "_prisma_migrations" (
    "id"                    TEXT PRIMARY KEY NOT NULL,
    "checksum"              TEXT NOT NULL,
    "finished_at"           DATETIME,
    "migration_name"        TEXT NOT NULL,
    "logs"                  TEXT,
    "rolled_back_at"        DATETIME,
    "started_at"            DATETIME NOT NULL DEFAULT current_timestamp,
    "applied_steps_count"   INTEGER UNSIGNED NOT NULL DEFAULT 0
)`;

const POSTGRES_MIGRATIONS_TABLE_SQL = `CREATE TABLE IF NOT EXISTS "_prisma_migrations" (
    "id"                    VARCHAR(36) PRIMARY KEY NOT NULL,
    "checksum"              VARCHAR(64) NOT NULL,
    "finished_at"           TIMESTAMPTZ,
    "migration_name"        VARCHAR(255) NOT NULL,
    "logs"                  TEXT,
    "rolled_back_at"        TIMESTAMPTZ,
    "started_at"            TIMESTAMPTZ NOT NULL DEFAULT now(),
    "applied_steps_count"   INTEGER NOT NULL DEFAULT 0
)`;

/** Key of the PostgreSQL advisory lock the runner holds while it migrates ("Stoke" in ASCII). */
const POSTGRES_MIGRATION_LOCK_KEY = 0x53746f6b65;

export type Provider = "sqlite" | "postgresql";

/** The project's migrations folder for a provider (under the working directory). */
export function defaultMigrationsDir(provider: Provider = "sqlite"): string {
  return provider === "sqlite"
    ? path.join(/*turbopackIgnore: true*/ process.cwd(), "prisma", "migrations")
    : path.join(/*turbopackIgnore: true*/ process.cwd(), "prisma", "postgres", "migrations");
}

export function sha256Hex(text: string): string {
  return createHash("sha256").update(text, "utf8").digest("hex");
}

/** Reads the migration folders in order. Throws when the lock file names another provider. */
export function readMigrations(dir: string = defaultMigrationsDir(), provider: Provider = "sqlite"): MigrationFile[] {
  if (!fs.existsSync(/*turbopackIgnore: true*/ dir)) {
    throw new Error(`Migrations folder not found: ${dir}`);
  }
  const lockFile = path.join(dir, "migration_lock.toml");
  if (fs.existsSync(/*turbopackIgnore: true*/ lockFile)) {
    const lock = fs.readFileSync(/*turbopackIgnore: true*/ lockFile, "utf8");
    const m = /provider\s*=\s*"([^"]+)"/.exec(lock);
    if (m && m[1] !== provider) {
      throw new Error(`The migrations in ${dir} are for "${m[1]}", not ${provider}.`);
    }
  }
  return fs
    .readdirSync(/*turbopackIgnore: true*/ dir, { withFileTypes: true })
    .filter((d) => d.isDirectory())
    .map((d) => d.name)
    .sort()
    .flatMap((name) => {
      const file = path.join(dir, name, "migration.sql");
      if (!fs.existsSync(/*turbopackIgnore: true*/ file)) return [];
      const sql = fs.readFileSync(/*turbopackIgnore: true*/ file, "utf8");
      return [{ name, sql, checksum: sha256Hex(sql) }];
    });
}

function isoNow(): string {
  // Same text form Prisma's SQLite adapter writes: 2025-01-31T12:00:00.000+00:00
  return new Date().toISOString().replace("Z", "+00:00");
}

/**
 * Brings the SQLite database named by `databaseUrl` (default: DATABASE_URL or
 * data/stoke.db) up to date. Creates the file and its folder when missing.
 * Refuses to continue when an applied migration's file has changed since, or when a
 * migration is recorded as started but not finished.
 */
export function migrateSqlite(options: { databaseUrl?: string; migrationsDir?: string } = {}): MigrateResult {
  const target = databaseTarget(options.databaseUrl);
  if (target.provider !== "sqlite") {
    throw new Error("migrateSqlite() handles SQLite only; PostgreSQL goes through migrate() or migratePostgres().");
  }
  const migrations = readMigrations(options.migrationsDir, "sqlite");
  if (target.file !== ":memory:") {
    fs.mkdirSync(/*turbopackIgnore: true*/ path.dirname(target.file), { recursive: true });
  }
  const db = new Database(target.file, { timeout: DB_BUSY_TIMEOUT_MS });
  try {
    // Write-ahead log: readers never wait for a writer, and a writer waits (busy timeout) rather
    // than failing at once. The mode is stored in the file, so every later connection uses it.
    if (target.file !== ":memory:") db.pragma("journal_mode = WAL");
    db.pragma("foreign_keys = ON");
    db.exec(MIGRATIONS_TABLE_SQL);
    const rows = db.prepare(`SELECT migration_name, checksum, finished_at, rolled_back_at FROM "_prisma_migrations"`).all() as {
      migration_name: string;
      checksum: string;
      finished_at: string | null;
      rolled_back_at: string | null;
    }[];
    const done = new Map<string, { checksum: string }>();
    for (const r of rows) {
      if (r.rolled_back_at !== null) continue;
      if (r.finished_at === null) {
        throw new Error(`Migration ${r.migration_name} was started but did not finish; repair the database before continuing.`);
      }
      done.set(r.migration_name, { checksum: r.checksum });
    }
    const applied: string[] = [];
    const alreadyApplied: string[] = [];
    const record = db.prepare(
      `INSERT INTO "_prisma_migrations" (id, checksum, finished_at, migration_name, logs, rolled_back_at, started_at, applied_steps_count)
       VALUES (?, ?, ?, ?, NULL, NULL, ?, 1)`,
    );
    for (const m of migrations) {
      const prev = done.get(m.name);
      if (prev) {
        if (prev.checksum !== m.checksum) {
          throw new Error(
            `Migration ${m.name} was modified after it was applied (checksum differs). Add a new migration instead of editing an applied one.`,
          );
        }
        alreadyApplied.push(m.name);
        continue;
      }
      const startedAt = isoNow();
      const apply = db.transaction(() => {
        db.exec(m.sql);
        record.run(randomUUID(), m.checksum, isoNow(), m.name, startedAt);
      });
      try {
        apply();
      } catch (e) {
        throw new Error(`Migration ${m.name} failed: ${(e as Error).message}`);
      }
      applied.push(m.name);
    }
    return { file: target.file, applied, alreadyApplied };
  } finally {
    db.close();
  }
}

/** Where a PostgreSQL URL points, without its password (for messages). */
export function describePostgresUrl(url: string): string {
  try {
    const u = new URL(url);
    return `postgresql://${u.username ? `${u.username}@` : ""}${u.host}${u.pathname}`;
  } catch {
    return "PostgreSQL";
  }
}

/**
 * Brings the PostgreSQL database named by `databaseUrl` up to date with the committed
 * PostgreSQL migrations. Holds an advisory lock for the whole run, so that app instances starting
 * together wait for each other instead of applying a migration twice.
 */
export async function migratePostgres(options: { databaseUrl: string; migrationsDir?: string }): Promise<MigrateResult> {
  const migrations = readMigrations(options.migrationsDir ?? defaultMigrationsDir("postgresql"), "postgresql");
  const client = new pg.Client({ connectionString: options.databaseUrl });
  await client.connect();
  try {
    await client.query("SELECT pg_advisory_lock($1)", [POSTGRES_MIGRATION_LOCK_KEY]);
    await client.query(POSTGRES_MIGRATIONS_TABLE_SQL);
    const { rows } = await client.query<{
      migration_name: string;
      checksum: string;
      finished_at: Date | null;
      rolled_back_at: Date | null;
    }>(`SELECT migration_name, checksum, finished_at, rolled_back_at FROM "_prisma_migrations"`);
    const done = new Map<string, string>();
    for (const r of rows) {
      if (r.rolled_back_at !== null) continue;
      if (r.finished_at === null) {
        throw new Error(`Migration ${r.migration_name} was started but did not finish; repair the database before continuing.`);
      }
      done.set(r.migration_name, r.checksum);
    }
    const applied: string[] = [];
    const alreadyApplied: string[] = [];
    for (const m of migrations) {
      const prev = done.get(m.name);
      if (prev !== undefined) {
        if (prev !== m.checksum) {
          throw new Error(
            `Migration ${m.name} was modified after it was applied (checksum differs). Add a new migration instead of editing an applied one.`,
          );
        }
        alreadyApplied.push(m.name);
        continue;
      }
      const startedAt = new Date();
      try {
        await client.query("BEGIN");
        // The simple query protocol (no parameters) runs every statement of the file.
        await client.query(m.sql);
        await client.query(
          `INSERT INTO "_prisma_migrations" (id, checksum, finished_at, migration_name, logs, rolled_back_at, started_at, applied_steps_count)
           VALUES ($1, $2, now(), $3, NULL, NULL, $4, 1)`,
          [randomUUID(), m.checksum, m.name, startedAt],
        );
        await client.query("COMMIT");
      } catch (e) {
        await client.query("ROLLBACK").catch(() => undefined);
        throw new Error(`Migration ${m.name} failed: ${(e as Error).message}`);
      }
      applied.push(m.name);
    }
    return { file: describePostgresUrl(options.databaseUrl), applied, alreadyApplied };
  } finally {
    await client.query("SELECT pg_advisory_unlock($1)", [POSTGRES_MIGRATION_LOCK_KEY]).catch(() => undefined);
    await client.end();
  }
}

/** Applies the migrations of whichever database `databaseUrl` (default DATABASE_URL) names. */
export async function migrate(options: { databaseUrl?: string } = {}): Promise<MigrateResult & { provider: Provider }> {
  const target = databaseTarget(options.databaseUrl);
  if (target.provider === "postgresql") return { provider: "postgresql", ...(await migratePostgres({ databaseUrl: target.url })) };
  return { provider: "sqlite", ...migrateSqlite({ databaseUrl: target.url }) };
}
