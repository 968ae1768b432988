/**
 * The dated exchange-rate table: listed, added one by one or imported (CSV or JSON), all or
 * nothing. A stored rate is never changed: a new rate for a later date takes over from that date.
 */
import { inTransaction, type Db } from "../db/client";
import { findRate, insertRate, listRates, rateJson, type ExchangeRateJson } from "../db/exchange-rate-rows";
import { fieldErrors } from "../schemas/fuel";
import { exchangeRateInputSchema } from "../schemas/exchange-rate";
import { ok, problem, type FieldErrors, type Result } from "./result";
import { readTable, rowErrors, type TableFormat, type TableRow } from "./tables";

export async function listExchangeRates(db: Db): Promise<ExchangeRateJson[]> {
  return (await listRates(db)).map(rateJson);
}

const COLUMNS = ["fromCurrency", "toCurrency", "rate", "validFrom", "source"] as const;

/** Adds rates from a JSON body (one object or a list) or a file; all or nothing. */
export function addExchangeRates(
  db: Db,
  input: { text: string; format: TableFormat } | { value: unknown },
): Promise<Result<ExchangeRateJson[]>> {
  let rows: TableRow[];
  if ("value" in input) {
    const list = Array.isArray(input.value) ? input.value : [input.value];
    rows = list.map((v, i) => ({
      where: list.length === 1 && !Array.isArray(input.value) ? "" : `item ${i + 1}`,
      values: v as Record<string, unknown>,
      columnOf: (f) => f,
    }));
  } else {
    const t = readTable(input.text, input.format, ["rate"], COLUMNS);
    if (!t.ok) return Promise.resolve(t);
    rows = t.rows;
  }
  return inTransaction(db, async (tx): Promise<Result<ExchangeRateJson[]>> => {
    const errs: FieldErrors = {};
    const out: ExchangeRateJson[] = [];
    const seen = new Set<string>();
    for (const row of rows) {
      const parsed = exchangeRateInputSchema.safeParse(row.values);
      if (!parsed.success) {
        const fe = fieldErrors(parsed.error);
        Object.assign(errs, row.where ? rowErrors(row, fe) : fe);
        continue;
      }
      const r = parsed.data;
      const key = `${r.fromCurrency}/${r.toCurrency}/${r.validFrom}`;
      if (seen.has(key) || (await findRate(tx, r.fromCurrency, r.toCurrency, r.validFrom))) {
        const msg = `a ${r.fromCurrency}→${r.toCurrency} rate from ${r.validFrom} is already stored (rates are not overwritten; date a new one)`;
        Object.assign(errs, row.where ? rowErrors(row, { validFrom: msg }) : { validFrom: msg });
        continue;
      }
      seen.add(key);
      out.push(rateJson(await insertRate(tx, r)));
    }
    if (Object.keys(errs).length) {
      const [k, v] = Object.entries(errs)[0];
      return problem(
        Object.values(errs).some((m) => m.includes("already stored")) && Object.keys(errs).length === 1 ? "conflict" : "invalid",
        `Nothing was stored: ${k}: ${v}`,
        errs,
      );
    }
    return ok(out);
  });
}
