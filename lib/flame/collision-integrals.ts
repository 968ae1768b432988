/**
 * Reduced collision integrals Ω(2,2)*, Ω(1,1)* and the ratios A*, B*, C* for Chapman–Enskog transport
 * with the Lennard-Jones 12-6 potential, and the Stockmayer (12-6-3) potential for polar pairs.
 *
 * - Ω(2,2)*, A* and C* against reduced temperature T* = k_B T/ε and reduced dipole δ* = μ²/(2εσ³):
 *   the tables of Monchick & Mason, J. Chem. Phys. 35 (1961) 1676 (collision-integral-tables.ts),
 *   interpolated quadratically in δ* over the three nearest columns and quadratically in ln T* over
 *   the three nearest rows. Ω(1,1)* = Ω(2,2)* /A*.
 * - Outside the tables' T* range (0.1–100): Ω(2,2)* and Ω(1,1)* follow the Neufeld, Janzen & Aziz
 *   correlations (J. Chem. Phys. 57 (1972) 1100, eqs. for the LJ 12-6 potential), scaled to meet
 *   the table at its end; A* and C* keep their end values. (Within 200–3500 K, T* stays inside the
 *   tables for every GRI-Mech 3.0 species.)
 * - B* = (5Ω(1,2)* − 4Ω(1,3)*)/Ω(1,1)*, only needed for thermal diffusion of light species against
 *   non-polar partners: from the Neufeld–Janzen–Aziz Ω(1,1)* with the exact recursion of the
 *   reduced integrals, Ω(l,s+1)* = Ω(l,s)* + (T* /(s+2)) dΩ(l,s)* /dT* (Hirschfelder, Curtiss & Bird,
 *   Molecular Theory of Gases and Liquids, Wiley 1954, ch. 8).
 */
import { A_STAR, C_STAR, DELTA_STAR, OMEGA22_STAR, TSTAR } from "./collision-integral-tables";

const NT = TSTAR.length;
const ND = DELTA_STAR.length;
const LN_TSTAR = TSTAR.map(Math.log);
const TSTAR_MIN = TSTAR[0];
const TSTAR_MAX = TSTAR[NT - 1];
const DELTA_MAX = DELTA_STAR[ND - 1];

/** Neufeld, Janzen & Aziz (1972): Ω(2,2)* of the LJ 12-6 potential. */
export function omega22NJA(Ts: number): number {
  const p = Ts ** 0.14874;
  return (
    1.16145 / p +
    0.52487 * Math.exp(-0.7732 * Ts) +
    2.16178 * Math.exp(-2.43787 * Ts) -
    6.435e-4 * p * Math.sin(18.0323 * Ts ** -0.7683 - 7.27371)
  );
}

// Neufeld, Janzen & Aziz (1972) Ω(1,1)* = a T*^−b + c e^(−d T*) + e e^(−f T*) + g e^(−h T*).
const NJA11 = [1.06036, 0.1561, 0.193, 0.47635, 1.03587, 1.52996, 1.76474, 3.89411] as const;

/** Neufeld, Janzen & Aziz (1972): Ω(1,1)* of the LJ 12-6 potential, with its first and second T*-derivatives. */
function omega11NJAWithDerivatives(Ts: number): [number, number, number] {
  const [a, b, c, d, e, f, g, h] = NJA11;
  const pw = a * Ts ** -b;
  const ed = c * Math.exp(-d * Ts);
  const ef = e * Math.exp(-f * Ts);
  const eh = g * Math.exp(-h * Ts);
  const v = pw + ed + ef + eh;
  const d1 = (-b * pw) / Ts - d * ed - f * ef - h * eh;
  const d2 = (b * (b + 1) * pw) / (Ts * Ts) + d * d * ed + f * f * ef + h * h * eh;
  return [v, d1, d2];
}

/** Neufeld, Janzen & Aziz (1972): Ω(1,1)* of the LJ 12-6 potential. */
export function omega11NJA(Ts: number): number {
  return omega11NJAWithDerivatives(Ts)[0];
}

/** Quadratic Lagrange interpolation through (x0,y0), (x1,y1), (x2,y2) at x. */
function quad(x: number, x0: number, x1: number, x2: number, y0: number, y1: number, y2: number): number {
  return (
    (y0 * (x - x1) * (x - x2)) / ((x0 - x1) * (x0 - x2)) +
    (y1 * (x - x0) * (x - x2)) / ((x1 - x0) * (x1 - x2)) +
    (y2 * (x - x0) * (x - x1)) / ((x2 - x0) * (x2 - x1))
  );
}

/** First of the three stencil indices around v in the ascending grid g (length n). */
function stencil(g: readonly number[], v: number): number {
  let i = 1;
  while (i < g.length - 1 && g[i] < v) i++; // g[i-1] < v <= g[i] (or ends)
  // centre the stencil on the nearer node
  const j = v - g[i - 1] < g[i] - v ? i - 2 : i - 1;
  return Math.min(Math.max(j, 0), g.length - 3);
}

/** Table value at (T*, δ*) with T* inside [0.1, 100] and 0 ≤ δ* ≤ 2.5. */
function table2(table: readonly number[], Ts: number, ds: number): number {
  const j0 = stencil(DELTA_STAR, ds);
  const i0 = stencil(TSTAR, Ts);
  const d0 = DELTA_STAR[j0],
    d1 = DELTA_STAR[j0 + 1],
    d2 = DELTA_STAR[j0 + 2];
  let r0 = 0,
    r1 = 0,
    r2 = 0;
  for (let r = 0; r < 3; r++) {
    const o = (i0 + r) * ND + j0;
    const v = ds === 0 ? table[o - j0] : quad(ds, d0, d1, d2, table[o], table[o + 1], table[o + 2]);
    if (r === 0) r0 = v;
    else if (r === 1) r1 = v;
    else r2 = v;
  }
  return quad(Math.log(Ts), LN_TSTAR[i0], LN_TSTAR[i0 + 1], LN_TSTAR[i0 + 2], r0, r1, r2);
}

function checkDelta(ds: number): number {
  if (!(ds >= 0)) throw new Error(`collision integrals: reduced dipole δ* = ${ds} is not ≥ 0`);
  // Beyond the tables (no GRI-Mech species comes near): hold the last column.
  return Math.min(ds, DELTA_MAX);
}

/** Ω(2,2)*(T*, δ*), the viscosity collision integral. */
export function omega22Star(Ts: number, deltaStar: number): number {
  const ds = checkDelta(deltaStar);
  if (Ts < TSTAR_MIN) return table2(OMEGA22_STAR, TSTAR_MIN, ds) * (omega22NJA(Ts) / omega22NJA(TSTAR_MIN));
  if (Ts > TSTAR_MAX) return table2(OMEGA22_STAR, TSTAR_MAX, ds) * (omega22NJA(Ts) / omega22NJA(TSTAR_MAX));
  return table2(OMEGA22_STAR, Ts, ds);
}

/** A*(T*, δ*) = Ω(2,2)* / Ω(1,1)*. */
export function aStar(Ts: number, deltaStar: number): number {
  const ds = checkDelta(deltaStar);
  return table2(A_STAR, Math.min(Math.max(Ts, TSTAR_MIN), TSTAR_MAX), ds);
}

/** C*(T*, δ*) = Ω(1,2)* / Ω(1,1)*. */
export function cStar(Ts: number, deltaStar: number): number {
  const ds = checkDelta(deltaStar);
  return table2(C_STAR, Math.min(Math.max(Ts, TSTAR_MIN), TSTAR_MAX), ds);
}

/** Ω(1,1)*(T*, δ*), the diffusion collision integral. */
export function omega11Star(Ts: number, deltaStar: number): number {
  return omega22Star(Ts, deltaStar) / aStar(Ts, deltaStar);
}

/**
 * Ω(1,2)* / Ω(1,1)* and B* of the LJ 12-6 potential (δ* = 0) from the Neufeld–Janzen–Aziz Ω(1,1)*
 * and the recursion of the reduced collision integrals.
 */
export function ratiosLJFromRecursion(Ts: number): { cStar: number; bStar: number } {
  const [o11, d1, d2] = omega11NJAWithDerivatives(Ts);
  const o12 = o11 + (Ts / 3) * d1;
  const do12 = (4 / 3) * d1 + (Ts / 3) * d2;
  const o13 = o12 + (Ts / 4) * do12;
  return { cStar: o12 / o11, bStar: (5 * o12 - 4 * o13) / o11 };
}
