/**
 * The plant's duty (rated and annual useful heat) and what a fuel needs to deliver it: heat
 * input, fuel mass and volume flow, combustion-air and flue-gas flow at rated duty, and the
 * fuel demand per year.
 *
 * Every candidate delivers the same useful heat as the baseline: at rated duty the baseline
 * fires its rated input; a candidate fires rated useful heat ÷ its own efficiency.
 */
import { MJ_per_MWh, m3_per_L } from "../units/energy";
import { METERING_REFERENCE_C, type Plant } from "../schemas/plant";
import type { FuelContext } from "./fuel-context";
import { actualFromNormal_m3, type FuelPerformance } from "./performance";
import { meteringLabelWithPressure } from "../units/metering";

const s_per_h = 3600;

export interface PlantDuty {
  ratedInput_kW: number;
  ratedInputBasis: "net" | "gross";
  /** Useful heat at rated duty (baseline at rated input), kW. */
  ratedUseful_kW: number;
  annualUseful_MWh: number;
  annualUsefulOrigin: "given" | "hours × load × rated input × baseline efficiency";
  /** Equivalent full-load hours of the annual useful heat. */
  fullLoadHours: number;
}

export function plantDuty(plant: Plant, baseline: FuelPerformance): PlantDuty {
  const eff = plant.ratedInputBasis === "gross" ? baseline.efficiency.gross.efficiency : baseline.efficiency.net.efficiency;
  const ratedUseful = plant.ratedInput_kW * eff;
  const given = plant.annualUsefulHeat_MWh ?? null;
  const annual = given !== null ? given : (plant.operatingHours * plant.averageLoadFraction * ratedUseful) / 1000;
  return {
    ratedInput_kW: plant.ratedInput_kW,
    ratedInputBasis: plant.ratedInputBasis,
    ratedUseful_kW: ratedUseful,
    annualUseful_MWh: annual,
    annualUsefulOrigin: given !== null ? "given" : "hours × load × rated input × baseline efficiency",
    fullLoadHours: ratedUseful > 0 ? (annual * 1000) / ratedUseful : 0,
  };
}

export interface FuelVolume {
  value: number;
  /** What the volume means, e.g. "m³/h gas at 0 °C, 101.325 kPa (real gas)". */
  basis: string;
  kind: "gas" | "liquid";
}

export interface RatedFlows {
  heatInput_kW_net: number;
  heatInput_kW_gross: number;
  fuel_kg_per_h: number;
  /** Gas at the plant's supply metering reference, or liquid at 15 °C; null for solids / liquids without density. */
  fuelVolume_per_h: FuelVolume | null;
  air_m3_per_h_normal: number;
  air_m3_per_h_actual: number;
  flueGas_m3_per_h_normal: number;
  flueGas_m3_per_h_actual: number;
  condensate_kg_per_h: number;
  basis: { air: string; flueGas: string };
}

/** Fuel volume for a mass of fuel: gases at the metering reference (real gas), liquids at their density. */
export function fuelVolume(ctx: FuelContext, mass_kg: number, meteringReferenceC: number): FuelVolume | null {
  const f = ctx.fuel;
  if (f.kind === "gas") {
    return {
      value: mass_kg / ctx.gasDensity_kg_per_m3(meteringReferenceC),
      basis: `gas at ${meteringLabelWithPressure(meteringReferenceC)} (real gas, ISO 6976)`,
      kind: "gas",
    };
  }
  if (f.kind === "liquid" && f.density_kg_per_m3) {
    return { value: mass_kg / f.density_kg_per_m3, basis: "liquid at 15 °C", kind: "liquid" };
  }
  return null;
}

/** Flows of a fuel delivering `useful_kW`. */
export function flowsForUseful(plant: Plant, ctx: FuelContext, perf: FuelPerformance, useful_kW: number): RatedFlows {
  const net_kW = useful_kW / perf.efficiency.net.efficiency;
  const MJ_per_h = (net_kW / 1000) * s_per_h;
  const p = perf.perMJ_net;
  const fuelKg = MJ_per_h * p.fuel_kg;
  const airN = MJ_per_h * p.air_m3_normal;
  const flueN = MJ_per_h * p.flueGasWet_m3_normal;
  const op = perf.operatingPoint;
  return {
    heatInput_kW_net: net_kW,
    heatInput_kW_gross: (net_kW * ctx.hv.hhv_MJ_per_kg) / ctx.hv.lhv_MJ_per_kg,
    fuel_kg_per_h: fuelKg,
    fuelVolume_per_h: fuelVolume(ctx, fuelKg, METERING_REFERENCE_C[plant.fuelSupplyMeteringReference]),
    air_m3_per_h_normal: airN,
    air_m3_per_h_actual: actualFromNormal_m3(airN, op.combustionAirC),
    flueGas_m3_per_h_normal: flueN,
    flueGas_m3_per_h_actual: actualFromNormal_m3(flueN, op.stackTemperatureC),
    condensate_kg_per_h: MJ_per_h * p.condensate_kg,
    basis: {
      air: `humid combustion air; normal = 0 °C, 101.325 kPa; actual = at ${op.combustionAirC} °C (ideal gas)`,
      flueGas: `wet flue gas leaving (after any condensation); normal = 0 °C, 101.325 kPa; actual = at ${op.stackTemperatureC} °C (ideal gas)`,
    },
  };
}

export interface AnnualDemand {
  useful_MWh: number;
  fuel_MWh_net: number;
  fuel_MWh_gross: number;
  fuel_t: number;
  /** Gas at the plant's supply metering reference, or liquid m³; null for solids. */
  fuelVolume: FuelVolume | null;
  /** Liquids: litres per year. */
  fuel_L: number | null;
  condensate_t: number;
}

export function annualDemand(plant: Plant, ctx: FuelContext, perf: FuelPerformance, useful_MWh: number): AnnualDemand {
  const net = useful_MWh / perf.efficiency.net.efficiency;
  const MJ = net * MJ_per_MWh;
  const kg = MJ * perf.perMJ_net.fuel_kg;
  const vol = fuelVolume(ctx, kg, METERING_REFERENCE_C[plant.fuelSupplyMeteringReference]);
  return {
    useful_MWh,
    fuel_MWh_net: net,
    fuel_MWh_gross: (net * ctx.hv.hhv_MJ_per_kg) / ctx.hv.lhv_MJ_per_kg,
    fuel_t: kg / 1000,
    fuelVolume: vol,
    fuel_L: vol && vol.kind === "liquid" ? vol.value / m3_per_L : null,
    condensate_t: (MJ * perf.perMJ_net.condensate_kg) / 1000,
  };
}
