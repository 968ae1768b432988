/**
 * Bounded parameter lists. SQLite refuses a statement with more than 999 parameters here (and
 * PostgreSQL more than 65,535), and Prisma turns an `in` list or a relation include over many rows
 * into one parameter per id. Every query over an unbounded set of ids goes through `inChunks`, and
 * relations of a list are loaded by the row loaders with it, never by a nested include.
 */

/** Ids per query: well below SQLite's 999 parameters, leaving room for the other conditions. */
export const ID_CHUNK = 500;

/** Runs `query` on consecutive slices of at most ID_CHUNK distinct ids and concatenates the rows. */
export async function inChunks<R>(ids: readonly number[], query: (chunk: number[]) => Promise<R[]>): Promise<R[]> {
  const distinct = [...new Set(ids)];
  const out: R[] = [];
  for (let i = 0; i < distinct.length; i += ID_CHUNK) {
    const rows = await query(distinct.slice(i, i + ID_CHUNK));
    for (const r of rows) out.push(r);
  }
  return out;
}

/** Groups rows by a key, keeping their order. */
export function groupBy<R>(rows: readonly R[], key: (r: R) => number): Map<number, R[]> {
  const m = new Map<number, R[]>();
  for (const r of rows) {
    const k = key(r);
    const list = m.get(k);
    if (list) list.push(r);
    else m.set(k, [r]);
  }
  return m;
}
