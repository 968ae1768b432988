import { describe, expect, it } from "vitest";
import { solveEquilibriumTP } from "../../../lib/combustion/equilibrium";
import { createKinetics } from "../../../lib/flame/kinetics";
import { loadMechanism } from "../../../lib/flame/mechanism";
import { g_J_per_mol } from "../../../lib/thermo/nasa7";
import { SPECIES } from "../../../lib/thermo/species-data";
import { atmospherePa, R_J_per_molK, standardPressurePa } from "../../../lib/units/constants";
import { mechanismEquilibrium } from "./mech-equilibrium";
import { flameZoneMoleFractions } from "../../support/flame-mixture";

const mech = loadMechanism();
const kin = createKinetics(mech);
const nS = mech.nSpecies,
  nR = mech.reactions.length;
const idx = (n: string) => mech.speciesIndex.get(n) as number;
const CAL = 4.184; // thermochemical calorie, J (the calorie of CHEMKIN files)
/**
 * ΔfH°(298.15 K) of OH in GRI-Mech 3.0's record (39.347 kJ/mol, a6 = 3615.08056 in its low range) less
 * the NASA Glenn value in Stoke's species data (37.278206 kJ/mol; McBride, Zehe & Gordon 2002, record
 * "OH" after Ruscic et al. 2002): 248.80404 K × R. The mechanism keeps its own published thermo.
 */
const OH_HF_MECH_MINUS_GLENN_J = 248.80404 * R_J_per_molK;

/** Dry air by volume (common practice, no source: rounded standard composition). */
const AIR: Record<string, number> = { O2: 0.2095, N2: 0.7809, Ar: 0.0093, CO2: 0.0003 };

/** Element amounts of CH4 + air at equivalence ratio phi (per mole of CH4). */
function methaneAir(phi: number): Record<string, number> {
  const air = 2 / phi / AIR.O2;
  return { C: 1 + air * AIR.CO2, H: 4, O: air * (2 * AIR.O2 + 2 * AIR.CO2), N: air * 2 * AIR.N2, Ar: air * AIR.Ar };
}

/** Equilibrium of the mechanism's species on its own thermo at (T, p), started from Stoke's equilibrium solver. */
function equilibriumState(phi: number, T: number, p: number): { C: Float64Array; X: Float64Array; stoke: Record<string, number> } {
  const el = methaneAir(phi);
  const x = solveEquilibriumTP({ elementMoles: el, pressurePa: p, temperatureK: T }).moleFractions;
  const start = { CO2: x.CO2, H2O: x.H2O, O2: x.O2, N2: x.N2, AR: x.Ar, CO: x.CO, H2: x.H2, OH: x.OH };
  const eq = mechanismEquilibrium(mech, T, p, el, start);
  return { C: eq.C, X: eq.X, stoke: x };
}

describe("GRI-Mech 3.0 kinetics", () => {
  it.each([
    [1.0, 2200, 101325],
    [0.8, 1600, 2e6],
    [1.3, 1900, 50000],
  ])("detailed balance: at equilibrium (φ %s, %s K, %s Pa) every reversible reaction's net rate vanishes", (phi, T, p) => {
    const { C } = equilibriumState(phi, T, p);
    const f = new Float64Array(nR),
      r = new Float64Array(nR),
      q = new Float64Array(nR);
    kin.ratesOfProgress(T, C, f, r, q);
    let worst = 0;
    for (let i = 0; i < nR; i++) {
      if (!mech.reactions[i].reversible || f[i] === 0) continue;
      worst = Math.max(worst, Math.abs(q[i]) / f[i]);
    }
    // exact in exact arithmetic; the bound is round-off of exp/log over ~60 orders of magnitude of rates
    expect(worst).toBeLessThan(1e-8);
    // the irreversible reactions keep running: the forward rate of R135 CH2 + O2 => OH + H + CO is not zero
    expect(f[134]).toBeGreaterThan(0);
  });

  it.each([1500, 2000, 2500])(
    "K_c at %s K agrees with NASA Glenn thermo within 0.5 per cent once the 1 atm standard state is applied",
    (T) => {
      // Independent thermo: NASA Glenn (McBride, Zehe & Gordon, NASA/TP-2002-211556) at 1 bar, as in
      // lib/thermo/species-data.ts. CHEMKIN (Kee, Rupley, Miller, SAND89-8009, 1989) forms
      // K_c = K_p (P_atm/RT)^Δν with P_atm = 1 atm, so for Δν = −1 the mechanism's K_c is the Glenn value
      // × (1 bar/1 atm) = 0.98692 × (thermo differences of the two data sets, ≤ 0.3 % here) × the
      // factor of OH's formation enthalpy, exp(−ν_OH Δ/RT) with Δ = OH_HF_MECH_MINUS_GLENN_J.
      const Kc = new Float64Array(nR);
      kin.equilibriumConstants(T, Kc);
      const cases: [number, Record<string, number>][] = [
        [0, { O: -2, O2: 1 }], // 2 O + M <=> O2 + M
        [1, { O: -1, H: -1, OH: 1 }], // O + H + M <=> OH + M
        [37, { H: -1, O2: -1, O: 1, OH: 1 }], // H + O2 <=> O + OH
      ];
      for (const [i, nu] of cases) {
        let dG = 0,
          dn = 0;
        for (const [k, v] of Object.entries(nu)) {
          dG += v * g_J_per_mol(SPECIES[k], T);
          dn += v;
        }
        const glennKc = Math.exp(-dG / (R_J_per_molK * T)) * (standardPressurePa / (R_J_per_molK * T)) ** dn;
        const ohFactor = Math.exp((-(nu.OH ?? 0) * OH_HF_MECH_MINUS_GLENN_J) / (R_J_per_molK * T));
        const expected = glennKc * (standardPressurePa / atmospherePa) ** -dn * ohFactor; // 1-atm convention
        expect(Math.abs(Kc[i] / expected - 1)).toBeLessThan(0.005);
      }
    },
  );

  it("the mechanism's equilibrium (its own thermo) agrees with Stoke's equilibrium solver: CO2, H2O, N2, CO, H2 within 1 %, OH by the two data sets' ΔfH° of OH", () => {
    // Two thermo data sets (GRI-Mech 3.0's and NASA Glenn's) describe the same species: their equilibria
    // differ by their data differences only. The one that matters is OH's formation enthalpy (see
    // OH_HF_MECH_MINUS_GLENN_J): the mechanism's OH is lower by the factor exp(−Δ/RT) (−10.7 % at 2200 K),
    // which frees oxygen and raises O2 and NO by about 1.4 % and 1.1 % (2 % allowed).
    const T = 2200;
    const { X, stoke } = equilibriumState(1.0, T, 101325);
    for (const k of ["CO2", "H2O", "N2", "CO", "H2"]) expect(Math.abs(X[idx(k)] / stoke[k] - 1), k).toBeLessThan(0.01);
    const ohRatio = Math.exp(-OH_HF_MECH_MINUS_GLENN_J / (R_J_per_molK * T));
    expect(Math.abs(X[idx("OH")] / stoke.OH / ohRatio - 1), "OH").toBeLessThan(0.01);
    for (const k of ["O2", "NO"]) expect(Math.abs(X[idx(k)] / stoke[k] - 1), k).toBeLessThan(0.02);
  });

  it("H + O2 <=> O + OH: forward rate constant from the GRI-Mech 3.0 reaction list", () => {
    // GRI-Mech 3.0 (Smith et al. 1999), reaction 38: A = 2.65e16 cm3/(mol s), b = −0.6707, Ea = 17041 cal/mol.
    const T = 1500;
    const kf = new Float64Array(nR),
      kr = new Float64Array(nR);
    kin.rateConstants(T, new Float64Array(nS), kf, kr);
    const expected_cm3 = 2.65e16 * T ** -0.6707 * Math.exp((-17041 * CAL) / (R_J_per_molK * T));
    expect(kf[37] / (expected_cm3 * 1e-6)).toBeCloseTo(1, 12);
  });

  it("O + H2 <=> H + OH and OH + H2 <=> H + H2O: forward rate constants from the GRI-Mech 3.0 list", () => {
    // GRI-Mech 3.0 reaction 3: A = 3.87e4 cm3/(mol s), b = 2.7, Ea = 6260 cal/mol;
    // reaction 84 OH + H2 <=> H + H2O: A = 2.16e8, b = 1.51, Ea = 3430 cal/mol.
    const T = 1200;
    const kf = new Float64Array(nR),
      kr = new Float64Array(nR);
    kin.rateConstants(T, new Float64Array(nS), kf, kr);
    expect(mech.reactions[2].equation).toBe("O + H2 <=> H + OH");
    expect(kf[2] / (3.87e4 * 1e-6 * T ** 2.7 * Math.exp((-6260 * CAL) / (R_J_per_molK * T)))).toBeCloseTo(1, 12);
    expect(mech.reactions[83].equation).toBe("OH + H2 <=> H + H2O");
    expect(kf[83] / (2.16e8 * 1e-6 * T ** 1.51 * Math.exp((-3430 * CAL) / (R_J_per_molK * T)))).toBeCloseTo(1, 12);
  });

  it("H + CH3 (+M) <=> CH4 (+M): Troe fall-off constant evaluated by hand", () => {
    // GRI-Mech 3.0 reaction 52: k_inf: A = 1.39e16 cm3/(mol s), b = −0.534, Ea = 536 cal/mol;
    // k_0: A = 2.62e33 cm6/(mol2 s), b = −4.76, Ea = 2440 cal/mol; Troe a = 0.783, T3 = 74, T1 = 2941, T2 = 6964;
    // efficiencies H2 2, H2O 6, CH4 3, CO 1.5, CO2 2, C2H6 3, AR 0.7.
    // Troe form: R. G. Gilbert, K. Luther, J. Troe, Ber. Bunsenges. Phys. Chem. 87 (1983) 169, as written
    // in the CHEMKIN-II manual (Kee, Rupley, Miller, SAND89-8009, 1989).
    const T = 1800,
      p = 101325;
    const C = new Float64Array(nS);
    const ctot = p / (R_J_per_molK * T);
    C[idx("N2")] = 0.7 * ctot;
    C[idx("H2O")] = 0.2 * ctot;
    C[idx("AR")] = 0.1 * ctot;
    const M_cm3 = (0.7 + 6 * 0.2 + 0.7 * 0.1) * ctot * 1e-6; // mol/cm3
    const RT_cal = (R_J_per_molK / CAL) * T;
    const kinf = 1.39e16 * T ** -0.534 * Math.exp(-536 / RT_cal);
    const k0 = 2.62e33 * T ** -4.76 * Math.exp(-2440 / RT_cal);
    const Pr = (k0 * M_cm3) / kinf;
    const Fcent = (1 - 0.783) * Math.exp(-T / 74) + 0.783 * Math.exp(-T / 2941) + Math.exp(-6964 / T);
    const c = -0.4 - 0.67 * Math.log10(Fcent);
    const n = 0.75 - 1.27 * Math.log10(Fcent);
    const f1 = (Math.log10(Pr) + c) / (n - 0.14 * (Math.log10(Pr) + c));
    const F = 10 ** (Math.log10(Fcent) / (1 + f1 * f1));
    const k_cm3 = kinf * (Pr / (1 + Pr)) * F;
    const kf = new Float64Array(nR),
      kr = new Float64Array(nR);
    kin.rateConstants(T, C, kf, kr);
    expect(mech.reactions[51].equation).toBe("H + CH3 (+M) <=> CH4 (+M)");
    expect(kf[51] / (k_cm3 * 1e-6)).toBeCloseTo(1, 10);
    // at 1 atm and 1800 K this reaction is well inside its fall-off region
    expect(Pr).toBeGreaterThan(0.01);
    expect(Pr).toBeLessThan(100);
  });

  it("O + CO (+M) <=> CO2 (+M): Lindemann fall-off constant evaluated by hand", () => {
    // GRI-Mech 3.0 reaction 12: k_inf A = 1.8e10 cm3/(mol s), b = 0, Ea = 2385 cal/mol; k_0 A = 6.02e14 cm6/(mol2 s),
    // b = 0, Ea = 3000 cal/mol; no Troe parameters (Lindemann, F = 1); efficiency of N2 = 1.
    const T = 1500,
      p = 5e5;
    const C = new Float64Array(nS);
    C[idx("N2")] = p / (R_J_per_molK * T);
    const RT_cal = (R_J_per_molK / CAL) * T;
    const kinf = 1.8e10 * Math.exp(-2385 / RT_cal);
    const Pr = (6.02e14 * Math.exp(-3000 / RT_cal) * C[idx("N2")] * 1e-6) / kinf;
    const kf = new Float64Array(nR),
      kr = new Float64Array(nR);
    kin.rateConstants(T, C, kf, kr);
    expect(kf[11] / (kinf * (Pr / (1 + Pr)) * 1e-6)).toBeCloseTo(1, 10);
  });

  it("duplicate reactions add: HO2 production from OH + H2O2 alone is (k88 + k89)[OH][H2O2]", () => {
    // GRI-Mech 3.0 reactions 88 and 89, both OH + H2O2 <=> HO2 + H2O (DUPLICATE):
    // A = 2.0e12 cm3/(mol s), b = 0, Ea = 427 cal/mol and A = 1.7e18, b = 0, Ea = 29410 cal/mol.
    // With only OH, H2O2 and N2 present the only other source of HO2 is 2 OH → H + HO2 (the reverse of
    // reaction 46), about 1e-7 of the total here: 1e-6 allowed.
    const T = 1500;
    const C = new Float64Array(nS);
    C[idx("OH")] = 1e-3;
    C[idx("H2O2")] = 2e-3;
    C[idx("N2")] = 8;
    const w = new Float64Array(nS);
    kin.netProductionRates(T, C, w);
    const RT_cal = (R_J_per_molK / CAL) * T;
    const k_cm3 = 2.0e12 * Math.exp(-427 / RT_cal) + 1.7e18 * Math.exp(-29410 / RT_cal);
    expect(Math.abs(w[idx("HO2")] / (k_cm3 * 1e-6 * 1e-3 * 2e-3) - 1)).toBeLessThan(1e-6);
  });

  it("a negative concentration reverses a species' self-reaction instead of feeding it (C·|C| for a squared concentration)", () => {
    // HO2 + HO2 <=> O2 + H2O2 (GRI-Mech 3.0 reactions 115 and 116, DUPLICATE): with HO2 alone (and N2),
    // the forward rate k[HO2]² would destroy HO2 at a negative concentration too and drive it further
    // below zero (a Newton or time step can leave a minor species slightly negative); as k[HO2]|[HO2]|
    // it runs backwards and restores it. At a positive concentration both are the law of mass action:
    // production −2(k115 + k116)[HO2]² (A = 1.3e11 and 4.2e14 cm3/(mol s), Ea = −1630 and 12000 cal/mol).
    // At 700 K the other path open to HO2 alone, HO2 + M → H + O2 + M, adds about 4e-7 of this (1e-4 allowed).
    const T = 700;
    const RT_cal = (R_J_per_molK / CAL) * T;
    const k_m3 = (1.3e11 * Math.exp(1630 / RT_cal) + 4.2e14 * Math.exp(-12000 / RT_cal)) * 1e-6;
    const w = new Float64Array(nS);
    const C = new Float64Array(nS);
    C[idx("N2")] = 8;
    C[idx("HO2")] = 1e-4;
    kin.netProductionRates(T, C, w);
    expect(Math.abs(w[idx("HO2")] / (-2 * k_m3 * 1e-8) - 1)).toBeLessThan(1e-4);
    C[idx("HO2")] = -1e-4;
    kin.netProductionRates(T, C, w);
    expect(Math.abs(w[idx("HO2")] / (2 * k_m3 * 1e-8) - 1)).toBeLessThan(1e-4);
    // and the derivative stays consistent: ∂ω̇_HO2/∂[HO2] = −4k|[HO2]|
    const J = new Float64Array(nS * nS),
      dT = new Float64Array(nS);
    kin.jacobian(T, C, J, dT);
    expect(Math.abs(J[idx("HO2") * nS + idx("HO2")] / (-4 * k_m3 * 1e-4) - 1)).toBeLessThan(1e-4);
  });

  it("ω̇ conserves every element (Σ_k a_ek ω̇_k = 0) in a reacting methane-air mixture", () => {
    const C = reactingState();
    const w = new Float64Array(nS);
    kin.netProductionRates(1500, C, w);
    for (let e = 0; e < mech.elementNames.length; e++) {
      let sum = 0,
        scale = 0;
      for (let k = 0; k < nS; k++) {
        const a = mech.elementMatrix[e * nS + k];
        sum += a * w[k];
        scale += Math.abs(a * w[k]);
      }
      if (scale > 0) expect(Math.abs(sum) / scale).toBeLessThan(1e-12);
    }
  });

  it("analytic ∂ω̇/∂C and ∂ω̇/∂T agree with central finite differences of ω̇ (consistency of the derivative code)", () => {
    const T = 1500;
    const C = reactingState();
    const J = new Float64Array(nS * nS),
      dT = new Float64Array(nS);
    kin.jacobian(T, C, J, dT);
    const wp = new Float64Array(nS),
      wm = new Float64Array(nS);
    const Cp = new Float64Array(nS),
      Cm = new Float64Array(nS);
    // round-off floor of a difference quotient: relative precision of ω̇_k (set by its gross production
    // and destruction rates, which cancel) divided by the step
    const f = new Float64Array(nR),
      r = new Float64Array(nR),
      q = new Float64Array(nR);
    kin.ratesOfProgress(T, C, f, r, q);
    const gross = new Float64Array(nS);
    mech.reactions.forEach((rx, i) => {
      for (const [list, coeffs] of [
        [rx.reactantIndex, rx.reactantCoeff],
        [rx.productIndex, rx.productCoeff],
      ] as const) {
        list.forEach((k, m) => {
          gross[k] += coeffs[m] * (f[i] + r[i]);
        });
      }
    });
    let worst = 0;
    for (let j = 0; j < nS; j++) {
      Cp.set(C);
      Cm.set(C);
      const h = 1e-6 * Math.abs(C[j]);
      Cp[j] += h;
      Cm[j] -= h;
      kin.netProductionRates(T, Cp, wp);
      kin.netProductionRates(T, Cm, wm);
      for (let k = 0; k < nS; k++) {
        const fd = (wp[k] - wm[k]) / (2 * h);
        const a = J[k * nS + j];
        // allowed: 1e-5 relative, plus ~50 machine epsilons of the gross rate over the step
        const allowed = 1e-5 * Math.max(Math.abs(fd), Math.abs(a)) + (1e-14 * gross[k]) / h;
        if (allowed > 0) worst = Math.max(worst, Math.abs(fd - a) / allowed);
      }
    }
    expect(worst).toBeLessThan(1);
    // ∂ω̇/∂T against a central difference
    const wT1 = new Float64Array(nS),
      wT2 = new Float64Array(nS);
    kin.netProductionRates(T + 0.01, C, wT1);
    kin.netProductionRates(T - 0.01, C, wT2);
    let worstT = 0;
    for (let k = 0; k < nS; k++) {
      const fd = (wT1[k] - wT2[k]) / 0.02;
      const allowed = 1e-6 * Math.max(Math.abs(fd), Math.abs(dT[k])) + (1e-14 * gross[k]) / 0.01;
      if (allowed > 0) worstT = Math.max(worstT, Math.abs(fd - dT[k]) / allowed);
    }
    expect(worstT).toBeLessThan(1);
  });
});

/** A partly burnt methane-air mixture with every species present (radicals at ppm levels). */
function reactingState(): Float64Array {
  const T = 1500,
    p = 101325;
  const ctot = p / (R_J_per_molK * T);
  const X = flameZoneMoleFractions(mech, { CH3: 0.0005, HO2: 0.0002 });
  return X.map((x) => x * ctot);
}
