/**
 * Currency conversion with a dated exchange-rate table. A rate says: from `validFrom` on, one unit
 * of `fromCurrency` buys `rate` units of `toCurrency`. The rate used for an amount dated D is the
 * latest rate for the pair (either direction; the inverse direction is inverted) whose validFrom is
 * not after D — "the rate in force on D". No rate in force: no conversion (null), never a guess.
 */

export interface ExchangeRateEntry {
  id?: number;
  fromCurrency: string;
  toCurrency: string;
  rate: number;
  /** YYYY-MM-DD */
  validFrom: string;
  source?: string;
}

export interface AppliedRate {
  /** Multiply an amount in `from` by this factor to get it in `to`. */
  factor: number;
  from: string;
  to: string;
  /** The table entry used, as stored (it may be the inverse pair). */
  entry: ExchangeRateEntry;
  inverted: boolean;
}

/** The rate in force on `onDate` (YYYY-MM-DD) to convert `from` into `to`; null when the table has none. */
export function rateInForce(rates: readonly ExchangeRateEntry[], from: string, to: string, onDate: string): AppliedRate | null {
  if (from === to)
    return { factor: 1, from, to, entry: { fromCurrency: from, toCurrency: to, rate: 1, validFrom: onDate }, inverted: false };
  let best: AppliedRate | null = null;
  for (const r of rates) {
    if (r.validFrom > onDate || !(r.rate > 0)) continue;
    const direct = r.fromCurrency === from && r.toCurrency === to;
    const inverse = r.fromCurrency === to && r.toCurrency === from;
    if (!direct && !inverse) continue;
    // The later date wins; on the same date the direct quotation wins over the inverted one.
    if (best && (r.validFrom < best.entry.validFrom || (r.validFrom === best.entry.validFrom && (inverse || !best.inverted)))) continue;
    best = { factor: direct ? r.rate : 1 / r.rate, from, to, entry: r, inverted: inverse };
  }
  return best;
}

/** How a conversion is stated beside the converted figure. */
export function rateText(a: AppliedRate): string {
  const e = a.entry;
  const stated = `1 ${e.fromCurrency} = ${e.rate} ${e.toCurrency} from ${e.validFrom}${e.source ? ` (${e.source})` : ""}`;
  return a.inverted ? `${stated}, inverted: 1 ${a.from} = ${round6(a.factor)} ${a.to}` : stated;
}

const round6 = (x: number) => Number(x.toPrecision(6));
