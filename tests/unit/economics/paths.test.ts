import { describe, expect, it } from "vitest";
import {
  abatementCostFromPaths,
  discountedPaybackFromFlows,
  discountRateInTerms,
  pathFactors,
  pathScenarioState,
  pathValues,
  switchingCashFlows,
  switchingNpvFromPaths,
  type PathScenario,
} from "../../../lib/economics/paths";
import { InputError } from "../../../lib/errors";

describe("price paths", () => {
  it("escalation gives level·(1+g)^(t−1)", () => {
    // Hand-computed: 80 at 5 % a year → 80, 84, 88.2.
    expect([...pathValues({ kind: "escalation", percentPerYear: 5 }, 80, 3, "p")].map((v) => +v.toFixed(10))).toEqual([80, 84, 88.2]);
  });

  it("linear interpolates between points and holds the ends; stepped holds each value until the next point", () => {
    const points = [
      { year: 2, value: 100 },
      { year: 6, value: 140 },
    ];
    // Hand-computed: year 1 holds 100; years 3–5 at +10 a year; years 7–8 hold 140.
    expect([...pathValues({ kind: "linear", points }, 0, 8, "p")]).toEqual([100, 100, 110, 120, 130, 140, 140, 140]);
    expect([...pathValues({ kind: "stepped", points }, 0, 8, "p")]).toEqual([100, 100, 100, 100, 100, 140, 140, 140]);
  });

  it("a table needs one value per year from year 1 and names the field when a year is missing", () => {
    expect([
      ...pathValues(
        {
          kind: "table",
          points: [
            { year: 1, value: 1 },
            { year: 2, value: 1.5 },
          ],
        },
        0,
        3,
        "p",
      ),
    ]).toEqual([1, 1.5, 1.5]);
    const bad = () =>
      pathValues(
        {
          kind: "table",
          points: [
            { year: 1, value: 1 },
            { year: 3, value: 2 },
          ],
        },
        0,
        3,
        "paths.carbon",
      );
    expect(bad).toThrow(InputError);
    expect(bad).toThrow(/year 2 is missing/);
    try {
      bad();
    } catch (e) {
      expect((e as InputError).field).toBe("paths.carbon.points");
    }
  });

  it("converts a discount rate by the Fisher relation (1 + n) = (1 + r)(1 + i)", () => {
    // Hand-computed: real 5 %, inflation 2 % → nominal 1.05·1.02 − 1 = 7.1 %; and back.
    expect(discountRateInTerms(5, "real", "nominal", 2)).toBeCloseTo(7.1, 12);
    expect(discountRateInTerms(7.1, "nominal", "real", 2)).toBeCloseTo(5, 12);
  });
});

describe("switching figures year by year", () => {
  const base: PathScenario = {
    priceParts: [{ source: 0, perMWh_net: 50 }],
    co2Fossil_kg_per_GJ_net: 56,
    upstreamCo2e_kg_per_GJ_net: 0,
    includeUpstream: false,
    capex: 0,
    fixedOpexChange: 0,
  };
  const cand: PathScenario = {
    priceParts: [{ source: 1, perMWh_net: 40 }],
    co2Fossil_kg_per_GJ_net: 0,
    upstreamCo2e_kg_per_GJ_net: 0,
    includeUpstream: false,
    capex: 20_000,
    fixedOpexChange: 0,
  };

  it("NPV, cash flows and discounted payback of a hand-computed case", () => {
    // 1,000 MWh a year of fuel either way; the candidate's price path rises 1, 1.25, 1.5; no carbon; 10 %.
    // Flows: 1000·(50 − 40·[1, 1.25, 1.5]) = 10,000, 0, −10,000;
    // NPV = −20,000 + 10,000/1.1 − 10,000/1.1³ = −18,422.2389 (hand-computed).
    const f = pathFactors(
      { terms: "real", discountRatePercent: 10, horizonYears: 3 },
      [Float64Array.from([1, 1, 1]), Float64Array.from([1, 1.25, 1.5])],
      new Float64Array(3),
    );
    const b = pathScenarioState(base, f, 900, 0.9, null);
    const c = pathScenarioState(cand, f, 900, 0.9, null);
    expect(switchingNpvFromPaths(b, c, f)).toBeCloseTo(-20_000 + 10_000 / 1.1 - 10_000 / 1.331, 6);
    const flows = switchingCashFlows(base, cand, f, 1000, 1000);
    expect([...flows].map((v) => Math.round(v))).toEqual([10_000, 0, -10_000]);
    expect(discountedPaybackFromFlows(20_000, flows, f.discount)).toBeNull();
    // A capex of 5,000 is repaid within year 1: 5,000 / (10,000/1.1) = 0.55 years (hand-computed).
    expect(discountedPaybackFromFlows(5_000, flows, f.discount)).toBeCloseTo(0.55, 12);
  });

  it("abatement cost: present cost without carbon price over present tonnes avoided", () => {
    // 1,000 MWh = 3,600 GJ × 56 kg/GJ = 201.6 t a year avoided; flat prices; 0 % discount, 2 years:
    // present cost = 20,000 − 2·10,000 = 0 → 0 per t; at 10,000 capex: −10,000 / 403.2 t = −24.80 per t (hand-computed).
    const f = pathFactors(
      { terms: "real", discountRatePercent: 0, horizonYears: 2 },
      [Float64Array.from([1, 1]), Float64Array.from([1, 1])],
      Float64Array.from([80, 80]),
    );
    const b = pathScenarioState(base, f, 1000, 1, null);
    expect(abatementCostFromPaths(b, pathScenarioState(cand, f, 1000, 1, null), f)).toBeCloseTo(0, 9);
    expect(abatementCostFromPaths(b, pathScenarioState({ ...cand, capex: 10_000 }, f, 1000, 1, null), f)).toBeCloseTo(-10_000 / 403.2, 9);
    // With a carbon price of 80 per t the NPV gains 2 × 201.6 × 80 = 32,256.
    expect(switchingNpvFromPaths(b, pathScenarioState(cand, f, 1000, 1, null), f)).toBeCloseTo(32_256, 6);
  });

  it("gives the same NPV in real and in nominal terms when paths and rate are converted consistently", () => {
    // Fisher: nominal_t = real_t·(1+i)^t and (1 + n) = (1 + r)(1 + i) leave every present value unchanged.
    const i = 0.03,
      years = 10;
    const realIdx = Float64Array.from({ length: years }, (_, t) => 1 + 0.02 * t);
    const realCarbon = Float64Array.from({ length: years }, (_, t) => 60 + 5 * t);
    const toNominal = (v: Float64Array) => v.map((x, t) => x * (1 + i) ** (t + 1));
    const real = pathFactors(
      { terms: "real", discountRatePercent: 6, horizonYears: years },
      [Float64Array.from({ length: years }, () => 1), realIdx],
      realCarbon,
    );
    const nomRate = discountRateInTerms(6, "real", "nominal", 3);
    const nominal = pathFactors(
      { terms: "nominal", discountRatePercent: nomRate, horizonYears: years },
      [toNominal(Float64Array.from({ length: years }, () => 1)), toNominal(realIdx)],
      toNominal(realCarbon),
    );
    const npv = (f: typeof real) =>
      switchingNpvFromPaths(pathScenarioState(base, f, 900, 0.9, null), pathScenarioState(cand, f, 900, 0.92, null), f);
    expect(npv(nominal)).toBeCloseTo(npv(real), 6);
  });
});
