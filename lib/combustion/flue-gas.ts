/**
 * Flue gas of complete combustion at an air factor λ ≥ 1: composition wet and dry, amounts and
 * volumes per kg and per MJ of fuel, CO2max and the water dew point.
 */
import type { ResolvedFuel } from "../fuels/resolve";
import { InfeasibleChargeError } from "../errors";
import { MOLAR_MASS_g_per_mol } from "../thermo/species-data";
import { saturationTemperatureK, WATER_SATURATION_MIN_PA } from "../thermo/water";
import { atmospherePa, kelvinToCelsius, R_J_per_molK, T0CK } from "../units/constants";
import { DRY_AIR, stoichiometricO2_mol_per_kg, type Oxidizer } from "./stoichiometry";

export type FlueSpecies = "CO2" | "H2O" | "SO2" | "N2" | "O2" | "Ar";
export const FLUE_SPECIES: readonly FlueSpecies[] = ["CO2", "H2O", "SO2", "N2", "O2", "Ar"];

export interface FlueGas {
  lambda: number;
  /** Moles of each species per kg fuel. */
  mol_per_kg: Record<FlueSpecies, number>;
  wet_mol_per_kg: number;
  dry_mol_per_kg: number;
  wetMoleFractions: Record<FlueSpecies, number>;
  dryMoleFractions: Record<Exclude<FlueSpecies, "H2O">, number>;
  /** Mass of flue gas per kg fuel (fuel + oxidiser − ash). */
  mass_kg_per_kg: number;
  /** Volume at 0 °C, 101.325 kPa (ideal gas), per kg fuel. */
  wet_m3_per_kg: number;
  dry_m3_per_kg: number;
}

/** Molar volume of an ideal gas at 0 °C and 101.325 kPa, m³/mol (flue-gas volumes are stated at these conditions). */
export const NORMAL_MOLAR_VOLUME_m3_per_mol = (R_J_per_molK * T0CK) / atmospherePa;

export function flueGasPerKgFuel(fuel: ResolvedFuel, opts: { lambda: number; oxidizer?: Oxidizer }): FlueGas {
  const { lambda } = opts;
  const ox = opts.oxidizer ?? DRY_AIR;
  if (!(lambda >= 1)) {
    throw new InfeasibleChargeError(
      "lambda",
      `complete-combustion flue gas needs λ ≥ 1 (got ${lambda}): too little oxygen`,
      "too-little-oxygen",
    );
  }
  const el = fuel.elements_mol_per_kg;
  const nO2 = stoichiometricO2_mol_per_kg(el);
  const nOx = (lambda * nO2) / (ox.O2 ?? 0);
  const m: Record<FlueSpecies, number> = {
    CO2: el.C + nOx * (ox.CO2 ?? 0),
    H2O: el.H / 2 + nOx * (ox.H2O ?? 0),
    SO2: el.S,
    N2: el.N / 2 + nOx * (ox.N2 ?? 0),
    O2: (lambda - 1) * nO2,
    Ar: el.Ar + nOx * (ox.Ar ?? 0),
  };
  const wet = FLUE_SPECIES.reduce((s, k) => s + m[k], 0);
  const dry = wet - m.H2O;
  const wetX = {} as Record<FlueSpecies, number>;
  for (const k of FLUE_SPECIES) wetX[k] = m[k] / wet;
  const dryX = {} as Record<Exclude<FlueSpecies, "H2O">, number>;
  for (const k of FLUE_SPECIES) if (k !== "H2O") dryX[k] = m[k] / dry;
  const mass = FLUE_SPECIES.reduce((s, k) => s + (m[k] * MOLAR_MASS_g_per_mol[k]) / 1000, 0);
  return {
    lambda,
    mol_per_kg: m,
    wet_mol_per_kg: wet,
    dry_mol_per_kg: dry,
    wetMoleFractions: wetX,
    dryMoleFractions: dryX,
    mass_kg_per_kg: mass,
    wet_m3_per_kg: wet * NORMAL_MOLAR_VOLUME_m3_per_mol,
    dry_m3_per_kg: dry * NORMAL_MOLAR_VOLUME_m3_per_mol,
  };
}

/** Maximum CO2 in the dry flue gas (stoichiometric combustion), vol %. */
export function co2MaxDryPercent(fuel: ResolvedFuel, oxidizer: Oxidizer = DRY_AIR): number {
  return 100 * flueGasPerKgFuel(fuel, { lambda: 1, oxidizer }).dryMoleFractions.CO2;
}

/**
 * Water dew point of a flue gas: the saturation temperature (IAPWS-IF97) at the water partial
 * pressure. Returns null when the partial pressure is below the triple point (no dew above 0 °C).
 */
export function waterDewPointC(waterMoleFraction: number, pressurePa = atmospherePa): number | null {
  const pw = waterMoleFraction * pressurePa;
  if (pw < WATER_SATURATION_MIN_PA) return null;
  return kelvinToCelsius(saturationTemperatureK(pw));
}

/**
 * Share of the fuel's sulfur leaving as SO3 (the rest as SO2) assumed for the acid dew point:
 * 1–5 % is usual in boilers; 2 % is taken (common practice, no source).
 */
export const SO3_CONVERSION_DEFAULT = 0.02;

/** 1 atm = 760 mmHg (exact, by definition of the torr). */
const MMHG_PER_PA = 760 / atmospherePa;

/**
 * Sulfuric-acid dew point by the correlation of Verhoff & Banchero (1974), Chem. Eng. Prog.
 * 70(8):71–72: 1000/T = 2.276 − 0.0294 ln p_H2O − 0.0858 ln p_SO3 + 0.0062 ln p_H2O · ln p_SO3,
 * T in K, partial pressures in mmHg. Returns null without SO3 or water.
 */
export function acidDewPointC(waterMoleFraction: number, so3MoleFraction: number, pressurePa = atmospherePa): number | null {
  if (!(waterMoleFraction > 0) || !(so3MoleFraction > 0)) return null;
  const lw = Math.log(waterMoleFraction * pressurePa * MMHG_PER_PA);
  const ls = Math.log(so3MoleFraction * pressurePa * MMHG_PER_PA);
  return kelvinToCelsius(1000 / (2.276 - 0.0294 * lw - 0.0858 * ls + 0.0062 * lw * ls));
}

/** Acid dew point of a flue gas whose SO2 partly oxidises to SO3 (null for sulfur-free fuels). */
export function flueAcidDewPointC(fg: FlueGas, so3Conversion = SO3_CONVERSION_DEFAULT, pressurePa = atmospherePa): number | null {
  return acidDewPointC(fg.wetMoleFractions.H2O, so3Conversion * fg.wetMoleFractions.SO2, pressurePa);
}
