/**
 * Backup and restore of the whole database.
 *
 * SQLite: an online backup through SQLite's backup API (better-sqlite3 `backup`), consistent while
 * the server keeps running and writing; restore checks the file (integrity, a Stoke database, no
 * migration this code does not know), copies it over the live database with the same API, then
 * applies any newer migrations. Stop the server for a restore, or it may keep serving what it
 * read before.
 *
 * PostgreSQL: `pg_dump --format=custom` and `pg_restore --clean --if-exists --no-owner` (Debian's
 * postgresql-client), run with the URL from DATABASE_URL.
 */
import { execFile } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { promisify } from "node:util";
import Database from "better-sqlite3";
import { DB_BUSY_TIMEOUT_MS } from "./busy-timeout";
import { defaultMigrationsDir, migrate, readMigrations } from "./migrate";
import { databaseTarget } from "./paths";

const run = promisify(execFile);

export interface BackupResult {
  provider: "sqlite" | "postgresql";
  file: string;
  bytes: number;
}

/** Writes a backup of the database `databaseUrl` names (default DATABASE_URL) to `file`. */
export async function backupDatabase(file: string, databaseUrl?: string): Promise<BackupResult> {
  const target = databaseTarget(databaseUrl);
  const out = path.resolve(/*turbopackIgnore: true*/ file);
  fs.mkdirSync(/*turbopackIgnore: true*/ path.dirname(out), { recursive: true });
  if (target.provider === "postgresql") {
    await run("pg_dump", ["--format=custom", "--no-owner", `--file=${out}`, `--dbname=${target.url}`]);
    return { provider: "postgresql", file: out, bytes: fs.statSync(/*turbopackIgnore: true*/ out).size };
  }
  if (!fs.existsSync(/*turbopackIgnore: true*/ target.file)) throw new Error(`No database at ${target.file}`);
  if (path.resolve(target.file) === out) throw new Error("The backup file must not be the database itself.");
  const db = new Database(target.file, { readonly: true, timeout: DB_BUSY_TIMEOUT_MS });
  try {
    await db.backup(out);
  } finally {
    db.close();
  }
  return { provider: "sqlite", file: out, bytes: fs.statSync(/*turbopackIgnore: true*/ out).size };
}

/** What a restore did: the migrations it applied on top of the backup. */
export interface RestoreResult {
  provider: "sqlite" | "postgresql";
  file: string;
  migrationsApplied: string[];
}

/** Checks that a file is a sound Stoke SQLite database this code can run; throws saying why not. */
export function checkSqliteBackup(file: string): void {
  if (!fs.existsSync(/*turbopackIgnore: true*/ file)) throw new Error(`No backup file at ${file}`);
  let db: Database.Database;
  try {
    db = new Database(file, { readonly: true, fileMustExist: true });
  } catch (e) {
    throw new Error(`${file} cannot be opened as a SQLite database: ${(e as Error).message}`);
  }
  try {
    let check: unknown;
    try {
      check = db.pragma("integrity_check", { simple: true });
    } catch (e) {
      throw new Error(`${file} is not a SQLite database: ${(e as Error).message}`);
    }
    if (check !== "ok") throw new Error(`${file} fails SQLite's integrity check: ${String(check)}`);
    const table = db.prepare(`SELECT name FROM sqlite_master WHERE type = 'table' AND name = '_prisma_migrations'`).get();
    if (!table) throw new Error(`${file} is not a Stoke database (it has no migration record).`);
    const known = new Set(readMigrations(defaultMigrationsDir("sqlite"), "sqlite").map((m) => m.name));
    const unknown = (
      db.prepare(`SELECT migration_name FROM "_prisma_migrations" WHERE rolled_back_at IS NULL`).all() as { migration_name: string }[]
    )
      .map((r) => r.migration_name)
      .filter((n) => !known.has(n));
    if (unknown.length) {
      throw new Error(`${file} was written by a newer Stoke (migrations ${unknown.join(", ")} are unknown here); update Stoke first.`);
    }
  } finally {
    db.close();
  }
}

/** Replaces the database `databaseUrl` names (default DATABASE_URL) with the backup in `file`, then migrates it. */
export async function restoreDatabase(file: string, databaseUrl?: string): Promise<RestoreResult> {
  const target = databaseTarget(databaseUrl);
  const src = path.resolve(/*turbopackIgnore: true*/ file);
  if (target.provider === "postgresql") {
    if (!fs.existsSync(/*turbopackIgnore: true*/ src)) throw new Error(`No backup file at ${src}`);
    await run("pg_restore", ["--clean", "--if-exists", "--no-owner", "--single-transaction", `--dbname=${target.url}`, src]);
    const m = await migrate({ databaseUrl: target.url });
    return { provider: "postgresql", file: src, migrationsApplied: m.applied };
  }
  if (path.resolve(target.file) === src) throw new Error("The backup file is the database itself.");
  checkSqliteBackup(src);
  fs.mkdirSync(/*turbopackIgnore: true*/ path.dirname(target.file), { recursive: true });
  const backup = new Database(src, { readonly: true });
  try {
    // The backup API writes the destination through SQLite (its locks, its journal), not around it.
    await backup.backup(target.file);
  } finally {
    backup.close();
  }
  const m = await migrate({ databaseUrl: target.url });
  return { provider: "sqlite", file: target.file, migrationsApplied: m.applied };
}
