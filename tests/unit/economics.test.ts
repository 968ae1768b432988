import { describe, expect, it } from "vitest";
import {
  capitalRecoveryFactor,
  cashFlowInYear,
  discountedPaybackYears,
  netPresentValue,
  presentValueFactor,
  simplePaybackYears,
} from "../../lib/economics/finance";
import { breakEven, compare, scenarioCosts, type CostInputs, type FinanceAssumptions } from "../../lib/economics/costs";
import { metricValue, tornado } from "../../lib/economics/sensitivity";

describe("discounting, against a hand-worked example", () => {
  // Hand-worked example (common practice, no source; arithmetic written out here):
  // capex 100 000 at t = 0, saving 25 000 at the end of each of 10 years, 8 % discount rate.
  //   1.08^10 = 2.158 924 997 → 1.08^−10 = 0.463 193 488
  //   annuity factor (1 − 0.463 193 488) / 0.08 = 6.710 081 40
  //   NPV = −100 000 + 25 000 × 6.710 081 40 = 67 752.03
  //   simple payback = 100 000 / 25 000 = 4.0 years
  //   discounted cash flows: 23 148.15, 21 433.47, 19 845.81, 18 375.75, 17 014.58, 15 754.24 …
  //   cumulative after 5 years −182.24 → payback 5 + 182.24 / 15 754.24 = 5.0116 years
  //   capital recovery factor 1 / 6.710 081 40 = 0.149 029 49
  const profile = { capex: 100_000, escalatingAnnual: 25_000, constantAnnual: 0, discountRatePercent: 8, years: 10, escalationPercent: 0 };

  it("annuity factor and NPV", () => {
    expect(presentValueFactor(8, 10)).toBeCloseTo(6.7100814, 6);
    expect(netPresentValue(profile)).toBeCloseTo(67_752.03, 1);
  });
  it("simple and discounted payback", () => {
    expect(simplePaybackYears(100_000, 25_000)).toBe(4);
    expect(discountedPaybackYears(profile)!).toBeCloseTo(5.0116, 3);
    expect(simplePaybackYears(100_000, -5)).toBeNull();
    expect(discountedPaybackYears({ ...profile, escalatingAnnual: 10_000 })).toBeNull(); // 10 000 × 6.71 < 100 000
  });
  it("capital recovery factor", () => {
    expect(capitalRecoveryFactor(8, 10)).toBeCloseTo(0.14902949, 7);
  });

  it("escalating savings, year by year", () => {
    // Hand-worked (common practice, no source): capex 50 000; saving 10 000 in year 1 escalating 3 %/yr, 5 % discount, 3 years.
    //   flows 10 000, 10 300, 10 609; PV 9 523.8095 + 9 342.4036 + 9 164.4531 = 28 030.6662; NPV = −21 969.3338
    const p = { capex: 50_000, escalatingAnnual: 10_000, constantAnnual: 0, discountRatePercent: 5, years: 3, escalationPercent: 3 };
    expect(cashFlowInYear(p, 3)).toBeCloseTo(10_609, 6);
    expect(netPresentValue(p)).toBeCloseTo(-21_969.3338, 3);
    // r = g limit: N/(1+r)
    expect(presentValueFactor(4, 5, 4)).toBeCloseTo(5 / 1.04, 10);
  });
});

const fin: FinanceAssumptions = { discountRatePercent: 8, horizonYears: 10, priceEscalationPercent: 0 };

// Natural-gas-like baseline; numbers chosen for hand arithmetic (invented, not market data).
const gas: CostInputs = {
  usefulHeat_MWh: 10_000,
  efficiencyNet: 0.9,
  grossOverNet: 1.109,
  deliveredPrice_per_MWh_net: 40,
  co2Fossil_kg_per_GJ_net: 56.1, // IPCC 2006 Vol. 2 Table 1.4, natural gas 56 100 kg/TJ (value from memory, high confidence)
  co2Biogenic_kg_per_GJ_net: 0,
  upstreamCo2e_kg_per_GJ_net: 0,
  carbonPrice_per_t: 80,
  includeUpstream: false,
  capex: 0,
  fixedOpexChange: 0,
};
const biomethane: CostInputs = { ...gas, deliveredPrice_per_MWh_net: 90, co2Fossil_kg_per_GJ_net: 0, co2Biogenic_kg_per_GJ_net: 56.1 };

describe("cost of useful heat", () => {
  it("hand-worked annual figures", () => {
    // 10 000 MWh useful / 0.9 = 11 111.11 MWh fuel (net) = 40 000 GJ; fuel 444 444.44; CO2 40 000 × 56.1 kg = 2 244 t;
    // carbon 2 244 × 80 = 179 520; energy cost 623 964.44 → 62.396 per useful MWh; 56.1 / 0.9 = 62.333 g CO2 per useful MJ.
    const c = scenarioCosts(gas);
    expect(c.fuelInput_MWh_net).toBeCloseTo(11_111.111, 2);
    expect(c.annualFuelCost).toBeCloseTo(444_444.44, 1);
    expect(c.annualCo2Fossil_t).toBeCloseTo(2244, 6);
    expect(c.annualCarbonCost).toBeCloseTo(179_520, 4);
    expect(c.costPerUsefulMWh.total).toBeCloseTo(62.3964, 3);
    expect(c.costPerUsefulGJ.total).toBeCloseTo(62.3964 / 3.6, 3);
    expect(c.co2PerUsefulMJ_g.fossil).toBeCloseTo(62.333, 3);
    expect(c.efficiencyGross).toBeCloseTo(0.9 / 1.109, 10);
    expect(c.fuelInput_MWh_gross).toBeCloseTo(11_111.111 * 1.109, 1);
  });

  it("abatement cost and break-even carbon price (hand-worked)", () => {
    // Extra fuel cost (90 − 40) × 11 111.11 = 555 555.56 per year; 2 244 t avoided per year;
    // no capex, no escalation → abatement cost = 555 555.56 / 2 244 = 247.574 per t, and the
    // carbon price that equalises cost per useful MWh is the same number.
    const cmp = compare(gas, biomethane, fin);
    expect(cmp.annualCo2Avoided_t).toBeCloseTo(2244, 6);
    expect(cmp.abatementCost_per_t!).toBeCloseTo(247.574, 2);
    expect(cmp.breakEven.carbonPriceOperating_per_t!).toBeCloseTo(247.574, 2);
    expect(cmp.breakEven.carbonPriceNpv_per_t!).toBeCloseTo(247.574, 2);
    // Break-even candidate price: p / 0.9 = 40 / 0.9 + 80 × 0.2244 t/MWh useful → p = 40 + 16.157 = 56.157
    expect(cmp.breakEven.fuelPriceOperating_per_MWh_net!).toBeCloseTo(56.1568, 3);
    expect(cmp.co2ChangePercent).toBeCloseTo(-100, 10);
    expect(cmp.simplePaybackYears).toBeNull(); // it costs more at this carbon price
  });

  it("capex enters NPV, payback and the NPV break-even", () => {
    const cand = { ...biomethane, deliveredPrice_per_MWh_net: 45, capex: 200_000 };
    const cmp = compare(gas, cand, fin);
    // Year-1 saving: (40 − 45) × 11 111.11 + 179 520 = 123 964.44; payback 200 000 / 123 964.44 = 1.6134 years
    expect(cmp.annualNetSaving).toBeCloseTo(123_964.44, 1);
    expect(cmp.simplePaybackYears!).toBeCloseTo(1.61337, 4);
    expect(cmp.npv).toBeCloseTo(-200_000 + 123_964.444 * 6.7100814, 0);
    // At the NPV break-even fuel price the NPV is zero.
    const p = cmp.breakEven.fuelPriceNpv_per_MWh_net!;
    expect(compare(gas, { ...cand, deliveredPrice_per_MWh_net: p }, fin).npv).toBeCloseTo(0, 4);
    const c = breakEven(gas, cand, fin).carbonPriceNpv_per_t!;
    expect(compare({ ...gas, carbonPrice_per_t: c }, { ...cand, carbonPrice_per_t: c }, fin).npv).toBeCloseTo(0, 4);
  });

  it("break-even is null when CO2 does not differ", () => {
    expect(breakEven(gas, { ...gas, deliveredPrice_per_MWh_net: 41 }, fin).carbonPriceOperating_per_t).toBeNull();
  });
});

describe("tornado", () => {
  it("rows sorted by swing; the candidate price moves cost per useful MWh by ±20 % of 45/0.9", () => {
    const cand = { ...biomethane, deliveredPrice_per_MWh_net: 45, capex: 200_000 };
    const t = tornado("cost-per-useful-MWh", gas, cand, fin);
    expect(t.rows[0].parameter).toBe("candidate-fuel-price");
    expect(t.rows[0].swing).toBeCloseTo((2 * 0.2 * 45) / 0.9, 8);
    for (let i = 1; i < t.rows.length; i++) expect(t.rows[i - 1].swing).toBeGreaterThanOrEqual(t.rows[i].swing);
    // The candidate's cost does not depend on the baseline's price, capex or the baseline's efficiency,
    // and biomethane's CO2 is biogenic, so the carbon price cannot move it either: listed, not drawn.
    expect(t.rows.map((r) => r.parameter)).not.toContain("baseline-fuel-price");
    expect(t.noEffect.map((r) => r.parameter).sort()).toEqual(["baseline-efficiency", "baseline-fuel-price", "capex", "carbon-price"]);
    expect(t.baseValue).toBeCloseTo(metricValue("cost-per-useful-MWh", gas, cand, fin)!, 12);
  });
  it("NPV tornado responds to carbon price and capex", () => {
    const cand = { ...biomethane, deliveredPrice_per_MWh_net: 45, capex: 200_000 };
    const t = tornado("npv", gas, cand, fin);
    const capex = t.rows.find((r) => r.parameter === "capex")!;
    expect(capex.swing).toBeCloseTo(2 * 0.3 * 200_000, 6);
    const carbon = t.rows.find((r) => r.parameter === "carbon-price")!;
    expect(carbon.metricAtHigh!).toBeGreaterThan(carbon.metricAtLow!);
  });
});
