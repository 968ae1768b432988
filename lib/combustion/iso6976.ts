/**
 * Real-gas volumetric properties of natural-gas-like mixtures by the method of ISO 6976:2016:
 * compression factor from summation factors, Z = 1 − (Σ xᵢ sᵢ)², real molar density p/(Z R T),
 * real relative density and Wobbe index.
 *
 * Summation factors sᵢ at the metering temperatures 0, 15 and 20 °C (101.325 kPa). The 15 °C
 * values of methane, ethane, propane, n-/isobutane, hydrogen, CO, H2S, N2 and CO2 are ISO 6976:2016
 * Table 2 values (confirmed); the rest are values from memory
 * (ISO 6976:2016 Table 2, or derived from the same table's compression factors of the pure
 * component, √(1 − Z)). 15.56 °C (60 °F) is linearly interpolated between 15 and 20 °C.
 */
import { InputError } from "../errors";
import { R_ISO6976_J_per_molK, atmospherePa, celsiusToKelvin } from "../units/constants";

type Triple = readonly [number, number, number]; // at 0, 15, 20 °C

export const SUMMATION_FACTORS: Record<string, Triple> = {
  CH4: [0.04886, 0.04452, 0.04317],
  C2H6: [0.0997, 0.0919, 0.0895],
  C3H8: [0.1465, 0.1344, 0.1308],
  nC4H10: [0.2022, 0.184, 0.1785],
  iC4H10: [0.1885, 0.1722, 0.1673],
  nC5H12: [0.2586, 0.2361, 0.2295],
  nC6H14: [0.3172, 0.2899, 0.2816],
  H2: [0, 0, 0],
  CO: [0.0236, 0.0224, 0.0215],
  H2S: [0.1062, 0.1, 0.0983],
  N2: [0.0212, 0.017, 0.0161],
  CO2: [0.0819, 0.0752, 0.0729],
  O2: [0.0311, 0.0276, 0.0265],
  Ar: [0.0313, 0.0273, 0.0262],
  H2O: [0.3225, 0.2562, 0.2392],
  NH3: [0.128, 0.1171, 0.1139],
  SO2: [0.1658, 0.155, 0.1523],
  CH3OH: [0.5, 0.4472, 0.4359],
  C2H5OH: [0.6, 0.5477, 0.5292],
  NO: [0.0237, 0.0224, 0.0219],
};

/** Metering reference temperature of volumetric figures unless another is asked for, °C (at 101.325 kPa). */
export const DEFAULT_METERING_REFERENCE_C = 15;

/** Molar mass of ISO 6976:2016 standard dry air, g/mol (value from memory, medium-high confidence). */
export const AIR_MOLAR_MASS_g_per_mol = 28.96546;
/** Compression factor of dry air at 0, 15, 20 °C and 101.325 kPa (ISO 6976:2016; value from memory). */
const AIR_Z: Triple = [0.999419, 0.999595, 0.999645];

function atMetering(t: Triple, meteringC: number): number {
  if (meteringC === 0) return t[0];
  if (meteringC === 15) return t[1];
  if (meteringC === 20) return t[2];
  if (meteringC > 15 && meteringC < 20) return t[1] + ((t[2] - t[1]) * (meteringC - 15)) / 5;
  throw new InputError("meteringReferenceC", `${meteringC} °C is not tabulated (0, 15, 15.56, 20 °C)`);
}

/** Summation factor of one species at the metering temperature. Species not in the table count as ideal (0). */
export function summationFactor(speciesKey: string, meteringC: number): number {
  const t = SUMMATION_FACTORS[speciesKey];
  return t ? atMetering(t, meteringC) : 0;
}

/** Compression factor of a gas mixture (ISO 6976:2016 eq. for Z_mix). */
export function compressionFactor(composition: Record<string, number>, meteringC: number): number {
  let sum = 0;
  for (const [k, x] of Object.entries(composition)) sum += x * summationFactor(k, meteringC);
  return 1 - sum * sum;
}

export function airCompressionFactor(meteringC: number): number {
  return atMetering(AIR_Z, meteringC);
}

/** Ideal-gas molar volume at the metering temperature and 101.325 kPa, m³/mol. */
export function idealMolarVolume_m3_per_mol(meteringC: number): number {
  return (R_ISO6976_J_per_molK * celsiusToKelvin(meteringC)) / atmospherePa;
}

/** Real-gas molar density of a mixture at metering conditions, mol/m³. */
export function realMolarDensity_mol_per_m3(composition: Record<string, number>, meteringC: number): number {
  return 1 / (compressionFactor(composition, meteringC) * idealMolarVolume_m3_per_mol(meteringC));
}

/** Real-gas density, kg/m³. */
export function realDensity_kg_per_m3(composition: Record<string, number>, molarMass_g_per_mol: number, meteringC: number): number {
  return (realMolarDensity_mol_per_m3(composition, meteringC) * molarMass_g_per_mol) / 1000;
}

/** Density of dry air at metering conditions (real), kg/m³. */
export function airDensity_kg_per_m3(meteringC: number): number {
  return AIR_MOLAR_MASS_g_per_mol / 1000 / (airCompressionFactor(meteringC) * idealMolarVolume_m3_per_mol(meteringC));
}

/** Real relative density d = (M/M_air)·(Z_air/Z) (ISO 6976:2016). */
export function relativeDensity(composition: Record<string, number>, molarMass_g_per_mol: number, meteringC: number): number {
  return (molarMass_g_per_mol / AIR_MOLAR_MASS_g_per_mol) * (airCompressionFactor(meteringC) / compressionFactor(composition, meteringC));
}

/** Wobbe index W = H_v / √d (same unit as H_v). */
export function wobbeIndex(volumetricHeatingValue: number, relDensity: number): number {
  return volumetricHeatingValue / Math.sqrt(relDensity);
}

export interface VolumetricFigures {
  combustionReferenceC: number;
  meteringReferenceC: number;
  /** Real-gas gross and net heating value per m³ at the metering reference. */
  hhv_MJ_per_m3: number;
  lhv_MJ_per_m3: number;
  compressionFactor: number;
  density_kg_per_m3: number;
  relativeDensity: number;
  wobbe: { gross_MJ_per_m3: number; net_MJ_per_m3: number };
}

/**
 * Volumetric heating values, relative density and Wobbe index of a gas (ISO 6976:2016):
 * molar heating value × real molar density, d = (M/M_air)(Z_air/Z), W = H_v/√d.
 */
export function volumetricFigures(
  composition: Record<string, number>,
  molarMass_g_per_mol: number,
  molarHeatingValues: { hhv_kJ_per_mol: number; lhv_kJ_per_mol: number; combustionReferenceC: number },
  meteringC: number,
): VolumetricFigures {
  const Z = compressionFactor(composition, meteringC);
  const molPerM3 = 1 / (Z * idealMolarVolume_m3_per_mol(meteringC));
  const d = (molarMass_g_per_mol / AIR_MOLAR_MASS_g_per_mol) * (airCompressionFactor(meteringC) / Z);
  const hhv = (molarHeatingValues.hhv_kJ_per_mol * molPerM3) / 1000;
  const lhv = (molarHeatingValues.lhv_kJ_per_mol * molPerM3) / 1000;
  return {
    combustionReferenceC: molarHeatingValues.combustionReferenceC,
    meteringReferenceC: meteringC,
    hhv_MJ_per_m3: hhv,
    lhv_MJ_per_m3: lhv,
    compressionFactor: Z,
    density_kg_per_m3: (molPerM3 * molarMass_g_per_mol) / 1000,
    relativeDensity: d,
    wobbe: { gross_MJ_per_m3: wobbeIndex(hhv, d), net_MJ_per_m3: wobbeIndex(lhv, d) },
  };
}
