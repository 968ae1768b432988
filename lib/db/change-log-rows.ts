/** The change log: one row per change to a fuel, quote, plant, study, account or token. */
import type { ChangeLog } from "./generated/client";
import type { DbOrTx } from "./client";

export type ChangeLogRow = ChangeLog;

export interface ChangeLogColumns {
  actor: string;
  accountId: number | null;
  subjectType: string;
  subjectId: number;
  entity: string;
  entityId: number;
  action: string;
  summary: string;
  before: string | null;
  after: string | null;
}

export function insertChange(tx: DbOrTx, data: ChangeLogColumns): Promise<ChangeLog> {
  return tx.changeLog.create({ data });
}

/** The changes shown on one object's page, newest first. */
export function changesOf(db: DbOrTx, subjectType: string, subjectId: number, limit: number): Promise<ChangeLog[]> {
  return db.changeLog.findMany({
    where: { subjectType, subjectId },
    orderBy: [{ at: "desc" }, { id: "desc" }],
    take: limit,
  });
}

/** The newest changes shown on pages of one kind (all accounts, say), newest first. */
export function changesOfType(db: DbOrTx, subjectType: string, limit: number): Promise<ChangeLog[]> {
  return db.changeLog.findMany({ where: { subjectType }, orderBy: [{ at: "desc" }, { id: "desc" }], take: limit });
}

export function countChangesOfType(db: DbOrTx, subjectType: string): Promise<number> {
  return db.changeLog.count({ where: { subjectType } });
}

export function countChangesOf(db: DbOrTx, subjectType: string, subjectId: number): Promise<number> {
  return db.changeLog.count({ where: { subjectType, subjectId } });
}
