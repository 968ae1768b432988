/**
 * Block-tridiagonal linear systems by block LU factorisation (the block Thomas algorithm), for the
 * Newton steps of the 1D flame: N points, a block of n unknowns per point,
 *
 *   A_j x_{j−1} + B_j x_j + C_j x_{j+1} = r_j,   j = 0 … N−1   (A_0 and C_{N−1} unused).
 *
 * Factorisation: D_0 = B_0, D_j = B_j − A_j G_{j−1} with G_j = D_j⁻¹ C_j; each D_j is LU-factorised
 * with partial pivoting. Solve: forward y_j = D_j⁻¹ (r_j − A_j y_{j−1}), backward
 * x_j = y_j − G_j x_{j+1}. Cost ≈ N·(7/3)n³ flops to factorise, N·4n² to solve; one factorisation
 * serves many right-hand sides (the modified Newton iteration reuses it).
 *
 * All storage is allocated once (for up to `capacity` points) and reused, also for another N up to
 * the capacity (`reshape`); nothing is allocated in factor() or solve().
 * The blocks are dense, row-major, at [(j·n + row)·n + col] of `lower` (A), `diag` (B), `upper` (C).
 */

export class BlockTridiagonal {
  readonly blockSize: number;
  /** Points the storage holds; `reshape` may use any number up to this. */
  readonly capacity: number;
  /** A_j: coupling of point j's equations to point j−1's unknowns. */
  readonly lower: Float64Array;
  /** B_j: coupling within point j. */
  readonly diag: Float64Array;
  /** C_j: coupling of point j's equations to point j+1's unknowns. */
  readonly upper: Float64Array;
  private readonly lu: Float64Array;
  private readonly piv: Int32Array;
  private readonly g: Float64Array;
  private factored = false;
  private points: number;

  /** Storage for `capacity` points (default nPoints), of which the first nPoints are in use. */
  constructor(nPoints: number, blockSize: number, capacity = nPoints) {
    if (!(capacity >= nPoints)) throw new Error("BlockTridiagonal: capacity below the number of points");
    this.points = nPoints;
    this.blockSize = blockSize;
    this.capacity = capacity;
    const nn = blockSize * blockSize;
    this.lower = new Float64Array(capacity * nn);
    this.diag = new Float64Array(capacity * nn);
    this.upper = new Float64Array(capacity * nn);
    this.lu = new Float64Array(capacity * nn);
    this.piv = new Int32Array(capacity * blockSize);
    this.g = new Float64Array(capacity * nn);
  }

  /** Points in use N. */
  get nPoints(): number {
    return this.points;
  }

  /**
   * Takes the storage for a system of nPoints points (the contents are discarded: unfactorised
   * until refilled and factor()ed). False when nPoints exceeds the capacity.
   */
  reshape(nPoints: number): boolean {
    if (!(nPoints >= 1 && nPoints <= this.capacity)) return false;
    this.points = nPoints;
    this.factored = false;
    return true;
  }

  /** Whether factor() succeeded since the bands were last cleared. */
  get isFactored(): boolean {
    return this.factored;
  }

  /** Sets all three block bands to zero. */
  clear(): void {
    const used = this.points * this.blockSize * this.blockSize;
    this.lower.fill(0, 0, used);
    this.diag.fill(0, 0, used);
    this.upper.fill(0, 0, used);
    this.factored = false;
  }

  /**
   * Factorises the matrix. Returns −1 on success, or the index of the first point whose pivot block
   * is singular (the matrix is then unusable until refilled).
   */
  factor(): number {
    const n = this.blockSize;
    const nn = n * n;
    const N = this.nPoints;
    const { lower, diag, upper, lu, piv, g } = this;
    for (let j = 0; j < N; j++) {
      const o = j * nn;
      // D_j = B_j − A_j G_{j−1}
      for (let i = 0; i < nn; i++) lu[o + i] = diag[o + i];
      if (j > 0) {
        const og = (j - 1) * nn;
        for (let r = 0; r < n; r++) {
          const ar = o + r * n;
          subtractCombination(lu, ar, lower, ar, g, og, 0, n, n);
        }
      }
      if (!luFactor(lu, o, n, piv, j * n)) {
        this.factored = false;
        return j;
      }
      // G_j = D_j⁻¹ C_j, all columns at once by row operations (contiguous rows; zero multipliers skipped)
      if (j < N - 1) {
        for (let i = 0; i < nn; i++) g[o + i] = upper[o + i];
        const po = j * n;
        for (let k = 0; k < n; k++) {
          const p = piv[po + k];
          if (p !== k) {
            const rk = o + k * n;
            const rp = o + p * n;
            for (let c = 0; c < n; c++) {
              const t = g[rk + c];
              g[rk + c] = g[rp + c];
              g[rp + c] = t;
            }
          }
        }
        for (let i = 1; i < n; i++) {
          const ri = o + i * n;
          subtractCombination(g, ri, lu, ri, g, o, 0, i, n);
        }
        for (let i = n - 1; i >= 0; i--) {
          const ri = o + i * n;
          subtractCombination(g, ri, lu, ri, g, o, i + 1, n, n);
          const inv = 1 / lu[ri + i];
          for (let c = 0; c < n; c++) g[ri + c] *= inv;
        }
      }
    }
    this.factored = true;
    return -1;
  }

  /** Solves in place: `rhs` (length N·n, point-major) is overwritten with the solution. */
  solve(rhs: Float64Array): void {
    if (!this.factored) throw new Error("BlockTridiagonal.solve: matrix not factorised");
    const n = this.blockSize;
    const nn = n * n;
    const N = this.nPoints;
    const { lower, lu, piv, g } = this;
    for (let j = 0; j < N; j++) {
      const o = j * nn;
      const x = j * n;
      if (j > 0) {
        const xp = (j - 1) * n;
        for (let r = 0; r < n; r++) {
          let s = 0;
          const ar = o + r * n;
          for (let k = 0; k < n; k++) s += lower[ar + k] * rhs[xp + k];
          rhs[x + r] -= s;
        }
      }
      luSolve(lu, o, n, piv, j * n, rhs, x);
    }
    for (let j = N - 2; j >= 0; j--) {
      const o = j * nn;
      const x = j * n;
      const xn = (j + 1) * n;
      for (let r = 0; r < n; r++) {
        let s = 0;
        const gr = o + r * n;
        for (let k = 0; k < n; k++) s += g[gr + k] * rhs[xn + k];
        rhs[x + r] -= s;
      }
    }
  }

  /** y = M·x for the (unfactorised) bands, for checks. */
  multiply(x: Float64Array, y: Float64Array): void {
    const n = this.blockSize;
    const nn = n * n;
    const N = this.nPoints;
    for (let j = 0; j < N; j++) {
      for (let r = 0; r < n; r++) {
        let s = 0;
        const row = j * nn + r * n;
        for (let c = 0; c < n; c++) s += this.diag[row + c] * x[j * n + c];
        if (j > 0) for (let c = 0; c < n; c++) s += this.lower[row + c] * x[(j - 1) * n + c];
        if (j < N - 1) for (let c = 0; c < n; c++) s += this.upper[row + c] * x[(j + 1) * n + c];
        y[j * n + r] = s;
      }
    }
  }
}

/**
 * The kernel of the factorisation: row y (at y[yo…yo+n)) −= Σ_{k=k0}^{k1−1} coef[co+k] · row k of
 * the n-wide rows at rows[ro + k·n …]. Four rows are combined per pass over y, so that y is loaded
 * and stored a quarter as often (the loop is memory-bound in JavaScript); zero coefficients of a
 * group of four are skipped.
 */
export function subtractCombination(
  y: Float64Array,
  yo: number,
  coef: Float64Array,
  co: number,
  rows: Float64Array,
  ro: number,
  k0: number,
  k1: number,
  n: number,
): void {
  let k = k0;
  for (; k + 3 < k1; k += 4) {
    const a0 = coef[co + k];
    const a1 = coef[co + k + 1];
    const a2 = coef[co + k + 2];
    const a3 = coef[co + k + 3];
    if (a0 === 0 && a1 === 0 && a2 === 0 && a3 === 0) continue;
    const r0 = ro + k * n;
    const r1 = r0 + n;
    const r2 = r1 + n;
    const r3 = r2 + n;
    for (let c = 0; c < n; c++) y[yo + c] -= a0 * rows[r0 + c] + a1 * rows[r1 + c] + a2 * rows[r2 + c] + a3 * rows[r3 + c];
  }
  for (; k < k1; k++) {
    const a = coef[co + k];
    if (a === 0) continue;
    const r0 = ro + k * n;
    for (let c = 0; c < n; c++) y[yo + c] -= a * rows[r0 + c];
  }
}

/** In-place LU with partial pivoting of the n×n block at a[o…]; false if singular. */
export function luFactor(a: Float64Array, o: number, n: number, piv: Int32Array, po: number): boolean {
  for (let k = 0; k < n; k++) {
    let p = k;
    let big = Math.abs(a[o + k * n + k]);
    for (let i = k + 1; i < n; i++) {
      const v = Math.abs(a[o + i * n + k]);
      if (v > big) {
        big = v;
        p = i;
      }
    }
    piv[po + k] = p;
    if (!(big > 0) || !Number.isFinite(big)) return false;
    if (p !== k) {
      const rk = o + k * n;
      const rp = o + p * n;
      for (let c = 0; c < n; c++) {
        const t = a[rk + c];
        a[rk + c] = a[rp + c];
        a[rp + c] = t;
      }
    }
    const rk = o + k * n;
    const inv = 1 / a[rk + k];
    for (let i = k + 1; i < n; i++) {
      const ri = o + i * n;
      const f = a[ri + k] * inv;
      if (f === 0) continue;
      a[ri + k] = f;
      for (let c = k + 1; c < n; c++) a[ri + c] -= f * a[rk + c];
    }
  }
  return true;
}

/** Solves (LU) x = b in place for the vector at b[bo … bo+n). */
export function luSolve(a: Float64Array, o: number, n: number, piv: Int32Array, po: number, b: Float64Array, bo: number): void {
  for (let k = 0; k < n; k++) {
    const p = piv[po + k];
    if (p !== k) {
      const t = b[bo + k];
      b[bo + k] = b[bo + p];
      b[bo + p] = t;
    }
  }
  for (let i = 1; i < n; i++) {
    let s = b[bo + i];
    const ri = o + i * n;
    for (let k = 0; k < i; k++) s -= a[ri + k] * b[bo + k];
    b[bo + i] = s;
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = b[bo + i];
    const ri = o + i * n;
    for (let k = i + 1; k < n; k++) s -= a[ri + k] * b[bo + k];
    b[bo + i] = s / a[ri + i];
  }
}
