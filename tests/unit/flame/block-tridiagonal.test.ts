import { describe, expect, it } from "vitest";
import { BlockTridiagonal } from "../../../lib/flame/block-tridiagonal";

/** Deterministic pseudo-random numbers (linear congruential; common practice, no source). */
function rng(seed: number) {
  let s = seed >>> 0;
  return () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return s / 4294967296 - 0.5;
  };
}

/** Fills the bands with random blocks; the diagonal blocks are not dominant (pivoting is needed). */
function randomSystem(N: number, n: number, seed: number) {
  const m = new BlockTridiagonal(N, n);
  const r = rng(seed);
  for (let i = 0; i < m.diag.length; i++) {
    m.lower[i] = r();
    m.upper[i] = r();
    m.diag[i] = r();
  }
  // make it well-conditioned overall, but put the large entries off the block diagonal's own diagonal
  for (let j = 0; j < N; j++) for (let k = 0; k < n; k++) m.diag[(j * n + k) * n + ((k + 1) % n)] += 4;
  return m;
}

/** Dense matrix of the block system, row-major (N·n)². */
function dense(m: BlockTridiagonal): Float64Array {
  const N = m.nPoints;
  const n = m.blockSize;
  const S = N * n;
  const a = new Float64Array(S * S);
  for (let j = 0; j < N; j++)
    for (let r = 0; r < n; r++)
      for (let c = 0; c < n; c++) {
        const row = j * n + r;
        a[row * S + j * n + c] = m.diag[(j * n + r) * n + c];
        if (j > 0) a[row * S + (j - 1) * n + c] = m.lower[(j * n + r) * n + c];
        if (j < N - 1) a[row * S + (j + 1) * n + c] = m.upper[(j * n + r) * n + c];
      }
  return a;
}

/** Textbook Gaussian elimination with partial pivoting on the dense matrix. */
function denseSolve(a: Float64Array, b: Float64Array): Float64Array {
  const S = b.length;
  const A = Float64Array.from(a);
  const x = Float64Array.from(b);
  for (let k = 0; k < S; k++) {
    let p = k;
    for (let i = k + 1; i < S; i++) if (Math.abs(A[i * S + k]) > Math.abs(A[p * S + k])) p = i;
    for (let c = 0; c < S; c++) [A[k * S + c], A[p * S + c]] = [A[p * S + c], A[k * S + c]];
    [x[k], x[p]] = [x[p], x[k]];
    for (let i = k + 1; i < S; i++) {
      const f = A[i * S + k] / A[k * S + k];
      for (let c = k; c < S; c++) A[i * S + c] -= f * A[k * S + c];
      x[i] -= f * x[k];
    }
  }
  for (let i = S - 1; i >= 0; i--) {
    let s = x[i];
    for (let c = i + 1; c < S; c++) s -= A[i * S + c] * x[c];
    x[i] = s / A[i * S + i];
  }
  return x;
}

describe("block-tridiagonal LU", () => {
  it("agrees with a dense Gaussian elimination to 1e-10 (12 points, blocks of 7)", () => {
    const m = randomSystem(12, 7, 42);
    const r = rng(7);
    const b = new Float64Array(12 * 7).map(() => r());
    const ref = denseSolve(dense(m), b);
    expect(m.factor()).toBe(-1);
    const x = Float64Array.from(b);
    m.solve(x);
    for (let i = 0; i < x.length; i++) expect(Math.abs(x[i] - ref[i])).toBeLessThan(1e-10);
  });

  it("recovers a chosen solution from its right-hand side, and reuses one factorisation for a second one", () => {
    const m = randomSystem(30, 5, 3);
    const r = rng(11);
    expect(m.factor()).toBe(-1);
    for (let trial = 0; trial < 2; trial++) {
      const xTrue = new Float64Array(150).map(() => r());
      const b = new Float64Array(150);
      m.multiply(xTrue, b);
      m.solve(b);
      for (let i = 0; i < 150; i++) expect(Math.abs(b[i] - xTrue[i])).toBeLessThan(1e-10);
    }
  });

  it("reuses its storage for a smaller system (reshape within the capacity), solving it like a fresh matrix", () => {
    // first a larger system in storage for 20 points, factorised and solved, so the arrays hold stale data
    const m = new BlockTridiagonal(16, 4, 20);
    const big = randomSystem(16, 4, 9);
    m.lower.set(big.lower);
    m.diag.set(big.diag);
    m.upper.set(big.upper);
    expect(m.factor()).toBe(-1);
    expect(m.reshape(21)).toBe(false);
    expect(m.reshape(10)).toBe(true);
    expect(m.nPoints).toBe(10);
    expect(m.isFactored).toBe(false);
    // then a 10-point system written over the same storage
    const small = randomSystem(10, 4, 13);
    m.clear();
    m.lower.set(small.lower);
    m.diag.set(small.diag);
    m.upper.set(small.upper);
    const r = rng(17);
    const b = new Float64Array(40).map(() => r());
    const ref = denseSolve(dense(small), b);
    expect(m.factor()).toBe(-1);
    const x = Float64Array.from(b);
    m.solve(x);
    for (let i = 0; i < x.length; i++) expect(Math.abs(x[i] - ref[i])).toBeLessThan(1e-10);
  });

  it("reports the first point whose pivot block is singular", () => {
    const m = randomSystem(4, 3, 5);
    for (let i = 0; i < 9; i++) m.diag[2 * 9 + i] = 0;
    for (let i = 0; i < 9; i++) m.lower[2 * 9 + i] = 0;
    expect(m.factor()).toBe(2);
  });
});
