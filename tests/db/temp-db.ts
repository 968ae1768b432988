/**
 * A fresh, empty database migrated the same way as production: a SQLite file in a temp folder,
 * or — when STOKE_TEST_PG_URL names a PostgreSQL server (`.ci/run` starts a throw-away cluster) —
 * a new database on that server, dropped again by `cleanup`.
 */
import { randomBytes } from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import pg from "pg";
import { migratePostgres, migrateSqlite } from "../../lib/db/migrate";
import { createClient, type Db } from "../../lib/db/client";

export interface TempDb {
  provider: "sqlite" | "postgresql";
  url: string;
  /** The SQLite file ("" on PostgreSQL). */
  file: string;
  /** A temp folder for the test's own files (both providers). */
  dir: string;
  client: Db;
  cleanup: () => Promise<void>;
}

/** The PostgreSQL server the database tests run against, or null for SQLite. */
export const testPostgresServer: string | null = process.env.STOKE_TEST_PG_URL?.trim() || null;

/** The URL of database `name` on the test server. */
export function postgresDatabaseUrl(server: string, name: string): string {
  const u = new URL(server);
  u.pathname = `/${name}`;
  return u.toString();
}

/** Creates an empty database on the test PostgreSQL server and returns its URL and a dropper. */
export async function createPostgresDatabase(server: string): Promise<{ url: string; drop: () => Promise<void> }> {
  const name = `stoke_test_${randomBytes(6).toString("hex")}`;
  const admin = new pg.Client({ connectionString: server });
  await admin.connect();
  try {
    await admin.query(`CREATE DATABASE "${name}"`);
  } finally {
    await admin.end();
  }
  return {
    url: postgresDatabaseUrl(server, name),
    drop: async () => {
      const a = new pg.Client({ connectionString: server });
      await a.connect();
      try {
        await a.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
      } finally {
        await a.end();
      }
    },
  };
}

export async function tempDb(): Promise<TempDb> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "stoke-test-"));
  if (testPostgresServer) {
    const { url, drop } = await createPostgresDatabase(testPostgresServer);
    await migratePostgres({ databaseUrl: url });
    const client = createClient(url);
    return {
      provider: "postgresql",
      url,
      file: "",
      dir,
      client,
      cleanup: async () => {
        await client.$disconnect();
        await drop();
        fs.rmSync(dir, { recursive: true, force: true });
      },
    };
  }
  const file = path.join(dir, "test.db");
  const url = `file:${file}`;
  migrateSqlite({ databaseUrl: url });
  const client = createClient(url);
  return {
    provider: "sqlite",
    url,
    file,
    dir,
    client,
    cleanup: async () => {
      await client.$disconnect();
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}
