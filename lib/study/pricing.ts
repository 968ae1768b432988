/** Study prices through the one normalisation module (lib/economics/prices); errors name the field. */
import { METERING_REFERENCE_C } from "../schemas/plant";
import type { StudyPrice } from "../schemas/study";
import { mixPrices, normalisePrice, PriceNormalisationError, type NormalisedPrice, type PriceQuoteTerms } from "../economics/prices";
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
 * Delivered price of a blend from one quote per component: the mass-weighted mix of the
 * components' delivered prices per kg (commodity, transport and handling kept apart), stated
 * for the blend through the same normalisation.
 */
export function blendPriceFromComponents(
  blend: FuelContext,
  parts: readonly FuelContext[],
  prices: readonly StudyPrice[],
  field: string,
): NormalisedPrice {
  const w = blend.fuel.componentMassFractions;
  if (!w || w.length !== parts.length)
    throw new StudyInputError(`${field}.componentPrices`, "component prices need a blend with one price per component");
  return mixPrices(
    parts.map((c, i) => ({ massFraction: w[i], price: normaliseStudyPrice(prices[i], c, `${field}.componentPrices.${i}`) })),
    blend.energyContent,
  );
}
