/** Study prices through the one normalisation module (lib/economics/prices); errors name the field. */
import { METERING_REFERENCE_C } from "../schemas/plant";
import type { StudyPrice } from "../schemas/study";
import type { BlendFuelDefinition } from "../schemas/fuel";
import { normalisePrice, PriceNormalisationError, type NormalisedPrice, type PriceQuoteTerms } from "../economics/prices";
import type { FuelContext } from "../plant/fuel-context";
import { StudyInputError } from "./errors";

export function priceTerms(p: StudyPrice): PriceQuoteTerms {
  return {
    amount: p.amount,
    unit: p.unit,
    energyBasis: p.energyBasis ?? null,
    meteringReferenceC: p.meteringReference ? METERING_REFERENCE_C[p.meteringReference] : null,
    transportAdder: p.transportAdder,
    handlingAdder: p.handlingAdder,
  };
}

/** Normalises a study price for a fuel; a mismatch (e.g. a per-litre price for a gas) names the price's field. */
export function normaliseStudyPrice(p: StudyPrice, ctx: FuelContext, field: string): NormalisedPrice {
  try {
    return normalisePrice(priceTerms(p), ctx.energyContent);
  } catch (e) {
    if (e instanceof PriceNormalisationError) {
      const i = e.issues[0];
      const f = i.field === "meteringReferenceC" ? "meteringReference" : i.field === "density" ? "unit" : i.field;
      throw new StudyInputError(`${field}.${f}`, i.message);
    }
    throw e;
  }
}

/**
 * Mass fractions of a blend's components, by the blend rule of lib/fuels/resolve.ts: a volume
 * share weighs by molar mass (gases) or density (liquids), an energy share by 1/LHV at 25 °C,
 * a mass share by 1.
 */
export function blendMassFractions(def: BlendFuelDefinition, parts: readonly FuelContext[], field: string): number[] {
  const perShare = parts.map((c, i) => {
    if (def.basis === "mass") return 1;
    if (def.basis === "energy") return 1 / c.hv.lhv_MJ_per_kg;
    if (c.fuel.kind === "gas" && c.fuel.molarMass_g_per_mol) return c.fuel.molarMass_g_per_mol;
    if (c.fuel.kind === "liquid" && c.fuel.density_kg_per_m3) return c.fuel.density_kg_per_m3;
    throw new StudyInputError(`${field}.blend.${i}.fuel`, "a volume share needs a gas or a liquid with its density");
  });
  const m = def.blend.map((c, i) => c.share * perShare[i]);
  const total = m.reduce((a, b) => a + b, 0);
  return m.map((v) => v / total);
}

/**
 * Delivered price of a blend from one quote per component: the mass-weighted mix of the
 * components' delivered prices per kg (commodity, transport and handling kept apart), stated
 * for the blend through the same normalisation.
 */
export function blendPriceFromComponents(
  def: BlendFuelDefinition,
  blend: FuelContext,
  parts: readonly FuelContext[],
  prices: readonly StudyPrice[],
  field: string,
): NormalisedPrice {
  const w = blendMassFractions(def, parts, `${field}.fuel`);
  let commodity = 0, transport = 0, handling = 0;
  parts.forEach((c, i) => {
    const n = normaliseStudyPrice(prices[i], c, `${field}.componentPrices.${i}`);
    commodity += w[i] * n.parts.commodity.perKg;
    transport += w[i] * n.parts.transport.perKg;
    handling += w[i] * n.parts.handling.perKg;
  });
  return normalisePrice({ amount: commodity, unit: "kg", transportAdder: transport, handlingAdder: handling }, blend.energyContent);
}
