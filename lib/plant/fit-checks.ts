/**
 * Fit checks of a candidate fuel against the plant's limits, each pass / warn / fail with the
 * number, the limit and a sentence. A check whose limit is not entered is "not-checked" (the
 * number is still shown); one that does not apply to the fuel is "not-applicable".
 *
 * Warning rule (one for all checks): a value warns once it uses at least
 * `plant.warnAtFractionOfLimit` of its allowance (0.9 = within 10 % of the limit).
 */
import { METERING_REFERENCE_C, type Plant } from "../schemas/plant";
import type { FuelContext } from "./fuel-context";
import type { FuelPerformance } from "./performance";
import type { EfficiencyResult } from "./efficiency";
import type { RatedFlows } from "./duty";
import { flueAcidDewPointC, SO3_CONVERSION_DEFAULT } from "../combustion/flue-gas";
import { meteringLabel } from "../units/metering";

export const CHECK_STATUSES = ["pass", "warn", "fail", "not-checked", "not-applicable"] as const;
export type CheckStatus = (typeof CHECK_STATUSES)[number];

export const FIT_CHECK_IDS = [
  "wobbe-band",
  "wobbe-range",
  "flame-temperature-rise",
  "flue-gas-fan",
  "combustion-air-fan",
  "fuel-supply",
  "stack-dew-point",
  "hydrogen-share",
  "gas-pressure",
  "liquid-flow",
  "liquid-viscosity",
  "untuned-burner",
  "flashback",
  "nox-permit",
  "so2-permit",
] as const;
export type FitCheckId = (typeof FIT_CHECK_IDS)[number];

export const FIT_CHECK_LABELS: Record<FitCheckId, string> = {
  "wobbe-band": "Wobbe index within ± band of baseline",
  "wobbe-range": "Wobbe index within absolute range",
  "flame-temperature-rise": "Flame-temperature rise over baseline (equilibrium)",
  "flue-gas-fan": "Flue-gas volume vs fan capacity",
  "combustion-air-fan": "Combustion air vs fan capacity",
  "fuel-supply": "Fuel volume flow vs supply capacity",
  "stack-dew-point": "Stack temperature vs dew point (water; acid for sulfur fuels)",
  "hydrogen-share": "Hydrogen share vs burner maker's limit",
  "gas-pressure": "Gas pressure needed at the burner vs supply pressure",
  "liquid-flow": "Liquid flow vs liquid-train capacity",
  "liquid-viscosity": "Viscosity at the atomiser vs its range",
  "untuned-burner": "Untuned burner on the day the fuel changes",
  flashback: "Flashback: burning velocity vs baseline (screening estimate)",
  "nox-permit": "NOx vs permit (screening estimate)",
  "so2-permit": "SO2 vs permit (from fuel sulfur)",
};

export interface FitCheck {
  id: FitCheckId;
  label: string;
  status: CheckStatus;
  /** The checked number (null if it cannot be computed for this fuel). */
  value: number | null;
  /**
   * The limit it is checked against: for an absolute range the bound nearest to the value; for a
   * ± band (Wobbe band) its half-width, positive, so that it reads "±5.0 %" for every scenario.
   */
  limit: number | null;
  unit: string;
  /** Share of the allowance used (1 = at the limit), where meaningful. */
  usage: number | null;
  message: string;
  /** Basis / reference conditions of the numbers. */
  basis: string;
}

export interface FuelInPlant {
  ctx: FuelContext;
  perf: FuelPerformance;
  /** Heat-loss balance at rated useful duty (radiation share of that firing rate). */
  rated: EfficiencyResult;
  /** Flows at rated useful duty. */
  flows: RatedFlows;
}

const SEVERITY: Record<CheckStatus, number> = { "not-applicable": 0, "not-checked": 0, pass: 1, warn: 2, fail: 3 };

/** The worst of several statuses (fail > warn > pass > not-checked/not-applicable). */
export function worstStatus(statuses: readonly CheckStatus[]): CheckStatus {
  let worst: CheckStatus = "not-checked";
  for (const s of statuses) if (SEVERITY[s] > SEVERITY[worst]) worst = s;
  return worst;
}

/** Relative tolerance for "at the limit": a blend of exactly 20 vol % meets a 20 vol % limit despite rounding. */
const AT_LIMIT_TOLERANCE = 1e-9;

/** Status of a one-sided "at most" limit. */
export function atMost(value: number, limit: number, warnAt: number): { status: CheckStatus; usage: number } {
  const usage = limit > 0 ? value / limit : value > AT_LIMIT_TOLERANCE ? Infinity : 0;
  return {
    status:
      value > limit + AT_LIMIT_TOLERANCE * Math.max(1, Math.abs(limit)) ? "fail" : usage >= warnAt - AT_LIMIT_TOLERANCE ? "warn" : "pass",
    usage,
  };
}

/**
 * Added to a failing check of the baseline: the plant runs on that fuel today, so the entered limit
 * (or the operating point) is the first thing to check.
 */
const BASELINE_LIMIT_HINT: Partial<Record<FitCheckId, string>> = {
  "flue-gas-fan":
    "the baseline itself exceeds the flue-gas fan capacity, yet the plant runs on it today: check the entered capacity and its basis (actual or normal m³/h)",
  "combustion-air-fan":
    "the baseline itself exceeds the combustion-air fan capacity, yet the plant runs on it today: check the entered capacity and its basis (actual or normal m³/h)",
  "fuel-supply":
    "the baseline itself exceeds the fuel supply capacity, yet the plant runs on it today: check the entered capacity and its metering reference",
  "wobbe-range": "the baseline itself lies outside the entered Wobbe range: check the range and its reference temperatures",
  "hydrogen-share": "the baseline itself exceeds the burner maker's hydrogen limit: check the entered limit",
  "stack-dew-point":
    "the baseline itself runs below its dew point in a non-condensing unit: check the stack temperature and the condensing setting",
};

const fmt = (v: number, d = 1) => (Number.isFinite(v) ? v.toFixed(d) : String(v));
const refLabel = meteringLabel;

export interface FitCheckOptions {
  /** Build the message sentences (default true); sweeps that need only statuses and numbers skip them. */
  messages?: boolean;
  /**
   * The fuel whose flame a candidate's flame temperature is judged against when it is not the
   * baseline's: the reference liquid of a dual-fuel plant's liquid train for liquid candidates.
   */
  flameReference?: { fip: FuelInPlant; label: string };
}

export function fitChecks(plant: Plant, baseline: FuelInPlant, cand: FuelInPlant, options: FitCheckOptions = {}): FitCheck[] {
  const warnAt = plant.warnAtFractionOfLimit;
  const withText = options.messages !== false;
  const out: FitCheck[] = [];
  // Sentences are only built when wanted (sweeps evaluate thousands of checks).
  const T = withText;
  // The baseline is what the plant burns today: a limit it fails is more likely mistyped than real.
  const isBaseline = cand === baseline;
  const push = (c: Omit<FitCheck, "label">) => {
    (c as FitCheck).label = FIT_CHECK_LABELS[c.id];
    if (T && isBaseline && c.status === "fail" && c.limit !== null && BASELINE_LIMIT_HINT[c.id])
      c.message = `${c.message} — ${BASELINE_LIMIT_HINT[c.id]}`;
    out.push(c as FitCheck);
  };

  // --- Wobbe index -------------------------------------------------------------------------
  const tc = plant.wobbeCombustionReferenceC;
  const tm = METERING_REFERENCE_C[plant.wobbeMeteringReference];
  const wBasis = !T ? "" : `gross Wobbe index, combustion ${tc} °C, metering ${refLabel(tm)}, 101.325 kPa (ISO 6976:2016, real gas)`;
  const w = cand.ctx.wobbe(tc, tm);
  const wb = baseline.ctx.wobbe(tc, tm);
  {
    const tol = plant.wobbeTolerancePercent ?? null;
    if (!w || !wb) {
      push({
        id: "wobbe-band",
        status: "not-applicable",
        value: null,
        limit: tol,
        unit: "%",
        usage: null,
        basis: wBasis,
        message: !w ? "not a gaseous fuel: the Wobbe index does not apply" : "the baseline is not a gas: no Wobbe band to compare with",
      });
    } else {
      const shift = (100 * (w.gross_MJ_per_m3 - wb.gross_MJ_per_m3)) / wb.gross_MJ_per_m3;
      if (tol === null) {
        push({
          id: "wobbe-band",
          status: "not-checked",
          value: shift,
          limit: null,
          unit: "%",
          usage: null,
          basis: wBasis,
          message: T ? `Wobbe shift ${fmt(shift, 2)} % versus baseline; no ± band entered for this plant` : "",
        });
      } else {
        const r = atMost(Math.abs(shift), tol, warnAt);
        push({
          id: "wobbe-band",
          status: r.status,
          value: shift,
          limit: tol,
          unit: "%",
          usage: r.usage,
          basis: wBasis,
          message: T
            ? `Wobbe ${fmt(w.gross_MJ_per_m3, 2)} MJ/m³, ${fmt(shift, 2)} % versus baseline ${fmt(wb.gross_MJ_per_m3, 2)} MJ/m³; band ±${fmt(tol, 1)} %`
            : "",
        });
      }
    }
  }
  {
    const lo = plant.wobbeMin_MJ_per_m3 ?? null;
    const hi = plant.wobbeMax_MJ_per_m3 ?? null;
    if (!w) {
      push({
        id: "wobbe-range",
        status: "not-applicable",
        value: null,
        limit: null,
        unit: "MJ/m³",
        usage: null,
        basis: wBasis,
        message: "not a gaseous fuel: the Wobbe index does not apply",
      });
    } else if (lo === null || hi === null) {
      push({
        id: "wobbe-range",
        status: "not-checked",
        value: w.gross_MJ_per_m3,
        limit: null,
        unit: "MJ/m³",
        usage: null,
        basis: wBasis,
        message: T ? `Wobbe ${fmt(w.gross_MJ_per_m3, 2)} MJ/m³; no absolute range entered` : "",
      });
    } else {
      const v = w.gross_MJ_per_m3;
      const mid = (lo + hi) / 2;
      const half = (hi - lo) / 2;
      const usage = Math.abs(v - mid) / half;
      const status: CheckStatus = usage > 1 + AT_LIMIT_TOLERANCE ? "fail" : usage >= warnAt - AT_LIMIT_TOLERANCE ? "warn" : "pass";
      push({
        id: "wobbe-range",
        status,
        value: v,
        limit: v < mid ? lo : hi,
        unit: "MJ/m³",
        usage,
        basis: wBasis,
        message: T ? `Wobbe ${fmt(v, 2)} MJ/m³; range ${fmt(lo, 2)}–${fmt(hi, 2)} MJ/m³` : "",
      });
    }
  }

  // --- Flame temperature -------------------------------------------------------------------
  {
    const ref = options.flameReference;
    const cf = cand.perf.flame;
    const bf = ref ? ref.fip.perf.flame : baseline.perf.flame;
    const refName = ref ? `the liquid train's reference (${ref.label})` : "baseline";
    const lim = plant.maxFlameTempRiseK ?? null;
    const op = cand.perf.operatingPoint;
    if (!cf || !bf) {
      push({
        id: "flame-temperature-rise",
        status: "not-checked",
        value: null,
        limit: lim,
        unit: "K",
        usage: null,
        basis: "chemical equilibrium",
        message: cand.perf.flameError ?? baseline.perf.flameError ?? "no flame temperature",
      });
    } else {
      const rise = cf.temperatureK - bf.temperatureK;
      const basis = !T
        ? ""
        : `adiabatic flame temperature, chemical equilibrium (NASA RP-1311 method), at ${fmt(op.flueO2DryPercent, 1)} % O2 dry and ${op.combustionAirC} °C combustion air, fuel at 25 °C, 101.325 kPa`;
      const text = !T
        ? ""
        : `flame ${fmt(cf.temperatureC, 0)} °C, ${rise >= 0 ? "+" : ""}${fmt(rise, 0)} K versus ${refName} ${fmt(bf.temperatureC, 0)} °C`;
      if (lim === null)
        push({
          id: "flame-temperature-rise",
          status: "not-checked",
          value: rise,
          limit: null,
          unit: "K",
          usage: null,
          basis,
          message: T ? `${text}; no maximum rise entered` : "",
        });
      else {
        const r = rise <= 0 ? { status: "pass" as CheckStatus, usage: 0 } : atMost(rise, lim, warnAt);
        push({
          id: "flame-temperature-rise",
          status: r.status,
          value: rise,
          limit: lim,
          unit: "K",
          usage: r.usage,
          basis,
          message: T ? `${text}; maximum rise ${fmt(lim, 0)} K` : "",
        });
      }
    }
  }

  // --- Fans --------------------------------------------------------------------------------
  const fan = (
    id: "flue-gas-fan" | "combustion-air-fan",
    capacity: number | null | undefined,
    basisKey: "actual" | "normal",
    normal: number,
    actual: number,
    baseNormal: number,
    what: string,
    tempC: number,
  ) => {
    const v = basisKey === "actual" ? actual : normal;
    const change = (100 * (normal - baseNormal)) / baseNormal;
    const basis = !T
      ? ""
      : basisKey === "actual"
        ? `m³/h actual at ${tempC} °C, 101.325 kPa (ideal gas)`
        : "m³/h at 0 °C, 101.325 kPa (ideal gas)";
    const text = !T ? "" : `${what} ${fmt(v, 0)} m³/h at rated duty (${change >= 0 ? "+" : ""}${fmt(change, 1)} % versus baseline)`;
    if (capacity === null || capacity === undefined) {
      push({
        id,
        status: "not-checked",
        value: v,
        limit: null,
        unit: "m³/h",
        usage: null,
        basis,
        message: T ? `${text}; no fan capacity entered` : "",
      });
    } else {
      const r = atMost(v, capacity, warnAt);
      push({
        id,
        status: r.status,
        value: v,
        limit: capacity,
        unit: "m³/h",
        usage: r.usage,
        basis,
        message: T ? `${text}; fan capacity ${fmt(capacity, 0)} m³/h` : "",
      });
    }
  };
  fan(
    "flue-gas-fan",
    plant.flueGasCapacity_m3_per_h,
    plant.flueGasCapacityBasis,
    cand.flows.flueGas_m3_per_h_normal,
    cand.flows.flueGas_m3_per_h_actual,
    baseline.flows.flueGas_m3_per_h_normal,
    "wet flue gas",
    cand.perf.operatingPoint.stackTemperatureC,
  );
  fan(
    "combustion-air-fan",
    plant.airCapacity_m3_per_h,
    plant.airCapacityBasis,
    cand.flows.air_m3_per_h_normal,
    cand.flows.air_m3_per_h_actual,
    baseline.flows.air_m3_per_h_normal,
    "combustion air",
    cand.perf.operatingPoint.combustionAirC,
  );

  // --- Fuel supply -------------------------------------------------------------------------
  {
    const cap = plant.fuelSupplyCapacity_m3_per_h ?? null;
    const v = cand.flows.fuelVolume_per_h;
    const bv = baseline.flows.fuelVolume_per_h;
    const candKind = cand.ctx.fuel.kind;
    const baseKind = baseline.ctx.fuel.kind;
    const train = plant.liquidTrain ?? null;
    if (candKind === "liquid" && train) {
      push({
        id: "fuel-supply",
        status: "not-applicable",
        value: null,
        limit: null,
        unit: "m³/h",
        usage: null,
        basis: "",
        message: "fired on the liquid train: its capacity is the liquid-flow check",
      });
      liquidTrainChecks(train, cand, push, warnAt, T);
    } else if (candKind !== baseKind) {
      push({
        id: "fuel-supply",
        status: "warn",
        value: v?.value ?? null,
        limit: null,
        unit: "m³/h",
        usage: null,
        basis: v?.basis ?? "fuel mass flow",
        message: T
          ? `a ${candKind} fuel in a plant fed with a ${baseKind}: it needs its own fuel train, storage and burner; the supply capacity does not apply`
          : "",
      });
    } else if (!v) {
      push({
        id: "fuel-supply",
        status: "not-applicable",
        value: null,
        limit: cap,
        unit: "m³/h",
        usage: null,
        basis: "fuel mass flow",
        message: T ? `fuel ${fmt(cand.flows.fuel_kg_per_h, 0)} kg/h; no volume for this fuel` : "",
      });
    } else {
      const change = bv ? (100 * (v.value - bv.value)) / bv.value : null;
      const text = !T
        ? ""
        : `fuel ${fmt(v.value, 1)} m³/h at rated duty${change === null ? "" : ` (${change >= 0 ? "+" : ""}${fmt(change, 1)} % versus baseline)`}`;
      if (cap === null)
        push({
          id: "fuel-supply",
          status: "not-checked",
          value: v.value,
          limit: null,
          unit: "m³/h",
          usage: null,
          basis: v.basis,
          message: T ? `${text}; no supply capacity entered` : "",
        });
      else {
        const r = atMost(v.value, cap, warnAt);
        push({
          id: "fuel-supply",
          status: r.status,
          value: v.value,
          limit: cap,
          unit: "m³/h",
          usage: r.usage,
          basis: v.basis,
          message: T ? `${text}; supply capacity ${fmt(cap, 1)} m³/h` : "",
        });
      }
    }
  }

  if (!(cand.ctx.fuel.kind === "liquid" && plant.liquidTrain)) {
    push({
      id: "liquid-flow",
      status: "not-applicable",
      value: null,
      limit: null,
      unit: plant.liquidTrain?.flowUnit ?? "L/h",
      usage: null,
      basis: "",
      message: plant.liquidTrain ? "not a liquid fuel: the liquid train does not apply" : "the plant has no liquid train",
    });
    push({
      id: "liquid-viscosity",
      status: "not-applicable",
      value: null,
      limit: null,
      unit: "mm²/s",
      usage: null,
      basis: "",
      message: plant.liquidTrain ? "not a liquid fuel" : "the plant has no liquid train",
    });
  }

  // --- Stack vs dew point --------------------------------------------------------------------
  {
    const eff = cand.perf.balance;
    const op = cand.perf.operatingPoint;
    const waterDew = eff.dewPointC;
    const sulfur = cand.ctx.fuel.elements_mol_per_kg.S > 0;
    const acidDew = sulfur ? flueAcidDewPointC(eff.flue) : null;
    // A non-condensing unit must stay above the higher of the two dew points.
    const dew = !op.condensing && acidDew !== null && (waterDew === null || acidDew > waterDew) ? acidDew : waterDew;
    const dewName = acidDew !== null && dew === acidDew ? "sulfuric-acid dew point" : "dew point";
    const acid =
      sulfur && dew !== acidDew
        ? `; the fuel contains sulfur: acid dew point about ${acidDew === null ? "–" : fmt(acidDew, 0)} °C, acid condensate where the water condenses`
        : "";
    const basis = sulfur
      ? `water dew point from the water partial pressure (IAPWS-IF97), acid dew point by Verhoff & Banchero (1974) with ${100 * SO3_CONVERSION_DEFAULT} % of SO2 as SO3; 101.325 kPa`
      : "water dew point of the wet flue gas from its water partial pressure (IAPWS-IF97 saturation), 101.325 kPa";
    if (dew === null) {
      push({
        id: "stack-dew-point",
        status: "pass",
        value: null,
        limit: null,
        unit: "K",
        usage: null,
        basis,
        message: "the flue gas holds too little water to condense above 0 °C",
      });
    } else if (op.condensing) {
      const margin = op.stackTemperatureC - dew;
      if (eff.condensed_mol_per_kg > 0) {
        push({
          id: "stack-dew-point",
          status: sulfur ? "warn" : "pass",
          value: margin,
          limit: 0,
          unit: "K",
          usage: null,
          basis,
          message: T
            ? `condensing unit: dew point ${fmt(dew, 1)} °C, ${fmt(100 * eff.condensedFraction, 0)} % of the flue water condenses (flue gas leaving saturated at the ${fmt(eff.condensingTemperatureC ?? 0, 1)} °C stack); condensate drain and neutralisation needed${acid}`
            : "",
        });
      } else {
        push({
          id: "stack-dew-point",
          status: "warn",
          value: margin,
          limit: 0,
          unit: "K",
          usage: null,
          basis,
          message: T
            ? `condensing unit, but the stack is too warm: dew point ${fmt(dew, 1)} °C is below the ${fmt(op.stackTemperatureC, 1)} °C stack, so no condensate heat is recovered`
            : "",
        });
      }
    } else {
      const margin = op.stackTemperatureC - dew;
      const need = plant.dewPointMarginK;
      const status: CheckStatus = margin < 0 ? "fail" : margin < need ? "warn" : "pass";
      push({
        id: "stack-dew-point",
        status,
        value: margin,
        limit: need,
        unit: "K",
        usage: need > 0 ? Math.max(0, (need - margin) / need) : null,
        basis,
        message: !T
          ? ""
          : margin < 0
            ? `stack ${fmt(op.stackTemperatureC, 0)} °C is below the ${dewName} ${fmt(dew, 1)} °C: condensate in a non-condensing unit (corrosion)${acid}`
            : `stack ${fmt(op.stackTemperatureC, 0)} °C is ${fmt(margin, 1)} K above the ${dewName} ${fmt(dew, 1)} °C (margin wanted ${fmt(need, 0)} K)${acid}`,
      });
    }
  }

  // --- Hydrogen share ----------------------------------------------------------------------
  {
    const h2 = cand.ctx.h2SharePercent;
    const lim = plant.maxH2SharePercent ?? null;
    const basis = "mole (= volume, ideal gas) % of hydrogen in the fuel gas";
    if (cand.ctx.fuel.kind !== "gas") {
      push({
        id: "hydrogen-share",
        status: "not-applicable",
        value: 0,
        limit: lim,
        unit: "vol %",
        usage: null,
        basis,
        message: "not a gaseous fuel",
      });
    } else if (h2 <= 0) {
      push({
        id: "hydrogen-share",
        status: "pass",
        value: 0,
        limit: lim,
        unit: "vol %",
        usage: 0,
        basis,
        message: "no hydrogen in the fuel",
      });
    } else if (lim === null) {
      push({
        id: "hydrogen-share",
        status: "warn",
        value: h2,
        limit: null,
        unit: "vol %",
        usage: null,
        basis,
        message: T ? `${fmt(h2, 1)} vol % hydrogen and no burner limit entered: ask the burner maker` : "",
      });
    } else {
      const r = atMost(h2, lim, warnAt);
      push({
        id: "hydrogen-share",
        status: r.status,
        value: h2,
        limit: lim,
        unit: "vol %",
        usage: r.usage,
        basis,
        message: T ? `${fmt(h2, 1)} vol % hydrogen; burner maker's limit ${fmt(lim, 1)} vol %` : "",
      });
    }
  }
  return out;
}

/**
 * Kinematic viscosity at a temperature from one or two stated points: ASTM D341 (Walther),
 * log10 log10(ν + 0.7) = A − B log10 T, through two points; one point serves only within 1 K of it.
 */
export function viscosityAt(
  points: readonly { temperatureC: number; mm2_per_s: number }[] | undefined,
  temperatureC: number,
): number | null {
  if (!points || points.length === 0) return null;
  if (points.length === 1 || points[0].temperatureC === points[1].temperatureC)
    return Math.abs(points[0].temperatureC - temperatureC) <= 1 ? points[0].mm2_per_s : null;
  const ll = (v: number) => Math.log10(Math.log10(v + 0.7));
  const [a, b] = points;
  const ta = Math.log10(a.temperatureC + 273.15);
  const tb = Math.log10(b.temperatureC + 273.15);
  const B = (ll(a.mm2_per_s) - ll(b.mm2_per_s)) / (tb - ta);
  const A = ll(a.mm2_per_s) + B * ta;
  return 10 ** (10 ** (A - B * Math.log10(temperatureC + 273.15))) - 0.7;
}

/** The liquid train's flow and atomiser checks of a liquid candidate. */
function liquidTrainChecks(
  train: NonNullable<Plant["liquidTrain"]>,
  cand: FuelInPlant,
  push: (c: Omit<FitCheck, "label">) => void,
  warnAt: number,
  T: boolean,
): void {
  const kg = cand.flows.fuel_kg_per_h;
  const rho = cand.ctx.fuel.density_kg_per_m3;
  const flow = train.flowUnit === "kg/h" ? kg : rho ? (1000 * kg) / rho : null;
  const flowBasis =
    train.flowUnit === "kg/h" ? "fuel mass flow at rated duty" : "liquid volume flow at rated duty at the fuel's density at 15 °C";
  if (flow === null) {
    push({
      id: "liquid-flow",
      status: "not-checked",
      value: null,
      limit: train.flowCapacity,
      unit: train.flowUnit,
      usage: null,
      basis: flowBasis,
      message: T ? `fuel ${fmt(kg, 0)} kg/h; the fuel states no density, so its flow in L/h is unknown` : "",
    });
  } else {
    const r = atMost(flow, train.flowCapacity, warnAt);
    push({
      id: "liquid-flow",
      status: r.status,
      value: flow,
      limit: train.flowCapacity,
      unit: train.flowUnit,
      usage: r.usage,
      basis: flowBasis,
      message: T
        ? `liquid ${fmt(flow, 0)} ${train.flowUnit} at rated duty; liquid-train capacity ${fmt(train.flowCapacity, 0)} ${train.flowUnit}`
        : "",
    });
  }
  const lo = train.viscosityMin_mm2_per_s ?? null;
  const hi = train.viscosityMax_mm2_per_s ?? null;
  const def = cand.ctx.fuel.kinematicViscosity;
  const nu = viscosityAt(def, train.firingTemperatureC);
  const basis = `kinematic viscosity at the atomiser (${train.firingTemperatureC} °C), ASTM D341 between the fuel's stated points`;
  if (lo === null && hi === null) {
    push({
      id: "liquid-viscosity",
      status: "not-checked",
      value: nu,
      limit: null,
      unit: "mm²/s",
      usage: null,
      basis,
      message: "no viscosity range entered for the atomiser",
    });
  } else if (nu === null) {
    push({
      id: "liquid-viscosity",
      status: "not-checked",
      value: null,
      limit: lo ?? hi,
      unit: "mm²/s",
      usage: null,
      basis,
      message: T
        ? `the fuel states ${def?.length ? "its viscosity at one temperature only" : "no viscosity"}: give it at two temperatures to check the atomiser range ${lo ?? "–"}–${hi ?? "–"} mm²/s`
        : "",
    });
  } else {
    const below = lo !== null && nu < lo;
    const above = hi !== null && nu > hi;
    const nearHi = hi !== null && nu >= warnAt * hi;
    const nearLo = lo !== null && lo >= warnAt * nu;
    const status: CheckStatus = below || above ? "fail" : nearHi || nearLo ? "warn" : "pass";
    push({
      id: "liquid-viscosity",
      status,
      value: nu,
      limit: above || (!below && hi !== null && nu > (lo ?? 0) + (hi - (lo ?? 0)) / 2) ? hi : (lo ?? hi),
      unit: "mm²/s",
      usage: hi !== null ? nu / hi : null,
      basis,
      message: T ? `${fmt(nu, 2)} mm²/s at ${train.firingTemperatureC} °C; atomiser range ${lo ?? "–"}–${hi ?? "–"} mm²/s` : "",
    });
  }
}
