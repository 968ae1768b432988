/**
 * Study evaluation: one plant, its baseline and N candidate scenarios → every scenario's
 * performance, costs, CO2, fit checks and comparison with the baseline, the ranking by the
 * chosen metric (infeasible scenarios flagged, never dropped), sensitivity, the hydrogen-share
 * sweep and the audit trail. Pure: the command line and the pages call the same function.
 */
import type { FuelDefinition } from "../schemas/fuel";
import {
  operatingPointOf,
  plantWithOverrides,
  type OperatingPoint,
  type Plant,
  EQUIPMENT_TYPE_LABELS,
  METERING_REFERENCE_C,
} from "../schemas/plant";
import type { Scenario, Study, StudyPrice } from "../schemas/study";
import type { FuelContext, WobbeFigures } from "../plant/fuel-context";
import type { FuelPerformance } from "../plant/performance";
import { createEvaluationCaches, type EvaluationCaches } from "./caches";
import { blendPriceFromComponents, normaliseStudyPrice, priceTerms } from "./pricing";
import {
  annualDemand,
  efficiencyAtUseful,
  flowsForUseful,
  plantDuty,
  type AnnualDemand,
  type PlantDuty,
  type RatedFlows,
} from "../plant/duty";
import { checkOperatingPoint, type FuelPerformance as Perf } from "../plant/performance";
import { InputError, rethrowUnder } from "../errors";
import { fitChecks, worstStatus, type CheckStatus, type FitCheck, type FuelInPlant } from "../plant/fit-checks";
import { siegertClassOf, siegertLossPercent, SIEGERT_COMPARISON_DEFINITION, SIEGERT_CONSTANTS } from "../plant/siegert";
import {
  coHeatOfCombustion_MJ_per_m3,
  UNBURNT_CARBON_HEATING_VALUE_J_per_kg,
  type EfficiencyResult,
  type LossTerms,
} from "../plant/efficiency";
import { priceUnitLabel, type NormalisedPrice } from "../economics/prices";
import { compare, scenarioCosts, type Comparison, type CostInputs, type FinanceAssumptions, type ScenarioCosts } from "../economics/costs";
import { RANKING_METRIC_INFO, tornado, type RankingMetric, type SensitivityRanges, type Tornado } from "../economics/sensitivity";
import { STUDY_METHODS, studyAssumptions, type AuditTrail } from "./audit";
import { cautionsFor, DEFER, type Caution, type HazardKey } from "../fuels/cautions";
import { hydrogenSweep, type HydrogenSweepResult } from "./hydrogen-sweep";
import { StudyInputError } from "./errors";
import { pathEconomicsOf, studyPricePaths } from "./price-paths";
import { kg_per_t, MJ_per_GJ, MJ_per_MWh } from "../units/energy";
import { flameRequestOfKey, type FlameLookup } from "../plant/burner-flame";
import type { FlameSpeedInput } from "../schemas/flame-speed";
import { BURNER_CAUTIONS, BURNER_SCREENING_NOTE, burnerChecks, burnerResult, type BurnerResult } from "../plant/burner-checks";

export { normaliseStudyPrice } from "./pricing";
export { StudyInputError } from "./errors";

export { createEvaluationCaches, type EvaluationCaches };

export interface EvaluationOptions {
  /** Run the hydrogen-share sweep (default: the study's hydrogenSweep.enabled). */
  sweep?: boolean;
  /** Compute tornado data for every candidate (default true). */
  tornado?: boolean;
  /** Caches to reuse across evaluations (e.g. a page re-ranking the same study). */
  caches?: EvaluationCaches;
  /**
   * Flame solves found so far (by request key). Absent or missing a key: the burning velocity and
   * NOx figures that need it are unknown (null) and the result lists the solve under
   * `flameSolves.pending`.
   */
  flames?: FlameLookup;
}

/** One flame solve a study needs, in the order a solver should run them (sweep points in share order, for warm starts). */
export interface FlameSolveNeed {
  key: string;
  request: FlameSpeedInput;
  /** Where it is used: "baseline", "scenarios.2", "hydrogenSweep.30". */
  usedBy: string[];
}

export type ScenarioStatus = "feasible" | "feasible-with-warnings" | "infeasible";

export interface ScenarioFuelSummary {
  label: string;
  kind: "gas" | "liquid" | "solid";
  definition: FuelDefinition;
  hhv_MJ_per_kg: number;
  lhv_MJ_per_kg: number;
  /** Basis of the heating values. */
  heatingValueBasis: string;
  h2SharePercent: number;
  biogenicCarbonShare: number;
  /** Gases: Wobbe at the plant's Wobbe references. */
  wobbe: WobbeFigures | null;
  co2_kg_per_GJ: { fossil_net: number; biogenic_net: number; fossil_gross: number; biogenic_gross: number; upstream_net: number | null };
}

export interface EfficiencySummary {
  /** Efficiency at the average load (what the annual fuel demand, costs and CO2 use), gross basis. */
  gross: number;
  /** The same on the net basis. */
  net: number;
  /** Efficiency at rated duty (what the rated flows use). */
  ratedLoad: { gross: number; net: number };
  /** Average load of these figures, fraction of the rated input. */
  averageLoadFraction: number;
  /** Loss terms at the average load in % of the input on each basis (credits positive). */
  lossesGrossPercent: LossTerms;
  lossesNetPercent: LossTerms;
  lambda: number;
  excessAirPercent: number;
  flueO2DryPercent: number;
  dewPointC: number | null;
  condensedFraction: number;
  condensingTemperatureC: number | null;
  /** Unburnt carbon leaving in the residue, kg per kg fuel (0 without ash or without a stated carbon share). */
  unburntCarbon_kg_per_kg: number;
  /**
   * Siegert rule-of-thumb flue loss beside the flue-gas loss computed by the regulation's own
   * definition (not the heat-loss method's efficiency terms), % of net input, where its constants apply.
   */
  siegert: { fuelClass: string; siegertPercent: number; heatLossMethodPercent: number; heatLossMethodDefinition: string } | null;
  basis: string;
}

export interface ScenarioResult {
  /** −1 for the baseline, else the index in study.scenarios. */
  index: number;
  name: string;
  isBaseline: boolean;
  fuel: ScenarioFuelSummary;
  operatingPoint: OperatingPoint;
  efficiency: EfficiencySummary;
  flame: { temperatureC: number; shiftK: number; method: string } | null;
  flameError?: string;
  wobbeShiftPercent: number | null;
  ratedFlows: RatedFlows;
  /** Change of flows versus the baseline at rated duty, %. */
  flowChangePercent: { fuelMass: number; fuelVolume: number | null; air: number; flueGas: number };
  annual: AnnualDemand;
  /** g CO2 per MJ of useful heat (needs no price). */
  /** Upstream and (when the study counts upstream) ranked are null where the fuel states no upstream factor: unknown. */
  co2PerUsefulMJ_g: { fossil: number; biogenic: number; upstream: number | null; ranked: number | null };
  /** t CO2 per year at the annual useful heat (needs no price; kg/GJ of useful heat × GJ per year): fossil, biogenic, upstream CO2e (null: unknown). */
  annualCo2_t: { fossil: number; biogenic: number; upstream: number | null };
  /** Delivered price, from the scenario's quote or (blends) from its components' quotes. */
  price:
    | (NormalisedPrice & {
        unitLabel: string;
        currency: string;
        origin: "quote" | "blend of component quotes";
        quote: StudyPrice | null;
        componentQuotes: StudyPrice[] | null;
      })
    | null;
  /** The numbers the economics ran on (for other metrics' tornadoes or what-ifs via lib/economics). */
  costInputs: CostInputs | null;
  costs: ScenarioCosts | null;
  comparison: Comparison | null;
  tornado: Tornado | null;
  checks: FitCheck[];
  /** The burner: untuned and retuned, flashback margin, NOx and SO2 (screening estimates). */
  burner: BurnerResult;
  status: ScenarioStatus;
  worstCheck: CheckStatus;
  metricValue: number | null;
  rank: number | null;
  /** Hazards of this fuel (cautions texts in StudyResult.cautions). */
  cautions: HazardKey[];
  audit: {
    inputs: {
      fuel: FuelDefinition;
      price: StudyPrice | null;
      componentPrices: StudyPrice[] | null;
      capex: number;
      fixedOpexChange: number;
      overrides: Scenario["overrides"];
    };
    notes: string[];
  };
}

export interface RankingEntry {
  rank: number;
  index: number;
  name: string;
  isBaseline: boolean;
  value: number | null;
  status: ScenarioStatus;
}

export interface StudyResult {
  study: {
    name: string;
    currency: string;
    carbonPrice_per_t: number;
    discountRatePercent: number;
    horizonYears: number;
    priceEscalationPercent: number;
    includeUpstream: boolean;
    rankingMetric: RankingMetric;
    finance: FinanceAssumptions;
    sensitivity: SensitivityRanges;
  };
  plant: Plant & { equipmentLabel: string };
  duty: PlantDuty;
  baseline: ScenarioResult;
  scenarios: ScenarioResult[];
  ranking: { metric: RankingMetric; label: string; unit: string; better: "lower" | "higher"; entries: RankingEntry[] };
  hydrogenSweep: HydrogenSweepResult | null;
  /** Screening-tool statement and the cautions that apply to the fuels of this study. */
  cautions: { screening: string; items: Caution[] };
  /** The burner section's screening statement and cautions. */
  burner: { screening: string; cautions: string[] };
  /** Flame solves the study needs: all of them (deduplicated), and how many are solved, pending or failed. */
  flameSolves: { needed: FlameSolveNeed[]; solved: number; pending: number; failed: number };
  audit: AuditTrail;
  stats: { fuelStates: number; performanceStates: number; performanceCacheHits: number };
}

const pct = (v: number, b: number) => (b !== 0 ? (100 * (v - b)) / b : 0);

interface Prepared {
  scenario: Scenario;
  index: number;
  field: string;
  ctx: FuelContext;
  op: OperatingPoint;
  perf: FuelPerformance;
  flameError?: string;
}

/** Operating-point fields whose errors are blamed on the scenario override or on the plant, wherever the value came from. */
const OPERATING_POINT_FIELDS = new Set([
  "stackTemperatureC",
  "returnWaterC",
  "condensingApproachK",
  "flueCODryPpm",
  "unburntCarbonInAshPercent",
  "radiationLossPercent",
  "combustionAirC",
  "flueO2DryPercent",
]);

/**
 * The operating point of a fuel: the plant's with the scenario's overrides; a liquid fired on the
 * liquid train of a dual-fuel plant at that train's flue O2 unless the scenario states its own.
 */
function operatingPointFor(plant: Plant, sc: Pick<Scenario, "overrides">, kind: string): OperatingPoint {
  const op = operatingPointOf(plant, sc.overrides);
  const trainO2 = plant.liquidTrain?.flueO2DryPercent ?? null;
  if (kind === "liquid" && trainO2 !== null && sc.overrides?.flueO2DryPercent === undefined) op.flueO2DryPercent = trainO2;
  return op;
}

function prepare(sc: Scenario, index: number, field: string, plant: Plant, caches: EvaluationCaches): Prepared {
  const ctx = caches.fuels.fromDefinition(sc.fuel, `${field}.fuel`);
  const op = operatingPointFor(plant, sc, ctx.fuel.kind);
  if (op.condensing && op.returnWaterC === null)
    throw new StudyInputError(`${field}.overrides.returnWaterC`, "a condensing unit needs its return-water temperature");
  const opField = (k: string) => (sc.overrides && k in sc.overrides ? `${field}.overrides.${k}` : `plant.${k}`);
  let perf: FuelPerformance;
  try {
    checkOperatingPoint(op);
    perf = caches.performance.get(ctx, op);
  } catch (e) {
    if (e instanceof InputError && OPERATING_POINT_FIELDS.has(e.field)) throw new StudyInputError(opField(e.field), e.detail);
    // Any other Stoke error belongs to this scenario (its fuel or its conditions); anything else is a bug.
    rethrowUnder(field, e);
  }
  return { scenario: sc, index, field, ctx, op, perf };
}

/** A fuel's balance at rated duty and at the average load (radiation share of each firing rate). */
function atLoads(perf: Perf, duty: PlantDuty): { rated: EfficiencyResult; annual: EfficiencyResult } {
  try {
    return { rated: efficiencyAtUseful(perf, duty, duty.ratedUseful_kW), annual: efficiencyAtUseful(perf, duty, duty.averageUseful_kW) };
  } catch (e) {
    if (e instanceof InputError) throw new StudyInputError(`plant.${e.field}`, e.detail);
    throw e;
  }
}

function flameSolveSummary(needed: FlameSolveNeed[], flames: FlameLookup | undefined): StudyResult["flameSolves"] {
  let solved = 0;
  let failed = 0;
  for (const n of needed) {
    const o = flames?.get(n.key);
    if (o === undefined) continue;
    if ("error" in o) failed++;
    else solved++;
  }
  return { needed, solved, failed, pending: needed.length - solved - failed };
}

export function evaluateStudy(study: Study, options: EvaluationOptions = {}): StudyResult {
  const caches = options.caches ?? createEvaluationCaches();
  const hitsBefore = caches.performance.hits;
  const plant = study.plant;
  const fin: FinanceAssumptions = {
    discountRatePercent: study.discountRatePercent,
    horizonYears: study.horizonYears,
    priceEscalationPercent: study.priceEscalationPercent,
  };
  const metric = study.rankingMetric;
  const notes: string[] = [];

  const base = prepare(study.baseline, -1, "baseline", plant, caches);
  const cands = study.scenarios.map((sc, i) => prepare(sc, i, `scenarios.${i}`, plant, caches));
  let duty: PlantDuty;
  try {
    duty = plantDuty(plant, base.ctx, base.perf);
  } catch (e) {
    if (e instanceof InputError) throw new StudyInputError(`plant.${e.field}`, e.detail);
    throw e;
  }
  const loads = new Map<Prepared, { rated: EfficiencyResult; annual: EfficiencyResult }>();
  const loadsOf = (p: Prepared) => {
    let l = loads.get(p);
    if (!l) {
      l = atLoads(p.perf, duty);
      loads.set(p, l);
    }
    return l;
  };
  const wobbeRef = (ctx: FuelContext) => ctx.wobbe(plant.wobbeCombustionReferenceC, METERING_REFERENCE_C[plant.wobbeMeteringReference]);

  const fip = (p: Prepared): FuelInPlant => {
    const rated = loadsOf(p).rated;
    return { ctx: p.ctx, perf: p.perf, rated, flows: flowsForUseful(plant, p.ctx, p.perf, rated, duty.ratedUseful_kW) };
  };
  const baseFip = fip(base);

  // The liquid train of a dual-fuel plant: its reference liquid is the burner set-up and the
  // flame reference of every liquid candidate (when the baseline itself is not a liquid).
  const train = plant.liquidTrain ?? null;
  let liquidRef: { fip: FuelInPlant; label: string } | null = null;
  if (train && base.ctx.fuel.kind !== "liquid" && cands.some((c) => c.ctx.fuel.kind === "liquid")) {
    const refScenario: Scenario = { ...study.baseline, name: "liquid train reference", fuel: train.referenceFuel, overrides: {} };
    const rp = prepare(refScenario, -2, "plant.liquidTrain.referenceFuel", plant, caches);
    if (rp.ctx.fuel.kind !== "liquid") throw new StudyInputError("plant.liquidTrain.referenceFuel", "must be a liquid fuel");
    liquidRef = { fip: fip(rp), label: train.referenceFuel.name ?? rp.ctx.label };
  }

  // Flame solves: every request the study needs, each once, in the order they are met.
  const needs = new Map<string, FlameSolveNeed>();
  const needFlame = (b: BurnerResult, usedBy: string) => {
    if (!b.flame.key) return;
    const n = needs.get(b.flame.key);
    if (n) n.usedBy.push(usedBy);
    else needs.set(b.flame.key, { key: b.flame.key, request: flameRequestOfKey(b.flame.key), usedBy: [usedBy] });
  };
  const baseBurner = burnerResult({
    plant,
    reference: baseFip,
    referenceLabel: "the baseline fuel",
    cand: baseFip,
    baselineFlame: null,
    flames: options.flames,
  });
  const baselineFlame = baseBurner.flame.figures;
  const burnerOf = (p: Prepared, f: FuelInPlant, plantS: Plant) => {
    const liquid = liquidRef !== null && p.ctx.fuel.kind === "liquid";
    return burnerResult({
      plant: plantS,
      reference: liquid && liquidRef ? liquidRef.fip : baseFip,
      referenceLabel: liquid && liquidRef ? `the liquid train's reference (${liquidRef.label})` : "the baseline fuel",
      cand: f,
      baselineFlame: liquid ? null : baselineFlame,
      flames: options.flames,
    });
  };

  /** Upstream CO2e per GJ (net), or null when the fuel (or a blend component) states no factor: unknown, never 0. */
  const upstreamOf = (p: Prepared): number | null => p.ctx.co2.upstreamCo2e_kg_per_GJ_lhv ?? null;
  /** Costs need the upstream factor only when the study counts upstream emissions. */
  const costable = (p: Prepared) => !study.includeUpstream || upstreamOf(p) !== null;
  const costInputs = (p: Prepared, price: NormalisedPrice): CostInputs | null => (costable(p) ? costInputsKnown(p, price) : null);
  const costInputsKnown = (p: Prepared, price: NormalisedPrice): CostInputs => ({
    usefulHeat_MWh: duty.annualUseful_MWh,
    efficiencyNet: loadsOf(p).annual.net.efficiency,
    grossOverNet: p.ctx.hv.hhv_MJ_per_kg / p.ctx.hv.lhv_MJ_per_kg,
    deliveredPrice_per_MWh_net: price.perMWh_net,
    co2Fossil_kg_per_GJ_net: p.ctx.co2.fossil_kg_per_GJ_lhv,
    co2Biogenic_kg_per_GJ_net: p.ctx.co2.biogenic_kg_per_GJ_lhv,
    // Not counted when the study leaves upstream out (costs.ts then ignores it); known whenever it is counted.
    upstreamCo2e_kg_per_GJ_net: upstreamOf(p) ?? 0,
    carbonPrice_per_t: study.carbonPrice_per_t,
    includeUpstream: study.includeUpstream,
    capex: p.scenario.capex,
    fixedOpexChange: p.scenario.fixedOpexChange,
  });

  const priceOf = (p: Prepared): NormalisedPrice | null => {
    const sc = p.scenario;
    if (sc.price) return normaliseStudyPrice(sc.price, p.ctx, `${p.field}.price`);
    if (sc.componentPrices && "blend" in sc.fuel) {
      const def = sc.fuel;
      const parts = def.blend.map((c, i) => caches.fuels.fromDefinition(c.fuel, `${p.field}.fuel.blend.${i}.fuel`));
      return blendPriceFromComponents(p.ctx, parts, sc.componentPrices, p.field);
    }
    return null;
  };
  const basePrice = priceOf(base);
  const baseCI = basePrice ? costInputs(base, basePrice) : null;
  if (!basePrice) notes.push("The baseline has no price quote: no costs, savings, NPV or break-even prices are computed.");
  else if (!baseCI)
    notes.push(
      "The baseline's upstream CO2e is unknown (no factor stated) and the study counts upstream emissions: its costs, savings, NPV and break-even prices are unknown.",
    );

  const evaluate = (p: Prepared): ScenarioResult => {
    const isBaseline = p.index === -1;
    const f = isBaseline ? baseFip : fip(p);
    const eff = loadsOf(p).annual;
    const ctx = p.ctx;
    const price = isBaseline ? basePrice : priceOf(p);
    const ci = price ? costInputs(p, price) : null;
    const costs = ci ? scenarioCosts(ci) : null;
    const comparison = !isBaseline && ci && baseCI ? compare(baseCI, ci, fin) : null;
    const tor = !isBaseline && ci && baseCI && options.tornado !== false ? tornado(metric, baseCI, ci, fin, study.sensitivity) : null;
    const plantS = plantWithOverrides(plant, p.scenario.overrides);
    const liquidOnTrain = liquidRef !== null && ctx.fuel.kind === "liquid";
    const burner = burnerOf(p, f, plantS);
    needFlame(burner, p.field);
    const checks = [
      ...fitChecks(plantS, baseFip, f, liquidOnTrain && liquidRef ? { flameReference: liquidRef } : {}),
      ...burnerChecks(plantS, liquidOnTrain && liquidRef ? liquidRef.fip : baseFip, f, burner),
    ];
    const worst = worstStatus(checks.map((c) => c.status));
    const status: ScenarioStatus = worst === "fail" ? "infeasible" : worst === "warn" ? "feasible-with-warnings" : "feasible";
    const w = wobbeRef(ctx);
    const wb = wobbeRef(base.ctx);
    const up = upstreamOf(p);
    const etaN = eff.net.efficiency;
    const co2Useful = {
      fossil: ctx.co2.fossil_kg_per_GJ_lhv / etaN,
      biogenic: ctx.co2.biogenic_kg_per_GJ_lhv / etaN,
      upstream: up === null ? null : up / etaN,
      ranked: study.includeUpstream
        ? up === null
          ? null
          : (ctx.co2.fossil_kg_per_GJ_lhv + up) / etaN
        : ctx.co2.fossil_kg_per_GJ_lhv / etaN,
    };
    const sClass = siegertClassOf(ctx.fuel);
    const op = p.op;
    const label = p.scenario.fuel.name ?? ctx.label;
    let metricValue: number | null;
    switch (metric) {
      case "cost-per-useful-MWh":
        metricValue = costs ? costs.costPerUsefulMWh.total : null;
        break;
      case "co2-per-useful-MJ":
        metricValue = co2Useful.ranked;
        break;
      case "abatement-cost":
        metricValue = comparison ? comparison.abatementCost_per_t : null;
        break;
      case "npv":
        metricValue = isBaseline ? (baseCI ? 0 : null) : comparison ? comparison.npv : null;
        break;
    }
    const scenarioNotes = [...ctx.fuel.notes];
    if (price && !p.scenario.price) {
      scenarioNotes.push(
        `blend priced from its components' quotes (mass-weighted delivered price per kg): ${price.perMWh_net.toFixed(2)} per MWh (net) = ${price.perMWh_gross.toFixed(2)} per MWh (gross) = ${price.perKg.toFixed(4)} per kg`,
      );
    }
    if (price && p.scenario.price) {
      scenarioNotes.push(
        `price ${p.scenario.price.amount} + ${p.scenario.price.transportAdder} transport + ${p.scenario.price.handlingAdder} handling ${p.scenario.price.currency} per ${priceUnitLabel(priceTerms(p.scenario.price))} = ${price.perMWh_net.toFixed(2)} per MWh (net) = ${price.perMWh_gross.toFixed(2)} per MWh (gross) = ${price.perKg.toFixed(4)} per kg`,
      );
    }
    if (!price) scenarioNotes.push("no price quote: cost figures omitted");
    if (op.flueCODryPpm > 0) {
      scenarioNotes.push(
        `${op.flueCODryPpm} ppm CO in the dry flue gas, charged at its heat of combustion (${coHeatOfCombustion_MJ_per_m3().toFixed(2)} MJ per m³ of CO at 0 °C): ${eff.net.percent.unburntCO.toFixed(3)} % of the net input`,
      );
    }
    if (op.unburntCarbonInAshPercent > 0) {
      scenarioNotes.push(
        ctx.fuel.ash_kg_per_kg > 0
          ? `${op.unburntCarbonInAshPercent} % carbon in the residue = ${(1000 * eff.unburntCarbon_kg_per_kg).toFixed(2)} g unburnt carbon per kg fuel, charged at ${(UNBURNT_CARBON_HEATING_VALUE_J_per_kg / 1e6).toFixed(2)} MJ/kg (ASME PTC 4): ${eff.net.percent.unburntCarbon.toFixed(2)} % of the net input`
          : `unburnt carbon in the ash (${op.unburntCarbonInAshPercent} %) does not apply: this fuel has no ash`,
      );
    }
    return {
      index: p.index,
      name: p.scenario.name,
      isBaseline,
      fuel: {
        label,
        kind: ctx.fuel.kind,
        definition: p.scenario.fuel,
        hhv_MJ_per_kg: ctx.hv.hhv_MJ_per_kg,
        lhv_MJ_per_kg: ctx.hv.lhv_MJ_per_kg,
        heatingValueBasis: "per kg as fired, combustion reference 25 °C",
        h2SharePercent: ctx.h2SharePercent,
        biogenicCarbonShare: ctx.fuel.biogenicCarbonShare,
        wobbe: w,
        co2_kg_per_GJ: {
          fossil_net: ctx.co2.fossil_kg_per_GJ_lhv,
          biogenic_net: ctx.co2.biogenic_kg_per_GJ_lhv,
          fossil_gross: ctx.co2.fossil_kg_per_GJ_hhv,
          biogenic_gross: ctx.co2.biogenic_kg_per_GJ_hhv,
          upstream_net: ctx.co2.upstreamCo2e_kg_per_GJ_lhv ?? null,
        },
      },
      operatingPoint: op,
      efficiency: {
        gross: eff.gross.efficiency,
        net: etaN,
        ratedLoad: { gross: f.rated.gross.efficiency, net: f.rated.net.efficiency },
        averageLoadFraction: duty.averageLoadFraction,
        lossesGrossPercent: eff.gross.percent,
        lossesNetPercent: eff.net.percent,
        lambda: eff.lambda,
        excessAirPercent: p.perf.excessAirPercent,
        flueO2DryPercent: op.flueO2DryPercent,
        dewPointC: eff.dewPointC,
        condensedFraction: eff.condensedFraction,
        condensingTemperatureC: eff.condensingTemperatureC,
        unburntCarbon_kg_per_kg: eff.unburntCarbon_kg_per_kg,
        siegert: sClass
          ? {
              fuelClass: SIEGERT_CONSTANTS[sClass].label,
              siegertPercent: siegertLossPercent(sClass, op.stackTemperatureC, op.combustionAirC, op.flueO2DryPercent),
              heatLossMethodPercent: eff.siegertDefinitionLossPercent,
              heatLossMethodDefinition: SIEGERT_COMPARISON_DEFINITION,
            }
          : null,
        basis: `efficiency = useful heat ÷ fuel heat input at HHV (gross) or LHV (net), 25 °C reference; heat-loss method; at the average load (${(100 * duty.averageLoadFraction).toFixed(0)} % of rated input; radiation and casing loss a constant heat flow)`,
      },
      flame:
        p.perf.flame && (liquidOnTrain && liquidRef ? liquidRef.fip.perf.flame : base.perf.flame)
          ? {
              temperatureC: p.perf.flame.temperatureC,
              shiftK:
                p.perf.flame.temperatureK - ((liquidOnTrain && liquidRef ? liquidRef.fip.perf.flame : base.perf.flame)?.temperatureK ?? 0),
              method: p.perf.flame.methodLabel,
            }
          : null,
      ...(p.perf.flameError ? { flameError: p.perf.flameError } : {}),
      wobbeShiftPercent: w && wb ? pct(w.gross_MJ_per_m3, wb.gross_MJ_per_m3) : null,
      ratedFlows: f.flows,
      flowChangePercent: {
        fuelMass: pct(f.flows.fuel_kg_per_h, baseFip.flows.fuel_kg_per_h),
        fuelVolume:
          f.flows.fuelVolume_per_h &&
          baseFip.flows.fuelVolume_per_h &&
          f.flows.fuelVolume_per_h.kind === baseFip.flows.fuelVolume_per_h.kind
            ? pct(f.flows.fuelVolume_per_h.value, baseFip.flows.fuelVolume_per_h.value)
            : null,
        air: pct(f.flows.air_m3_per_h_normal, baseFip.flows.air_m3_per_h_normal),
        flueGas: pct(f.flows.flueGas_m3_per_h_normal, baseFip.flows.flueGas_m3_per_h_normal),
      },
      annual: annualDemand(plant, ctx, p.perf, eff, duty.annualUseful_MWh),
      co2PerUsefulMJ_g: co2Useful,
      annualCo2_t: {
        fossil: (co2Useful.fossil * duty.annualUseful_MWh * MJ_per_MWh) / MJ_per_GJ / kg_per_t,
        biogenic: (co2Useful.biogenic * duty.annualUseful_MWh * MJ_per_MWh) / MJ_per_GJ / kg_per_t,
        upstream: co2Useful.upstream === null ? null : (co2Useful.upstream * duty.annualUseful_MWh * MJ_per_MWh) / MJ_per_GJ / kg_per_t,
      },
      price: price
        ? p.scenario.price
          ? {
              ...price,
              unitLabel: priceUnitLabel(priceTerms(p.scenario.price)),
              currency: p.scenario.price.currency,
              origin: "quote",
              quote: p.scenario.price,
              componentQuotes: null,
            }
          : {
              ...price,
              unitLabel: "kg",
              currency: study.currency,
              origin: "blend of component quotes",
              quote: null,
              componentQuotes: p.scenario.componentPrices ?? null,
            }
        : null,
      costInputs: ci,
      costs,
      comparison,
      tornado: tor,
      checks,
      burner,
      status,
      worstCheck: worst,
      metricValue,
      rank: null,
      cautions: cautionsFor(p.scenario.fuel)
        .map((c) => c.hazard)
        .filter((h) => h !== "burner-change"),
      audit: {
        inputs: {
          fuel: p.scenario.fuel,
          price: p.scenario.price ?? null,
          componentPrices: p.scenario.componentPrices ?? null,
          capex: p.scenario.capex,
          fixedOpexChange: p.scenario.fixedOpexChange,
          overrides: p.scenario.overrides,
        },
        notes: scenarioNotes,
      },
    };
  };

  const baseline = evaluate(base);
  const scenarios = cands.map(evaluate);

  // Stated price and carbon paths: NPV, payback and abatement cost year by year (price-paths.ts).
  if (study.paths) {
    const pp = studyPricePaths(study, caches, [baseline, ...scenarios]);
    pathEconomicsOf(pp, [baseline, ...scenarios], duty.annualUseful_MWh).forEach((p, i) => {
      const r = scenarios[i];
      const k = r.comparison;
      if (!p || !k) return;
      k.npv = p.npv;
      k.simplePaybackYears = p.simplePaybackYears;
      k.discountedPaybackYears = p.discountedPaybackYears;
      k.abatementCost_per_t = p.abatementCost_per_t;
      if (metric === "npv") r.metricValue = p.npv;
      if (metric === "abatement-cost") r.metricValue = p.abatementCost_per_t;
    });
    notes.push(
      ...pp.notes,
      `price paths stated (${pp.factors.finance.terms} terms, discount rate ${pp.factors.finance.discountRatePercent.toFixed(3)} %): NPV, payback and abatement cost follow them year by year; year-1 costs, savings and break-even prices are at the quotes`,
    );
  }

  // Ranking: feasible before infeasible; within each, by the metric (undefined values last).
  const info = RANKING_METRIC_INFO[metric];
  const all = [baseline, ...scenarios];
  const order = [...all].sort((a, b) => {
    const fa = a.status === "infeasible" ? 1 : 0;
    const fb = b.status === "infeasible" ? 1 : 0;
    if (fa !== fb) return fa - fb;
    if (a.metricValue === null && b.metricValue === null) return a.index - b.index;
    if (a.metricValue === null) return 1;
    if (b.metricValue === null) return -1;
    const d = info.better === "lower" ? a.metricValue - b.metricValue : b.metricValue - a.metricValue;
    return d !== 0 ? d : a.index - b.index;
  });
  const entries: RankingEntry[] = order.map((r, i) => {
    r.rank = i + 1;
    return { rank: i + 1, index: r.index, name: r.name, isBaseline: r.isBaseline, value: r.metricValue, status: r.status };
  });

  // Hydrogen sweep on the baseline gas.
  const doSweep = options.sweep ?? study.hydrogenSweep.enabled;
  let sweep: HydrogenSweepResult | null = null;
  if (doSweep) {
    sweep = hydrogenSweep({
      study,
      plant,
      duty,
      caches,
      baseline: { definition: study.baseline.fuel, fip: baseFip, price: basePrice, costInputs: baseCI },
      scenarios: cands.map((c, i) => ({ ctx: c.ctx, price: scenarios[i].price })),
      fin,
      flames: options.flames,
      needFlame,
      baselineFlame,
    });
  }

  // Cautions: every hazard of a fuel considered, the burner change when any candidate differs
  // from the baseline fuel, hydrogen whenever the sweep runs.
  const byHazard = new Map<HazardKey, Caution>();
  const addAll = (def: FuelDefinition) => {
    for (const c of cautionsFor(def)) if (c.hazard !== "burner-change" && !byHazard.has(c.hazard)) byHazard.set(c.hazard, c);
  };
  addAll(study.baseline.fuel);
  for (const sc of study.scenarios) addAll(sc.fuel);
  if (sweep?.available) addAll(study.hydrogenSweep.hydrogen);
  if (cands.some((c) => c.ctx.key !== base.ctx.key) || sweep?.available) {
    const bc = cautionsFor(study.baseline.fuel).find((c) => c.hazard === "burner-change");
    if (bc) byHazard.set("burner-change", bc);
  }

  return {
    study: {
      name: study.name,
      currency: study.currency,
      carbonPrice_per_t: study.carbonPrice_per_t,
      discountRatePercent: study.discountRatePercent,
      horizonYears: study.horizonYears,
      priceEscalationPercent: study.priceEscalationPercent,
      includeUpstream: study.includeUpstream,
      rankingMetric: metric,
      finance: fin,
      sensitivity: study.sensitivity,
    },
    plant: { ...plant, equipmentLabel: EQUIPMENT_TYPE_LABELS[plant.equipmentType] },
    duty,
    baseline,
    scenarios,
    ranking: { metric, label: info.label, unit: info.unit.replace("currency", study.currency), better: info.better, entries },
    hydrogenSweep: sweep,
    cautions: { screening: DEFER, items: [...byHazard.values()] },
    burner: { screening: BURNER_SCREENING_NOTE, cautions: BURNER_CAUTIONS },
    flameSolves: flameSolveSummary([...needs.values()], options.flames),
    audit: { methods: [...STUDY_METHODS], assumptions: studyAssumptions(), notes },
    stats: {
      fuelStates: caches.fuels.size,
      performanceStates: caches.performance.size,
      performanceCacheHits: caches.performance.hits - hitsBefore,
    },
  };
}
