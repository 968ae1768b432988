/**
 * The data revision: the counter in the one `DataRevision` row that database triggers raise at every
 * committed change to any other table (migration 20261202121000_data_revision).
 */
import type { DbOrTx } from "./client";

/** The current value of the counter (0 before the first change). */
export async function readDataRevision(db: DbOrTx): Promise<number> {
  const row = await db.dataRevision.findUnique({ where: { id: 1 }, select: { n: true } });
  if (!row) throw new Error("The DataRevision row is missing: the database was not migrated with this version of Stoke.");
  return row.n;
}
