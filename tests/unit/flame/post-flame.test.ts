import { describe, expect, it } from "vitest";
import { solveEquilibriumTP } from "../../../lib/combustion/equilibrium";
import { InputError, NotConvergedError } from "../../../lib/errors";
import { createKinetics } from "../../../lib/flame/kinetics";
import { loadMechanism } from "../../../lib/flame/mechanism";
import { integratePostFlame, noReport } from "../../../lib/flame/post-flame";
import { moleToMass } from "../../../lib/flame/thermo";
import { R_J_per_molK } from "../../../lib/units/constants";
import { mechanismEquilibrium } from "./mech-equilibrium";

const mech = loadMechanism();
const kin = createKinetics(mech);
const n = mech.nSpecies;
const idx = (s: string) => mech.speciesIndex.get(s) as number;
const iN = mech.elementNames.indexOf("N");

/** Dry air by volume (common practice, no source: rounded standard composition). */
const AIR: Record<string, number> = { O2: 0.2095, N2: 0.7809, Ar: 0.0093, CO2: 0.0003 };
function methaneAir(phi: number): Record<string, number> {
  const air = 2 / phi / AIR.O2;
  return { C: 1 + air * AIR.CO2, H: 4, O: air * (2 * AIR.O2 + 2 * AIR.CO2), N: air * 2 * AIR.N2, Ar: air * AIR.Ar };
}
function elementsOf(X: Float64Array): Record<string, number> {
  const out: Record<string, number> = {};
  mech.elementNames.forEach((e, ei) => {
    let s = 0;
    for (let k = 0; k < n; k++) s += mech.elementMatrix[ei * n + k] * X[k];
    out[e] = s;
  });
  return out;
}
function startFrom(X: Float64Array): Record<string, number> {
  return {
    CO2: X[idx("CO2")],
    H2O: X[idx("H2O")],
    O2: X[idx("O2")],
    N2: X[idx("N2")],
    AR: X[idx("AR")],
    CO: X[idx("CO")],
    H2: X[idx("H2")],
    OH: X[idx("OH")],
  };
}

/**
 * Burnt lean methane-air gas (φ = 0.9) in equilibrium at T on the mechanism's thermo, with every
 * nitrogen species except N2 removed: the classic start of a thermal-NO calculation (O, OH, H, O2, N2
 * at equilibrium, no NO yet).
 */
function nitrogenFreeBurntGas(T: number, p: number): Float64Array {
  return burntGas(T, p).X0;
}
function burntGas(T: number, p: number): { X0: Float64Array; equilibriumNO: number } {
  const el = methaneAir(0.9);
  const st = solveEquilibriumTP({ elementMoles: el, pressurePa: p, temperatureK: T }).moleFractions;
  const eq = mechanismEquilibrium(mech, T, p, el, {
    CO2: st.CO2,
    H2O: st.H2O,
    O2: st.O2,
    N2: st.N2,
    AR: st.Ar,
    CO: st.CO,
    H2: st.H2,
    OH: st.OH,
  });
  const X = eq.X.slice();
  for (let k = 0; k < n; k++) if (mech.elementMatrix[iN * n + k] > 0 && k !== idx("N2")) X[k] = 0;
  const s = X.reduce((a, b) => a + b, 0);
  return { X0: X.map((x) => x / s), equilibriumNO: eq.X[idx("NO")] };
}
function massFractions(X: Float64Array): Float64Array {
  const Y = new Float64Array(n);
  moleToMass(mech, X, Y);
  return Y;
}

describe("post-flame NO (plug flow with the full mechanism)", () => {
  it.each([2200, 2400])(
    "initial NO formation rate at %s K, 1 atm (NO below 5 per cent of equilibrium) matches the Zeldovich rate 2 k1 [O]eq [N2]eq within 25 per cent",
    (T) => {
      const p = 101325;
      const { X0, equilibriumNO } = burntGas(T, p);
      const r = integratePostFlame(mech, kin, {
        temperatureK: T,
        pressurePa: p,
        massFractions: massFractions(X0),
        residenceMs: 0.5,
        energy: "isothermal",
        sampleTimesMs: [0.1, 0.5],
      });
      const ctot = p / (R_J_per_molK * T);
      const [a, b] = r.samples;
      const rate = ((b.moleFractions[idx("NO")] - a.moleFractions[idx("NO")]) * ctot) / 0.4e-3; // mol/(m³ s)
      // S. R. Turns, An Introduction to Combustion, 2nd ed. (McGraw-Hill 2000), ch. 5, thermal (Zeldovich)
      // mechanism (value from memory of that chapter): k1f = 1.8e14 exp(−38 370/T) cm³/(mol s) for
      // O + N2 → NO + N, and d[NO]/dt = 2 k1f [O]eq [N2]eq while NO is far below equilibrium.
      const k1f = 1.8e14 * Math.exp(-38370 / T) * 1e-6; // m³/(mol s)
      const zeldovich = 2 * k1f * X0[idx("O")] * ctot * X0[idx("N2")] * ctot;
      // 25 %: GRI-Mech 3.0's N + NO rate constant (its reaction 178, 2.7e13 cm³/(mol s)) is about 30 % below
      // the value behind Turns' k1f (k1r = 3.8e13), the N2O route adds a few per cent.
      expect(Math.abs(rate / zeldovich - 1)).toBeLessThan(0.25);
      // NO is still far below equilibrium over this interval (the premise of the initial-rate formula)
      expect(b.moleFractions[idx("NO")]).toBeLessThan(0.05 * equilibriumNO);
    },
  );

  it("NO approaches its equilibrium value at constant T and p for a long residence (2400 K, 3 s)", () => {
    const T = 2400,
      p = 101325;
    const X0 = nitrogenFreeBurntGas(T, p);
    const r = integratePostFlame(mech, kin, {
      temperatureK: T,
      pressurePa: p,
      massFractions: massFractions(X0),
      residenceMs: 3000,
      energy: "isothermal",
    });
    // equilibrium of the same element amounts at the same T, p (mechanism thermo)
    const eq = mechanismEquilibrium(mech, T, p, elementsOf(X0), startFrom(X0));
    expect(r.moleFractions[idx("NO")] / eq.X[idx("NO")]).toBeCloseTo(1, 2);
    expect(r.moleFractions[idx("NO2")] / eq.X[idx("NO2")]).toBeCloseTo(1, 2);
    expect(r.moleFractions[idx("O2")] / eq.X[idx("O2")]).toBeCloseTo(1, 3);
  });

  it("adiabatic run started at equilibrium stays there: T within 0.05 K, NO within 0.1 %", () => {
    const T = 2100,
      p = 101325;
    const el = methaneAir(0.95);
    const st = solveEquilibriumTP({ elementMoles: el, pressurePa: p, temperatureK: T }).moleFractions;
    const eq = mechanismEquilibrium(mech, T, p, el, {
      CO2: st.CO2,
      H2O: st.H2O,
      O2: st.O2,
      N2: st.N2,
      AR: st.Ar,
      CO: st.CO,
      H2: st.H2,
      OH: st.OH,
    });
    const r = integratePostFlame(mech, kin, { temperatureK: T, pressurePa: p, massFractions: massFractions(eq.X), residenceMs: 50 });
    expect(Math.abs(r.temperatureK - T)).toBeLessThan(0.05);
    expect(r.moleFractions[idx("NO")] / eq.X[idx("NO")]).toBeCloseTo(1, 3);
    expect(r.enthalpyDrift).toBeLessThan(1e-6);
  });

  it("reports dry ppm and NOx as NO2 at 3 % O2: 100 ppm NO dry at 3 % O2 dry is 205.3 mg/m³", () => {
    // Wet gas with 15 % H2O; dry-basis NO 100 ppm and O2 3 %.
    const T = 1500,
      p = 101325;
    const X = new Float64Array(n);
    const dry = 0.85;
    X[idx("H2O")] = 0.15;
    X[idx("NO")] = 100e-6 * dry;
    X[idx("O2")] = 0.03 * dry;
    X[idx("CO2")] = 0.09 * dry;
    X[idx("N2")] = dry - X[idx("NO")] - X[idx("O2")] - X[idx("CO2")];
    const r = integratePostFlame(mech, kin, { temperatureK: T, pressurePa: p, massFractions: massFractions(X), residenceMs: 0 });
    const rep = noReport(r);
    expect(rep.ppm_dry).toBeCloseTo(100, 8);
    expect(rep.O2_percent_dry).toBeCloseTo(3, 8);
    // 100 ppm × 46.0055 g/mol / 22.414 L/mol = 205.25 mg/m³ (0 °C, 101.325 kPa); at 3 % O2 the
    // correction (21 − 3)/(21 − 3) is 1 (Directive 2010/75/EU, Annex VI Part 2).
    expect(rep.mg_per_m3_dry_at_ref_O2).toBeCloseTo(205.25, 1);
    expect(rep.label).toMatch(/screening indicator/i);
    // at 6 % O2 reference: × 15/18
    const r6 = integratePostFlame(mech, kin, {
      temperatureK: T,
      pressurePa: p,
      massFractions: massFractions(X),
      residenceMs: 0,
      referenceO2Percent: 6,
    });
    expect(noReport(r6).mg_per_m3_dry_at_ref_O2).toBeCloseTo((205.25 * 15) / 18, 1);
  });

  it("a negative residence time is refused naming postFlameResidenceMs", () => {
    const X = new Float64Array(n);
    X[idx("N2")] = 1;
    expect(() =>
      integratePostFlame(mech, kin, { temperatureK: 1500, pressurePa: 101325, massFractions: massFractions(X), residenceMs: -1 }),
    ).toThrow(InputError);
    try {
      integratePostFlame(mech, kin, { temperatureK: 1500, pressurePa: 101325, massFractions: massFractions(X), residenceMs: -1 });
    } catch (e) {
      expect((e as InputError).field).toBe("postFlameResidenceMs");
    }
  });

  it("a cancelled run stops with a not-converged error marked cancelled, never a number", () => {
    const X0 = nitrogenFreeBurntGas(2200, 101325);
    const ac = new AbortController();
    ac.abort();
    let err: unknown;
    try {
      integratePostFlame(mech, kin, {
        temperatureK: 2200,
        pressurePa: 101325,
        massFractions: massFractions(X0),
        residenceMs: 20,
        signal: ac.signal,
      });
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(NotConvergedError);
    expect((err as NotConvergedError).diagnostics.cancelled).toBe(true);
  });
});
