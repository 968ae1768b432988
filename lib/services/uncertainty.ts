/**
 * The Monte Carlo ranking of a stored study (lib/study/uncertainty.ts) with ranges stated for one
 * view (the uncertainty page's form). The ranges are validated through the study schema's
 * `uncertainty` field; nothing is written to the database.
 */
import type { Db } from "../db/client";
import { uncertaintySchema, type RankingMetric, type UncertaintyRange } from "../schemas/study";
import { uncertaintyRanking, MAX_DRAWS, type UncertaintyResult } from "../study/uncertainty";
import { fieldErrors } from "../schemas/fuel";
import { problem, problemFromError, type Problem } from "./result";
import { sharedCaches, studyBundle, type StudyBundle, type ViewSettings } from "./studies";

/** Symmetric ranges a page states: ± % (prices, carbon, capex, hours) and ± points (efficiency). */
export interface SymmetricRanges {
  fuelPricePercent?: number;
  carbonPricePercent?: number;
  capexPercent?: number;
  efficiencyPoints?: number;
  operatingHoursPercent?: number;
}

export interface UncertaintyRequest extends ViewSettings {
  draws: number;
  seed: number;
  /** How a ± range becomes a distribution: triangular or PERT on (−w, 0, +w), or normal with sd = w. */
  shape?: "triangular" | "pert" | "normal";
  ranges?: SymmetricRanges;
  /** One correlation between every pair of fuel prices (a shared market factor), e.g. 0.7; none when absent. */
  fuelPriceCorrelation?: number;
}

/** Draws a page may ask for. */
export const PAGE_MAX_DRAWS = Math.min(MAX_DRAWS, 50_000);

export type UncertaintyAnswer = { ok: true; bundle: StudyBundle; result: UncertaintyResult } | Problem;

function rangeOf(w: number, shape: NonNullable<UncertaintyRequest["shape"]>): UncertaintyRange {
  return shape === "normal" ? { distribution: "normal", mean: 0, sd: w } : { distribution: shape, low: -w, mode: 0, high: w };
}

/** Runs the ranking of stored study `id` with the request's ranges (the study's own where none is stated). */
export async function uncertaintyOfStoredStudy(db: Db, id: number, req: UncertaintyRequest): Promise<UncertaintyAnswer> {
  if (!Number.isInteger(req.draws) || req.draws < 100 || req.draws > PAGE_MAX_DRAWS) {
    return problem("invalid", `draws: must be a whole number from 100 to ${PAGE_MAX_DRAWS}`, {
      draws: `must be a whole number from 100 to ${PAGE_MAX_DRAWS}`,
    });
  }
  const loaded = await studyBundle(db, id, req);
  if (!loaded.ok) return loaded;
  const study = loaded.bundle.study;
  const shape = req.shape ?? "triangular";
  const r = req.ranges ?? {};
  const raw: Record<string, unknown> = { ...(study.uncertainty ?? {}) };
  if (r.fuelPricePercent !== undefined) raw.fuelPriceDefault = rangeOf(r.fuelPricePercent, shape);
  if (r.carbonPricePercent !== undefined) raw.carbonPrice = rangeOf(r.carbonPricePercent, shape);
  if (r.capexPercent !== undefined) raw.capex = rangeOf(r.capexPercent, shape);
  if (r.efficiencyPoints !== undefined) raw.efficiencyPoints = rangeOf(r.efficiencyPoints, shape);
  if (r.operatingHoursPercent !== undefined) raw.operatingHours = rangeOf(r.operatingHoursPercent, shape);
  try {
    if (req.fuelPriceCorrelation !== undefined) raw.fuelPriceCorrelation = req.fuelPriceCorrelation;
    const parsed = uncertaintySchema.safeParse(raw);
    if (!parsed.success) {
      const errs = fieldErrors(parsed.error);
      return problem(
        "invalid",
        `The ranges cannot be used: ${Object.entries(errs)
          .map(([k, v]) => `${k}: ${v}`)
          .join("; ")}`,
        errs,
      );
    }
    const result = uncertaintyRanking(
      { ...study, uncertainty: parsed.data },
      { draws: req.draws, seed: req.seed, metric: req.metric as RankingMetric | undefined, caches: sharedCaches() },
    );
    return { ok: true, bundle: loaded.bundle, result };
  } catch (e) {
    return problemFromError(e, {
      kind: "unprocessable",
      message: (s, field) => `The uncertainty ranking cannot be run: ${field ? `${field}: ` : ""}${s}.`,
    });
  }
}
