/** How the uncertainty ranking's figures are written, on its page and in the report. */
import type { Percentiles, UncertaintyResult, UncertaintyScenario } from "@/lib/study/uncertainty";
import { fmt, money } from "../../_ui/format";

/** A probability as a percentage with one decimal. */
export const pct = (p: number) => fmt(100 * p, 1);

/** Writes a value of the run's ranking metric (money for NPV). */
export function metricFormat(r: Pick<UncertaintyResult, "metric" | "currency">): (v: number) => string {
  return r.metric === "npv" ? (v: number) => money(v, r.currency, 0) : (v: number) => fmt(v, Math.abs(v) >= 1000 ? 0 : 2);
}

/** P10 / P50 / P90, or a dash when unknown. */
export function band(p: Percentiles | null, f: (v: number) => string): string {
  return p ? `${f(p.p10)} / ${f(p.p50)} / ${f(p.p90)}` : "–";
}

/** Options ordered by their chance of ranking first (then as in the study). */
export const byChanceFirst = (scenarios: UncertaintyScenario[]) => [...scenarios].sort((a, b) => b.pFirst - a.pFirst || a.index - b.index);

/** The option's name cell: baseline marked, and why it is not ranked when it is not. */
export function OptionName({ s }: { s: UncertaintyScenario }) {
  return (
    <td>
      {s.name}
      {s.isBaseline ? " (baseline)" : ""}
      {s.excludedReason && <div className="unit">not ranked: {s.excludedReason}</div>}
    </td>
  );
}

/** P(first) ± its standard error, or a dash for an option not ranked. */
export const pFirstText = (s: UncertaintyScenario) => (s.ranked ? `${pct(s.pFirst)} ± ${pct(s.pFirstSE)}` : "–");

/** P(NPV > 0) ± its standard error, or a dash when unknown. */
export const pNpvText = (s: UncertaintyScenario) =>
  s.pNpvPositive === null ? "–" : `${pct(s.pNpvPositive)} ± ${pct(s.pNpvPositiveSE ?? 0)}`;
