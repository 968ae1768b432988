/**
 * The Newton iteration of the reduced Gibbs equations (RP-1311 ch. 2), its control factor and
 * convergence tests (ch. 3), the polishing steps, and the verification of the final state (element and
 * enthalpy balances). Never returns an unverified number.
 */
import { InputError } from "../../errors";
import { evalInto } from "../../thermo/nasa7";
import { R_J_per_molK } from "../../units/constants";
import { MATRIX_STRIDE, solveDense } from "./linear";
import * as settings from "./settings";
import { coldGuess, seedNearStoichiometric, temperatureGuess, traceEstimate, warmStart } from "./start";
import { EquilibriumNotConvergedError, type EquilibriumProblem, type EquilibriumResult } from "./types";
import type { Workspace } from "./workspace";

function fail(field: string, msg: string): never {
  throw new InputError(field, msg);
}

// Result arrays are views into shared slabs: allocating a separate small Float64Array per result costs
// more than a whole Newton iteration.
const SLAB_LENGTH = 4096;
let slab = new ArrayBuffer(SLAB_LENGTH * 8);
let slabUsed = 0;
function allocMoles(length: number): Float64Array {
  if (slabUsed + length > SLAB_LENGTH) {
    slab = new ArrayBuffer(SLAB_LENGTH * 8);
    slabUsed = 0;
  }
  const v = new Float64Array(slab, slabUsed * 8, length);
  slabUsed += length;
  return v;
}

export function solveEquilibrium(
  ws: Workspace,
  p: Omit<EquilibriumProblem, "enthalpyJ">,
  hp: boolean,
  H0_J: number,
  Tgiven: number,
): EquilibriumResult {
  // the settings and the row stride of M as local constants for the inner loops
  const S = MATRIX_STRIDE;
  const { LIMIT_ELEMENT_BALANCE, LIMIT_ENTHALPY_BALANCE, LN_1E4, LN_FLOOR, MAX_ITERATIONS, MAX_POLISH_ITERATIONS } = settings;
  const { SIZE, T_ITER_MAX, T_ITER_MIN, TOL_ELEMENT_RP1311, TOL_FINAL_STEP, TOL_LNT, TOL_MOLES } = settings;
  ws.setup(p);
  if (!hp && (Tgiven < ws.tLow || Tgiven > ws.tHigh)) {
    fail("temperatureK", `${Tgiven} K is outside the range of the species data (${ws.tLow}–${ws.tHigh} K)`);
  }
  const nS = ws.nS;
  const nE = ws.nE;
  const n = ws.n;
  const lnn = ws.lnn;
  const mu = ws.mu;
  const dln = ws.dln;
  const Hk = ws.H;
  const cpR = ws.cpR;
  const hRT = ws.hRT;
  const sR = ws.sR;
  const b0 = ws.b0;
  const M = ws.M;
  const rhs = ws.rhs;
  const x = ws.x;
  const actSp = ws.actSp;
  const lnPstd = ws.lnPstd;
  const entI = ws.entI;
  const entK = ws.entK;
  const entA = ws.entA;
  const nEnt = ws.nEnt;
  const pairSlot = ws.pairSlot;
  const pairK = ws.pairK;
  const pairC = ws.pairC;
  const nPair = ws.nPair;
  const data = ws.data;
  const lnP = Math.log(p.pressurePa);
  const lnLimit = ws.lnLimit;
  for (let k = 0; k < nS; k++) lnLimit[k] = Math.log(ws.elementLimit(k));

  // ---- starting point
  let lnNtot = NaN;
  let T = NaN;
  const w = p.warmStart;
  if (w !== undefined) {
    lnNtot = warmStart(ws, w);
    if (hp && typeof w.temperatureK === "number" && w.temperatureK > 0 && Number.isFinite(w.temperatureK)) {
      T = w.temperatureK;
    }
  }
  const cold = !Number.isFinite(lnNtot);
  if (cold) lnNtot = coldGuess(ws);
  else for (let k = 0; k < nS; k++) ws.isMajorGuess[k] = 1;
  if (Tgiven > 0) T = Tgiven; // TP temperature, or the HP initialTemperatureK
  if (!(T > 0)) T = temperatureGuess(ws, H0_J / ws.scale);
  if (T < T_ITER_MIN) T = T_ITER_MIN;
  if (T > T_ITER_MAX) T = T_ITER_MAX;
  if (cold) {
    lnNtot = seedNearStoichiometric(ws, T, lnNtot);
    lnNtot = traceEstimate(ws, T, lnP, lnNtot);
  }
  let lnT = Math.log(T);
  const lnTmin = Math.log(T_ITER_MIN);
  const lnTmax = Math.log(T_ITER_MAX);
  const h0R = H0_J / ws.scale / R_J_per_molK; // K·mol per scaled charge

  let bmax = 0;
  for (let ie = 0; ie < nE; ie++) if (b0[ie] > bmax) bmax = b0[ie];
  // floor for ln n_j: e^-300 of the total, or lower for a trace element
  const lnFloorAbs = ws.lnFloorAbs;
  let lnFloor = Math.min(lnNtot - LN_FLOOR, lnFloorAbs);

  const m = hp ? nE + 2 : nE + 1; // size of the reduced system
  const iN = nE; // row/column of Δln n
  const iT = nE + 1; // row/column of Δln T (HP)

  let iter = 0;
  let rp1311Converged = false;
  let polish = 0;
  let lastResidual = Infinity;
  let sumN = 0;
  let thermoT = NaN;

  for (;;) {
    // ---- state at the current point: thermo once per iteration, n_j, μ_j/RT
    T = hp ? Math.exp(lnT) : Tgiven;
    if (T !== thermoT) {
      evalInto(data, T, cpR, hRT, sR);
      thermoT = T;
    }
    const Ntot = Math.exp(lnNtot);
    sumN = 0;
    for (let k = 0; k < nS; k++) {
      const j = actSp[k];
      const nk = Math.exp(lnn[k]);
      n[k] = nk;
      sumN += nk;
      const h = hRT[j];
      Hk[k] = h;
      mu[k] = h - sR[j] + lnP - lnPstd[j] + lnn[k] - lnNtot;
    }

    if (rp1311Converged) {
      // the last step passed the RP-1311 tests; stop once it was also at round-off level
      if (lastResidual <= TOL_FINAL_STEP || polish >= MAX_POLISH_ITERATIONS) break;
      polish++;
    }
    if (iter >= MAX_ITERATIONS) {
      throw new EquilibriumNotConvergedError(
        `chemical equilibrium did not converge in ${MAX_ITERATIONS} iterations (last scaled correction ${lastResidual.toExponential(3)})`,
        iter,
        lastResidual,
      );
    }
    iter++;

    // ---- reduced Gibbs iteration matrix (symmetric: upper triangle assembled, then mirrored)
    for (let r = 0; r < m; r++) {
      rhs[r] = 0;
      for (let c = r; c < m; c++) M[r * S + c] = 0;
    }
    for (let q = 0; q < nPair; q++) M[pairSlot[q]] += pairC[q] * n[pairK[q]];
    for (let q = 0; q < nEnt; q++) {
      const k = entK[q];
      const row = entI[q] * S;
      const t = entA[q] * n[k];
      M[row + iN] += t; // Σ_j a_ij n_j = b_i
      M[row + iT] += t * Hk[k];
      rhs[entI[q]] += t * mu[k];
    }
    let sNH = 0; // Σ n_j H_j
    let sNCp = 0; // Σ n_j (Cp_j + H_j²)
    let sNmu = 0; // Σ n_j μ_j
    let sNHmu = 0; // Σ n_j H_j μ_j
    for (let k = 0; k < nS; k++) {
      const nk = n[k];
      const h = Hk[k];
      const nh = nk * h;
      sNH += nh;
      sNCp += nk * (cpR[actSp[k]] + h * h);
      sNmu += nk * mu[k];
      sNHmu += nh * mu[k];
    }
    let elemRes = 0;
    for (let i = 0; i < nE; i++) {
      const res = b0[i] - M[i * S + iN];
      rhs[i] += res;
      const r = Math.abs(res) / bmax;
      if (r > elemRes) elemRes = r;
    }
    M[iN * S + iN] = sumN - Ntot;
    rhs[iN] = Ntot - sumN + sNmu;
    if (hp) {
      M[iN * S + iT] = sNH;
      M[iT * S + iT] = sNCp;
      rhs[iT] = h0R / T - sNH + sNHmu;
    }
    for (let r = 1; r < m; r++) for (let c = 0; c < r; c++) M[r * S + c] = M[c * S + r];

    if (!solveDense(M, rhs, x, m, S)) {
      throw new EquilibriumNotConvergedError(
        `the equilibrium composition cannot be resolved at ${T.toFixed(0)} K: the charge is (nearly) a single ` +
          `product species, so the amounts of the others are below what double precision can separate ` +
          `(Newton matrix singular at iteration ${iter})`,
        iter,
        lastResidual,
      );
    }
    const dlnN = x[iN];
    const dlnT = hp ? x[iT] : 0;

    // ---- species corrections Δln n_j
    for (let k = 0; k < nS; k++) dln[k] = dlnN + Hk[k] * dlnT - mu[k];
    for (let q = 0; q < nEnt; q++) dln[entK[q]] += entA[q] * x[entI[q]];

    // ---- control factor λ (RP-1311 ch. 3) and convergence measures
    let maxBig = 5 * Math.abs(dlnN);
    if (5 * Math.abs(dlnT) > maxBig) maxBig = 5 * Math.abs(dlnT);
    let lambda2 = 1;
    let convMoles = 0; // max n_j |Δln n_j| / Σ n_j
    let maxStep = 0; // max |Δln n_j| of species not parked at the floor
    for (let k = 0; k < nS; k++) {
      const d = dln[k];
      const ad = Math.abs(d);
      const lnx = lnn[k] - lnNtot;
      if (lnx > -SIZE) {
        if (ad > maxBig) maxBig = ad;
      } else if (d >= 0) {
        const den = d - dlnN;
        if (den > 0) {
          const l2 = Math.abs((-lnx - LN_1E4) / den);
          if (l2 < lambda2) lambda2 = l2;
        }
      }
      const c = (n[k] * ad) / sumN;
      if (c > convMoles) convMoles = c;
      if ((d > 0 || lnn[k] > lnFloor + 1) && ad > maxStep) maxStep = ad;
    }
    let lambda = maxBig > 2 ? 2 / maxBig : 1;
    if (lambda2 < lambda) lambda = lambda2;

    // ---- convergence tests (RP-1311 ch. 3) on this correction
    const cN = (Ntot * Math.abs(dlnN)) / sumN;
    rp1311Converged =
      lambda === 1 && convMoles <= TOL_MOLES && cN <= TOL_MOLES && Math.abs(dlnT) <= TOL_LNT && elemRes <= TOL_ELEMENT_RP1311;
    lastResidual = Math.max(maxStep, Math.abs(dlnN), Math.abs(dlnT), convMoles, cN);

    // ---- update
    lnNtot += lambda * dlnN;
    lnFloor = Math.min(lnNtot - LN_FLOOR, lnFloorAbs);
    const lnLo = lnFloor;
    for (let k = 0; k < nS; k++) {
      let v = lnn[k] + lambda * dln[k];
      if (v < lnLo) v = lnLo;
      // no species beyond what its scarcest element allows (a linearised step from far below can
      // overshoot a trace element by orders of magnitude, and coming down costs one step per e-fold)
      if (v > lnLimit[k]) v = lnLimit[k];
      lnn[k] = v;
    }
    if (hp) {
      lnT += lambda * dlnT;
      if (lnT < lnTmin) lnT = lnTmin;
      if (lnT > lnTmax) lnT = lnTmax;
    }
    if (!Number.isFinite(lnNtot) || !Number.isFinite(lnT) || !Number.isFinite(lastResidual)) {
      throw new EquilibriumNotConvergedError(`chemical equilibrium iteration diverged at iteration ${iter}`, iter, lastResidual);
    }
  }

  // ---- verification at the final state (thermo was evaluated at the final T above)
  let elemErr = 0;
  for (let i = 0; i < nE; i++) x[i] = 0;
  for (let q = 0; q < nEnt; q++) x[entI[q]] += entA[q] * n[entK[q]];
  for (let i = 0; i < nE; i++) {
    const r = Math.abs(b0[i] - x[i]) / b0[i];
    if (!(r <= elemErr)) elemErr = r;
  }
  let enthErr = 0;
  if (hp) {
    let hSum = 0; // Σ n h / R
    let hAbs = 0;
    for (let k = 0; k < nS; k++) {
      const hk = Hk[k] * T;
      hSum += n[k] * hk;
      hAbs += n[k] * Math.abs(hk);
    }
    enthErr = Math.abs(hSum - h0R) / Math.max(hAbs, T * sumN);
  }
  if (!(elemErr <= LIMIT_ELEMENT_BALANCE) || !(enthErr <= LIMIT_ENTHALPY_BALANCE)) {
    throw new EquilibriumNotConvergedError(
      `chemical equilibrium failed verification after ${iter} iterations: element balance error ` +
        `${elemErr.toExponential(3)} (limit ${LIMIT_ELEMENT_BALANCE}), enthalpy balance error ` +
        `${enthErr.toExponential(3)} (limit ${LIMIT_ENTHALPY_BALANCE})`,
      iter,
      Math.max(elemErr, enthErr),
    );
  }
  if (T < ws.tLow || T > ws.tHigh) {
    throw new EquilibriumNotConvergedError(
      `equilibrium temperature ${T.toFixed(1)} K lies outside the range of the species data (${ws.tLow}–${ws.tHigh} K)`,
      iter,
      0,
    );
  }

  // ---- result (the only allocations of a solve)
  const keys = ws.activeKeys;
  const scale = ws.scale;
  const moles = allocMoles(nS);
  const moleFractions: Record<string, number> = { ...ws.fractionsTemplate };
  for (let k = 0; k < nS; k++) {
    moles[k] = n[k] * scale;
    moleFractions[keys[k]] = n[k] / sumN;
  }
  return {
    temperatureK: T,
    pressurePa: p.pressurePa,
    species: keys,
    moles,
    moleFractions,
    totalMoles: sumN * scale,
    iterations: iter,
    elementBalanceRelError: elemErr,
    enthalpyBalanceRelError: enthErr,
  };
}
