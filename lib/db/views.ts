/**
 * What the fuel pages and the API show about stored fuels: lib/ computes, this module only
 * gathers the results for a row (properties, flame temperatures, normalised prices) and
 * turns failures into messages instead of numbers.
 */
import type { BlendComponent, Fuel, PriceQuote, PrismaClient } from "./generated/client";
import { currentQuote, effectiveDefinition, isBlendRow, listPriceQuotes, quoteJson, quoteTerms, resolveRow, storedDefinition } from "./fuels";
import { fuelPropertiesFromResolved, type FuelProperties } from "../combustion/properties";
import { flameTemperature, FLAME_METHODS, FLAME_METHOD_LABELS, type FlameMethod } from "../combustion/flame";
import { mixPrices, normalisePrice, priceUnitLabel, type NormalisedPrice } from "../economics/prices";
import { energyContentOf } from "../combustion/energy-content";
import type { ResolvedFuel } from "../fuels/resolve";
import { heatingValues } from "../combustion/heating-values";
import type { FuelDefinition } from "../schemas/fuel";
import { cautionsFor, DEFER, type Caution } from "../fuels/cautions";

export interface PriceView {
  quote: ReturnType<typeof quoteJson>;
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
  fuel: Fuel;
  definition: FuelDefinition;
  effectiveDefinition: FuelDefinition;
  isBlend: boolean;
  components: (BlendComponent & { component: Pick<Fuel, "id" | "name" | "kind"> })[];
  usedInBlends: Pick<Fuel, "id" | "name">[];
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

function message(e: unknown): string {
  return e instanceof Error ? e.message : String(e);
}

function priceViews(quotes: PriceQuote[], resolved: ResolvedFuel | null, asOf: Date): PriceView[] {
  const cur = currentQuote(quotes, asOf);
  return quotes.map((q) => {
    let normalised: NormalisedPrice | null = null;
    let error: string | null = null;
    if (resolved) {
      try {
        // Prices use heating values at the 25 °C combustion reference, whatever the display reference.
        const content = energyContentOf(resolved, heatingValues(resolved, 25));
        normalised = normalisePrice(quoteTerms(q), content);
      } catch (e) {
        error = message(e);
      }
    } else error = "the fuel's properties could not be computed";
    return { quote: quoteJson(q), unitLabel: priceUnitLabel(quoteTerms(q)), normalised, error, current: q === cur };
  });
}

function propertiesOf(row: Fuel, opts: ViewOptions): { resolved: ResolvedFuel | null; properties: FuelProperties | null; error: string | null } {
  try {
    const resolved = resolveRow(row);
    const properties = fuelPropertiesFromResolved(resolved, {
      combustionReferenceC: opts.combustionReferenceC,
      meteringReferenceC: opts.meteringReferenceC,
    });
    return { resolved, properties, error: null };
  } catch (e) {
    return { resolved: null, properties: null, error: message(e) };
  }
}

/** All fuels (optionally of one kind) with their headline figures and the price in force. */
export async function fuelList(db: PrismaClient, opts: ViewOptions & { kind?: string } = {}): Promise<FuelListItem[]> {
  const rows = await db.fuel.findMany({
    where: opts.kind ? { kind: opts.kind } : undefined,
    orderBy: [{ kind: "asc" }, { name: "asc" }],
    include: {
      priceQuotes: { orderBy: [{ validFrom: "desc" }, { createdAt: "desc" }, { id: "desc" }] },
      components: { orderBy: { position: "asc" }, include: { component: { include: { priceQuotes: { orderBy: [{ validFrom: "desc" }, { createdAt: "desc" }, { id: "desc" }] } } } } },
    },
  });
  const asOf = opts.asOf ?? new Date();
  return rows.map((row) => {
    const { resolved, properties, error } = propertiesOf(row, opts);
    const cur = currentQuote(row.priceQuotes, asOf);
    const price = cur ? priceViews([cur], resolved, asOf)[0] : null;
    const estimatedPrice = !price && resolved ? estimateBlendPrice(resolved, row.components, asOf) : null;
    return { id: row.id, name: row.name, kind: row.kind, isDemo: row.isDemo, isBlend: isBlendRow(row), properties, error, price, estimatedPrice };
  });
}

function estimateBlendPrice(
  blend: ResolvedFuel,
  components: { component: Fuel & { priceQuotes: PriceQuote[] } }[],
  asOf: Date,
): FuelListItem["estimatedPrice"] {
  const w = blend.componentMassFractions;
  if (!w || components.length === 0 || w.length !== components.length) return null;
  try {
    const parts = components.map((c, i) => {
      const q = currentQuote(c.component.priceQuotes, asOf);
      if (!q) throw new Error("a component has no quote in force");
      const r = resolveRow(c.component);
      return { massFraction: w[i], price: normalisePrice(quoteTerms(q), energyContentOf(r, heatingValues(r, 25))), currency: q.currency, isInvented: q.isInvented };
    });
    if (new Set(parts.map((p) => p.currency)).size !== 1) return null;
    const normalised = mixPrices(parts, energyContentOf(blend, heatingValues(blend, 25)));
    return { normalised, currency: parts[0].currency, isInvented: parts.some((p) => p.isInvented) };
  } catch {
    return null;
  }
}

/** Flame-temperature conditions shown on a fuel sheet: in dry air at 25 °C, 101.325 kPa. */
export const SHEET_FLAME_CONDITIONS = [
  { label: "stoichiometric (φ = 1)", input: { phi: 1 } },
  { label: "3 % O2 in the dry flue gas", input: { flueO2DryPercent: 3 } },
] as const;

export function flameRows(resolved: ResolvedFuel): FlameRow[] {
  const rows: FlameRow[] = [];
  for (const c of SHEET_FLAME_CONDITIONS) {
    for (const method of FLAME_METHODS) {
      try {
        const r = flameTemperature({ fuel: resolved, method, ...c.input });
        rows.push({ condition: c.label, method, methodLabel: FLAME_METHOD_LABELS[method], temperatureK: r.temperatureK, error: null });
      } catch (e) {
        rows.push({ condition: c.label, method, methodLabel: FLAME_METHOD_LABELS[method], temperatureK: null, error: message(e) });
      }
    }
  }
  return rows;
}

/** Everything the fuel sheet shows. Null when there is no such fuel. */
export async function fuelSheet(db: PrismaClient, id: number, opts: ViewOptions & { flame?: boolean } = {}): Promise<FuelSheet | null> {
  const fuel = await db.fuel.findUnique({
    where: { id },
    include: {
      components: { orderBy: { position: "asc" }, include: { component: { select: { id: true, name: true, kind: true } } } },
      usedInBlends: { include: { blend: { select: { id: true, name: true } } } },
    },
  });
  if (!fuel) return null;
  const { components, usedInBlends, ...row } = fuel;
  const { resolved, properties, error } = propertiesOf(row, opts);
  const quotes = await listPriceQuotes(db, id);
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
    cautions: safeCautions(effectiveDefinition(row)),
    cautionPreamble: DEFER,
  };
}

function safeCautions(def: FuelDefinition): Caution[] {
  try {
    return cautionsFor(def);
  } catch (e) {
    return [{ hazard: "burner-change", title: "Cautions unavailable", text: message(e) }];
  }
}
