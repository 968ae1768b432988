/**
 * Gas-phase kinetics of a mechanism (CHEMKIN conventions, SI units): rate constants, equilibrium
 * constants, rates of progress, net molar production rates and their Jacobian.
 *
 * Rate forms (R. J. Kee, F. M. Rupley, J. A. Miller, "CHEMKIN-II", Sandia report SAND89-8009 (1989);
 * the conventions GRI-Mech 3.0 is written for):
 * - modified Arrhenius  k = A T^b exp(−Ea/(R T));
 * - three-body  q = [M] (k_f Π C^ν' − k_r Π C^ν''), [M] = Σ_j ε_j C_j (collision efficiencies ε,
 *   default 1);
 * - fall-off  k_f = k_∞ (P_r/(1+P_r)) F, P_r = k_0 [M]/k_∞; Lindemann F = 1; Troe
 *   log10 F = log10 F_cent / (1 + ((log10 P_r + c)/(n − 0.14 (log10 P_r + c)))²),
 *   c = −0.4 − 0.67 log10 F_cent, n = 0.75 − 1.27 log10 F_cent,
 *   F_cent = (1−a) exp(−T/T3) + a exp(−T/T1) + exp(−T2/T) (last term only when T2 is given);
 * - duplicate reactions are simply separate reactions whose rates add;
 * - non-standard forward `orders` replace the reactant exponents of the forward rate (the reverse
 *   rate keeps the product stoichiometry);
 * - reverse rate constant of a reversible reaction k_r = k_f / K_c, with
 *   K_c = K_p (P_atm/(R T))^Δν,  K_p = exp(−Σ_k ν_k g°_k/(R T)),  Δν = Σ_k ν_k (products minus
 *   reactants), g° from the mechanism's NASA-7 data at its standard-state pressure, which for CHEMKIN
 *   data is P_atm = 1 atm = 101325 Pa exactly (`mech.standardPressurePa`). Irreversible reactions
 *   (`=>`) have no reverse rate.
 *
 * Jacobian, analytic: ∂ω̇/∂C (including the dependence of [M] on every collider, and of the fall-off
 * factor — Lindemann and Troe — on P_r) and ∂ω̇/∂T at constant C (Arrhenius, van 't Hoff for 1/K_c,
 * and the temperature dependence of P_r and F_cent in the fall-off factor).
 *
 * All evaluations are allocation-free: work arrays are made once in createKinetics. Temperature-
 * dependent quantities are cached for the last temperature used.
 */
import { R_J_per_molK } from "../units/constants";
import type { Mechanism } from "./mechanism";
import { speciesThermoInto } from "./thermo";

export interface Kinetics {
  readonly mech: Mechanism;
  readonly nReactions: number;
  /** net molar production rates ω̇_k [mol/(m³·s)] at T [K] and concentrations C [mol/m³] */
  netProductionRates(T: number, C: Float64Array, out: Float64Array): void;
  /** ∂ω̇/∂C (dense nSpecies×nSpecies, row-major: [k * nSpecies + j] = ∂ω̇_k/∂C_j, 1/s) and ∂ω̇/∂T (mol/(m³·s·K)) */
  jacobian(T: number, C: Float64Array, dWdC: Float64Array, dWdT: Float64Array): void;
  /** Forward and reverse rates of progress and their difference, mol/(m³·s), per reaction. */
  ratesOfProgress(T: number, C: Float64Array, forward: Float64Array, reverse: Float64Array, net: Float64Array): void;
  /**
   * Effective forward and reverse rate constants at T and C (fall-off: k_∞ (P_r/(1+P_r)) F; three-body:
   * without the [M] factor), SI units; reverse is 0 for irreversible reactions.
   */
  rateConstants(T: number, C: Float64Array, kf: Float64Array, kr: Float64Array): void;
  /** Equilibrium constants in concentration units K_c, (mol/m³)^Δν, per reaction. */
  equilibriumConstants(T: number, out: Float64Array): void;
}

const LN10 = Math.LN10;
/** Floor for P_r in log10 (P_r = 0 when [M] = 0): the fall-off factor tends to its low-pressure limit smoothly. */
const PR_FLOOR = 1e-300;

/**
 * C^o for the orders in use: C, C·|C| and C³ for orders 1, 2, 3, a power of max(C, 0) otherwise. The
 * same as C^o for C ≥ 0; a Newton or time step can leave a minor species slightly negative, and
 * C·|C| keeps the sign there, so a self-reaction (2 HO2 → H2O2 + O2) runs backwards and restores the
 * species instead of destroying it further (C² drove HO2 in lean hydrogen flames and HCCOH at 10 bar to
 * −1e-2 and the solve to failure).
 */
function powOrder(c: number, o: number): number {
  if (o === 1) return c;
  if (o === 2) return c * Math.abs(c);
  if (o === 3) return c * c * c;
  return c > 0 ? c ** o : 0;
}
/** d(C^o)/dC consistent with powOrder. */
function dPowOrder(c: number, o: number): number {
  if (o === 1) return 1;
  if (o === 2) return 2 * Math.abs(c);
  if (o === 3) return 3 * c * c;
  return c > 0 ? o * c ** (o - 1) : 0;
}

export function createKinetics(mech: Mechanism): Kinetics {
  const nS = mech.nSpecies;
  const rx = mech.reactions;
  const nR = rx.length;

  // ---- flattened reaction data ----
  const A = new Float64Array(nR),
    B = new Float64Array(nR),
    EaR = new Float64Array(nR);
  const A0 = new Float64Array(nR),
    B0 = new Float64Array(nR),
    Ea0R = new Float64Array(nR);
  const kind = new Uint8Array(nR); // 0 elementary, 1 three-body, 2 fall-off
  const reversible = new Uint8Array(nR);
  const troeKind = new Uint8Array(nR); // 0 Lindemann, 1 Troe without T2, 2 Troe with T2
  const troeA = new Float64Array(nR),
    troeT3 = new Float64Array(nR),
    troeT1 = new Float64Array(nR),
    troeT2 = new Float64Array(nR);
  const dNu = new Float64Array(nR);
  const fOff = new Int32Array(nR + 1),
    rOff = new Int32Array(nR + 1),
    sOff = new Int32Array(nR + 1),
    eOff = new Int32Array(nR + 1);
  let nf = 0,
    nr = 0,
    ns = 0,
    ne = 0;
  for (const r of rx) {
    nf += r.forwardOrderIndex.length;
    nr += r.productIndex.length;
    ns += r.reactantIndex.length + r.productIndex.length;
    if (r.efficiencies) for (let k = 0; k < nS; k++) if (r.efficiencies[k] !== 1) ne++;
  }
  // forward-rate factors (species, order), reverse-rate factors (species, product coefficient)
  const fIdx = new Int32Array(nf),
    fOrd = new Float64Array(nf);
  const rIdx = new Int32Array(nr),
    rOrd = new Float64Array(nr);
  // net stoichiometry (species, ν'' − ν'), one entry per appearance
  const sIdx = new Int32Array(ns),
    sNu = new Float64Array(ns);
  // third-body efficiencies as default × C_total + Σ (ε_j − default) C_j; the default is 1 for GRI but kept general
  const effDefault = new Float64Array(nR);
  const eIdx = new Int32Array(ne),
    eVal = new Float64Array(ne);
  const effFull = new Float64Array(nR * nS); // ε_j for every species (Jacobian)
  nf = nr = ns = ne = 0;
  for (let i = 0; i < nR; i++) {
    const r = rx[i];
    A[i] = r.rate.A;
    B[i] = r.rate.b;
    EaR[i] = r.rate.Ea_J_per_mol / R_J_per_molK;
    kind[i] = r.type === "elementary" ? 0 : r.type === "three-body" ? 1 : 2;
    reversible[i] = r.reversible ? 1 : 0;
    if (r.lowRate) {
      A0[i] = r.lowRate.A;
      B0[i] = r.lowRate.b;
      Ea0R[i] = r.lowRate.Ea_J_per_mol / R_J_per_molK;
    }
    if (r.troe) {
      troeKind[i] = r.troe[3] === null ? 1 : 2;
      troeA[i] = r.troe[0];
      troeT3[i] = r.troe[1];
      troeT1[i] = r.troe[2];
      troeT2[i] = r.troe[3] ?? 0;
    }
    fOff[i] = nf;
    for (let j = 0; j < r.forwardOrderIndex.length; j++) {
      fIdx[nf] = r.forwardOrderIndex[j];
      fOrd[nf] = r.forwardOrder[j];
      nf++;
    }
    rOff[i] = nr;
    for (let j = 0; j < r.productIndex.length; j++) {
      rIdx[nr] = r.productIndex[j];
      rOrd[nr] = r.productCoeff[j];
      nr++;
    }
    sOff[i] = ns;
    let dn = 0;
    for (let j = 0; j < r.reactantIndex.length; j++) {
      sIdx[ns] = r.reactantIndex[j];
      sNu[ns] = -r.reactantCoeff[j];
      dn -= r.reactantCoeff[j];
      ns++;
    }
    for (let j = 0; j < r.productIndex.length; j++) {
      sIdx[ns] = r.productIndex[j];
      sNu[ns] = r.productCoeff[j];
      dn += r.productCoeff[j];
      ns++;
    }
    dNu[i] = dn;
    eOff[i] = ne;
    if (r.efficiencies) {
      effDefault[i] = 1;
      for (let k = 0; k < nS; k++) {
        effFull[i * nS + k] = r.efficiencies[k];
        if (r.efficiencies[k] !== 1) {
          eIdx[ne] = k;
          eVal[ne] = r.efficiencies[k] - 1;
          ne++;
        }
      }
    }
  }
  fOff[nR] = nf;
  rOff[nR] = nr;
  sOff[nR] = ns;
  eOff[nR] = ne;

  // ---- work arrays ----
  const cpR = new Float64Array(nS),
    hRT = new Float64Array(nS),
    sR = new Float64Array(nS),
    gRT = new Float64Array(nS);
  const kInf = new Float64Array(nR); // k_f (elementary, three-body) or k_∞ (fall-off) at T
  const k0 = new Float64Array(nR);
  const invKc = new Float64Array(nR); // 1/K_c (0 for irreversible reactions)
  const fcent = new Float64Array(nR);
  // temperature derivatives at constant concentrations (for the Jacobian's ∂ω̇/∂T)
  const dlnkInf = new Float64Array(nR),
    dlnk0 = new Float64Array(nR),
    dfcent = new Float64Array(nR),
    dlnInvKc = new Float64Array(nR);
  const dlnkf = new Float64Array(nR); // d ln k_f,eff/dT at constant C
  const kfEff = new Float64Array(nR); // effective k_f at (T, C)
  const dkfdM = new Float64Array(nR); // ∂k_f,eff/∂[M] (fall-off)
  const conc3 = new Float64Array(nR); // [M] (three-body, fall-off)
  const qf = new Float64Array(nR),
    qr = new Float64Array(nR);
  const w0 = new Float64Array(nS);
  let lastT = Number.NaN;
  const stdConc = (T: number) => mech.standardPressurePa / (R_J_per_molK * T);

  function setTemperature(T: number): void {
    if (T === lastT) return;
    if (!(T > 0) || !Number.isFinite(T)) throw new Error(`kinetics: temperature must be a positive finite number, got ${T}`);
    lastT = T;
    const lnT = Math.log(T),
      invT = 1 / T;
    speciesThermoInto(mech, T, cpR, hRT, sR);
    for (let k = 0; k < nS; k++) gRT[k] = hRT[k] - sR[k];
    const lnC0 = Math.log(stdConc(T));
    for (let i = 0; i < nR; i++) {
      const bi = B[i],
        ei = EaR[i];
      kInf[i] = bi === 0 && ei === 0 ? A[i] : A[i] * Math.exp(bi * lnT - ei * invT);
      dlnkInf[i] = (bi + ei * invT) * invT;
      if (kind[i] === 2) {
        k0[i] = A0[i] * Math.exp(B0[i] * lnT - Ea0R[i] * invT);
        dlnk0[i] = (B0[i] + Ea0R[i] * invT) * invT;
        const tk = troeKind[i];
        if (tk > 0) {
          const a = troeA[i];
          const e3 = Math.exp(-T / troeT3[i]),
            e1 = Math.exp(-T / troeT1[i]);
          let fc = (1 - a) * e3 + a * e1;
          let dfc = (-(1 - a) * e3) / troeT3[i] - (a * e1) / troeT1[i];
          if (tk === 2) {
            const e2 = Math.exp(-troeT2[i] * invT);
            fc += e2;
            dfc += troeT2[i] * invT * invT * e2;
          }
          fcent[i] = fc;
          dfcent[i] = dfc;
        }
      }
      if (reversible[i]) {
        let dG = 0,
          dH = 0;
        for (let p = sOff[i]; p < sOff[i + 1]; p++) {
          dG += sNu[p] * gRT[sIdx[p]];
          dH += sNu[p] * hRT[sIdx[p]];
        }
        // ln K_c = −ΔG°/RT + Δν ln(P_atm/RT);  d ln(1/K_c)/dT = (−ΔH°/RT + Δν)/T  (van 't Hoff)
        invKc[i] = Math.exp(dG - dNu[i] * lnC0);
        dlnInvKc[i] = (dNu[i] - dH) * invT;
      } else {
        invKc[i] = 0;
        dlnInvKc[i] = 0;
      }
    }
  }

  /** Effective forward constants, [M], and ∂k_f/∂[M] at the current T for concentrations C. */
  function setConcentrations(C: Float64Array): void {
    let Ctot = 0;
    for (let k = 0; k < nS; k++) Ctot += C[k];
    for (let i = 0; i < nR; i++) {
      const kd = kind[i];
      if (kd === 0) {
        kfEff[i] = kInf[i];
        dlnkf[i] = dlnkInf[i];
        continue;
      }
      let M = effDefault[i] * Ctot;
      for (let p = eOff[i]; p < eOff[i + 1]; p++) M += eVal[p] * C[eIdx[p]];
      conc3[i] = M;
      if (kd === 1) {
        kfEff[i] = kInf[i];
        dlnkf[i] = dlnkInf[i];
        continue;
      }
      // fall-off
      const ki = kInf[i];
      const PrRaw = (k0[i] * M) / ki;
      const Pr = Math.max(PrRaw, PR_FLOOR);
      const lind = Pr / (1 + Pr);
      // d ln P_r/dT at constant [M] (0 where P_r sits on its floor)
      const dlnPr = PrRaw > PR_FLOOR ? dlnk0[i] - dlnkInf[i] : 0;
      let F = 1,
        dlnFdx = 0,
        dlnFdT = 0;
      if (troeKind[i] > 0) {
        const fc = Math.max(fcent[i], 1e-300);
        const lfc = Math.log10(fc);
        const c = -0.4 - 0.67 * lfc;
        const n = 0.75 - 1.27 * lfc;
        const xc = Math.log10(Pr) + c;
        const den = n - 0.14 * xc;
        const f = xc / den;
        const g = 1 / (1 + f * f);
        F = 10 ** (lfc * g);
        // d ln F / d log10 P_r = ln F_cent · d g/d f · d f/d x,  dg/df = −2f g², df/dx = n/den²
        dlnFdx = lfc * LN10 * (-2 * f * g * g) * (n / (den * den));
        // d ln F/dT through F_cent (in c, n and the prefactor) and through P_r (in x)
        const dlfc = fcent[i] > 1e-300 ? dfcent[i] / (fc * LN10) : 0;
        const dxc = dlnPr / LN10 - 0.67 * dlfc;
        const dden = -1.27 * dlfc - 0.14 * dxc;
        const df = (dxc * den - xc * dden) / (den * den);
        dlnFdT = LN10 * (dlfc * g + lfc * (-2 * f * g * g) * df);
      }
      kfEff[i] = ki * lind * F;
      dlnkf[i] = dlnkInf[i] + dlnPr / (1 + Pr) + dlnFdT;
      // ∂k_f/∂[M] = k_0 · d/dP_r [P_r F/(1+P_r)] = k_0 · F · (1/(1+P_r)² + (1/(1+P_r)) d ln F/d log10 P_r / ln 10)
      dkfdM[i] = Pr > PR_FLOOR ? k0[i] * F * (1 / ((1 + Pr) * (1 + Pr)) + dlnFdx / ((1 + Pr) * LN10)) : k0[i] * F;
    }
  }

  function progress(C: Float64Array): void {
    for (let i = 0; i < nR; i++) {
      let f = kfEff[i];
      for (let p = fOff[i]; p < fOff[i + 1]; p++) f *= powOrder(C[fIdx[p]], fOrd[p]);
      let r = 0;
      if (reversible[i]) {
        r = kfEff[i] * invKc[i];
        for (let p = rOff[i]; p < rOff[i + 1]; p++) r *= powOrder(C[rIdx[p]], rOrd[p]);
      }
      if (kind[i] === 1) {
        f *= conc3[i];
        r *= conc3[i];
      }
      qf[i] = f;
      qr[i] = r;
    }
  }

  function net(T: number, C: Float64Array, out: Float64Array): void {
    setTemperature(T);
    setConcentrations(C);
    progress(C);
    out.fill(0, 0, nS);
    for (let i = 0; i < nR; i++) {
      const q = qf[i] - qr[i];
      for (let p = sOff[i]; p < sOff[i + 1]; p++) out[sIdx[p]] += sNu[p] * q;
    }
  }

  function jacobian(T: number, C: Float64Array, dWdC: Float64Array, dWdT: Float64Array): void {
    net(T, C, w0);
    // ∂ω̇/∂T at constant C: d q_f/dT = q_f d ln k_f/dT, d q_r/dT = q_r (d ln k_f/dT + d ln(1/K_c)/dT)
    dWdT.fill(0, 0, nS);
    for (let i = 0; i < nR; i++) {
      const d = qf[i] * dlnkf[i] - qr[i] * (dlnkf[i] + dlnInvKc[i]);
      if (d === 0) continue;
      for (let p = sOff[i]; p < sOff[i + 1]; p++) dWdT[sIdx[p]] += sNu[p] * d;
    }
    // analytic ∂ω̇/∂C; net() above left kfEff, conc3, dkfdM, qf, qr at (T, C)
    dWdC.fill(0, 0, nS * nS);
    for (let i = 0; i < nR; i++) {
      const kd = kind[i];
      const kf = kfEff[i];
      const kr = reversible[i] ? kf * invKc[i] : 0;
      const M = kd === 1 ? conc3[i] : 1;
      // direct dependence through the mass-action products: ∂q/∂C_j for j in the forward factors …
      for (let p = fOff[i]; p < fOff[i + 1]; p++) {
        const j = fIdx[p];
        let d = kf * M * dPowOrder(C[j], fOrd[p]);
        for (let p2 = fOff[i]; p2 < fOff[i + 1]; p2++) if (p2 !== p) d *= powOrder(C[fIdx[p2]], fOrd[p2]);
        for (let s = sOff[i]; s < sOff[i + 1]; s++) dWdC[sIdx[s] * nS + j] += sNu[s] * d;
      }
      // … and in the reverse factors
      if (kr !== 0) {
        for (let p = rOff[i]; p < rOff[i + 1]; p++) {
          const j = rIdx[p];
          let d = -kr * M * dPowOrder(C[j], rOrd[p]);
          for (let p2 = rOff[i]; p2 < rOff[i + 1]; p2++) if (p2 !== p) d *= powOrder(C[rIdx[p2]], rOrd[p2]);
          for (let s = sOff[i]; s < sOff[i + 1]; s++) dWdC[sIdx[s] * nS + j] += sNu[s] * d;
        }
      }
      if (kd === 0) continue;
      // dependence through [M]: ∂q/∂C_j += ε_j · ∂q/∂[M]
      // q = k(M) (Π_f − Π_r/K_c) with k = [M] k_f (three-body) or k_f,eff([M]) (fall-off)
      let f = 1,
        r = 0;
      for (let p = fOff[i]; p < fOff[i + 1]; p++) f *= powOrder(C[fIdx[p]], fOrd[p]);
      if (reversible[i]) {
        r = invKc[i];
        for (let p = rOff[i]; p < rOff[i + 1]; p++) r *= powOrder(C[rIdx[p]], rOrd[p]);
      }
      const dqdM = (kd === 1 ? kf : dkfdM[i]) * (f - r);
      if (dqdM === 0) continue;
      const eb = i * nS;
      for (let s = sOff[i]; s < sOff[i + 1]; s++) {
        const row = sIdx[s] * nS;
        const v = sNu[s] * dqdM;
        for (let j = 0; j < nS; j++) dWdC[row + j] += v * effFull[eb + j];
      }
    }
  }

  return {
    mech,
    nReactions: nR,
    netProductionRates: net,
    jacobian,
    ratesOfProgress(T, C, forward, reverse, netq) {
      setTemperature(T);
      setConcentrations(C);
      progress(C);
      for (let i = 0; i < nR; i++) {
        forward[i] = qf[i];
        reverse[i] = qr[i];
        netq[i] = qf[i] - qr[i];
      }
    },
    rateConstants(T, C, kf, kr) {
      setTemperature(T);
      setConcentrations(C);
      for (let i = 0; i < nR; i++) {
        kf[i] = kfEff[i];
        kr[i] = kfEff[i] * invKc[i];
      }
    },
    equilibriumConstants(T, out) {
      setTemperature(T);
      const lnC0 = Math.log(stdConc(T));
      for (let i = 0; i < nR; i++) {
        let dG = 0;
        for (let p = sOff[i]; p < sOff[i + 1]; p++) dG += sNu[p] * gRT[sIdx[p]];
        out[i] = Math.exp(-dG + dNu[i] * lnC0);
      }
    },
  };
}
