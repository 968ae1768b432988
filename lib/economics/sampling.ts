/**
 * Monte Carlo sampling: Latin hypercube sampling, rank correlation by the Iman–Conover method,
 * Cholesky factorisation, Spearman rank correlation and sample percentiles.
 *
 * - Latin hypercube (McKay, Beckman & Conover, Technometrics 21, 1979): for each input the unit
 *   interval is cut into N equal strata, each stratum gets exactly one draw (uniform inside it)
 *   and the strata are paired across inputs by independent random permutations. The variance of
 *   a mean estimated from an LHS sample is never larger than from N independent draws
 *   (asymptotically; Stein, Technometrics 29, 1987), so the independent-draw standard error
 *   √(p(1−p)/N) is a conservative statement for LHS.
 * - Iman & Conover (Commun. Statist. B 11, 1982): the sampled columns are re-paired, without
 *   changing any marginal, so that their van der Waerden scores Φ⁻¹(i/(N+1)) have the target
 *   correlation matrix (a Gaussian copula on ranks). The target is the correlation of the normal
 *   scores; for normal inputs it is their ordinary correlation.
 */
import { InputError } from "../errors";
import { normalQuantile, type Xoshiro128ss } from "./random";

/**
 * Lower-triangular Cholesky factor L (row-major, n × n) of a symmetric matrix, A = L·Lᵀ.
 * Throws InputError(field) when the matrix is not positive definite (e.g. correlations that
 * contradict each other).
 */
export function cholesky(a: Float64Array, n: number, field = "correlations"): Float64Array {
  const l = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      let s = a[i * n + j];
      for (let k = 0; k < j; k++) s -= l[i * n + k] * l[j * n + k];
      if (i === j) {
        if (!(s > 1e-12))
          throw new InputError(field, "the stated correlations contradict each other (the correlation matrix is not positive definite)");
        l[i * n + i] = Math.sqrt(s);
      } else {
        l[i * n + j] = s / l[j * n + j];
      }
    }
  }
  return l;
}

/** Fisher–Yates shuffle of 0 … n−1 into `out`. */
export function permutation(rng: Xoshiro128ss, n: number, out: Int32Array = new Int32Array(n)): Int32Array {
  for (let i = 0; i < n; i++) out[i] = i;
  for (let i = n - 1; i > 0; i--) {
    const j = rng.below(i + 1);
    const t = out[i];
    out[i] = out[j];
    out[j] = t;
  }
  return out;
}

/**
 * Latin hypercube sample of `dims` uniforms, N rows: column-major Float64Array of N·dims values
 * in (0, 1), column j at [j·N, (j+1)·N).
 */
export function latinHypercube(rng: Xoshiro128ss, n: number, dims: number): Float64Array {
  const u = new Float64Array(n * dims);
  const perm = new Int32Array(n);
  for (let j = 0; j < dims; j++) {
    permutation(rng, n, perm);
    const off = j * n;
    for (let i = 0; i < n; i++) u[off + i] = (perm[i] + rng.uniformOpen()) / n;
  }
  return u;
}

/** Plain Monte Carlo: N·dims independent uniforms in (0, 1), column-major like latinHypercube. */
export function independentUniforms(rng: Xoshiro128ss, n: number, dims: number): Float64Array {
  const u = new Float64Array(n * dims);
  for (let k = 0; k < u.length; k++) u[k] = rng.uniformOpen();
  return u;
}

/** Indices 0 … n−1 ordered by the values of column `off` of `x` (ascending). */
function orderOf(x: Float64Array, off: number, n: number): Int32Array {
  const idx = new Int32Array(n);
  for (let i = 0; i < n; i++) idx[i] = i;
  const sub = x.subarray(off, off + n);
  idx.sort((p, q) => sub[p] - sub[q]);
  return idx;
}

/**
 * Iman–Conover: re-pairs the columns of `x` (column-major, N rows, `dims` columns; changed in
 * place) so that the normal scores of their ranks have the target correlation `target`
 * (row-major dims × dims, unit diagonal). Columns keep their values, only the pairing changes.
 */
export function imanConover(
  x: Float64Array,
  n: number,
  dims: number,
  target: Float64Array,
  rng: Xoshiro128ss,
  field = "correlations",
): void {
  if (dims < 2) return;
  const p = cholesky(target, dims, field);
  // Scores: van der Waerden scores, randomly permuted per column.
  const scores = new Float64Array(n);
  for (let i = 0; i < n; i++) scores[i] = normalQuantile((i + 1) / (n + 1));
  const m = new Float64Array(n * dims);
  const perm = new Int32Array(n);
  for (let j = 0; j < dims; j++) {
    permutation(rng, n, perm);
    for (let i = 0; i < n; i++) m[j * n + i] = scores[perm[i]];
  }
  // Their sample correlation E and its Cholesky factor Q; T = M·(Q⁻¹)ᵀ·Pᵀ has correlation ≈ target.
  const e = new Float64Array(dims * dims);
  let ss = 0;
  for (let i = 0; i < n; i++) ss += scores[i] * scores[i];
  for (let a = 0; a < dims; a++) {
    for (let b = 0; b <= a; b++) {
      let s = 0;
      for (let i = 0; i < n; i++) s += m[a * n + i] * m[b * n + i];
      e[a * dims + b] = e[b * dims + a] = s / ss;
    }
  }
  const q = cholesky(e, dims, field);
  // S = P·Q⁻¹ (dims × dims): solve S·Q = P row by row (Q lower-triangular).
  const s = new Float64Array(dims * dims);
  for (let r = 0; r < dims; r++) {
    for (let c = dims - 1; c >= 0; c--) {
      let v = p[r * dims + c];
      for (let k = c + 1; k < dims; k++) v -= s[r * dims + k] * q[k * dims + c];
      s[r * dims + c] = v / q[c * dims + c];
    }
  }
  // T = M·Sᵀ, column by column; then each column of x takes the ranks of T's column.
  const t = new Float64Array(n);
  const sorted = new Float64Array(n);
  for (let c = 0; c < dims; c++) {
    t.fill(0);
    for (let k = 0; k <= c; k++) {
      const w = s[c * dims + k];
      if (w === 0) continue;
      const off = k * n;
      for (let i = 0; i < n; i++) t[i] += w * m[off + i];
    }
    const col = x.subarray(c * n, (c + 1) * n);
    sorted.set(col);
    sorted.sort();
    const order = orderOf(t, 0, n);
    for (let r = 0; r < n; r++) col[order[r]] = sorted[r];
  }
}

/** First index of `sorted` whose value is ≥ x (or > x when `strict`). */
function bound(sorted: Float64Array, x: number, strict: boolean): number {
  let lo = 0,
    hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (strict ? sorted[mid] <= x : sorted[mid] < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** Ranks 1 … N of `v` (ties get their average rank). Sorts a typed copy, then finds each value's run. */
export function ranks(v: ArrayLike<number>): Float64Array {
  const n = v.length;
  const sorted = new Float64Array(n);
  for (let i = 0; i < n; i++) sorted[i] = v[i];
  sorted.sort();
  const r = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const first = bound(sorted, v[i], false);
    const last = bound(sorted, v[i], true) - 1;
    r[i] = (first + last) / 2 + 1;
  }
  return r;
}

/** Pearson correlation of two equally long samples; null when either does not vary. */
export function pearson(x: ArrayLike<number>, y: ArrayLike<number>): number | null {
  const n = x.length;
  let mx = 0,
    my = 0;
  for (let i = 0; i < n; i++) {
    mx += x[i];
    my += y[i];
  }
  mx /= n;
  my /= n;
  let sxy = 0,
    sxx = 0,
    syy = 0;
  for (let i = 0; i < n; i++) {
    const dx = x[i] - mx,
      dy = y[i] - my;
    sxy += dx * dy;
    sxx += dx * dx;
    syy += dy * dy;
  }
  if (!(sxx > 0 && syy > 0)) return null;
  return sxy / Math.sqrt(sxx * syy);
}

/** Spearman rank correlation: Pearson correlation of the ranks (average ranks for ties). */
export function spearman(x: ArrayLike<number>, y: ArrayLike<number>): number | null {
  return pearson(ranks(x), ranks(y));
}

/** Percentile of a sorted sample by linear interpolation between order statistics (Hyndman & Fan type 7). */
export function percentileSorted(sorted: ArrayLike<number>, p: number): number {
  const n = sorted.length;
  if (n === 0) return NaN;
  const h = (n - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.min(n - 1, lo + 1);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}

/** Moves the k-th smallest value of `a` to a[k] (smaller before, larger after): Hoare's quickselect. */
function selectKth(a: Float64Array, k: number, lo = 0, hi = a.length - 1): void {
  while (hi > lo) {
    const mid = (lo + hi) >> 1;
    // Median of three as the pivot.
    if (a[mid] < a[lo]) swap(a, mid, lo);
    if (a[hi] < a[lo]) swap(a, hi, lo);
    if (a[hi] < a[mid]) swap(a, hi, mid);
    const pivot = a[mid];
    let i = lo,
      j = hi;
    while (i <= j) {
      while (a[i] < pivot) i++;
      while (a[j] > pivot) j--;
      if (i <= j) {
        swap(a, i, j);
        i++;
        j--;
      }
    }
    if (k <= j) hi = j;
    else if (k >= i) lo = i;
    else return;
  }
}

function swap(a: Float64Array, i: number, j: number): void {
  const t = a[i];
  a[i] = a[j];
  a[j] = t;
}

/**
 * Percentiles (Hyndman & Fan type 7, as percentileSorted) of an unsorted sample without sorting
 * it: quickselect per order statistic, O(N) each. `work` is reordered.
 */
export function percentilesUnsorted(work: Float64Array, ps: readonly number[]): number[] {
  const n = work.length;
  if (n === 0) return ps.map(() => NaN);
  return ps.map((p) => {
    const h = (n - 1) * p;
    const lo = Math.floor(h);
    selectKth(work, lo);
    const a = work[lo];
    if (lo + 1 >= n || h === lo) return a;
    let b = Infinity;
    for (let i = lo + 1; i < n; i++) if (work[i] < b) b = work[i];
    return a + (h - lo) * (b - a);
  });
}

/** Standard error of a proportion p estimated from N independent draws: √(p(1−p)/N). */
export function proportionStandardError(p: number, n: number): number {
  return n > 0 ? Math.sqrt((p * (1 - p)) / n) : NaN;
}
