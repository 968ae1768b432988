/** Study-revision rows: the queries (insert and read only; a revision is never changed). */
import type { StudyRevision } from "./generated/client";
import type { DbOrTx, Tx } from "./client";

export type StudyRevisionRow = StudyRevision;

export interface RevisionColumns {
  hash: string;
  inputs: string;
  results: string;
  meta: string;
}

/** A study's revisions, newest first (without the stored documents). */
export function listRevisionRows(db: DbOrTx, studyId: number) {
  return db.studyRevision.findMany({
    where: { studyId },
    orderBy: { number: "desc" },
    select: { number: true, hash: true, createdAt: true, _count: { select: { quotes: true } } },
  });
}

export function findRevisionRow(db: DbOrTx, studyId: number, number: number): Promise<StudyRevision | null> {
  return db.studyRevision.findUnique({ where: { studyId_number: { studyId, number } } });
}

export function latestRevisionRow(db: DbOrTx, studyId: number): Promise<StudyRevision | null> {
  return db.studyRevision.findFirst({ where: { studyId }, orderBy: { number: "desc" } });
}

export function countRevisions(db: DbOrTx, studyId: number): Promise<number> {
  return db.studyRevision.count({ where: { studyId } });
}

/** Inserts the next revision (number = highest + 1) with the quotes it used. */
export async function insertRevision(tx: Tx, studyId: number, c: RevisionColumns, quoteIds: readonly number[]): Promise<StudyRevision> {
  const last = await tx.studyRevision.findFirst({ where: { studyId }, orderBy: { number: "desc" }, select: { number: true } });
  const row = await tx.studyRevision.create({ data: { studyId, number: (last?.number ?? 0) + 1, ...c } });
  for (const quoteId of quoteIds) await tx.revisionQuote.create({ data: { revisionId: row.id, quoteId } });
  return row;
}
