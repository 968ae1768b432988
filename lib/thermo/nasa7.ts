/**
 * NASA 7-coefficient polynomials (McBride, Zehe & Gordon, NASA/TP-2002-211556, eq. 1-3):
 *   cp/R  = a1 + a2 T + a3 T^2 + a4 T^3 + a5 T^4
 *   h/RT  = a1 + a2 T/2 + a3 T^2/3 + a4 T^3/4 + a5 T^4/5 + a6/T
 *   s/R   = a1 ln T + a2 T + a3 T^2/2 + a4 T^3/3 + a5 T^4/4 + a7
 * h includes the enthalpy of formation at 298.15 K (the NASA convention), s is the absolute
 * entropy at the polynomials' standard-state pressure (1 bar for NASA Glenn data).
 */
import { R_J_per_molK, T298K } from "../units/constants";

export type Element = "C" | "H" | "O" | "N" | "S" | "Ar";
export const ELEMENTS: readonly Element[] = ["C", "H", "O", "N", "S", "Ar"];

export interface Nasa7Species {
  /** Stoke's key for the species, e.g. "CH4", "nC4H10", "iC4H10", "C2H5OH", "H2O(L)". */
  key: string;
  /** Display name, e.g. "methane". */
  name: string;
  /** Atoms per molecule. */
  elements: Partial<Record<Element, number>>;
  phase: "gas" | "liquid";
  /** [Tlow, Tmid, Thigh] in K: lowCoeffs apply on [Tlow, Tmid], highCoeffs on [Tmid, Thigh]. */
  rangesK: readonly [number, number, number];
  lowCoeffs: readonly number[];
  highCoeffs: readonly number[];
  /** Standard-state pressure of the data, Pa. */
  standardPressurePa: number;
  /** Where the coefficients come from (document and record). */
  source: string;
}

/** Picks the coefficient set for T. Outside the fitted range the nearest set is extrapolated. */
export function coeffsAt(sp: Nasa7Species, temperatureK: number): readonly number[] {
  return temperatureK < sp.rangesK[1] ? sp.lowCoeffs : sp.highCoeffs;
}

export function cp_over_R(sp: Nasa7Species, temperatureK: number): number {
  const a = coeffsAt(sp, temperatureK);
  const T = temperatureK;
  return a[0] + T * (a[1] + T * (a[2] + T * (a[3] + T * a[4])));
}

export function h_over_RT(sp: Nasa7Species, temperatureK: number): number {
  const a = coeffsAt(sp, temperatureK);
  const T = temperatureK;
  return a[0] + T * (a[1] / 2 + T * (a[2] / 3 + T * (a[3] / 4 + T * (a[4] / 5)))) + a[5] / T;
}

export function s_over_R(sp: Nasa7Species, temperatureK: number): number {
  const a = coeffsAt(sp, temperatureK);
  const T = temperatureK;
  return a[0] * Math.log(T) + T * (a[1] + T * (a[2] / 2 + T * (a[3] / 3 + T * (a[4] / 4)))) + a[6];
}

/** Heat capacity at constant pressure, J/(mol·K). */
export function cp_J_per_molK(sp: Nasa7Species, temperatureK: number): number {
  return R_J_per_molK * cp_over_R(sp, temperatureK);
}
/** Enthalpy including formation enthalpy at 298.15 K, J/mol. */
export function h_J_per_mol(sp: Nasa7Species, temperatureK: number): number {
  return R_J_per_molK * temperatureK * h_over_RT(sp, temperatureK);
}
/** Absolute entropy at the data's standard-state pressure, J/(mol·K). */
export function s_J_per_molK(sp: Nasa7Species, temperatureK: number): number {
  return R_J_per_molK * s_over_R(sp, temperatureK);
}
/** Standard Gibbs energy g° = h − T s°, J/mol. */
export function g_J_per_mol(sp: Nasa7Species, temperatureK: number): number {
  return h_J_per_mol(sp, temperatureK) - temperatureK * s_J_per_molK(sp, temperatureK);
}
/** Sensible enthalpy h(T) − h(298.15 K), J/mol. */
export function sensibleH_J_per_mol(sp: Nasa7Species, temperatureK: number): number {
  return h_J_per_mol(sp, temperatureK) - h_J_per_mol(sp, T298K);
}

/**
 * Fills cp/R, h/RT and s/R of many species at one temperature into caller-owned arrays.
 * For inner loops (equilibrium solver): no allocation, one log per call.
 */
export function evalInto(
  species: readonly Nasa7Species[],
  temperatureK: number,
  cpR: Float64Array,
  hRT: Float64Array,
  sR: Float64Array,
): void {
  const T = temperatureK;
  const lnT = Math.log(T);
  const T2 = T * T,
    T3 = T2 * T,
    T4 = T3 * T;
  for (let i = 0; i < species.length; i++) {
    const sp = species[i];
    const a = T < sp.rangesK[1] ? sp.lowCoeffs : sp.highCoeffs;
    cpR[i] = a[0] + a[1] * T + a[2] * T2 + a[3] * T3 + a[4] * T4;
    hRT[i] = a[0] + (a[1] * T) / 2 + (a[2] * T2) / 3 + (a[3] * T3) / 4 + (a[4] * T4) / 5 + a[5] / T;
    sR[i] = a[0] * lnT + a[1] * T + (a[2] * T2) / 2 + (a[3] * T3) / 3 + (a[4] * T4) / 4 + a[6];
  }
}

/** Values per species in a packed NASA-7 array: [Tlow, Tmid, Thigh, low a1..a7, high a1..a7]. */
export const NASA7_PACKED_STRIDE = 17;

/**
 * Fills cp/R, h/RT and s/R of n species at one temperature from a packed coefficient array (layout
 * NASA7_PACKED_STRIDE), the same polynomials as above. For inner loops (kinetics, flame): no
 * allocation, one log per call. Outside a species' fitted range its nearest set is extrapolated.
 */
export function evalPackedInto(
  packed: Float64Array,
  n: number,
  temperatureK: number,
  cpR: Float64Array,
  hRT: Float64Array,
  sR: Float64Array,
): void {
  const T = temperatureK;
  const lnT = Math.log(T);
  const T2 = T * T,
    T3 = T2 * T,
    T4 = T3 * T;
  const invT = 1 / T;
  for (let i = 0; i < n; i++) {
    const base = i * NASA7_PACKED_STRIDE;
    const o = T < packed[base + 1] ? base + 3 : base + 10;
    const a0 = packed[o],
      a1 = packed[o + 1],
      a2 = packed[o + 2],
      a3 = packed[o + 3],
      a4 = packed[o + 4];
    cpR[i] = a0 + a1 * T + a2 * T2 + a3 * T3 + a4 * T4;
    hRT[i] = a0 + (a1 * T) / 2 + (a2 * T2) / 3 + (a3 * T3) / 4 + (a4 * T4) / 5 + packed[o + 5] * invT;
    sR[i] = a0 * lnT + a1 * T + (a2 * T2) / 2 + (a3 * T3) / 3 + (a4 * T4) / 4 + packed[o + 6];
  }
}
