/**
 * Physical constants and reference states. One place for each.
 * Sources are given beside each value.
 */

/** Molar gas constant, J/(mol·K). CODATA 2018 exact value (8.314462618). */
export const R_J_per_molK = 8.314462618;

/** Boltzmann constant, J/K. SI 2019 exact value (CODATA 2018). */
export const kB_J_per_K = 1.380649e-23;

/** Avogadro constant, 1/mol. SI 2019 exact value (CODATA 2018). */
export const NA_per_mol = 6.02214076e23;

/** Molar gas constant used by ISO 6976:2016 for its volumetric figures, J/(mol·K) (ISO 6976:2016, cl. 3/Table). */
export const R_ISO6976_J_per_molK = 8.3144621;

/** Standard-state pressure of the NASA Glenn polynomials and of NIST-JANAF 4th ed.: 1 bar. */
export const standardPressurePa = 100000;

/** Standard atmosphere, Pa. Metering reference pressure for all volumetric figures. */
export const atmospherePa = 101325;

/** Thermochemical reference temperature, K. */
export const T298K = 298.15;

/** 0 °C in K. */
export const T0CK = 273.15;

export function celsiusToKelvin(temperatureC: number): number {
  return temperatureC + T0CK;
}
export function kelvinToCelsius(temperatureK: number): number {
  return temperatureK - T0CK;
}
export function fahrenheitToKelvin(temperatureF: number): number {
  return (temperatureF - 32) / 1.8 + T0CK;
}
export function kelvinToFahrenheit(temperatureK: number): number {
  return (temperatureK - T0CK) * 1.8 + 32;
}
