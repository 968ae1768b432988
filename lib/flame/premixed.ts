/**
 * Steady, isobaric, freely propagating 1D premixed flame (low Mach number), after the method of
 * Kee, Grcar, Smooke & Miller, "PREMIX", Sandia report SAND85-8240 (1985), and Kee, Coltrin &
 * Glarborg, Chemically Reacting Flow (Wiley 2003), ch. 16.
 *
 * Unknowns at each grid point z_j: T, the K species mass fractions Y_k, and the mass flux ṁ = ρu
 * (the eigenvalue; carried at every point so that the Jacobian stays block-tridiagonal, with
 * dṁ/dz = 0 written towards the anchor point, where T = T_fix closes the system instead).
 *
 *   species:  ṁ dY_k/dz + d j_k/dz − ω̇_k W_k = 0
 *   energy:   ṁ c_p dT/dz − d(λ dT/dz)/dz + (Σ_k j_k c_p,k) dT/dz + Σ_k h_k ω̇_k = 0
 *
 * Discretisation: finite volumes around each point (faces at the interval midpoints, width
 * (z_{j+1} − z_{j−1})/2), first-order upwind convective fluxes (ṁY_{j} at face j+1/2) and central
 * diffusive fluxes at the faces, with the transport coefficients of the two neighbouring points
 * averaged. The conservative form makes the element fluxes at the inlet and the outlet agree to
 * round-off on any grid (the nodal upwind form (Y_j − Y_{j−1})/(z_j − z_{j−1}) does not on a
 * non-uniform grid: it lost a few per cent of the hydrogen of lean H2 flames). Mixture-averaged diffusion j_k = −ρ (W_k/W̄) D_km dX_k/dz
 * (+ thermal diffusion −ρ (W_k/W̄) D_km k_T,k (1/T) dT/dz for H and H2 when on), with the correction
 * j_k ← j_k − Y_k Σ_i j_i so that the fluxes sum to zero. Inlet: T = T_u and the species fluxes
 * ṁ Y_k + j_k = ṁ Y_k,u; outlet: zero gradients.
 *
 * Solution: damped modified Newton iteration (Deuflhard, Numer. Math. 22 (1974) 289–315: a step is
 * accepted when the next Newton correction, computed with the same Jacobian, is smaller), the
 * Jacobian kept over several steps; when Newton fails, backward-Euler pseudo-time steps
 * (Smooke, J. Comput. Phys. 48 (1982) 72–105), then Newton again. The Jacobian is built by finite
 * differences of the residual with column colouring over the block-tridiagonal structure (every
 * third point perturbed at once): thermo, kinetics and transport are evaluated only at the
 * perturbed points, the residual rows are reassembled around them.
 *
 * Nothing is allocated inside the residual, the Jacobian or the Newton loop: all work arrays are
 * allocated once per grid.
 */
import { NotConvergedError } from "../errors";
import { R_J_per_molK } from "../units/constants";
import { BlockTridiagonal } from "./block-tridiagonal";
import { interpolateField, markIntervals, removablePoints, splitIntervals, type GridCriteria } from "./grid";
import type { Mechanism } from "./mechanism";
import { speciesThermoInto } from "./thermo";

/** What the flame needs of the kinetics (structural: lib/flame/kinetics.ts provides it). */
export interface FlameKinetics {
  netProductionRates(T: number, C: Float64Array, out: Float64Array): void;
  /** ∂ω̇/∂C (row-major [k·K + j]) and ∂ω̇/∂T; used for the Jacobian when present. */
  jacobian?(T: number, C: Float64Array, dWdC: Float64Array, dWdT: Float64Array): void;
}
/** What the flame needs of the transport (structural: lib/flame/transport.ts provides it). */
export interface FlameTransportOut {
  viscosity_Pa_s: number;
  conductivity_W_per_mK: number;
  Dkm_m2_per_s: Float64Array;
  thermalDiffusionRatio: Float64Array;
}
export interface FlameTransport {
  readonly soret: boolean;
  evaluate(T: number, p_Pa: number, X: Float64Array, out: FlameTransportOut): void;
  newOutput(): FlameTransportOut;
}

export interface PremixedProblem {
  mech: Mechanism;
  kinetics: FlameKinetics;
  transport: FlameTransport;
  pressurePa: number;
  unburntTemperatureK: number;
  /** Inlet mass fractions, length nSpecies. */
  inletY: Float64Array;
}

/** A solution on its grid (point-major, n = K + 2 values per point: T, Y_1…Y_K, ṁ). */
export interface FlameSolution {
  z: Float64Array;
  x: Float64Array;
  nSpecies: number;
  /** Anchor: position and temperature of the fixed point. */
  zFix: number;
  tFix: number;
  speciesNames: readonly string[];
}

export interface SolverSettings {
  rtol: number;
  atolY: number;
  atolT: number;
  /** Newton steps with one Jacobian before it is refreshed. */
  maxJacobianAge: number;
  /**
   * Steady Newton: a Jacobian from an earlier state is refreshed when the step needed damping or
   * when, at the step's contraction rate, more than this many further steps would be needed
   * (0: only when a step fails or the age limit is reached).
   */
  jacobianRefreshIterations: number;
  /** Steady Newton: quasi-Newton (good Broyden) updates kept per Jacobian (0: plain modified Newton). */
  quasiNewtonSteps: number;
  /** Pseudo-time: first step, s. */
  dt0: number;
  /** Pseudo-time steps per attempt before Newton is tried again. */
  timeSteps: number;
  maxTimeStepAttempts: number;
}

export const DEFAULT_SOLVER_SETTINGS: SolverSettings = {
  rtol: 1e-5,
  atolY: 1e-9,
  atolT: 1e-6,
  maxJacobianAge: 20,
  jacobianRefreshIterations: 20,
  quasiNewtonSteps: 8,
  dt0: 1e-5,
  timeSteps: 10,
  maxTimeStepAttempts: 40,
};

export interface ProgressInfo {
  stage: string;
  /** Share of the point budget (`maxPoints`) the current grid uses, at most 0.95 before the end: a rough indicator of progress, not a forecast. */
  fraction: number;
  gridPoints: number;
}

export interface SolveStats {
  residualEvaluations: number;
  jacobianEvaluations: number;
  newtonIterations: number;
  timeSteps: number;
  jacobianSeconds: number;
  factorSeconds: number;
  residualSeconds: number;
}

const Y_LOWER = -1e-4;
/**
 * Jacobian storage is allocated for this many times the grid's points, so that the next refinement
 * pass (or a sweep's next solve, which adds a few points) reuses it instead of allocating tens of MB.
 */
const JACOBIAN_CAPACITY_SLACK = 1.25;
/** Point-evaluation modes (see evalPointFast). */
const FULL = 0;
const NO_KINETICS = 1;
const COMPOSITION = 2;
const T_LOWER = 150;
const T_UPPER = 6000;
const DAMP = Math.SQRT2;
const MAX_DAMP_STEPS = 9;
/**
 * Steady Newton: a step with a freshly evaluated Jacobian that needs damping below this is taken as
 * a sign that the state is too far from the steady solution; the attempt ends there (pseudo-time
 * steps follow) instead of creeping on with tiny steps that the time stepping discards anyway.
 */
const LAMBDA_MIN = 0.05;

/**
 * The flame on one grid: work arrays, residual, Jacobian and the Newton/pseudo-time solver.
 * Create one per grid (Flame.onGrid); the arrays are reused across all iterations on that grid.
 */
export class FlameGridSolver {
  readonly K: number;
  readonly n: number;
  readonly N: number;
  readonly z: Float64Array;
  readonly jFix: number;
  readonly tFix: number;
  readonly x: Float64Array;
  private readonly prob: PremixedProblem;
  private readonly W: Float64Array;
  private readonly invW: Float64Array;
  // per-point properties (N × K arrays, and N scalars)
  private readonly Xp: Float64Array;
  private readonly cpR: Float64Array;
  private readonly hRT: Float64Array;
  private readonly wdot: Float64Array;
  private readonly coef: Float64Array;
  private readonly coefT: Float64Array;
  private readonly Dk: Float64Array;
  private readonly kT: Float64Array;
  private readonly sDk: Float64Array;
  private readonly sKT: Float64Array;
  private readonly dWdC: Float64Array;
  private readonly dWdT: Float64Array;
  private readonly dwdY: Float64Array;
  private readonly rho: Float64Array;
  private readonly cpMass: Float64Array;
  private readonly lambda: Float64Array;
  private readonly Tp: Float64Array;
  // saved per-point properties for the Jacobian passes
  private readonly sXp: Float64Array;
  private readonly sCpR: Float64Array;
  private readonly sHRT: Float64Array;
  private readonly sWdot: Float64Array;
  private readonly sCoef: Float64Array;
  private readonly sCoefT: Float64Array;
  private readonly sScal: Float64Array;
  // fluxes at midpoints ((N−1) × K)
  private readonly flux: Float64Array;
  private readonly sFlux: Float64Array;
  // work vectors
  private readonly F: Float64Array;
  private readonly F1: Float64Array;
  private readonly dx: Float64Array;
  private readonly dx1: Float64Array;
  private readonly x1: Float64Array;
  private readonly xOld: Float64Array;
  private readonly ewt: Float64Array;
  private readonly v: Float64Array;
  // quasi-Newton history: the full steps taken with the current Jacobian, their weighted norms², the weights
  private readonly qnS: Float64Array;
  private readonly qnNorm2: Float64Array;
  private readonly qnW: Float64Array;
  private readonly qnLast: Float64Array;
  private qnSteps = 0;
  private readonly jac: BlockTridiagonal;
  // point work arrays
  private readonly C: Float64Array;
  private readonly sR: Float64Array;
  private readonly Xw: Float64Array;
  private readonly cpRw: Float64Array;
  private readonly hRTw: Float64Array;
  private readonly wdotw: Float64Array;
  private readonly trOut: FlameTransportOut;
  private readonly soretSpecies: Int32Array;
  private rdt = 0;
  private jacobianValid = false;
  private jacobianAge = 0;
  private jacobianRdt = 0;
  readonly stats: SolveStats = {
    residualEvaluations: 0,
    jacobianEvaluations: 0,
    newtonIterations: 0,
    timeSteps: 0,
    jacobianSeconds: 0,
    factorSeconds: 0,
    residualSeconds: 0,
  };
  settings: SolverSettings;
  signal?: AbortSignal;
  /**
   * Steady Newton: once the next correction is below `tolerance` (weighted norm), `stop()` is
   * asked whether to end the solve before convergence (the driver's early refinement decision).
   */
  earlyStop?: { tolerance: number; stop: () => boolean };
  /** The last solve() ended early by `earlyStop`: x is nearly, not fully, converged. */
  stoppedEarly = false;
  /** Use the kinetics' analytic Jacobian for the source terms (when it has one). */
  analyticKinetics: boolean;

  constructor(
    prob: PremixedProblem,
    z: Float64Array,
    x: Float64Array,
    jFix: number,
    tFix: number,
    settings: SolverSettings = DEFAULT_SOLVER_SETTINGS,
    inheritedJacobian?: BlockTridiagonal,
    spareStorage?: BlockTridiagonal,
  ) {
    const K = prob.mech.nSpecies;
    this.prob = prob;
    this.K = K;
    this.n = K + 2;
    this.N = z.length;
    this.z = z;
    this.x = x;
    this.jFix = jFix;
    this.tFix = tFix;
    this.settings = settings;
    this.analyticKinetics = typeof prob.kinetics.jacobian === "function";
    const N = this.N;
    this.W = prob.mech.molarMass_kg_per_mol;
    this.invW = this.W.map((w) => 1 / w);
    const NK = N * K;
    this.Xp = new Float64Array(NK);
    this.cpR = new Float64Array(NK);
    this.hRT = new Float64Array(NK);
    this.wdot = new Float64Array(NK);
    this.coef = new Float64Array(NK);
    this.coefT = new Float64Array(NK);
    this.Dk = new Float64Array(NK);
    this.kT = new Float64Array(NK);
    this.sDk = new Float64Array(NK);
    this.sKT = new Float64Array(NK);
    this.dWdC = new Float64Array(K * K);
    this.dWdT = new Float64Array(K);
    this.dwdY = new Float64Array(K);
    this.rho = new Float64Array(N);
    this.cpMass = new Float64Array(N);
    this.lambda = new Float64Array(N);
    this.Tp = new Float64Array(N);
    this.sXp = new Float64Array(NK);
    this.sCpR = new Float64Array(NK);
    this.sHRT = new Float64Array(NK);
    this.sWdot = new Float64Array(NK);
    this.sCoef = new Float64Array(NK);
    this.sCoefT = new Float64Array(NK);
    this.sScal = new Float64Array(4 * N);
    this.flux = new Float64Array(Math.max(1, N - 1) * K);
    this.sFlux = new Float64Array(Math.max(1, N - 1) * K);
    const S = N * this.n;
    this.F = new Float64Array(S);
    this.F1 = new Float64Array(S);
    this.dx = new Float64Array(S);
    this.dx1 = new Float64Array(S);
    this.x1 = new Float64Array(S);
    this.xOld = new Float64Array(S);
    this.ewt = new Float64Array(this.n);
    this.v = new Float64Array(S);
    const qnMax = Math.max(0, settings.quasiNewtonSteps);
    this.qnS = new Float64Array(qnMax * S);
    this.qnNorm2 = new Float64Array(qnMax);
    this.qnW = new Float64Array(this.n);
    this.qnLast = new Float64Array(qnMax > 0 ? S : 0);
    if (inheritedJacobian && inheritedJacobian.nPoints === N && inheritedJacobian.blockSize === this.n && inheritedJacobian.isFactored) {
      // A neighbour's factorised steady-state Jacobian on this same grid: used as if it were one
      // step old, so that the first step it fails to reduce brings a fresh one (see newton()).
      this.jac = inheritedJacobian;
      this.jacobianValid = true;
      this.jacobianRdt = 0;
      this.jacobianAge = 1;
    } else {
      const storage = spareStorage ?? inheritedJacobian;
      this.jac =
        storage && storage.blockSize === this.n && storage.reshape(N)
          ? storage
          : new BlockTridiagonal(N, this.n, Math.ceil(N * JACOBIAN_CAPACITY_SLACK));
    }
    this.C = new Float64Array(K);
    this.sR = new Float64Array(K);
    this.Xw = new Float64Array(K);
    this.cpRw = new Float64Array(K);
    this.hRTw = new Float64Array(K);
    this.wdotw = new Float64Array(K);
    this.trOut = prob.transport.newOutput();
    const sor: number[] = [];
    if (prob.transport.soret) {
      for (const name of ["H", "H2"]) {
        const i = prob.mech.speciesIndex.get(name);
        if (i !== undefined) sor.push(i);
      }
    }
    this.soretSpecies = Int32Array.from(sor);
  }

  // ---- properties -------------------------------------------------------------------------------

  /**
   * Properties at point j from the state xs (allocation-free). mode FULL: thermo, kinetics and
   * transport; NO_KINETICS: the production rates are kept (the Jacobian adds their derivatives
   * analytically); COMPOSITION: temperature unchanged, so thermo and transport coefficients are kept
   * and only the mole fractions, density, c_p and the flux coefficients' density factor are updated.
   */
  private evalPointFast(xs: Float64Array, j: number, mode = FULL): void {
    const { K, n, W, invW, prob, C, Xw, sR, trOut } = this;
    const o = j * n;
    const ok = j * K;
    const T = xs[o];
    this.Tp[j] = T;
    let sumYoverW = 0;
    for (let k = 0; k < K; k++) sumYoverW += xs[o + 1 + k] * invW[k];
    const Wbar = 1 / sumYoverW;
    const rho = (prob.pressurePa * Wbar) / (R_J_per_molK * T);
    this.rho[j] = rho;
    for (let k = 0; k < K; k++) {
      const y = xs[o + 1 + k];
      const Xk = y * invW[k] * Wbar;
      this.Xp[ok + k] = Xk;
      Xw[k] = Xk;
      C[k] = rho * y * invW[k];
    }
    if (mode !== COMPOSITION) {
      speciesThermoInto(prob.mech, T, this.cpRw, this.hRTw, sR);
      for (let k = 0; k < K; k++) {
        this.cpR[ok + k] = this.cpRw[k];
        this.hRT[ok + k] = this.hRTw[k];
      }
    }
    let cp = 0;
    for (let k = 0; k < K; k++) cp += this.cpR[ok + k] * invW[k] * xs[o + 1 + k];
    this.cpMass[j] = cp * R_J_per_molK;
    if (mode === FULL) {
      prob.kinetics.netProductionRates(T, C, this.wdotw);
      for (let k = 0; k < K; k++) this.wdot[ok + k] = this.wdotw[k];
    }
    if (mode !== COMPOSITION) {
      // transport from non-negative mole fractions
      for (let k = 0; k < K; k++) if (Xw[k] < 0) Xw[k] = 0;
      prob.transport.evaluate(T, prob.pressurePa, Xw, trOut);
      this.lambda[j] = trOut.conductivity_W_per_mK;
      const D = trOut.Dkm_m2_per_s;
      for (let k = 0; k < K; k++) this.Dk[ok + k] = D[k];
      const kT = trOut.thermalDiffusionRatio;
      for (let i = 0; i < this.soretSpecies.length; i++) {
        const k = this.soretSpecies[i];
        this.kT[ok + k] = kT[k];
      }
    }
    const f = rho * sumYoverW; // ρ / W̄
    for (let k = 0; k < K; k++) this.coef[ok + k] = f * W[k] * this.Dk[ok + k];
    for (let i = 0; i < this.soretSpecies.length; i++) {
      const k = this.soretSpecies[i];
      this.coefT[ok + k] = (this.coef[ok + k] * this.kT[ok + k]) / T;
    }
  }

  private savePoint(j: number): void {
    const K = this.K;
    const ok = j * K;
    for (let k = 0; k < K; k++) {
      this.sXp[ok + k] = this.Xp[ok + k];
      this.sCpR[ok + k] = this.cpR[ok + k];
      this.sHRT[ok + k] = this.hRT[ok + k];
      this.sWdot[ok + k] = this.wdot[ok + k];
      this.sCoef[ok + k] = this.coef[ok + k];
      this.sCoefT[ok + k] = this.coefT[ok + k];
      this.sDk[ok + k] = this.Dk[ok + k];
      this.sKT[ok + k] = this.kT[ok + k];
    }
    this.sScal[4 * j] = this.rho[j];
    this.sScal[4 * j + 1] = this.cpMass[j];
    this.sScal[4 * j + 2] = this.lambda[j];
    this.sScal[4 * j + 3] = this.Tp[j];
  }
  /** Restores what evalPointFast(…, mode) changed at point j from the saved copy. */
  private restorePoint(j: number, mode: number): void {
    const K = this.K;
    const ok = j * K;
    for (let k = 0; k < K; k++) {
      this.Xp[ok + k] = this.sXp[ok + k];
      this.coef[ok + k] = this.sCoef[ok + k];
    }
    for (let i = 0; i < this.soretSpecies.length; i++) {
      const k = ok + this.soretSpecies[i];
      this.coefT[k] = this.sCoefT[k];
    }
    if (mode !== COMPOSITION) {
      for (let k = 0; k < K; k++) {
        this.cpR[ok + k] = this.sCpR[ok + k];
        this.hRT[ok + k] = this.sHRT[ok + k];
        this.Dk[ok + k] = this.sDk[ok + k];
      }
      for (let i = 0; i < this.soretSpecies.length; i++) {
        const k = ok + this.soretSpecies[i];
        this.kT[k] = this.sKT[k];
      }
      this.lambda[j] = this.sScal[4 * j + 2];
      this.Tp[j] = this.sScal[4 * j + 3];
    }
    if (mode === FULL) for (let k = 0; k < K; k++) this.wdot[ok + k] = this.sWdot[ok + k];
    this.rho[j] = this.sScal[4 * j];
    this.cpMass[j] = this.sScal[4 * j + 1];
  }

  /** Diffusive mass fluxes at the midpoint m + 1/2 (between points m and m+1), corrected to sum to zero. */
  private evalFlux(xs: Float64Array, m: number): void {
    const { K, n } = this;
    const o0 = m * K;
    const o1 = (m + 1) * K;
    const of = m * K;
    const dz = this.z[m + 1] - this.z[m];
    const T0 = xs[m * n];
    const T1 = xs[(m + 1) * n];
    const dTdz = (T1 - T0) / dz;
    let sum = 0;
    for (let k = 0; k < K; k++) {
      const c = 0.5 * (this.coef[o0 + k] + this.coef[o1 + k]);
      let jk = (-c * (this.Xp[o1 + k] - this.Xp[o0 + k])) / dz;
      const cT = this.coefT[o0 + k] + this.coefT[o1 + k];
      if (cT !== 0) jk -= 0.5 * cT * dTdz;
      this.flux[of + k] = jk;
      sum += jk;
    }
    const y0 = m * n + 1;
    const y1 = (m + 1) * n + 1;
    for (let k = 0; k < K; k++) this.flux[of + k] -= 0.5 * (xs[y0 + k] + xs[y1 + k]) * sum;
  }

  /** Residual rows of point j into out (at j·n), from the current per-point properties and fluxes. */
  private residualAt(xs: Float64Array, j: number, out: Float64Array): void {
    const { K, n, N, z } = this;
    const o = j * n;
    const prob = this.prob;
    const iM = K + 1;
    // eigenvalue row
    if (j === this.jFix) out[o + iM] = xs[o] - this.tFix;
    else if (j < this.jFix) out[o + iM] = xs[o + iM] - xs[o + n + iM];
    else out[o + iM] = xs[o + iM] - xs[o - n + iM];
    if (j === 0) {
      out[o] = xs[o] - prob.unburntTemperatureK;
      const mdot = xs[o + iM];
      for (let k = 0; k < K; k++) out[o + 1 + k] = mdot * (xs[o + 1 + k] - prob.inletY[k]) + this.flux[k];
      return;
    }
    if (j === N - 1) {
      out[o] = xs[o] - xs[o - n];
      for (let k = 0; k < K; k++) out[o + 1 + k] = xs[o + 1 + k] - xs[o - n + 1 + k];
      return;
    }
    const mdot = xs[o + iM];
    const dzm = z[j] - z[j - 1];
    const dzp = z[j + 1] - z[j];
    const dzc = 0.5 * (z[j + 1] - z[j - 1]);
    const fm = (j - 1) * K;
    const fp = j * K;
    const ok = j * K;
    const rho = this.rho[j];
    const rdt = this.rdt;
    const xo = this.xOld;
    let sumFluxCp = 0;
    let heat = 0;
    const RT = R_J_per_molK * xs[o];
    for (let k = 0; k < K; k++) {
      const y = xs[o + 1 + k];
      const wk = this.wdot[ok + k];
      let r = (mdot * (y - xs[o - n + 1 + k])) / dzc + (this.flux[fp + k] - this.flux[fm + k]) / dzc - wk * this.W[k];
      if (rdt !== 0) r += rho * (y - xo[o + 1 + k]) * rdt;
      out[o + 1 + k] = r;
      sumFluxCp += 0.5 * (this.flux[fp + k] + this.flux[fm + k]) * this.cpR[ok + k] * this.invW[k];
      heat += this.hRT[ok + k] * wk;
    }
    const T = xs[o];
    const Tm = xs[o - n];
    const Tp = xs[o + n];
    const lm = 0.5 * (this.lambda[j - 1] + this.lambda[j]);
    const lp = 0.5 * (this.lambda[j] + this.lambda[j + 1]);
    const dTc = (Tp - Tm) / (2 * dzc);
    let rT =
      (mdot * this.cpMass[j] * (T - Tm)) / dzc -
      ((lp * (Tp - T)) / dzp - (lm * (T - Tm)) / dzm) / dzc +
      sumFluxCp * R_J_per_molK * dTc +
      heat * RT;
    if (rdt !== 0) rT += rho * this.cpMass[j] * (T - xo[o]) * rdt;
    out[o] = rT;
  }

  /** Full residual of state xs into out. */
  residual(xs: Float64Array, out: Float64Array): void {
    const t0 = performance.now();
    const N = this.N;
    for (let j = 0; j < N; j++) this.evalPointFast(xs, j);
    for (let m = 0; m < N - 1; m++) this.evalFlux(xs, m);
    for (let j = 0; j < N; j++) this.residualAt(xs, j, out);
    this.stats.residualEvaluations++;
    this.stats.residualSeconds += (performance.now() - t0) / 1000;
  }

  /**
   * Jacobian by finite differences with column colouring: for each unknown v and each colour c,
   * every third point (j ≡ c mod 3) is perturbed at once; only those points' properties are
   * re-evaluated and only the residual rows next to them reassembled. Then factorised.
   * The state must be x with F = residual(x) freshly computed (properties current).
   */
  private evalJacobian(): boolean {
    const t0 = performance.now();
    const { N, n, K, x, F, F1, jac } = this;
    const nn = n * n;
    for (let j = 0; j < N; j++) this.savePoint(j);
    this.sFlux.set(this.flux);
    jac.clear();
    // Column by column, point by point: a perturbation of point p changes only the residuals of
    // p − 1, p and p + 1 (through p's own properties and the two fluxes beside it). All variables of
    // one point are perturbed in turn, so the temperature-only part of the transport is computed
    // twice per point (at T + δ and back at T), not once per column.
    for (let p = 0; p < N; p++) {
      const lo = p > 0 ? p - 1 : 0;
      const hi = p < N - 1 ? p + 1 : N - 1;
      for (let v = 0; v < n; v++) {
        const i = p * n + v;
        const xv = x[i];
        const d = 1e-5 * Math.abs(xv) + (v === 0 ? 1e-5 : 1.5e-8);
        x[i] = xv + d;
        const mode = this.analyticKinetics ? (v === 0 ? NO_KINETICS : COMPOSITION) : FULL;
        if (v <= K) this.evalPointFast(x, p, mode);
        if (p > 0) this.evalFlux(x, p - 1);
        if (p < N - 1) this.evalFlux(x, p);
        for (let r = lo; r <= hi; r++) {
          this.residualAt(x, r, F1);
          const ro = r * n;
          // block of row point r, column point p: diag (r = p), upper (p = r+1), lower (p = r−1)
          const band = r === p ? jac.diag : p > r ? jac.upper : jac.lower;
          const bo = r * nn + v;
          for (let e = 0; e < n; e++) band[bo + e * n] = (F1[ro + e] - F[ro + e]) / d;
        }
        x[i] = xv;
        // exact restore of the point's evaluated properties and of the two fluxes
        if (v <= K) this.restorePoint(p, mode);
        if (p > 0) for (let k = 0; k < K; k++) this.flux[(p - 1) * K + k] = this.sFlux[(p - 1) * K + k];
        if (p < N - 1) for (let k = 0; k < K; k++) this.flux[p * K + k] = this.sFlux[p * K + k];
      }
    }
    if (this.analyticKinetics) this.addKineticsJacobian();
    this.stats.jacobianEvaluations++;
    const t1 = performance.now();
    this.stats.jacobianSeconds += (t1 - t0) / 1000;
    const bad = jac.factor();
    this.stats.factorSeconds += (performance.now() - t1) / 1000;
    this.jacobianValid = bad < 0;
    this.jacobianRdt = this.rdt;
    this.jacobianAge = 0;
    return this.jacobianValid;
  }

  /**
   * Adds the production-rate terms to the diagonal blocks of the interior points from the kinetics'
   * analytic Jacobian ∂ω̇/∂C, ∂ω̇/∂T, by the chain rule through C_i = ρY_i/W_i, ρ = pW̄/(RT):
   *   ∂C_i/∂Y_j = ρ δ_ij/W_i − C_i W̄/W_j,   ∂C_i/∂T = −C_i/T.
   * Species rows carry −W_k ω̇_k, the energy row Σ_k h_k ω̇_k (its ∂h_k/∂T·ω̇_k part is already in
   * the finite differences, which kept ω̇ fixed).
   */
  private addKineticsJacobian(): void {
    const { N, n, K, x, W, invW, C, dWdC, dWdT, dwdY, jac } = this;
    const kin = this.prob.kinetics;
    const nn = n * n;
    const p = this.prob.pressurePa;
    for (let j = 1; j < N - 1; j++) {
      const o = j * n;
      const ok = j * K;
      const T = x[o];
      let sumYoverW = 0;
      for (let k = 0; k < K; k++) sumYoverW += x[o + 1 + k] * invW[k];
      const Wbar = 1 / sumYoverW;
      const rho = (p * Wbar) / (R_J_per_molK * T);
      for (let k = 0; k < K; k++) C[k] = rho * x[o + 1 + k] * invW[k];
      kin.jacobian?.(T, C, dWdC, dWdT);
      const RT = R_J_per_molK * T;
      const bo = j * nn;
      // s_k = Σ_i ∂ω̇_k/∂C_i C_i  (kept in dwdY temporarily)
      for (let k = 0; k < K; k++) {
        let s = 0;
        const r = k * K;
        for (let i = 0; i < K; i++) s += dWdC[r + i] * C[i];
        dwdY[k] = s;
      }
      // temperature column
      let eT = 0;
      for (let k = 0; k < K; k++) {
        const dw = dWdT[k] - dwdY[k] / T;
        jac.diag[bo + (1 + k) * n] -= W[k] * dw;
        eT += this.hRT[ok + k] * RT * dw;
      }
      jac.diag[bo] += eT;
      // species columns: ∂ω̇_k/∂Y_m = dWdC[k,m]·ρ/W_m − s_k W̄/W_m
      for (let m = 0; m < K; m++) {
        const a = rho * invW[m];
        const b = Wbar * invW[m];
        let e = 0;
        const col = 1 + m;
        for (let k = 0; k < K; k++) {
          const dw = dWdC[k * K + m] * a - dwdY[k] * b;
          if (dw === 0) continue;
          jac.diag[bo + (1 + k) * n + col] -= W[k] * dw;
          e += this.hRT[ok + k] * RT * dw;
        }
        jac.diag[bo + col] += e;
      }
    }
  }

  /** Error weights per component (RP: rtol·mean|x| + atol), as in common practice for DAE solvers. */
  private updateWeights(): void {
    const { N, n, K, x, ewt } = this;
    const s = this.settings;
    for (let v = 0; v < n; v++) {
      let m = 0;
      for (let j = 0; j < N; j++) m += Math.abs(x[j * n + v]);
      m /= N;
      ewt[v] = s.rtol * m + (v === 0 ? s.atolT : v <= K ? s.atolY : 1e-10);
    }
  }

  /** Weighted RMS norm of a correction. */
  private norm(dx: Float64Array): number {
    const { N, n, ewt } = this;
    let s = 0;
    for (let j = 0; j < N; j++) {
      const o = j * n;
      for (let v = 0; v < n; v++) {
        const e = dx[o + v] / ewt[v];
        s += e * e;
      }
    }
    return Math.sqrt(s / (N * n));
  }

  /** Largest λ ≤ 1 keeping T and Y within bounds along x + λ·dx. */
  private boundStep(xs: Float64Array, dx: Float64Array): number {
    const { N, n, K } = this;
    let lam = 1;
    for (let j = 0; j < N; j++) {
      const o = j * n;
      const T = xs[o];
      const dT = dx[o];
      if (T + dT < T_LOWER) lam = Math.min(lam, (T - T_LOWER) / -dT);
      if (T + dT > T_UPPER) lam = Math.min(lam, (T_UPPER - T) / dT);
      for (let k = 1; k <= K; k++) {
        const y = xs[o + k];
        const d = dx[o + k];
        // a non-negative mass fraction may go at most to Y_LOWER in one step; one already negative is not
        // bounded (it would block every step), the iteration brings it back
        if (d < 0 && y >= 0 && y + d < Y_LOWER) lam = Math.min(lam, (y - Y_LOWER) / -d);
      }
      const m = xs[o + K + 1];
      const dm = dx[o + K + 1];
      if (m + dm <= 0) lam = Math.min(lam, (0.9 * m) / -dm);
    }
    return Math.max(lam, 0);
  }

  private checkAbort(): void {
    if (this.signal?.aborted) throw new NotConvergedError("premixed-flame", "cancelled", { cancelled: true, gridPoints: this.N });
  }

  /**
   * Damped modified Newton on F(x) = 0 (steady if rdt = 0, else one backward-Euler step with x_old).
   * Returns true on convergence (weighted correction norm < 1 after a full step).
   */
  private newton(maxSteps: number): boolean {
    const { x, F, F1, dx, dx1, x1, v } = this;
    this.updateWeights();
    this.residual(x, F);
    let needJac = !this.jacobianValid || this.jacobianRdt !== this.rdt;
    // v = −J⁻¹F at x for the current Jacobian J, dx the step to take from x (v itself, or v with the
    // quasi-Newton updates); both carried over from the last accepted trial
    let haveDx = false;
    this.qnSteps = 0;
    const quasiNewton = this.rdt === 0 && this.settings.quasiNewtonSteps > 0;
    for (let it = 0; it < maxSteps; it++) {
      this.checkAbort();
      if (needJac) {
        if (!this.evalJacobian()) return false;
        needJac = false;
        haveDx = false;
        this.qnSteps = 0;
      }
      if (!haveDx) {
        for (let i = 0; i < v.length; i++) v[i] = -F[i];
        this.jac.solve(v);
        dx.set(v);
      }
      haveDx = false;
      const s0 = this.norm(v);
      if (!Number.isFinite(s0) || !Number.isFinite(this.norm(dx))) return false;
      this.stats.newtonIterations++;
      let lam = this.boundStep(x, dx);
      let accepted = false;
      let s1 = Infinity;
      if (lam > 1e-10) {
        for (let m = 0; m < MAX_DAMP_STEPS; m++) {
          for (let i = 0; i < x.length; i++) x1[i] = x[i] + lam * dx[i];
          this.residual(x1, F1);
          for (let i = 0; i < dx1.length; i++) dx1[i] = -F1[i];
          this.jac.solve(dx1);
          s1 = this.norm(dx1);
          if (Number.isFinite(s1) && (s1 < s0 || s1 < 1)) {
            accepted = true;
            break;
          }
          lam /= DAMP;
        }
      }
      if (accepted && this.rdt === 0 && this.jacobianAge === 0 && lam < LAMBDA_MIN) accepted = false;
      if (accepted) {
        const stale = this.jacobianAge > 0;
        x.set(x1);
        F.set(F1);
        this.jacobianAge++;
        // the next step: dx1 (= −J⁻¹F at the new x), improved by the quasi-Newton updates of the
        // full steps taken with this Jacobian
        const qn = quasiNewton && lam === 1;
        if (qn) this.qnLast.set(dx);
        v.set(dx1);
        dx.set(dx1);
        if (!qn || !this.quasiNewtonStep()) this.qnSteps = 0;
        this.updateWeights();
        if (this.rdt === 0 && this.earlyStop && s1 < this.earlyStop.tolerance && this.earlyStop.stop()) {
          this.stoppedEarly = true;
          return true;
        }
        if (lam === 1 && s1 < 1) {
          // converged: take the last (small) correction too
          // (the properties are not re-evaluated here: every newton() begins with the residual at x)
          for (let i = 0; i < x.length; i++) x[i] += dx[i];
          return true;
        }
        if (this.jacobianAge >= this.settings.maxJacobianAge) needJac = true;
        else if (stale && this.rdt === 0 && this.slowConvergence(lam, s0, s1)) needJac = true;
        else haveDx = true;
      } else {
        if (this.jacobianAge === 0) return false;
        // a fresh Jacobian, after the properties of x are restored (the trials overwrote them)
        this.residual(x, F);
        needJac = true;
        this.jacobianValid = false;
      }
    }
    return false;
  }

  /**
   * Quasi-Newton update of the simplified Newton correction (Deuflhard's QNERR: "good" Broyden
   * updates of the Jacobian in product form, Deuflhard, Newton Methods for Nonlinear Problems,
   * Springer 2004, sec. 2.1.4). The full step just taken (qnLast) is stored; with the stored steps Δx_0 … Δx_k taken since the Jacobian was factorised and
   * v = −J⁻¹F at the new point (in dx on entry):
   *   v ← v + (⟨Δx_{i−1}, v⟩/|Δx_{i−1}|²) Δx_i   for i = 1 … k,
   *   α = ⟨Δx_k, v⟩/|Δx_k|²,   Δx_{k+1} = v/(1 − α)   (into dx).
   * Inner products weighted by the error weights frozen at the first stored step. Returns false
   * (dx left as the plain correction) when the history is full or α ≥ ½ (the update is not
   * contracting: Deuflhard's condition), and the history is then restarted.
   */
  private quasiNewtonStep(): boolean {
    const { dx, qnS, qnW, n } = this;
    const size = dx.length;
    const k = this.qnSteps;
    if (k >= this.settings.quasiNewtonSteps) return false;
    if (k === 0) for (let c = 0; c < n; c++) qnW[c] = 1 / (this.ewt[c] * this.ewt[c]);
    qnS.set(this.qnLast, k * size);
    const nrm2 = this.qnDot(k, this.qnLast);
    this.qnNorm2[k] = nrm2;
    if (!(nrm2 > 0)) return false;
    for (let i = 1; i <= k; i++) {
      const a = this.qnDot(i - 1, dx) / this.qnNorm2[i - 1];
      const o = i * size;
      for (let e = 0; e < size; e++) dx[e] += a * qnS[o + e];
    }
    const alpha = this.qnDot(k, dx) / nrm2;
    if (!(alpha < 0.5)) {
      dx.set(this.v);
      return false;
    }
    const f = 1 / (1 - alpha);
    for (let e = 0; e < size; e++) dx[e] *= f;
    this.qnSteps = k + 1;
    return true;
  }

  private qnDot(i: number, y: Float64Array): number {
    const { qnS, qnW, n } = this;
    const size = y.length;
    const o = i * size;
    let s = 0;
    for (let j = 0; j < size; j += n) for (let c = 0; c < n; c++) s += qnS[o + j + c] * y[j + c] * qnW[c];
    return s;
  }

  /**
   * Whether a Jacobian evaluated at an earlier state converges too slowly to keep: the step needed
   * damping, or at the contraction rate θ = s1/s0 of this step the correction would need more
   * than `settings.jacobianRefreshIterations` further steps to fall below 1. A fresh Jacobian
   * (evaluation and factorisation) costs about ten steps and then converges in one or two; the rate
   * of the first steps with a kept Jacobian is pessimistic, as the quasi-Newton updates speed up
   * the later ones. The default 20 was chosen on the hydrogen sweep of the benchmark (Jacobians +
   * residuals/10 over the ten warm steps: 24.3 at 5, 23.0 at 8, 22.2 at 12, 21.5 at 20; without
   * the rule, 26.3).
   */
  private slowConvergence(lam: number, s0: number, s1: number): boolean {
    const limit = this.settings.jacobianRefreshIterations;
    if (!(limit > 0)) return false;
    if (lam < 1) return true;
    if (s1 <= 1) return false;
    if (s1 >= s0) return true;
    return Math.log(s1) / Math.log(s0 / s1) > limit;
  }

  /** Steady solve with pseudo-time stepping when Newton fails. */
  solve(onStep?: () => void): void {
    const s = this.settings;
    let dt = s.dt0;
    for (let attempt = 0; attempt <= s.maxTimeStepAttempts; attempt++) {
      this.rdt = 0;
      this.xOld.set(this.x);
      if (this.newton(60)) return;
      this.x.set(this.xOld); // a failed steady attempt may have wandered off: time-step from where it began
      if (attempt === s.maxTimeStepAttempts) break;
      // pseudo-time steps
      let done = 0;
      let fails = 0;
      while (done < s.timeSteps) {
        this.checkAbort();
        this.xOld.set(this.x);
        this.rdt = 1 / dt;
        if (this.newton(12)) {
          // the pseudo-time path only leads to the steady solution's basin: keep it physical
          clipNegativeMassFractions(this.x, this.K);
          done++;
          this.stats.timeSteps++;
          if (done % 3 === 0) dt *= 2;
          onStep?.();
        } else {
          this.x.set(this.xOld);
          dt /= 4;
          fails++;
          if (dt < 1e-9 || fails > 12) {
            this.rdt = 0;
            throw new NotConvergedError("premixed-flame", "pseudo-time stepping failed (time step too small)", {
              gridPoints: this.N,
              timeStep_s: dt,
              ...this.statsDiagnostics(),
            });
          }
        }
      }
    }
    this.rdt = 0;
    throw new NotConvergedError("premixed-flame", "Newton iteration did not converge after pseudo-time stepping", {
      gridPoints: this.N,
      ...this.statsDiagnostics(),
    });
  }

  /** The Jacobian's storage (for the next grid's solver, once this one is done with it). */
  jacobianStorage(): BlockTridiagonal {
    return this.jac;
  }

  /** The factorised steady-state Jacobian of the last Newton iterations, when there is one. */
  steadyJacobian(): BlockTridiagonal | undefined {
    return this.jacobianValid && this.jacobianRdt === 0 ? this.jac : undefined;
  }

  statsDiagnostics(): Record<string, number> {
    return { ...this.stats };
  }

  /** Steady residual norm check helper: max |F| of the energy rows (for diagnostics). */
  massFlux(): number {
    return this.x[this.K + 1];
  }
}

// ---- the refinement driver ------------------------------------------------------------------------

export interface PremixedRunOptions {
  criteria: GridCriteria;
  settings?: SolverSettings;
  /** Settings for the first grid only (e.g. a warm start allowed few pseudo-time steps). */
  firstGridSettings?: SolverSettings;
  onProgress?: (p: ProgressInfo) => void;
  signal?: AbortSignal;
  /**
   * A factorised steady-state Jacobian from a neighbouring solve on the starting grid (a warm
   * start's): the first Newton steps use it instead of evaluating and factorising a new one.
   */
  startJacobian?: BlockTridiagonal;
  /** The starting grid is a neighbour's (a warm start, as along a sweep); see solvePremixed. */
  inheritedGrid?: boolean;
}

export interface PremixedRunResult {
  solution: FlameSolution;
  /** The final grid's factorised steady-state Jacobian (for a neighbour's warm start), if valid. */
  jacobian?: BlockTridiagonal;
  stats: SolveStats;
  refinementPasses: number;
  /** Burning velocity on each grid of the refinement sequence, m/s (last = final). */
  velocityHistory: { gridPoints: number; burningVelocity_m_per_s: number }[];
}

/** Unburnt density from the inlet state, kg/m³. */
export function inletDensity(prob: PremixedProblem): number {
  const W = prob.mech.molarMass_kg_per_mol;
  let s = 0;
  for (let k = 0; k < W.length; k++) s += prob.inletY[k] / W[k];
  return prob.pressurePa / (s * R_J_per_molK * prob.unburntTemperatureK);
}

/**
 * Grid handling of a warm start (`inheritedGrid`), chosen on the benchmark's hydrogen sweep
 * (11 steps, 0–100 % H2 at φ = 0.8), counted in point-weighted residuals, Jacobians,
 * factorisations and back-substitutions: the ten warm steps cost 18 % less than with the plain
 * refinement, and their grids hold 2 698 points in all instead of 2 553.
 *
 * - The Newton iteration on the inherited grid stops as soon as its correction is below
 *   EARLY_REFINEMENT_TOLERANCE (weighted norm; 1 is converged) and the grid criteria already ask
 *   for points: that grid's solution serves only to place them, and the criteria (changes of
 *   6–12 % of a range) do not move with what is left to converge.
 * - A grid that needs points is refined ahead, to REFINE_AHEAD times the slope and curve limits,
 *   so that a sweep's next steps, whose flames are thinner, find a grid that already meets them:
 *   every second step then needs no refinement pass and no Jacobian on a new grid.
 * - The inherited grid is pruned (removablePoints in grid.ts, margin PRUNE_MARGIN of the limits)
 *   where the new flame no longer needs the neighbour's points: with the refinement it needs anyway,
 *   or alone when at least PRUNE_ALONE_FRACTION of its points can go.
 * The final grid meets the same criteria as a cold start's, and the velocity stays within the
 * discretisation error of the plain refinement (largest difference along the sweep 0.2 %).
 */
const EARLY_REFINEMENT_TOLERANCE = 100;
const REFINE_AHEAD = 0.8;
const PRUNE_MARGIN = 0.6;
const PRUNE_ALONE_FRACTION = 0.1;

/**
 * Negative mass fractions set to 0 (and the point's mass fractions renormalised), where a state is
 * only a way to the solution, never in a result:
 * - the start on a refined grid (the coarser grid's solution interpolated): a solution on a coarse
 *   grid can carry large negative values of minor species (−1e-2 of HCCOH in a methane flame at
 *   10 bar on the 17-point starting grid), from which Newton on the finer grid did not recover;
 * - after each accepted pseudo-time step: OH went to −2e-3 in the time steps of a rich (φ = 2)
 *   hydrogen flame's start, and the mass flux to zero.
 */
function clipNegativeMassFractions(x: Float64Array, K: number): void {
  const n = K + 2;
  for (let o = 0; o < x.length; o += n) {
    let clipped = false;
    let sum = 0;
    for (let k = 1; k <= K; k++) {
      if (x[o + k] < 0) {
        x[o + k] = 0;
        clipped = true;
      }
      sum += x[o + k];
    }
    if (clipped) for (let k = 1; k <= K; k++) x[o + k] /= sum;
  }
}

function nearestIndex(z: ArrayLike<number>, zf: number): number {
  let best = 0;
  for (let j = 1; j < z.length; j++) if (Math.abs(z[j] - zf) < Math.abs(z[best] - zf)) best = j;
  return best;
}

/**
 * Solves on the starting grid, then refines (slope, curve, ratio) and re-solves until the criteria
 * add no point. With `inheritedGrid` (a warm start on a neighbour's grid) the first grid's solve may
 * stop early for its refinement, grids are refined ahead and the first one is pruned (see
 * EARLY_REFINEMENT_TOLERANCE). Throws NotConvergedError (with diagnostics) if any solve fails or
 * the grid budget is exhausted before the criteria are met.
 */
export function solvePremixed(prob: PremixedProblem, start: FlameSolution, opts: PremixedRunOptions): PremixedRunResult {
  const K = prob.mech.nSpecies;
  const n = K + 2;
  let z: Float64Array = Float64Array.from(start.z);
  let x: Float64Array = Float64Array.from(start.x);
  const tFix = start.tFix;
  const zFix = start.zFix;
  const rhoU = inletDensity(prob);
  const stats: SolveStats = {
    residualEvaluations: 0,
    jacobianEvaluations: 0,
    newtonIterations: 0,
    timeSteps: 0,
    jacobianSeconds: 0,
    factorSeconds: 0,
    residualSeconds: 0,
  };
  const history: PremixedRunResult["velocityHistory"] = [];
  const criteria = opts.criteria;
  let spare: BlockTridiagonal | undefined;
  for (let pass = 0; ; pass++) {
    const jFix = nearestIndex(z, zFix);
    const settings = (pass === 0 ? opts.firstGridSettings : undefined) ?? opts.settings ?? DEFAULT_SOLVER_SETTINGS;
    const solver = new FlameGridSolver(prob, z, x, jFix, tFix, settings, pass === 0 ? opts.startJacobian : undefined, spare);
    spare = undefined;
    solver.signal = opts.signal;
    opts.onProgress?.({
      stage: pass === 0 ? "solving on the starting grid" : `refinement pass ${pass}`,
      fraction: Math.min(0.95, z.length / criteria.maxPoints),
      gridPoints: z.length,
    });
    if (opts.inheritedGrid && pass === 0) {
      const gridZ = z;
      solver.earlyStop = {
        tolerance: EARLY_REFINEMENT_TOLERANCE,
        stop: () => markIntervals(gridZ, K + 1, (c, j) => solver.x[j * n + c], criteria).some((m) => m === 1),
      };
    }
    try {
      solver.solve();
    } finally {
      for (const key of Object.keys(stats) as (keyof SolveStats)[]) stats[key] += solver.stats[key];
    }
    x = solver.x;
    // (a solve stopped early for refinement has no converged velocity of its own)
    if (!solver.stoppedEarly) history.push({ gridPoints: z.length, burningVelocity_m_per_s: x[K + 1] / rhoU });
    const values = (c: number, j: number) => x[j * n + c];
    let mark = markIntervals(z, K + 1, values, criteria);
    let remove: Uint8Array | undefined;
    if (opts.inheritedGrid) {
      let marked = 0;
      for (let j = 0; j < mark.length; j++) marked += mark[j];
      if (marked > 0) {
        mark = markIntervals(z, K + 1, values, { ...criteria, slope: REFINE_AHEAD * criteria.slope, curve: REFINE_AHEAD * criteria.curve });
      }
      if (pass === 0) {
        remove = removablePoints(z, K + 1, values, criteria, mark, [jFix], PRUNE_MARGIN);
        let removed = 0;
        for (let j = 0; j < remove.length; j++) removed += remove[j];
        // pruning alone is worth another pass only when it removes many points
        if (marked === 0 && removed < PRUNE_ALONE_FRACTION * z.length) remove = undefined;
      }
    }
    const zNew = splitIntervals(z, mark, criteria.maxPoints, remove);
    if (!zNew) {
      let any = false;
      for (let i = 0; i < mark.length; i++) if (mark[i]) any = true;
      if (any) {
        throw new NotConvergedError("premixed-flame", `grid refinement needs more than ${criteria.maxPoints} points`, {
          gridPoints: z.length,
          maxPoints: criteria.maxPoints,
          ...stats,
        });
      }
      opts.onProgress?.({ stage: "converged", fraction: 1, gridPoints: z.length });
      return {
        solution: { z, x, nSpecies: K, zFix, tFix, speciesNames: prob.mech.speciesNames },
        jacobian: solver.steadyJacobian(),
        stats,
        refinementPasses: pass,
        velocityHistory: history,
      };
    }
    // this grid's Jacobian is of no further use: its storage serves the next grid
    spare = solver.jacobianStorage();
    x = interpolateField(z, x, n, zNew);
    clipNegativeMassFractions(x, K);
    z = zNew;
  }
}
