/**
 * Shapes a study result for display: scenarios in rank order, chart rows in display units, the
 * headline answer. Only picks and converts figures lib/ computed; no physics or economics here.
 */
import type { ScenarioResult, StudyResult } from "@/lib/study/evaluate";
import type { StudyBundle, ScenarioMeta } from "@/lib/services/studies";
import type { RankingMetric } from "@/lib/economics/sensitivity";
import type { CostRow, Co2Row, ScatterPoint } from "../../_charts/ScenarioCharts";
import type { Display } from "./display";
import { fmt, money } from "../../_ui/format";

export interface Ranked {
  r: ScenarioResult;
  meta: ScenarioMeta;
}

export function ranked(result: StudyResult, bundle: StudyBundle): Ranked[] {
  const all: Ranked[] = [
    { r: result.baseline, meta: bundle.meta.baseline },
    ...result.scenarios.map((r, i) => ({ r, meta: bundle.meta.scenarios[i] })),
  ];
  return all.sort((a, b) => (a.r.rank ?? 1e9) - (b.r.rank ?? 1e9));
}

/** CO2 per useful MJ as ranked (fossil, plus upstream when included); null where upstream is counted but unknown. */
export function co2Ranked(r: ScenarioResult): number | null {
  return r.co2PerUsefulMJ_g.ranked;
}

export function costRows(list: Ranked[], d: Display): CostRow[] {
  return list.map(({ r }) => ({
    name: r.name,
    status: r.status,
    isBaseline: r.isBaseline,
    fuel: r.costs ? d.costPerEnergyValue(r.costs.costPerUsefulMWh.fuel) : null,
    carbon: r.costs ? d.costPerEnergyValue(r.costs.costPerUsefulMWh.carbon) : null,
    upstream: r.costs ? d.costPerEnergyValue(r.costs.costPerUsefulMWh.upstream) : null,
    total: r.costs ? d.costPerEnergyValue(r.costs.costPerUsefulMWh.total) : null,
  }));
}

export function co2Rows(list: Ranked[]): Co2Row[] {
  return list.map(({ r }) => ({
    name: r.name,
    status: r.status,
    isBaseline: r.isBaseline,
    fossil: r.co2PerUsefulMJ_g.fossil,
    upstream: r.co2PerUsefulMJ_g.upstream,
    biogenic: r.co2PerUsefulMJ_g.biogenic,
  }));
}

export function scatterPoints(list: Ranked[], d: Display): ScatterPoint[] {
  return list
    .filter(({ r }) => r.costs)
    .filter(({ r }) => co2Ranked(r) !== null)
    .map(({ r }) => ({
      name: r.name,
      status: r.status,
      isBaseline: r.isBaseline,
      cost: d.costPerEnergyValue(r.costs!.costPerUsefulMWh.total),
      co2: co2Ranked(r) as number,
    }));
}

/** The ranking metric's value of a scenario, formatted with its unit, in display units. */
export function metricText(metric: RankingMetric, v: number | null, d: Display): string {
  if (v === null || !Number.isFinite(v)) return "–";
  switch (metric) {
    case "cost-per-useful-MWh":
      return `${d.costPerEnergy(v)} ${d.costPerEnergyUnit} useful`;
    case "co2-per-useful-MJ":
      return `${fmt(v, 1)} g CO2/MJ useful`;
    case "abatement-cost":
      return `${money(v, d.currency, 0)}/t CO2`;
    case "npv":
      return money(v, d.currency, 0);
  }
}

export interface Headline {
  best: Ranked | null;
  bestIsBaseline: boolean;
  bestCandidate: Ranked | null;
  lowestCo2: Ranked | null;
  infeasible: Ranked[];
}

export function headline(list: Ranked[]): Headline {
  const feasible = list.filter((x) => x.r.status !== "infeasible" && x.r.metricValue !== null);
  const best = feasible[0] ?? null;
  const bestCandidate = feasible.find((x) => !x.r.isBaseline) ?? null;
  const lowestCo2 =
    [...list.filter((x) => x.r.status !== "infeasible" && co2Ranked(x.r) !== null)].sort(
      (a, b) => (co2Ranked(a.r) as number) - (co2Ranked(b.r) as number),
    )[0] ?? null;
  return {
    best,
    bestIsBaseline: best?.r.isBaseline ?? false,
    bestCandidate,
    lowestCo2,
    infeasible: list.filter((x) => x.r.status === "infeasible"),
  };
}

export function failingChecks(r: ScenarioResult): string[] {
  return r.checks.filter((c) => c.status === "fail").map((c) => c.label);
}
