/**
 * CO2 from the fuel's carbon (complete oxidation), per GJ of fuel on gross and net basis,
 * split into fossil and biogenic parts by the fuel's biogenic carbon share.
 */
import type { ResolvedFuel } from "../fuels/resolve";
import { MOLAR_MASS_g_per_mol } from "../thermo/species-data";

export interface Co2Factors {
  /** kg CO2 per kg fuel. */
  kg_per_kg: number;
  kg_per_GJ_hhv: number;
  kg_per_GJ_lhv: number;
  fossil_kg_per_GJ_hhv: number;
  fossil_kg_per_GJ_lhv: number;
  biogenic_kg_per_GJ_hhv: number;
  biogenic_kg_per_GJ_lhv: number;
  /** Upstream (well-to-tank) CO2e per GJ net, when the fuel states one. */
  upstreamCo2e_kg_per_GJ_lhv?: number;
}

export function co2Factors(fuel: ResolvedFuel, hv: { hhv_MJ_per_kg: number; lhv_MJ_per_kg: number }): Co2Factors {
  const kgPerKg = (fuel.elements_mol_per_kg.C * MOLAR_MASS_g_per_mol.CO2) / 1000;
  const hhv = (kgPerKg / hv.hhv_MJ_per_kg) * 1000;
  const lhv = (kgPerKg / hv.lhv_MJ_per_kg) * 1000;
  const b = fuel.biogenicCarbonShare;
  return {
    kg_per_kg: kgPerKg,
    kg_per_GJ_hhv: hhv,
    kg_per_GJ_lhv: lhv,
    fossil_kg_per_GJ_hhv: hhv * (1 - b),
    fossil_kg_per_GJ_lhv: lhv * (1 - b),
    biogenic_kg_per_GJ_hhv: hhv * b,
    biogenic_kg_per_GJ_lhv: lhv * b,
    ...(fuel.upstreamCo2e_kg_per_GJ !== undefined ? { upstreamCo2e_kg_per_GJ_lhv: fuel.upstreamCo2e_kg_per_GJ } : {}),
  };
}
