/**
 * Accounts, sign-in, sessions and API tokens of team mode.
 *
 * - Passwords are hashed with argon2id (@node-rs/argon2) at the OWASP Password Storage Cheat Sheet's
 *   first recommended setting (m = 19 MiB, t = 2, p = 1); only the hash is stored.
 * - A session is a random 256-bit key: the browser holds it in a sealed cookie, the database the
 *   key's SHA-256 with the account's version at sign-in. Signing out deletes the row; a password
 *   change, role change or disabling raises the account's version and deletes its sessions, so every
 *   session of the account ends at once (on every app instance: the check reads the database).
 * - Failed sign-ins are slowed: after `FREE_FAILURES` failures in a row an account waits 30 s,
 *   doubling with each further failure up to 15 min; a client that fails `CLIENT_FAILURES` times
 *   within 10 min (any e-mail) waits out the window. Unknown e-mails take as long as known ones.
 * - API tokens (`stk_…`, 256 random bits) are shown once and stored as SHA-256; they act with the
 *   account's current role and stop with it when it is disabled, or when they expire: each has a
 *   lifetime chosen at issue (`TOKEN_LIFETIME_DEFAULT_DAYS`, at most `TOKEN_LIFETIME_MAX_DAYS`).
 */
import { createHash, randomBytes } from "node:crypto";
import { hash as argonHash, verify as argonVerify } from "@node-rs/argon2";
import { inTransaction, type Db, type DbOrTx, type Tx } from "../db/client";
import {
  accountJson,
  countAccounts,
  deleteApiTokenRow,
  deleteExpiredSessions,
  deleteSessionByHash,
  deleteSessionsOf,
  findAccount,
  findAccountByEmail,
  findApiToken,
  findApiTokenWithAccount,
  findSessionWithAccount,
  insertAccount,
  insertApiToken,
  insertSession,
  listAccountRows,
  listApiTokens,
  touchApiToken,
  updateAccountRow,
  type AccountJson,
  type AccountRow,
} from "../db/account-rows";
import {
  accountChangeSchema,
  accountInputSchema,
  apiTokenInputSchema,
  ownPasswordSchema,
  type ApiTokenInput,
  signInSchema,
  type AccountInput,
  type Role,
} from "../schemas/accounts";
import { fieldErrors } from "../schemas/fuel";
import type { Actor } from "./actor";
import { recordChange } from "./change-log";
import { friendlyMessages } from "./fuels";
import { ok, problem, type Problem, type Result } from "./result";

export { accountJson, type AccountJson };

/** argon2id, OWASP Password Storage Cheat Sheet (2023): m = 19 MiB, t = 2, p = 1. `algorithm: 2` is Argon2id. */
const ARGON2 = { algorithm: 2, memoryCost: 19_456, timeCost: 2, parallelism: 1 } as const;

export function hashPassword(password: string): Promise<string> {
  return argonHash(password, ARGON2 as never);
}

export async function passwordMatches(hash: string, password: string): Promise<boolean> {
  try {
    return await argonVerify(hash, password);
  } catch {
    return false; // a malformed stored hash matches nothing
  }
}

const sha256 = (s: string) => createHash("sha256").update(s).digest("hex");
const randomKey = () => randomBytes(32).toString("base64url");

/** How long a session lasts from sign-in. */
export const SESSION_HOURS = 12;
/** Failures in a row an account may make before it has to wait. */
export const FREE_FAILURES = 5;
const FIRST_WAIT_S = 30;
const MAX_WAIT_S = 15 * 60;
/** Failures one client may make within `CLIENT_WINDOW_MS`. */
export const CLIENT_FAILURES = 20;
const CLIENT_WINDOW_MS = 10 * 60 * 1000;

const invalid = (p: Problem) => p;

/* ------------------------------------------------------------------ accounts */

function parse<T>(
  schema: { safeParse(v: unknown): { success: true; data: T } | { success: false; error: never } },
  raw: unknown,
  what: string,
): Result<T> {
  const r = schema.safeParse(raw);
  if (r.success) return ok(r.data);
  return problem("invalid", `The ${what} has errors; nothing was saved.`, friendlyMessages(fieldErrors(r.error)));
}

export async function listAccounts(db: DbOrTx): Promise<AccountJson[]> {
  return (await listAccountRows(db)).map(accountJson);
}

/** Creates an account (an admin on the accounts page, or the first admin from the command line). */
export async function createAccount(db: Db, raw: unknown): Promise<Result<AccountJson>> {
  const input = parse<AccountInput>(accountInputSchema as never, raw, "account");
  if (!input.ok) return input;
  const passwordHash = await hashPassword(input.value.password);
  return inTransaction(db, async (tx): Promise<Result<AccountJson>> => {
    if (await findAccountByEmail(tx, input.value.email)) {
      return problem("conflict", `An account for ${input.value.email} already exists.`, {
        email: "an account with this e-mail already exists",
      });
    }
    const row = await insertAccount(tx, {
      email: input.value.email,
      displayName: input.value.displayName,
      role: input.value.role,
      passwordHash,
    });
    const after = accountJson(row);
    await recordChange(tx, { subject: { type: "account", id: row.id }, entity: "account", entityId: row.id, action: "create", after });
    return ok(after);
  });
}

/** How many enabled admins there are. */
export function enabledAdmins(db: DbOrTx): Promise<number> {
  return countAccounts(db, { role: "admin", enabledOnly: true });
}

/**
 * Changes an account: display name, role, disabled, a new password. A role change, disabling or a
 * new password ends every session of the account. The last enabled admin cannot be demoted or disabled.
 */
export async function changeAccount(db: Db, id: number, raw: unknown): Promise<Result<AccountJson>> {
  const input = parse(accountChangeSchema as never, raw, "change") as Result<{
    displayName?: string;
    role?: Role;
    disabled?: boolean;
    password?: string;
  }>;
  if (!input.ok) return input;
  const c = input.value;
  const passwordHash = c.password === undefined ? undefined : await hashPassword(c.password);
  return inTransaction(db, async (tx): Promise<Result<AccountJson>> => {
    const existing = await findAccount(tx, id);
    if (!existing) return problem("not-found", `No account with id ${id}.`);
    const wasAdmin = existing.role === "admin" && existing.disabledAt === null;
    const staysAdmin = (c.role ?? existing.role) === "admin" && !(c.disabled ?? existing.disabledAt !== null);
    if (wasAdmin && !staysAdmin && (await enabledAdmins(tx)) <= 1) {
      return problem("conflict", "This is the last enabled admin; make another account admin first.", {
        [c.role !== undefined && c.role !== "admin" ? "role" : "disabled"]: "the last enabled admin must stay an enabled admin",
      });
    }
    const roleChanged = c.role !== undefined && c.role !== existing.role;
    const disabledChanged = c.disabled !== undefined && c.disabled !== (existing.disabledAt !== null);
    const revoke = roleChanged || disabledChanged || passwordHash !== undefined;
    const row = await updateAccountRow(tx, id, {
      displayName: c.displayName,
      role: c.role,
      passwordHash,
      disabledAt: disabledChanged ? (c.disabled ? new Date() : null) : undefined,
      ...(passwordHash !== undefined ? { failedSignIns: 0, lockedUntil: null } : {}),
      bumpVersion: revoke,
    });
    if (revoke) await deleteSessionsOf(tx, id);
    const before = accountJson(existing);
    const after = accountJson(row);
    const what = [
      roleChanged ? `role ${existing.role} → ${row.role}` : "",
      disabledChanged ? (c.disabled ? "disabled" : "enabled") : "",
      passwordHash !== undefined ? "password reset" : "",
      c.displayName !== undefined && c.displayName !== existing.displayName ? "display name" : "",
    ].filter(Boolean);
    await recordChange(tx, {
      subject: { type: "account", id },
      entity: "account",
      entityId: id,
      action: "update",
      summary: `${what.join(", ") || "no change"}${revoke ? "; sessions ended" : ""}`,
      before,
      after,
    });
    return ok(after);
  });
}

/**
 * A signed-in person changes their own password: the current one must match. Every session of the
 * account ends (this one too: sign in again with the new password).
 */
export async function changeOwnPassword(db: Db, accountId: number, raw: unknown): Promise<Result<AccountJson>> {
  const input = parse<{ currentPassword: string; newPassword: string }>(ownPasswordSchema as never, raw, "password change");
  if (!input.ok) return input;
  const existing = await findAccount(db, accountId);
  if (!existing) return problem("not-found", "No such account.");
  if (!(await passwordMatches(existing.passwordHash, input.value.currentPassword))) {
    return problem("invalid", "The current password is wrong; nothing was changed.", { currentPassword: "is wrong" });
  }
  const passwordHash = await hashPassword(input.value.newPassword);
  return inTransaction(db, async (tx): Promise<Result<AccountJson>> => {
    const row = await updateAccountRow(tx, accountId, { passwordHash, failedSignIns: 0, lockedUntil: null, bumpVersion: true });
    await deleteSessionsOf(tx, accountId);
    const after = accountJson(row);
    await recordChange(tx, {
      subject: { type: "account", id: accountId },
      entity: "account",
      entityId: accountId,
      action: "update",
      summary: "password changed by the account itself; sessions ended",
      before: accountJson(existing),
      after,
    });
    return ok(after);
  });
}

/* ------------------------------------------------------------------ sign-in */

/** Failed sign-ins per client (address) in this process: times of the failures in the window. */
const clientFailures = new Map<string, number[]>();

function recentClientFailures(client: string, now: number): number[] {
  const list = (clientFailures.get(client) ?? []).filter((t) => now - t < CLIENT_WINDOW_MS);
  if (list.length) clientFailures.set(client, list);
  else clientFailures.delete(client);
  return list;
}

function noteClientFailure(client: string, now: number): void {
  const list = recentClientFailures(client, now);
  list.push(now);
  clientFailures.set(client, list);
  if (clientFailures.size > 10_000) clientFailures.delete(clientFailures.keys().next().value as string);
}

/**
 * Failures in a row for e-mails without an account, in this process: they are slowed on the same
 * schedule as accounts, so that a 429 does not tell which e-mails have accounts.
 */
const unknownEmails = new Map<string, { failures: number; lockedUntil: number }>();

/** The wait after `failures` failures in a row, s (0 below `FREE_FAILURES`). */
function waitAfter(failures: number): number {
  const over = failures - FREE_FAILURES;
  return over >= 0 ? Math.min(MAX_WAIT_S, FIRST_WAIT_S * 2 ** over) : 0;
}

/** Forgets the failures of every client and unknown e-mail (tests). */
export function resetSignInThrottle(): void {
  clientFailures.clear();
  unknownEmails.clear();
}

let dummyHash: Promise<string> | undefined;
/** A hash to verify against for unknown e-mails, so that they take as long as known ones. */
const timingDummy = () => (dummyHash ??= hashPassword(randomKey()));

const throttled = (waitS: number, who: string): Problem => ({
  ...problem("throttled", `Too many failed sign-ins ${who}; try again in ${waitS} s.`, { _: `wait ${waitS} s` }),
  retryAfterS: waitS,
});

const wrong = () => problem("unauthorized", "The e-mail or the password is wrong.", { password: "e-mail or password is wrong" });

export interface SignedIn {
  /** The session key: the HTTP layer seals it into the cookie. */
  key: string;
  expiresAt: Date;
  account: AccountJson;
}

/** Checks an e-mail and password and opens a session. `client` identifies the caller for throttling (its address). */
export async function signIn(db: Db, raw: unknown, client: string, now: Date = new Date()): Promise<Result<SignedIn>> {
  const input = parse<{ email: string; password: string }>(signInSchema as never, raw, "sign-in");
  if (!input.ok) return invalid(input);
  const t = now.getTime();
  const recent = recentClientFailures(client, t);
  if (recent.length >= CLIENT_FAILURES) return throttled(Math.ceil((recent[0] + CLIENT_WINDOW_MS - t) / 1000), "from this address");
  const account = await findAccountByEmail(db, input.value.email);
  if (!account) {
    const u = unknownEmails.get(input.value.email) ?? { failures: 0, lockedUntil: 0 };
    if (u.lockedUntil > t) return throttled(Math.ceil((u.lockedUntil - t) / 1000), "for this account");
    await passwordMatches(await timingDummy(), input.value.password);
    noteClientFailure(client, t);
    u.failures += 1;
    u.lockedUntil = t + waitAfter(u.failures) * 1000;
    unknownEmails.set(input.value.email, u);
    if (unknownEmails.size > 10_000) unknownEmails.delete(unknownEmails.keys().next().value as string);
    return wrong();
  }
  if (account.lockedUntil && account.lockedUntil.getTime() > t) {
    return throttled(Math.ceil((account.lockedUntil.getTime() - t) / 1000), "for this account");
  }
  const matches = await passwordMatches(account.passwordHash, input.value.password);
  if (!matches || account.disabledAt !== null) {
    noteClientFailure(client, t);
    const failures = account.failedSignIns + 1;
    const waitS = waitAfter(failures);
    await updateAccountRow(db, account.id, { failedSignIns: failures, lockedUntil: waitS ? new Date(t + waitS * 1000) : null });
    return wrong();
  }
  const key = randomKey();
  const expiresAt = new Date(t + SESSION_HOURS * 3600 * 1000);
  await db.$transaction(async (tx) => {
    await updateAccountRow(tx, account.id, { failedSignIns: 0, lockedUntil: null, lastSignInAt: now });
    await insertSession(tx, { keyHash: sha256(key), accountId: account.id, accountVersion: account.version, expiresAt });
    await deleteExpiredSessions(tx, now);
  });
  return ok({ key, expiresAt, account: accountJson(account) });
}

const actorOf = (a: AccountRow, via: Actor["via"]): Actor => ({ name: a.email, accountId: a.id, role: a.role as Role, via });

/** The account a session key belongs to, while the session is valid; null otherwise. */
export async function sessionActor(db: DbOrTx, key: string, now: Date = new Date()): Promise<Actor | null> {
  if (!key) return null;
  const s = await findSessionWithAccount(db, sha256(key));
  if (!s || s.expiresAt.getTime() <= now.getTime()) return null;
  if (s.account.disabledAt !== null || s.accountVersion !== s.account.version) return null;
  return actorOf(s.account, "session");
}

/** Ends one session (sign-out). */
export async function signOut(db: DbOrTx, key: string): Promise<void> {
  await deleteSessionByHash(db, sha256(key));
}

/* ------------------------------------------------------------------ API tokens */

export const TOKEN_PREFIX = "stk_";

const DAY_MS = 24 * 3600 * 1000;

/** An instant as the token messages and lists show it: `2027-03-02 11:51 UTC`. */
export const utcMinute = (d: Date) => `${d.toISOString().slice(0, 16).replace("T", " ")} UTC`;

export interface TokenJson {
  id: number;
  accountId: number;
  email: string;
  name: string;
  prefix: string;
  createdAt: string;
  expiresAt: string;
  /** Whether `expiresAt` has passed (the token is refused). */
  expired: boolean;
  lastUsedAt: string | null;
}

export async function listTokens(db: DbOrTx, now: Date = new Date()): Promise<TokenJson[]> {
  return (await listApiTokens(db)).map((t) => ({
    id: t.id,
    accountId: t.accountId,
    email: t.account.email,
    name: t.name,
    prefix: t.prefix,
    createdAt: t.createdAt.toISOString(),
    expiresAt: t.expiresAt.toISOString(),
    expired: t.expiresAt.getTime() <= now.getTime(),
    lastUsedAt: t.lastUsedAt?.toISOString() ?? null,
  }));
}

export interface IssuedToken {
  id: number;
  token: string;
  prefix: string;
  accountId: number;
  expiresAt: string;
}

/**
 * Issues a token for an account, valid for `lifetimeDays` from `now`; the token itself is in the
 * answer once and never again.
 */
export async function issueToken(db: Db, raw: unknown, now: Date = new Date()): Promise<Result<IssuedToken>> {
  const input = parse<ApiTokenInput>(apiTokenInputSchema as never, raw, "token");
  if (!input.ok) return input;
  const token = `${TOKEN_PREFIX}${randomKey()}`;
  const prefix = token.slice(0, TOKEN_PREFIX.length + 6);
  const expiresAt = new Date(now.getTime() + input.value.lifetimeDays * DAY_MS);
  return inTransaction(db, async (tx: Tx): Promise<Result<IssuedToken>> => {
    const account = await findAccount(tx, input.value.accountId);
    if (!account) return problem("invalid", "No such account.", { accountId: `no account with id ${input.value.accountId}` });
    const row = await insertApiToken(tx, {
      accountId: account.id,
      name: input.value.tokenName,
      tokenHash: sha256(token),
      prefix,
      createdAt: now,
      expiresAt,
    });
    const after = { id: row.id, name: row.name, prefix, expiresAt: expiresAt.toISOString() };
    await recordChange(tx, {
      subject: { type: "account", id: account.id },
      entity: "token",
      entityId: row.id,
      action: "create",
      summary: `API token "${row.name}" (${prefix}…) issued, valid ${input.value.lifetimeDays} days until ${utcMinute(expiresAt)}`,
      after,
    });
    return ok({ id: row.id, token, prefix, accountId: account.id, expiresAt: expiresAt.toISOString() });
  });
}

export async function revokeToken(db: Db, id: number): Promise<Result<{ id: number }>> {
  return inTransaction(db, async (tx) => {
    const row = await findApiToken(tx, id);
    if (!row) return problem("not-found", `No API token with id ${id}.`);
    await deleteApiTokenRow(tx, id);
    await recordChange(tx, {
      subject: { type: "account", id: row.accountId },
      entity: "token",
      entityId: id,
      action: "delete",
      summary: `API token "${row.name}" (${row.prefix}…) revoked`,
      before: { id, name: row.name, prefix: row.prefix },
    });
    return ok({ id });
  });
}

/**
 * The account a bearer token acts for; `expired` (with the instant) for a token past its expiry;
 * null for an unknown token or a disabled account. `now` is the clock (tests pass their own).
 */
export async function tokenActor(db: DbOrTx, token: string, now: Date = new Date()): Promise<Actor | { expiredAt: Date } | null> {
  if (!token.startsWith(TOKEN_PREFIX) || token.length > 200) return null;
  const t = await findApiTokenWithAccount(db, sha256(token));
  if (!t || t.account.disabledAt !== null) return null;
  if (t.expiresAt.getTime() <= now.getTime()) return { expiredAt: t.expiresAt };
  // Note the use at most once a minute, so that reads do not turn into writes.
  if (!t.lastUsedAt || now.getTime() - t.lastUsedAt.getTime() > 60_000) await touchApiToken(db, t.id, now);
  return actorOf(t.account, "token");
}
