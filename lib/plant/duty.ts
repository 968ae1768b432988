/**
 * The plant's duty (rated and annual useful heat) and what a fuel needs to deliver it: heat
 * input, efficiency at that firing rate, fuel mass and volume flow, combustion-air and flue-gas
 * flow at rated duty, and the fuel demand per year.
 *
 * Every candidate delivers the same useful heat as the baseline: at rated duty the baseline
 * fires its rated input; a candidate fires rated useful heat ÷ its own efficiency.
 *
 * Radiation and casing loss is a constant heat flow: the plant's figure (% of the net input at
 * rated load, as rating plates and the ABMA-type charts state it) times the baseline's rated net
 * input. Its share of a fuel's input therefore grows as the load falls (about 1/load):
 * delivering useful heat U with a fuel whose other losses leave η₀ of its net input,
 *   Q_in = (U + Q_rad) / η₀,   share = Q_rad · η₀ / (U + Q_rad),   η = U / Q_in.
 * Rated flows use the efficiency at rated duty; the annual fuel demand, costs and CO2 per useful
 * MJ use the efficiency at the average load.
 */
import { MJ_per_MWh, m3_per_L } from "../units/energy";
import { METERING_REFERENCE_C, type OperatingPoint, type Plant } from "../schemas/plant";
import { InputError } from "../errors";
import { withRadiationShare, type EfficiencyResult } from "./efficiency";
import type { FuelContext } from "./fuel-context";
import { actualFromNormal_m3, type FuelPerformance } from "./performance";
import { meteringLabelWithPressure } from "../units/metering";

const s_per_h = 3600;

export type AnnualUsefulOrigin = "given" | "operating hours × useful heat at the average load";

export interface PlantDuty {
  ratedInput_kW: number;
  ratedInputBasis: "net" | "gross";
  /** Rated input of the baseline fuel on the net basis, kW. */
  ratedInputNet_kW: number;
  /** Useful heat at rated duty (baseline at rated input), kW. */
  ratedUseful_kW: number;
  /** Average load used for the radiation share of the annual figures, fraction of the rated input. */
  averageLoadFraction: number;
  /** Where that load comes from. */
  averageLoadOrigin: "given" | "annual useful heat ÷ operating hours" | "rated load (no hours or load given)";
  /** Useful heat at the average load, kW. */
  averageUseful_kW: number;
  annualUseful_MWh: number;
  annualUsefulOrigin: AnnualUsefulOrigin;
  /** Equivalent full-load hours of the annual useful heat. */
  fullLoadHours: number;
}

/** Radiation and casing loss of an operating point as a heat flow, kW. */
export function radiationLoss_kW(duty: PlantDuty, op: OperatingPoint): number {
  return (op.radiationLossPercent / 100) * duty.ratedInputNet_kW;
}

/**
 * The heat-loss balance of a fuel delivering `useful_kW`: the per-kg balance with the radiation
 * share of that firing rate.
 */
export function efficiencyAtUseful(perf: FuelPerformance, duty: PlantDuty, useful_kW: number): EfficiencyResult {
  const q = radiationLoss_kW(duty, perf.operatingPoint);
  const eta0 = perf.balance.net.efficiency;
  if (!(useful_kW > 0) || !(eta0 > 0)) throw new InputError("averageLoadFraction", "the unit delivers no useful heat at this load");
  return withRadiationShare(perf.balance, (100 * q * eta0) / (useful_kW + q));
}

export function plantDuty(plant: Plant, baseCtx: FuelContext, baseline: FuelPerformance): PlantDuty {
  const netOverRated = plant.ratedInputBasis === "gross" ? baseCtx.hv.lhv_MJ_per_kg / baseCtx.hv.hhv_MJ_per_kg : 1;
  const ratedNet = plant.ratedInput_kW * netOverRated;
  const eta0 = baseline.balance.net.efficiency;
  const rShare = baseline.operatingPoint.radiationLossPercent / 100;
  const ratedUseful = ratedNet * (eta0 - rShare);
  if (!(ratedUseful > 0)) throw new InputError("radiationLossPercent", "the losses leave no useful heat at rated load");
  const given = plant.annualUsefulHeat_MWh ?? null;
  let load = plant.averageLoadFraction;
  let loadOrigin: PlantDuty["averageLoadOrigin"] = "given";
  if (!(load > 0)) {
    if (given !== null && plant.operatingHours > 0) {
      // Useful heat per hour → load: U = ratedNet · (L · η₀ − r).
      load = ((given * 1000) / plant.operatingHours / ratedNet + rShare) / eta0;
      loadOrigin = "annual useful heat ÷ operating hours";
      if (load > 1) {
        throw new InputError(
          "annualUsefulHeat_MWh",
          `${given} MWh in ${plant.operatingHours} h needs ${(100 * load).toFixed(0)} % of the rated input: more than the unit delivers at rated input`,
        );
      }
    } else {
      load = 1;
      loadOrigin = "rated load (no hours or load given)";
    }
  }
  const averageUseful = ratedNet * (load * eta0 - rShare);
  if (!(averageUseful > 0)) {
    throw new InputError(
      "averageLoadFraction",
      `at ${(100 * load).toFixed(1)} % load the radiation and casing loss (${(100 * rShare).toFixed(2)} % of the rated input) takes all the heat the flue gas leaves: no useful heat`,
    );
  }
  const annual = given !== null ? given : (plant.operatingHours * averageUseful) / 1000;
  return {
    ratedInput_kW: plant.ratedInput_kW,
    ratedInputBasis: plant.ratedInputBasis,
    ratedInputNet_kW: ratedNet,
    ratedUseful_kW: ratedUseful,
    averageLoadFraction: load,
    averageLoadOrigin: loadOrigin,
    averageUseful_kW: averageUseful,
    annualUseful_MWh: annual,
    annualUsefulOrigin: given !== null ? "given" : "operating hours × useful heat at the average load",
    fullLoadHours: (annual * 1000) / ratedUseful,
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

/** Flows of a fuel delivering `useful_kW` at efficiency `eff` (from efficiencyAtUseful at the same useful heat). */
export function flowsForUseful(
  plant: Plant,
  ctx: FuelContext,
  perf: FuelPerformance,
  eff: EfficiencyResult,
  useful_kW: number,
): RatedFlows {
  const net_kW = useful_kW / eff.net.efficiency;
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

/** Annual fuel demand for `useful_MWh` at the efficiency `eff` of the average load. */
export function annualDemand(
  plant: Plant,
  ctx: FuelContext,
  perf: FuelPerformance,
  eff: EfficiencyResult,
  useful_MWh: number,
): AnnualDemand {
  const net = useful_MWh / eff.net.efficiency;
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
