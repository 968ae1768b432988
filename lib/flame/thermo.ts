/**
 * Species and mixture thermo of a mechanism on its own NASA-7 records (see ../thermo/nasa7.ts for the
 * polynomials, which are evaluated only there). Standard state: the mechanism's (1 atm for
 * CHEMKIN-format data, `mech.standardPressurePa`). All functions are allocation-free; outputs are
 * caller-owned Float64Arrays of length nSpecies.
 */
import { evalPackedInto } from "../thermo/nasa7";
import { R_J_per_molK } from "../units/constants";
import type { Mechanism } from "./mechanism";

/** cp/R, h/RT (formation enthalpy included) and s°/R of every species at T. */
export function speciesThermoInto(mech: Mechanism, T: number, cp_R: Float64Array, h_RT: Float64Array, s_R: Float64Array): void {
  evalPackedInto(mech.nasa7, mech.nSpecies, T, cp_R, h_RT, s_R);
}

/** Mean molar mass, kg/mol, of a mixture given by mass fractions Y. */
export function meanMolarMass(mech: Mechanism, Y: Float64Array): number {
  const W = mech.molarMass_kg_per_mol;
  let s = 0;
  for (let k = 0; k < mech.nSpecies; k++) s += Y[k] / W[k];
  return 1 / s;
}

/** Mean molar mass, kg/mol, of a mixture given by mole fractions X. */
export function meanMolarMassFromMole(mech: Mechanism, X: Float64Array): number {
  const W = mech.molarMass_kg_per_mol;
  let s = 0;
  for (let k = 0; k < mech.nSpecies; k++) s += X[k] * W[k];
  return s;
}

/** Mole fractions X from mass fractions Y (X may not alias Y). */
export function massToMole(mech: Mechanism, Y: Float64Array, X: Float64Array): void {
  const W = mech.molarMass_kg_per_mol;
  const Wm = meanMolarMass(mech, Y);
  for (let k = 0; k < mech.nSpecies; k++) X[k] = (Y[k] * Wm) / W[k];
}

/** Mass fractions Y from mole fractions X (Y may not alias X). */
export function moleToMass(mech: Mechanism, X: Float64Array, Y: Float64Array): void {
  const W = mech.molarMass_kg_per_mol;
  const Wm = meanMolarMassFromMole(mech, X);
  for (let k = 0; k < mech.nSpecies; k++) Y[k] = (X[k] * W[k]) / Wm;
}

/** Mixture cp, J/(kg·K), from species cp/R (evaluated at T by speciesThermoInto) and mass fractions. */
export function mixtureCp_J_per_kgK(mech: Mechanism, cp_R: Float64Array, Y: Float64Array): number {
  const W = mech.molarMass_kg_per_mol;
  let s = 0;
  for (let k = 0; k < mech.nSpecies; k++) s += (Y[k] * cp_R[k]) / W[k];
  return R_J_per_molK * s;
}

/** Mixture enthalpy, J/kg (formation enthalpies included), from species h/RT at T and mass fractions. */
export function mixtureEnthalpy_J_per_kg(mech: Mechanism, T: number, h_RT: Float64Array, Y: Float64Array): number {
  const W = mech.molarMass_kg_per_mol;
  let s = 0;
  for (let k = 0; k < mech.nSpecies; k++) s += (Y[k] * h_RT[k]) / W[k];
  return R_J_per_molK * T * s;
}

/** Species enthalpies, J/kg, from h/RT at T (for the energy equation's Σ h_k ω̇_k W_k). */
export function speciesEnthalpy_J_per_kg_Into(mech: Mechanism, T: number, h_RT: Float64Array, out: Float64Array): void {
  const W = mech.molarMass_kg_per_mol;
  const RT = R_J_per_molK * T;
  for (let k = 0; k < mech.nSpecies; k++) out[k] = (h_RT[k] * RT) / W[k];
}
