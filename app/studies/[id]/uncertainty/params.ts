/** The uncertainty page's address (and the JSON/CSV route's): ranges, distribution, correlation, draws, seed. */
import { PAGE_MAX_DRAWS, type UncertaintyRequest, type SymmetricRanges } from "@/lib/services/uncertainty";
import { OPERATING_HOURS_DEFAULT_PERCENT, type SensitivityRanges } from "@/lib/schemas/study";
import { intParam, numParam, viewChoice, type SearchParams } from "../../_components/settings";

export const RANGES = [
  { q: "fp", key: "fuelPricePercent" as const, label: "Fuel prices ± %", max: 200, def: (s: SensitivityRanges) => s.fuelPricePercent },
  { q: "cp", key: "carbonPricePercent" as const, label: "Carbon price ± %", max: 200, def: (s: SensitivityRanges) => s.carbonPricePercent },
  { q: "xp", key: "capexPercent" as const, label: "Capex ± %", max: 200, def: (s: SensitivityRanges) => s.capexPercent },
  { q: "ep", key: "efficiencyPoints" as const, label: "Efficiency ± points", max: 20, def: (s: SensitivityRanges) => s.efficiencyPoints },
  { q: "hp", key: "operatingHoursPercent" as const, label: "Operating hours ± %", max: 90, def: () => OPERATING_HOURS_DEFAULT_PERCENT },
  // Empty = per scenario, the band that moves its loss account by the efficiency ± points.
  { q: "sk", key: "stackTemperatureK" as const, label: "Stack after retrofit ± K", max: 150, def: () => null },
] as const;
export const SHAPES = ["triangular", "pert", "normal"] as const;
export const DEFAULT_DRAWS = 5_000;

const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);

export interface UncertaintyParams {
  request: UncertaintyRequest;
  ranges: SymmetricRanges;
  shape: (typeof SHAPES)[number];
  rho: number | undefined;
  /** Values out of range, ignored: the address field and what it allows. */
  ignored: { field: string; label: string }[];
}

export function uncertaintyParams(sp: SearchParams): UncertaintyParams {
  const view = viewChoice(sp);
  const ignored: UncertaintyParams["ignored"] = [];
  const drawsAsked = intParam(sp, "draws");
  const draws = drawsAsked !== null && drawsAsked >= 100 && drawsAsked <= PAGE_MAX_DRAWS ? drawsAsked : DEFAULT_DRAWS;
  if (drawsAsked !== null && draws !== drawsAsked) ignored.push({ field: "draws", label: `draws (100–${PAGE_MAX_DRAWS})` });
  const seedAsked = intParam(sp, "seed");
  const seed = seedAsked !== null && seedAsked >= 0 ? seedAsked : 1;
  const shapeAsked = one(sp.shape);
  const shape = (SHAPES as readonly string[]).includes(shapeAsked ?? "") ? (shapeAsked as (typeof SHAPES)[number]) : "triangular";
  const ranges: SymmetricRanges = {};
  for (const r of RANGES) {
    const v = numParam(sp, r.q);
    if (v === undefined) continue;
    if (v >= 0 && v <= r.max) ranges[r.key] = v;
    else ignored.push({ field: r.q, label: `${r.label} (0–${r.max})` });
  }
  const rhoAsked = numParam(sp, "rho");
  const rho = rhoAsked !== undefined && rhoAsked > -1 && rhoAsked < 1 ? rhoAsked : undefined;
  if (rhoAsked !== undefined && rho === undefined) ignored.push({ field: "rho", label: "fuel-price correlation (between −1 and 1)" });
  return {
    request: { draws, seed, shape, ranges, fuelPriceCorrelation: rho, metric: view.metric, includeUpstream: view.includeUpstream },
    ranges,
    shape,
    rho,
    ignored,
  };
}
