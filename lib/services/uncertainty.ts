/**
 * The Monte Carlo ranking of a stored study (lib/study/uncertainty.ts) with ranges stated for one
 * view (the uncertainty page's form). The ranges are validated through the study schema's
 * `uncertainty` field. `uncertaintyOfStoredStudy` answers at once and stores nothing; stored runs
 * with progress are lib/services/uncertainty-runs.ts.
 */
import type { Db } from "../db/client";
import { uncertaintySchema, type RankingMetric, type Study, type UncertaintyRange, type UncertaintySettings } from "../schemas/study";
import { uncertaintyRanking, MAX_DRAWS, type UncertaintyOptions, type UncertaintyResult } from "../study/uncertainty";
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
  /** ± K on the stack temperature of every scenario whose operating changes state one (a retrofit). */
  stackTemperatureK?: number;
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

/** What a run needs once the request is checked: the study with the ranges as applied, and the options. */
export interface PreparedUncertainty {
  bundle: StudyBundle;
  study: Study;
  options: UncertaintyOptions;
  /** What was asked, as a run stores it. */
  settings: UncertaintyRunSettings;
}

/** The settings a stored run keeps beside its result (what was asked and the ranges as applied). */
export interface UncertaintyRunSettings {
  draws: number;
  seed: number;
  metric: RankingMetric;
  includeUpstream: boolean;
  shape: NonNullable<UncertaintyRequest["shape"]>;
  ranges: SymmetricRanges;
  fuelPriceCorrelation: number | null;
  uncertainty: UncertaintySettings;
}

/** Checks a request against stored study `id` and states the ranges (the study's own where none is stated). */
export async function prepareUncertainty(
  db: Db,
  id: number,
  req: UncertaintyRequest,
): Promise<{ ok: true; value: PreparedUncertainty } | Problem> {
  if (!Number.isInteger(req.draws) || req.draws < 100 || req.draws > PAGE_MAX_DRAWS) {
    return problem("invalid", `draws: must be a whole number from 100 to ${PAGE_MAX_DRAWS}`, {
      draws: `must be a whole number from 100 to ${PAGE_MAX_DRAWS}`,
    });
  }
  if (!Number.isInteger(req.seed) || req.seed < 0 || req.seed > 0xffffffff) {
    return problem("invalid", "seed: must be a whole number from 0 to 4294967295", { seed: "must be a whole number from 0 to 4294967295" });
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
  if (r.stackTemperatureK !== undefined) raw.stackTemperatureK = rangeOf(r.stackTemperatureK, shape);
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
  const metric = (req.metric as RankingMetric | undefined) ?? study.rankingMetric;
  return {
    ok: true,
    value: {
      bundle: loaded.bundle,
      study: { ...study, uncertainty: parsed.data },
      options: { draws: req.draws, seed: req.seed, metric, caches: sharedCaches() },
      settings: {
        draws: req.draws,
        seed: req.seed,
        metric,
        includeUpstream: study.includeUpstream,
        shape,
        ranges: r,
        fuelPriceCorrelation: req.fuelPriceCorrelation ?? null,
        uncertainty: parsed.data,
      },
    },
  };
}

/** The problem of a ranking lib/ refuses (a range it cannot use, a study it cannot evaluate). */
export function uncertaintyProblem(e: unknown): Problem {
  return problemFromError(e, {
    kind: "unprocessable",
    message: (s, field) => `The uncertainty ranking cannot be run: ${field ? `${field}: ` : ""}${s}.`,
  });
}

/** Runs the ranking of stored study `id` with the request's ranges at once (the JSON/CSV route; nothing is stored). */
export async function uncertaintyOfStoredStudy(db: Db, id: number, req: UncertaintyRequest): Promise<UncertaintyAnswer> {
  const prepared = await prepareUncertainty(db, id, req);
  if (!prepared.ok) return prepared;
  const { bundle, study, options } = prepared.value;
  try {
    return { ok: true, bundle, result: uncertaintyRanking(study, options) };
  } catch (e) {
    return uncertaintyProblem(e);
  }
}
