/**
 * Thermochemistry of the complete-combustion products of a set of element amounts
 * (C → CO2, H → H2O, S → SO2, N → N2, Ar → Ar): their enthalpy at a temperature, with product water
 * liquid or vapour, from the NASA polynomials. The one place of this sum: heating values (Hess's law)
 * and the formation enthalpy of a fuel given by its measured heating value both use it.
 */
import { h_J_per_mol, type Element } from "./nasa7";
import { SPECIES } from "./species-data";

export type WaterPhase = "liquid" | "vapour";

/** Σ n h(T) of the complete-combustion products of `el` (mol of each element), J; NASA convention. */
export function completeProductsEnthalpy_J(el: Readonly<Record<Element, number>>, temperatureK: number, water: WaterPhase): number {
  return (
    el.C * h_J_per_mol(SPECIES.CO2, temperatureK) +
    (el.H / 2) * h_J_per_mol(water === "liquid" ? SPECIES["H2O(L)"] : SPECIES.H2O, temperatureK) +
    el.S * h_J_per_mol(SPECIES.SO2, temperatureK) +
    (el.N / 2) * h_J_per_mol(SPECIES.N2, temperatureK) +
    el.Ar * h_J_per_mol(SPECIES.Ar, temperatureK)
  );
}

/** Enthalpy of vaporisation of water at T from the polynomials, J/mol (H2O(g) − H2O(l)). */
export function waterLatentHeat_J_per_mol(temperatureK: number): number {
  return h_J_per_mol(SPECIES.H2O, temperatureK) - h_J_per_mol(SPECIES["H2O(L)"], temperatureK);
}
