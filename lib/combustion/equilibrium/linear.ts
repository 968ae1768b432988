/**
 * The dense linear solver of the equilibrium iteration: Gaussian elimination with scaled partial
 * pivoting on a small system stored row-major with a fixed row stride.
 */
import { NE_ALL } from "./settings";

/**
 * Largest reduced system: one row per element, one for Δln n and one for Δln T (HP); the row stride of
 * every matrix the solver keeps.
 */
export const MATRIX_STRIDE = NE_ALL + 2;

/**
 * Solves M x = rhs in place (M: m×m, row stride `stride`) by Gaussian elimination with scaled partial pivoting.
 * Returns false if the matrix is singular to working precision.
 */
export function solveDense(M: Float64Array, rhs: Float64Array, x: Float64Array, m: number, stride: number): boolean {
  // row scaling: divide each row by its largest magnitude
  for (let r = 0; r < m; r++) {
    let s = 0;
    for (let c = 0; c < m; c++) {
      const v = Math.abs(M[r * stride + c]);
      if (v > s) s = v;
    }
    if (!(s > 0) || !Number.isFinite(s)) return false;
    const inv = 1 / s;
    for (let c = 0; c < m; c++) M[r * stride + c] *= inv;
    rhs[r] *= inv;
  }
  for (let col = 0; col < m; col++) {
    let piv = col;
    let best = Math.abs(M[col * stride + col]);
    for (let r = col + 1; r < m; r++) {
      const v = Math.abs(M[r * stride + col]);
      if (v > best) {
        best = v;
        piv = r;
      }
    }
    if (!(best > 1e-300)) return false;
    if (piv !== col) {
      for (let c = col; c < m; c++) {
        const t = M[col * stride + c];
        M[col * stride + c] = M[piv * stride + c];
        M[piv * stride + c] = t;
      }
      const t = rhs[col];
      rhs[col] = rhs[piv];
      rhs[piv] = t;
    }
    const inv = 1 / M[col * stride + col];
    for (let r = col + 1; r < m; r++) {
      const f = M[r * stride + col] * inv;
      if (f === 0) continue;
      for (let c = col + 1; c < m; c++) M[r * stride + c] -= f * M[col * stride + c];
      rhs[r] -= f * rhs[col];
    }
  }
  for (let r = m - 1; r >= 0; r--) {
    let s = rhs[r];
    for (let c = r + 1; c < m; c++) s -= M[r * stride + c] * x[c];
    x[r] = s / M[r * stride + r];
    if (!Number.isFinite(x[r])) return false;
  }
  return true;
}
