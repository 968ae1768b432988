/**
 * Gross (HHV) and net (LHV) heating values by Hess's law at a combustion reference temperature:
 * reactants (fuel as fed + O2) and products (CO2, H2O, SO2, N2, Ar) all at the reference
 * temperature; water liquid for the gross value, vapour for the net value. Species enthalpies
 * from the NASA polynomials; fuel enthalpy from its resolved description.
 */
import { h_J_per_mol } from "../thermo/nasa7";
import { MOLAR_MASS_g_per_mol, SPECIES } from "../thermo/species-data";
import { completeProductsEnthalpy_J } from "../thermo/combustion-products";
import { celsiusToKelvin } from "../units/constants";
import type { ResolvedFuel } from "../fuels/resolve";
import { assertCombustible } from "./stoichiometry";

const O2_MOLAR_MASS_kg_per_mol = MOLAR_MASS_g_per_mol.O2 / 1000;

export interface HeatingValues {
  combustionReferenceC: number;
  hhv_MJ_per_kg: number;
  lhv_MJ_per_kg: number;
  /** Per mole of fuel (gases and pure compounds). */
  hhv_kJ_per_mol?: number;
  lhv_kJ_per_mol?: number;
  /** Per mole and per kg of O2 consumed. */
  hhv_kJ_per_mol_O2: number;
  lhv_kJ_per_mol_O2: number;
  hhv_MJ_per_kg_O2: number;
  lhv_MJ_per_kg_O2: number;
  /** Product water per kg fuel, mol (what separates gross from net). */
  productWater_mol_per_kg: number;
}

/** Combustion reference temperature of heating values unless another is asked for, °C (ISO 6976:2016 lists 25 °C first). */
export const DEFAULT_COMBUSTION_REFERENCE_C = 25;

export function heatingValues(fuel: ResolvedFuel, combustionReferenceC = DEFAULT_COMBUSTION_REFERENCE_C): HeatingValues {
  const T = celsiusToKelvin(combustionReferenceC);
  const el = fuel.elements_mol_per_kg;
  const nO2 = assertCombustible(fuel);
  const hFuel = fuel.formationEnthalpy_J_per_kg + fuel.sensibleEnthalpy_J_per_kg(T);
  const hReactants = hFuel + nO2 * h_J_per_mol(SPECIES.O2, T);
  const water = el.H / 2;
  const hhv = hReactants - completeProductsEnthalpy_J(el, T, "liquid");
  const lhv = hReactants - completeProductsEnthalpy_J(el, T, "vapour");
  const out: HeatingValues = {
    combustionReferenceC,
    hhv_MJ_per_kg: hhv / 1e6,
    lhv_MJ_per_kg: lhv / 1e6,
    hhv_kJ_per_mol_O2: hhv / nO2 / 1e3,
    lhv_kJ_per_mol_O2: lhv / nO2 / 1e3,
    hhv_MJ_per_kg_O2: hhv / (nO2 * O2_MOLAR_MASS_kg_per_mol) / 1e6,
    lhv_MJ_per_kg_O2: lhv / (nO2 * O2_MOLAR_MASS_kg_per_mol) / 1e6,
    productWater_mol_per_kg: water,
  };
  if (fuel.molarMass_g_per_mol) {
    out.hhv_kJ_per_mol = (hhv / 1e3) * (fuel.molarMass_g_per_mol / 1000);
    out.lhv_kJ_per_mol = (lhv / 1e3) * (fuel.molarMass_g_per_mol / 1000);
  }
  return out;
}
