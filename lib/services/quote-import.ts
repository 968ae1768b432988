/**
 * Bulk quotes for fuels already in the library: a CSV (header row) or a JSON list, one quote per
 * row, the fuel named in the `fuel` column (case-insensitive). All or nothing: every row is checked
 * (fuel known, quote valid and fitting the fuel, price plausible or confirmed) before anything is
 * stored; errors come back by row and column. A preview answers what would be added.
 */
import { recordChange } from "./change-log";
import { inTransaction, type Db } from "../db/client";
import { findFuel, fuelNames } from "../db/fuel-rows";
import { insertQuote } from "../db/price-quote-rows";
import type { PriceQuoteInputParsed } from "../schemas/library";
import { checkQuoteWrite } from "./fuels";
import { ok, problem, type FieldErrors, type Problem, type Result } from "./result";
import { readTable, rowErrors, type TableFormat } from "./tables";

const COLUMNS = [
  "fuel",
  "amount",
  "currency",
  "unit",
  "energyBasis",
  "meteringReference",
  "transportAdder",
  "handlingAdder",
  "validFrom",
  "sourceNote",
  "supplier",
  "confirmImplausible",
] as const;
const NUMERIC = ["amount", "transportAdder", "handlingAdder"];

export interface ImportedQuote {
  where: string;
  fuelId: number;
  fuelName: string;
  quote: PriceQuoteInputParsed;
  warnings: string[];
  /** Set once stored. */
  id?: number;
}

export interface QuoteImportSummary {
  preview: boolean;
  added: ImportedQuote[];
}

/** Reads, checks and (unless `preview`) stores the quotes; nothing is stored when any row has an error. */
export function importQuotes(
  db: Db,
  text: string,
  format: TableFormat,
  opts: { preview?: boolean; confirmImplausible?: boolean } = {},
): Promise<Result<QuoteImportSummary>> {
  const t = readTable(text, format, NUMERIC, COLUMNS);
  if (!t.ok) return Promise.resolve(t);
  if (!t.rows.length) return Promise.resolve(problem("invalid", "The file holds no quotes.", { file: "no rows" }));
  return inTransaction(db, async (tx): Promise<Result<QuoteImportSummary>> => {
    const byName = new Map((await fuelNames(tx)).map((f) => [f.name.trim().toLowerCase(), f]));
    const errs: FieldErrors = {};
    const out: ImportedQuote[] = [];
    let blocked: string[] = [];
    for (const row of t.rows) {
      const { fuel, confirmImplausible, ...quote } = row.values;
      const f = typeof fuel === "string" ? byName.get(fuel.trim().toLowerCase()) : undefined;
      if (!f) {
        Object.assign(
          errs,
          rowErrors(row, {
            fuel: typeof fuel === "string" && fuel.trim() ? `no fuel named "${fuel}" in the library` : "name a fuel of the library",
          }),
        );
        continue;
      }
      const fuelRow = await findFuel(tx, f.id);
      if (!fuelRow) throw new Error(`fuel ${f.id} vanished during the import`);
      const confirm =
        opts.confirmImplausible === true || confirmImplausible === true || confirmImplausible === "true" || confirmImplausible === "1";
      const checked = await checkQuoteWrite(tx, fuelRow, { ...quote, confirmImplausible: confirm });
      if (!checked.ok) {
        Object.assign(errs, rowErrors(row, checked.fieldErrors));
        if (checked.warnings) blocked = [...blocked, ...checked.warnings.map((w) => `${row.where}: ${w}`)];
        continue;
      }
      out.push({ where: row.where, fuelId: f.id, fuelName: f.name, quote: checked.value.quote, warnings: checked.value.warnings });
    }
    if (Object.keys(errs).length) {
      const [k, v] = Object.entries(errs)[0];
      const n = Object.keys(errs).length;
      const p: Problem = problem("invalid", `Import refused, nothing was stored (${n} error${n > 1 ? "s" : ""}; first: ${k}: ${v}).`, errs);
      return blocked.length ? { ...p, warnings: blocked } : p;
    }
    if (!opts.preview) {
      for (const q of out) {
        const row = await insertQuote(tx, q.fuelId, q.quote);
        q.id = row.id;
        const { createdAt: _c, ...after } = row;
        await recordChange(tx, {
          subject: { type: "fuel", id: q.fuelId },
          entity: "quote",
          entityId: row.id,
          action: "import",
          summary: `bulk quote import, ${q.where}`,
          after,
        });
      }
    }
    return ok({ preview: opts.preview === true, added: out });
  });
}
