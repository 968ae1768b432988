/**
 * The hydrogen sweep and the comparison price the same blend differently when the scenario brings
 * its own quote, changes the operating point or blends into another gas. For every hydrogen-blend
 * scenario of a study this says, on one line, whether its cost per useful MWh agrees with the sweep
 * at the same share, and if not, why.
 */
import type { StudyResult } from "./evaluate";
import { fieldLabel } from "../schemas/labels";

export interface SweepScenarioAgreement {
  scenario: string;
  h2Percent: number;
  comparisonCost: number | null;
  sweepCost: number | null;
  /** The sweep has a point at exactly this share (otherwise the nearest two are interpolated). */
  exactPoint: boolean;
  agrees: boolean;
  /** Why the figures differ (empty when they agree). */
  reasons: string[];
}

/** Relative difference under which two costs are the same figure (rounding of the shown digits). */
const SAME = 5e-4;

function atShare<T>(
  points: readonly { h2Percent: number }[],
  share: number,
  value: (i: number) => T | null,
): { v: number | null; exact: boolean } {
  const i = points.findIndex((p) => p.h2Percent >= share - 1e-9);
  if (i < 0) return { v: null, exact: false };
  const exact = Math.abs(points[i].h2Percent - share) < 1e-9;
  const vi = value(i) as number | null;
  if (exact || i === 0) return { v: vi, exact };
  const v0 = value(i - 1) as number | null;
  if (vi === null || v0 === null) return { v: null, exact: false };
  const t = (share - points[i - 1].h2Percent) / (points[i].h2Percent - points[i - 1].h2Percent);
  return { v: v0 + t * (vi - v0), exact: false };
}

export function sweepAgreement(result: StudyResult): SweepScenarioAgreement[] {
  const sw = result.hydrogenSweep;
  if (!sw?.available || !sw.points.length) return [];
  const out: SweepScenarioAgreement[] = [];
  for (const r of result.scenarios) {
    if (r.fuel.kind !== "gas" || !(r.fuel.h2SharePercent > 0) || r.fuel.h2SharePercent >= 100) continue;
    const share = r.fuel.h2SharePercent;
    const cost = atShare(sw.points, share, (i) => sw.points[i].costPerUsefulMWh);
    const wobbe = atShare(sw.points, share, (i) => sw.points[i].wobbeGross_MJ_per_m3);
    const comparisonCost = r.costs?.costPerUsefulMWh.total ?? null;
    const reasons: string[] = [];
    const w = r.fuel.wobbe?.gross_MJ_per_m3 ?? null;
    if (w !== null && wobbe.v !== null && Math.abs(w - wobbe.v) > 1e-3 * wobbe.v) {
      reasons.push("the scenario's gas is not the baseline gas with hydrogen (its Wobbe index differs from the sweep's at this share)");
    }
    const changed = Object.keys(r.audit.inputs.overrides ?? {});
    if (changed.length) reasons.push(`the scenario changes ${changed.map(fieldLabel).join(", ")}`);
    if (r.price?.origin === "quote") {
      reasons.push("the scenario is priced by its own quote, while the sweep mixes the baseline gas price and the hydrogen price by mass");
    }
    if (!cost.exact) reasons.push(`the sweep has no point at ${share} % and is interpolated between its neighbours`);
    const agrees = comparisonCost !== null && cost.v !== null && Math.abs(comparisonCost - cost.v) <= SAME * Math.abs(cost.v);
    if (!agrees && comparisonCost !== null && cost.v !== null && reasons.length === 0) {
      reasons.push("the scenario's blend components are priced from quotes other than the sweep's baseline and hydrogen prices");
    }
    out.push({
      scenario: r.name,
      h2Percent: share,
      comparisonCost,
      sweepCost: cost.v,
      exactPoint: cost.exact,
      agrees,
      reasons: agrees ? [] : reasons,
    });
  }
  return out;
}
