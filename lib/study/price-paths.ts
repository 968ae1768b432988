/**
 * A study's prices over the horizon: its price sources (each distinct quote is one price, keyed by
 * its first place in the study), every scenario's delivered price split into one part per source,
 * and the paths with their present-value factors (lib/economics/paths.ts).
 *
 * A blend priced from its components' quotes is linear in each component's delivered price
 * (mass-weighted mix per kg, lib/economics/prices.ts `mixPrices`), so its part of a source is the
 * change of the blend price when that quote doubles, found through the pricing code itself.
 */
import type { Scenario, Study, StudyPrice, PricePath } from "../schemas/study";
import type { CostInputs } from "../economics/costs";
import { InputError } from "../errors";
import {
  abatementCostFromPaths,
  costPerUsefulMWhYear1,
  discountedPaybackFromFlows,
  discountRateInTerms,
  pathFactors,
  pathScenarioState,
  pathValues,
  switchingCashFlows,
  switchingNpvFromPaths,
  type PathFactors,
  type PathScenario,
} from "../economics/paths";
import type { EvaluationCaches } from "./caches";
import { blendPriceFromComponents } from "./pricing";

export interface PriceSource {
  /** Key as the user writes it in paths.fuelPrices and uncertainty.fuelPrices (the quote's first place). */
  key: string;
  label: string;
  /** Every place the quote is used. */
  usedBy: string[];
}

/** What this module needs of an evaluated scenario (a ScenarioResult satisfies it). */
export interface PricedScenario {
  index: number;
  isBaseline: boolean;
  name: string;
  fuel: { label: string };
  price: { perMWh_net: number } | null;
  costInputs: CostInputs | null;
  efficiency: { net: number };
}

export interface StudyPricePaths {
  sources: PriceSource[];
  /** Per scenario (baseline first, then the candidates), its year-by-year economics; null without costs. */
  scenarios: (PathScenario | null)[];
  factors: PathFactors;
  notes: string[];
  /** The paths as applied, years 1 … N. */
  applied: { carbon_per_t: number[]; fuelIndex: { key: string; label: string; values: number[] }[] };
}

const quoteDouble = (q: StudyPrice): StudyPrice => ({
  ...q,
  amount: 2 * q.amount,
  transportAdder: 2 * q.transportAdder,
  handlingAdder: 2 * q.handlingAdder,
});

/** Sources, price parts, paths and factors of an evaluated study (`results`: baseline first). */
export function studyPricePaths(study: Study, caches: EvaluationCaches, results: readonly PricedScenario[]): StudyPricePaths {
  const notes: string[] = [];
  const sources: PriceSource[] = [];
  const byIdentity = new Map<string, number>();
  const sourceOf = (fuel: unknown, quote: StudyPrice, key: string, label: string): number => {
    const id = JSON.stringify([
      fuel,
      quote.amount,
      quote.unit,
      quote.energyBasis ?? null,
      quote.meteringReference ?? null,
      quote.transportAdder,
      quote.handlingAdder,
      quote.currency,
    ]);
    let k = byIdentity.get(id);
    if (k === undefined) {
      k = sources.length;
      byIdentity.set(id, k);
      sources.push({ key, label, usedBy: [] });
    }
    sources[k].usedBy.push(key);
    return k;
  };
  const scenarios = results.map((r): PathScenario | null => {
    const sc: Scenario = r.isBaseline ? study.baseline : study.scenarios[r.index];
    const field = r.isBaseline ? "baseline" : `scenarios.${r.index}`;
    if (!r.costInputs || !r.price) return null;
    const ci = r.costInputs;
    const parts: PathScenario["priceParts"] = [];
    if (sc.price) {
      parts.push({
        source: sourceOf(sc.fuel, sc.price, `${field}.price`, `${sc.fuel.name ?? r.fuel.label} (${sc.name})`),
        perMWh_net: r.price.perMWh_net,
      });
    } else if (sc.componentPrices && "blend" in sc.fuel) {
      const blend = sc.fuel;
      const ctx = caches.fuels.fromDefinition(sc.fuel, `${field}.fuel`);
      const comps = blend.blend.map((c, j) => caches.fuels.fromDefinition(c.fuel, `${field}.fuel.blend.${j}.fuel`));
      const nominal = r.price.perMWh_net;
      let sum = 0;
      sc.componentPrices.forEach((q, j) => {
        const doubled = sc.componentPrices!.map((p, i) => (i === j ? quoteDouble(p) : p));
        const part = blendPriceFromComponents(ctx, comps, doubled, field).perMWh_net - nominal;
        sum += part;
        const compName = blend.blend[j].fuel.name ?? comps[j].label;
        parts.push({
          source: sourceOf(blend.blend[j].fuel, q, `${field}.componentPrices.${j}`, `${compName} (component of ${sc.name})`),
          perMWh_net: part,
        });
      });
      if (Math.abs(sum - nominal) > 1e-9 * Math.max(1, Math.abs(nominal)))
        throw new Error(`blend price of ${field} is not the sum of its component parts: ${sum} vs ${nominal}`);
    }
    return {
      priceParts: parts,
      co2Fossil_kg_per_GJ_net: ci.co2Fossil_kg_per_GJ_net,
      upstreamCo2e_kg_per_GJ_net: ci.upstreamCo2e_kg_per_GJ_net,
      includeUpstream: ci.includeUpstream,
      capex: ci.capex,
      fixedOpexChange: ci.fixedOpexChange,
    };
  });

  const paths = study.paths ?? null;
  const terms = paths?.terms ?? "nominal";
  const rateTerms = paths?.discountRateTerms ?? terms;
  const inflation = paths?.inflationPercent ?? 0;
  const rate = discountRateInTerms(study.discountRatePercent, rateTerms, terms, inflation);
  if (rateTerms !== terms) {
    notes.push(
      `discount rate ${study.discountRatePercent} % (${rateTerms}) converted to ${rate.toFixed(3)} % (${terms}) by the Fisher relation (1 + nominal) = (1 + real)(1 + inflation), inflation ${inflation} % a year`,
    );
  }
  const N = study.horizonYears;
  const escalation: PricePath = { kind: "escalation", percentPerYear: study.priceEscalationPercent };
  const known = new Set(sources.map((s) => s.key));
  for (const key of Object.keys(paths?.fuelPrices ?? {})) {
    if (!known.has(key))
      throw new InputError(
        `paths.fuelPrices.${key}`,
        `no priced quote has this key; the keys are ${[...known].join(", ") || "(none: no scenario has a price)"}`,
      );
  }
  const sourceIndex = sources.map((s) => pathValues(paths?.fuelPrices?.[s.key] ?? escalation, 1, N, `paths.fuelPrices.${s.key}`));
  const carbon = pathValues(paths?.carbon ?? escalation, study.carbonPrice_per_t, N, "paths.carbon");
  if (paths?.carbon && paths.carbon.kind !== "escalation" && carbon[0] !== study.carbonPrice_per_t) {
    notes.push(
      `the carbon path's year 1 (${carbon[0]} per t) differs from the study's carbon price (${study.carbonPrice_per_t} per t): the path is used`,
    );
  }
  sources.forEach((s, i) => {
    if (sourceIndex[i][0] !== 1 && paths?.fuelPrices?.[s.key])
      notes.push(`the path of ${s.key} starts at ${sourceIndex[i][0]} × the quote in year 1`);
  });
  if (!paths)
    notes.push(
      `no paths stated: every price and the carbon price escalate at ${study.priceEscalationPercent} % a year (${terms} terms assumed for the discount rate of ${study.discountRatePercent} %)`,
    );
  return {
    sources,
    scenarios,
    factors: pathFactors({ terms, discountRatePercent: rate, horizonYears: N }, sourceIndex, carbon),
    notes,
    applied: { carbon_per_t: [...carbon], fuelIndex: sources.map((s, i) => ({ key: s.key, label: s.label, values: [...sourceIndex[i]] })) },
  };
}

export interface PathEconomics {
  index: number;
  name: string;
  costPerUsefulMWhYear1: number;
  npv: number;
  simplePaybackYears: number | null;
  discountedPaybackYears: number | null;
  abatementCost_per_t: number | null;
  /** Net saving per year, years 1 … N, in the study's path terms. */
  cashFlows: number[];
}

/**
 * Year-by-year switching figures of every priced candidate against the baseline (null where a
 * candidate or the baseline has no costs). Without stated paths they equal the flat-escalation
 * closed forms of lib/economics/costs.ts.
 */
export function pathEconomicsOf(
  p: StudyPricePaths,
  results: readonly PricedScenario[],
  annualUseful_MWh: number,
): (PathEconomics | null)[] {
  const f = p.factors;
  const [bp, ...cps] = p.scenarios;
  const [br, ...crs] = results;
  const b = bp ? pathScenarioState(bp, f, annualUseful_MWh, br.efficiency.net, null) : null;
  return cps.map((cp, i) => {
    if (!b || !bp || !cp) return null;
    const r = crs[i];
    const s = pathScenarioState(cp, f, annualUseful_MWh, r.efficiency.net, null);
    const flows = switchingCashFlows(bp, cp, f, b.fuelMWh_net, s.fuelMWh_net);
    const firstNet = flows[0];
    return {
      index: r.index,
      name: r.name,
      costPerUsefulMWhYear1: costPerUsefulMWhYear1(s, f, annualUseful_MWh),
      npv: switchingNpvFromPaths(b, s, f),
      simplePaybackYears: s.capex <= 0 ? (firstNet >= 0 ? 0 : null) : firstNet > 0 ? s.capex / firstNet : null,
      discountedPaybackYears: discountedPaybackFromFlows(s.capex, flows, f.discount),
      abatementCost_per_t: abatementCostFromPaths(b, s, f),
      cashFlows: [...flows],
    };
  });
}

/** One path as a report states it: what it is and its values, years 1 … N. */
export interface PathAssumption {
  key: string;
  label: string;
  /** The kind in words, e.g. "escalation 2 % a year (the study's rate)" or "linear between 3 points". */
  kind: string;
  values: number[];
}

export interface PathAssumptions {
  terms: string;
  discountRatePercent: number;
  notes: string[];
  /** Fuel prices as an index on their quote (1 = the quote). */
  fuel: PathAssumption[];
  /** Carbon price, currency per t. */
  carbon: PathAssumption;
}

function pathKindText(p: PricePath | undefined, study: Study): string {
  if (!p) return `escalation ${study.priceEscalationPercent} % a year (the study's rate)`;
  if (p.kind === "escalation") return `escalation ${p.percentPerYear} % a year`;
  const n = p.points.length;
  return p.kind === "table" ? `table of ${n} years` : `${p.kind} between ${n} point${n > 1 ? "s" : ""}`;
}

/** The price and carbon paths an evaluated study uses, for the report (the same paths the figures use). */
export function pathAssumptions(study: Study, results: readonly PricedScenario[], caches: EvaluationCaches): PathAssumptions {
  const pp = studyPricePaths(study, caches, results);
  return {
    terms: pp.factors.finance.terms,
    discountRatePercent: pp.factors.finance.discountRatePercent,
    notes: pp.notes,
    fuel: pp.applied.fuelIndex.map((f) => ({ ...f, kind: pathKindText(study.paths?.fuelPrices?.[f.key], study) })),
    carbon: {
      key: "carbon",
      label: "carbon price",
      kind: pathKindText(study.paths?.carbon ?? undefined, study),
      values: pp.applied.carbon_per_t,
    },
  };
}
