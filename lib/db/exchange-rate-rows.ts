/** Exchange-rate rows: the queries, and one mapper per direction between a row and a rate entry. */
import type { ExchangeRate } from "./generated/client";
import type { DbOrTx } from "./client";

export type ExchangeRateRow = ExchangeRate;

export interface ExchangeRateColumns {
  fromCurrency: string;
  toCurrency: string;
  rate: number;
  /** YYYY-MM-DD */
  validFrom: string;
  source: string;
}

/* ------------------------------------------------------------------ row → domain */

export function rateJson(r: ExchangeRate) {
  return {
    id: r.id,
    fromCurrency: r.fromCurrency,
    toCurrency: r.toCurrency,
    rate: r.rate,
    validFrom: r.validFrom.toISOString().slice(0, 10),
    source: r.source,
    createdAt: r.createdAt.toISOString(),
  };
}
export type ExchangeRateJson = ReturnType<typeof rateJson>;

/* ------------------------------------------------------------------ queries */

/** Every rate, by pair and newest first. */
export function listRates(db: DbOrTx): Promise<ExchangeRate[]> {
  return db.exchangeRate.findMany({ orderBy: [{ fromCurrency: "asc" }, { toCurrency: "asc" }, { validFrom: "desc" }] });
}

export function findRate(db: DbOrTx, fromCurrency: string, toCurrency: string, validFrom: string): Promise<ExchangeRate | null> {
  return db.exchangeRate.findUnique({
    where: { fromCurrency_toCurrency_validFrom: { fromCurrency, toCurrency, validFrom: new Date(`${validFrom}T00:00:00Z`) } },
  });
}

export function insertRate(db: DbOrTx, r: ExchangeRateColumns): Promise<ExchangeRate> {
  return db.exchangeRate.create({ data: { ...r, validFrom: new Date(`${r.validFrom}T00:00:00Z`) } });
}
