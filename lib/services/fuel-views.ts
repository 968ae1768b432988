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
  listFuelsWithQuotes,
  storedDefinition,
  type BlendComponentRow,
  type FuelRow,
  type FuelWithQuotesRow,
} from "../db/fuel-rows";
import { listQuotes, quoteJson, type PriceQuoteRow, type QuoteJson } from "../db/price-quote-rows";
import { fuelPropertiesFromResolved, type FuelProperties } from "../combustion/properties";
import { flameTemperature, FLAME_METHODS, FLAME_METHOD_LABELS, type FlameMethod } from "../combustion/flame";
import { mixPrices, normalisePrice, priceUnitLabel, type NormalisedPrice } from "../economics/prices";
import { energyContentOf } from "../combustion/energy-content";
import type { ResolvedFuel } from "../fuels/resolve";
import { heatingValues } from "../combustion/heating-values";
import type { FuelDefinition } from "../schemas/fuel";
import { cautionsFor, DEFER, type Caution } from "../fuels/cautions";
import { currentQuote, effectiveDefinition, quoteTerms, resolveRow } from "./fuels";
import { reasonOf } from "./result";

export interface PriceView {
  quote: QuoteJson;
  unitLabel: string;
  normalised: NormalisedPrice | null;
  /** Why the quote could not be normalised, when it could not. */
  error: string | null;
  /** In force today (latest valid-from not in the future). */
  current: boolean;
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
    return { quote: quoteJson(q), unitLabel: priceUnitLabel(quoteTerms(q)), normalised: price, error, current: q === cur };
  });
}

function propertiesOf(
  row: FuelRow,
  opts: ViewOptions,
): { resolved: ResolvedFuel | null; properties: FuelProperties | null; error: string | null } {
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
}

/** All fuels (optionally of one kind) with their headline figures and the price in force. */
export async function fuelList(db: Db, opts: ViewOptions & { kind?: string } = {}): Promise<FuelListItem[]> {
  const rows = await listFuelsWithQuotes(db, opts.kind);
  const asOf = opts.asOf ?? new Date();
  return rows.map((row) => {
    const { resolved, properties, error } = propertiesOf(row, opts);
    const cur = currentQuote(row.priceQuotes, asOf);
    const price = cur ? priceViews([cur], resolved, asOf)[0] : null;
    const estimatedPrice = !price && resolved ? estimateBlendPrice(resolved, row.components, asOf) : null;
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
