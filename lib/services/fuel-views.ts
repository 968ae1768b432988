/**
 * What the fuel pages and the API show about stored fuels: lib/ computes, this module gathers the
 * results for a row (properties, flame temperatures, normalised prices, cautions). A figure that
 * lib/ refuses to compute comes back as its reason, never as a number; anything else is a bug
 * and propagates.
 */
import type { Db } from "../db/client";
import {
  findFuelForSheet,
  isBlendRow,
  countFuels,
  listFuelsWithQuotes,
  storedDefinition,
  type BlendComponentRow,
  type FuelRow,
  type FuelWithQuotesRow,
} from "../db/fuel-rows";
import { listQuotes, quoteJson, type PriceQuoteRow, type QuoteJson } from "../db/price-quote-rows";
import { fuelPropertiesFromResolved, type FuelProperties } from "../combustion/properties";
import { flameTemperature, FLAME_METHODS, FLAME_METHOD_LABELS, type FlameMethod } from "../combustion/flame";
import { carbonCostPerMWh, mixPrices, normalisePrice, priceUnitLabel, type NormalisedPrice } from "../economics/prices";
import { co2Factors } from "../combustion/co2";
import { listRates, rateJson } from "../db/exchange-rate-rows";
import { latestStudyUsingFuel } from "../db/study-rows";
import { inCurrency, liveQuotes } from "./quote-choice";
import { energyContentOf } from "../combustion/energy-content";
import type { ResolvedFuel } from "../fuels/resolve";
import { heatingValues } from "../combustion/heating-values";
import type { FuelDefinition } from "../schemas/fuel";
import { cautionsFor, DEFER, type Caution } from "../fuels/cautions";
import { currentQuote, effectiveDefinition, quoteTerms, resolveRow } from "./fuels";
import { reasonOf } from "./result";
import type { Page } from "./paging";
import { contentKey, propertyCache } from "./eval-cache";

export { countFuels };

export interface PriceView {
  quote: QuoteJson;
  unitLabel: string;
  normalised: NormalisedPrice | null;
  /** Why the quote could not be normalised, when it could not. */
  error: string | null;
  /** In force today (latest valid-from not in the future). */
  current: boolean;
  /** The correction that replaced this quote (it then prices nothing). */
  supersededBy: number | null;
  withdrawn: boolean;
}

export interface FuelListItem {
  id: number;
  name: string;
  kind: string;
  isDemo: boolean;
  isBlend: boolean;
  properties: FuelProperties | null;
  error: string | null;
  price: PriceView | null;
  /**
   * A blend with no quote of its own: the price estimated from its components' quotes in force
   * (mass-weighted delivered price per kg), when every component has one in the same currency.
   */
  estimatedPrice: { normalised: NormalisedPrice; currency: string; isInvented: boolean } | null;
}

export interface FlameRow {
  condition: string;
  method: FlameMethod;
  methodLabel: string;
  temperatureK: number | null;
  error: string | null;
}

export interface FuelSheet {
  fuel: FuelRow;
  definition: FuelDefinition;
  effectiveDefinition: FuelDefinition;
  isBlend: boolean;
  components: (BlendComponentRow & { component: Pick<FuelRow, "id" | "name" | "kind"> })[];
  usedInBlends: Pick<FuelRow, "id" | "name">[];
  properties: FuelProperties | null;
  error: string | null;
  flame: FlameRow[];
  prices: PriceView[];
  resolved: ResolvedFuel | null;
  cautions: Caution[];
  cautionPreamble: string;
}

export interface ViewOptions {
  combustionReferenceC?: number;
  meteringReferenceC?: number;
  asOf?: Date;
}

/** Prices use heating values at the 25 °C combustion reference, whatever the display reference. */
const PRICE_COMBUSTION_REFERENCE_C = 25;

function normalised(q: PriceQuoteRow, fuel: ResolvedFuel): NormalisedPrice {
  return normalisePrice(quoteTerms(q), energyContentOf(fuel, heatingValues(fuel, PRICE_COMBUSTION_REFERENCE_C)));
}

function priceViews(quotes: PriceQuoteRow[], resolved: ResolvedFuel | null, asOf: Date): PriceView[] {
  const cur = currentQuote(quotes, asOf);
  return quotes.map((q) => {
    let price: NormalisedPrice | null = null;
    let error: string | null = null;
    if (resolved) {
      try {
        price = normalised(q, resolved);
      } catch (e) {
        error = reasonOf(e);
      }
    } else error = "the fuel's properties could not be computed";
    const next = quotes.find((x) => x.supersedesId === q.id);
    return {
      quote: quoteJson(q),
      unitLabel: priceUnitLabel(quoteTerms(q)),
      normalised: price,
      error,
      current: q === cur,
      supersededBy: next ? next.id : null,
      withdrawn: q.withdrawnAt !== null,
    };
  });
}

type PropertiesOutcome = { resolved: ResolvedFuel | null; properties: FuelProperties | null; error: string | null };

/**
 * The fuel's resolved form and property sheet at the view's references, cached by the content of
 * the definition lib/ evaluates (`effectiveDefinition`: stored definition, name, column attributes)
 * and the references: an edited fuel has another key, so it is computed afresh at once.
 */
function propertiesOf(row: FuelRow, opts: ViewOptions): PropertiesOutcome {
  const key = contentKey("fuel-properties", effectiveDefinition(row), opts.combustionReferenceC ?? null, opts.meteringReferenceC ?? null);
  return propertyCache<PropertiesOutcome>().getOrCompute(key, () => {
    try {
      const resolved = resolveRow(row);
      const properties = fuelPropertiesFromResolved(resolved, {
        combustionReferenceC: opts.combustionReferenceC,
        meteringReferenceC: opts.meteringReferenceC,
      });
      return { resolved, properties, error: null };
    } catch (e) {
      return { resolved: null, properties: null, error: reasonOf(e) };
    }
  });
}

/** Fuels (optionally of one kind; a page of them when `page` is given) with their headline figures and the price in force. */
export async function fuelList(db: Db, opts: ViewOptions & { kind?: string; page?: Page } = {}): Promise<FuelListItem[]> {
  const rows = await listFuelsWithQuotes(db, opts.kind, opts.page);
  const asOf = opts.asOf ?? new Date();
  return rows.map((row) => {
    const { resolved, properties, error } = propertiesOf(row, opts);
    const cur = currentQuote(row.priceQuotes, asOf);
    // The price views depend on the fuel, the quote in force and, for a blend without one, its components and their quotes in force.
    const componentsInForce = cur
      ? null
      : row.components.map((c) => [effectiveDefinition(c.component), currentQuote(c.component.priceQuotes, asOf) ?? null]);
    const priceKey = contentKey("fuel-list-price", effectiveDefinition(row), cur ?? null, componentsInForce);
    const { price, estimatedPrice } = propertyCache<Pick<FuelListItem, "price" | "estimatedPrice">>().getOrCompute(priceKey, () => {
      const price = cur ? priceViews([cur], resolved, asOf)[0] : null;
      return { price, estimatedPrice: !price && resolved ? estimateBlendPrice(resolved, row.components, asOf) : null };
    });
    return {
      id: row.id,
      name: row.name,
      kind: row.kind,
      isDemo: row.isDemo,
      isBlend: isBlendRow(row),
      properties,
      error,
      price,
      estimatedPrice,
    };
  });
}

/** The blend's price from its components' quotes in force; null when one has none, or the currencies differ, or one cannot be normalised. */
function estimateBlendPrice(blend: ResolvedFuel, components: FuelWithQuotesRow["components"], asOf: Date): FuelListItem["estimatedPrice"] {
  const w = blend.componentMassFractions;
  if (!w || components.length === 0 || w.length !== components.length) return null;
  const inForce = components.map((c) => currentQuote(c.component.priceQuotes, asOf)).filter((q): q is PriceQuoteRow => q !== undefined);
  if (inForce.length !== components.length) return null;
  if (new Set(inForce.map((q) => q.currency)).size !== 1) return null;
  try {
    const parts = components.map((c, i) => ({
      massFraction: w[i],
      price: normalised(inForce[i], resolveRow(c.component)),
      currency: inForce[i].currency,
      isInvented: inForce[i].isInvented,
    }));
    const mixed = mixPrices(parts, energyContentOf(blend, heatingValues(blend, PRICE_COMBUSTION_REFERENCE_C)));
    return { normalised: mixed, currency: parts[0].currency, isInvented: parts.some((p) => p.isInvented) };
  } catch (e) {
    reasonOf(e); // only a refusal of lib/ means "no estimate"; a bug propagates
    return null;
  }
}

/** Flame-temperature conditions shown on a fuel sheet: in dry air at 25 °C, 101.325 kPa. */
export const SHEET_FLAME_CONDITIONS = [
  { label: "stoichiometric (φ = 1)", input: { phi: 1 } },
  { label: "3 % O2 in the dry flue gas", input: { flueO2DryPercent: 3 } },
] as const;

/** The sheet's flame temperatures by every method; a method that cannot answer says why. */
export function flameRows(resolved: ResolvedFuel): FlameRow[] {
  const rows: FlameRow[] = [];
  for (const c of SHEET_FLAME_CONDITIONS) {
    for (const method of FLAME_METHODS) {
      const row = { condition: c.label, method, methodLabel: FLAME_METHOD_LABELS[method] };
      try {
        rows.push({ ...row, temperatureK: flameTemperature({ fuel: resolved, method, ...c.input }).temperatureK, error: null });
      } catch (e) {
        rows.push({ ...row, temperatureK: null, error: reasonOf(e) });
      }
    }
  }
  return rows;
}

/** Everything the fuel sheet shows. Null when there is no such fuel. */
export async function fuelSheet(db: Db, id: number, opts: ViewOptions & { flame?: boolean } = {}): Promise<FuelSheet | null> {
  const fuel = await findFuelForSheet(db, id);
  if (!fuel) return null;
  const { components, usedInBlends, ...row } = fuel;
  const { resolved, properties, error } = propertiesOf(row, opts);
  const quotes = await listQuotes(db, id);
  return {
    fuel: row,
    definition: storedDefinition(row),
    effectiveDefinition: effectiveDefinition(row),
    isBlend: isBlendRow(row),
    components,
    usedInBlends: usedInBlends.map((u) => u.blend),
    properties,
    error,
    flame: resolved && opts.flame !== false ? flameRows(resolved) : [],
    prices: priceViews(quotes, resolved, opts.asOf ?? new Date()),
    resolved,
    cautions: cautionsOf(effectiveDefinition(row)),
    cautionPreamble: DEFER,
  };
}

/** The fuel's cautions; when its definition cannot be read, one caution says so (never none). */
function cautionsOf(def: FuelDefinition): Caution[] {
  try {
    return cautionsFor(def);
  } catch (e) {
    return [{ hazard: "burner-change", title: "Cautions unavailable", text: reasonOf(e) }];
  }
}

/* ---------------------------------------------------------------- quotes side by side */

export interface QuoteComparisonRow {
  supplier: string;
  quoteId: number;
  validFrom: string;
  /** The quote as stated. */
  stated: string;
  /** Delivered cost per MWh of fuel in the comparison currency, gross and net basis; null with `problem`. */
  perMWh_gross: number | null;
  perMWh_net: number | null;
  /** The same plus the carbon cost of the fossil CO2 at the carbon price. */
  withCarbon_gross: number | null;
  withCarbon_net: number | null;
  conversion: string | null;
  problem: string | null;
}

export interface QuoteComparison {
  currency: string;
  carbonPrice_per_t: number;
  /** Where the carbon price came from. */
  carbonPriceSource: string;
  /** kg fossil CO2 per GJ, gross and net. */
  fossilCo2_kg_per_GJ: { gross: number; net: number } | null;
  rows: QuoteComparisonRow[];
}

/**
 * The current quotes of a fuel side by side, one per supplier (the latest live quote valid today of
 * each), normalised to delivered cost per MWh gross and net, with and without the carbon cost.
 * Quotes in another currency are converted at the rate in force on their date (stated).
 */
export async function quoteComparison(
  db: Db,
  fuelId: number,
  opts: { currency?: string; carbonPrice_per_t?: number; carbonPriceSource?: string; asOf?: Date } = {},
): Promise<QuoteComparison | null> {
  const sheet = await fuelSheet(db, fuelId, { flame: false });
  if (!sheet) return null;
  const quotes = await listQuotes(db, fuelId);
  const asOf = opts.asOf ?? new Date();
  const live = liveQuotes(quotes).filter((q) => q.validFrom.getTime() <= asOf.getTime());
  const bySupplier = new Map<string, PriceQuoteRow>();
  for (const q of live) if (!bySupplier.has(q.supplier.trim().toLowerCase())) bySupplier.set(q.supplier.trim().toLowerCase(), q);
  const currencies = [...bySupplier.values()].map((q) => q.currency);
  // Without a carbon price set on the page: the latest study that uses the fuel (its currency too), else 0.
  const usedBy = opts.carbonPrice_per_t === undefined || opts.currency === undefined ? await latestStudyUsingFuel(db, fuelId) : null;
  const currency =
    opts.currency ??
    usedBy?.currency ??
    currencies.sort((a, b) => currencies.filter((c) => c === b).length - currencies.filter((c) => c === a).length)[0] ??
    "EUR";
  const carbon = opts.carbonPrice_per_t ?? usedBy?.carbonPrice_per_t ?? 0;
  const carbonSource =
    opts.carbonPriceSource ??
    (opts.carbonPrice_per_t !== undefined
      ? "set on this page"
      : usedBy
        ? `from study "${usedBy.name}", the latest that uses this fuel`
        : "0: no carbon price set and no study uses this fuel");
  let co2: QuoteComparison["fossilCo2_kg_per_GJ"] = null;
  if (sheet.resolved) {
    const f = co2Factors(sheet.resolved, heatingValues(sheet.resolved, PRICE_COMBUSTION_REFERENCE_C));
    co2 = { gross: f.fossil_kg_per_GJ_hhv, net: f.fossil_kg_per_GJ_lhv };
  }
  const rates = (await listRates(db)).map(rateJson);
  const rows: QuoteComparisonRow[] = [...bySupplier.values()].map((q) => {
    const stated = `${q.amount}${q.transportAdder || q.handlingAdder ? ` + ${q.transportAdder + q.handlingAdder} adders` : ""} ${q.currency}/${priceUnitLabel(quoteTerms(q))}`;
    const base = {
      supplier: q.supplier || "(no supplier named)",
      quoteId: q.id,
      validFrom: q.validFrom.toISOString().slice(0, 10),
      stated,
    };
    const empty = { perMWh_gross: null, perMWh_net: null, withCarbon_gross: null, withCarbon_net: null };
    const c = inCurrency(q, { currency, rates });
    if (!c.ok) return { ...base, ...empty, conversion: null, problem: c.reason };
    if (!sheet.resolved) return { ...base, ...empty, conversion: c.note, problem: "the fuel's properties could not be computed" };
    let n: NormalisedPrice;
    try {
      const factor = c.price.amount / (q.amount || 1);
      n = normalised(
        {
          ...q,
          amount: c.price.amount,
          transportAdder: q.transportAdder * (q.amount ? factor : 1),
          handlingAdder: q.handlingAdder * (q.amount ? factor : 1),
        },
        sheet.resolved,
      );
    } catch (e) {
      return { ...base, ...empty, conversion: c.note, problem: reasonOf(e) };
    }
    return {
      ...base,
      perMWh_gross: n.perMWh_gross,
      perMWh_net: n.perMWh_net,
      withCarbon_gross: co2 ? n.perMWh_gross + carbonCostPerMWh(co2.gross, carbon) : null,
      withCarbon_net: co2 ? n.perMWh_net + carbonCostPerMWh(co2.net, carbon) : null,
      conversion: c.note,
      problem: null,
    };
  });
  return { currency, carbonPrice_per_t: carbon, carbonPriceSource: carbonSource, fossilCo2_kg_per_GJ: co2, rows };
}
