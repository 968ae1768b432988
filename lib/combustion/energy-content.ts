/**
 * The energy content of a resolved fuel per unit of quantity: heating values per kg and the
 * density that turns a volume into a mass (liquids at 15 °C, solids bulk, gases real-gas at the
 * metering reference, ISO 6976:2016 compression factor). Prices and plant flows both read it.
 */
import type { ResolvedFuel } from "../fuels/resolve";
import { realDensity_kg_per_m3 } from "./iso6976";

/** What turns a quantity of fuel (kg, m³, L) into energy: heating values and densities. */
export interface FuelEnergyContent {
  kind: "gas" | "liquid" | "solid";
  /** Gross (higher) heating value, MJ per kg as fired. */
  hhv_MJ_per_kg: number;
  /** Net (lower) heating value, MJ per kg as fired. */
  lhv_MJ_per_kg: number;
  /** Liquids: density at 15 °C; solids: bulk density. kg/m³. */
  density_kg_per_m3?: number | null;
  /** Gases: density (real gas) at a metering temperature (°C, 101.325 kPa), kg/m³. */
  gasDensity_kg_per_m3?: (meteringReferenceC: number) => number;
}

/**
 * The energy content of a resolved fuel per unit of quantity: heating values (at the combustion
 * reference they were computed at) and its density — liquids at 15 °C, solids bulk (when
 * given), gases real-gas at each metering reference (ISO 6976:2016 compression factor).
 */
export function energyContentOf(fuel: ResolvedFuel, hv: { hhv_MJ_per_kg: number; lhv_MJ_per_kg: number }): FuelEnergyContent {
  const content: FuelEnergyContent = {
    kind: fuel.kind,
    hhv_MJ_per_kg: hv.hhv_MJ_per_kg,
    lhv_MJ_per_kg: hv.lhv_MJ_per_kg,
    density_kg_per_m3: fuel.kind === "gas" ? null : (fuel.density_kg_per_m3 ?? null),
  };
  if (fuel.kind === "gas" && fuel.gasComposition && fuel.molarMass_g_per_mol) {
    const composition = fuel.gasComposition;
    const M = fuel.molarMass_g_per_mol;
    content.gasDensity_kg_per_m3 = (meteringReferenceC) => realDensity_kg_per_m3(composition, M, meteringReferenceC);
  }
  return content;
}
