/** Stored uncertainty runs: the queries (insert and read only; a stored run is never changed). */
import type { UncertaintyRun } from "./generated/client";
import type { DbOrTx } from "./client";

export type UncertaintyRunRow = UncertaintyRun;

export interface UncertaintyRunColumns {
  inputsHash: string;
  settings: string;
  results: string;
}

export function insertUncertaintyRun(db: DbOrTx, studyId: number, c: UncertaintyRunColumns): Promise<UncertaintyRun> {
  return db.uncertaintyRun.create({ data: { studyId, ...c } });
}

export function findUncertaintyRun(db: DbOrTx, studyId: number, id: number): Promise<UncertaintyRun | null> {
  return db.uncertaintyRun.findFirst({ where: { id, studyId } });
}

/** A study's runs, newest first, without their documents. */
export function listUncertaintyRunRows(db: DbOrTx, studyId: number) {
  return db.uncertaintyRun.findMany({
    where: { studyId },
    orderBy: [{ createdAt: "desc" }, { id: "desc" }],
    select: { id: true, inputsHash: true, settings: true, createdAt: true },
  });
}

/** The newest run of a study, or the newest on inputs with this hash (e.g. a revision's). */
export function latestUncertaintyRun(db: DbOrTx, studyId: number, inputsHash?: string): Promise<UncertaintyRun | null> {
  return db.uncertaintyRun.findFirst({
    where: { studyId, ...(inputsHash === undefined ? {} : { inputsHash }) },
    orderBy: [{ createdAt: "desc" }, { id: "desc" }],
  });
}
