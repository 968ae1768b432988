/**
 * Accounts, their sessions and API tokens: the queries. Secrets never reach these rows: a session
 * row and a token row hold the SHA-256 of their random key, an account the argon2id hash of its
 * password.
 */
import type { Account, ApiToken, Session } from "./generated/client";
import type { DbOrTx, Tx } from "./client";

export type AccountRow = Account;
export type SessionRow = Session;
export type ApiTokenRow = ApiToken;

/** An account as lists and the change log show it: never its password hash. */
export function accountJson(a: Account) {
  return {
    id: a.id,
    email: a.email,
    displayName: a.displayName,
    role: a.role,
    disabled: a.disabledAt !== null,
    lastSignInAt: a.lastSignInAt?.toISOString() ?? null,
    createdAt: a.createdAt.toISOString(),
  };
}
export type AccountJson = ReturnType<typeof accountJson>;

export function listAccountRows(db: DbOrTx): Promise<Account[]> {
  return db.account.findMany({ orderBy: { email: "asc" } });
}

export function countAccounts(db: DbOrTx, where: { role?: string; enabledOnly?: boolean } = {}): Promise<number> {
  return db.account.count({ where: { role: where.role, ...(where.enabledOnly ? { disabledAt: null } : {}) } });
}

export function findAccount(db: DbOrTx, id: number): Promise<Account | null> {
  return db.account.findUnique({ where: { id } });
}

export function findAccountByEmail(db: DbOrTx, email: string): Promise<Account | null> {
  return db.account.findUnique({ where: { email } });
}

export function insertAccount(
  tx: DbOrTx,
  data: { email: string; displayName: string; role: string; passwordHash: string },
): Promise<Account> {
  return tx.account.create({ data });
}

export function updateAccountRow(
  tx: DbOrTx,
  id: number,
  data: Partial<
    Pick<Account, "displayName" | "role" | "passwordHash" | "disabledAt" | "failedSignIns" | "lockedUntil" | "lastSignInAt">
  > & {
    bumpVersion?: boolean;
  },
): Promise<Account> {
  const { bumpVersion, ...rest } = data;
  return tx.account.update({ where: { id }, data: { ...rest, ...(bumpVersion ? { version: { increment: 1 } } : {}) } });
}

/* ------------------------------------------------------------------ sessions */

export function insertSession(
  tx: DbOrTx,
  data: { keyHash: string; accountId: number; accountVersion: number; expiresAt: Date },
): Promise<Session> {
  return tx.session.create({ data });
}

export function findSessionWithAccount(db: DbOrTx, keyHash: string) {
  return db.session.findUnique({ where: { keyHash }, include: { account: true } });
}

export function deleteSessionByHash(tx: DbOrTx, keyHash: string): Promise<{ count: number }> {
  return tx.session.deleteMany({ where: { keyHash } });
}

/** Ends every session of an account (password, role change, disabling). */
export function deleteSessionsOf(tx: DbOrTx, accountId: number): Promise<{ count: number }> {
  return tx.session.deleteMany({ where: { accountId } });
}

export function deleteExpiredSessions(tx: DbOrTx, now: Date): Promise<{ count: number }> {
  return tx.session.deleteMany({ where: { expiresAt: { lt: now } } });
}

/* ------------------------------------------------------------------ API tokens */

export function insertApiToken(
  tx: DbOrTx,
  data: { accountId: number; name: string; tokenHash: string; prefix: string; createdAt: Date; expiresAt: Date },
): Promise<ApiToken> {
  return tx.apiToken.create({ data });
}

export function findApiTokenWithAccount(db: DbOrTx, tokenHash: string) {
  return db.apiToken.findUnique({ where: { tokenHash }, include: { account: true } });
}

export function listApiTokens(db: DbOrTx) {
  return db.apiToken.findMany({ orderBy: { id: "asc" }, include: { account: { select: { email: true } } } });
}

export function findApiToken(db: DbOrTx, id: number): Promise<ApiToken | null> {
  return db.apiToken.findUnique({ where: { id } });
}

export function deleteApiTokenRow(tx: Tx, id: number): Promise<ApiToken> {
  return tx.apiToken.delete({ where: { id } });
}

export function touchApiToken(db: DbOrTx, id: number, at: Date): Promise<unknown> {
  return db.apiToken.update({ where: { id }, data: { lastUsedAt: at } });
}
