/**
 * Price normalisation: turns a quote in any unit (per MWh, GJ, kWh, MMBtu or therm on a gross
 * or net basis; per t or kg; per L, US gal or m³) plus its transport and handling adders into
 * delivered cost per MWh (gross and net), per GJ (gross and net) and per kg, using the fuel's
 * own heating values and density.
 *
 * Every quote goes through cost per kg: per-energy quotes divide by the heating value on the
 * quote's basis, per-volume quotes multiply by the density (liquids at 15 °C, solids bulk,
 * gases at the quote's metering reference, real gas). The currency is the quote's; no
 * exchange rates are applied.
 */
import {
  ENERGY_UNITS_MJ,
  MASS_UNITS_KG,
  MJ_per_GJ,
  MJ_per_MWh,
  kg_per_t,
  VOLUME_UNITS_M3,
  UNIT_LABELS,
  type EnergyUnit,
  type MassUnit,
  type VolumeUnit,
} from "../units/energy";
import type { FuelEnergyContent } from "../combustion/energy-content";
import { meteringLabel } from "../units/metering";

import { PRICE_UNITS, type EnergyBasis, type PriceUnit } from "../schemas/price-units";

export { ENERGY_BASES, PRICE_UNITS, type EnergyBasis, type PriceUnit } from "../schemas/price-units";
export type { FuelEnergyContent } from "../combustion/energy-content";

export function isEnergyUnit(unit: PriceUnit): unit is EnergyUnit {
  return unit in ENERGY_UNITS_MJ;
}
export function isMassUnit(unit: PriceUnit): unit is MassUnit {
  return unit in MASS_UNITS_KG;
}
export function isVolumeUnit(unit: PriceUnit): unit is VolumeUnit {
  return unit in VOLUME_UNITS_M3;
}

/** What a quote says: amount and adders are in the same currency and per the same unit. */
export interface PriceQuoteTerms {
  amount: number;
  unit: PriceUnit;
  /** Required for energy units, absent for mass and volume units. */
  energyBasis?: EnergyBasis | null;
  /** Gas volume quotes: metering temperature, °C at 101.325 kPa. */
  meteringReferenceC?: number | null;
  transportAdder?: number | null;
  handlingAdder?: number | null;
}

export interface CostPerBasis {
  perMWh_gross: number;
  perMWh_net: number;
  perGJ_gross: number;
  perGJ_net: number;
  perKg: number;
}

export interface NormalisedPrice extends CostPerBasis {
  /** kg of fuel in one quoted unit. */
  kgPerUnit: number;
  /** amount + transport + handling, per quoted unit. */
  deliveredPerUnit: number;
  /** The same figures for each part of the delivered price. */
  parts: { commodity: CostPerBasis; transport: CostPerBasis; handling: CostPerBasis };
}

export interface PriceIssue {
  field: keyof PriceQuoteTerms | "density";
  message: string;
}

/**
 * Checks that a quote's unit, basis and reference fit each other and the fuel, before anything
 * is stored. Returns one issue per offending field (empty when the quote is usable).
 */
export function priceQuoteIssues(
  terms: Pick<PriceQuoteTerms, "unit" | "energyBasis" | "meteringReferenceC">,
  fuel: { kind: FuelEnergyContent["kind"]; hasDensity: boolean },
): PriceIssue[] {
  const issues: PriceIssue[] = [];
  const { unit } = terms;
  if (!(PRICE_UNITS as readonly string[]).includes(unit)) {
    return [{ field: "unit", message: `unknown unit "${unit}" (use one of ${PRICE_UNITS.join(", ")})` }];
  }
  if (isEnergyUnit(unit)) {
    if (!terms.energyBasis) {
      issues.push({ field: "energyBasis", message: `a price per ${unit} needs a basis: gross (HHV) or net (LHV)` });
    }
  } else if (terms.energyBasis) {
    issues.push({ field: "energyBasis", message: `a price per ${unit} is not on an energy basis; leave the basis empty` });
  }
  if (isVolumeUnit(unit)) {
    if (fuel.kind === "gas") {
      if (unit !== "m3") issues.push({ field: "unit", message: `a gas is not priced per ${unit}; use m³ at a metering reference` });
      else if (terms.meteringReferenceC === null || terms.meteringReferenceC === undefined) {
        issues.push({ field: "meteringReferenceC", message: "a price per m³ of gas needs its metering reference temperature" });
      }
    } else {
      if (fuel.kind === "solid" && unit !== "m3") {
        issues.push({ field: "unit", message: `a solid fuel is not priced per ${unit}; use t, kg, m³ (bulk) or an energy unit` });
      } else if (!fuel.hasDensity) {
        issues.push({
          field: "density",
          message: `a price per volume needs the fuel's ${fuel.kind === "solid" ? "bulk " : ""}density; enter it on the fuel first`,
        });
      }
    }
  }
  if (!(isVolumeUnit(unit) && fuel.kind === "gas") && terms.meteringReferenceC !== null && terms.meteringReferenceC !== undefined) {
    issues.push({ field: "meteringReferenceC", message: "a metering reference applies only to prices per m³ of gas; leave it empty" });
  }
  return issues;
}

export class PriceNormalisationError extends Error {
  constructor(public readonly issues: PriceIssue[]) {
    super(issues.map((i) => `${i.field}: ${i.message}`).join("; "));
    this.name = "PriceNormalisationError";
  }
}

/** kg of fuel in one quoted unit. */
export function kgPerPriceUnit(terms: PriceQuoteTerms, fuel: FuelEnergyContent): number {
  const density =
    fuel.kind === "gas"
      ? undefined
      : fuel.density_kg_per_m3 !== null && fuel.density_kg_per_m3 !== undefined && fuel.density_kg_per_m3 > 0
        ? fuel.density_kg_per_m3
        : undefined;
  const issues = priceQuoteIssues(terms, { kind: fuel.kind, hasDensity: density !== undefined });
  if (issues.length) throw new PriceNormalisationError(issues);
  if (!(fuel.hhv_MJ_per_kg > 0) || !(fuel.lhv_MJ_per_kg > 0)) {
    throw new PriceNormalisationError([{ field: "unit", message: "the fuel has no positive heating value to price against" }]);
  }
  const { unit } = terms;
  if (isEnergyUnit(unit)) {
    const hv = terms.energyBasis === "gross" ? fuel.hhv_MJ_per_kg : fuel.lhv_MJ_per_kg;
    return ENERGY_UNITS_MJ[unit] / hv;
  }
  if (isMassUnit(unit)) return MASS_UNITS_KG[unit];
  const m3 = VOLUME_UNITS_M3[unit];
  if (fuel.kind === "gas") {
    if (!fuel.gasDensity_kg_per_m3) {
      throw new PriceNormalisationError([{ field: "meteringReferenceC", message: "no gas density available for this fuel" }]);
    }
    return m3 * fuel.gasDensity_kg_per_m3(terms.meteringReferenceC as number);
  }
  return m3 * (density as number);
}

function costPerBasis(perKg: number, fuel: FuelEnergyContent): CostPerBasis {
  return {
    perKg,
    perMWh_gross: (perKg * MJ_per_MWh) / fuel.hhv_MJ_per_kg,
    perMWh_net: (perKg * MJ_per_MWh) / fuel.lhv_MJ_per_kg,
    perGJ_gross: (perKg * MJ_per_GJ) / fuel.hhv_MJ_per_kg,
    perGJ_net: (perKg * MJ_per_GJ) / fuel.lhv_MJ_per_kg,
  };
}

/** Delivered cost of a quote per MWh and GJ (gross and net) and per kg, with its parts. */
export function normalisePrice(terms: PriceQuoteTerms, fuel: FuelEnergyContent): NormalisedPrice {
  const kgPerUnit = kgPerPriceUnit(terms, fuel);
  const transport = terms.transportAdder ?? 0;
  const handling = terms.handlingAdder ?? 0;
  const delivered = terms.amount + transport + handling;
  const d = costPerBasis(delivered / kgPerUnit, fuel);
  // Fields written out (not spread): an object spread here was the sweep's most expensive line.
  return {
    perKg: d.perKg,
    perMWh_gross: d.perMWh_gross,
    perMWh_net: d.perMWh_net,
    perGJ_gross: d.perGJ_gross,
    perGJ_net: d.perGJ_net,
    kgPerUnit,
    deliveredPerUnit: delivered,
    parts: {
      commodity: costPerBasis(terms.amount / kgPerUnit, fuel),
      transport: costPerBasis(transport / kgPerUnit, fuel),
      handling: costPerBasis(handling / kgPerUnit, fuel),
    },
  };
}

/**
 * Delivered price of a blend from its components' normalised prices: per kg, the mass-weighted
 * mix of each part (commodity, transport, handling), restated for the blend's own energy content.
 */
export function mixPrices(parts: readonly { massFraction: number; price: NormalisedPrice }[], blend: FuelEnergyContent): NormalisedPrice {
  let commodity = 0,
    transport = 0,
    handling = 0;
  for (const { massFraction: w, price } of parts) {
    commodity += w * price.parts.commodity.perKg;
    transport += w * price.parts.transport.perKg;
    handling += w * price.parts.handling.perKg;
  }
  return normalisePrice({ amount: commodity, unit: "kg", transportAdder: transport, handlingAdder: handling }, blend);
}

/** Label for a quote's unit, e.g. "MWh (gross)", "m³ (15 °C)", "US gal". */
export function priceUnitLabel(terms: Pick<PriceQuoteTerms, "unit" | "energyBasis" | "meteringReferenceC">): string {
  let s: string = UNIT_LABELS[terms.unit] ?? terms.unit;
  if (terms.energyBasis) s += ` ${terms.energyBasis === "gross" ? "gross (HHV)" : "net (LHV)"}`;
  if (terms.meteringReferenceC !== null && terms.meteringReferenceC !== undefined) {
    s += ` at ${meteringLabel(terms.meteringReferenceC)}`;
  }
  return s;
}

/** Carbon cost per MWh of fuel: kg CO2 per GJ (on the MWh's basis) × carbon price per t. */
export function carbonCostPerMWh(co2_kg_per_GJ: number, carbonPrice_per_t: number): number {
  return (co2_kg_per_GJ * (MJ_per_MWh / MJ_per_GJ) * carbonPrice_per_t) / kg_per_t;
}
