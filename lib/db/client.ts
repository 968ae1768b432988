/**
 * The Prisma client, one per process, with no native Prisma engine: `DATABASE_URL` chooses the
 * database (see paths.ts) and with it the driver adapter — better-sqlite3 for a SQLite file,
 * pg (node-postgres) for PostgreSQL. Each provider has its own generated client (lib/db/generated
 * from prisma/schema.prisma, lib/db/generated-pg from the derived prisma/postgres/schema.prisma);
 * both have the same models and queries, so the rest of the code sees one type, `Db`.
 */
import { PrismaBetterSqlite3 } from "@prisma/adapter-better-sqlite3";
import { PrismaPg } from "@prisma/adapter-pg";
import { PrismaClient } from "./generated/client";
import { PrismaClient as PrismaClientPg } from "./generated-pg/client";
import { databaseTarget } from "./paths";
import { DB_BUSY_TIMEOUT_MS } from "./busy-timeout";

export type Db = PrismaClient;
/** A client inside an open transaction (what `inTransaction` hands its callback). */
export type Tx = Omit<PrismaClient, "$connect" | "$disconnect" | "$on" | "$transaction" | "$extends">;
/** Either: queries take a plain client or one inside a transaction. */
export type DbOrTx = Db | Tx;

/** Connections each app process keeps to PostgreSQL at most (`STOKE_PG_POOL_MAX`, default 10). */
function poolMax(): number {
  const n = Number(process.env.STOKE_PG_POOL_MAX ?? "10");
  return Number.isInteger(n) && n > 0 && n <= 1000 ? n : 10;
}

const providers = new WeakMap<object, "sqlite" | "postgresql">();

export function createClient(databaseUrl?: string): PrismaClient {
  const target = databaseTarget(databaseUrl);
  if (target.provider === "postgresql") {
    // A write waiting for another's lock gives up after the busy timeout (503), as on SQLite.
    const adapter = new PrismaPg({ connectionString: target.url, max: poolMax(), options: `-c lock_timeout=${DB_BUSY_TIMEOUT_MS}` });
    // Same models, fields and queries as the SQLite client (one schema, provider swapped).
    const client = new PrismaClientPg({ adapter }) as unknown as PrismaClient;
    providers.set(client, "postgresql");
    return client;
  }
  const adapter = new PrismaBetterSqlite3({ url: target.file, timeout: DB_BUSY_TIMEOUT_MS });
  const client = new PrismaClient({ adapter });
  providers.set(client, "sqlite");
  return client;
}

/** The database a client made by `createClient` talks to. */
export function providerOf(client: Db): "sqlite" | "postgresql" {
  return providers.get(client) ?? databaseTarget(process.env.DATABASE_URL).provider;
}

/**
 * True when an error means the database was locked by another connection for longer than the
 * busy timeout (SQLite), or PostgreSQL gave up on a lock or a serialisation conflict: the request
 * may succeed when tried again (the HTTP layer answers 503).
 */
export function isDatabaseBusy(e: unknown): boolean {
  // The driver's error sits in `cause` or in Prisma's `meta.driverAdapterError`, a few levels down.
  const queue: unknown[] = [e];
  for (let seen = 0; queue.length && seen < 12; seen++) {
    const x = queue.shift();
    if (!x || typeof x !== "object") continue;
    const o = x as { code?: unknown; message?: unknown; kind?: unknown; originalCode?: unknown; cause?: unknown; meta?: unknown };
    const codes = [o.code, o.originalCode].filter((c): c is string => typeof c === "string");
    const message = typeof o.message === "string" ? o.message : "";
    if (codes.some((c) => c.startsWith("SQLITE_BUSY")) || /SQLITE_BUSY|database is locked/i.test(message)) return true;
    if (o.kind === "SocketTimeout" || codes.includes("P1008") || codes.includes("P2034")) return true;
    // PostgreSQL: lock_not_available (lock_timeout), serialization_failure, deadlock_detected.
    if (codes.some((c) => c === "55P03" || c === "40001" || c === "40P01")) return true;
    queue.push(o.cause, (o.meta as { driverAdapterError?: unknown } | undefined)?.driverAdapterError);
  }
  return false;
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

/** Advisory-lock keys of the work that must not run twice at once across app instances. */
export const LOCK_KEYS = { seed: 0x5365656401 } as const;

/**
 * `inTransaction`, but on PostgreSQL the transaction first takes the advisory lock `key`, so that
 * the same work started by several app instances at once runs one after the other (the lock ends
 * with the transaction). SQLite has one writer at a time anyway.
 */
export async function inExclusiveTransaction<R extends { ok: boolean }>(client: Db, key: number, fn: (tx: Tx) => Promise<R>): Promise<R> {
  const postgres = providerOf(client) === "postgresql";
  return inTransaction(client, async (tx) => {
    if (postgres) await tx.$executeRawUnsafe("SELECT pg_advisory_xact_lock($1::bigint)", key);
    return fn(tx);
  });
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
