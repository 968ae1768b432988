/**
 * Starting estimates of the equilibrium iteration: the cold start (complete-combustion products, a
 * temperature from their enthalpy balance, O2/CO/H2 seeded near φ = 1, trace species from fitted
 * element potentials) and the warm start from a previous solution.
 */
import { InputError } from "../../errors";
import { evalInto } from "../../thermo/nasa7";
import { R_J_per_molK } from "../../units/constants";
import { MATRIX_STRIDE, solveDense } from "./linear";
import * as settings from "./settings";
import type { EquilibriumResult } from "./types";
import type { Workspace } from "./workspace";

// Settings as module-level constants (plain locals in the hot loops, not live import bindings).
const { E_AR, E_C, E_H, E_N, E_O, E_S, LN_FLOOR, SEED_NEAR_STOICH, T_GUESS_MAX, T_GUESS_MIN, T_SEED_MIN, TRACE_START } = settings;

function fail(field: string, msg: string): never {
  throw new InputError(field, msg);
}

/**
 * Cold start, first part: the products of complete combustion (CO2, H2O, SO2, N2, Ar, excess O2; on
 * the rich side the oxygen beyond CO shared between CO2 and H2O in proportion to C and H/2), with
 * every other species at a trace amount. Returns ln(total moles).
 */
export function coldGuess(ws: Workspace): number {
  const nS = ws.nS;
  const actSp = ws.actSp;
  const sn = ws.scratchN;
  const b = ws.b0All;
  sn.fill(0);
  const C = b[E_C],
    Hh = b[E_H],
    O = b[E_O],
    N = b[E_N],
    S = b[E_S],
    Ar = b[E_AR];
  const majorsAvailable =
    (C === 0 || (ws.iCO2 >= 0 && ws.iCO >= 0)) &&
    (Hh === 0 || (ws.iH2O >= 0 && ws.iH2 >= 0)) &&
    (O === 0 || ws.iO2 >= 0) &&
    (N === 0 || ws.iN2 >= 0) &&
    (S === 0 || ws.iSO2 >= 0) &&
    (Ar === 0 || ws.iAr >= 0);
  let total = 0;
  const Oleft = O - 2 * S;
  if (majorsAvailable && Oleft >= 0 && (C === 0 || Oleft > C)) {
    if (S > 0) sn[ws.iSO2] = S;
    if (Oleft >= 2 * C + Hh / 2) {
      if (C > 0) sn[ws.iCO2] = C;
      if (Hh > 0) sn[ws.iH2O] = Hh / 2;
      if (O > 0) sn[ws.iO2] = (Oleft - 2 * C - Hh / 2) / 2;
    } else {
      const f = (Oleft - C) / (C + Hh / 2);
      if (C > 0) {
        sn[ws.iCO2] = f * C;
        sn[ws.iCO] = (1 - f) * C;
      }
      if (Hh > 0) {
        sn[ws.iH2O] = (f * Hh) / 2;
        sn[ws.iH2] = ((1 - f) * Hh) / 2;
      }
    }
    if (N > 0) sn[ws.iN2] = N / 2;
    if (Ar > 0) sn[ws.iAr] = Ar;
    for (let k = 0; k < nS; k++) total += sn[actSp[k]];
  }
  if (!(total > 0)) {
    // generic start (as in RP-1311): equal amounts of every species
    let atoms = 0;
    for (let ie = 0; ie < ws.nE; ie++) atoms += ws.b0[ie];
    total = atoms;
    for (let k = 0; k < nS; k++) sn[actSp[k]] = atoms / nS;
  }
  const trace = TRACE_START * total;
  let sum = 0;
  for (let k = 0; k < nS; k++) {
    const v = sn[actSp[k]];
    // any positive complete-combustion amount counts, however small (the carrier of a trace element)
    const major = v > 0;
    ws.isMajorGuess[k] = major ? 1 : 0;
    const nk = major ? v : Math.min(trace, 1e-3 * ws.elementLimit(k));
    ws.n[k] = nk;
    ws.lnn[k] = Math.log(nk);
    sum += nk;
  }
  return Math.log(sum);
}

/**
 * Near φ = 1 the complete-combustion majors (CO2, H2O) leave the oxygen potential undetermined; in a
 * hot mixture a little O2, CO and H2 fix it and save several damped steps. Returns ln(total moles).
 */
export function seedNearStoichiometric(ws: Workspace, T: number, lnNtot: number): number {
  if (T < T_SEED_MIN) return lnNtot;
  const b = ws.b0All;
  const C = b[E_C],
    Hh = b[E_H];
  const ref = C + Hh / 2;
  const kO2 = ws.iO2 >= 0 ? ws.kOf[ws.iO2] : -1;
  const kCO = ws.iCO >= 0 ? ws.kOf[ws.iCO] : -1;
  const kH2 = ws.iH2 >= 0 ? ws.kOf[ws.iH2] : -1;
  if (!(ref > 0) || kO2 < 0 || (C > 0 && kCO < 0) || (Hh > 0 && kH2 < 0)) return lnNtot;
  const n = ws.n;
  const seed = SEED_NEAR_STOICH * ref;
  const free = (C > 0 ? n[kCO] : 0) + (Hh > 0 ? n[kH2] : 0);
  if (n[kO2] >= seed || free >= seed) return lnNtot;
  const set = (k: number, v: number) => {
    if (n[k] < v) {
      n[k] = v;
      ws.lnn[k] = Math.log(v);
      ws.isMajorGuess[k] = 1;
    }
  };
  set(kO2, seed);
  if (C > 0) set(kCO, (seed * C) / ref);
  if (Hh > 0) set(kH2, (seed * Hh) / 2 / ref);
  let sum = 0;
  for (let k = 0; k < ws.nS; k++) sum += n[k];
  return Math.log(sum);
}

/** Temperature at which the estimated majors have the enthalpy H0 (1-D Newton), capped at T_GUESS_MAX. */
export function temperatureGuess(ws: Workspace, H0_J: number): number {
  const nS = ws.nS;
  const h0R = H0_J / R_J_per_molK;
  let T = 2000;
  for (let it = 0; it < 30; it++) {
    evalInto(ws.data, T, ws.cpR, ws.hRT, ws.sR);
    let h = 0; // Σ n h / R, K·mol
    let cp = 0; // Σ n cp / R, mol
    for (let k = 0; k < nS; k++) {
      if (!ws.isMajorGuess[k]) continue;
      const j = ws.actSp[k];
      h += ws.n[k] * ws.hRT[j] * T;
      cp += ws.n[k] * ws.cpR[j];
    }
    const dT = (h0R - h) / cp;
    let Tn = T + dT;
    if (!(Tn > T_GUESS_MIN)) Tn = T_GUESS_MIN;
    if (Tn > T_GUESS_MAX) Tn = T_GUESS_MAX;
    const done = Math.abs(Tn - T) < 1 || (Tn === T_GUESS_MAX && T === T_GUESS_MAX) || (Tn === T_GUESS_MIN && T === T_GUESS_MIN);
    T = Tn;
    if (done) break;
  }
  return T;
}

/**
 * Cold start, last part: element potentials fitted (least squares weighted by amount) to the
 * chemical potentials of the estimated composition at temperature T, and every other species set to the
 * amount those potentials give it, ln(n_k/n) = −μ°_k/RT + Σ_i a_ik π_i, capped at 5 %.
 * Returns ln(total moles). Leaves the estimate unchanged if the fit is singular.
 */
export function traceEstimate(ws: Workspace, T: number, lnP: number, lnNtot: number): number {
  const S = MATRIX_STRIDE;
  const nS = ws.nS;
  const nE = ws.nE;
  const ns = ws.ns;
  const a = ws.a;
  const M = ws.M;
  const r = ws.rhs;
  const x = ws.x;
  evalInto(ws.data, T, ws.cpR, ws.hRT, ws.sR);
  for (let i = 0; i < nE; i++) {
    r[i] = 0;
    for (let c = 0; c < nE; c++) M[i * S + c] = 0;
  }
  const N = Math.exp(lnNtot);
  for (let k = 0; k < nS; k++) {
    // trace species enter with their tiny weights: they only settle directions the majors leave open
    const j = ws.actSp[k];
    const w = ws.n[k] / N;
    const muk = ws.hRT[j] - ws.sR[j] + lnP - ws.lnPstd[j] + ws.lnn[k] - lnNtot;
    for (let i = 0; i < nE; i++) {
      const aik = a[i * ns + k];
      if (aik === 0) continue;
      const t = w * aik;
      for (let i2 = 0; i2 < nE; i2++) M[i * S + i2] += t * a[i2 * ns + k];
      r[i] += t * muk;
    }
  }
  if (!solveDense(M, r, x, nE, S)) return lnNtot;
  const lnCap = Math.log(0.05);
  let sum = 0;
  for (let k = 0; k < nS; k++) {
    if (!ws.isMajorGuess[k]) {
      const j = ws.actSp[k];
      let lnx = -(ws.hRT[j] - ws.sR[j] + lnP - ws.lnPstd[j]);
      for (let i = 0; i < nE; i++) lnx += a[i * ns + k] * x[i];
      if (lnx > lnCap) lnx = lnCap;
      // never more of an element in one estimated species than the charge holds
      const lnLimit = Math.log(ws.elementLimit(k)) - lnNtot;
      if (lnx > lnLimit) lnx = lnLimit;
      const lnLo = Math.min(-LN_FLOOR, ws.lnFloorAbs - lnNtot) + 1;
      if (lnx < lnLo) lnx = lnLo;
      ws.lnn[k] = lnNtot + lnx;
      ws.n[k] = Math.exp(ws.lnn[k]);
    }
    sum += ws.n[k];
  }
  return Math.log(sum);
}

/** Warm start from a previous result (species matched by key). Returns ln(total moles) or NaN. */
export function warmStart(ws: Workspace, w: EquilibriumResult): number {
  const nS = ws.nS;
  const map = ws.warmMap;
  const wsp = w.species;
  const wm = w.moles;
  if (!wsp || !wm || wsp.length !== wm.length) fail("warmStart", "must be a result of this solver (species and moles)");
  let total = 0;
  for (let k = 0; k < nS; k++) {
    const key = ws.activeKeys[k];
    let idx = -1;
    if (k < wsp.length && wsp[k] === key) idx = k;
    else {
      for (let i = 0; i < wsp.length; i++) {
        if (wsp[i] === key) {
          idx = i;
          break;
        }
      }
    }
    map[k] = idx;
    const v = idx >= 0 ? wm[idx] : 0;
    if (v > 0 && Number.isFinite(v)) total += v;
  }
  if (!(total > 0)) return NaN;
  total /= ws.scale;
  const floor = TRACE_START * total;
  const n = ws.n;
  for (let k = 0; k < nS; k++) {
    const idx = map[k];
    const v = idx >= 0 ? wm[idx] : 0;
    n[k] = v > 0 && Number.isFinite(v) ? v / ws.scale : floor; // floor: absent from the previous solution
  }
  // The charge may differ from the previous one: scale each species by the ratio new/old of the
  // amount of its scarcest element, so that trace elements start near their new amounts.
  const x = ws.x;
  for (let i = 0; i < ws.nE; i++) x[i] = 0;
  for (let q = 0; q < ws.nEnt; q++) x[ws.entI[q]] += ws.entA[q] * n[ws.entK[q]];
  let sum = 0;
  for (let k = 0; k < nS; k++) {
    let iMin = -1;
    for (let i = 0; i < ws.nE; i++) {
      if (ws.a[i * ws.ns + k] > 0 && (iMin < 0 || ws.b0[i] < ws.b0[iMin])) iMin = i;
    }
    if (iMin >= 0 && x[iMin] > 0) n[k] *= ws.b0[iMin] / x[iMin];
    ws.lnn[k] = Math.log(n[k]);
    sum += n[k];
  }
  return Math.log(sum);
}
