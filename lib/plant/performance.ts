/**
 * A fuel burnt in a plant at one operating point: air factor from the measured flue O2,
 * efficiency by the heat-loss method, equilibrium flame temperature at the plant's air
 * temperature, and the flows per unit of heat input. Results are cached per (fuel state,
 * operating point), so no state is solved twice; the equilibrium solver can be warm-started
 * from a neighbouring solution (hydrogen sweeps).
 */
import { humidAir, lambdaFromFlueO2Dry, excessAirPercentFromLambda, oxidizerDemand, type Oxidizer } from "../combustion/stoichiometry";
import { flameTemperature, type FlameResult } from "../combustion/flame";
import { NORMAL_MOLAR_VOLUME_m3_per_mol } from "../combustion/flue-gas";
import type { EquilibriumResult } from "../combustion/equilibrium";
import { celsiusToKelvin, kelvinToCelsius, T0CK, T298K } from "../units/constants";
import { condensingStackFloorC, stackBelowFloorMessage, type OperatingPoint } from "../schemas/plant";
import { InfeasibleChargeError, InputError, NotConvergedError } from "../errors";
import {
  burntFuel,
  heatLossEfficiency,
  netEfficiencyOfAccount,
  prepareLossAccount,
  unburntCarbon_kg_per_kg,
  type EfficiencyConditions,
  type EfficiencyResult,
  type LossAccountBase,
} from "./efficiency";
import type { FuelContext } from "./fuel-context";
/** Fuel temperature at the burner for the flame temperature and the heat balance, K (25 °C reference). */
export const FUEL_TEMPERATURE_K = T298K;

export interface FlameFigures {
  temperatureK: number;
  temperatureC: number;
  method: FlameResult["method"];
  methodLabel: string;
  phi: number;
  /** Solver iterations (equilibrium), for diagnostics. */
  iterations?: number;
}

export interface FuelPerformance {
  fuelKey: string;
  operatingPoint: OperatingPoint;
  oxidizer: Oxidizer;
  lambda: number;
  excessAirPercent: number;
  /**
   * Heat-loss balance per kg of fuel with every term except radiation and casing (that loss is a
   * constant heat flow, so its share depends on the firing rate: see `efficiencyAtUseful` in duty.ts).
   */
  balance: EfficiencyResult;
  /** Equilibrium flame temperature; null when the solver did not converge (see flameError). */
  flame: FlameFigures | null;
  flameError?: string;
  /** Equilibrium solution kept for warm starts of neighbouring states. */
  equilibrium?: EquilibriumResult;
  /** Per MJ of fuel heat input on the net basis. */
  perMJ_net: {
    fuel_kg: number;
    /** Combustion air (humid) at 0 °C, 101.325 kPa, ideal gas. */
    air_m3_normal: number;
    air_kg: number;
    /** Wet flue gas leaving (after any condensation) at 0 °C, 101.325 kPa, ideal gas. */
    flueGasWet_m3_normal: number;
    flueGasDry_m3_normal: number;
    flueGas_kg: number;
    condensate_kg: number;
  };
}

/** Oxidiser of a plant: ambient air with its humidity (the absolute humidity is kept through any preheater). */
export function plantOxidizer(op: OperatingPoint): Oxidizer {
  return humidAir(op.ambientAir.relativeHumidityPercent / 100, op.ambientAir.temperatureC);
}

/**
 * Refuses an operating point the model cannot honour, naming the operating-point field: a
 * condensing unit without its return-water temperature, or with a stack colder than the return
 * water plus the approach.
 */
export function checkOperatingPoint(op: OperatingPoint): void {
  if (!op.condensing) return;
  if (op.returnWaterC === null) throw new InputError("returnWaterC", "a condensing unit needs its return-water temperature");
  if (op.stackTemperatureC < condensingStackFloorC(op.returnWaterC, op.condensingApproachK)) {
    throw new InputError("stackTemperatureC", stackBelowFloorMessage(op.returnWaterC, op.condensingApproachK));
  }
}

export function operatingPointKey(op: OperatingPoint): string {
  return [
    op.stackTemperatureC,
    op.flueO2DryPercent,
    op.combustionAirC,
    op.radiationLossPercent,
    op.condensing ? 1 : 0,
    op.returnWaterC ?? "-",
    op.condensingApproachK,
    op.flueCODryPpm,
    op.unburntCarbonInAshPercent,
    op.ambientAir.temperatureC,
    op.ambientAir.relativeHumidityPercent,
  ].join("|");
}

/** Volume of an ideal gas at temperature T (°C) and 101.325 kPa from its volume at 0 °C. */
export function actualFromNormal_m3(normal_m3: number, temperatureC: number): number {
  return (normal_m3 * celsiusToKelvin(temperatureC)) / T0CK;
}

export class PerformanceCache {
  private readonly memo = new Map<string, FuelPerformance>();
  private readonly oxidizers = new Map<string, Oxidizer>();
  private readonly opKeys = new WeakMap<OperatingPoint, string>();
  hits = 0;
  misses = 0;

  /**
   * Performance of a fuel at an operating point. `warmStart` seeds the equilibrium solver with a
   * neighbouring solution (same element set) when this state is not cached yet.
   */
  get(ctx: FuelContext, op: OperatingPoint, warmStart?: EquilibriumResult): FuelPerformance {
    // An operating point is never changed once made: its key is built once per object (a sweep asks with one object 101 times).
    let opKey = this.opKeys.get(op);
    if (opKey === undefined) {
      opKey = operatingPointKey(op);
      this.opKeys.set(op, opKey);
    }
    const key = `${ctx.key}#${opKey}`;
    const hit = this.memo.get(key);
    if (hit) {
      this.hits++;
      return hit;
    }
    this.misses++;
    const oxKey = `${op.ambientAir.temperatureC}|${op.ambientAir.relativeHumidityPercent}`;
    let ox = this.oxidizers.get(oxKey);
    if (!ox) {
      ox = plantOxidizer(op);
      this.oxidizers.set(oxKey, ox);
    }
    const perf = computePerformance(ctx, op, ox, warmStart);
    this.memo.set(key, perf);
    return perf;
  }

  get size(): number {
    return this.memo.size;
  }
}

/** The heat-loss balance of a fuel at an operating point, radiation and casing apart (that loss is a heat flow: duty.ts). */
function balanceAt(ctx: FuelContext, op: OperatingPoint, lambda: number, oxidizer: Oxidizer): EfficiencyResult {
  return heatLossEfficiency(ctx.fuel, ctx.hv, conditionsAt(op, lambda, oxidizer));
}

/** The heat-loss conditions of an operating point (radiation apart). */
function conditionsAt(op: OperatingPoint, lambda: number, oxidizer: Oxidizer): EfficiencyConditions {
  return {
    lambda,
    oxidizer,
    combustionAirC: op.combustionAirC,
    stackTemperatureC: op.stackTemperatureC,
    radiationLossPercent: 0,
    coDryPpm: op.flueCODryPpm,
    unburntCarbonInAshPercent: op.unburntCarbonInAshPercent,
  };
}

/**
 * The balance of `perf` with the flue gas leaving at another stack temperature: the same fuel, air
 * factor (set by the flue O2) and combustion air, the whole loss account run again (sensible
 * losses, condensation at the new temperature, credits). Refuses, naming `stackTemperatureC`, a
 * stack below a condensing unit's floor.
 */
export function balanceAtStack(ctx: FuelContext, perf: FuelPerformance, stackTemperatureC: number): EfficiencyResult {
  const op: OperatingPoint = { ...perf.operatingPoint, stackTemperatureC };
  checkOperatingPoint(op);
  return balanceAt(ctx, op, perf.lambda, perf.oxidizer);
}

const preparedAccounts = new WeakMap<FuelPerformance, LossAccountBase>();

/**
 * Net efficiency (radiation apart) of `perf` with the flue gas leaving at another stack
 * temperature: `balanceAtStack(…).net.efficiency` to the last digit, with the stack-independent
 * part of the account prepared once per performance (cached by the performance object, which is
 * never changed) — for loops that vary only the stack.
 */
export function netEfficiencyAtStack(ctx: FuelContext, perf: FuelPerformance, stackTemperatureC: number): number {
  const op = perf.operatingPoint;
  if (op.condensing && op.returnWaterC !== null && stackTemperatureC < condensingStackFloorC(op.returnWaterC, op.condensingApproachK))
    checkOperatingPoint({ ...op, stackTemperatureC }); // throws the InputError naming stackTemperatureC
  let b = preparedAccounts.get(perf);
  if (!b) {
    b = prepareLossAccount(ctx.fuel, ctx.hv, conditionsAt(perf.operatingPoint, perf.lambda, perf.oxidizer));
    preparedAccounts.set(perf, b);
  }
  return netEfficiencyOfAccount(b, stackTemperatureC);
}

export function computePerformance(
  ctx: FuelContext,
  op: OperatingPoint,
  oxidizer: Oxidizer,
  warmStart?: EquilibriumResult,
): FuelPerformance {
  checkOperatingPoint(op);
  const fuel = ctx.fuel;
  // The measured flue O2 belongs to the carbon actually burnt.
  const burnt = burntFuel(fuel, unburntCarbon_kg_per_kg(fuel, op.unburntCarbonInAshPercent));
  const lambda = lambdaFromFlueO2Dry(burnt, op.flueO2DryPercent, oxidizer);
  const balance = balanceAt(ctx, op, lambda, oxidizer);
  const canWarm = warmStart !== undefined && fuel.elements_mol_per_kg.S > 0 === warmStart.species.includes("SO2");
  let flame: FlameResult | null = null;
  let flameError: string | undefined;
  try {
    flame = flameTemperature({
      fuel: burnt,
      oxidizer,
      phi: 1 / lambda,
      fuelTemperatureK: FUEL_TEMPERATURE_K,
      oxidizerTemperatureK: celsiusToKelvin(op.combustionAirC),
      method: "equilibrium",
      ...(canWarm ? { warmStart } : {}),
    });
  } catch (e) {
    // Reported, never replaced by a guess: the flame check becomes "not-checked" with this message.
    if (e instanceof NotConvergedError) flameError = `equilibrium flame temperature did not converge: ${e.detail}`;
    else if (e instanceof InfeasibleChargeError) flameError = `no equilibrium flame temperature at this operating point: ${e.detail}`;
    else throw e;
  }
  const demand = oxidizerDemand(fuel, oxidizer);
  const oxidizerKgPerMol = demand.oxidizer_kg_per_kg / demand.oxidizer_mol_per_kg;
  const lhv = ctx.hv.lhv_MJ_per_kg;
  const fuelKgPerMJ = 1 / lhv;
  const fg = balance.flue;
  const leavingWet = balance.wetLeaving_mol_per_kg;
  return {
    fuelKey: ctx.key,
    operatingPoint: op,
    oxidizer,
    lambda,
    excessAirPercent: excessAirPercentFromLambda(lambda),
    balance,
    flame: flame
      ? {
          temperatureK: flame.temperatureK,
          temperatureC: kelvinToCelsius(flame.temperatureK),
          method: flame.method,
          methodLabel: flame.methodLabel,
          phi: flame.phi,
          ...(flame.equilibrium ? { iterations: flame.equilibrium.iterations } : {}),
        }
      : null,
    ...(flameError ? { flameError } : {}),
    ...(flame?.equilibrium ? { equilibrium: flame.equilibrium } : {}),
    perMJ_net: {
      fuel_kg: fuelKgPerMJ,
      air_m3_normal: balance.oxidizer_mol_per_kg * NORMAL_MOLAR_VOLUME_m3_per_mol * fuelKgPerMJ,
      air_kg: balance.oxidizer_mol_per_kg * oxidizerKgPerMol * fuelKgPerMJ,
      flueGasWet_m3_normal: leavingWet * NORMAL_MOLAR_VOLUME_m3_per_mol * fuelKgPerMJ,
      flueGasDry_m3_normal: fg.dry_mol_per_kg * NORMAL_MOLAR_VOLUME_m3_per_mol * fuelKgPerMJ,
      flueGas_kg: (fg.mass_kg_per_kg - balance.condensate_kg_per_kg) * fuelKgPerMJ,
      condensate_kg: balance.condensate_kg_per_kg * fuelKgPerMJ,
    },
  };
}
