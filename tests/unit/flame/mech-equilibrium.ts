/**
 * Test support: the chemical equilibrium of all species of a mechanism at fixed T and p, on the
 * mechanism's own thermo, by the element-potential conditions of Gibbs-energy minimisation for an
 * ideal gas (Gordon & McBride, NASA RP-1311 (1994), ch. 2):
 *   ln X_k = −g°_k/(R T) − ln(p/P°) + Σ_e a_ek λ_e,   Σ_k X_k = 1,   Σ_k a_ek X_k = N b_e.
 * Unknowns λ_e and ln N, solved by Newton with the analytic Jacobian (∂X_k/∂λ_e = a_ek X_k), started
 * from element potentials read off a given major-species composition (e.g. from Stoke's equilibrium
 * solver, whose thermo differs slightly). Returns the concentrations, mol/m³.
 */
import type { Mechanism } from "../../../lib/flame/mechanism";
import { speciesThermoInto } from "../../../lib/flame/thermo";
import { R_J_per_molK } from "../../../lib/units/constants";

export function mechanismEquilibrium(
  mech: Mechanism,
  T: number,
  pPa: number,
  elementAmounts: Record<string, number>,
  /** ln λ guesses: species whose mole fractions fix one element each, in element order of `pivots` */
  startX: Record<string, number>,
): { C: Float64Array; X: Float64Array } {
  const nS = mech.nSpecies,
    nE = mech.elementNames.length;
  const cp = new Float64Array(nS),
    h = new Float64Array(nS),
    s = new Float64Array(nS),
    g = new Float64Array(nS);
  speciesThermoInto(mech, T, cp, h, s);
  const lnP = Math.log(pPa / mech.standardPressurePa);
  for (let k = 0; k < nS; k++) g[k] = h[k] - s[k];
  const a = (e: number, k: number) => mech.elementMatrix[e * nS + k];
  const b = mech.elementNames.map((e) => elementAmounts[e] ?? 0);
  // start: least squares λ from ln X_k + g_k + lnP = Σ a_ek λ_e over the given species
  const lam = new Float64Array(nE);
  {
    const rows: number[][] = [],
      rhs: number[] = [];
    for (const [name, x] of Object.entries(startX)) {
      const k = mech.speciesIndex.get(name) as number;
      rows.push(mech.elementNames.map((_, e) => a(e, k)));
      rhs.push(Math.log(x) + g[k] + lnP);
    }
    const AtA = Array.from({ length: nE }, () => new Array(nE + 1).fill(0));
    for (let r = 0; r < rows.length; r++)
      for (let i = 0; i < nE; i++) {
        for (let j = 0; j < nE; j++) AtA[i][j] += rows[r][i] * rows[r][j];
        AtA[i][nE] += rows[r][i] * rhs[r];
      }
    solveInPlace(AtA, nE).forEach((v, i) => {
      lam[i] = v;
    });
  }
  const X = new Float64Array(nS);
  const fill = () => {
    for (let k = 0; k < nS; k++) {
      let v = -g[k] - lnP;
      for (let e = 0; e < nE; e++) v += a(e, k) * lam[e];
      X[k] = Math.exp(Math.min(v, 50));
    }
  };
  fill();
  const bsum = b.reduce((x, y) => x + y, 0);
  let lnN = 0;
  {
    let tot = 0;
    for (let e = 0; e < nE; e++) for (let k = 0; k < nS; k++) tot += a(e, k) * X[k];
    lnN = Math.log(tot / bsum);
  }
  for (let it = 0; it < 200; it++) {
    fill();
    const N = Math.exp(lnN);
    const J = Array.from({ length: nE + 1 }, () => new Array(nE + 2).fill(0));
    let maxRes = 0;
    for (let e = 0; e < nE; e++) {
      let r = -N * b[e];
      for (let k = 0; k < nS; k++) r += a(e, k) * X[k];
      J[e][nE + 1] = -r;
      maxRes = Math.max(maxRes, Math.abs(r) / (N * bsum));
      for (let f = 0; f < nE; f++) {
        let v = 0;
        for (let k = 0; k < nS; k++) v += a(e, k) * a(f, k) * X[k];
        J[e][f] = v;
      }
      J[e][nE] = -N * b[e];
    }
    let sum = -1;
    for (let k = 0; k < nS; k++) sum += X[k];
    J[nE][nE + 1] = -sum;
    maxRes = Math.max(maxRes, Math.abs(sum));
    for (let f = 0; f < nE; f++) {
      let v = 0;
      for (let k = 0; k < nS; k++) v += a(f, k) * X[k];
      J[nE][f] = v;
    }
    if (maxRes < 1e-14) {
      const ctot = pPa / (R_J_per_molK * T);
      return { C: X.map((x) => x * ctot), X };
    }
    const d = solveInPlace(J, nE + 1);
    let step = 1;
    for (const v of d) step = Math.min(step, 2 / Math.max(Math.abs(v), 1e-300));
    for (let e = 0; e < nE; e++) lam[e] += step * d[e];
    lnN += step * d[nE];
  }
  throw new Error("mechanismEquilibrium: no convergence");
}

function solveInPlace(M: number[][], n: number): number[] {
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(M[r][c]) > Math.abs(M[p][c])) p = r;
    [M[c], M[p]] = [M[p], M[c]];
    for (let r = c + 1; r < n; r++) {
      const f = M[r][c] / M[c][c];
      for (let j = c; j <= n; j++) M[r][j] -= f * M[c][j];
    }
  }
  const x = new Array(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let v = M[r][n];
    for (let j = r + 1; j < n; j++) v -= M[r][j] * x[j];
    x[r] = v / M[r][r];
  }
  return x;
}
