/**
 * Post-flame NO: the burnt gas leaving the flame, continued as a constant-pressure plug flow with the
 * full mechanism for a stated residence time, and its NO and NO2 reported as a flue-gas emission
 * would be.
 *
 * Model (a closed, homogeneous, isobaric reactor: the plug flow in its own time t = z/u):
 *   dY_k/dt = ω̇_k W_k / ρ,   dT/dt = −Σ_k h_k ω̇_k W_k / (ρ c_p)   (adiabatic; h_k, c_p per kg)
 * with ρ = p W̄/(R T); `energy: "isothermal"` holds T instead (for checks against rate laws).
 *
 * Integration: TR-BDF2 (R. E. Bank, W. M. Coughran, W. Fichtner, E. H. Grosse, D. J. Rose,
 * R. K. Smith, IEEE Trans. Electron Devices 32 (1985) 1992; M. E. Hosea, L. F. Shampine, Appl. Numer.
 * Math. 20 (1996) 21): a trapezoidal stage to t + γh and a BDF2 stage to t + h, γ = 2 − √2, both
 * with the same Newton matrix I − (γ/2) h J (L-stable, second order). The local error estimate
 *   err = (I − (γ/2) h J)⁻¹ · 2Ch (f_n/γ − f_{n+γ}/(γ(1−γ)) + f_{n+1}/(1−γ)),  C = (−3γ² + 4γ − 2)/(12(2 − γ)),
 * controls the step (relative 1e-5, absolute 1e-11 on mass fractions, 1e-4 K on T). The Newton matrix
 * uses the analytic kinetics Jacobian ∂ω̇/∂C (chain rule to Y and T, the weak dependence of ρ on the
 * composition and of c_p on T left out: it only slows Newton, it does not change the answer).
 *
 * Report (dry flue gas, `noReport`): NO and NO2 in ppm by volume, O2 in % by volume, both on the dry
 * basis X_dry = X/(1 − X_H2O); NOx = NO + NO2 expressed as NO2 in mg/m³ at 0 °C, 101.325 kPa, dry, at
 * the reference O2 (3 % by default), by the conversions of lib/units/emissions.ts:
 *   mg/m³ = ppm × M_NO2/V_m (V_m = 22.414 L/mol),  E_ref = E × (21 − O2_ref)/(21 − O2_meas).
 * The reference-O2 formula assumes air as the oxidiser: with enriched air or oxygen the figure at
 * reference O2 is unknown (NaN/null) when the flue O2 is 21 % or more, and should be read with care
 * otherwise.
 *
 * This is a screening indicator of thermal and prompt NO (prompt NO formed in the flame is carried
 * in with the flame's burnt-end composition; thermal NO forms here): an adiabatic hot zone with no
 * heat extraction, mixing or staging, so it is not an emission guarantee.
 *
 * Default residence time: 20 ms (common practice, no source: the order of the time the gas spends
 * near its peak temperature in a burner's hot zone before heat exchange and dilution cool it; an
 * adiabatic plug flow held longer over-states thermal NO). Callers state the time they use.
 */
import { InputError, NotConvergedError } from "../errors";
import { R_J_per_molK } from "../units/constants";
import { atReferenceO2, ppmToMg_per_m3Normal } from "../units/emissions";
import { luFactor, luSolve } from "./block-tridiagonal";
import type { Kinetics } from "./kinetics";
import type { Mechanism } from "./mechanism";
import { speciesThermoInto } from "./thermo";

export const DEFAULT_POST_FLAME_RESIDENCE_MS = 20;
export const DEFAULT_REFERENCE_O2_PERCENT = 3;

export const POST_FLAME_LABEL =
  "Screening indicator of thermal and prompt NO: adiabatic constant-pressure plug flow after the flame, full mechanism; not an emission guarantee.";

export interface PostFlameInput {
  /** Burnt-gas temperature at the flame's end, K. */
  temperatureK: number;
  pressurePa: number;
  /** Mass fractions at the flame's end (length nSpecies). Not modified. */
  massFractions: Float64Array;
  /** Residence time, ms (default DEFAULT_POST_FLAME_RESIDENCE_MS). 0 reports the flame's end state. */
  residenceMs?: number;
  /** Reference O2 for mg/m³, % dry (default 3). */
  referenceO2Percent?: number;
  /** "adiabatic" (default): T follows from the energy balance; "isothermal": T held. */
  energy?: "adiabatic" | "isothermal";
  /** Times (ms, ascending, ≤ residence) at which to record the state. */
  sampleTimesMs?: readonly number[];
  signal?: AbortSignal;
}

export interface PostFlameSample {
  timeMs: number;
  temperatureK: number;
  /** Mole fractions (wet). */
  moleFractions: Float64Array;
}

export interface PostFlameResult {
  residenceMs: number;
  energy: "adiabatic" | "isothermal";
  initialTemperatureK: number;
  temperatureK: number;
  pressurePa: number;
  massFractions: Float64Array;
  /** Mole fractions (wet) at the end of the residence time. */
  moleFractions: Float64Array;
  NO_ppm_dry: number;
  NO2_ppm_dry: number;
  NOx_ppm_dry: number;
  O2_percent_dry: number;
  H2O_percent_wet: number;
  /** NO + NO2 as NO2, mg/m³ at 0 °C, 101.325 kPa, dry, at referenceO2Percent; NaN when unknown. */
  NOx_as_NO2_mg_per_m3_dry_at_ref_O2: number;
  referenceO2Percent: number;
  samples: PostFlameSample[];
  steps: number;
  rejectedSteps: number;
  /** Steps retried with half the step because Newton did not converge. */
  newtonFailures: number;
  /** |h_end − h_start| / (R T/W̄) for the adiabatic run (0 for isothermal). */
  enthalpyDrift: number;
  label: string;
  conversion: string;
}

/** The NO figure of the flame-speed output. */
export interface NOReport {
  ppm_dry: number;
  NO2_ppm_dry: number;
  /** null when unknown (flue O2 ≥ 21 %). */
  mg_per_m3_dry_at_ref_O2: number | null;
  referenceO2Percent: number;
  residenceMs: number;
  O2_percent_dry: number;
  basis: string;
  label: string;
}

const GAMMA = 2 - Math.SQRT2;
const D = GAMMA / 2; // = (1 − γ)/(2 − γ)
const ERR_C = (-3 * GAMMA * GAMMA + 4 * GAMMA - 2) / (12 * (2 - GAMMA));
const RTOL = 1e-5;
const ATOL_Y = 1e-9;
const ATOL_T = 1e-4;
const MAX_STEPS = 20000;
const MAX_NEWTON = 10;
/** Newton converged when its correction is below this fraction of the error tolerance. */
const NEWTON_TOL = 0.05;

export const POST_FLAME_CONVERSION =
  "Dry basis X_dry = X/(1 − X_H2O); mg/m³ at 0 °C, 101.325 kPa = ppm × M_NO2/22.414 L/mol; " +
  "at reference O2: × (21 − O2_ref)/(21 − O2_dry) (Directive 2010/75/EU, Annex VI Part 2); NOx = NO + NO2 as NO2.";

export function integratePostFlame(mech: Mechanism, kin: Kinetics, input: PostFlameInput): PostFlameResult {
  const n = mech.nSpecies;
  const N = n + 1;
  const W = mech.molarMass_kg_per_mol;
  const p = input.pressurePa;
  const residenceMs = input.residenceMs ?? DEFAULT_POST_FLAME_RESIDENCE_MS;
  const energy = input.energy ?? "adiabatic";
  const adiabatic = energy === "adiabatic";
  const refO2 = input.referenceO2Percent ?? DEFAULT_REFERENCE_O2_PERCENT;
  if (!(residenceMs >= 0) || !Number.isFinite(residenceMs))
    throw new InputError("postFlameResidenceMs", `must be a finite number of ms ≥ 0, got ${residenceMs}`);
  if (!(refO2 >= 0 && refO2 < 21)) throw new InputError("referenceO2Percent", `must be ≥ 0 and below 21 %, got ${refO2}`);
  if (!(input.temperatureK > 0) || !(input.pressurePa > 0))
    throw new InputError("", "post-flame: temperature and pressure must be positive");
  const tEnd = residenceMs / 1000;

  const sys = createPlugFlowSystem(mech, kin, p, adiabatic);
  const { rhs, Jf } = sys;
  const jacobian = sys.jacobian;
  const cpR = new Float64Array(n),
    hRT = new Float64Array(n),
    sR = new Float64Array(n);
  const Mx = new Float64Array(N * N);
  const piv = new Int32Array(N);
  const y0 = new Float64Array(N),
    y1 = new Float64Array(N),
    z = new Float64Array(N);
  const f0 = new Float64Array(N),
    fg = new Float64Array(N),
    f1 = new Float64Array(N);
  const r = new Float64Array(N),
    res = new Float64Array(N),
    dy = new Float64Array(N),
    err = new Float64Array(N);

  /** Newton matrix I − (γ/2) h J, factored in place (dense LU of the block solver). */
  function factor(h: number): boolean {
    for (let i = 0; i < N * N; i++) Mx[i] = -D * h * Jf[i];
    for (let i = 0; i < N; i++) Mx[i * N + i] += 1;
    return luFactor(Mx, 0, N, piv, 0);
  }
  function solve(b: Float64Array): void {
    luSolve(Mx, 0, N, piv, 0, b, 0);
  }
  const wt = (i: number, a: number, b: number) => (i === n ? ATOL_T : ATOL_Y) + RTOL * Math.max(Math.abs(a), Math.abs(b));

  /** Newton on x − D h f(x) = rhsv, x holds the guess; fx receives f(x). */
  function newton(x: Float64Array, rhsv: Float64Array, h: number, fx: Float64Array): boolean {
    let prev = 0;
    for (let it = 0; it < MAX_NEWTON; it++) {
      rhs(x, fx);
      for (let i = 0; i < N; i++) dy[i] = -(x[i] - D * h * fx[i] - rhsv[i]);
      solve(dy);
      let nrm = 0;
      for (let i = 0; i < N; i++) {
        x[i] += dy[i];
        const e = dy[i] / wt(i, x[i], x[i]);
        nrm += e * e;
      }
      nrm = Math.sqrt(nrm / N);
      if (!Number.isFinite(nrm) || !(x[n] > 200 && x[n] < 6000)) return false;
      // converged when the remaining error, estimated from the contraction rate, is small
      // (the stopping rule for simplified Newton iterations in E. Hairer, G. Wanner, Solving Ordinary
      // Differential Equations II, 2nd ed., Springer 1996, ch. IV)
      const rate = it > 0 ? nrm / prev : 0;
      if (it > 0 && rate >= 1) return false;
      if (nrm < NEWTON_TOL * (it > 0 ? (1 - rate) / Math.max(rate, 1e-3) : 1) || nrm < 1e-3) {
        rhs(x, fx);
        return true;
      }
      prev = nrm;
    }
    return false;
  }

  // ---- initial state ----
  for (let k = 0; k < n; k++) y0[k] = input.massFractions[k];
  y0[n] = input.temperatureK;
  const h0 = mixtureEnthalpy(y0);
  const samplesMs = input.sampleTimesMs ?? [];
  const samples: PostFlameSample[] = [];
  let nextSample = 0;
  const record = (tMs: number, y: Float64Array) => {
    const X = new Float64Array(n);
    molesOf(y, X);
    samples.push({ timeMs: tMs, temperatureK: y[n], moleFractions: X });
  };
  while (nextSample < samplesMs.length && samplesMs[nextSample] <= 0) record(samplesMs[nextSample++], y0);

  let t = 0;
  let h = Math.min(1e-8, tEnd);
  let steps = 0,
    rejected = 0,
    newtonFailures = 0;
  while (t < tEnd * (1 - 1e-12)) {
    if (input.signal?.aborted) throw new NotConvergedError("post-flame", "cancelled", { cancelled: true, timeMs: t * 1000, steps });
    if (steps + rejected > MAX_STEPS) {
      throw new NotConvergedError(
        "post-flame",
        `the post-flame integration did not reach ${residenceMs} ms in ${MAX_STEPS} steps`,
        { timeMs: t * 1000, steps, rejected, newtonFailures, stepS: h, temperatureK: y0[n] },
        "postFlameResidenceMs",
      );
    }
    // do not step over the next sample time or the end
    const tStop = nextSample < samplesMs.length ? Math.min(samplesMs[nextSample] / 1000, tEnd) : tEnd;
    if (t + h > tStop) h = tStop - t;
    if (h < 1e-16 * Math.max(tEnd, 1e-9) || h < 1e-20) {
      throw new NotConvergedError(
        "post-flame",
        "the post-flame integration step fell below round-off",
        { timeMs: t * 1000, steps, rejected, newtonFailures, stepS: h, temperatureK: y0[n] },
        "postFlameResidenceMs",
      );
    }
    jacobian(y0, f0);
    if (!factor(h)) {
      h *= 0.25;
      rejected++;
      continue;
    }
    // stage 1: trapezoid to t + γh
    for (let i = 0; i < N; i++) r[i] = y0[i] + D * h * f0[i];
    z.set(y0);
    let ok = newton(z, r, h, fg);
    if (ok) {
      // stage 2: BDF2 to t + h
      const a = 1 / (GAMMA * (2 - GAMMA)),
        b = ((1 - GAMMA) * (1 - GAMMA)) / (GAMMA * (2 - GAMMA));
      // predictor: the line through y_n and y_{n+γ}
      for (let i = 0; i < N; i++) {
        res[i] = a * z[i] - b * y0[i];
        y1[i] = y0[i] + (z[i] - y0[i]) / GAMMA;
      }
      ok = newton(y1, res, h, f1);
    }
    if (!ok) {
      h *= 0.5;
      rejected++;
      newtonFailures++;
      continue;
    }
    // error estimate, filtered through the Newton matrix
    for (let i = 0; i < N; i++) err[i] = 2 * ERR_C * h * (f0[i] / GAMMA - fg[i] / (GAMMA * (1 - GAMMA)) + f1[i] / (1 - GAMMA));
    solve(err);
    let en = 0;
    for (let i = 0; i < N; i++) {
      const e = err[i] / wt(i, y0[i], y1[i]);
      en += e * e;
    }
    en = Math.sqrt(en / N);
    if (!Number.isFinite(en)) {
      h *= 0.25;
      rejected++;
      continue;
    }
    const fac = Math.min(5, Math.max(0.2, 0.9 * Math.cbrt(1 / Math.max(en, 1e-12))));
    if (en > 1) {
      h *= fac;
      rejected++;
      continue;
    }
    t += h;
    steps++;
    y0.set(y1);
    while (nextSample < samplesMs.length && samplesMs[nextSample] / 1000 <= t * (1 + 1e-12)) record(samplesMs[nextSample++], y0);
    h *= fac;
  }
  while (nextSample < samplesMs.length) record(samplesMs[nextSample++], y0);

  // ---- report ----
  const X = new Float64Array(n);
  molesOf(y0, X);
  const Yend = y0.slice(0, n);
  const iNO = idx(mech, "NO"),
    iNO2 = idx(mech, "NO2"),
    iO2 = idx(mech, "O2"),
    iH2O = idx(mech, "H2O");
  const dry = 1 - Math.max(X[iH2O], 0);
  const NO = (1e6 * Math.max(X[iNO], 0)) / dry;
  const NO2 = (1e6 * Math.max(X[iNO2], 0)) / dry;
  const O2 = (100 * Math.max(X[iO2], 0)) / dry;
  const mgNO2 = ppmToMg_per_m3Normal(NO + NO2, W[iNO2] * 1000);
  let drift = 0;
  if (adiabatic) {
    const h1 = mixtureEnthalpy(y0);
    let s = 0;
    for (let k = 0; k < n; k++) s += y0[k] / W[k];
    drift = Math.abs(h1 - h0) / (R_J_per_molK * y0[n] * s);
  }
  return {
    residenceMs,
    energy,
    initialTemperatureK: input.temperatureK,
    temperatureK: y0[n],
    pressurePa: p,
    massFractions: Yend,
    moleFractions: X,
    NO_ppm_dry: NO,
    NO2_ppm_dry: NO2,
    NOx_ppm_dry: NO + NO2,
    O2_percent_dry: O2,
    H2O_percent_wet: 100 * X[iH2O],
    NOx_as_NO2_mg_per_m3_dry_at_ref_O2: atReferenceO2(mgNO2, O2, refO2),
    referenceO2Percent: refO2,
    samples,
    steps,
    rejectedSteps: rejected,
    newtonFailures,
    enthalpyDrift: drift,
    label: POST_FLAME_LABEL,
    conversion: POST_FLAME_CONVERSION,
  };

  function mixtureEnthalpy(y: Float64Array): number {
    speciesThermoInto(mech, y[n], cpR, hRT, sR);
    let s = 0;
    for (let k = 0; k < n; k++) s += (y[k] * hRT[k]) / W[k];
    return s * R_J_per_molK * y[n];
  }
  function molesOf(y: Float64Array, out: Float64Array): void {
    let s = 0;
    for (let k = 0; k < n; k++) s += y[k] / W[k];
    for (let k = 0; k < n; k++) out[k] = y[k] / W[k] / s;
  }
}

/**
 * The plug-flow ODE system in y = [Y_0 … Y_{K−1}, T]: f(y) and its Jacobian ∂f/∂y (row-major, (K+1)²).
 * Exported so that tests can check the Jacobian against differences of f.
 */
export function createPlugFlowSystem(mech: Mechanism, kin: Kinetics, p: number, adiabatic: boolean) {
  const n = mech.nSpecies;
  const N = n + 1;
  const W = mech.molarMass_kg_per_mol;
  const C = new Float64Array(n),
    wdot = new Float64Array(n);
  const cpR = new Float64Array(n),
    hRT = new Float64Array(n),
    sR = new Float64Array(n);
  const hk = new Float64Array(n),
    cpk = new Float64Array(n);
  const dWdC = new Float64Array(n * n),
    dWdT = new Float64Array(n);
  const Jf = new Float64Array(N * N);

  let rhoLast = 0;
  /** f(y) into out; leaves C, ρ, hk, cpk, cp at the state y. */
  let cpLast = 0;
  function rhs(y: Float64Array, out: Float64Array): void {
    const T = y[n];
    let s = 0;
    for (let k = 0; k < n; k++) s += y[k] / W[k];
    const rho = p / (R_J_per_molK * T * s);
    rhoLast = rho;
    for (let k = 0; k < n; k++) C[k] = (rho * y[k]) / W[k];
    kin.netProductionRates(T, C, wdot);
    for (let k = 0; k < n; k++) out[k] = (wdot[k] * W[k]) / rho;
    if (adiabatic) {
      speciesThermoInto(mech, T, cpR, hRT, sR);
      let cp = 0,
        q = 0;
      for (let k = 0; k < n; k++) {
        hk[k] = (hRT[k] * R_J_per_molK * T) / W[k];
        cpk[k] = (cpR[k] * R_J_per_molK) / W[k];
        cp += y[k] * cpk[k];
        q += hk[k] * out[k];
      }
      cpLast = cp;
      out[n] = -q / cp;
    } else {
      out[n] = 0;
    }
  }

  /** Jf = ∂f/∂y at y (f(y) already in fy). */
  function jacobian(y: Float64Array, fy: Float64Array): void {
    rhs(y, fy);
    const T = y[n];
    const rho = rhoLast;
    kin.jacobian(T, C, dWdC, dWdT);
    // C_k = ρ Y_k/W_k, ρ = p W̄/(R T): ∂C_m/∂Y_j = ρ δ_mj/W_m − C_m W̄/W_j, ∂C_m/∂T = −C_m/T;
    // f_k = ω̇_k W_k/ρ: ∂(1/ρ)/∂Y_j = W̄/(ρ W_j), ∂(1/ρ)/∂T = 1/(ρ T).
    let s = 0;
    for (let k = 0; k < n; k++) s += y[k] / W[k];
    const Wbar = 1 / s;
    Jf.fill(0);
    for (let k = 0; k < n; k++) {
      let sumC = 0;
      for (let j = 0; j < n; j++) sumC += dWdC[k * n + j] * C[j];
      for (let j = 0; j < n; j++) {
        Jf[k * N + j] = (W[k] / W[j]) * dWdC[k * n + j] + (Wbar / W[j]) * (fy[k] - (W[k] / rho) * sumC);
      }
      Jf[k * N + n] = adiabatic ? (W[k] / rho) * (dWdT[k] - sumC / T) + fy[k] / T : 0;
    }
    if (adiabatic) {
      // f_T = −Σ h_k f_k / c_p; ∂c_p/∂Y_j = c_p,j (the T-dependence of c_p is left out)
      const cp = cpLast;
      const fT = fy[n];
      for (let j = 0; j <= n; j++) {
        let q = 0;
        for (let k = 0; k < n; k++) q += hk[k] * Jf[k * N + j];
        Jf[n * N + j] = -q / cp - (j < n ? (fT * cpk[j]) / cp : 0);
      }
      let s2 = 0;
      for (let k = 0; k < n; k++) s2 += cpk[k] * fy[k];
      Jf[n * N + n] -= s2 / cp;
    }
  }

  return { rhs, jacobian, Jf };
}

function idx(mech: Mechanism, name: string): number {
  const i = mech.speciesIndex.get(name);
  if (i === undefined) throw new Error(`post-flame: the mechanism ${mech.name} has no species ${name}`);
  return i;
}

/** The `NO` object of the flame-speed output, from a post-flame result. */
export function noReport(r: PostFlameResult): NOReport {
  const mg = r.NOx_as_NO2_mg_per_m3_dry_at_ref_O2;
  return {
    ppm_dry: r.NO_ppm_dry,
    NO2_ppm_dry: r.NO2_ppm_dry,
    mg_per_m3_dry_at_ref_O2: Number.isFinite(mg) ? mg : null,
    referenceO2Percent: r.referenceO2Percent,
    residenceMs: r.residenceMs,
    O2_percent_dry: r.O2_percent_dry,
    basis: r.conversion,
    label: r.label,
  };
}
