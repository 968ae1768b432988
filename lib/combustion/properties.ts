/**
 * The property sheet of a fuel: heating values on every basis, interchangeability, stoichiometry,
 * flue gas at stoichiometric air and CO2 factors — each figure with its basis.
 */
import type { FuelDefinition } from "../schemas/fuel";
import { resolveFuel, type ResolvedFuel } from "../fuels/resolve";
import { DEFAULT_COMBUSTION_REFERENCE_C, heatingValues } from "./heating-values";
import { MJ_per_kWh } from "../units/energy";
import { atmospherePa, standardPressurePa } from "../units/constants";
import { DRY_AIR, oxidizerDemand } from "./stoichiometry";
import { co2MaxDryPercent, flueAcidDewPointC, flueGasPerKgFuel, SO3_CONVERSION_DEFAULT, waterDewPointC } from "./flue-gas";
import { co2Factors, type Co2Factors } from "./co2";
import { airDensity_kg_per_m3, DEFAULT_METERING_REFERENCE_C, volumetricFigures } from "./iso6976";

export interface PropertyOptions {
  /** Combustion reference temperature, °C (25 default; 0, 15, 15.55, 20 selectable). */
  combustionReferenceC?: number;
  /** Metering reference temperature at 101.325 kPa, °C (15 default; 0, 15.56 = 60 °F, 20). */
  meteringReferenceC?: number;
}

export interface HeatingValueFigures {
  kJ_per_mol?: number;
  MJ_per_kg: number;
  /** Real gas at the metering reference (ISO 6976 compression factor). */
  MJ_per_m3?: number;
  /** Liquids: per litre at 15 °C density. */
  MJ_per_L?: number;
  kJ_per_mol_O2: number;
  MJ_per_kg_O2: number;
  /** Per m³ of stoichiometric dry air at the metering reference. */
  MJ_per_m3_air: number;
  kWh_per_kg: number;
}

export interface FuelProperties {
  label: string;
  kind: ResolvedFuel["kind"];
  molarMass_g_per_mol?: number;
  density_kg_per_m3?: number;
  /** Gases: real-gas density at the metering reference. */
  gasDensity_kg_per_m3?: number;
  compressionFactor?: number;
  hhv: HeatingValueFigures;
  lhv: HeatingValueFigures;
  relativeDensity?: number;
  wobbe?: { gross_MJ_per_m3: number; net_MJ_per_m3: number };
  stoichiometricAir: { kg_per_kg: number; mol_per_mol?: number; m3_per_kg: number; m3_per_m3?: number };
  stoichiometricO2: { mol_per_kg: number; kg_per_kg: number; mol_per_mol?: number };
  co2: Co2Factors;
  flueGas: {
    /** Stoichiometric complete combustion in dry air; volumes at 0 °C, 101.325 kPa. */
    wet_m3_per_MJ_lhv: number;
    wet_m3_per_MJ_hhv: number;
    dry_m3_per_MJ_lhv: number;
    mass_kg_per_MJ_lhv: number;
    mass_kg_per_MJ_hhv: number;
    dry_m3_per_MJ_hhv: number;
    wet_m3_per_kg: number;
    co2max_dry_percent: number;
    water_wet_percent: number;
    dewPoint_C: number | null;
    /** Sulfur fuels: sulfuric-acid dew point (Verhoff & Banchero 1974) with 2 % of SO2 as SO3; null otherwise. */
    acidDewPoint_C: number | null;
  };
  elements_mol_per_kg: ResolvedFuel["elements_mol_per_kg"];
  biogenicCarbonShare: number;
  h2MoleFraction: number;
  heatingValueOrigin: ResolvedFuel["heatingValueOrigin"];
  reference: {
    combustionReferenceC: number;
    meteringReferenceC: number;
    meteringPressure_kPa: number;
    volumetricBasis: string;
    flueGasVolumeBasis: string;
    airBasis: string;
    standardStatePressure_kPa: number;
  };
  notes: string[];
}

export function fuelPropertiesFromResolved(fuel: ResolvedFuel, opts: PropertyOptions = {}): FuelProperties {
  const tc = opts.combustionReferenceC ?? DEFAULT_COMBUSTION_REFERENCE_C;
  const tm = opts.meteringReferenceC ?? DEFAULT_METERING_REFERENCE_C;
  const hv = heatingValues(fuel, tc);
  const demand = oxidizerDemand(fuel, DRY_AIR);
  const rhoAir = airDensity_kg_per_m3(tm);
  const airM3PerKg = demand.oxidizer_kg_per_kg / rhoAir;
  const fg = flueGasPerKgFuel(fuel, { lambda: 1, oxidizer: DRY_AIR });
  const figures = (MJ_per_kg: number, kJ_per_mol: number | undefined, kJ_per_mol_O2: number, MJ_per_kg_O2: number): HeatingValueFigures => {
    const f: HeatingValueFigures = {
      MJ_per_kg,
      kJ_per_mol_O2,
      MJ_per_kg_O2,
      MJ_per_m3_air: MJ_per_kg / airM3PerKg,
      kWh_per_kg: MJ_per_kg / MJ_per_kWh,
    };
    if (kJ_per_mol !== undefined) f.kJ_per_mol = kJ_per_mol;
    return f;
  };
  const hhv = figures(hv.hhv_MJ_per_kg, hv.hhv_kJ_per_mol, hv.hhv_kJ_per_mol_O2, hv.hhv_MJ_per_kg_O2);
  const lhv = figures(hv.lhv_MJ_per_kg, hv.lhv_kJ_per_mol, hv.lhv_kJ_per_mol_O2, hv.lhv_MJ_per_kg_O2);
  const out: FuelProperties = {
    label: fuel.label,
    kind: fuel.kind,
    hhv,
    lhv,
    stoichiometricAir: { kg_per_kg: demand.oxidizer_kg_per_kg, m3_per_kg: airM3PerKg },
    stoichiometricO2: { mol_per_kg: demand.O2_mol_per_kg, kg_per_kg: demand.O2_kg_per_kg },
    co2: co2Factors(fuel, hv),
    flueGas: {
      wet_m3_per_MJ_lhv: fg.wet_m3_per_kg / hv.lhv_MJ_per_kg,
      wet_m3_per_MJ_hhv: fg.wet_m3_per_kg / hv.hhv_MJ_per_kg,
      dry_m3_per_MJ_lhv: fg.dry_m3_per_kg / hv.lhv_MJ_per_kg,
      mass_kg_per_MJ_lhv: fg.mass_kg_per_kg / hv.lhv_MJ_per_kg,
      mass_kg_per_MJ_hhv: fg.mass_kg_per_kg / hv.hhv_MJ_per_kg,
      dry_m3_per_MJ_hhv: fg.dry_m3_per_kg / hv.hhv_MJ_per_kg,
      wet_m3_per_kg: fg.wet_m3_per_kg,
      co2max_dry_percent: co2MaxDryPercent(fuel, DRY_AIR),
      water_wet_percent: 100 * fg.wetMoleFractions.H2O,
      dewPoint_C: waterDewPointC(fg.wetMoleFractions.H2O),
      acidDewPoint_C: flueAcidDewPointC(fg),
    },
    elements_mol_per_kg: fuel.elements_mol_per_kg,
    biogenicCarbonShare: fuel.biogenicCarbonShare,
    h2MoleFraction: fuel.h2MoleFraction,
    heatingValueOrigin: fuel.heatingValueOrigin,
    reference: {
      combustionReferenceC: tc,
      meteringReferenceC: tm,
      meteringPressure_kPa: atmospherePa / 1000,
      volumetricBasis:
        fuel.kind === "gas"
          ? `real gas at ${tm} °C, ${atmospherePa / 1000} kPa (ISO 6976:2016 compression factor); combustion at ${tc} °C`
          : fuel.kind === "liquid"
            ? "per litre at the liquid's density (15 °C)"
            : "solid: per kg as received",
      flueGasVolumeBasis: `ideal gas at 0 °C, ${atmospherePa / 1000} kPa; stoichiometric complete combustion in dry air; acid dew point (sulfur fuels) by Verhoff & Banchero (1974) with ${100 * SO3_CONVERSION_DEFAULT} % of SO2 as SO3`,
      airBasis: `dry air (O2 20.946 %, N2 78.084 %, Ar 0.934 %, CO2 0.036 %); volumes at ${tm} °C, ${atmospherePa / 1000} kPa`,
      standardStatePressure_kPa: standardPressurePa / 1000,
    },
    notes: [...fuel.notes],
  };
  if (demand.oxidizer_mol_per_mol !== undefined) out.stoichiometricAir.mol_per_mol = demand.oxidizer_mol_per_mol;
  if (demand.O2_mol_per_mol !== undefined) out.stoichiometricO2.mol_per_mol = demand.O2_mol_per_mol;
  if (fuel.molarMass_g_per_mol !== undefined) out.molarMass_g_per_mol = fuel.molarMass_g_per_mol;
  if (fuel.kind === "gas" && fuel.gasComposition && fuel.molarMass_g_per_mol) {
    const v = volumetricFigures(
      fuel.gasComposition,
      fuel.molarMass_g_per_mol,
      { hhv_kJ_per_mol: hv.hhv_kJ_per_mol!, lhv_kJ_per_mol: hv.lhv_kJ_per_mol!, combustionReferenceC: tc },
      tm,
    );
    hhv.MJ_per_m3 = v.hhv_MJ_per_m3;
    lhv.MJ_per_m3 = v.lhv_MJ_per_m3;
    out.relativeDensity = v.relativeDensity;
    out.compressionFactor = v.compressionFactor;
    out.gasDensity_kg_per_m3 = v.density_kg_per_m3;
    out.wobbe = v.wobbe;
    out.stoichiometricAir.m3_per_m3 = airM3PerKg * out.gasDensity_kg_per_m3;
  }
  if (fuel.density_kg_per_m3 !== undefined) {
    out.density_kg_per_m3 = fuel.density_kg_per_m3;
    if (fuel.kind === "liquid") {
      hhv.MJ_per_L = (hv.hhv_MJ_per_kg * fuel.density_kg_per_m3) / 1000;
      lhv.MJ_per_L = (hv.lhv_MJ_per_kg * fuel.density_kg_per_m3) / 1000;
    }
  }
  return out;
}

/** Resolves and evaluates a fuel definition (throws FuelDefinitionError naming the field). */
export function computeFuelProperties(def: FuelDefinition, opts: PropertyOptions = {}): FuelProperties {
  return fuelPropertiesFromResolved(resolveFuel(def), opts);
}
