/**
 * Ranges on a scenario's stack temperature: each draw runs the heat-loss account again at the
 * drawn temperature (lib/plant/performance.ts balanceAtStack), checked against a hand calculation
 * of the stack loss at two temperatures and against the plant model at the drawn temperature.
 */
import { describe, expect, it } from "vitest";
import { studySchema, type Study } from "../../../lib/schemas/study";
import { resolveFuel } from "../../../lib/fuels/resolve";
import { heatingValues } from "../../../lib/combustion/heating-values";
import { heatLossEfficiency } from "../../../lib/plant/efficiency";
import { createEvaluationCaches } from "../../../lib/study/evaluate";
import { efficiencyPointsPerK, studyPathSetup, uncertaintyRanking } from "../../../lib/study/uncertainty";
import { twentyScenarioStudy } from "../../bench/study.bench";

describe("stack loss by hand at two temperatures", () => {
  // Methane with λ = 1.2 in dry air of 21 % O2 / 79 % N2 at 25 °C. Per mol CH4 the flue gas is
  // 1 CO2, 2 H2O, 0.4 O2 and 2.4 · 79/21 = 9.028571 N2 (complete combustion, no condensation: the
  // water dew point is about 57 °C). Its sensible heat above 25 °C is Σ n (H − H°298.15) with
  // H − H°298.15 from NIST-JANAF Thermochemical Tables, 4th ed. (Chase 1998), at 400 K and 500 K
  // (values from memory of the tables), kJ/mol:
  //   CO2 4.003 / 8.305, H2O(g) 3.452 / 6.925, O2 3.027 / 6.086, N2 2.971 / 5.911.
  const n = { CO2: 1, H2O: 2, O2: 0.4, N2: (2.4 * 79) / 21 };
  const dH400 = n.CO2 * 4.003 + n.H2O * 3.452 + n.O2 * 3.027 + n.N2 * 2.971; // 38.94 kJ per mol CH4
  const dH500 = n.CO2 * 8.305 + n.H2O * 6.925 + n.O2 * 6.086 + n.N2 * 5.911; // 77.96 kJ per mol CH4
  const M_CH4 = 16.04246; // g/mol, IUPAC 2005 atomic weights as ISO 6976:2016 uses them
  const fuel = resolveFuel({ composition: { CH4: 1 } });
  const hv = heatingValues(fuel, 25);
  const lossAt = (stackTemperatureC: number) => {
    const r = heatLossEfficiency(fuel, hv, {
      lambda: 1.2,
      oxidizer: { O2: 0.21, N2: 0.79 },
      combustionAirC: 25,
      stackTemperatureC,
      radiationLossPercent: 0,
    });
    return { kJ_per_kg: r.terms_kJ_per_kg.dryFlueGas + r.terms_kJ_per_kg.moistureSensible, eta: r.net.efficiency };
  };

  it("the loss account's sensible stack loss at 400 K and 500 K matches the hand sum within 0.3 %", () => {
    const at400 = lossAt(400 - 273.15);
    const at500 = lossAt(500 - 273.15);
    // Tolerance: NASA polynomials against the JANAF table, 0.1–0.2 % in this range.
    expect(Math.abs(at400.kJ_per_kg / ((dH400 * 1000) / M_CH4) - 1)).toBeLessThan(0.003);
    expect(Math.abs(at500.kJ_per_kg / ((dH500 * 1000) / M_CH4) - 1)).toBeLessThan(0.003);
    // The net efficiency falls by the difference of the two losses over the LHV (no other term moves).
    const dEta = at400.eta - at500.eta;
    expect(Math.abs(dEta / (((dH500 - dH400) * 1000) / M_CH4 / (hv.lhv_MJ_per_kg * 1000)) - 1)).toBeLessThan(0.003);
  });
});

const zero = { distribution: "triangular" as const, low: 0, mode: 0, high: 0 };
const fixed = (v: number) => ({ distribution: "triangular" as const, low: v, mode: v, high: v });
const ECONOMISER = "natural gas, economiser upgrade"; // stack 110 °C in the benchmark study
const CONDENSING = "H2 20 %, condensing retrofit"; // stack 55 °C, return water 40 °C, approach 5 K

function withRanges(study: Study, extra: Record<string, unknown>, stackOverride?: number): Study {
  const s = structuredClone(study);
  if (stackOverride !== undefined) {
    const sc = s.scenarios.find((x) => x.name === ECONOMISER)!;
    sc.overrides = { ...sc.overrides, stackTemperatureC: stackOverride };
  }
  s.uncertainty = studySchema.shape.uncertainty.parse({
    fuelPriceDefault: zero,
    carbonPrice: zero,
    capex: zero,
    efficiencyPoints: zero,
    operatingHours: zero,
    ...extra,
  });
  return s;
}

describe("a drawn stack temperature runs the loss account again", () => {
  const study = studySchema.parse(twentyScenarioStudy());

  it("a stack drawn 40 K above the stated 110 °C gives exactly the figures of the study evaluated at 150 °C", () => {
    const drawn = uncertaintyRanking(withRanges(study, { stackTemperatureByScenario: { [ECONOMISER]: fixed(40) } }), {
      draws: 100,
      seed: 1,
      metric: "cost-per-useful-MWh",
    });
    const at150 = uncertaintyRanking(withRanges(study, { stackTemperatureByScenario: { [ECONOMISER]: fixed(0) } }, 150), {
      draws: 100,
      seed: 1,
      metric: "cost-per-useful-MWh",
    });
    const a = drawn.scenarios.find((s) => s.name === ECONOMISER)!;
    const b = at150.scenarios.find((s) => s.name === ECONOMISER)!;
    expect(a.costPerUsefulMWh!.p50).toBe(b.costPerUsefulMWh!.p50);
    expect(a.npv!.p50).toBe(b.npv!.p50);
    expect(drawn.inputs.find((i) => i.key === `stack:${ECONOMISER}`)?.unit).toBe("K");
  });

  it("by default only retrofits (a stated stack) get a stack range, as wide as the sensitivity's points through the loss account", () => {
    const s = withRanges(study, { efficiencyPoints: null });
    const r = uncertaintyRanking(s, { draws: 200, seed: 2 });
    const stacks = r.inputs.filter((i) => i.kind === "stack").map((i) => i.key);
    expect(stacks.sort()).toEqual([`stack:${CONDENSING}`, `stack:${ECONOMISER}`].sort());
    // Their efficiency-points range gives way to the stack; the others keep it.
    expect(r.inputs.some((i) => i.key === `efficiency:${ECONOMISER}`)).toBe(false);
    expect(r.inputs.some((i) => i.key === "efficiency:biomethane")).toBe(true);
    const setup = studyPathSetup(s, createEvaluationCaches());
    const eco = setup.scenarios.find((x) => x.scenario.name === ECONOMISER)!;
    const slope = Math.abs(efficiencyPointsPerK(eco));
    // Common practice, no source: about 1 point of efficiency per 20 K of stack temperature for natural gas.
    expect(slope).toBeGreaterThan(0.03);
    expect(slope).toBeLessThan(0.07);
    const input = r.inputs.find((i) => i.key === `stack:${ECONOMISER}`)!;
    expect(input.spec).toEqual({ distribution: "triangular", low: -2 / slope, mode: 0, high: 2 / slope });
  });

  it("a condensing retrofit's drawn stack below return water + approach is held at that floor and said so", () => {
    const r = uncertaintyRanking(withRanges(study, { stackTemperatureByScenario: { [CONDENSING]: fixed(-30) } }), { draws: 100, seed: 3 });
    expect(r.notes.some((n) => n.startsWith("100 sampled stack temperatures"))).toBe(true);
  });
});
