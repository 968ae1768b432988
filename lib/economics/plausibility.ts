/**
 * Plausible price ranges, one per price unit, for catching a typing slip before a quote is stored
 * (1e9 EUR/MWh, a price per kWh entered per MWh). The ranges are in euro-like currency units
 * (EUR, USD, GBP, CHF …) and deliberately wide: from the cheapest waste or coal to the dearest
 * bottled hydrogen or laboratory-grade fuel, with a margin (common practice, no source). A quote
 * in another currency is first converted to EUR with the exchange-rate table; when no rate is in
 * force the check says it could not be made. Outside the range is a warning, not an error: the
 * user may confirm the figure.
 */
import type { PriceUnit } from "../schemas/price-units";

export const PLAUSIBILITY_CURRENCY = "EUR";

/** Delivered price (amount + adders) per unit, EUR: [lowest, highest] plausible (common practice, no source). */
export const PLAUSIBLE_PRICE_RANGES: Readonly<Record<PriceUnit, readonly [number, number]>> = Object.freeze({
  MWh: [0.5, 2000],
  kWh: [0.0005, 2],
  GJ: [0.14, 560],
  MMBtu: [0.15, 590],
  therm: [0.015, 59],
  t: [1, 40000],
  kg: [0.001, 40],
  L: [0.01, 30],
  USgal: [0.04, 115],
  m3: [0.01, 30000],
});

export interface PlausibilityWarning {
  field: string;
  message: string;
  /** True when the figure lies outside the range (storing it needs a confirmation). */
  blocking: boolean;
}

/**
 * The warning for a delivered price per `unit` (already in EUR, or `eurFactor` converts it), or
 * null when it lies in the range. `eurFactor` null = no rate to EUR: the check says so.
 */
export function priceWarning(
  deliveredAmount: number,
  unit: PriceUnit,
  currency: string,
  eurFactor: number | null,
): PlausibilityWarning | null {
  const [lo, hi] = PLAUSIBLE_PRICE_RANGES[unit];
  const range = `${lo}–${hi} ${PLAUSIBILITY_CURRENCY}/${unit}`;
  if (eurFactor === null) {
    return {
      field: "amount",
      message: `cannot check ${deliveredAmount} ${currency}/${unit} against the plausible range ${range}: no exchange rate from ${currency} to ${PLAUSIBILITY_CURRENCY} is in force on the quote's date`,
      blocking: false,
    };
  }
  const eur = deliveredAmount * eurFactor;
  if (eur >= lo && eur <= hi) return null;
  const shown =
    currency === PLAUSIBILITY_CURRENCY
      ? `${deliveredAmount} ${currency}/${unit}`
      : `${deliveredAmount} ${currency}/${unit} (${Number(eur.toPrecision(4))} ${PLAUSIBILITY_CURRENCY}/${unit})`;
  return {
    field: "amount",
    message: `${shown} is ${eur < lo ? "below" : "above"} the plausible range ${range} (delivered price: amount plus adders); check the figure and the unit, or confirm it`,
    blocking: true,
  };
}
