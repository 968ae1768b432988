import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { MECHANISM_CITATIONS } from "../../../lib/flame/mechanism/citations";
import { convertMechanismYaml, mechanismJsonText } from "../../../lib/flame/mechanism/convert";
import { createKinetics } from "../../../lib/flame/kinetics";
import { buildMechanism, loadMechanism } from "../../../lib/flame/mechanism";
import {
  massToMole,
  meanMolarMass,
  meanMolarMassFromMole,
  mixtureCp_J_per_kgK,
  moleToMass,
  speciesThermoInto,
} from "../../../lib/flame/thermo";
import { R_J_per_molK } from "../../../lib/units/constants";

const dir = new URL("../../../lib/flame/mechanism/", import.meta.url);

describe("GRI-Mech 3.0 data file", () => {
  it("the committed JSON equals a fresh conversion of the YAML", () => {
    const fresh = mechanismJsonText(
      convertMechanismYaml(readFileSync(new URL("gri30.yaml", dir), "utf8"), "gri30", MECHANISM_CITATIONS.gri30),
    );
    expect(readFileSync(new URL("gri30.json", dir), "utf8")).toBe(fresh);
  });

  it("has 53 species and 325 reactions, 5 elements", () => {
    // GRI-Mech 3.0 (Smith et al. 1999): 53 species, 325 reactions, elements O, H, C, N, Ar.
    const m = loadMechanism();
    expect(m.nSpecies).toBe(53);
    expect(m.reactions.length).toBe(325);
    expect([...m.elementNames].sort()).toEqual(["Ar", "C", "H", "N", "O"]);
  });

  it("converts A and Ea to SI for a bimolecular, a three-body and a fall-off reaction", () => {
    const m = loadMechanism();
    // GRI-Mech 3.0 reaction list: R38 H + O2 <=> O + OH, A = 2.65e16 cm3/(mol s), b = -0.6707, Ea = 17041 cal/mol
    // (grimech30.dat; the GRI-Mech web reaction table rounds b to -0.671).
    const r38 = m.reactions[37];
    expect(r38.equation).toBe("H + O2 <=> O + OH");
    expect(r38.rate.A).toBeCloseTo(2.65e16 * 1e-6, 6);
    expect(r38.rate.b).toBe(-0.6707);
    expect(r38.rate.Ea_J_per_mol).toBeCloseTo(17041 * 4.184, 6);
    // R1 2O + M <=> O2 + M, A = 1.2e17 cm6/(mol2 s) -> 1.2e5 m6/(mol2 s).
    expect(m.reactions[0].rate.A).toBeCloseTo(1.2e5, 6);
    // R12 O + CO (+M) <=> CO2 (+M): k_inf A = 1.8e10 cm3/(mol s); k0 A = 6.02e14 cm6/(mol2 s).
    const r12 = m.reactions[11];
    expect(r12.rate.A).toBeCloseTo(1.8e4, 6);
    expect(r12.lowRate?.A).toBeCloseTo(6.02e2, 8);
  });

  it("molar masses of CH4 and N2 match ISO 6976:2016 (IUPAC 2005 atomic weights)", () => {
    const m = loadMechanism();
    // ISO 6976:2016 Table 1: methane 16.04246 g/mol, nitrogen 28.0134 g/mol.
    expect(m.molarMass_kg_per_mol[m.speciesIndex.get("CH4") as number]).toBeCloseTo(0.01604246, 9);
    expect(m.molarMass_kg_per_mol[m.speciesIndex.get("N2") as number]).toBeCloseTo(0.0280134, 9);
    const X = new Float64Array(m.nSpecies);
    X[m.speciesIndex.get("N2") as number] = 1;
    expect(meanMolarMassFromMole(m, X)).toBeCloseTo(0.0280134, 9);
  });

  it("dry air on the mechanism thermo: molar mass 28.96 g/mol, c_p 1.005 kJ/(kg K) at 300 K; mass/mole round trip", () => {
    const m = loadMechanism();
    const n = m.nSpecies;
    const X = new Float64Array(n),
      Y = new Float64Array(n),
      X2 = new Float64Array(n);
    // dry air by volume (common practice, no source: rounded standard composition)
    const air: Record<string, number> = { O2: 0.2095, N2: 0.7809, AR: 0.0093, CO2: 0.0003 };
    for (const [k, x] of Object.entries(air)) X[m.speciesIndex.get(k) as number] = x;
    moleToMass(m, X, Y);
    massToMole(m, Y, X2);
    for (let k = 0; k < n; k++) expect(X2[k]).toBeCloseTo(X[k], 14);
    // ISO 2533:1975 (standard atmosphere): molar mass of dry air 28.96442 g/mol (value from memory)
    expect(meanMolarMass(m, Y) * 1000).toBeCloseTo(28.964, 2);
    const cp = new Float64Array(n),
      h = new Float64Array(n),
      s = new Float64Array(n);
    speciesThermoInto(m, 300, cp, h, s);
    // ideal-gas c_p of air at 300 K: 1.005 kJ/(kg K) (Çengel & Boles, Thermodynamics, Table A-2b; value from memory)
    expect(mixtureCp_J_per_kgK(m, cp, Y) / 1000).toBeCloseTo(1.005, 2);
  });

  it("mechanism thermo reproduces NIST-JANAF values for H2O and N2", () => {
    const m = loadMechanism();
    const n = m.nSpecies;
    const cp = new Float64Array(n),
      h = new Float64Array(n),
      s = new Float64Array(n);
    const iH2O = m.speciesIndex.get("H2O") as number,
      iN2 = m.speciesIndex.get("N2") as number;
    speciesThermoInto(m, 298.15, cp, h, s);
    // NIST-JANAF Thermochemical Tables, 4th ed. (Chase 1998), H2O(g): ΔfH°(298.15) = −241.826 kJ/mol,
    // S°(298.15) = 188.834 J/(mol K) at 1 bar (the mechanism's records are used at CHEMKIN's 1 atm standard
    // state; the R ln(1.01325) = 0.109 J/(mol K) between the two is within the tolerance).
    expect((h[iH2O] * R_J_per_molK * 298.15) / 1000).toBeCloseTo(-241.826, 1);
    expect(s[iH2O] * R_J_per_molK).toBeCloseTo(188.834, 0);
    speciesThermoInto(m, 1000, cp, h, s);
    // NIST-JANAF, N2: cp(1000 K) = 32.697 J/(mol K); H − H(298.15) at 1000 K = 21.463 kJ/mol.
    // The mechanism's fit meets its range boundary at 1000 K: within 0.3 % of JANAF there.
    expect(Math.abs(cp[iN2] * R_J_per_molK - 32.697)).toBeLessThan(0.1);
    expect((h[iN2] * R_J_per_molK * 1000) / 1000).toBeCloseTo(21.463, 1);
  });
});

describe("mechanism converter on small hand-written mechanisms", () => {
  const species = (name: string, comp: string) => `
- name: ${name}
  composition: ${comp}
  thermo:
    model: NASA7
    temperature-ranges: [200.0, 1000.0, 3500.0]
    data:
    - [3.5, 0.0, 0.0, 0.0, 0.0, -1000.0, 3.0]
    - [3.5, 0.0, 0.0, 0.0, 0.0, -1000.0, 3.0]
  transport:
    model: gas
    geometry: linear
    well-depth: 100.0
    diameter: 3.0`;
  const yaml = (reactions: string) => `
units: {length: cm, time: s, quantity: mol, activation-energy: cal/mol}
phases:
- name: t
  elements: [H, O]
  species: [H2, O2, H2O]
species:${species("H2", "{H: 2}")}${species("O2", "{O: 2}")}${species("H2O", "{H: 2, O: 1}")}
reactions:
${reactions}
`;

  it("honours non-standard forward orders: q = k [H2]^1.5 [O2]^0.25 for an irreversible global step", () => {
    // A CHEMKIN FORD-type global reaction (orders replace the stoichiometric exponents of the forward rate;
    // CHEMKIN-II manual, Kee, Rupley & Miller, SAND89-8009, 1989): k = 1e10 (cm3/mol)^0.75/s, Ea = 0.
    const raw = convertMechanismYaml(
      yaml(`- equation: 2 H2 + O2 => 2 H2O
  rate-constant: {A: 1.0e+10, b: 0.0, Ea: 0.0}
  orders: {H2: 1.5, O2: 0.25}`),
      "t",
      "test",
    );
    const m = buildMechanism(raw);
    const kin = createKinetics(m);
    const C = new Float64Array([4, 9, 0]); // mol/m3
    const w = new Float64Array(3);
    kin.netProductionRates(1000, C, w);
    // order n = 1.75: A_SI = 1e10 × (1e-6)^0.75 = 1e5.5 (m3/mol)^0.75/s
    const q = 1e10 * 1e-6 ** 0.75 * 4 ** 1.5 * 9 ** 0.25;
    expect(w[2] / (2 * q)).toBeCloseTo(1, 10);
    expect(w[0] / (-2 * q)).toBeCloseTo(1, 10);
  });

  it("refuses rate forms it does not know, naming the reaction", () => {
    expect(() =>
      convertMechanismYaml(
        yaml(`- equation: H2 + O2 <=> H2O + O2
  type: pressure-dependent-Arrhenius
  rate-constants: []`),
        "t",
        "test",
      ),
    ).toThrow(/reaction 1 .*not supported/);
  });
});
