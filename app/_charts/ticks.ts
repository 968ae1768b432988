/**
 * Axis ticks by the nice-number method (P. S. Heckbert, "Nice numbers for graph labels", Graphics
 * Gems, Academic Press 1990, pp. 61–63): steps of 1, 2 or 5 × 10^k, a domain widened to whole steps,
 * and ONE number format per axis (the same decimals and the same thousands scale on every tick), so an
 * axis never shows "12k / 9900" or the same label twice.
 */

export interface NiceAxis {
  domain: [number, number];
  ticks: number[];
  /** Formats a value with the axis's own decimals and scale. */
  format: (v: number) => string;
  /** "k" or "M" when the labels are in thousands or millions, "" otherwise (say it in the axis title). */
  scaleSuffix: "" | "k" | "M";
}

/** The nice number near x: 1, 2, 5 or 10 × 10^k (rounded, or the next one up when round is false). */
export function niceNumber(x: number, round: boolean): number {
  const exp = Math.floor(Math.log10(x));
  const f = x / 10 ** exp;
  let nf: number;
  if (round) nf = f < 1.5 ? 1 : f < 3 ? 2 : f < 7 ? 5 : 10;
  else nf = f <= 1 ? 1 : f <= 2 ? 2 : f <= 5 ? 5 : 10;
  return nf * 10 ** exp;
}

/**
 * Ticks covering [min, max] with about `target` intervals. A degenerate range (min = max) is widened
 * around the value. Non-finite input gives an axis of [0, 1].
 */
export function niceAxis(min: number, max: number, target = 5): NiceAxis {
  if (!Number.isFinite(min) || !Number.isFinite(max)) return niceAxis(0, 1, target);
  if (min > max) [min, max] = [max, min];
  if (min === max) {
    const pad = min === 0 ? 1 : Math.abs(min) * 0.05;
    min -= pad;
    max += pad;
  }
  const range = niceNumber(max - min, false);
  const step = niceNumber(range / Math.max(1, target), true);
  const lo = Math.floor(min / step + 1e-9) * step;
  const hi = Math.ceil(max / step - 1e-9) * step;
  const ticks: number[] = [];
  for (let v = lo, i = 0; v <= hi + step / 2 && i < 100; v = lo + ++i * step) ticks.push(cleanZero(roundTo(v, step)));
  const largest = Math.max(Math.abs(lo), Math.abs(hi));
  const scale = largest >= 1e6 && step >= 1e5 ? 1e6 : largest >= 1e4 && step >= 1e3 ? 1e3 : 1;
  const scaleSuffix = scale === 1e6 ? "M" : scale === 1e3 ? "k" : "";
  const decimals = Math.max(0, -Math.floor(Math.log10(step / scale) + 1e-9));
  const format = (v: number) =>
    `${(v / scale).toLocaleString("en-GB", { minimumFractionDigits: decimals, maximumFractionDigits: decimals })}${scaleSuffix}`;
  return { domain: [ticks[0], ticks[ticks.length - 1]], ticks, format, scaleSuffix };
}

/** Ticks for the values of a series (nulls and non-finite values ignored), optionally including extra values such as limits. */
export function niceAxisFor(values: readonly (number | null | undefined)[], extra: readonly number[] = [], target = 5): NiceAxis {
  const xs = [...values, ...extra].filter((v): v is number => typeof v === "number" && Number.isFinite(v));
  if (!xs.length) return niceAxis(0, 1, target);
  return niceAxis(Math.min(...xs), Math.max(...xs), target);
}

function roundTo(v: number, step: number): number {
  const d = Math.max(0, -Math.floor(Math.log10(step)) + 1);
  return Number(v.toFixed(Math.min(d, 15)));
}

function cleanZero(v: number): number {
  return Object.is(v, -0) ? 0 : v;
}

/** An axis title: the unit, with the axis's thousands scale when its labels carry one. */
export const axisTitle = (unit: string, axis: NiceAxis) => `${unit}${axis.scaleSuffix ? ` (${axis.scaleSuffix})` : ""}`;
