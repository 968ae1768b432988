/**
 * The Prisma client, one per process, on the better-sqlite3 driver adapter (no native
 * Prisma engine). `DATABASE_URL` chooses the file (see paths.ts).
 */
import { PrismaBetterSqlite3 } from "@prisma/adapter-better-sqlite3";
import { PrismaClient } from "./generated/client";
import { databaseTarget } from "./paths";

export type Db = PrismaClient;

export function createClient(databaseUrl?: string): PrismaClient {
  const target = databaseTarget(databaseUrl);
  if (target.provider !== "sqlite") {
    throw new Error(
      "DATABASE_URL points at PostgreSQL, but this build of Stoke is generated for SQLite. Follow README.md, section PostgreSQL.",
    );
  }
  const adapter = new PrismaBetterSqlite3({ url: target.file });
  return new PrismaClient({ adapter });
}

const globalForDb = globalThis as unknown as { __stokeDb?: { url: string; client: PrismaClient } };

/** The shared client for the current DATABASE_URL. */
export function db(): PrismaClient {
  const url = process.env.DATABASE_URL ?? "";
  const cached = globalForDb.__stokeDb;
  if (cached && cached.url === url) return cached.client;
  if (cached) void cached.client.$disconnect();
  const client = createClient(url || undefined);
  globalForDb.__stokeDb = { url, client };
  return client;
}
