/**
 * Fuel definitions: blends by volume, mass and energy share against hand computations from the
 * ISO 6976:2016 component table; upstream CO2e of blends; the Channiwala & Parikh correlation against
 * published heating values; field paths of input errors. Every reference value carries its source.
 */
import { describe, expect, it } from "vitest";
import { channiwalaParikhHHV_MJ_per_kg, FuelDefinitionError, MAX_BLEND_NESTING, resolveFuel } from "../../lib/fuels/resolve";
import { heatingValues } from "../../lib/combustion/heating-values";
import { computeFuelProperties } from "../../lib/combustion/properties";
import { InputError } from "../../lib/errors";
import { ATOMIC_WEIGHT_g_per_mol as W } from "../../lib/thermo/elements";
import type { FuelDefinition } from "../../lib/schemas/fuel";

const rel = (a: number, b: number) => Math.abs(a / b - 1);

// ISO 6976:2016 Table 3, molar net calorific values at 25 °C, kJ/mol: methane 802.60, hydrogen 241.81;
// Table 1 molar masses: methane 16.04246, hydrogen 2.01588 g/mol (hydrogen: value from memory).
const NCV_CH4_kJ_per_mol = 802.6;
const NCV_H2_kJ_per_mol = 241.81;
const M_CH4 = 16.04246;
const M_H2 = 2.01588;
// per kg: 802.60 / 16.04246 = 50.0297 MJ/kg; 241.81 / 2.01588 = 119.9526 MJ/kg
const NCV_CH4_MJ_per_kg = NCV_CH4_kJ_per_mol / M_CH4;
const NCV_H2_MJ_per_kg = NCV_H2_kJ_per_mol / M_H2;

const CH4: FuelDefinition = { compound: "CH4" };
const H2: FuelDefinition = { compound: "H2" };

describe("blends against hand computations from ISO 6976:2016 component values (net, 25 °C)", () => {
  // Stoke's molar heating values agree with the ISO 6976:2016 table within 0.02 % per component
  // (combustion.test.ts); a blend computed by hand from the table agrees within the same 0.02 %.
  it("80/20 by volume CH4/H2: NCV 0.8 × 802.60 + 0.2 × 241.81 = 690.442 kJ/mol, H2 mole fraction 0.2", () => {
    const f = resolveFuel({
      blend: [
        { fuel: CH4, share: 0.8 },
        { fuel: H2, share: 0.2 },
      ],
      basis: "volume",
    });
    expect(f.h2MoleFraction).toBeCloseTo(0.2, 12);
    expect(rel(heatingValues(f).lhv_kJ_per_mol!, 0.8 * 802.6 + 0.2 * 241.81)).toBeLessThan(2e-4);
  });

  it("80/20 by mass CH4/H2: NCV 0.8 × 50.0297 + 0.2 × 119.9526 = 64.0143 MJ/kg; carbon 0.8 × 1000 / 16.04246 = 49.868 mol/kg", () => {
    const f = resolveFuel({
      blend: [
        { fuel: CH4, share: 0.8 },
        { fuel: H2, share: 0.2 },
      ],
      basis: "mass",
    });
    expect(f.componentMassFractions).toEqual([0.8, 0.2]);
    const byHand = 0.8 * NCV_CH4_MJ_per_kg + 0.2 * NCV_H2_MJ_per_kg;
    expect(byHand).toBeCloseTo(64.0143, 3);
    expect(rel(heatingValues(f).lhv_MJ_per_kg, byHand)).toBeLessThan(2e-4);
    // elements: carbon only from methane, per kg of blend (IUPAC 2005 atomic weights, as ISO 6976:2016)
    expect(rel(f.elements_mol_per_kg.C, (0.8 * 1000) / (W.C + 4 * W.H))).toBeLessThan(1e-12);
  });

  it("50/50 by energy CH4/H2: mass fractions 0.7057/0.2943 and NCV 70.609 MJ/kg", () => {
    // By hand: the mass of each component per unit of energy share is share / NCV:
    //   CH4 0.5 / 50.0297 = 0.0099941 kg, H2 0.5 / 119.9526 = 0.0041683 kg, total 0.0141624 kg per MJ;
    //   mass fractions 0.0099941 / 0.0141624 = 0.7057 and 0.2943; NCV = 1 MJ / 0.0141624 kg = 70.609 MJ/kg.
    const mCH4 = 0.5 / NCV_CH4_MJ_per_kg;
    const mH2 = 0.5 / NCV_H2_MJ_per_kg;
    const wCH4 = mCH4 / (mCH4 + mH2);
    expect(wCH4).toBeCloseTo(0.7057, 4);
    expect(1 / (mCH4 + mH2)).toBeCloseTo(70.609, 2);
    const f = resolveFuel({
      blend: [
        { fuel: CH4, share: 0.5 },
        { fuel: H2, share: 0.5 },
      ],
      basis: "energy",
    });
    expect(rel(f.componentMassFractions![0], wCH4)).toBeLessThan(2e-4);
    expect(rel(f.componentMassFractions![1], 1 - wCH4)).toBeLessThan(5e-4);
    expect(rel(heatingValues(f).lhv_MJ_per_kg, 1 / (mCH4 + mH2))).toBeLessThan(2e-4);
  });
});

describe("upstream CO2e of a blend", () => {
  const a: FuelDefinition = { compound: "CH4", upstreamCo2e_kg_per_GJ: 10 };
  const b: FuelDefinition = { compound: "H2", upstreamCo2e_kg_per_GJ: 20 };
  const unstated: FuelDefinition = { compound: "H2" };

  it("50/50 by energy of 10 and 20 kg/GJ is 15 kg/GJ (energy-weighted by hand)", () => {
    const p = computeFuelProperties({
      blend: [
        { fuel: a, share: 0.5 },
        { fuel: b, share: 0.5 },
      ],
      basis: "energy",
    });
    expect(p.co2.upstreamCo2e_kg_per_GJ_lhv).toBeCloseTo(15, 9);
  });

  it("a component with no stated factor makes the blend's upstream CO2e unknown (undefined), not 0, and says so", () => {
    const f = resolveFuel({
      blend: [
        { fuel: a, share: 0.9 },
        { fuel: unstated, share: 0.1 },
      ],
      basis: "energy",
    });
    expect(f.upstreamCo2e_kg_per_GJ).toBeUndefined();
    expect(f.notes.join(" ")).toMatch(/upstream CO2e unknown: component 1 states no factor/);
    const p = computeFuelProperties({
      blend: [
        { fuel: a, share: 0.9 },
        { fuel: unstated, share: 0.1 },
      ],
      basis: "energy",
    });
    expect(p.co2.upstreamCo2e_kg_per_GJ_lhv).toBeUndefined();
  });
});

describe("Channiwala & Parikh (2002) correlation against ISO 6976:2016 gross calorific values", () => {
  // Channiwala & Parikh, Fuel 81 (2002) 1051–1063: HHV = 0.3491 C + 1.1783 H + 0.1005 S − 0.1034 O
  // − 0.0151 N − 0.0211 ash (MJ/kg, dry mass %), derived from 225 data points covering gaseous, liquid
  // and solid fuels, average absolute error 1.45 % (abstract). Its stated range of validity (H up to
  // 25.15 %, S up to 94.08 %, abstract) reaches methane (H 25.13 %) and hydrogen sulfide (S 94.08 %).
  // The paper's own data table was not at hand; the gross values here are ISO 6976:2016 Table 3
  // (25 °C, kJ/mol) divided by the Table 1 molar masses. Each within the paper's 1.45 %.
  const gases: [string, { C: number; H: number; S: number }, number][] = [
    ["methane", { C: 1, H: 4, S: 0 }, 890.58],
    ["ethane", { C: 2, H: 6, S: 0 }, 1560.69],
    ["propane", { C: 3, H: 8, S: 0 }, 2219.17],
    ["n-butane", { C: 4, H: 10, S: 0 }, 2877.4],
    ["hydrogen sulfide", { C: 0, H: 2, S: 1 }, 562.01],
  ];
  for (const [name, atoms, gcv_kJ_per_mol] of gases) {
    it(`${name}: ${gcv_kJ_per_mol} kJ/mol gross within 1.45 %`, () => {
      const M = atoms.C * W.C + atoms.H * W.H + atoms.S * W.S;
      const pct = (n: number, w: number) => (100 * n * w) / M;
      const hhv = channiwalaParikhHHV_MJ_per_kg({ C: pct(atoms.C, W.C), H: pct(atoms.H, W.H), S: pct(atoms.S, W.S), O: 0, N: 0, ash: 0 });
      expect(rel(hhv, gcv_kJ_per_mol / M)).toBeLessThan(0.0145);
    });
  }
});

describe("input errors name the field as the user wrote it", () => {
  it("an unknown species in a blend component: fuel.blend.1.fuel.composition.XY", () => {
    const def = {
      blend: [
        { fuel: CH4, share: 0.5 },
        { fuel: { composition: { XY: 1 } }, share: 0.5 },
      ],
      basis: "volume",
    } as FuelDefinition;
    expect(() => resolveFuel(def)).toThrow(InputError);
    expect(() => resolveFuel(def)).toThrow(/^fuel\.blend\.1\.fuel\.composition\.XY: unknown species "XY"/);
  });

  it("FuelDefinitionError is the common InputError", () => {
    expect(() => resolveFuel({ compound: "XY" } as FuelDefinition)).toThrow(FuelDefinitionError);
    expect(() => resolveFuel({ compound: "XY" } as FuelDefinition)).toThrow(/^fuel\.compound: /);
  });

  it(`blends nest at most ${MAX_BLEND_NESTING} levels; a 1,000-deep blend is an InputError naming its path, not a stack overflow`, () => {
    const nest = (depth: number): FuelDefinition => {
      let def: FuelDefinition = CH4;
      for (let i = 0; i < depth; i++) def = { blend: [{ fuel: def, share: 1 }], basis: "mass" };
      return def;
    };
    expect(resolveFuel(nest(MAX_BLEND_NESTING)).elements_mol_per_kg.C).toBeGreaterThan(0);
    const deepPath = `fuel${".blend.0.fuel".repeat(MAX_BLEND_NESTING)}.blend`;
    for (const depth of [MAX_BLEND_NESTING + 1, 1000]) {
      expect(() => resolveFuel(nest(depth))).toThrow(InputError);
      expect(() => resolveFuel(nest(depth))).toThrow(`${deepPath}: blends nest at most ${MAX_BLEND_NESTING} levels deep`);
    }
  });
});

describe("energy-share blends need components that release heat", () => {
  it("nitrogen in a blend by energy share is an InputError naming its share", () => {
    const def: FuelDefinition = {
      blend: [
        { fuel: CH4, share: 0.9 },
        { fuel: { compound: "N2" }, share: 0.1 },
      ],
      basis: "energy",
    };
    expect(() => resolveFuel(def)).toThrow(InputError);
    expect(() => resolveFuel(def)).toThrow(/^fuel\.blend\.1\.share: /);
  });
});
