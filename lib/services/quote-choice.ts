/**
 * Which quote prices a scenario, and in which currency. A scenario either names a quote or follows
 * the rule "the latest quote in the study's currency valid on date D" (D = the scenario's
 * `priceValidOn`, else the day of evaluation). Quotes are never overwritten: a correction is a new
 * version that supersedes the old one; a withdrawn quote stays on record but prices nothing.
 * A quote in another currency is converted at the exchange rate in force on the quote's date (the
 * rate is stated). Every choice carries its rule and notes so that the pages can say it.
 */
import type { PriceQuoteRow } from "../db/price-quote-rows";
import { quoteJson } from "../db/price-quote-rows";
import type { StudyPriceInput } from "../schemas/study";
import { rateInForce, rateText, type ExchangeRateEntry } from "../economics/currency";

export const day = (d: Date) => d.toISOString().slice(0, 10);

export type PriceSource =
  | { kind: "quote"; quoteId: number; invented: boolean; validFrom: string; rule: string; notes: string[] }
  | { kind: "current"; quoteId: number; invented: boolean; validFrom: string; rule: string; notes: string[] }
  | { kind: "components"; quoteIds: number[]; invented: boolean; rule: string; notes: string[] }
  | { kind: "none"; invented: false; currency: string; rule: string; notes: string[] };

export interface PricingContext {
  currency: string;
  rates: readonly ExchangeRateEntry[];
}

/** The quote's terms as a study file carries them (in its own currency). */
export function studyPrice(q: PriceQuoteRow): StudyPriceInput {
  const j = quoteJson(q);
  return {
    amount: j.amount,
    currency: j.currency,
    unit: j.unit as StudyPriceInput["unit"],
    energyBasis: j.energyBasis as StudyPriceInput["energyBasis"],
    meteringReference: j.meteringReference as StudyPriceInput["meteringReference"],
    transportAdder: j.transportAdder,
    handlingAdder: j.handlingAdder,
    validFrom: j.validFrom,
    sourceNote: j.sourceNote,
    isInvented: j.isInvented,
  };
}

/** Quotes that may price something: not withdrawn and not superseded by a correction (order kept). */
export function liveQuotes(quotes: readonly PriceQuoteRow[]): PriceQuoteRow[] {
  const superseded = new Set(quotes.map((q) => q.supersedesId).filter((x): x is number => x !== null));
  return quotes.filter((q) => q.withdrawnAt === null && !superseded.has(q.id));
}

/** The newest version of a quote among `all` (following corrections). */
export function latestVersion(q: PriceQuoteRow, all: readonly PriceQuoteRow[]): PriceQuoteRow {
  let cur = q;
  for (let guard = 0; guard < 1000; guard++) {
    const next = all.filter((x) => x.supersedesId === cur.id).sort((a, b) => b.id - a.id)[0];
    if (!next) return cur;
    cur = next;
  }
  return cur;
}

export const ruleText = (currency: string, validOn: string | null) =>
  `latest quote in ${currency} valid on ${validOn ?? "the day of evaluation"}`;

type Converted = { ok: true; price: StudyPriceInput; note: string | null } | { ok: false; reason: string };

/** The quote in the study's currency: itself, or converted at the rate in force on its date. */
export function inCurrency(q: PriceQuoteRow, ctx: PricingContext): Converted {
  const p = studyPrice(q);
  if (q.currency === ctx.currency) return { ok: true, price: p, note: null };
  const on = day(q.validFrom);
  const r = rateInForce(ctx.rates, q.currency, ctx.currency, on);
  if (!r)
    return {
      ok: false,
      reason: `quote #${q.id} is in ${q.currency} and no exchange rate from ${q.currency} to ${ctx.currency} is in force on ${on}`,
    };
  const f = r.factor;
  const note = `quote #${q.id} converted from ${q.amount} ${q.currency} at ${rateText(r)}`;
  return {
    ok: true,
    price: {
      ...p,
      amount: q.amount * f,
      transportAdder: q.transportAdder * f,
      handlingAdder: q.handlingAdder * f,
      currency: ctx.currency,
      sourceNote: `${p.sourceNote ?? ""}${p.sourceNote ? " — " : ""}${note}`.slice(0, 1000),
    },
    note,
  };
}

/**
 * The rule's quote: the latest live quote valid on `asOf` in the study's currency; failing that the
 * latest live quote in another currency that a rate converts. With the reason when there is none.
 */
export function quoteByRule(
  quotesNewestFirst: readonly PriceQuoteRow[],
  asOf: Date,
  ctx: PricingContext,
): { quote: PriceQuoteRow; converted: Extract<Converted, { ok: true }> } | { quote: null; reason: string } {
  const valid = liveQuotes(quotesNewestFirst).filter((q) => q.validFrom.getTime() <= asOf.getTime());
  const own = valid.find((q) => q.currency === ctx.currency);
  if (own) return { quote: own, converted: { ok: true, price: studyPrice(own), note: null } };
  const reasons: string[] = [];
  for (const q of valid) {
    const c = inCurrency(q, ctx);
    if (c.ok) return { quote: q, converted: c };
    reasons.push(c.reason);
  }
  if (!valid.length) return { quote: null, reason: `no quote valid on ${day(asOf)}` };
  return { quote: null, reason: `no quote in ${ctx.currency} valid on ${day(asOf)}; ${reasons[0]}` };
}
