/**
 * Starting estimate of a premixed flame: fresh mixture upstream, the equilibrium products of Stoke's
 * own equilibrium solver (lib/combustion/equilibrium.ts: the burnt state at the inlet enthalpy and
 * pressure) downstream, joined by a linear ramp over a short stretch of the domain; and the warm
 * start, which interpolates a neighbouring solution onto the new problem.
 */
import { R_J_per_molK } from "../units/constants";
import type { Mechanism } from "./mechanism";
import { interpolateField } from "./grid";
import type { FlameSolution, PremixedProblem } from "./premixed";

/** Fractions of the domain length at which the starting grid has its points. */
const START_GRID = [0, 0.08, 0.14, 0.18, 0.2, 0.22, 0.24, 0.26, 0.28, 0.3, 0.33, 0.37, 0.42, 0.5, 0.6, 0.75, 1];
/** The temperature ramp of the start runs from RAMP_START to RAMP_END (fractions of the length). */
const RAMP_START = 0.2;
const RAMP_END = 0.3;
/** The anchor point (T fixed there) lies at this fraction of the domain length, inside the ramp. */
const ANCHOR = 0.24;

/** Domain length for a flame at pressure p, m: 2 cm at 1 atm, shrinking with pressure like a flame's thickness (~p^-0.6). */
export function domainLength_m(pressurePa: number): number {
  return 0.02 * (101325 / pressurePa) ** 0.6;
}

/** Mass fractions from mole fractions keyed by species name (unknown names are an error). */
export function massFractionsFromMoles(mech: Mechanism, X: Record<string, number>): Float64Array {
  const Y = new Float64Array(mech.nSpecies);
  let s = 0;
  for (const [name, x] of Object.entries(X)) {
    const k = mech.speciesIndex.get(name);
    if (k === undefined) throw new Error(`species ${name} is not in mechanism ${mech.name}`);
    Y[k] += x * mech.molarMass_kg_per_mol[k];
    s += x * mech.molarMass_kg_per_mol[k];
  }
  for (let k = 0; k < Y.length; k++) Y[k] /= s;
  return Y;
}

/**
 * Starting guess of the burning velocity (sets the cold start's mass flux; the solve finds the
 * eigenvalue). Common practice, no source: a reference velocity of the fuel at φ = 1, 298 K, 1 atm
 * (methane 0.4 m/s rising to hydrogen 2 m/s with the square of the hydrogen share), scaled
 *   - with the burnt temperature as a one-step flame, S ∝ exp(−T_a / 2T_b), T_a = GUESS_ACTIVATION_K,
 *     against the reference fuel's adiabatic temperature (2225 K methane … 2390 K hydrogen),
 *   - with T_u/298.15 K (the rest of the rise with preheat) and with (p/1 atm)^−0.4.
 * Over 72 solved flames (eight fuels from methane to hydrogen, syngas and biogas; φ 0.6–1.4,
 * 298–600 K, 1–20 bar) it lies within 0.45–1.9 × the solved velocity (2.95 × for biogas at φ 1.4).
 * The former guess (the fuel's φ = 1 reference alone) started lean hydrogen at over twice its
 * velocity, and those solves failed.
 */
const GUESS_ACTIVATION_K = 16000;
export function burningVelocityGuess_m_per_s(
  h2MoleFraction: number,
  burntTemperatureK: number,
  unburntTemperatureK: number,
  pressurePa: number,
): number {
  const x = Math.min(1, Math.max(0, h2MoleFraction));
  const reference_m_per_s = 0.4 + 1.6 * x * x;
  const referenceBurntK = 2225 + 165 * x;
  const burnt = Math.exp(-(GUESS_ACTIVATION_K / 2) * (1 / burntTemperatureK - 1 / referenceBurntK));
  return reference_m_per_s * burnt * (unburntTemperatureK / 298.15) * (pressurePa / 101325) ** -0.4;
}

export interface BurntState {
  temperatureK: number;
  /** Mass fractions in the mechanism's species order. */
  Y: Float64Array;
}

/**
 * Cold start: fresh mixture at T_u on [0, ramp start], the burnt state beyond the ramp, linear in
 * between; ṁ = ρ_u·S_guess. The anchor temperature is the start's temperature at the anchor point.
 */
export function coldStart(
  prob: PremixedProblem,
  burnt: BurntState,
  burningVelocityGuess_m_per_s: number,
  length_m = domainLength_m(prob.pressurePa),
): FlameSolution {
  const { mech } = prob;
  const K = mech.nSpecies;
  const n = K + 2;
  const z = Float64Array.from(START_GRID, (f) => f * length_m);
  const x = new Float64Array(z.length * n);
  let s = 0;
  for (let k = 0; k < K; k++) s += prob.inletY[k] / mech.molarMass_kg_per_mol[k];
  const rhoU = prob.pressurePa / (s * R_J_per_molK * prob.unburntTemperatureK);
  const mdot = rhoU * burningVelocityGuess_m_per_s;
  const Tu = prob.unburntTemperatureK;
  const Tb = burnt.temperatureK;
  const ramp = (f: number) => Math.min(1, Math.max(0, (f - RAMP_START) / (RAMP_END - RAMP_START)));
  for (let j = 0; j < z.length; j++) {
    const w = ramp(START_GRID[j]);
    const o = j * n;
    x[o] = Tu + w * (Tb - Tu);
    for (let k = 0; k < K; k++) x[o + 1 + k] = (1 - w) * prob.inletY[k] + w * burnt.Y[k];
    x[o + K + 1] = mdot;
  }
  const zFix = ANCHOR * length_m;
  const tFix = Tu + ramp(ANCHOR) * (Tb - Tu);
  return { z, x, nSpecies: K, zFix, tFix, speciesNames: mech.speciesNames };
}

/**
 * Warm start from a neighbouring solution (another φ, hydrogen share, preheat, pressure …): its grid
 * and flame structure, moved onto the new problem's end states. With w the old solution's progress
 * (T − T_u,old)/(T_end,old − T_u,old) at each point, the new profiles are
 *   T = T_old + (1 − w)(T_u − T_u,old) + w (T_b − T_b,old),
 *   Y = Y_old + (1 − w)(Y_u − Y_u,old) + w (Y_b − Y_b,old),
 * where Y_b − Y_end,old is taken as the change of the equilibrium estimates of the burnt state
 * (new minus the neighbour's), and likewise for T_b; the inlet is the new fresh mixture, and the
 * neighbour's own solution is left unchanged where nothing changed. ṁ is scaled by the ratio of the inlet densities (same velocity);
 * the anchor keeps its position and its progress value.
 */
export function warmStart(
  prob: PremixedProblem,
  from: FlameSolution,
  fromUnburntK: number,
  fromInletY: Float64Array,
  fromBurnt: BurntState,
  fromInletDensity: number,
  newInletDensity: number,
  burnt: BurntState,
): FlameSolution {
  const K = prob.mech.nSpecies;
  if (from.nSpecies !== K) throw new Error("warm start from a solution of another mechanism");
  const n = K + 2;
  const x = Float64Array.from(from.x);
  const N = from.z.length;
  const Tu = prob.unburntTemperatureK;
  const TbOld = from.x[(N - 1) * n];
  const progress = (T: number) => Math.min(1, Math.max(0, (T - fromUnburntK) / Math.max(1, TbOld - fromUnburntK)));
  const dTu = Tu - fromUnburntK;
  const dTb = burnt.temperatureK - fromBurnt.temperatureK;
  for (let j = 0; j < N; j++) {
    const o = j * n;
    const w = progress(from.x[o]);
    x[o] = from.x[o] + (1 - w) * dTu + w * dTb;
    for (let k = 0; k < K; k++) {
      x[o + 1 + k] = from.x[o + 1 + k] + (1 - w) * (prob.inletY[k] - fromInletY[k]) + w * (burnt.Y[k] - fromBurnt.Y[k]);
    }
    x[o + K + 1] *= newInletDensity / fromInletDensity;
  }
  const wFix = progress(from.tFix);
  return {
    z: Float64Array.from(from.z),
    x,
    nSpecies: K,
    zFix: from.zFix,
    tFix: from.tFix + (1 - wFix) * dTu + wFix * dTb,
    speciesNames: from.speciesNames,
  };
}

/**
 * A coarser copy of a solution: every m-th point (m chosen for about `targetPoints`), always with
 * the ends and the point nearest the anchor. For warm starts that need pseudo-time steps: those are
 * cheap on a coarse grid, and refinement brings the points back.
 */
export function thinSolution(sol: FlameSolution, targetPoints: number): FlameSolution {
  const N = sol.z.length;
  const m = Math.max(1, Math.round(N / targetPoints));
  if (m === 1) return sol;
  const n = sol.nSpecies + 2;
  let jFix = 0;
  for (let j = 1; j < N; j++) if (Math.abs(sol.z[j] - sol.zFix) < Math.abs(sol.z[jFix] - sol.zFix)) jFix = j;
  const keep: number[] = [];
  for (let j = 0; j < N; j++) if (j % m === 0 || j === N - 1 || j === jFix) keep.push(j);
  const z = Float64Array.from(keep, (j) => sol.z[j]);
  const x = new Float64Array(keep.length * n);
  for (let i = 0; i < keep.length; i++) x.set(sol.x.subarray(keep[i] * n, (keep[i] + 1) * n), i * n);
  return { ...sol, z, x };
}

/**
 * What a warm-started solve changed beyond its estimate: the solution minus the estimate it was
 * started from (on the solution's grid; the mass flux as a ratio), and the inlet change that
 * estimate was made for. The next warm start along the same path extrapolates it (secant
 * predictor).
 */
export interface WarmCorrection {
  /** Solution minus estimate (T, Y); ln(ṁ/ṁ_estimate) in the ṁ slot; point-major on the solution's grid. */
  delta: Float64Array;
  /** Inlet change of that step: mass fractions, then ΔT_u/1000 K, then Δ ln p. */
  inletChange: Float64Array;
}

/** Inlet state as one vector for the secant predictor: mass fractions, T_u/1000 K, ln p. */
export function inletVector(inletY: Float64Array, unburntK: number, pressurePa: number): Float64Array {
  const v = new Float64Array(inletY.length + 2);
  v.set(inletY);
  v[inletY.length] = unburntK / 1000;
  v[inletY.length + 1] = Math.log(pressurePa);
  return v;
}

/** The correction a solve made to its estimate (see WarmCorrection). */
export function warmCorrection(solution: FlameSolution, estimate: FlameSolution, inletChange: Float64Array): WarmCorrection {
  const K = solution.nSpecies;
  const n = K + 2;
  const N = solution.z.length;
  const est = interpolateField(estimate.z, estimate.x, n, solution.z);
  const delta = new Float64Array(N * n);
  for (let j = 0; j < N; j++) {
    const o = j * n;
    for (let v = 0; v <= K; v++) delta[o + v] = solution.x[o + v] - est[o + v];
    delta[o + K + 1] = Math.log(solution.x[o + K + 1] / est[o + K + 1]);
  }
  return { delta, inletChange };
}

/** Smallest cosine between this step's inlet change and the last one's for the secant predictor. */
const PREDICTOR_MIN_COSINE = 0.9;
/** Largest extrapolation factor of the secant predictor. */
const PREDICTOR_MAX_FACTOR = 2;

/**
 * Secant predictor for a sweep: when the inlet changes along (nearly) the same direction as in the
 * step that produced `from`, the correction that step needed beyond its estimate is added to the
 * new estimate, scaled by the ratio of the steps (α = d₂·d₁/d₁·d₁, at most 2): temperatures and
 * mass fractions additively (mass fractions kept ≥ 0), the mass flux as a factor. `guess` is the
 * warm-start estimate on the grid of `from` (that of `correction`); it is changed in place.
 * Returns α (0: no extrapolation).
 */
export function extrapolateWarmStart(guess: FlameSolution, correction: WarmCorrection, inletChange: Float64Array): number {
  const d1 = correction.inletChange;
  const d2 = inletChange;
  if (d1.length !== d2.length || correction.delta.length !== guess.x.length) return 0;
  let d11 = 0;
  let d22 = 0;
  let d12 = 0;
  for (let i = 0; i < d1.length; i++) {
    d11 += d1[i] * d1[i];
    d22 += d2[i] * d2[i];
    d12 += d1[i] * d2[i];
  }
  if (!(d11 > 0 && d22 > 0) || d12 < PREDICTOR_MIN_COSINE * Math.sqrt(d11 * d22)) return 0;
  const alpha = Math.min(PREDICTOR_MAX_FACTOR, d12 / d11);
  const K = guess.nSpecies;
  const n = K + 2;
  const N = guess.z.length;
  const x = guess.x;
  const dl = correction.delta;
  for (let j = 0; j < N; j++) {
    const o = j * n;
    x[o] += alpha * dl[o];
    for (let k = 1; k <= K; k++) x[o + k] = Math.max(0, x[o + k] + alpha * dl[o + k]);
    x[o + K + 1] *= Math.exp(alpha * dl[o + K + 1]);
  }
  return alpha;
}
