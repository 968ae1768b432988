import { describe, expect, it } from "vitest";
import { resolveFuel } from "../../lib/fuels/resolve";
import { heatingValues } from "../../lib/combustion/heating-values";
import { DRY_AIR, humidAir, lambdaFromFlueO2Dry } from "../../lib/combustion/stoichiometry";
import {
  burntFuel,
  coHeatOfCombustion_J_per_mol,
  heatLossEfficiency,
  unburntCarbon_kg_per_kg,
  UNBURNT_CARBON_HEATING_VALUE_J_per_kg,
  type EfficiencyConditions,
} from "../../lib/plant/efficiency";
import { siegertClassOf, siegertLossPercent } from "../../lib/plant/siegert";
import { checkOperatingPoint } from "../../lib/plant/performance";
import { InputError } from "../../lib/errors";
import type { OperatingPoint } from "../../lib/schemas/plant";
import type { FuelDefinition } from "../../lib/schemas/fuel";

// Typical pipeline natural gas (H-gas), mole fractions (common practice, no source).
const NATURAL_GAS: FuelDefinition = { composition: { CH4: 0.93, C2H6: 0.04, C3H8: 0.01, CO2: 0.01, N2: 0.01 } };
// Heating gas oil by ultimate analysis with a net heating value of 42.9 MJ/kg (typical EN 590 values, value from memory).
const GAS_OIL: FuelDefinition = {
  ultimate: { C: 0.8655, H: 0.133, N: 0.0005, S: 0.001, O: 0, moisture: 0, ash: 0 },
  kind: "liquid",
  lhv_MJ_per_kg: 42.9,
};
// Wood pellets, 8 % moisture as received (typical values, value from memory).
const PELLETS: FuelDefinition = {
  ultimate: { C: 0.4646, H: 0.0561, O: 0.3911, N: 0.003, S: 0.0002, moisture: 0.08, ash: 0.005 },
  kind: "solid",
  lhv_MJ_per_kg: 17.0,
};
const H2_BLEND: FuelDefinition = {
  blend: [
    { fuel: { composition: { CH4: 1 } }, share: 0.8 },
    { fuel: { compound: "H2", phase: "gas" }, share: 0.2 },
  ],
  basis: "volume",
};

function run(def: FuelDefinition, o2: number, c: Partial<EfficiencyConditions> & { stackTemperatureC: number }) {
  const fuel = resolveFuel(def);
  const hv = heatingValues(fuel, 25);
  const oxidizer = c.oxidizer ?? humidAir(0.6, 15);
  const burnt = burntFuel(fuel, unburntCarbon_kg_per_kg(fuel, c.unburntCarbonInAshPercent ?? 0));
  const lambda = c.lambda ?? lambdaFromFlueO2Dry(burnt, o2, oxidizer);
  const r = heatLossEfficiency(fuel, hv, {
    lambda,
    oxidizer,
    combustionAirC: c.combustionAirC ?? 20,
    stackTemperatureC: c.stackTemperatureC,
    radiationLossPercent: c.radiationLossPercent ?? 1,
    coDryPpm: c.coDryPpm ?? 0,
    unburntCarbonInAshPercent: c.unburntCarbonInAshPercent ?? 0,
  });
  return { fuel, hv, r };
}

describe("heat-loss efficiency: energy conservation", () => {
  it("the loss account equals the direct balance of absolute enthalpies in and out, with every term active", () => {
    // A wet solid fuel with ash, unburnt carbon and CO, preheated air, stack below the dew point.
    const { r } = run(PELLETS, 6, {
      stackTemperatureC: 40,
      combustionAirC: 60,
      coDryPpm: 300,
      unburntCarbonInAshPercent: 20,
      radiationLossPercent: 1.5,
    });
    expect(r.condensed_mol_per_kg).toBeGreaterThan(0);
    expect(r.terms_kJ_per_kg.unburntCO).toBeGreaterThan(0);
    expect(r.terms_kJ_per_kg.unburntCarbon).toBeGreaterThan(0);
    // Independent path: formation + sensible enthalpies of fuel and air in, of flue gas, condensate,
    // CO and residue carbon out. Equal to rounding (1e-9 of the input).
    expect(Math.abs(r.balanceResidual_kJ_per_kg)).toBeLessThan(1e-9 * r.gross.input_kJ_per_kg);
    expect(r.gross.useful_kJ_per_kg).toBeCloseTo(r.net.useful_kJ_per_kg, 6);
  });
});

describe("heat-loss efficiency against published figures", () => {
  // US DOE Office of Industrial Technologies (later Advanced Manufacturing Office), Energy Tips –
  // Steam, Steam Tip Sheet #4 "Improve Your Boiler's Combustion Efficiency", table "Combustion
  // Efficiency for Natural Gas": combustion efficiency (gross basis; "assumes complete combustion with
  // no water vapor in the combustion air") by excess air and flue-gas temperature less combustion-air
  // temperature (°F). Its worked example reads 78.2 % at 44.9 % excess air and 400 °F, 83.1 % at 9.5 % and 300 °F.
  const DT_F = [200, 300, 400, 500, 600];
  const TABLE: [number, number[]][] = [
    [9.5, [85.4, 83.1, 80.8, 78.4, 76.0]],
    [15.0, [85.2, 82.8, 80.4, 77.9, 75.4]],
    [28.1, [84.7, 82.1, 79.5, 76.7, 74.0]],
    [44.9, [84.1, 81.2, 78.2, 75.2, 72.1]],
    [81.6, [82.8, 79.3, 75.6, 71.9, 68.2]],
  ];
  it("natural gas: gross efficiency without radiation within 1.0 point of every cell of DOE Steam Tip Sheet #4", () => {
    // The tip sheet states neither its gas composition nor its reference temperature; our pipeline gas
    // and a 25 °C reference (air at 25 °C) leave up to about 0.8 points (tolerance: common practice, no source).
    const fuel = resolveFuel(NATURAL_GAS);
    const hv = heatingValues(fuel, 25);
    for (const [excessAir, row] of TABLE) {
      row.forEach((published, i) => {
        const r = heatLossEfficiency(fuel, hv, {
          lambda: 1 + excessAir / 100,
          oxidizer: DRY_AIR,
          combustionAirC: 25,
          stackTemperatureC: 25 + DT_F[i] / 1.8,
          radiationLossPercent: 0,
        });
        expect(Math.abs(100 * r.gross.efficiency - published), `${excessAir} % excess air, ΔT ${DT_F[i]} °F`).toBeLessThan(1.0);
      });
    }
  });

  it("CO is charged at 283.0 kJ/mol, its heat of combustion at 25 °C", () => {
    // ΔfH°(CO2, g) −393.52 and ΔfH°(CO, g) −110.53 kJ/mol: NIST-JANAF Thermochemical Tables, 4th ed. (Chase 1998).
    expect(coHeatOfCombustion_J_per_mol() / 1000).toBeCloseTo(393.52 - 110.53, 1);
  });

  it("unburnt carbon is charged at 14 500 Btu/lbm = 33.73 MJ/kg", () => {
    // ASME PTC 4 heating value of carbon in residue, 14 500 Btu/lbm (value from memory); 1 Btu/lbm = 2.326 kJ/kg exactly (NIST SP 811 (2008) App. B.8).
    expect(UNBURNT_CARBON_HEATING_VALUE_J_per_kg / 1e6).toBeCloseTo(14_500 * 2.326e-3, 9);
  });

  it("latent heat of the fuel water: 10.5–11.5 % of net input for natural gas, 5.5–7 % for gas oil", () => {
    // HHV/LHV of methane 890.6/802.7 kJ/mol at 25 °C (ISO 6976:2016 Table 3, value from memory) → 10.9 %;
    // heating gas oil HHV ≈ 45.5, LHV ≈ 42.9 MJ/kg (typical EN 590 values, value from memory) → about 6 %.
    const gas = run(NATURAL_GAS, 3, { stackTemperatureC: 150 });
    const oil = run(GAS_OIL, 3, { stackTemperatureC: 150 });
    const pc = (x: typeof gas) => (100 * x.r.terms_kJ_per_kg.latent) / x.r.net.input_kJ_per_kg;
    expect(pc(gas)).toBeGreaterThan(10.5);
    expect(pc(gas)).toBeLessThan(11.5);
    expect(pc(oil)).toBeGreaterThan(5.5);
    expect(pc(oil)).toBeLessThan(7.0);
  });
});

describe("Siegert formula (German 1. BImSchV, Annex III)", () => {
  // qA = (t_flue − t_air)·(A2/(21 − O2) + B), % of net input; natural gas A2 0.66, B 0.009; fuel oil
  // A2 0.68, B 0.007 (1. BImSchV Annex III, value from memory).
  it("fuel oil at 180 °C flue, 20 °C air, 4 % O2: 7.52 %", () => {
    // Commonly printed example of the formula with the oil constants: 160 × (0.68/17 + 0.007) = 7.52 % (value from memory).
    expect(siegertLossPercent("fuel-oil", 180, 20, 4)).toBeCloseTo(7.52, 2);
  });

  // The figure set beside Siegert is the regulation's definition of the flue-gas loss (sensible heat
  // of dry and wet flue gas from air to flue temperature, net basis, no latent heat). The formula is a
  // rule of thumb fitted to typical fuels: within 0.3 points or 3 % of the loss, whichever is larger
  // (common practice, no source).
  const grid: [number, number][] = [
    [120, 2],
    [200, 4],
    [250, 6],
  ];
  for (const [name, def, cls] of [
    ["natural gas", NATURAL_GAS, "natural-gas"],
    ["gas oil", GAS_OIL, "fuel-oil"],
  ] as const) {
    it(`${name}: the regulation-definition loss is within the rule of thumb's margin at ${grid.map(([t, o]) => `${t} °C/${o} % O2`).join(", ")}`, () => {
      for (const [t, o2] of grid) {
        const { fuel, r } = run(def, o2, { stackTemperatureC: t, combustionAirC: 20, oxidizer: DRY_AIR });
        expect(siegertClassOf(fuel)).toBe(cls);
        const s = siegertLossPercent(cls, t, 20, o2);
        expect(Math.abs(r.siegertDefinitionLossPercent - s)).toBeLessThan(Math.max(0.3, 0.03 * s));
      }
    });
  }
  it("does not apply its gas constants to hydrogen blends", () => {
    expect(siegertClassOf(resolveFuel(H2_BLEND))).toBeNull();
  });
});

describe("condensing: the flue gas leaves saturated at the stack temperature", () => {
  it("water vapour leaving a 45 °C stack sits at the saturation pressure of water at 45 °C, 9.59 kPa", () => {
    // p_sat(45 °C) = 9.595 kPa (IAPWS-IF97 saturation line; steam tables, value from memory).
    const { r } = run(NATURAL_GAS, 3, { stackTemperatureC: 45, combustionAirC: 20 });
    expect(r.condensingTemperatureC).toBe(45);
    const vapour = r.flue.mol_per_kg.H2O - r.condensed_mol_per_kg;
    expect((101.325 * vapour) / r.wetLeaving_mol_per_kg).toBeCloseTo(9.595, 2);
  });

  it("natural gas at 40 °C: net-basis efficiency above 100 %, gross below 100 %", () => {
    const { r } = run(NATURAL_GAS, 3, { stackTemperatureC: 40, combustionAirC: 20 });
    expect(r.net.efficiency).toBeGreaterThan(1.0);
    expect(r.gross.efficiency).toBeLessThan(1.0);
  });

  it("no water condenses above the dew point", () => {
    const hot = run(NATURAL_GAS, 3, { stackTemperatureC: 120 }).r;
    expect(hot.condensed_mol_per_kg).toBe(0);
    expect(hot.condensingTemperatureC).toBeNull();
  });

  const op = (o: Partial<OperatingPoint>): OperatingPoint => ({
    stackTemperatureC: 45,
    flueO2DryPercent: 3,
    combustionAirC: 20,
    radiationLossPercent: 1,
    condensing: true,
    returnWaterC: 30,
    condensingApproachK: 5,
    flueCODryPpm: 0,
    unburntCarbonInAshPercent: 0,
    ambientAir: { temperatureC: 15, relativeHumidityPercent: 60 },
    ...o,
  });
  it("a condensing unit's stack below return water + approach is an input error naming stackTemperatureC", () => {
    expect(() => checkOperatingPoint(op({ stackTemperatureC: 34 }))).toThrow(InputError);
    try {
      checkOperatingPoint(op({ stackTemperatureC: 34 }));
    } catch (e) {
      expect((e as InputError).field).toBe("stackTemperatureC");
      expect((e as InputError).detail).toMatch(/≥ 35 °C/);
    }
    expect(() => checkOperatingPoint(op({ stackTemperatureC: 35 }))).not.toThrow();
    expect(() => checkOperatingPoint(op({ stackTemperatureC: 34, condensing: false }))).not.toThrow();
  });
});

describe("unburnt losses", () => {
  it("1000 ppm CO in the dry flue gas costs 1000 ppm of the dry flue-gas volume at 12.63 MJ/m³", () => {
    // Gross calorific value of CO on a volume basis, 0 °C / 101.325 kPa: 12.63 MJ/m³ (ISO 6976:2016
    // Table 5, value from memory); the ideal-gas figure from 283.0 kJ/mol ÷ 22.414 L/mol is 12.626 MJ/m³.
    const clean = run(PELLETS, 6, { stackTemperatureC: 160 }).r;
    const co = run(PELLETS, 6, { stackTemperatureC: 160, coDryPpm: 1000 }).r;
    const dry_m3_per_kg = co.flue.dry_mol_per_kg * 0.022414; // molar volume of an ideal gas at 0 °C, 101.325 kPa (CODATA)
    expect(co.terms_kJ_per_kg.unburntCO / 1000 / (1e-3 * dry_m3_per_kg)).toBeCloseTo(12.63, 1);
    expect(co.net.efficiency).toBeLessThan(clean.net.efficiency);
  });

  it("unburnt carbon beyond the fuel's carbon is an input error naming the field", () => {
    const coal = resolveFuel({
      ultimate: { C: 0.05, H: 0.01, O: 0.04, N: 0, S: 0, moisture: 0.1, ash: 0.8 },
      kind: "solid",
      lhv_MJ_per_kg: 1.5,
    });
    expect(() => unburntCarbon_kg_per_kg(coal, 20)).toThrow(/unburntCarbonInAshPercent: 20 % carbon in the residue/);
  });

  it("unburnt carbon needs ash: a gas has none", () => {
    expect(unburntCarbon_kg_per_kg(resolveFuel(NATURAL_GAS), 20)).toBe(0);
  });
});

describe("guards", () => {
  it("refuses heating values at another reference than the balance's 25 °C", () => {
    const fuel = resolveFuel(NATURAL_GAS);
    expect(() =>
      heatLossEfficiency(fuel, heatingValues(fuel, 15), {
        lambda: 1.15,
        oxidizer: DRY_AIR,
        combustionAirC: 20,
        stackTemperatureC: 150,
        radiationLossPercent: 1,
      }),
    ).toThrow(/25 °C/);
  });
});
