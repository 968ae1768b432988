/**
 * The change log: every change to fuels, quotes, plants, studies, accounts and tokens is recorded by
 * the service that makes it, inside the same transaction — who (the current actor), what (entity,
 * id, action), when, and the record before and after as JSON. Each object's page shows its history
 * with the fields that differ.
 */
import type { DbOrTx } from "../db/client";
import { changesOf, changesOfType, countChangesOf, countChangesOfType, insertChange, type ChangeLogRow } from "../db/change-log-rows";
import { jsonDifferences, type JsonDifference } from "../formats/canonical-json";
import { currentActor } from "./actor";

export type SubjectType = "fuel" | "plant" | "study" | "account";
export type ChangeEntity = "fuel" | "quote" | "plant" | "study" | "account" | "token";
export type ChangeAction =
  | "create"
  | "update"
  | "trash"
  | "restore"
  | "purge"
  | "withdraw"
  | "correct"
  | "delete"
  | "duplicate"
  | "issue"
  | "import";

export interface ChangeInput {
  subject: { type: SubjectType; id: number };
  entity: ChangeEntity;
  entityId: number;
  action: ChangeAction;
  summary?: string;
  before?: unknown;
  after?: unknown;
}

/** JSON text of a record with dates as ISO strings (null when there is no record). */
function snapshot(v: unknown): string | null {
  if (v === undefined || v === null) return null;
  return JSON.stringify(v, (_k, x) => (x instanceof Date ? x.toISOString() : x));
}

/** Records one change as the current actor. Call it inside the transaction that makes the change. */
export async function recordChange(tx: DbOrTx, c: ChangeInput): Promise<void> {
  const actor = currentActor();
  await insertChange(tx, {
    actor: actor.name,
    accountId: actor.accountId,
    subjectType: c.subject.type,
    subjectId: c.subject.id,
    entity: c.entity,
    entityId: c.entityId,
    action: c.action,
    summary: (c.summary ?? "").slice(0, 500),
    before: snapshot(c.before),
    after: snapshot(c.after),
  });
}

/** Fields that record when a row was written, left out of the differences shown. */
const BOOKKEEPING = new Set(["updatedAt", "createdAt"]);

export interface HistoryEntry {
  id: number;
  at: string;
  actor: string;
  entity: string;
  entityId: number;
  action: string;
  summary: string;
  before: unknown;
  after: unknown;
  /** Fields that differ between before and after (both present: an update). */
  differences: JsonDifference[];
}

export interface History {
  entries: HistoryEntry[];
  total: number;
}

const parse = (s: string | null): unknown => (s === null ? null : JSON.parse(s));

/** The newest `limit` changes shown on an object's page, each with its differences. */
export async function historyOf(db: DbOrTx, type: SubjectType, id: number, limit = 30): Promise<History> {
  const [rows, total] = await Promise.all([changesOf(db, type, id, limit), countChangesOf(db, type, id)]);
  return { total, entries: rows.map(entryOf) };
}

/** The newest `limit` changes to every object of a kind (the accounts page shows those of all accounts). */
export async function historyOfType(db: DbOrTx, type: SubjectType, limit = 30): Promise<History> {
  const [rows, total] = await Promise.all([changesOfType(db, type, limit), countChangesOfType(db, type)]);
  return { total, entries: rows.map(entryOf) };
}

function entryOf(r: ChangeLogRow): HistoryEntry {
  const before = parse(r.before);
  const after = parse(r.after);
  const differences =
    before !== null && after !== null
      ? jsonDifferences(before, after, 40).filter((d) => !BOOKKEEPING.has(d.path.split(".").pop() ?? ""))
      : [];
  return {
    id: r.id,
    at: r.at.toISOString(),
    actor: r.actor,
    entity: r.entity,
    entityId: r.entityId,
    action: r.action,
    summary: r.summary,
    before,
    after,
    differences,
  };
}
