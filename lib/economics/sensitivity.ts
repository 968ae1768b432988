/**
 * Ranking metrics and one-at-a-time sensitivity (tornado) over fuel prices, carbon price,
 * efficiency and capex.
 */
import { compare, scenarioCosts, type CostInputs, type FinanceAssumptions } from "./costs";

import { SENSITIVITY_DEFAULTS, type RankingMetric, type SensitivityRanges } from "../schemas/study";

export { RANKING_METRICS, type RankingMetric, type SensitivityRanges } from "../schemas/study";

export const RANKING_METRIC_INFO: Record<RankingMetric, { label: string; unit: string; better: "lower" | "higher" }> = {
  "cost-per-useful-MWh": { label: "energy cost per useful MWh (fuel + carbon)", unit: "currency/MWh useful", better: "lower" },
  "co2-per-useful-MJ": { label: "CO2 per useful MJ (fossil, plus upstream when included)", unit: "g/MJ useful", better: "lower" },
  "abatement-cost": { label: "abatement cost per t CO2 avoided (carbon price excluded)", unit: "currency/t", better: "lower" },
  npv: { label: "NPV of switching over the horizon", unit: "currency", better: "higher" },
};

/** Value of a metric for a candidate against the baseline; null where it is undefined (e.g. no CO2 avoided). */
export function metricValue(metric: RankingMetric, base: CostInputs, cand: CostInputs, fin: FinanceAssumptions): number | null {
  switch (metric) {
    case "cost-per-useful-MWh":
      return scenarioCosts(cand).costPerUsefulMWh.total;
    case "co2-per-useful-MJ": {
      const c = scenarioCosts(cand).co2PerUsefulMJ_g;
      return c.fossil + (cand.includeUpstream ? c.upstream : 0);
    }
    case "abatement-cost":
      return compare(base, cand, fin).abatementCost_per_t;
    case "npv":
      return compare(base, cand, fin).npv;
  }
}

export type TornadoParameter =
  | "candidate-fuel-price"
  | "baseline-fuel-price"
  | "carbon-price"
  | "candidate-efficiency"
  | "baseline-efficiency"
  | "capex";

export interface TornadoRow {
  parameter: TornadoParameter;
  label: string;
  unit: string;
  baseInput: number;
  lowInput: number;
  highInput: number;
  /** Metric at the low and high input; null where the metric is undefined there. */
  metricAtLow: number | null;
  metricAtHigh: number | null;
  /** |metricAtHigh − metricAtLow| (0 when either is undefined). */
  swing: number;
}

export interface Tornado {
  metric: RankingMetric;
  baseValue: number | null;
  /** Inputs that move the metric, largest swing first. */
  rows: TornadoRow[];
  /** Inputs that cannot move this metric (no swing at either end); listed, not drawn. */
  noEffect: { parameter: TornadoParameter; label: string }[];
  notes: string[];
}

/** Tornado data for one candidate against the baseline; rows sorted by swing, largest first. */
export function tornado(
  metric: RankingMetric,
  base: CostInputs,
  cand: CostInputs,
  fin: FinanceAssumptions,
  ranges: SensitivityRanges = SENSITIVITY_DEFAULTS,
): Tornado {
  const notes: string[] = [];
  const pct = (v: number, p: number, sign: -1 | 1) => v * (1 + (sign * p) / 100);
  const effClamp = (e: number) => Math.min(1.2, Math.max(0.05, e));
  type Variation = {
    parameter: TornadoParameter;
    label: string;
    unit: string;
    value: number;
    apply: (v: number) => [CostInputs, CostInputs];
    lo: number;
    hi: number;
  };
  const carbon = base.carbonPrice_per_t;
  const variations: Variation[] = [
    {
      parameter: "candidate-fuel-price",
      label: "candidate delivered fuel price",
      unit: "currency/MWh (net)",
      value: cand.deliveredPrice_per_MWh_net,
      apply: (v) => [base, { ...cand, deliveredPrice_per_MWh_net: v }],
      lo: pct(cand.deliveredPrice_per_MWh_net, ranges.fuelPricePercent, -1),
      hi: pct(cand.deliveredPrice_per_MWh_net, ranges.fuelPricePercent, 1),
    },
    {
      parameter: "baseline-fuel-price",
      label: "baseline delivered fuel price",
      unit: "currency/MWh (net)",
      value: base.deliveredPrice_per_MWh_net,
      apply: (v) => [{ ...base, deliveredPrice_per_MWh_net: v }, cand],
      lo: pct(base.deliveredPrice_per_MWh_net, ranges.fuelPricePercent, -1),
      hi: pct(base.deliveredPrice_per_MWh_net, ranges.fuelPricePercent, 1),
    },
    {
      parameter: "carbon-price",
      label: "carbon price",
      unit: "currency/t CO2",
      value: carbon,
      apply: (v) => [
        { ...base, carbonPrice_per_t: v },
        { ...cand, carbonPrice_per_t: v },
      ],
      lo: Math.max(0, pct(carbon, ranges.carbonPricePercent, -1)),
      hi: pct(carbon, ranges.carbonPricePercent, 1),
    },
    {
      parameter: "candidate-efficiency",
      label: "candidate efficiency (net basis)",
      unit: "fraction",
      value: cand.efficiencyNet,
      apply: (v) => [base, { ...cand, efficiencyNet: v }],
      lo: effClamp(cand.efficiencyNet - ranges.efficiencyPoints / 100),
      hi: effClamp(cand.efficiencyNet + ranges.efficiencyPoints / 100),
    },
    {
      parameter: "baseline-efficiency",
      label: "baseline efficiency (net basis)",
      unit: "fraction",
      value: base.efficiencyNet,
      apply: (v) => [{ ...base, efficiencyNet: v }, cand],
      lo: effClamp(base.efficiencyNet - ranges.efficiencyPoints / 100),
      hi: effClamp(base.efficiencyNet + ranges.efficiencyPoints / 100),
    },
    {
      parameter: "capex",
      label: "switching capex",
      unit: "currency",
      value: cand.capex,
      apply: (v) => [base, { ...cand, capex: v }],
      lo: Math.max(0, pct(cand.capex, ranges.capexPercent, -1)),
      hi: pct(cand.capex, ranges.capexPercent, 1),
    },
  ];
  const rows: TornadoRow[] = variations.map((v) => {
    const low = metricValue(metric, ...v.apply(v.lo), fin);
    const high = metricValue(metric, ...v.apply(v.hi), fin);
    return {
      parameter: v.parameter,
      label: v.label,
      unit: v.unit,
      baseInput: v.value,
      lowInput: v.lo,
      highInput: v.hi,
      metricAtLow: low,
      metricAtHigh: high,
      swing: low === null || high === null ? 0 : Math.abs(high - low),
    };
  });
  const baseValue = metricValue(metric, base, cand, fin);
  // An input moves the metric when either end differs from the base value by more than rounding.
  const tolerance = 1e-9 * Math.max(1, Math.abs(baseValue ?? 0));
  const moves = (r: TornadoRow) =>
    baseValue === null ||
    r.metricAtLow === null ||
    r.metricAtHigh === null ||
    Math.abs(r.metricAtLow - baseValue) > tolerance ||
    Math.abs(r.metricAtHigh - baseValue) > tolerance;
  const moving = rows.filter(moves).sort((a, b) => b.swing - a.swing);
  const noEffect = rows.filter((r) => !moves(r)).map((r) => ({ parameter: r.parameter, label: r.label }));
  if (noEffect.length) notes.push(`cannot move this metric, so not drawn: ${noEffect.map((r) => r.label).join(", ")}`);
  return { metric, baseValue, rows: moving, noEffect, notes };
}
