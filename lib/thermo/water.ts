/**
 * Saturation line of water, IAPWS-IF97 (Revised Release on the IAPWS Industrial Formulation 1997,
 * IAPWS R7-97(2012)), region 4: eq. 30 (saturation pressure) and eq. 31 (saturation temperature).
 * Valid 273.15 K … 647.096 K (611.213 Pa … 22.064 MPa).
 */
import { InputError } from "../errors";
import { T0CK } from "../units/constants";

const n = [
  0.11670521452767e4, -0.72421316598162e6, -0.17073846940092e2, 0.1202082470247e5, -0.32325550322333e7, 0.1491510861353e2,
  -0.48232657361591e4, 0.40511340542057e6, -0.23855557567849, 0.65017534844798e3,
];

export const WATER_TRIPLE_POINT_K = 273.16;
export const WATER_CRITICAL_K = 647.096;
/** Lower end of IAPWS-IF97 region 4: saturation pressure at 273.15 K, Pa (IF97 eq. 30). */
export const WATER_SATURATION_MIN_PA = 611.213;
/** Critical pressure of water, Pa (IAPWS-IF97). */
export const WATER_CRITICAL_PA = 22.064e6;

/** Saturation pressure of water at T, Pa (IAPWS-IF97 eq. 30). */
export function saturationPressurePa(temperatureK: number): number {
  if (!(temperatureK >= T0CK && temperatureK <= WATER_CRITICAL_K)) {
    throw new InputError("temperatureK", `${temperatureK} K is outside the saturation line of water (${T0CK}–${WATER_CRITICAL_K} K)`);
  }
  const T = temperatureK;
  const th = T + n[8] / (T - n[9]);
  const A = th * th + n[0] * th + n[1];
  const B = n[2] * th * th + n[3] * th + n[4];
  const C = n[5] * th * th + n[6] * th + n[7];
  const p_MPa = ((2 * C) / (-B + Math.sqrt(B * B - 4 * A * C))) ** 4;
  return p_MPa * 1e6;
}

/**
 * Saturation temperature of water at p, K (IAPWS-IF97 eq. 31). Below the triple-point pressure
 * (611.2 Pa) water vapour would deposit as ice; the function then returns NaN-free result
 * by throwing, so callers must handle "no dew point above 0 °C".
 */
export function saturationTemperatureK(pressurePa: number): number {
  if (!(pressurePa >= WATER_SATURATION_MIN_PA && pressurePa <= WATER_CRITICAL_PA)) {
    throw new InputError(
      "pressurePa",
      `${pressurePa} Pa is outside the saturation line of water (${WATER_SATURATION_MIN_PA} Pa – ${WATER_CRITICAL_PA / 1e6} MPa)`,
    );
  }
  const beta = (pressurePa / 1e6) ** 0.25;
  const E = beta * beta + n[2] * beta + n[5];
  const F = n[0] * beta * beta + n[3] * beta + n[6];
  const G = n[1] * beta * beta + n[4] * beta + n[7];
  const D = (2 * G) / (-F - Math.sqrt(F * F - 4 * E * G));
  return (n[9] + D - Math.sqrt((n[9] + D) * (n[9] + D) - 4 * (n[8] + n[9] * D))) / 2;
}
