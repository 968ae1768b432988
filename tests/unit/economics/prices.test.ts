import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  normalisePrice,
  priceQuoteIssues,
  PriceNormalisationError,
  priceUnitLabel,
  type FuelEnergyContent,
  type PriceQuoteTerms,
} from "../../../lib/economics/prices";
import { MJ_per_MMBtu, MJ_per_therm, L_per_USgal } from "../../../lib/units/energy";

// A gas oil by the IPCC 2006 Guidelines, Vol. 2, Ch. 1, Table 1.2 default NCV (gas/diesel oil
// 43.0 TJ/Gg; value from memory, high confidence). HHV/LHV ratio 1.065 and density 845 kg/m³:
// common practice, no source (EN 590 density range 820–845 kg/m³).
const gasOil: FuelEnergyContent = { kind: "liquid", lhv_MJ_per_kg: 43.0, hhv_MJ_per_kg: 45.8, density_kg_per_m3: 845 };

// Methane by ISO 6976:2016 (Table 3, confirmed): GCV 890.58,
// NCV 802.60 kJ/mol at 25 °C, M = 16.04246 g/mol; ideal molar volume at 15 °C 23.644829 L/mol,
// Z(15 °C) = 1 − 0.04452² (summation factor 0.04452).
const M_CH4 = 16.04246;
const methane: FuelEnergyContent = {
  kind: "gas",
  hhv_MJ_per_kg: 890.58 / M_CH4,
  lhv_MJ_per_kg: 802.6 / M_CH4,
  gasDensity_kg_per_m3: (t) => {
    if (t !== 15) throw new Error("only 15 °C in this test");
    const Z = 1 - 0.04452 ** 2;
    return M_CH4 / 23.644829 / Z;
  },
};

describe("normalisePrice", () => {
  it("a price per MWh on its own basis comes back unchanged", () => {
    const p = normalisePrice({ amount: 42.5, unit: "MWh", energyBasis: "gross" }, methane);
    expect(p.perMWh_gross).toBeCloseTo(42.5, 10);
    const q = normalisePrice({ amount: 42.5, unit: "MWh", energyBasis: "net" }, methane);
    expect(q.perMWh_net).toBeCloseTo(42.5, 10);
  });

  it("gross and net differ by the ratio of heating values", () => {
    const p = normalisePrice({ amount: 30, unit: "MWh", energyBasis: "gross" }, methane);
    // Net price is higher: fewer net MWh in the same gas. Methane GCV/NCV (25 °C) = 890.58/802.60
    // (ISO 6976:2016 Table 3).
    expect(p.perMWh_net / p.perMWh_gross).toBeCloseTo(890.58 / 802.6, 10);
    expect(p.perMWh_net).toBeCloseTo(30 * 1.10962, 3);
  });

  it("per tonne of gas oil to per GJ and MWh net", () => {
    // 1000 per t = 1 per kg; at 43.0 MJ/kg (IPCC 2006 Table 1.2 default NCV, value from memory)
    // that is 1000/43.0 = 23.2558 per GJ net and 83.7209 per MWh net (arithmetic).
    const p = normalisePrice({ amount: 1000, unit: "t" }, gasOil);
    expect(p.perKg).toBeCloseTo(1, 12);
    expect(p.perGJ_net).toBeCloseTo(23.2558, 4);
    expect(p.perMWh_net).toBeCloseTo(83.7209, 4);
    expect(p.perGJ_gross).toBeCloseTo(1000 / 45.8, 10);
  });

  it("per US gallon uses the gallon and the density", () => {
    // EPA 40 CFR 98 Subpart C, Table C-1: distillate fuel oil No. 2, 0.138 mmBtu/gal (HHV).
    // A fuel whose HHV and density give exactly that: hhv × density × gal = 0.138 MMBtu.
    const density = 850; // common practice, no source
    const hhv = (0.138 * MJ_per_MMBtu) / (density * L_per_USgal * 1e-3);
    const oil: FuelEnergyContent = { kind: "liquid", hhv_MJ_per_kg: hhv, lhv_MJ_per_kg: hhv / 1.065, density_kg_per_m3: density };
    const perGal = normalisePrice({ amount: 3.0, unit: "USgal" }, oil);
    const perMMBtu = normalisePrice({ amount: 3.0 / 0.138, unit: "MMBtu", energyBasis: "gross" }, oil);
    expect(perGal.perMWh_gross).toBeCloseTo(perMMBtu.perMWh_gross, 9);
    // 3.00 per gal ÷ 0.138 MMBtu/gal = 21.739 per MMBtu = 74.18 per MWh (1 MWh = 3.41214 MMBtu).
    expect(perGal.perMWh_gross).toBeCloseTo((3.0 / 0.138) * 3.412142, 3);
  });

  it("per litre equals per m³ divided by 1000", () => {
    const a = normalisePrice({ amount: 0.9, unit: "L" }, gasOil);
    const b = normalisePrice({ amount: 900, unit: "m3" }, gasOil);
    expect(a.perMWh_net).toBeCloseTo(b.perMWh_net, 10);
    // 0.9 per L at 845 kg/m³ → 0.9/0.845 per kg (arithmetic).
    expect(a.perKg).toBeCloseTo(0.9 / 0.845, 12);
  });

  it("per m³ of gas uses the gas density at the metering reference", () => {
    // Methane, 25 °C combustion / 15 °C metering, real gas: GCV per m³ = 890.58/23.644829/Z
    // = 37.74 MJ/m³ (derived from the ISO 6976:2016 values above).
    const p = normalisePrice({ amount: 0.4, unit: "m3", meteringReferenceC: 15 }, methane);
    const gcv_MJ_per_m3 = 890.58 / 23.644829 / (1 - 0.04452 ** 2);
    expect(p.perMWh_gross).toBeCloseTo((0.4 / gcv_MJ_per_m3) * 3600, 8);
  });

  it("MMBtu and therm quotes land where the definitions put them", () => {
    // 10 per MMBtu = 34.1214 per MWh (1 MWh = 3.412142 MMBtu; common practice, no source).
    const a = normalisePrice({ amount: 10, unit: "MMBtu", energyBasis: "gross" }, methane);
    expect(a.perMWh_gross).toBeCloseTo(34.1214, 3);
    // 1 per therm = 1/0.0293071 = 34.1214 per MWh (1 therm = 29.3071 kWh; common practice, no source).
    const b = normalisePrice({ amount: 1, unit: "therm", energyBasis: "gross" }, methane);
    expect(b.perMWh_gross).toBeCloseTo(34.1214, 3);
    expect(b.perMWh_gross / a.perMWh_gross).toBeCloseTo(MJ_per_MMBtu / MJ_per_therm / 10, 12);
  });

  it("adders are in the quote's unit and add up", () => {
    const p = normalisePrice({ amount: 700, unit: "t", transportAdder: 35, handlingAdder: 15 }, gasOil);
    expect(p.deliveredPerUnit).toBe(750);
    expect(p.perKg).toBeCloseTo(0.75, 12);
    const sum = p.parts.commodity.perMWh_net + p.parts.transport.perMWh_net + p.parts.handling.perMWh_net;
    expect(sum).toBeCloseTo(p.perMWh_net, 10);
    expect(p.parts.transport.perKg).toBeCloseTo(0.035, 12);
  });

  it("any equivalent restatement of a quote gives the same delivered cost", () => {
    // Property: restating a price per kg in every other unit must not change cost per MWh.
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 10, noNaN: true }), (perKg) => {
        const base = normalisePrice({ amount: perKg, unit: "kg" }, gasOil).perMWh_net;
        const restated: PriceQuoteTerms[] = [
          { amount: perKg * 1000, unit: "t" },
          { amount: perKg * 0.845, unit: "L" },
          { amount: perKg * 845 * L_per_USgal * 1e-3, unit: "USgal" },
          { amount: (perKg / 43.0) * 1000, unit: "GJ", energyBasis: "net" },
          { amount: (perKg / 45.8) * 3.6, unit: "kWh", energyBasis: "gross" },
          { amount: (perKg / 45.8) * MJ_per_therm, unit: "therm", energyBasis: "gross" },
        ];
        for (const t of restated) {
          expect(normalisePrice(t, gasOil).perMWh_net / base).toBeCloseTo(1, 10);
        }
      }),
    );
  });
});

describe("quote checks", () => {
  it("energy units need a basis; mass units refuse one", () => {
    expect(priceQuoteIssues({ unit: "MWh" }, { kind: "gas", hasDensity: false })).toEqual([
      { field: "energyBasis", message: expect.stringContaining("gross (HHV) or net (LHV)") },
    ]);
    expect(priceQuoteIssues({ unit: "t", energyBasis: "net" }, { kind: "liquid", hasDensity: true })[0].field).toBe("energyBasis");
    expect(priceQuoteIssues({ unit: "GJ", energyBasis: "net" }, { kind: "solid", hasDensity: false })).toEqual([]);
  });

  it("volume units fit the fuel kind", () => {
    expect(priceQuoteIssues({ unit: "L" }, { kind: "gas", hasDensity: false })[0].field).toBe("unit");
    expect(priceQuoteIssues({ unit: "m3" }, { kind: "gas", hasDensity: false })[0].field).toBe("meteringReferenceC");
    expect(priceQuoteIssues({ unit: "m3", meteringReferenceC: 15 }, { kind: "gas", hasDensity: false })).toEqual([]);
    expect(priceQuoteIssues({ unit: "L" }, { kind: "liquid", hasDensity: false })[0].field).toBe("density");
    expect(priceQuoteIssues({ unit: "USgal" }, { kind: "solid", hasDensity: true })[0].field).toBe("unit");
    expect(priceQuoteIssues({ unit: "t", meteringReferenceC: 15 }, { kind: "liquid", hasDensity: true })[0].field).toBe(
      "meteringReferenceC",
    );
  });

  it("normalisePrice refuses a quote it cannot convert, naming the field", () => {
    expect(() => normalisePrice({ amount: 1, unit: "GJ" }, gasOil)).toThrow(PriceNormalisationError);
    expect(() => normalisePrice({ amount: 1, unit: "L" }, { ...gasOil, density_kg_per_m3: null })).toThrow(/density/);
  });

  it("labels state the basis", () => {
    expect(priceUnitLabel({ unit: "MWh", energyBasis: "gross" })).toBe("MWh gross (HHV)");
    expect(priceUnitLabel({ unit: "m3", meteringReferenceC: 15.56 })).toBe("m³ at 60 °F");
    expect(priceUnitLabel({ unit: "USgal" })).toBe("US gal");
  });
});
