/**
 * Price and carbon paths over the horizon, and how sure the ranking is: a Monte Carlo ranking of
 * a study's scenarios under stated uncertainty ranges.
 *
 * Set-up, once per run: the study is evaluated by `evaluateStudy` (the plant model: fuel
 * properties, heat-loss balance at each scenario's operating point, duty, fit checks, prices).
 * What a draw changes is then exact and cheap:
 * - fuel prices and the carbon price scale their whole path (a level factor); a blend priced from
 *   its components' quotes is linear in each component's delivered price, so its price splits
 *   into one part per quote (found through the pricing code itself);
 * - the efficiency change of a scenario is a change, in points, of its heat-loss balance
 *   efficiency before radiation (η₀, e.g. a stack temperature reached after a retrofit); the plant
 *   model's radiation loss is a constant heat flow Q, so the efficiency at the average useful heat
 *   U is η = η₀·U/(U + Q) (lib/plant/duty.ts), linear in η₀: evaluated exactly, no linearisation;
 * - a drawn stack temperature (a retrofit's, by default the band that moves its loss account by
 *   the sensitivity's points) runs the scenario's heat-loss account again at that temperature
 *   (lib/plant/performance.ts `netEfficiencyAtStack`: sensible losses and condensation, not a
 *   linear shift) and gives its η₀;
 * - operating hours go through `plantDuty` again (annual heat, or the average load and with it
 *   the radiation share, whichever the plant states);
 * - capex scales per scenario.
 * NPV, payback and abatement cost then follow year by year from the paths (lib/economics/paths.ts).
 *
 * Sampling: Latin hypercube (lib/economics/sampling.ts) from a seeded xoshiro128** generator, the
 * stated correlations imposed by Iman–Conover. Probabilities carry the standard error of N
 * independent draws, √(p(1−p)/N); an LHS estimate is at least as precise.
 */
import { condensingStackFloorC, operatingPointOf, type Plant } from "../schemas/plant";
import { OPERATING_HOURS_DEFAULT_PERCENT, type RankingMetric, type Scenario, type Study, type UncertaintyRange } from "../schemas/study";
import { plantDuty, radiationLoss_kW, type PlantDuty } from "../plant/duty";
import type { FuelContext } from "../plant/fuel-context";
import { balanceAtStack, netEfficiencyAtStack, type FuelPerformance } from "../plant/performance";
import { InputError } from "../errors";
import { RANKING_METRIC_INFO } from "../economics/sensitivity";
import { distributionOf, type Distribution, type DistributionSpec } from "../economics/distributions";
import { Xoshiro128ss } from "../economics/random";
import {
  imanConover,
  latinHypercube,
  pearson,
  percentileSorted,
  percentilesUnsorted,
  proportionStandardError,
  ranks,
  spearman,
} from "../economics/sampling";
import {
  abatementCostFromPaths,
  costPerUsefulMWhYear1,
  pathScenarioState,
  switchingNpvFromPaths,
  type PathFactors,
  type PathScenario,
  type PathScenarioState,
} from "../economics/paths";
import { writeCsv } from "../formats/csv";
import { createEvaluationCaches, evaluateStudy, type EvaluationCaches, type ScenarioResult, type StudyResult } from "./evaluate";
import { pathEconomicsOf, studyPricePaths, type PathEconomics, type PriceSource, type StudyPricePaths } from "./price-paths";

// ---------------------------------------------------------------------------------------------
// Price sources and paths

export type { PriceSource, PathEconomics } from "./price-paths";

interface ScenarioSetup {
  result: ScenarioResult;
  scenario: Scenario;
  field: string;
  /** Heat-loss balance efficiency before radiation (net basis) and the radiation heat flow, kW. */
  eta0: number;
  radiation_kW: number;
  path: PathScenario | null;
  /** The fuel in the plant at the scenario's operating point (what a drawn stack temperature re-runs). */
  ctx: FuelContext;
  perf: FuelPerformance;
}

export interface StudyPathSetup {
  evaluation: StudyResult;
  sources: PriceSource[];
  factors: PathFactors;
  scenarios: ScenarioSetup[];
  duty: PlantDuty;
  /** The baseline fuel in the plant (what plantDuty needs when the hours change). */
  baseFuel: { ctx: FuelContext; perf: FuelPerformance };
  notes: string[];
  /** Paths as applied, for the report: per source and carbon, years 1 … N. */
  applied: StudyPricePaths["applied"];
}

/**
 * Evaluates the study once and prepares its year-by-year economics: price sources, the price
 * parts of every scenario, the paths and their present-value factors, and what the plant model
 * says of each scenario's efficiency (η₀ and the radiation heat flow).
 */
export function studyPathSetup(study: Study, caches: EvaluationCaches = createEvaluationCaches()): StudyPathSetup {
  const evaluation = evaluateStudy(study, { sweep: false, tornado: false, caches });
  const plant = study.plant;
  const all = [evaluation.baseline, ...evaluation.scenarios];
  const baseCtx = caches.fuels.fromDefinition(study.baseline.fuel, "baseline.fuel");
  const basePerf = caches.performance.get(baseCtx, operatingPointOf(plant, study.baseline.overrides));
  const duty = plantDuty(plant, baseCtx, basePerf);
  const pp = studyPricePaths(study, caches, all);
  const scenarios: ScenarioSetup[] = all.map((r, k) => {
    const sc = r.isBaseline ? study.baseline : study.scenarios[r.index];
    const field = r.isBaseline ? "baseline" : `scenarios.${r.index}`;
    const ctx = caches.fuels.fromDefinition(sc.fuel, `${field}.fuel`);
    const perf = caches.performance.get(ctx, operatingPointOf(plant, sc.overrides));
    const eta0 = perf.balance.net.efficiency;
    const q = radiationLoss_kW(duty, perf.operatingPoint);
    const U = duty.averageUseful_kW;
    const check = (eta0 * U) / (U + q);
    if (Math.abs(check - r.efficiency.net) > 1e-12 * Math.max(1, r.efficiency.net)) {
      throw new Error(`efficiency of ${field} does not follow η₀·U/(U+Q): ${check} vs ${r.efficiency.net}`);
    }
    return { result: r, scenario: sc, field, eta0, radiation_kW: q, path: pp.scenarios[k], ctx, perf };
  });
  return {
    evaluation,
    sources: pp.sources,
    factors: pp.factors,
    scenarios,
    duty,
    baseFuel: { ctx: baseCtx, perf: basePerf },
    notes: pp.notes,
    applied: pp.applied,
  };
}

/**
 * Year-by-year switching figures of every priced candidate against the baseline, from the
 * study's paths (identical to the flat-escalation figures of `evaluateStudy` when no paths are stated).
 */
export function pathEconomics(setup: StudyPathSetup): { terms: string; discountRatePercent: number; scenarios: (PathEconomics | null)[] } {
  const f = setup.factors;
  const pp: StudyPricePaths = {
    sources: setup.sources,
    scenarios: setup.scenarios.map((s) => s.path),
    factors: f,
    notes: setup.notes,
    applied: setup.applied,
  };
  return {
    terms: f.finance.terms,
    discountRatePercent: f.finance.discountRatePercent,
    scenarios: pathEconomicsOf(
      pp,
      setup.scenarios.map((s) => s.result),
      setup.duty.annualUseful_MWh,
    ),
  };
}

// ---------------------------------------------------------------------------------------------
// Uncertain inputs

export type InputKind = "price" | "carbon" | "capex" | "efficiency" | "stack" | "hours";

export interface UncertainInput {
  key: string;
  label: string;
  kind: InputKind;
  unit: "%" | "points" | "K";
  spec: DistributionSpec;
  /** Where the range comes from. */
  origin: string;
}

const specOf = (r: UncertaintyRange): DistributionSpec =>
  r.distribution === "normal"
    ? { distribution: "normal", mean: r.mean, sd: r.sd }
    : { distribution: r.distribution, low: r.low, mode: r.mode, high: r.high };
const symmetric = (w: number): DistributionSpec => ({ distribution: "triangular", low: -w, mode: 0, high: w });

/**
 * Points of net efficiency (before radiation) per K of stack temperature at the scenario's stack,
 * from the loss account itself (a central difference of ± 1 K; one-sided at a condensing floor).
 */
export function efficiencyPointsPerK(s: Pick<ScenarioSetup, "ctx" | "perf">): number {
  const T = s.perf.operatingPoint.stackTemperatureC;
  const at = (t: number) => balanceAtStack(s.ctx, s.perf, t).net.efficiency;
  let lo = T - 1;
  try {
    at(lo);
  } catch (e) {
    if (!(e instanceof InputError)) throw e;
    lo = T;
  }
  return (100 * (at(T + 1) - at(lo))) / (T + 1 - lo);
}

/**
 * The stack-temperature input of a scenario: a range stated for it by name, else (when its
 * operating changes state a stack temperature, i.e. a retrofit) the stated default, else the band
 * that moves its loss account by the sensitivity's ± points at the stated temperature. null: none.
 */
function stackInput(s: ScenarioSetup, u: Study["uncertainty"], efficiencyPoints: number): UncertainInput | null {
  const name = s.scenario.name;
  const own = Object.entries(u?.stackTemperatureByScenario ?? {}).find(([k]) => k.toLowerCase() === name.toLowerCase())?.[1];
  const base = { key: `stack:${name}`, label: `stack temperature of ${name}`, kind: "stack" as const, unit: "K" as const };
  const T = s.perf.operatingPoint.stackTemperatureC;
  if (own) return { ...base, spec: specOf(own), origin: `stated for this scenario (from ${T} °C)` };
  if (s.scenario.overrides.stackTemperatureC === undefined || s.scenario.overrides.stackTemperatureC === null) return null;
  if (u?.stackTemperatureK) return { ...base, spec: specOf(u.stackTemperatureK), origin: `stated (from ${T} °C)` };
  const slope = Math.abs(efficiencyPointsPerK(s));
  if (!(slope > 1e-6) || !(efficiencyPoints > 0)) return null;
  const w = efficiencyPoints / slope;
  return {
    ...base,
    spec: symmetric(w),
    origin: `± ${w.toFixed(1)} K from ${T} °C: the band that moves the loss account by ± ${efficiencyPoints} points (sensitivity range, ${slope.toFixed(3)} points per K there), triangular`,
  };
}

/** The uncertain inputs of a study: stated ranges, else the defaults from its sensitivity ranges. */
export function uncertainInputs(study: Study, setup: StudyPathSetup): UncertainInput[] {
  const u = study.uncertainty ?? null;
  const sens = study.sensitivity;
  const inputs: UncertainInput[] = [];
  const known = new Set(setup.sources.map((s) => s.key));
  for (const key of Object.keys(u?.fuelPrices ?? {})) {
    if (!known.has(key))
      throw new InputError(
        `uncertainty.fuelPrices.${key}`,
        `no priced quote has this key; the keys are ${[...known].join(", ") || "(none)"}`,
      );
  }
  for (const s of setup.sources) {
    const own = u?.fuelPrices?.[s.key];
    const def = u?.fuelPriceDefault;
    inputs.push({
      key: `price:${s.key}`,
      label: `price of ${s.label}`,
      kind: "price",
      unit: "%",
      spec: own ? specOf(own) : def ? specOf(def) : symmetric(sens.fuelPricePercent),
      origin: own ? "stated" : def ? "stated default for fuel prices" : `± ${sens.fuelPricePercent} % (sensitivity range), triangular`,
    });
  }
  inputs.push({
    key: "carbon",
    label: "carbon price (whole path)",
    kind: "carbon",
    unit: "%",
    spec: u?.carbonPrice ? specOf(u.carbonPrice) : symmetric(sens.carbonPricePercent),
    origin: u?.carbonPrice ? "stated" : `± ${sens.carbonPricePercent} % (sensitivity range), triangular`,
  });
  const names = new Map(setup.scenarios.map((s) => [s.scenario.name.toLowerCase(), s]));
  for (const key of Object.keys(u?.efficiencyByScenario ?? {})) {
    if (!names.has(key.toLowerCase())) throw new InputError(`uncertainty.efficiencyByScenario.${key}`, "no scenario has this name");
  }
  for (const s of setup.scenarios) {
    if (!s.result.isBaseline && s.scenario.capex > 0) {
      inputs.push({
        key: `capex:${s.scenario.name}`,
        label: `capex of ${s.scenario.name}`,
        kind: "capex",
        unit: "%",
        spec: u?.capex ? specOf(u.capex) : symmetric(sens.capexPercent),
        origin: u?.capex ? "stated" : `± ${sens.capexPercent} % (sensitivity range), triangular`,
      });
    }
  }
  for (const key of Object.keys(u?.stackTemperatureByScenario ?? {})) {
    if (!names.has(key.toLowerCase())) throw new InputError(`uncertainty.stackTemperatureByScenario.${key}`, "no scenario has this name");
  }
  const stacks = new Set<ScenarioSetup>();
  for (const s of setup.scenarios) {
    const stack = stackInput(s, u, sens.efficiencyPoints);
    if (!stack) continue;
    stacks.add(s);
    inputs.push(stack);
  }
  for (const s of setup.scenarios) {
    const own = Object.entries(u?.efficiencyByScenario ?? {}).find(([k]) => k.toLowerCase() === s.scenario.name.toLowerCase())?.[1];
    // A drawn stack temperature carries the efficiency uncertainty of its scenario; only a range stated for it is added.
    if (stacks.has(s) && !own) continue;
    inputs.push({
      key: `efficiency:${s.scenario.name}`,
      label: `efficiency change of ${s.scenario.name}`,
      kind: "efficiency",
      unit: "points",
      spec: own ? specOf(own) : u?.efficiencyPoints ? specOf(u.efficiencyPoints) : symmetric(sens.efficiencyPoints),
      origin: own
        ? "stated for this scenario"
        : u?.efficiencyPoints
          ? "stated"
          : `± ${sens.efficiencyPoints} points (sensitivity range), triangular`,
    });
  }
  const hoursMatter = !(study.plant.annualUsefulHeat_MWh != null && study.plant.averageLoadFraction > 0);
  if (hoursMatter) {
    inputs.push({
      key: "hours",
      label: "operating hours",
      kind: "hours",
      unit: "%",
      spec: u?.operatingHours ? specOf(u.operatingHours) : symmetric(OPERATING_HOURS_DEFAULT_PERCENT),
      origin: u?.operatingHours ? "stated" : `± ${OPERATING_HOURS_DEFAULT_PERCENT} % (default, common practice), triangular`,
    });
  }
  return inputs;
}

// ---------------------------------------------------------------------------------------------
// The ranking

export interface UncertaintyOptions {
  draws: number;
  seed: number;
  metric?: RankingMetric;
  /** Number of points of each cumulative distribution returned for charts (default 101). */
  cdfPoints?: number;
  /** Reuse the caches of an earlier evaluation. */
  caches?: EvaluationCaches;
}

export interface Percentiles {
  p10: number;
  p50: number;
  p90: number;
  /** Draws in which the figure exists (e.g. an abatement cost needs CO2 avoided). */
  defined: number;
}

export interface UncertaintyScenario {
  index: number;
  name: string;
  isBaseline: boolean;
  status: ScenarioResult["status"];
  /** The deterministic rank and metric value of evaluateStudy. */
  deterministicRank: number | null;
  deterministicValue: number | null;
  /** Whether it takes part in "ranks first"; if not, why. */
  ranked: boolean;
  excludedReason: string | null;
  pFirst: number;
  pFirstSE: number;
  metric: Percentiles | null;
  costPerUsefulMWh: Percentiles | null;
  npv: Percentiles | null;
  abatementCost_per_t: Percentiles | null;
  /** P(NPV of switching from the baseline > 0); null for the baseline or without prices. */
  pNpvPositive: number | null;
  pNpvPositiveSE: number | null;
  /** The metric's empirical CDF at `cdfPoints` evenly spaced probabilities (0 … 1), for the CDF_OPTIONS options most often first; else null. */
  cdf: number[] | null;
}

export interface Driver {
  key: string;
  label: string;
  spearman: number;
  /** Median of the input (its change, in `unit`) in the draws where each of the two ranks better. */
  medianWhenFirstBetter: number | null;
  medianWhenSecondBetter: number | null;
  unit: string;
}

export interface UncertaintyResult {
  study: string;
  currency: string;
  metric: RankingMetric;
  metricLabel: string;
  metricUnit: string;
  better: "lower" | "higher";
  draws: number;
  seed: number;
  sampling: string;
  generator: string;
  standardError: string;
  terms: string;
  discountRatePercent: number;
  inputs: (UncertainInput & { mean: number; sd: number })[];
  correlations: { a: string; b: string; rho: number; sampled: number | null }[];
  scenarios: UncertaintyScenario[];
  /** The two scenarios most often first, and the inputs that decide between them. */
  topTwo: { first: string; second: string; drivers: Driver[]; draws: number } | null;
  paths: StudyPathSetup["applied"];
  sources: PriceSource[];
  notes: string[];
  caution: string;
  elapsedMs: number;
  /** Wall time of the phases: evaluation of the study, sampling, the draws, the summaries. */
  timingsMs: { setup: number; sampling: number; draws: number; summary: number };
}

export const UNCERTAINTY_CAUTION =
  "Screening estimate: the chances are only as good as the stated ranges, which are judgements, not measurements. Feasibility (fit checks) is taken at the stated operating point; an option flagged infeasible there never ranks first. Hydrogen, ammonia, biogas and burner changes need the burner maker's and the authority's review whatever their chance.";

export const MAX_DRAWS = 200_000;

/** The defined (non-NaN) values of `v`. */
function definedValues(v: Float64Array): Float64Array {
  let n = 0;
  for (let i = 0; i < v.length; i++) if (!Number.isNaN(v[i])) n++;
  const out = new Float64Array(n);
  n = 0;
  for (let i = 0; i < v.length; i++) if (!Number.isNaN(v[i])) out[n++] = v[i];
  return out;
}

function percentiles(v: Float64Array): Percentiles | null {
  const d = definedValues(v);
  if (d.length === 0) return null;
  const [p10, p50, p90] = percentilesUnsorted(d, [0.1, 0.5, 0.9]);
  return { p10, p50, p90, defined: d.length };
}

/** How many options get a cumulative distribution: those ranking first most often. */
export const CDF_OPTIONS = 5;

/** Where a run stands: after the set-up (`done` 0), then every `UNCERTAINTY_CHUNK_DRAWS` draws. */
export interface UncertaintyProgress {
  phase: "setup" | "draws";
  done: number;
  total: number;
}

/** Draws between two progress reports of `uncertaintyRankingSteps`. */
export const UNCERTAINTY_CHUNK_DRAWS = 500;

/**
 * Monte Carlo ranking of a study under uncertainty: every scenario's metric per draw with the
 * plant model's efficiencies, the chance of ranking first, percentiles, the chance of a positive
 * NPV and what decides between the top two. Pure and reproducible: the same study, draws and seed
 * give the same result (apart from the measured times `elapsedMs` and `timingsMs`).
 */
export function uncertaintyRanking(study: Study, options: UncertaintyOptions): UncertaintyResult {
  const steps = uncertaintyRankingSteps(study, options);
  for (;;) {
    const s = steps.next();
    if (s.done) return s.value;
  }
}

/**
 * The same ranking in steps: the generator yields its progress after the set-up and after every
 * `UNCERTAINTY_CHUNK_DRAWS` draws, so that a caller can run it in slices (a server keeps
 * answering, shows progress, and may stop it between two slices). Same figures as
 * `uncertaintyRanking`, which drains it.
 */
export function* uncertaintyRankingSteps(
  study: Study,
  options: UncertaintyOptions,
): Generator<UncertaintyProgress, UncertaintyResult, void> {
  const t0 = performance.now();
  const draws = options.draws;
  if (!Number.isInteger(draws) || draws < 10 || draws > MAX_DRAWS)
    throw new InputError("draws", `must be a whole number from 10 to ${MAX_DRAWS}`);
  if (!Number.isInteger(options.seed) || options.seed < 0 || options.seed > 0xffffffff)
    throw new InputError("seed", "must be a whole number from 0 to 4294967295");
  const metric = options.metric ?? study.rankingMetric;
  const info = RANKING_METRIC_INFO[metric];
  const setup = studyPathSetup(study, options.caches);
  const tSetup = performance.now();
  yield { phase: "setup", done: 0, total: draws };
  const notes = [...setup.notes];
  const inputs = uncertainInputs(study, setup);
  const dists: Distribution[] = inputs.map((inp) => {
    try {
      return distributionOf(inp.spec);
    } catch (e) {
      throw new InputError(`uncertainty.${inp.key}`, (e as Error).message);
    }
  });

  // Sample: Latin hypercube over the inputs that vary, then quantiles, then correlations.
  const rng = Xoshiro128ss.fromSeed(options.seed);
  const varying = dists.map((d, j) => (d.degenerate ? -1 : j)).filter((j) => j >= 0);
  const u = latinHypercube(rng, draws, varying.length);
  const x = new Float64Array(draws * inputs.length);
  dists.forEach((d, j) => {
    const col = x.subarray(j * draws, (j + 1) * draws);
    const v = varying.indexOf(j);
    if (v < 0) col.fill(d.quantile(0.5));
    else for (let i = 0; i < draws; i++) col[i] = d.quantile(u[v * draws + i]);
  });
  const keyIndex = new Map(inputs.map((inp, j) => [inp.key, j]));
  const explicit = study.uncertainty?.correlations ?? [];
  const shared = study.uncertainty?.fuelPriceCorrelation ?? null;
  const stated: { a: string; b: string; rho: number }[] = [...explicit];
  if (shared !== null && shared !== 0) {
    const said = new Set(explicit.flatMap((c) => [`${c.a}|${c.b}`, `${c.b}|${c.a}`]));
    const prices = inputs.filter((inp, j) => inp.kind === "price" && !dists[j].degenerate).map((inp) => inp.key);
    for (let a = 0; a < prices.length; a++) {
      for (let b = a + 1; b < prices.length; b++)
        if (!said.has(`${prices[a]}|${prices[b]}`)) stated.push({ a: prices[a], b: prices[b], rho: shared });
    }
  }
  const corrInputs: number[] = [];
  stated.forEach((c, k) => {
    for (const [which, key] of [
      ["a", c.a],
      ["b", c.b],
    ] as const) {
      const j = keyIndex.get(key);
      if (j === undefined)
        throw new InputError(
          k < explicit.length ? `uncertainty.correlations.${k}.${which}` : "uncertainty.fuelPriceCorrelation",
          `no uncertain input "${key}"; the inputs are ${inputs.map((i) => i.key).join(", ")}`,
        );
      if (dists[j].degenerate)
        throw new InputError(
          k < explicit.length ? `uncertainty.correlations.${k}.${which}` : "uncertainty.fuelPriceCorrelation",
          `"${key}" does not vary: nothing to correlate`,
        );
      if (!corrInputs.includes(j)) corrInputs.push(j);
    }
    if (c.a === c.b) throw new InputError(`uncertainty.correlations.${k}.b`, "an input is fully correlated with itself");
  });
  if (corrInputs.length >= 2) {
    // Gather the correlated columns, re-pair them, scatter back.
    const m = corrInputs.length;
    const sub = new Float64Array(draws * m);
    corrInputs.forEach((j, c) => {
      sub.set(x.subarray(j * draws, (j + 1) * draws), c * draws);
    });
    const target = new Float64Array(m * m);
    for (let a = 0; a < m; a++) target[a * m + a] = 1;
    stated.forEach((c) => {
      const a = corrInputs.indexOf(keyIndex.get(c.a)!);
      const b = corrInputs.indexOf(keyIndex.get(c.b)!);
      target[a * m + b] = target[b * m + a] = c.rho;
    });
    imanConover(sub, draws, m, target, rng, explicit.length ? "uncertainty.correlations" : "uncertainty.fuelPriceCorrelation");
    corrInputs.forEach((j, c) => {
      x.set(sub.subarray(c * draws, (c + 1) * draws), j * draws);
    });
  }

  const tSample = performance.now();
  // Per-draw evaluation.
  const f = setup.factors;
  const S = setup.scenarios.length;
  const col = (key: string) => {
    const j = keyIndex.get(key);
    return j === undefined ? null : x.subarray(j * draws, (j + 1) * draws);
  };
  const priceCols = setup.sources.map((s) => col(`price:${s.key}`)!);
  const carbonCol = col("carbon")!;
  const hoursCol = col("hours");
  const capexCols = setup.scenarios.map((s) => col(`capex:${s.scenario.name}`));
  const effCols = setup.scenarios.map((s) => col(`efficiency:${s.scenario.name}`));
  const stackCols = setup.scenarios.map((s) => col(`stack:${s.scenario.name}`));
  // A drawn stack temperature runs the scenario's loss account again (balanceAtStack); the stated
  // temperature must give the plant model's own η₀ (the same account), else the set-up is wrong.
  setup.scenarios.forEach((sc, s) => {
    if (!stackCols[s]) return;
    const again = netEfficiencyAtStack(sc.ctx, sc.perf, sc.perf.operatingPoint.stackTemperatureC);
    if (again !== sc.eta0) throw new Error(`loss account of ${sc.field} at its stated stack gives ${again}, the plant model ${sc.eta0}`);
  });
  const stackFloorC = setup.scenarios.map((sc) => {
    const op = sc.perf.operatingPoint;
    return op.condensing && op.returnWaterC !== null ? condensingStackFloorC(op.returnWaterC, op.condensingApproachK) : -Infinity;
  });
  const levels = new Float64Array(setup.sources.length);
  const cost = setup.scenarios.map(() => new Float64Array(draws));
  const npv = setup.scenarios.map(() => new Float64Array(draws));
  const abate = setup.scenarios.map(() => new Float64Array(draws));
  const co2 = setup.scenarios.map(() => new Float64Array(draws));
  let clippedPrices = 0,
    clippedEff = 0,
    clippedHours = 0,
    clippedStack = 0;
  const plant = study.plant;
  const basePlantDuty = setup.duty;
  const hoursDuty = (factor: number, draw: number): PlantDuty => {
    const p: Plant = { ...plant, operatingHours: plant.operatingHours * factor };
    try {
      return plantDuty(p, setup.baseFuel.ctx, setup.baseFuel.perf);
    } catch (e) {
      if (e instanceof InputError)
        throw new InputError("uncertainty.operatingHours", `draw ${draw + 1}: ${(100 * (factor - 1)).toFixed(1)} % hours: ${e.detail}`);
      throw e;
    }
  };
  const states: (PathScenarioState | null)[] = new Array(S).fill(null);
  // Reused per-scenario states and local bindings of the hot functions (no allocation per draw).
  const pool = setup.scenarios.map(() =>
    pathScenarioState(
      { priceParts: [], co2Fossil_kg_per_GJ_net: 0, upstreamCo2e_kg_per_GJ_net: 0, includeUpstream: false, capex: 0, fixedOpexChange: 0 },
      f,
      1,
      1,
      null,
    ),
  );
  const stateOf = pathScenarioState,
    costYear1 = costPerUsefulMWhYear1,
    npvOf = switchingNpvFromPaths,
    abatementOf = abatementCostFromPaths;
  for (let i = 0; i < draws; i++) {
    for (let k = 0; k < levels.length; k++) {
      let l = 1 + priceCols[k][i] / 100;
      if (l < 0) {
        l = 0;
        clippedPrices++;
      }
      levels[k] = l;
    }
    let cl = 1 + carbonCol[i] / 100;
    if (cl < 0) {
      cl = 0;
      clippedPrices++;
    }
    let duty = basePlantDuty;
    if (hoursCol) {
      let h = 1 + hoursCol[i] / 100;
      if (h < 0.01) {
        h = 0.01;
        clippedHours++;
      }
      duty = hoursDuty(h, i);
    }
    const Uk = duty.averageUseful_kW;
    const H = duty.annualUseful_MWh;
    for (let s = 0; s < S; s++) {
      const sc = setup.scenarios[s];
      let eta0 = sc.eta0;
      const sk = stackCols[s];
      if (sk) {
        let T = sc.perf.operatingPoint.stackTemperatureC + sk[i];
        const floor = Math.max(stackFloorC[s], sc.perf.operatingPoint.combustionAirC);
        if (T < floor) {
          T = floor;
          clippedStack++;
        }
        eta0 = netEfficiencyAtStack(sc.ctx, sc.perf, T);
      }
      const ec = effCols[s];
      let eta = ((ec ? eta0 + ec[i] / 100 : eta0) * Uk) / (Uk + sc.radiation_kW);
      if (eta < 0.05) {
        eta = 0.05;
        clippedEff++;
      }
      co2[s][i] = sc.result.co2PerUsefulMJ_g.ranked === null ? NaN : (sc.result.co2PerUsefulMJ_g.ranked * sc.result.efficiency.net) / eta;
      if (!sc.path) {
        states[s] = null;
        cost[s][i] = npv[s][i] = abate[s][i] = NaN;
        continue;
      }
      const cc = capexCols[s];
      let capexFactor = cc ? 1 + cc[i] / 100 : 1;
      if (capexFactor < 0) {
        capexFactor = 0;
        clippedPrices++;
      }
      const st = stateOf(sc.path, f, H, eta, levels, capexFactor, pool[s]);
      states[s] = st;
      cost[s][i] = costYear1(st, f, H, cl);
    }
    const b = states[0];
    for (let s = 0; s < S; s++) {
      const st = states[s];
      if (!st || !b) {
        npv[s][i] = abate[s][i] = NaN;
        continue;
      }
      if (s === 0) {
        npv[s][i] = 0;
        abate[s][i] = NaN;
        continue;
      }
      npv[s][i] = npvOf(b, st, f, cl);
      const a = abatementOf(b, st, f);
      abate[s][i] = a === null ? NaN : a;
    }
    if ((i + 1) % UNCERTAINTY_CHUNK_DRAWS === 0 && i + 1 < draws) yield { phase: "draws", done: i + 1, total: draws };
  }
  if (clippedPrices)
    notes.push(`${clippedPrices} sampled price, carbon or capex values below zero were set to zero (a normal range reaching below −100 %)`);
  if (clippedEff) notes.push(`${clippedEff} sampled efficiencies below 5 % were set to 5 %`);
  if (clippedStack)
    notes.push(
      `${clippedStack} sampled stack temperatures below the combustion air or a condensing unit's floor (return water + approach) were set to that floor`,
    );
  if (clippedHours) notes.push(`${clippedHours} sampled operating hours below 1 % of the stated hours were set to 1 %`);

  const tDraws = performance.now();
  const metricArr = metric === "cost-per-useful-MWh" ? cost : metric === "npv" ? npv : metric === "abatement-cost" ? abate : co2;
  const lower = info.better === "lower";

  // Who ranks first in each draw.
  const rankedFlags = setup.scenarios.map((s) => {
    if (s.result.status === "infeasible")
      return { ranked: false, reason: "infeasible at the stated operating point (fit checks): never ranks first" };
    if (metric === "abatement-cost" && s.result.isBaseline)
      return { ranked: false, reason: "the baseline is the reference of the abatement cost" };
    if (s.result.metricValue === null && !(metric === "abatement-cost"))
      return { ranked: false, reason: "its metric cannot be computed (no price, or an unknown upstream factor the study counts)" };
    if (metric !== "co2-per-useful-MJ" && !s.path) return { ranked: false, reason: "no price: no costs" };
    return { ranked: true, reason: null };
  });
  const firstCount = new Int32Array(S);
  const winner = new Int32Array(draws).fill(-1);
  for (let i = 0; i < draws; i++) {
    let best = -1;
    let bv = 0;
    for (let s = 0; s < S; s++) {
      if (!rankedFlags[s].ranked) continue;
      const v = metricArr[s][i];
      if (Number.isNaN(v)) continue;
      if (best < 0 || (lower ? v < bv : v > bv)) {
        best = s;
        bv = v;
      }
    }
    winner[i] = best;
    if (best >= 0) firstCount[best]++;
  }
  const noWinner = winner.reduce((n, w) => n + (w < 0 ? 1 : 0), 0);
  if (noWinner) notes.push(`${noWinner} draws had no scenario with a defined metric among those ranked`);

  const cdfPoints = Math.max(2, Math.min(1001, options.cdfPoints ?? 101));
  const cdfFor = new Set(
    setup.scenarios
      .map((_, s) => s)
      .filter((s) => rankedFlags[s].ranked)
      .sort((p, q) => firstCount[q] - firstCount[p] || p - q)
      .slice(0, CDF_OPTIONS),
  );
  const scenarios: UncertaintyScenario[] = setup.scenarios.map((sc, s) => {
    const r = sc.result;
    const m = percentiles(metricArr[s]);
    let cdf: number[] | null = null;
    if (m && cdfFor.has(s)) {
      const sorted = definedValues(metricArr[s]).sort();
      cdf = Array.from({ length: cdfPoints }, (_, k) => percentileSorted(sorted, k / (cdfPoints - 1)));
    }
    let pNpv: number | null = null;
    if (!r.isBaseline && sc.path && setup.scenarios[0].path) {
      let n = 0;
      for (let i = 0; i < draws; i++) if (npv[s][i] > 0) n++;
      pNpv = n / draws;
    }
    const pf = firstCount[s] / draws;
    return {
      index: r.index,
      name: r.name,
      isBaseline: r.isBaseline,
      status: r.status,
      deterministicRank: r.rank,
      deterministicValue: r.metricValue,
      ranked: rankedFlags[s].ranked,
      excludedReason: rankedFlags[s].reason,
      pFirst: pf,
      pFirstSE: proportionStandardError(pf, draws),
      metric: m,
      costPerUsefulMWh: metricArr === cost ? m : percentiles(cost[s]),
      npv: r.isBaseline ? null : metricArr === npv ? m : percentiles(npv[s]),
      abatementCost_per_t: r.isBaseline ? null : metricArr === abate ? m : percentiles(abate[s]),
      pNpvPositive: pNpv,
      pNpvPositiveSE: pNpv === null ? null : proportionStandardError(pNpv, draws),
      cdf,
    };
  });

  // The top two and what decides between them.
  const order = scenarios
    .map((_, s) => s)
    .filter((s) => scenarios[s].ranked && firstCount[s] > 0)
    .sort((p, q) => firstCount[q] - firstCount[p] || p - q);
  let topTwo: UncertaintyResult["topTwo"] = null;
  if (order.length >= 2) {
    const [A, B] = order;
    const diff: number[] = [];
    const rows: number[] = [];
    for (let i = 0; i < draws; i++) {
      const va = metricArr[A][i],
        vb = metricArr[B][i];
      if (Number.isNaN(va) || Number.isNaN(vb)) continue;
      diff.push(va - vb);
      rows.push(i);
    }
    const drivers: Driver[] = [];
    if (rows.length >= 10) {
      const aBetter = rows.map((_, r) => (lower ? diff[r] < 0 : diff[r] > 0));
      const diffRanks = ranks(diff);
      const nBetter = aBetter.reduce((n, b) => n + (b ? 1 : 0), 0);
      // Inputs that can move the difference: the two scenarios' own, the prices they burn, carbon,
      // hours, and (abatement cost only) the baseline's, its reference. The others cancel exactly.
      const sa = setup.scenarios[A],
        sb = setup.scenarios[B],
        s0 = setup.scenarios[0];
      const involved = metric === "abatement-cost" ? [sa, sb, s0] : [sa, sb];
      const relevant = new Set<string>(["carbon", "hours"]);
      for (const sc of involved) {
        relevant.add(`capex:${sc.scenario.name}`);
        relevant.add(`efficiency:${sc.scenario.name}`);
        relevant.add(`stack:${sc.scenario.name}`);
        for (const p of sc.path?.priceParts ?? []) relevant.add(`price:${setup.sources[p.source].key}`);
      }
      inputs.forEach((inp, j) => {
        if (dists[j].degenerate || !relevant.has(inp.key)) return;
        const v = new Float64Array(rows.length);
        for (let r = 0; r < rows.length; r++) v[r] = x[j * draws + rows[r]];
        const rho = pearson(ranks(v), diffRanks);
        if (rho === null) return;
        const med = (want: boolean) => {
          const sel = new Float64Array(want ? nBetter : rows.length - nBetter);
          let k = 0;
          for (let r = 0; r < rows.length; r++) if (aBetter[r] === want) sel[k++] = v[r];
          return sel.length ? percentileSorted(sel.sort(), 0.5) : null;
        };
        drivers.push({
          key: inp.key,
          label: inp.label,
          spearman: rho,
          medianWhenFirstBetter: med(true),
          medianWhenSecondBetter: med(false),
          unit: inp.unit,
        });
      });
      drivers.sort((p, q) => Math.abs(q.spearman) - Math.abs(p.spearman));
    }
    topTwo = { first: scenarios[A].name, second: scenarios[B].name, drivers, draws: rows.length };
  } else if (order.length === 1) {
    notes.push(`${scenarios[order[0]].name} ranks first in every draw: no runner-up to compare`);
  }
  const excluded = scenarios.filter((s) => !s.ranked);
  if (excluded.length) notes.push(`left out of "ranks first": ${excluded.map((s) => `${s.name} (${s.excludedReason})`).join("; ")}`);

  const correlations = stated.map((c) => {
    const a = col(c.a)!,
      b = col(c.b)!;
    return { a: c.a, b: c.b, rho: c.rho, sampled: spearman(a, b) };
  });

  return {
    study: study.name,
    currency: study.currency,
    metric,
    metricLabel: info.label,
    metricUnit: info.unit.replace("currency", study.currency),
    better: info.better,
    draws,
    seed: options.seed,
    sampling: `Latin hypercube, ${draws} draws over ${varying.length} varying inputs${corrInputs.length >= 2 ? `; correlations of ${corrInputs.length} inputs imposed on the normal scores of their ranks (Iman–Conover)` : "; inputs independent"}`,
    generator: "xoshiro128** (Blackman & Vigna), seeded through SplitMix32",
    standardError: `standard error of a chance p: √(p(1−p)/N) for N independent draws; the Latin hypercube estimate is at least as precise`,
    terms: f.finance.terms,
    discountRatePercent: f.finance.discountRatePercent,
    inputs: inputs.map((inp, j) => ({ ...inp, mean: dists[j].mean, sd: Math.sqrt(dists[j].variance) })),
    correlations,
    scenarios,
    topTwo,
    paths: setup.applied,
    sources: setup.sources,
    notes,
    caution: UNCERTAINTY_CAUTION,
    elapsedMs: performance.now() - t0,
    timingsMs: { setup: tSetup - t0, sampling: tSample - tSetup, draws: tDraws - tSample, summary: performance.now() - tDraws },
  };
}

const fmt = (v: number | null | undefined) =>
  v === null || v === undefined || !Number.isFinite(v) ? "" : String(Number(v.toPrecision(6)));

/** One row per scenario (with a header row): what `stoke evaluate --uncertainty N --format csv` prints. */
export function uncertaintyCsvRows(r: UncertaintyResult): string[][] {
  const cur = r.currency;
  const header = [
    "scenario",
    "baseline",
    "status",
    "ranked",
    "excluded because",
    "P(first)",
    "P(first) standard error",
    `${r.metric} P10 (${r.metricUnit})`,
    `${r.metric} P50 (${r.metricUnit})`,
    `${r.metric} P90 (${r.metricUnit})`,
    `cost per useful MWh year 1 P10 (${cur}/MWh)`,
    `cost per useful MWh year 1 P50 (${cur}/MWh)`,
    `cost per useful MWh year 1 P90 (${cur}/MWh)`,
    `NPV P10 (${cur}, ${r.terms})`,
    `NPV P50 (${cur}, ${r.terms})`,
    `NPV P90 (${cur}, ${r.terms})`,
    "P(NPV > 0)",
    "P(NPV > 0) standard error",
    `abatement cost P10 (${cur}/t)`,
    `abatement cost P50 (${cur}/t)`,
    `abatement cost P90 (${cur}/t)`,
    "draws with CO2 avoided",
  ];
  const rows = r.scenarios.map((s) => [
    s.name,
    s.isBaseline ? "yes" : "no",
    s.status,
    s.ranked ? "yes" : "no",
    s.excludedReason ?? "",
    fmt(s.pFirst),
    fmt(s.pFirstSE),
    fmt(s.metric?.p10),
    fmt(s.metric?.p50),
    fmt(s.metric?.p90),
    fmt(s.costPerUsefulMWh?.p10),
    fmt(s.costPerUsefulMWh?.p50),
    fmt(s.costPerUsefulMWh?.p90),
    fmt(s.npv?.p10),
    fmt(s.npv?.p50),
    fmt(s.npv?.p90),
    fmt(s.pNpvPositive),
    fmt(s.pNpvPositiveSE),
    fmt(s.abatementCost_per_t?.p10),
    fmt(s.abatementCost_per_t?.p50),
    fmt(s.abatementCost_per_t?.p90),
    s.abatementCost_per_t ? String(s.abatementCost_per_t.defined) : "",
  ]);
  return [header, ...rows];
}

/** The rows as CSV text through the one CSV writer. */
export function uncertaintyCsv(r: UncertaintyResult): string {
  return writeCsv(uncertaintyCsvRows(r));
}
