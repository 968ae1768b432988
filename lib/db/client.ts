/**
 * The Prisma client, one per process, on the better-sqlite3 driver adapter (no native
 * Prisma engine). `DATABASE_URL` chooses the file (see paths.ts).
 */
import { createRequire } from "node:module";
import { PrismaBetterSqlite3 } from "@prisma/adapter-better-sqlite3";
import { PrismaClient } from "./generated/client";
import { databaseTarget } from "./paths";

export type Db = PrismaClient;
/** A client inside an open transaction (what `inTransaction` hands its callback). */
export type Tx = Omit<PrismaClient, "$connect" | "$disconnect" | "$on" | "$transaction" | "$extends">;
/** Either: queries take a plain client or one inside a transaction. */
export type DbOrTx = Db | Tx;

export function createClient(databaseUrl?: string): PrismaClient {
  const target = databaseTarget(databaseUrl);
  if (target.provider === "postgresql") {
    // Optional: present only on a team server set up as README.md (section PostgreSQL) says.
    let PrismaPg: new (opts: { connectionString: string }) => unknown;
    try {
      const adapterPackage = ["@prisma", "adapter-pg"].join("/"); // resolved at run time only, when installed
      ({ PrismaPg } = createRequire(import.meta.url)(/* turbopackIgnore: true */ adapterPackage));
    } catch (e) {
      if (!(e instanceof Error && "code" in e && e.code === "MODULE_NOT_FOUND")) throw e;
      throw new Error(
        "DATABASE_URL points at PostgreSQL, but @prisma/adapter-pg is not installed and the client is generated for SQLite. Follow README.md, section PostgreSQL.",
      );
    }
    return new PrismaClient({ adapter: new PrismaPg({ connectionString: target.url }) as never });
  }
  const adapter = new PrismaBetterSqlite3({ url: target.file });
  return new PrismaClient({ adapter });
}

declare global {
  // One client per process, kept across hot reloads in development.
  var __stokeDb: { url: string; client: PrismaClient } | undefined;
}

/** The shared client for the current DATABASE_URL. */
export function db(): PrismaClient {
  const url = process.env.DATABASE_URL ?? "";
  const cached = globalThis.__stokeDb;
  if (cached && cached.url === url) return cached.client;
  if (cached) void cached.client.$disconnect();
  const client = createClient(url || undefined);
  globalThis.__stokeDb = { url, client };
  return client;
}

class Rollback<R> extends Error {
  constructor(public readonly outcome: R) {
    super("rolled back");
  }
}

/**
 * Runs `fn` in one transaction. An outcome with `ok: false` rolls everything back and is returned
 * as it is; an exception rolls back and propagates.
 */
export async function inTransaction<R extends { ok: boolean }>(client: Db, fn: (tx: Tx) => Promise<R>): Promise<R> {
  try {
    return await client.$transaction(async (tx) => {
      const r = await fn(tx);
      if (!r.ok) throw new Rollback(r);
      return r;
    });
  } catch (e) {
    if (e instanceof Rollback) return e.outcome as R;
    throw e;
  }
}
