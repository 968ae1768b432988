/**
 * Emission-concentration conversions. One place for each.
 *
 * - Normal conditions: 0 °C (273.15 K) and 101.325 kPa, dry gas — the reference conditions of the
 *   emission limit values for combustion plants in Directive 2010/75/EU (Industrial Emissions
 *   Directive), Annex V, Part 1.
 * - ppm by volume to mg/m³ at normal conditions: c[mg/m³] = ppm × M[g/mol] / V_m[L/mol], with the
 *   ideal-gas molar volume V_m = R T0 / p0 = 22.414 L/mol (from the constants below, not rounded).
 * - Reference-O2 correction (Directive 2010/75/EU, Annex VI Part 2):
 *   E_ref = E_meas × (21 − O2_ref) / (21 − O2_meas), O2 in % by volume, dry.
 */
import { atmospherePa, R_J_per_molK, T0CK } from "./constants";

/** Ideal-gas molar volume at 0 °C, 101.325 kPa, L/mol (= 22.414 L/mol). */
export const molarVolumeNormal_L_per_mol = ((R_J_per_molK * T0CK) / atmospherePa) * 1000;

/** O2 content of air, % by volume, as written in the reference-O2 formula of Directive 2010/75/EU, Annex VI Part 2. */
export const airO2ForReferencePercent = 21;

/** mg/m³ (0 °C, 101.325 kPa) of a gas at `ppm` parts per million by volume with molar mass M, g/mol. */
export function ppmToMg_per_m3Normal(ppm: number, molarMass_g_per_mol: number): number {
  return (ppm * molarMass_g_per_mol) / molarVolumeNormal_L_per_mol;
}

/**
 * A dry concentration measured at O2_meas (% dry) expressed at the reference O2 (% dry). Returns NaN
 * (unknown) when O2_meas is at or above the 21 % of the formula (the correction is undefined there).
 */
export function atReferenceO2(value: number, measuredO2DryPercent: number, referenceO2DryPercent: number): number {
  if (!(measuredO2DryPercent < airO2ForReferencePercent)) return Number.NaN;
  return (value * (airO2ForReferencePercent - referenceO2DryPercent)) / (airO2ForReferencePercent - measuredO2DryPercent);
}
