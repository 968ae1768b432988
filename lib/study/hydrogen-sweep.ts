/**
 * Hydrogen-share sweep: the baseline gas blended with hydrogen from 0 to 100 vol % in fixed steps,
 * evaluated in the study's plant at its operating point — Wobbe index, flame temperature
 * (equilibrium, warm-started from the previous point), efficiency, CO2 per useful MJ, fuel volume
 * flow, flue-gas and air flow and cost per useful MWh — with the first share at which each plant
 * limit warns and fails.
 */
import type { FuelDefinition } from "../schemas/fuel";
import { METERING_REFERENCE_C, operatingPointOf, type Plant } from "../schemas/plant";
import type { Study } from "../schemas/study";
import type { FuelContext } from "../plant/fuel-context";
import { blendOfResolved, resolveFuel, type ResolvedFuel } from "../fuels/resolve";
import { efficiencyAtUseful, flowsForUseful, type PlantDuty } from "../plant/duty";
import {
  FIT_CHECK_IDS,
  FIT_CHECK_LABELS,
  fitChecks,
  worstStatus,
  type CheckStatus,
  type FitCheckId,
  type FuelInPlant,
} from "../plant/fit-checks";
import { normalisePrice, type NormalisedPrice } from "../economics/prices";
import { scenarioCosts, type CostInputs, type FinanceAssumptions } from "../economics/costs";
import type { EquilibriumResult } from "../combustion/equilibrium";
import type { EvaluationCaches } from "./caches";
import { StudyInputError } from "./errors";
import { normaliseStudyPrice } from "./pricing";
import { METERING_REFERENCES, meteringLabelWithPressure } from "../units/metering";
import { burnerChecks, burnerResult, burnerSettingOf, type BurnerResult } from "../plant/burner-checks";
import type { FlameFigures, FlameLookup } from "../plant/burner-flame";

export interface SweepPoint {
  h2Percent: number;
  /** Hydrogen's share of the fuel energy on the net basis, %. */
  h2EnergySharePercent: number;
  wobbeGross_MJ_per_m3: number | null;
  wobbeShiftPercent: number | null;
  /** null where the equilibrium solver did not converge (never a guessed number). */
  flameTemperatureC: number | null;
  flameShiftK: number | null;
  efficiencyNet: number;
  efficiencyGross: number;
  dewPointC: number | null;
  /** g CO2 per useful MJ (fossil, plus upstream when the study includes it); null when counted upstream CO2e is unknown. */
  co2PerUsefulMJ_g: number | null;
  /** Change against the baseline gas, %; null where either figure is unknown or the baseline emits none. */
  co2ChangePercent: number | null;
  /** Gas volume flow at rated duty at the plant's supply metering reference, m³/h; null where it has no gas volume. */
  fuelVolume_m3_per_h: number | null;
  /** Flue-gas and air flow at rated duty on the plant's fan bases, m³/h. */
  flueGas_m3_per_h: number;
  air_m3_per_h: number;
  costPerUsefulMWh: number | null;
  /** The untuned burner at this share (air control and supply of the plant's burner). */
  untunedLambda: number | null;
  untunedHeatInputChangePercent: number | null;
  /** Flame figures: at the flame shares only (every `flameStepPercent`), null elsewhere and while unsolved. */
  burningVelocityRatio: number | null;
  burningVelocity_cm_per_s: number | null;
  /** NOx estimate (the permit check's figure) and the indicator's ratio to the baseline gas. */
  nox_mg_per_m3: number | null;
  noxRatio: number | null;
  /** A flame solve belongs to this share. */
  flamePoint: boolean;
  statuses: Record<FitCheckId, CheckStatus>;
  worst: CheckStatus;
}

export interface SweepCrossing {
  checkId: FitCheckId;
  label: string;
  /** First hydrogen share (vol %) at which the check warns or fails; null if never within 0–100 %. */
  firstWarnPercent: number | null;
  firstFailPercent: number | null;
  /** Status at 0 % hydrogen (a limit may already be exceeded by the baseline gas). */
  statusAtZero: CheckStatus;
  /** Found by linear interpolation between the flame shares (flashback and NOx). */
  interpolated?: boolean;
}

export interface SweepLimitLines {
  wobbeBand_MJ_per_m3: { min: number; max: number } | null;
  wobbeRange_MJ_per_m3: { min: number; max: number } | null;
  maxFlameTemperatureC: number | null;
  flueGasCapacity_m3_per_h: number | null;
  airCapacity_m3_per_h: number | null;
  fuelSupplyCapacity_m3_per_h: number | null;
  maxH2SharePercent: number | null;
  /** Flashback thresholds (premixed and partially premixed burners) and the NOx permit limit. */
  flashbackWarnRatio: number | null;
  flashbackFailRatio: number | null;
  noxLimit_mg_per_m3: number | null;
}

export interface HydrogenSweepResult {
  available: boolean;
  /** Why the sweep is not available (e.g. the baseline is not a gas). */
  reason?: string;
  baseGasLabel: string;
  hydrogenLabel: string;
  stepPercent: number;
  points: SweepPoint[];
  crossings: SweepCrossing[];
  limitLines: SweepLimitLines | null;
  basis: { wobbe: string; flame: string; volumes: string; cost: string; burner: string };
  /** Flame solves of the sweep: shares, and how many are solved. */
  flames: { stepPercent: number; shares: number[]; solved: number };
  notes: string[];
}

export interface SweepEnvironment {
  study: Study;
  plant: Plant;
  duty: PlantDuty;
  caches: EvaluationCaches;
  baseline: { definition: FuelDefinition; fip: FuelInPlant; price: NormalisedPrice | null; costInputs: CostInputs | null };
  scenarios: { ctx: FuelContext; price: NormalisedPrice | null }[];
  fin: FinanceAssumptions;
  flames?: FlameLookup;
  /** Registers a flame solve the sweep needs (key, where it is used). */
  needFlame?: (b: BurnerResult, usedBy: string) => void;
  /** The baseline gas's flame figures (ratios), null while unsolved. */
  baselineFlame: FlameFigures | null;
}

export function sweepShares(stepPercent: number): number[] {
  const n = Math.round(100 / stepPercent);
  const out: number[] = [];
  for (let i = 0; i <= n; i++) out.push(Math.min(100, Math.round(i * stepPercent * 1e6) / 1e6));
  if (out[out.length - 1] !== 100) out.push(100);
  return out;
}

export function hydrogenSweep(env: SweepEnvironment): HydrogenSweepResult {
  const { study, plant, duty, caches } = env;
  const cfg = study.hydrogenSweep;
  const baseCtx = env.baseline.fip.ctx;
  const basis = {
    wobbe: `gross Wobbe index, combustion ${plant.wobbeCombustionReferenceC} °C, metering ${meteringLabelWithPressure(METERING_REFERENCES[plant.wobbeMeteringReference].temperatureC)} (ISO 6976:2016)`,
    flame: "adiabatic flame temperature, chemical equilibrium at the plant's flue O2 and combustion-air temperature",
    volumes: `at rated useful duty: fuel gas at ${meteringLabelWithPressure(METERING_REFERENCES[plant.fuelSupplyMeteringReference].temperatureC)} (real gas); flue gas and air on the fans' ${plant.flueGasCapacityBasis}/${plant.airCapacityBasis} basis`,
    cost: "fuel + carbon (+ upstream when included) per MWh of useful heat",
    burner: `untuned burner: ${burnerSettingOf(plant).airControlLabel}; burning velocity and NOx indicator from flame solves every ${cfg.flameStepPercent} % hydrogen (first crossings between them interpolated linearly); screening estimates`,
  };
  const empty = (reason: string): HydrogenSweepResult => ({
    available: false,
    reason,
    baseGasLabel: baseCtx.label,
    hydrogenLabel: "hydrogen",
    stepPercent: cfg.stepPercent,
    points: [],
    crossings: [],
    limitLines: null,
    basis,
    flames: { stepPercent: cfg.flameStepPercent, shares: [], solved: 0 },
    notes: [],
  });
  if (baseCtx.fuel.kind !== "gas" || !baseCtx.fuel.molarMass_g_per_mol)
    return empty("the baseline fuel is not a gas: no hydrogen blending");
  const h2Ctx = caches.fuels.fromDefinition(cfg.hydrogen, "hydrogenSweep.hydrogen");
  if (h2Ctx.fuel.kind !== "gas" || !h2Ctx.fuel.molarMass_g_per_mol) throw new StudyInputError("hydrogenSweep.hydrogen", "must be a gas");
  const notes: string[] = [];

  // Prices per kg delivered (for mass-weighted blend prices).
  let h2Price: NormalisedPrice | null = cfg.hydrogenPrice
    ? normaliseStudyPrice(cfg.hydrogenPrice, h2Ctx, "hydrogenSweep.hydrogenPrice")
    : null;
  if (!h2Price) {
    const s = env.scenarios.find((x) => x.ctx.key === h2Ctx.key && x.price);
    if (s) {
      h2Price = s.price;
      notes.push("hydrogen priced at the quote of the scenario that burns pure hydrogen");
    }
  }
  const basePrice = env.baseline.price;
  if (!basePrice || !h2Price) notes.push("no cost line: the sweep needs a price for the baseline gas and for hydrogen");

  const op = operatingPointOf(plant, {});
  const baseFip = env.baseline.fip;
  const tmW = METERING_REFERENCE_C[plant.wobbeMeteringReference];
  const wb = baseCtx.wobbe(plant.wobbeCombustionReferenceC, tmW);
  const Mb = baseCtx.fuel.molarMass_g_per_mol;
  const Mh = h2Ctx.fuel.molarMass_g_per_mol;
  /** Ranked CO2 per GJ of fuel (net): fossil, plus upstream when counted; null when counted but unknown (no factor stated). */
  const rankedCo2PerGJ = (c: FuelContext): number | null => {
    if (!study.includeUpstream) return c.co2.fossil_kg_per_GJ_lhv;
    const up = c.co2.upstreamCo2e_kg_per_GJ_lhv;
    return up === undefined || up === null ? null : c.co2.fossil_kg_per_GJ_lhv + up;
  };
  const baseRanked = rankedCo2PerGJ(baseCtx);
  const baseCo2 = baseRanked === null ? null : baseRanked / efficiencyAtUseful(baseFip.perf, duty, duty.averageUseful_kW).net.efficiency;

  // The two components, resolved once for all shares (as resolveFuel would resolve them inside each blend).
  let resolved: { base: ResolvedFuel; hydrogen: ResolvedFuel } | null = null;
  const components = () =>
    (resolved ??= {
      base: resolveFuel(env.baseline.definition, "hydrogenSweep.blend.0.fuel"),
      hydrogen: resolveFuel(cfg.hydrogen, "hydrogenSweep.blend.1.fuel"),
    });
  const flameShares = new Set(sweepShares(cfg.flameStepPercent));
  let flamesSolved = 0;
  const points: SweepPoint[] = [];
  let warm: EquilibriumResult | undefined = baseFip.perf.equilibrium;
  for (const share of sweepShares(cfg.stepPercent)) {
    const x = share / 100;
    const ctx =
      share === 0
        ? baseCtx
        : share === 100
          ? h2Ctx
          : caches.fuels.fromKeyedResolved(`h2-sweep:${baseCtx.key}:${h2Ctx.key}:${share}`, () =>
              blendOfResolved(
                [
                  { f: components().base, share: 1 - x },
                  { f: components().hydrogen, share: x },
                ],
                "volume",
                "blend",
                "hydrogenSweep",
              ),
            );
    const perf = caches.performance.get(ctx, op, warm);
    if (perf.equilibrium) warm = perf.equilibrium;
    const rated = efficiencyAtUseful(perf, duty, duty.ratedUseful_kW);
    const annual = efficiencyAtUseful(perf, duty, duty.averageUseful_kW);
    const fip: FuelInPlant = { ctx, perf, rated, flows: flowsForUseful(plant, ctx, perf, rated, duty.ratedUseful_kW) };
    const flamePoint = flameShares.has(share);
    const burner = burnerResult({
      plant,
      reference: baseFip,
      referenceLabel: "the baseline gas",
      cand: fip,
      baselineFlame: env.baselineFlame,
      flames: flamePoint ? env.flames : undefined,
      light: !flamePoint,
    });
    if (flamePoint) {
      env.needFlame?.(burner, `hydrogenSweep.${share}`);
      if (burner.flame.status === "solved") flamesSolved++;
    }
    const checks = [
      ...fitChecks(plant, baseFip, fip, { messages: false }),
      ...burnerChecks(plant, baseFip, fip, burner, { messages: false }),
    ];
    const statuses = {} as Record<FitCheckId, CheckStatus>;
    for (const c of checks) statuses[c.id] = c.status;
    const w = ctx.wobbe(plant.wobbeCombustionReferenceC, tmW);
    const wH2 = (x * Mh) / (x * Mh + (1 - x) * Mb); // mass fraction of hydrogen
    const etaN = annual.net.efficiency;
    const ranked = rankedCo2PerGJ(ctx);
    const co2 = ranked === null ? null : ranked / etaN;
    let cost: number | null = null;
    if (basePrice && h2Price && env.baseline.costInputs && ranked !== null) {
      const perKg = (1 - wH2) * basePrice.perKg + wH2 * h2Price.perKg;
      const delivered = normalisePrice({ amount: perKg, unit: "kg" }, ctx.energyContent).perMWh_net;
      cost = scenarioCosts({
        ...env.baseline.costInputs,
        efficiencyNet: etaN,
        grossOverNet: ctx.hv.hhv_MJ_per_kg / ctx.hv.lhv_MJ_per_kg,
        deliveredPrice_per_MWh_net: delivered,
        co2Fossil_kg_per_GJ_net: ctx.co2.fossil_kg_per_GJ_lhv,
        co2Biogenic_kg_per_GJ_net: ctx.co2.biogenic_kg_per_GJ_lhv,
        // Known whenever the study counts it (ranked is not null); ignored by the costs otherwise.
        upstreamCo2e_kg_per_GJ_net: ctx.co2.upstreamCo2e_kg_per_GJ_lhv ?? 0,
      }).costPerUsefulMWh.total;
    }
    const flows = fip.flows;
    points.push({
      h2Percent: share,
      h2EnergySharePercent: (100 * wH2 * h2Ctx.hv.lhv_MJ_per_kg) / ctx.hv.lhv_MJ_per_kg,
      wobbeGross_MJ_per_m3: w ? w.gross_MJ_per_m3 : null,
      wobbeShiftPercent: w && wb ? (100 * (w.gross_MJ_per_m3 - wb.gross_MJ_per_m3)) / wb.gross_MJ_per_m3 : null,
      flameTemperatureC: perf.flame ? perf.flame.temperatureC : null,
      flameShiftK: perf.flame && baseFip.perf.flame ? perf.flame.temperatureK - baseFip.perf.flame.temperatureK : null,
      efficiencyNet: etaN,
      efficiencyGross: annual.gross.efficiency,
      dewPointC: perf.balance.dewPointC,
      co2PerUsefulMJ_g: co2,
      co2ChangePercent: co2 !== null && baseCo2 !== null && baseCo2 > 0 ? (100 * (co2 - baseCo2)) / baseCo2 : null,
      fuelVolume_m3_per_h: flows.fuelVolume_per_h ? flows.fuelVolume_per_h.value : null,
      flueGas_m3_per_h: plant.flueGasCapacityBasis === "actual" ? flows.flueGas_m3_per_h_actual : flows.flueGas_m3_per_h_normal,
      air_m3_per_h: plant.airCapacityBasis === "actual" ? flows.air_m3_per_h_actual : flows.air_m3_per_h_normal,
      costPerUsefulMWh: cost,
      untunedLambda: burner.untuned?.lambda ?? null,
      untunedHeatInputChangePercent: burner.untuned?.heatInputChangePercent ?? null,
      burningVelocityRatio: flamePoint ? burner.burningVelocityRatio : null,
      burningVelocity_cm_per_s: flamePoint ? burner.burningVelocity_cm_per_s : null,
      nox_mg_per_m3: flamePoint ? burner.nox.estimate_mg_per_m3 : null,
      noxRatio: flamePoint ? burner.nox.ratioToBaseline : null,
      flamePoint,
      statuses,
      worst: worstStatus(checks.map((c) => c.status)),
    });
  }

  const setting = burnerSettingOf(plant);
  const flamePts = points.filter((p) => p.flamePoint);
  const flashbackJudged = setting.type === "premixed" || setting.type === "partially-premixed";
  const noxLimit = plant.noxLimit_mg_per_m3 ?? null;
  const interpolatedCrossing = (id: FitCheckId): SweepCrossing | null => {
    if (id === "flashback" && flashbackJudged)
      return crossingOf(
        id,
        flamePts,
        (p) => p.burningVelocityRatio,
        setting.flashbackWarnRatio,
        setting.flashbackFailRatio,
        points[0].statuses[id],
      );
    if (id === "nox-permit" && noxLimit !== null)
      return crossingOf(id, flamePts, (p) => p.nox_mg_per_m3, plant.warnAtFractionOfLimit * noxLimit, noxLimit, points[0].statuses[id]);
    return null;
  };
  const crossings: SweepCrossing[] = FIT_CHECK_IDS.map((id) => {
    const interp = interpolatedCrossing(id);
    if (interp) return interp;
    const warn = points.find((p) => p.statuses[id] === "warn" || p.statuses[id] === "fail");
    const fail = points.find((p) => p.statuses[id] === "fail");
    return {
      checkId: id,
      label: FIT_CHECK_LABELS[id],
      firstWarnPercent: warn ? warn.h2Percent : null,
      firstFailPercent: fail ? fail.h2Percent : null,
      statusAtZero: points[0].statuses[id],
    };
  });

  const tol = plant.wobbeTolerancePercent ?? null;
  const limitLines: SweepLimitLines = {
    wobbeBand_MJ_per_m3:
      tol !== null && wb ? { min: wb.gross_MJ_per_m3 * (1 - tol / 100), max: wb.gross_MJ_per_m3 * (1 + tol / 100) } : null,
    wobbeRange_MJ_per_m3:
      plant.wobbeMin_MJ_per_m3 != null && plant.wobbeMax_MJ_per_m3 != null
        ? { min: plant.wobbeMin_MJ_per_m3, max: plant.wobbeMax_MJ_per_m3 }
        : null,
    maxFlameTemperatureC:
      plant.maxFlameTempRiseK != null && baseFip.perf.flame ? baseFip.perf.flame.temperatureC + plant.maxFlameTempRiseK : null,
    flueGasCapacity_m3_per_h: plant.flueGasCapacity_m3_per_h ?? null,
    airCapacity_m3_per_h: plant.airCapacity_m3_per_h ?? null,
    fuelSupplyCapacity_m3_per_h: plant.fuelSupplyCapacity_m3_per_h ?? null,
    maxH2SharePercent: plant.maxH2SharePercent ?? null,
    flashbackWarnRatio: flashbackJudged ? setting.flashbackWarnRatio : null,
    flashbackFailRatio: flashbackJudged ? setting.flashbackFailRatio : null,
    noxLimit_mg_per_m3: noxLimit,
  };

  return {
    available: true,
    baseGasLabel: env.baseline.definition.name ?? baseCtx.label,
    hydrogenLabel: cfg.hydrogen.name ?? h2Ctx.label,
    stepPercent: cfg.stepPercent,
    points,
    crossings,
    limitLines,
    basis,
    flames: { stepPercent: cfg.flameStepPercent, shares: flamePts.map((p) => p.h2Percent), solved: flamesSolved },
    notes,
  };
}

/**
 * First shares at which a rising figure reaches its warn and fail levels, by linear interpolation
 * between the points where it is known (null: not reached, or not known on both sides).
 */
export function crossingOf(
  id: FitCheckId,
  pts: readonly SweepPoint[],
  value: (p: SweepPoint) => number | null,
  warnAt: number,
  failAt: number,
  statusAtZero: CheckStatus,
): SweepCrossing {
  const first = (level: number): number | null => {
    let prev: { x: number; v: number } | null = null;
    for (const p of pts) {
      const v = value(p);
      if (v === null) {
        prev = null;
        continue;
      }
      if (v >= level) {
        if (!prev) return p.h2Percent;
        return Math.round(10 * (prev.x + ((level - prev.v) / (v - prev.v)) * (p.h2Percent - prev.x))) / 10;
      }
      prev = { x: p.h2Percent, v };
    }
    return null;
  };
  return {
    checkId: id,
    label: FIT_CHECK_LABELS[id],
    firstWarnPercent: first(warnAt),
    firstFailPercent: first(failAt),
    statusAtZero,
    interpolated: true,
  };
}

/** What a sweep means for the decision: which limits bind first and the largest share that passes them all. */
export interface SweepVerdict {
  /** Checks that fail at some share above 0 %, by the share at which they first fail. */
  firstFailures: SweepCrossing[];
  /** Checks that warn at some share above 0 % (and pass at 0 %), by the share at which they first warn. */
  firstWarnings: SweepCrossing[];
  /** Checks that already warn or fail on the baseline gas (0 % hydrogen). */
  failingOrWarningAtZero: SweepCrossing[];
  /** The largest swept share below the first failure (the last point when nothing fails); null when even the first point fails. */
  largestPassingPoint: SweepPoint | null;
}

export function sweepVerdict(points: readonly SweepPoint[], crossings: readonly SweepCrossing[]): SweepVerdict {
  const firstFailures = crossings
    .filter((c) => c.firstFailPercent !== null && c.statusAtZero !== "fail")
    .sort((a, b) => (a.firstFailPercent ?? 0) - (b.firstFailPercent ?? 0));
  const firstWarnings = crossings
    .filter((c) => c.firstWarnPercent !== null && c.statusAtZero !== "warn" && c.statusAtZero !== "fail")
    .sort((a, b) => (a.firstWarnPercent ?? 0) - (b.firstWarnPercent ?? 0));
  const failingOrWarningAtZero = crossings.filter((c) => c.statusAtZero === "fail" || c.statusAtZero === "warn");
  const firstFail = firstFailures[0]?.firstFailPercent ?? null;
  const largestPassingPoint =
    firstFail === null ? (points[points.length - 1] ?? null) : ([...points].reverse().find((p) => p.h2Percent < firstFail) ?? null);
  return { firstFailures, firstWarnings, failingOrWarningAtZero, largestPassingPoint };
}
