import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  createEquilibriumSolver,
  DEFAULT_PRODUCT_SPECIES,
  EquilibriumInfeasibleError,
  EquilibriumNotConvergedError,
  solveEquilibriumHP,
  solveEquilibriumTP,
  type EquilibriumProblem,
  type EquilibriumResult,
} from "../../lib/combustion/equilibrium";
import { cp_J_per_molK, ELEMENTS, g_J_per_mol, h_J_per_mol, type Element } from "../../lib/thermo/nasa7";
import { SPECIES } from "../../lib/thermo/species-data";
import { InfeasibleChargeError, NotConvergedError } from "../../lib/errors";
import { atmospherePa, R_J_per_molK, standardPressurePa } from "../../lib/units/constants";

// ---- test helpers -------------------------------------------------------------------------------

type Mix = Record<string, number>;

/** Textbook air: 1 O2 + 3.76 N2 (Turns, An Introduction to Combustion, ch. 2 convention). */
const TEXTBOOK_AIR: Mix = { O2: 1 / 4.76, N2: 3.76 / 4.76 };
/** Dry air with argon and CO2 (rounded standard composition; common practice, no source). */
const DRY_AIR: Mix = { O2: 0.2095, N2: 0.7809, Ar: 0.0093, CO2: 0.0003 };
const OXYGEN: Mix = { O2: 1 };

function elementsOf(mix: Mix): Record<Element, number> {
  const out = { C: 0, H: 0, O: 0, N: 0, S: 0, Ar: 0 } as Record<Element, number>;
  for (const [key, x] of Object.entries(mix)) {
    for (const [el, c] of Object.entries(SPECIES[key].elements)) out[el as Element] += x * (c ?? 0);
  }
  return out;
}

/**
 * Reactant charge of 1 mol of fuel with oxidiser at equivalence ratio φ (oxygen demand for CO2, H2O,
 * SO2 and N2 as products), each stream at its own temperature; enthalpy from the NASA polynomials.
 */
function charge(fuel: Mix, phi: number, oxidizer: Mix, fuelTemperatureK = 298.15, oxidizerTemperatureK = 298.15) {
  const f = elementsOf(fuel);
  const ox = elementsOf(oxidizer);
  const o2Demand = f.C + f.H / 4 + f.S - f.O / 2;
  const oxidizerMoles = o2Demand / phi / (ox.O / 2 - ox.C - ox.H / 4 - ox.S);
  const elementMoles: Partial<Record<Element, number>> = {};
  for (const el of ELEMENTS) {
    const v = f[el] + oxidizerMoles * ox[el];
    if (v > 0) elementMoles[el] = v;
  }
  let enthalpyJ = 0;
  for (const [key, x] of Object.entries(fuel)) enthalpyJ += x * h_J_per_mol(SPECIES[key], fuelTemperatureK);
  for (const [key, x] of Object.entries(oxidizer)) {
    enthalpyJ += oxidizerMoles * x * h_J_per_mol(SPECIES[key], oxidizerTemperatureK);
  }
  return { elementMoles, enthalpyJ };
}

function hp(fuel: Mix, phi: number, oxidizer: Mix, pressurePa = atmospherePa): EquilibriumResult {
  return solveEquilibriumHP({ ...charge(fuel, phi, oxidizer), pressurePa });
}

/**
 * Complete-combustion adiabatic temperature (products CO2, H2O, SO2, N2, Ar, excess O2 only; φ ≤ 1),
 * by a 1-D Newton iteration on the enthalpy with temperature-dependent cp. Test-local on purpose.
 */
function completeCombustionTemperatureK(elementMoles: Partial<Record<Element, number>>, enthalpyJ: number): number {
  const C = elementMoles.C ?? 0,
    H = elementMoles.H ?? 0,
    O = elementMoles.O ?? 0;
  const N = elementMoles.N ?? 0,
    S = elementMoles.S ?? 0,
    Ar = elementMoles.Ar ?? 0;
  const products: Mix = { CO2: C, H2O: H / 2, SO2: S, N2: N / 2, Ar, O2: O / 2 - C - H / 4 - S };
  if (products.O2 < -1e-12) throw new Error("complete combustion needs φ ≤ 1");
  let T = 2000;
  for (let i = 0; i < 50; i++) {
    let h = 0;
    let cp = 0;
    for (const [key, n] of Object.entries(products)) {
      if (n <= 0) continue;
      h += n * h_J_per_mol(SPECIES[key], T);
      cp += n * cp_J_per_molK(SPECIES[key], T);
    }
    const dT = (enthalpyJ - h) / cp;
    T += dT;
    if (Math.abs(dT) < 1e-9) return T;
  }
  throw new Error("complete-combustion temperature did not converge");
}

/** Element balance recomputed from the returned moles and the species formulas (not from the solver). */
function elementBalanceError(p: { elementMoles: Partial<Record<Element, number>> }, r: EquilibriumResult): number {
  let worst = 0;
  for (const el of ELEMENTS) {
    const b0 = p.elementMoles[el] ?? 0;
    if (b0 === 0) continue;
    let b = 0;
    r.species.forEach((key, k) => {
      b += (SPECIES[key].elements[el] ?? 0) * r.moles[k];
    });
    worst = Math.max(worst, Math.abs(b - b0) / b0);
  }
  return worst;
}

/** Enthalpy balance recomputed with the scalar NASA-polynomial functions. */
function enthalpyBalanceError(p: { enthalpyJ: number }, r: EquilibriumResult): number {
  let h = 0;
  let hAbs = 0;
  r.species.forEach((key, k) => {
    const hk = h_J_per_mol(SPECIES[key], r.temperatureK);
    h += r.moles[k] * hk;
    hAbs += r.moles[k] * Math.abs(hk);
  });
  return Math.abs(h - p.enthalpyJ) / Math.max(hAbs, R_J_per_molK * r.temperatureK * r.totalMoles);
}

/** ln K° of a reaction Σ ν_j A_j = 0 (products positive) from the NASA g°. */
function lnK(nu: Mix, T: number): number {
  let dG = 0;
  for (const [key, v] of Object.entries(nu)) dG += v * g_J_per_mol(SPECIES[key], T);
  return -dG / (R_J_per_molK * T);
}

/** ln of Π (x_j P/P°)^ν_j for the reaction, from a solution's mole fractions. */
function lnQ(nu: Mix, r: EquilibriumResult): number {
  let q = 0;
  for (const [key, v] of Object.entries(nu)) q += v * Math.log((r.moleFractions[key] * r.pressurePa) / standardPressurePa);
  return q;
}

// ---- published adiabatic flame temperatures ---------------------------------------------------------

describe("equilibrium adiabatic flame temperature against published values (298.15 K, 1 atm, φ = 1)", () => {
  // Turns, An Introduction to Combustion, 2nd ed., App. B, Table B.1 (fuel properties; T_ad of the
  // stoichiometric fuel–air mixture at 298 K, 1 atm, computed with equilibrium products): methane 2226 K,
  // propane 2267 K (values from memory). Turns' values are computed the same way with JANAF data;
  // the NASA Glenn data differ by a few kelvin, so ±10 K.
  it("methane–air: 2226 K ± 10 K (Turns, Table B.1)", () => {
    expect(Math.abs(hp({ CH4: 1 }, 1, TEXTBOOK_AIR).temperatureK - 2226)).toBeLessThan(10);
  });
  it("propane–air: 2267 K ± 10 K (Turns, Table B.1)", () => {
    expect(Math.abs(hp({ C3H8: 1 }, 1, TEXTBOOK_AIR).temperatureK - 2267)).toBeLessThan(10);
  });

  // Glassman & Yetter, Combustion, 4th ed., ch. 1, Table 1.1 "Approximate flame temperatures of various
  // stoichiometric mixtures, initial temperature 298 K": H2–air 2400 K, H2–O2 3080 K, CH4–air 2210 K,
  // CH4–O2 3030 K, CO–air 2400 K (values from memory). The table rounds to 10 K and calls its values approximate
  // (older thermochemical data); the comparison supports agreement within 1 % of the temperature.
  const glassman: [string, Mix, Mix, number][] = [
    ["hydrogen–air", { H2: 1 }, TEXTBOOK_AIR, 2400],
    ["hydrogen–oxygen", { H2: 1 }, OXYGEN, 3080],
    ["methane–air", { CH4: 1 }, TEXTBOOK_AIR, 2210],
    ["methane–oxygen", { CH4: 1 }, OXYGEN, 3030],
    ["carbon monoxide–air", { CO: 1 }, TEXTBOOK_AIR, 2400],
  ];
  for (const [name, fuel, oxidizer, published] of glassman) {
    it(`${name}: ${published} K within 1 % (Glassman & Yetter, Table 1.1)`, () => {
      expect(Math.abs(hp(fuel, 1, oxidizer).temperatureK - published)).toBeLessThan(0.01 * published);
    });
  }

  it("the CH4–air curve over φ peaks slightly on the rich side (1.0 < φ_max < 1.1)", () => {
    // Turns, An Introduction to Combustion, 2nd ed., Fig. 2.14 / common practice: the equilibrium
    // maximum lies slightly rich of stoichiometric because of dissociation and the lower product cp.
    const solver = createEquilibriumSolver(DEFAULT_PRODUCT_SPECIES);
    let prev: EquilibriumResult | undefined;
    let best = { phi: 0, T: 0 };
    for (let i = 0; i <= 60; i++) {
      const phi = 0.85 + i * 0.005;
      const p: EquilibriumProblem = { ...charge({ CH4: 1 }, phi, TEXTBOOK_AIR), pressurePa: atmospherePa };
      prev = solver.solveHP(prev ? { ...p, warmStart: prev } : p);
      if (prev.temperatureK > best.T) best = { phi, T: prev.temperatureK };
    }
    expect(best.phi).toBeGreaterThan(1.0);
    expect(best.phi).toBeLessThan(1.1);
    expect(hp({ CH4: 1 }, 1, TEXTBOOK_AIR).temperatureK).toBeLessThan(best.T);
  });

  it("equilibrium T_ad lies below the complete-combustion T_ad, by far more near φ = 1 than lean", () => {
    // Common practice, no source: dissociation (CO, H2, OH, H, O, NO) absorbs heat, strongly near φ = 1.
    for (const fuel of [{ CH4: 1 }, { H2: 1 }, { C3H8: 1 }] as Mix[]) {
      for (const phi of [0.5, 0.7, 0.9, 1.0]) {
        const c = charge(fuel, phi, TEXTBOOK_AIR);
        const Teq = solveEquilibriumHP({ ...c, pressurePa: atmospherePa }).temperatureK;
        expect(Teq).toBeLessThan(completeCombustionTemperatureK(c.elementMoles, c.enthalpyJ));
      }
    }
    const lean = charge({ CH4: 1 }, 0.5, TEXTBOOK_AIR);
    const stoich = charge({ CH4: 1 }, 1, TEXTBOOK_AIR);
    const gapLean =
      completeCombustionTemperatureK(lean.elementMoles, lean.enthalpyJ) -
      solveEquilibriumHP({ ...lean, pressurePa: atmospherePa }).temperatureK;
    const gapStoich =
      completeCombustionTemperatureK(stoich.elementMoles, stoich.enthalpyJ) -
      solveEquilibriumHP({ ...stoich, pressurePa: atmospherePa }).temperatureK;
    expect(gapLean).toBeLessThan(5);
    expect(gapStoich).toBeGreaterThan(60);
  });

  it("T_ad in oxygen exceeds T_ad in air; higher pressure suppresses dissociation and raises T_ad", () => {
    // Common practice, no source (no nitrogen ballast; Le Chatelier's principle for dissociation).
    for (const fuel of [{ CH4: 1 }, { H2: 1 }, { NH3: 1 }] as Mix[]) {
      expect(hp(fuel, 1, OXYGEN).temperatureK).toBeGreaterThan(hp(fuel, 1, TEXTBOOK_AIR).temperatureK + 400);
    }
    expect(hp({ CH4: 1 }, 1, OXYGEN, 20 * atmospherePa).temperatureK).toBeGreaterThan(hp({ CH4: 1 }, 1, OXYGEN).temperatureK + 100);
  });

  it("preheating the air raises T_ad", () => {
    // Common practice, no source.
    const cold = solveEquilibriumHP({ ...charge({ CH4: 1 }, 1, DRY_AIR, 298.15, 298.15), pressurePa: atmospherePa });
    const warm = solveEquilibriumHP({ ...charge({ CH4: 1 }, 1, DRY_AIR, 298.15, 700), pressurePa: atmospherePa });
    expect(warm.temperatureK).toBeGreaterThan(cold.temperatureK + 150);
  });
});

// ---- published equilibrium compositions --------------------------------------------------------------

describe("equilibrium compositions against published values", () => {
  it("stoichiometric CH4–air at 298 K, 1 atm (adiabatic): major and minor product mole fractions", () => {
    // Equilibrium products of stoichiometric methane–air (O2 + 3.76 N2) at 298 K, 1 atm, as tabulated in
    // combustion course material from NASA-type equilibrium calculations (T_ad ≈ 2226 K): CO2 0.0853,
    // H2O 0.1834, N2 0.7085, CO 0.0089, O2 0.0045, H2 0.0036, OH 0.0030, NO 0.0020 (values from memory;
    // the original table is not at hand). Majors within 1 %, minors within 10 % (the minor species carry
    // the differences between thermochemical databases, and the values are given to two figures).
    const x = hp({ CH4: 1 }, 1, TEXTBOOK_AIR).moleFractions;
    const majors: [string, number][] = [
      ["CO2", 0.0853],
      ["H2O", 0.1834],
      ["N2", 0.7085],
    ];
    const minors: [string, number][] = [
      ["CO", 0.0089],
      ["O2", 0.0045],
      ["H2", 0.0036],
      ["OH", 0.003],
      ["NO", 0.002],
    ];
    for (const [k, v] of majors) expect(Math.abs(x[k] / v - 1), k).toBeLessThan(0.01);
    for (const [k, v] of minors) expect(Math.abs(x[k] / v - 1), k).toBeLessThan(0.1);
  });

  // NASA's published sample problem "Example 1" for its equilibrium program (B. J. McBride & S. Gordon,
  // Computer Program for Calculation of Complex Chemical Equilibrium Compositions and Applications,
  // II. Users Manual and Program Description, NASA RP-1311 Part II, 1996, example problems): H2 with air
  // at r,eq.ratio = 1 and 1.5, assigned T = 3000 and 2000 K at p = 1, 0.1 and 0.01 atm. The mole
  // fractions below are those printed for it by the program as distributed by NASA Glenn (CEA2, May 2004,
  // thermodynamic data of 9/2004, i.e. the NASA Glenn database of McBride, Zehe & Gordon 2002), read in a
  // copy of the distributed output; the element amounts b0i (kmol per kg of mixture) are from the same
  // output. NASA's product list adds N, HO2, HNO, HNO2, HNO3, NH, N2O3 and O3, each below 3e-5 there.
  // Printed to five decimals: species of 0.001 and more are compared within 1 % (0.5 % rounding plus the
  // 7-coefficient fit of the data).
  const CEA_EXAMPLE_1: { phi: number; b0: Record<string, number>; x: Record<string, number[]> }[] = [
    {
      phi: 1,
      b0: { H: 0.02810846, N: 0.052388364, O: 0.014075632, Ar: 0.00031415977, C: 0.000010701224 },
      x: {
        Ar: [0.0071, 0.00773, 0.00625, 0.00771, 0.00511, 0.00767],
        H: [0.04075, 0.00009, 0.14289, 0.00041, 0.31894, 0.00186],
        H2: [0.06728, 0.00306, 0.08272, 0.00638, 0.04121, 0.01319],
        H2O: [0.2073, 0.34207, 0.09579, 0.33714, 0.01176, 0.32637],
        NO: [0.0123, 0.00048, 0.01371, 0.00072, 0.00967, 0.00107],
        N2: [0.58568, 0.64414, 0.51448, 0.64255, 0.42158, 0.63891],
        O: [0.0154, 0.00002, 0.05787, 0.0001, 0.14261, 0.00047],
        OH: [0.04517, 0.00113, 0.05953, 0.00244, 0.03275, 0.00519],
        O2: [0.01876, 0.00102, 0.0265, 0.00228, 0.0161, 0.00502],
      },
    },
    {
      phi: 1.5,
      b0: { H: 0.041593982, N: 0.051655507, O: 0.013878729, Ar: 0.00030976501, C: 0.000010551526 },
      x: {
        H: [0.06025, 0.00062, 0.18236, 0.00196, 0.39312, 0.00616],
        H2: [0.14706, 0.14737, 0.13472, 0.14676, 0.06261, 0.1449],
        H2O: [0.22224, 0.29508, 0.11131, 0.2945, 0.01465, 0.29261],
        NO: [0.00565, 0.00001, 0.00912, 0.00003, 0.00729, 0.00008],
        N2: [0.51356, 0.54995, 0.44786, 0.54948, 0.35692, 0.54799],
        O: [0.00755, 0, 0.04129, 0, 0.11694, 0.00004],
        OH: [0.03276, 0.00014, 0.05421, 0.00044, 0.0331, 0.0014],
        O2: [0.00451, 0, 0.01349, 0, 0.01082, 0.00003],
      },
    },
  ];
  const CEA_STATES: [number, number][] = [
    [1, 3000],
    [1, 2000],
    [0.1, 3000],
    [0.1, 2000],
    [0.01, 3000],
    [0.01, 2000],
  ];
  for (const { phi, b0, x } of CEA_EXAMPLE_1) {
    it(`H2–air at φ = ${phi}, 3000/2000 K, 1/0.1/0.01 atm: mole fractions of NASA's Example 1 within 1 %`, () => {
      CEA_STATES.forEach(([pAtm, T], i) => {
        const r = solveEquilibriumTP({
          elementMoles: { C: b0.C, H: b0.H, O: b0.O, N: b0.N, S: 0, Ar: b0.Ar },
          pressurePa: pAtm * atmospherePa,
          temperatureK: T,
        });
        for (const [k, ref] of Object.entries(x)) {
          if (ref[i] < 0.001) continue;
          expect(Math.abs(r.moleFractions[k] / ref[i] - 1), `${k} at ${T} K, ${pAtm} atm`).toBeLessThan(0.01);
        }
      });
    });
  }

  // NASA's sample problem "Example 3" (same manual and program output as Example 1 above): adiabatic
  // (hp) combustion of liquid toluene 40 % and n-octane 60 % by mass at 298.15 K with air at 700 K,
  // oxidant/fuel 17 by mass (φ = 0.8518), at 100, 10 and 1 bar. From the output: element amounts b0i
  // (kmol per kg of mixture), mixture enthalpy h0/R = 38.226854 kmol·K/kg with the program's
  // R = 8.31451 J/(mol·K) (H = 317.84 kJ/kg as printed), T = 2418.66, 2390.59, 2338.84 K, and the
  // mole fractions below. NASA's products add NO2 (2.3e-5 at most), HO2, N2O, HNO2 and others below
  // 1e-5 that Stoke does not carry. T within 1 K, species of 1e-4 and more within 1 %.
  it("toluene/n-octane with 700 K air at 100, 10, 1 bar (hp): T and mole fractions of NASA's Example 3", () => {
    const elementMoles = { C: 4.0331842, H: 7.1820928, O: 13.681266, N: 50.920563, S: 0, Ar: 0.30535774 }; // mol per kg
    const enthalpyJ = 38.226854 * 8.31451 * 1000; // J per kg
    const published: [number, number, Record<string, number>][] = [
      [
        100,
        2418.66,
        {
          CO: 1.6773e-3,
          CO2: 0.11537,
          H2: 2.5064e-4,
          H2O: 0.10277,
          NO: 6.7762e-3,
          N2: 0.73547,
          O: 1.5506e-4,
          OH: 2.3483e-3,
          O2: 0.026252,
          Ar: 8.8617e-3,
        },
      ],
      [
        10,
        2390.59,
        {
          CO: 4.312e-3,
          CO2: 0.11249,
          H: 1.2385e-4,
          H2: 6.6103e-4,
          H2O: 0.10136,
          NO: 6.5527e-3,
          N2: 0.73403,
          O: 4.3112e-4,
          OH: 3.816e-3,
          O2: 0.027365,
          Ar: 8.843e-3,
        },
      ],
      [
        1,
        2338.84,
        {
          CO: 9.186e-3,
          CO2: 0.10716,
          H: 4.5515e-4,
          H2: 1.4836e-3,
          H2O: 0.099015,
          NO: 6.1447e-3,
          N2: 0.73136,
          O: 1.0664e-3,
          OH: 5.7214e-3,
          O2: 0.029599,
          Ar: 8.8084e-3,
        },
      ],
    ];
    for (const [bar, T, x] of published) {
      const r = solveEquilibriumHP({ elementMoles, enthalpyJ, pressurePa: bar * 1e5 });
      expect(Math.abs(r.temperatureK - T), `T at ${bar} bar`).toBeLessThan(1);
      for (const [k, v] of Object.entries(x)) expect(Math.abs(r.moleFractions[k] / v - 1), `${k} at ${bar} bar`).toBeLessThan(0.01);
    }
  });

  // AB ⇌ A + ½ O2 from 1 mol AB at temperature T and 1 atm, with K° from the NIST-JANAF Thermochemical
  // Tables, 4th ed. (Chase 1998), standard Gibbs energies of formation Δf G°(T): table C-093 (CO),
  // C-095 (CO2), H-064 (H2O, gas). By hand: α mol dissociate, AB 1 − α, A α, O2 α/2, total 1 + α/2;
  // K° = α (α/2)^½ / (1 − α) · (p/p° / (1 + α/2))^½ with p/p° = 1.01325 (p° = 1 bar), solved for α by
  // bisection. Stoke's solver uses the NASA Glenn data, whose Δr G° at 2100 K differ from JANAF's by about
  // a tenth of a kJ/mol (K° by well under 1 %, the dissociated fraction by two thirds of that), so the
  // dissociated fraction agrees within 1 %.
  const dissociatedFraction = (drG_kJ: number, T: number) => {
    const K = Math.exp(-(drG_kJ * 1000) / (R_J_per_molK * T));
    const pr = atmospherePa / standardPressurePa;
    const f = (a: number) => ((a * Math.sqrt(a / 2)) / (1 - a)) * Math.sqrt(pr / (1 + a / 2)) - K;
    let lo = 0,
      hi = 0.999;
    for (let i = 0; i < 100; i++) {
      const m = (lo + hi) / 2;
      if (f(m) > 0) hi = m;
      else lo = m;
    }
    return (lo + hi) / 2;
  };

  it("pure CO2 at 2100 K, 1 atm (CO2, CO, O2): CO and O2 mole fractions from the JANAF Gibbs energies", () => {
    // JANAF, 2100 K: Δf G°(CO) = −294.372 kJ/mol (C-093), Δf G°(CO2) = −396.304 kJ/mol (C-095).
    const alpha = dissociatedFraction(-294.372 + 396.304, 2100);
    const xCO = alpha / (1 + alpha / 2);
    const r = solveEquilibriumTP({
      elementMoles: { C: 1, O: 2 },
      pressurePa: atmospherePa,
      temperatureK: 2100,
      productSpecies: ["CO2", "CO", "O2"],
    });
    expect(Math.abs(r.moleFractions.CO / xCO - 1)).toBeLessThan(0.01);
    expect(Math.abs(r.moleFractions.O2 / (xCO / 2) - 1)).toBeLessThan(0.01);
  });

  it("pure water vapour at 2100 K, 1 atm (H2O, H2, O2): H2 and O2 mole fractions from the JANAF Gibbs energy", () => {
    // JANAF, 2100 K: Δf G°(H2O, g) = −129.721 kJ/mol (H-064); H2 and O2 are reference elements (Δf G° = 0).
    const alpha = dissociatedFraction(129.721, 2100);
    const xH2 = alpha / (1 + alpha / 2);
    const r = solveEquilibriumTP({
      elementMoles: { H: 2, O: 1 },
      pressurePa: atmospherePa,
      temperatureK: 2100,
      productSpecies: ["H2O", "H2", "O2"],
    });
    expect(Math.abs(r.moleFractions.H2 / xH2 - 1)).toBeLessThan(0.01);
    expect(Math.abs(r.moleFractions.O2 / (xH2 / 2) - 1)).toBeLessThan(0.01);
  });
});

// ---- fixed temperature and pressure -----------------------------------------------------------------

describe("equilibrium at fixed temperature and pressure", () => {
  it("stoichiometric H2/O2 at 3000 K, 1 atm is strongly dissociated", () => {
    // Common practice, no source: at 3000 K and 1 atm water is roughly a quarter to a third
    // dissociated, with OH the largest radical (value from memory).
    const r = solveEquilibriumTP({ ...charge({ H2: 1 }, 1, OXYGEN), pressurePa: atmospherePa, temperatureK: 3000 });
    expect(r.moleFractions.OH).toBeGreaterThan(0.05);
    expect(r.moleFractions.H).toBeGreaterThan(0.02);
    expect(r.moleFractions.O).toBeGreaterThan(0.01);
    expect(r.moleFractions.H2O).toBeLessThan(0.75);
    expect(r.moleFractions.H2O).toBeGreaterThan(0.5);
    // Le Chatelier: at 10 atm less dissociation
    const r10 = solveEquilibriumTP({ ...charge({ H2: 1 }, 1, OXYGEN), pressurePa: 10 * atmospherePa, temperatureK: 3000 });
    expect(r10.moleFractions.OH).toBeLessThan(r.moleFractions.OH);
    expect(r10.moleFractions.H2O).toBeGreaterThan(r.moleFractions.H2O);
  });

  it("lean CH4/air products at 1000 K are essentially CO2, H2O, O2 and N2 (CO < 1e-10)", () => {
    // Common practice, no source: below about 1200 K the equilibrium of lean products is complete
    // combustion; the only other species of note is a trace of NO from N2 + O2.
    const c = charge({ CH4: 1 }, 0.8, TEXTBOOK_AIR);
    const r = solveEquilibriumTP({ ...c, pressurePa: atmospherePa, temperatureK: 1000 });
    const x = r.moleFractions;
    expect(x.CO).toBeLessThan(1e-10);
    expect(x.H2).toBeLessThan(1e-9);
    expect(x.CO2 + x.H2O + x.O2 + x.N2).toBeGreaterThan(1 - 1e-4);
    // complete-combustion composition: per mol CH4, 1 CO2 + 2 H2O + 0.5 O2 + 2.5 × 3.76 N2
    const total = 1 + 2 + 0.5 + 2.5 * 3.76;
    expect(x.CO2).toBeCloseTo(1 / total, 5);
    expect(x.H2O).toBeCloseTo(2 / total, 5);
  });

  it("mole fractions satisfy the equilibrium constants from the NASA g° to 1e-8 (internal consistency)", () => {
    // Definition of K° (ideal gases): Π (x_j P/P°)^ν_j = exp(−Δ_r G°/RT); no external value.
    const reactions: Mix[] = [
      { CO2: 1, CO: -1, O2: -0.5 }, // CO + ½ O2 = CO2
      { H2O: 1, H2: -1, O2: -0.5 }, // H2 + ½ O2 = H2O
      { NO: 1, N2: -0.5, O2: -0.5 }, // ½ N2 + ½ O2 = NO
      { OH: 1, H: 1, H2O: -1 }, // H2O = H + OH
      { O: 2, O2: -1 }, // O2 = 2 O
    ];
    for (const [T, P] of [
      [2500, atmospherePa],
      [2000, 1e4],
      [1800, 5e6],
      [3200, atmospherePa],
    ] as const) {
      const r = solveEquilibriumTP({ ...charge({ CH4: 1 }, 1, DRY_AIR), pressurePa: P, temperatureK: T });
      for (const nu of reactions) {
        const rel = Math.abs(Math.expm1(lnQ(nu, r) - lnK(nu, T)));
        expect(rel).toBeLessThan(1e-8);
      }
    }
    // and in an HP solution, at its own temperature
    const rHP = hp({ CH4: 1 }, 1.2, DRY_AIR);
    for (const nu of reactions) {
      expect(Math.abs(Math.expm1(lnQ(nu, rHP) - lnK(nu, rHP.temperatureK)))).toBeLessThan(1e-8);
    }
  });

  it("is a Gibbs-energy minimum: shifting CO + ½ O2 ⇌ CO2 either way raises G", () => {
    // Definition of equilibrium at fixed T and P; G/RT = Σ n_j (g°_j/RT + ln(x_j P/P°)).
    const T = 2600;
    const r = solveEquilibriumTP({ ...charge({ CH4: 1 }, 1, DRY_AIR), pressurePa: atmospherePa, temperatureK: T });
    const G = (moles: Float64Array) => {
      const total = moles.reduce((a, b) => a + b, 0);
      let g = 0;
      r.species.forEach((key, k) => {
        g +=
          moles[k] *
          (g_J_per_mol(SPECIES[key], T) / (R_J_per_molK * T) + Math.log((moles[k] / total) * (atmospherePa / standardPressurePa)));
      });
      return g;
    };
    const iCO2 = r.species.indexOf("CO2"),
      iCO = r.species.indexOf("CO"),
      iO2 = r.species.indexOf("O2");
    const g0 = G(r.moles);
    for (const eps of [1e-4, -1e-4]) {
      const m = Float64Array.from(r.moles);
      m[iCO2] += eps * m[iCO];
      m[iCO] -= eps * m[iCO];
      m[iO2] -= 0.5 * eps * r.moles[iCO];
      expect(G(m)).toBeGreaterThan(g0);
    }
  });
});

// ---- balances over the whole operating range (property-based) ----------------------------------------

const FUEL_KEYS = ["CH4", "C2H6", "C3H8", "H2", "CO", "CO2", "N2", "NH3", "H2S"] as const;
const COMBUSTIBLE = new Set(["CH4", "C2H6", "C3H8", "H2", "CO", "NH3", "H2S"]);

const fuelArb = fc
  .tuple(
    ...FUEL_KEYS.map((key) =>
      key === "H2S" ? fc.double({ min: 0, max: 0.05, noNaN: true }) : fc.oneof(fc.constant(0), fc.double({ min: 0, max: 1, noNaN: true })),
    ),
  )
  .filter((w) => FUEL_KEYS.some((key, i) => COMBUSTIBLE.has(key) && key !== "H2S" && w[i] > 0.01))
  .map((w) => {
    // hydrogen sulfide up to 5 % of the other combustibles (biogas-like): with SO2 the only sulfur
    // product a sulfur-rich, fuel-rich charge has no all-gas equilibrium (tested separately below)
    let others = 0;
    let combustible = 0;
    FUEL_KEYS.forEach((key, i) => {
      if (key !== "H2S" && w[i] > 1e-12) others += w[i]; // analyses do not go below ppm
      if (key !== "H2S" && COMBUSTIBLE.has(key) && w[i] > 1e-12) combustible += w[i];
    });
    const h2s = (w[FUEL_KEYS.indexOf("H2S")] * combustible) / others;
    const fuel: Mix = {};
    FUEL_KEYS.forEach((key, i) => {
      if (key === "H2S") {
        if (h2s > 1e-12) fuel.H2S = h2s;
      } else if (w[i] > 1e-12) {
        fuel[key] = ((1 - h2s) * w[i]) / others;
      }
    });
    return fuel;
  });

const oxidizerArb = fc.oneof(
  fc.constant(DRY_AIR),
  fc.double({ min: 0.21, max: 0.9, noNaN: true }).map((o2): Mix => ({ O2: o2, N2: 1 - o2 })), // O2-enriched air
  fc.constant(OXYGEN),
  fc.double({ min: 0.001, max: 0.06, noNaN: true }).map((w): Mix => {
    // humid air: 0.1 to 6 mol % water vapour (saturation near 36 °C)
    const out: Mix = { H2O: w };
    for (const [k, x] of Object.entries(DRY_AIR)) out[k] = x * (1 - w);
    return out;
  }),
);

describe("property-based: converges with verified balances over the operating range", () => {
  it("HP from a cold start: φ 0.3–3, reactants 250–1200 K, 0.1–50 bar, air / enriched / O2 / humid air", () => {
    fc.assert(
      fc.property(
        fuelArb,
        oxidizerArb,
        fc.double({ min: 0.3, max: 3, noNaN: true }),
        fc.double({ min: 250, max: 1200, noNaN: true }),
        fc.double({ min: 250, max: 1200, noNaN: true }),
        fc.double({ min: Math.log(1e4), max: Math.log(5e6), noNaN: true }),
        (fuel, oxidizer, phi, fuelT, oxT, lnP) => {
          const c = charge(fuel, phi, oxidizer, fuelT, oxT);
          const p = { ...c, pressurePa: Math.exp(lnP) };
          const r = solveEquilibriumHP(p);
          expect(r.elementBalanceRelError).toBeLessThanOrEqual(1e-10);
          expect(r.enthalpyBalanceRelError).toBeLessThanOrEqual(1e-6);
          expect(elementBalanceError(p, r)).toBeLessThanOrEqual(1e-10);
          expect(enthalpyBalanceError(p, r)).toBeLessThanOrEqual(1e-6);
          let sum = 0;
          for (const key of r.species) {
            expect(r.moleFractions[key]).toBeGreaterThanOrEqual(0);
            sum += r.moleFractions[key];
          }
          expect(Math.abs(sum - 1)).toBeLessThan(1e-12);
          expect(r.temperatureK).toBeGreaterThan(250);
          expect(r.temperatureK).toBeLessThan(4500);
          if (!(c.elementMoles.S! > 0)) expect(r.species).not.toContain("SO2");
        },
      ),
      { numRuns: 300, seed: 20240611 },
    );
  });

  it("TP from a cold start: 600–3500 K, same mixtures and pressures", () => {
    fc.assert(
      fc.property(
        fuelArb,
        oxidizerArb,
        fc.double({ min: 0.3, max: 3, noNaN: true }),
        fc.double({ min: 600, max: 3500, noNaN: true }),
        fc.double({ min: Math.log(1e4), max: Math.log(5e6), noNaN: true }),
        (fuel, oxidizer, phi, T, lnP) => {
          const c = charge(fuel, phi, oxidizer);
          const p = { elementMoles: c.elementMoles, pressurePa: Math.exp(lnP), temperatureK: T };
          const r = solveEquilibriumTP(p);
          expect(r.temperatureK).toBe(T);
          expect(elementBalanceError(p, r)).toBeLessThanOrEqual(1e-10);
          const sum = r.species.reduce((a, key) => a + r.moleFractions[key], 0);
          expect(Math.abs(sum - 1)).toBeLessThan(1e-12);
          const co = { CO2: 1, CO: -1, O2: -0.5 };
          if (r.species.includes("CO")) expect(Math.abs(Math.expm1(lnQ(co, r) - lnK(co, T)))).toBeLessThan(1e-8);
        },
      ),
      { numRuns: 150, seed: 7 },
    );
  });
});

// ---- API behaviour ----------------------------------------------------------------------------------

describe("solver API", () => {
  it("a reused solver, warm starts and the one-shot functions agree", () => {
    const solver = createEquilibriumSolver(DEFAULT_PRODUCT_SPECIES);
    const p1 = { ...charge({ CH4: 0.9, C2H6: 0.05, N2: 0.05 }, 0.95, DRY_AIR), pressurePa: atmospherePa };
    const p2 = { ...charge({ CH4: 0.9, C2H6: 0.05, N2: 0.05 }, 1.15, DRY_AIR), pressurePa: atmospherePa };
    const a = solver.solveHP(p1);
    const b = solveEquilibriumHP(p1);
    expect(a.temperatureK).toBeCloseTo(b.temperatureK, 9);
    const coldP2 = solver.solveHP(p2);
    const warmP2 = solver.solveHP({ ...p2, warmStart: a });
    const hintP2 = solver.solveHP({ ...p2, initialTemperatureK: 1500 });
    expect(warmP2.temperatureK).toBeCloseTo(coldP2.temperatureK, 7);
    expect(hintP2.temperatureK).toBeCloseTo(coldP2.temperatureK, 7);
    // the earlier result is not disturbed by later solves
    expect(a.temperatureK).toBeCloseTo(b.temperatureK, 9);
    expect(a.moles[a.species.indexOf("N2")]).toBeCloseTo(b.moles[b.species.indexOf("N2")], 12);
  });

  it("drops species whose elements are absent and adds SO2 and H2S only with sulfur", () => {
    const h2o2 = hp({ H2: 1 }, 1, OXYGEN);
    expect([...h2o2.species].sort()).toEqual(["H", "H2", "H2O", "O", "O2", "OH"]);
    const ch4air = hp({ CH4: 1 }, 1, DRY_AIR);
    expect([...ch4air.species]).toEqual([...DEFAULT_PRODUCT_SPECIES]);
    const sour = hp({ CH4: 0.98, H2S: 0.02 }, 0.9, DRY_AIR);
    expect(sour.species).toContain("SO2");
    // lean: essentially all sulfur leaves as SO2 (H2S is among the products but at trace level)
    expect(sour.species).toContain("H2S");
    expect(Math.abs(sour.moles[sour.species.indexOf("SO2")] - 0.02) / 0.02).toBeLessThan(1e-5);
  });

  it("refuses a charge that has no all-gas equilibrium instead of returning a number", () => {
    // rich hydrogen sulfide with SO2 the only sulfur product: O is short of 2 S
    const soOnly = [...DEFAULT_PRODUCT_SPECIES, "SO2"];
    const rich = () => solveEquilibriumHP({ ...charge({ H2S: 1 }, 2, TEXTBOOK_AIR), pressurePa: atmospherePa, productSpecies: soOnly });
    expect(rich).toThrow(EquilibriumInfeasibleError);
    expect(rich).toThrow(InfeasibleChargeError);
    // very rich propane: not enough oxygen even for CO (soot would form)
    expect(() => hp({ C3H8: 1 }, 3.5, TEXTBOOK_AIR)).toThrow(/too little oxygen/);
    // with H2S among the products (the default when sulfur is present) the sulfur-rich charge has a gaseous equilibrium
    const r = solveEquilibriumHP({
      ...charge({ H2S: 1 }, 2, TEXTBOOK_AIR),
      pressurePa: atmospherePa,
      productSpecies: [...DEFAULT_PRODUCT_SPECIES, "SO2", "H2S"],
    });
    expect(r.moleFractions.H2S).toBeGreaterThan(0.01);
    expect(r.elementBalanceRelError).toBeLessThanOrEqual(1e-10);
  });

  it("reports non-convergence when the product species cannot hold the charge", () => {
    // lean methane with no species for the surplus oxygen (no O2, O, OH, NO)
    const p = { ...charge({ CH4: 1 }, 0.8, TEXTBOOK_AIR), pressurePa: atmospherePa, productSpecies: ["CO2", "H2O", "N2"] };
    expect(() => solveEquilibriumHP(p)).toThrow(EquilibriumNotConvergedError);
    expect(() => solveEquilibriumHP(p)).toThrow(NotConvergedError);
  });

  it("rejects bad input naming the field", () => {
    const c = charge({ CH4: 1 }, 1, DRY_AIR);
    expect(() => solveEquilibriumHP({ ...c, pressurePa: -1 })).toThrow(/pressurePa/);
    expect(() => solveEquilibriumHP({ ...c, pressurePa: atmospherePa, enthalpyJ: NaN })).toThrow(/enthalpyJ/);
    expect(() => solveEquilibriumHP({ elementMoles: { C: 1, Xe: 1 } as never, enthalpyJ: 0, pressurePa: atmospherePa })).toThrow(
      /elementMoles.*Xe/,
    );
    expect(() => solveEquilibriumHP({ elementMoles: { C: -1 }, enthalpyJ: 0, pressurePa: atmospherePa })).toThrow(/elementMoles\.C/);
    expect(() => solveEquilibriumTP({ ...c, pressurePa: atmospherePa, temperatureK: 100 })).toThrow(/temperatureK/);
    expect(() => solveEquilibriumHP({ ...c, pressurePa: atmospherePa, productSpecies: ["CO2", "Unobtainium"] })).toThrow(
      /productSpecies.*Unobtainium/,
    );
    expect(() => createEquilibriumSolver(["H2O", "H2O(L)"])).toThrow(/not a gas/);
    const solver = createEquilibriumSolver(DEFAULT_PRODUCT_SPECIES);
    expect(() => solver.solveHP({ ...c, pressurePa: atmospherePa, productSpecies: ["CO2"] })).toThrow(/productSpecies/);
  });
});
