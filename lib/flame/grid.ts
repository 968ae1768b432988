/**
 * Adaptive grid for the 1D flame: where to add points so that every solution component is resolved
 * (the gradient and curvature criteria of Smooke, J. Comput. Phys. 48 (1982) 72–105, and of the
 * PREMIX method, Kee et al., Sandia report SAND85-8240 (1985)):
 *
 * - slope:  |φ_{j+1} − φ_j| ≤ slope · (max φ − min φ) on every interval;
 * - curve:  |φ'_{j+1/2} − φ'_{j−1/2}| ≤ curve · (max φ' − min φ'), with φ' the slope of an interval;
 * - ratio:  neighbouring intervals differ in length by at most `ratio`.
 *
 * An interval that violates a criterion is halved (curvature violations halve both intervals
 * around the point). Components whose range is below `threshold` are not used (trace species); the
 * curvature criterion applies only to components whose range exceeds `curveThreshold`. Below that,
 * the slopes of a trace species in the burnt gas carry the first-order upwind scheme's local error
 * where the interval length changes (its convective difference spans the upwind interval, its cell
 * the half-intervals on both sides), and halving intervals only moves those jumps: the curvature
 * criterion then fills the whole burnt gas with points (trace NO2 took a hydrogen flame with 600 K
 * air to 911 points; with the curvature of components below 1e-6 left out it takes 221, and its
 * burning velocity and NO move by less than 0.05 %).
 */

import { DEFAULT_FLAME_GRID } from "../schemas/flame-speed";

export interface GridCriteria {
  /** Largest length ratio of neighbouring intervals (≥ 2). */
  ratio: number;
  /** Largest change of a component across an interval, as a fraction of its range. */
  slope: number;
  /** Largest change of a component's slope between neighbouring intervals, as a fraction of the slopes' range. */
  curve: number;
  /** Upper bound on the number of points. */
  maxPoints: number;
  /** Components with (max − min) below this are ignored. */
  threshold: number;
  /** The curvature criterion applies to components with (max − min) above this only. */
  curveThreshold: number;
}

/** Settings of a converged production solve (DEFAULT_FLAME_GRID of the request schema, and the thresholds). */
export const DEFAULT_GRID_CRITERIA: GridCriteria = { ...DEFAULT_FLAME_GRID, threshold: 1e-8, curveThreshold: 1e-6 };

/** Range (max − min) of component c over the N points. */
function valueRange(N: number, c: number, values: (c: number, j: number) => number): number {
  let vmin = Infinity;
  let vmax = -Infinity;
  for (let j = 0; j < N; j++) {
    const v = values(c, j);
    if (v < vmin) vmin = v;
    if (v > vmax) vmax = v;
  }
  return vmax - vmin;
}

/** Slopes of component c on the intervals of z into `out`; returns their range (max − min). */
function intervalSlopes(z: ArrayLike<number>, c: number, values: (c: number, j: number) => number, out: Float64Array): number {
  let smin = Infinity;
  let smax = -Infinity;
  for (let j = 0; j < z.length - 1; j++) {
    const s = (values(c, j + 1) - values(c, j)) / (z[j + 1] - z[j]);
    out[j] = s;
    if (s < smin) smin = s;
    if (s > smax) smax = s;
  }
  return smax - smin;
}

/**
 * Marks the intervals to split. `values(c, j)` gives component c at point j; components are
 * 0 … nComponents−1. Returns a flag per interval (length N−1); none set means the grid is fine.
 */
export function markIntervals(
  z: ArrayLike<number>,
  nComponents: number,
  values: (c: number, j: number) => number,
  criteria: GridCriteria,
): Uint8Array {
  const N = z.length;
  const mark = new Uint8Array(Math.max(0, N - 1));
  const slopes = new Float64Array(Math.max(0, N - 1));
  for (let c = 0; c < nComponents; c++) {
    const range = valueRange(N, c, values);
    if (!(range > criteria.threshold)) continue;
    for (let j = 0; j < N - 1; j++) if (Math.abs(values(c, j + 1) - values(c, j)) > criteria.slope * range) mark[j] = 1;
    const srange = range > criteria.curveThreshold ? intervalSlopes(z, c, values, slopes) : 0;
    if (srange > 0) {
      for (let j = 0; j < N - 2; j++) {
        if (Math.abs(slopes[j + 1] - slopes[j]) > criteria.curve * srange) {
          mark[j] = 1;
          mark[j + 1] = 1;
        }
      }
    }
  }
  for (let j = 1; j < N - 1; j++) {
    const a = z[j] - z[j - 1];
    const b = z[j + 1] - z[j];
    if (a > criteria.ratio * b) mark[j - 1] = 1;
    if (b > criteria.ratio * a) mark[j] = 1;
  }
  return mark;
}

/**
 * Points that a grid no longer needs (pruning, for a grid inherited from a neighbouring solution
 * whose flame was wider or elsewhere): point j is removable when the interval [z_{j−1}, z_{j+1}]
 * left without it meets the slope and curve criteria with room to spare (`margin` times their
 * limits, so that the next refinement does not put the point back at once) and the ratio
 * criterion against the intervals beside it. Never removed: the ends, the points listed in
 * `keep`, the points next to an interval marked for splitting (`mark`, from markIntervals on the
 * same grid) or next to another removed point (at most one point of three goes, so each check
 * sees the neighbours that stay).
 */
export function removablePoints(
  z: ArrayLike<number>,
  nComponents: number,
  values: (c: number, j: number) => number,
  criteria: GridCriteria,
  mark: Uint8Array,
  keep: readonly number[],
  margin: number,
): Uint8Array {
  const N = z.length;
  const remove = new Uint8Array(N);
  if (N < 5) return remove;
  // candidates: j = 2 … N − 3 (both neighbours and the next ones exist), with no marked interval
  // among the four around j
  const ok = new Uint8Array(N);
  for (let j = 2; j <= N - 3; j++) ok[j] = mark[j - 2] || mark[j - 1] || mark[j] || mark[j + 1] ? 0 : 1;
  for (const k of keep) if (k >= 0 && k < N) ok[k] = 0;
  // ratio: the merged interval against the intervals beside it
  for (let j = 2; j <= N - 3; j++) {
    if (!ok[j]) continue;
    const h = z[j + 1] - z[j - 1];
    if (h > criteria.ratio * (z[j - 1] - z[j - 2]) || h > criteria.ratio * (z[j + 2] - z[j + 1])) ok[j] = 0;
  }
  const slopes = new Float64Array(N - 1);
  for (let c = 0; c < nComponents; c++) {
    const range = valueRange(N, c, values);
    if (!(range > criteria.threshold)) continue;
    const slopeLimit = margin * criteria.slope * range;
    const curveLimit = range > criteria.curveThreshold ? margin * criteria.curve * intervalSlopes(z, c, values, slopes) : Infinity;
    for (let j = 2; j <= N - 3; j++) {
      if (!ok[j]) continue;
      const vl = values(c, j - 1);
      const vr = values(c, j + 1);
      if (Math.abs(vr - vl) > slopeLimit) {
        ok[j] = 0;
        continue;
      }
      const sm = (vr - vl) / (z[j + 1] - z[j - 1]);
      const sl = (vl - values(c, j - 2)) / (z[j - 1] - z[j - 2]);
      const sr = (values(c, j + 2) - vr) / (z[j + 2] - z[j + 1]);
      if (Math.abs(sm - sl) > curveLimit || Math.abs(sr - sm) > curveLimit) ok[j] = 0;
    }
  }
  for (let j = 2; j <= N - 3; j++) {
    if (!ok[j]) continue;
    remove[j] = 1;
    j += 2; // the next two points stay
  }
  return remove;
}

/**
 * New grid with the marked intervals halved and the points flagged in `remove` (see
 * removablePoints) left out, at most `maxPoints` points (when the budget is short, the marked
 * intervals are split from the longest down). Returns null when nothing is marked or removed.
 */
export function splitIntervals(z: ArrayLike<number>, mark: Uint8Array, maxPoints: number, remove?: Uint8Array): Float64Array | null {
  const N = z.length;
  let count = 0;
  for (let j = 0; j < mark.length; j++) count += mark[j];
  let removed = 0;
  if (remove) for (let j = 0; j < N; j++) removed += remove[j];
  if (count === 0 && removed === 0) return null;
  const budget = Math.max(0, maxPoints - (N - removed));
  if (budget === 0 && removed === 0) return null;
  const use = Uint8Array.from(mark);
  if (count > budget) {
    const idx: number[] = [];
    for (let j = 0; j < mark.length; j++) if (mark[j]) idx.push(j);
    idx.sort((a, b) => z[b + 1] - z[b] - (z[a + 1] - z[a]));
    use.fill(0);
    for (let i = 0; i < budget; i++) use[idx[i]] = 1;
    count = budget;
  }
  const out = new Float64Array(N - removed + count);
  let k = 0;
  for (let j = 0; j < N; j++) {
    if (!remove?.[j]) out[k++] = z[j];
    if (j < N - 1 && use[j]) out[k++] = 0.5 * (z[j] + z[j + 1]);
  }
  return out;
}

/** Index of the interval [z_i, z_{i+1}] containing x (clamped to the ends); z ascending. */
export function intervalOf(z: ArrayLike<number>, x: number): number {
  let lo = 0;
  let hi = z.length - 1;
  if (x <= z[0]) return 0;
  if (x >= z[hi]) return hi - 1;
  while (hi - lo > 1) {
    const m = (lo + hi) >> 1;
    if (z[m] <= x) lo = m;
    else hi = m;
  }
  return lo;
}

/** Linear interpolation of a point-major field (nComp per point) from grid z onto grid zNew. */
export function interpolateField(z: ArrayLike<number>, field: Float64Array, nComp: number, zNew: ArrayLike<number>): Float64Array {
  const out = new Float64Array(zNew.length * nComp);
  for (let i = 0; i < zNew.length; i++) {
    const x = zNew[i];
    const j = intervalOf(z, x);
    const w = Math.min(1, Math.max(0, (x - z[j]) / (z[j + 1] - z[j])));
    for (let c = 0; c < nComp; c++) out[i * nComp + c] = (1 - w) * field[j * nComp + c] + w * field[(j + 1) * nComp + c];
  }
  return out;
}
