/**
 * Gas compositions as a certificate gives them: in mol % or as mole fractions, and a certificate
 * whose total is a little off 100 % (rounding, an unreported trace) normalised on request, with the
 * residual shown and recorded. Definitions store mole fractions.
 */
import { FRACTION_SUM_TOLERANCE } from "./fuel";

export const COMPOSITION_SCALES = ["fraction", "percent"] as const;
export type CompositionScale = (typeof COMPOSITION_SCALES)[number];

/** A certificate may be normalised when its total is within this many mol % of 100 (common practice, no source). */
export const NORMALISE_TOLERANCE_PERCENT = 0.5;

/** The value of one mole fraction on a scale. */
export function scaleFactor(scale: CompositionScale): number {
  return scale === "percent" ? 100 : 1;
}

export interface SumCheck {
  /** Total on the entry's own scale. */
  total: number;
  /** Total in mol %. */
  totalPercent: number;
  /** Within the schema's tolerance of 1 (100 %): can be saved as it is. */
  exact: boolean;
  /** Off, but within NORMALISE_TOLERANCE_PERCENT: can be normalised on request. */
  normalisable: boolean;
  /** The entry looks like it is on the other scale (e.g. mol % typed as fractions). */
  looksLike: CompositionScale | null;
}

export function checkSum(values: readonly number[], scale: CompositionScale): SumCheck {
  const total = values.reduce((a, b) => a + b, 0);
  const totalPercent = (100 * total) / scaleFactor(scale);
  const offPercent = Math.abs(totalPercent - 100);
  const exact = offPercent <= 100 * FRACTION_SUM_TOLERANCE;
  const normalisable = !exact && offPercent <= NORMALISE_TOLERANCE_PERCENT;
  let looksLike: CompositionScale | null = null;
  if (scale === "fraction" && Math.abs(total - 100) <= NORMALISE_TOLERANCE_PERCENT) looksLike = "percent";
  if (scale === "percent" && Math.abs(total - 1) <= NORMALISE_TOLERANCE_PERCENT / 100) looksLike = "fraction";
  return { total, totalPercent, exact, normalisable, looksLike };
}

/** Entry values → mole fractions (divides mol % by 100). */
export function toMoleFractions(values: Readonly<Record<string, number>>, scale: CompositionScale): Record<string, number> {
  const f = scaleFactor(scale);
  return Object.fromEntries(Object.entries(values).map(([k, v]) => [k, v / f]));
}

export interface Normalised {
  /** Values rescaled to sum to exactly 100 % (on the entry's scale). */
  values: Record<string, number>;
  totalPercentBefore: number;
  /** 100 − total before, mol %: what the rescaling spread over the components in proportion. */
  residualPercent: number;
  /** A line for the fuel's notes. */
  note: string;
}

/** Rescales a composition whose total is within NORMALISE_TOLERANCE_PERCENT of 100 %; null when it is not. */
export function normaliseComposition(
  values: Readonly<Record<string, number>>,
  scale: CompositionScale,
  dateISO: string,
): Normalised | null {
  const check = checkSum(Object.values(values), scale);
  if (!check.normalisable && !check.exact) return null;
  const k = scaleFactor(scale) / check.total;
  const out = Object.fromEntries(Object.entries(values).map(([key, v]) => [key, v * k]));
  const residualPercent = 100 - check.totalPercent;
  const sign = residualPercent >= 0 ? "+" : "−";
  const note = `Composition normalised on ${dateISO}: the analysis summed to ${check.totalPercent.toFixed(3)} mol %; the residual of ${sign}${Math.abs(residualPercent).toFixed(3)} mol % was spread over the components in proportion to their shares.`;
  return { values: out, totalPercentBefore: check.totalPercent, residualPercent, note };
}
