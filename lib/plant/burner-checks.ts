/**
 * The burner in the decision: for one fuel in one plant, the untuned and retuned burner
 * (burner.ts), the flame solve it needs (burner-flame.ts) and, once solved, the burning-velocity
 * ratio to the reference fuel (flashback), the NOx indicator at the permit's reference O2, SO2 from
 * the fuel's sulfur, and the fit checks that judge them. Every emission and flashback figure is a
 * screening estimate: the burner maker's guarantee and a measurement decide.
 *
 * Rules of thumb (common practice, no source): the flashback thresholds' defaults
 * (`FLASHBACK_DEFAULTS` in lib/schemas/burner.ts); a nozzle-mix burner's flame is shown but never
 * fails the scenario on flashback (fuel and air meet at the burner mouth, so a flame cannot run back
 * into a mixture upstream).
 */
import { AIR_CONTROL_LABELS, BURNER_TYPE_LABELS, FLASHBACK_DEFAULTS, type AirControl, type BurnerType } from "../schemas/burner";
import type { Plant } from "../schemas/plant";
import type { Oxidizer } from "../combustion/stoichiometry";
import { lambdaFromFlueO2Dry } from "../combustion/stoichiometry";
import { MOLAR_MASS_g_per_mol } from "../thermo/species-data";
import { atReferenceO2 } from "../units/emissions";
import { T0CK } from "../units/constants";
import { burnerFuel, burnerRisks, burnerShift, UNTUNED_RULES, type BurnerRisk, type BurnerState, type BurnerGas } from "./burner";
import { flameRequestFor, isFlameFailure, noxAtReferenceO2, type FlameLookup, type FlameFigures, type FlameRequest } from "./burner-flame";
import { atMost, type CheckStatus, type FitCheck, type FuelInPlant } from "./fit-checks";

/** Screening label carried by every emission and flashback figure. */
export const BURNER_SCREENING_NOTE =
  "Screening estimates: the burning velocity (flashback) and NOx figures come from an adiabatic laminar premixed flame with GRI-Mech 3.0 and a post-flame plug flow, not from this burner. The burner maker's guarantee, a measurement after commissioning, local codes and licensed engineers decide.";

export const BURNER_CAUTIONS = [
  "A fuel change on a fired unit needs the burner maker's approval and a recommissioning by a competent person: flame monitoring, ignition, purge and the gas-safety authority's rules apply.",
  "Flashback and NOx figures are screening estimates; they do not replace the burner maker's rating or an emission measurement.",
  "An untuned burner on a new gas runs at the air factor its control gives (shown here), not at the set flue O2: retune before, not after, the new fuel arrives.",
];

/**
 * Reference O2 of the emission limits by fuel kind, % dry: 3 % for liquid and gaseous fuels, 6 % for
 * solid fuels (Directive 2010/75/EU, Annex V, Part 1, note 1: combustion plants other than gas
 * turbines and engines).
 */
export const REFERENCE_O2_BY_KIND = Object.freeze({ gas: 3, liquid: 3, solid: 6 });

export interface BurnerSetting {
  described: boolean;
  type: BurnerType | null;
  typeLabel: string;
  airControl: AirControl;
  airControlLabel: string;
  regulatedSupply: boolean;
  flashbackWarnRatio: number;
  flashbackFailRatio: number;
}

export function burnerSettingOf(plant: Plant): BurnerSetting {
  const b = plant.burner ?? null;
  return {
    described: b !== null,
    type: b?.type ?? null,
    typeLabel: b ? BURNER_TYPE_LABELS[b.type] : "not described",
    airControl: b?.airControl ?? "fixed-linkage",
    airControlLabel: b ? AIR_CONTROL_LABELS[b.airControl] : `${AIR_CONTROL_LABELS["fixed-linkage"]} (assumed: no burner described)`,
    regulatedSupply: b?.regulatedSupply ?? true,
    flashbackWarnRatio: b?.flashbackWarnRatio ?? FLASHBACK_DEFAULTS.warnRatio,
    flashbackFailRatio: b?.flashbackFailRatio ?? FLASHBACK_DEFAULTS.failRatio,
  };
}

/** The burner part of a scenario's result (the interface `stoke evaluate` prints). */
export interface BurnerResult {
  setting: BurnerSetting;
  /** Air factor at which the burner was set up on the reference fuel (from its flue O2). */
  setupLambda: number;
  /** The fuel the burner was set up on: the baseline, or the liquid train's reference liquid. */
  referenceLabel: string;
  untuned: BurnerState | null;
  retuned: BurnerState | null;
  risks: { risk: BurnerRisk; text: string }[];
  /** Air factor of the flame solve: the lower of the untuned and retuned ones (the more reactive mixture). */
  flameLambda: number | null;
  flame: {
    status: "solved" | "pending" | "failed" | "not-applicable";
    key: string | null;
    reason: string | null;
    figures: FlameFigures | null;
  };
  burningVelocity_cm_per_s: number | null;
  burningVelocityRatio: number | null;
  nox: {
    /** The flame engine's post-flame indicator (adiabatic: an upper bound of thermal and prompt NO). */
    mg_per_m3_dry_at_ref_O2: number | null;
    referenceO2Percent: number;
    ratioToBaseline: number | null;
    /** The plant's measured baseline NOx × the ratio, when a measurement is entered. */
    scaledFromMeasured_mg_per_m3: number | null;
    /** The figure the permit check uses and how it was found. */
    estimate_mg_per_m3: number | null;
    estimateBasis: string;
  };
  so2: { mg_per_m3_dry_at_ref_O2: number | null; referenceO2Percent: number };
  /** The fuel carries bound nitrogen (ammonia, heavy fuel oil …): fuel NOx is not in the indicator. */
  fuelBoundNitrogen: boolean;
  notes: string[];
  screening: string;
}

export interface BurnerInputs {
  plant: Plant;
  /** The fuel the burner was set up on and its performance (flue O2, oxidiser). */
  reference: FuelInPlant;
  referenceLabel: string;
  cand: FuelInPlant;
  /** Flame figures of the baseline (for ratios); undefined while unsolved. */
  baselineFlame: FlameFigures | null;
  flames: FlameLookup | undefined;
  /** Only the untuned air factor and heat input (no flame temperatures, no flame request): sweep points between the flame shares. */
  light?: boolean;
}

const gasView = (f: FuelInPlant, plant: Plant): BurnerGas | null =>
  burnerFuel(f.ctx.fuel, f.ctx.wobbe(plant.wobbeCombustionReferenceC, 15), f.ctx.hv.lhv_MJ_per_kg);

export function fuelHasBoundNitrogen(f: FuelInPlant): boolean {
  const fuel = f.ctx.fuel;
  if (fuel.kind === "gas") return (fuel.gasComposition?.NH3 ?? 0) > 0;
  return fuel.elements_mol_per_kg.N > 0;
}

/** SO2 from all the fuel's sulfur, mg/m³ dry (0 °C, 101.325 kPa) at the reference O2. */
export function so2AtReferenceO2(f: FuelInPlant, referenceO2Percent: number): number {
  const flue = f.perf.balance.flue;
  const mg_per_m3 = (1000 * flue.mol_per_kg.SO2 * MOLAR_MASS_g_per_mol.SO2) / flue.dry_m3_per_kg;
  return atReferenceO2(mg_per_m3, 100 * flue.dryMoleFractions.O2, referenceO2Percent);
}

/** The flame solve a fuel in a plant needs (or why none applies), before any lookup. */
export function burnerFlameRequest(inp: Omit<BurnerInputs, "baselineFlame" | "flames">): {
  req: FlameRequest | { unknown: string };
  shift: ReturnType<typeof burnerShift> | null;
  setupLambda: number;
  flameLambda: number | null;
  notes: string[];
} {
  const { plant, reference, cand } = inp;
  const setting = burnerSettingOf(plant);
  const oxidizer: Oxidizer = reference.perf.oxidizer;
  const setupO2 = reference.perf.operatingPoint.flueO2DryPercent;
  const setupLambda = lambdaFromFlueO2Dry(reference.ctx.fuel, setupO2, oxidizer);
  const b = gasView(reference, plant);
  const c = gasView(cand, plant);
  const notes: string[] = [];
  let shift: ReturnType<typeof burnerShift> | null = null;
  if (b && c && b.fuel.kind === c.fuel.kind) {
    shift = burnerShift({
      baseline: b,
      candidate: c,
      airControl: setting.airControl,
      regulatedSupply: setting.regulatedSupply,
      setupFlueO2DryPercent: setupO2,
      oxidizer,
      oxidizerTemperatureK: cand.perf.operatingPoint.combustionAirC + T0CK,
      flameTemperatures: inp.light !== true,
    });
    notes.push(...shift.notes);
  } else {
    notes.push(
      !c
        ? "untuned burner: not computed for this fuel (a gas, or a liquid with a stated density, is needed)"
        : "untuned burner: the fuel goes to another fuel train than the one the burner was set up on",
    );
  }
  const flameLambda = shift ? Math.min(shift.untuned.lambda, shift.retuned.lambda) : cand.perf.lambda;
  if (flameLambda < 1) {
    return {
      req: { unknown: "the untuned air factor is below 1: no lean premixed flame to compare" },
      shift,
      setupLambda,
      flameLambda,
      notes,
    };
  }
  if (inp.light) return { req: { unknown: "no flame solve at this point" }, shift, setupLambda, flameLambda, notes };
  const req = flameRequestFor(cand.ctx.fuel, flameLambda, cand.perf.operatingPoint.combustionAirC + T0CK, oxidizer);
  return { req, shift, setupLambda, flameLambda, notes };
}

/** The burner figures of a fuel in the plant, with whatever flame solves the lookup holds. */
export function burnerResult(inp: BurnerInputs): BurnerResult {
  const { plant, cand } = inp;
  const setting = burnerSettingOf(plant);
  const pre = burnerFlameRequest(inp);
  const notes = [...pre.notes];
  const refO2 = plant.noxReferenceO2Percent ?? REFERENCE_O2_BY_KIND[cand.ctx.fuel.kind];
  let flame: BurnerResult["flame"];
  if ("unknown" in pre.req) flame = { status: "not-applicable", key: null, reason: pre.req.unknown, figures: null };
  else {
    notes.push(...pre.req.notes);
    const o = inp.flames?.get(pre.req.key);
    if (o === undefined) flame = { status: "pending", key: pre.req.key, reason: "flame solve not computed yet", figures: null };
    else if (isFlameFailure(o)) flame = { status: "failed", key: pre.req.key, reason: o.error, figures: null };
    else flame = { status: "solved", key: pre.req.key, reason: null, figures: o };
  }
  const fig = flame.figures;
  const base = inp.baselineFlame;
  const sl = fig ? fig.burningVelocity_cm_per_s : null;
  const nox = fig ? noxAtReferenceO2(fig, refO2) : null;
  const noxBase = base ? noxAtReferenceO2(base, refO2) : null;
  const ratio = sl !== null && base ? sl / base.burningVelocity_cm_per_s : null;
  const noxRatio = nox !== null && noxBase !== null && noxBase > 0 ? nox / noxBase : null;
  const measured = plant.noxMeasuredBaseline_mg_per_m3 ?? null;
  const scaled = measured !== null && noxRatio !== null ? measured * noxRatio : null;
  const boundN = fuelHasBoundNitrogen(cand);
  return {
    setting,
    setupLambda: pre.setupLambda,
    referenceLabel: inp.referenceLabel,
    untuned: pre.shift?.untuned ?? null,
    retuned: pre.shift?.retuned ?? null,
    risks: pre.shift ? burnerRisks(pre.shift, pre.setupLambda) : [],
    flameLambda: pre.flameLambda,
    flame,
    burningVelocity_cm_per_s: sl,
    burningVelocityRatio: ratio,
    nox: {
      mg_per_m3_dry_at_ref_O2: nox,
      referenceO2Percent: refO2,
      ratioToBaseline: noxRatio,
      scaledFromMeasured_mg_per_m3: scaled,
      estimate_mg_per_m3: scaled ?? nox,
      estimateBasis:
        scaled !== null
          ? `the plant's measured ${measured} mg/m³ on the baseline × the indicator's ratio ${noxRatio?.toFixed(3)} to the baseline`
          : nox !== null
            ? `post-flame NO + NO2 of the adiabatic flame after ${fig?.residenceMs} ms (no heat extraction: an upper bound of thermal and prompt NO; enter a measured baseline NOx to scale from it)`
            : "unknown",
    },
    so2: { mg_per_m3_dry_at_ref_O2: so2AtReferenceO2(cand, refO2), referenceO2Percent: refO2 },
    fuelBoundNitrogen: boundN,
    notes,
    screening: BURNER_SCREENING_NOTE,
  };
}

const fmt = (v: number, d = 1) => (Number.isFinite(v) ? v.toFixed(d) : String(v));

/** The burner's fit checks: gas pressure, untuned burner, flashback, NOx and SO2 against the permit. */
export function burnerChecks(
  plant: Plant,
  reference: FuelInPlant,
  cand: FuelInPlant,
  r: BurnerResult,
  options: { messages?: boolean } = {},
): FitCheck[] {
  const T = options.messages !== false;
  const warnAt = plant.warnAtFractionOfLimit;
  const out: FitCheck[] = [];
  const push = (c: FitCheck) => out.push(c);
  const s = r.setting;

  // --- gas pressure at the burner -----------------------------------------------------------
  {
    const pb = plant.gasBurnerPressure_kPa ?? null;
    const ps = plant.gasSupplyPressure_kPa ?? null;
    const wc = cand.ctx.wobbe(plant.wobbeCombustionReferenceC, 15);
    const wb = reference.ctx.wobbe(plant.wobbeCombustionReferenceC, 15);
    const basis = "burner pressure for the rated heat input through the same orifice: p × (W_ref / W)², net Wobbe index (orifice equation)";
    const label = "Gas pressure needed at the burner vs supply pressure";
    if (!wc || !wb) {
      push({
        id: "gas-pressure",
        label,
        status: "not-applicable",
        value: null,
        limit: ps,
        unit: "kPa",
        usage: null,
        basis,
        message: "not a gas",
      });
    } else if (pb === null) {
      push({
        id: "gas-pressure",
        label,
        status: "not-checked",
        value: null,
        limit: ps,
        unit: "kPa",
        usage: null,
        basis,
        message: "no burner gas pressure entered for the baseline gas",
      });
    } else {
      const need = pb * (wb.net_MJ_per_m3 / wc.net_MJ_per_m3) ** 2;
      const r2 = ps === null ? null : atMost(need, ps, warnAt);
      push({
        id: "gas-pressure",
        label,
        status: r2?.status ?? "not-checked",
        value: need,
        limit: ps,
        unit: "kPa",
        usage: r2?.usage ?? null,
        basis,
        message: T
          ? `${fmt(need, 2)} kPa needed at the burner (${fmt(pb, 2)} kPa on the baseline)${ps === null ? "; no supply pressure entered" : `; supply ${fmt(ps, 2)} kPa`}`
          : "",
      });
    }
  }

  // --- the untuned burner ---------------------------------------------------------------------
  {
    const u = r.untuned;
    const label = "Untuned burner on the day the fuel changes";
    const basis = `${s.airControlLabel}; ${s.regulatedSupply ? "regulated" : "unregulated"} supply; set up at λ ${fmt(r.setupLambda, 3)} on ${r.referenceLabel}`;
    if (!u) {
      push({
        id: "untuned-burner",
        label,
        status: "not-applicable",
        value: null,
        limit: null,
        unit: "λ",
        usage: null,
        basis,
        message: r.notes[0] ?? "",
      });
    } else {
      const status: CheckStatus = r.risks.length ? "warn" : "pass";
      push({
        id: "untuned-burner",
        label,
        status,
        value: u.lambda,
        // the lean blow-off bound; the other rules (λ < 1.05, heat input ±5 %) are named in the message
        limit: UNTUNED_RULES.leanBlowOffFactor * r.setupLambda,
        unit: "λ",
        usage: null,
        basis: `${basis}; rules of thumb (common practice, no source): λ below ${UNTUNED_RULES.coLambda} forms CO, λ above ${UNTUNED_RULES.leanBlowOffFactor} × the set-up value risks lean blow-off, heat input beyond ±${UNTUNED_RULES.heatInputPercent} % derates or overfires`,
        message: T
          ? `untuned λ ${fmt(u.lambda, 3)} (flue O2 ${fmt(u.flueO2DryPercent, 2)} %), heat input ${u.heatInputChangePercent === null ? "unknown (unregulated supply)" : `${u.heatInputChangePercent >= 0 ? "+" : ""}${fmt(u.heatInputChangePercent, 1)} %`} until retuned${r.risks.length ? `: ${r.risks.map((x) => x.text).join("; ")}` : ""}`
          : "",
      });
    }
  }

  // --- flashback ------------------------------------------------------------------------------
  {
    const label = "Flashback: burning velocity vs baseline (screening estimate)";
    const ratio = r.burningVelocityRatio;
    const basis = `laminar burning velocity (GRI-Mech 3.0, 1D adiabatic flame) at λ ${r.flameLambda === null ? "–" : fmt(r.flameLambda, 3)} and the combustion-air temperature, as a ratio to ${r.referenceLabel}'s; warn from ${fmt(s.flashbackWarnRatio, 2)}, fail from ${fmt(s.flashbackFailRatio, 2)} (${s.described && plant.burner ? "the plant's thresholds" : "rules of thumb, common practice, no source"}); screening estimate`;
    const lim = s.flashbackFailRatio;
    const why =
      r.flame.status === "pending"
        ? "flame solve pending: the figure follows when the background solve finishes"
        : r.flame.status === "solved"
          ? "the baseline's flame solve is pending or failed: no ratio yet"
          : (r.flame.reason ?? "unknown");
    if (cand.ctx.fuel.kind !== "gas") {
      push({
        id: "flashback",
        label,
        status: "not-applicable",
        value: null,
        limit: lim,
        unit: "×",
        usage: null,
        basis,
        message: "not a premixed gas flame",
      });
    } else if (ratio === null) {
      push({ id: "flashback", label, status: "not-checked", value: null, limit: lim, unit: "×", usage: null, basis, message: why });
    } else if (s.type === "nozzle-mix" || s.type === null) {
      push({
        id: "flashback",
        label,
        status: "not-checked",
        value: ratio,
        limit: lim,
        unit: "×",
        usage: null,
        basis,
        message: T
          ? `burning velocity ${fmt(r.burningVelocity_cm_per_s ?? Number.NaN, 1)} cm/s, ${fmt(ratio, 2)} × the reference; ${s.type === null ? "no burner type entered: describe the burner to judge flashback" : "nozzle-mix burner: shown for information, it does not fail the scenario"}`
          : "",
      });
    } else {
      const status: CheckStatus = ratio >= s.flashbackFailRatio ? "fail" : ratio >= s.flashbackWarnRatio ? "warn" : "pass";
      push({
        id: "flashback",
        label,
        status,
        value: ratio,
        limit: status === "pass" ? s.flashbackWarnRatio : lim,
        unit: "×",
        usage: ratio / lim,
        basis,
        message: T
          ? `burning velocity ${fmt(r.burningVelocity_cm_per_s ?? Number.NaN, 1)} cm/s, ${fmt(ratio, 2)} × the reference (${s.typeLabel} burner: warn from ${fmt(s.flashbackWarnRatio, 2)} ×, fail from ${fmt(lim, 2)} ×); screening estimate, the burner maker decides`
          : "",
      });
    }
  }

  // --- NOx against the permit ------------------------------------------------------------------
  {
    const label = "NOx vs permit (screening estimate)";
    const lim = plant.noxLimit_mg_per_m3 ?? null;
    const est = r.nox.estimate_mg_per_m3;
    const basis = `NOx as NO2, mg/m³ dry at 0 °C, 101.325 kPa and ${fmt(r.nox.referenceO2Percent, 0)} % O2 (reference conditions of Directive 2010/75/EU, Annex V): ${r.nox.estimateBasis}; screening estimate`;
    const fuelN = r.fuelBoundNitrogen
      ? "; the fuel carries bound nitrogen (fuel NOx), which the flame indicator does not cover: expect more, ask the burner maker"
      : "";
    if (est === null) {
      push({
        id: "nox-permit",
        label,
        status: r.fuelBoundNitrogen ? "warn" : "not-checked",
        value: null,
        limit: lim,
        unit: "mg/m³",
        usage: null,
        basis,
        message: `${cand.ctx.fuel.kind !== "gas" ? "no NOx indicator for a spray or bed flame" : r.flame.status === "pending" ? "flame solve pending" : (r.flame.reason ?? "NOx indicator unknown")}${fuelN}`,
      });
    } else if (lim === null) {
      push({
        id: "nox-permit",
        label,
        status: r.fuelBoundNitrogen ? "warn" : "not-checked",
        value: est,
        limit: null,
        unit: "mg/m³",
        usage: null,
        basis,
        message: T ? `NOx about ${fmt(est, 0)} mg/m³; no permit limit entered${fuelN}` : "",
      });
    } else {
      const a = atMost(est, lim, warnAt);
      const status: CheckStatus = a.status === "pass" && r.fuelBoundNitrogen ? "warn" : a.status;
      push({
        id: "nox-permit",
        label,
        status,
        value: est,
        limit: lim,
        unit: "mg/m³",
        usage: a.usage,
        basis,
        message: T
          ? `NOx about ${fmt(est, 0)} mg/m³ against the permit's ${fmt(lim, 0)} mg/m³${fuelN}; screening estimate, a measurement decides`
          : "",
      });
    }
  }

  // --- SO2 -------------------------------------------------------------------------------------
  {
    const label = "SO2 vs permit (from fuel sulfur)";
    const lim = plant.so2Limit_mg_per_m3 ?? null;
    const v = r.so2.mg_per_m3_dry_at_ref_O2;
    const basis = `all fuel sulfur as SO2, mg/m³ dry at 0 °C, 101.325 kPa and ${fmt(r.so2.referenceO2Percent, 0)} % O2 (no capture); screening estimate`;
    if (v === null || !Number.isFinite(v)) {
      push({
        id: "so2-permit",
        label,
        status: "not-checked",
        value: null,
        limit: lim,
        unit: "mg/m³",
        usage: null,
        basis,
        message: "SO2 unknown",
      });
    } else if (lim === null) {
      push({
        id: "so2-permit",
        label,
        status: "not-checked",
        value: v,
        limit: null,
        unit: "mg/m³",
        usage: null,
        basis,
        message: T ? `SO2 ${fmt(v, 0)} mg/m³; no permit limit entered` : "",
      });
    } else {
      const a = atMost(v, lim, warnAt);
      push({
        id: "so2-permit",
        label,
        status: a.status,
        value: v,
        limit: lim,
        unit: "mg/m³",
        usage: a.usage,
        basis,
        message: T ? `SO2 ${fmt(v, 0)} mg/m³ against the permit's ${fmt(lim, 0)} mg/m³` : "",
      });
    }
  }
  return out;
}
