/** View settings of the study pages, from the address (choices for this view; absent = the study's stored setting). */
import { RANKING_METRICS, RANKING_METRIC_INFO, type RankingMetric } from "@/lib/economics/sensitivity";

export type SearchParams = Record<string, string | string[] | undefined>;

export interface ViewChoice {
  /** Metric chosen in the address, if any (else the study's own). */
  metric?: RankingMetric;
  /** Upstream CO2e counted (true) or not (false) in this view; undefined = as the study stores it. */
  includeUpstream?: boolean;
}

const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);

export function viewChoice(sp: SearchParams): ViewChoice {
  const m = one(sp.metric);
  return {
    metric: m && (RANKING_METRICS as readonly string[]).includes(m) ? (m as RankingMetric) : undefined,
    includeUpstream: upstreamParam(one(sp.upstream) ?? null),
  };
}

/** Query string carrying the view choice (and extras), for links between the study pages. */
export function viewQuery(v: ViewChoice, extra: Record<string, string | number | undefined> = {}): string {
  const q = new URLSearchParams();
  if (v.metric) q.set("metric", v.metric);
  if (v.includeUpstream !== undefined) q.set("upstream", v.includeUpstream ? "1" : "0");
  for (const [k, val] of Object.entries(extra)) if (val !== undefined) q.set(k, String(val));
  const s = q.toString();
  return s ? `?${s}` : "";
}

/** `upstream=1` counts upstream CO2e, `upstream=0` does not; anything else leaves the study's setting. */
export function upstreamParam(v: string | null): boolean | undefined {
  return v === "1" ? true : v === "0" ? false : undefined;
}

export function intParam(sp: SearchParams, key: string): number | null {
  const v = one(sp[key]);
  return v !== undefined && /^-?\d{1,6}$/.test(v) ? Number(v) : null;
}

export function numParam(sp: SearchParams, key: string): number | undefined {
  const v = one(sp[key]);
  if (v === undefined || v.trim() === "") return undefined;
  const n = Number(v);
  return Number.isFinite(n) ? n : undefined;
}

export const METRIC_SHORT: Record<RankingMetric, string> = {
  "cost-per-useful-MWh": "Cost per useful energy",
  "co2-per-useful-MJ": "CO2 per useful MJ",
  "abatement-cost": "Abatement cost",
  npv: "NPV of switching",
};

export { RANKING_METRICS, RANKING_METRIC_INFO };
