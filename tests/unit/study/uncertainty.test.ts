import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { studySchema, type StudyInput } from "../../../lib/schemas/study";
import { evaluateStudy } from "../../../lib/study/evaluate";
import {
  pathEconomics,
  studyPathSetup,
  uncertaintyCsvRows,
  uncertaintyRanking,
  uncertaintyRankingSteps,
} from "../../../lib/study/uncertainty";
import { normalCdf } from "../../../lib/economics/random";
import { InputError } from "../../../lib/errors";
import { twentyScenarioStudy } from "../../bench/study.bench";

const example = JSON.parse(readFileSync(new URL("../../../seed/example-study.json", import.meta.url), "utf8")) as StudyInput;

/**
 * Two options burning the same gas in the same boiler (so the same efficiency), priced 40 and 42
 * per MWh (net), each price normal with a 5 % standard deviation, nothing else uncertain, ranked
 * by cost per useful MWh: the candidate ranks first exactly when its price is the lower one.
 */
function twoOptions(rho: number | null): StudyInput {
  const q = (amount: number) => ({ amount, currency: "EUR", unit: "MWh", energyBasis: "net" }) as never;
  const fixed = { distribution: "normal", mean: 0, sd: 0 } as const;
  return {
    ...example,
    carbonPrice_per_t: 0,
    baseline: { ...example.baseline, price: q(40) },
    scenarios: [{ name: "B", fuel: example.baseline.fuel, price: q(42) }],
    uncertainty: {
      fuelPrices: {
        "baseline.price": { distribution: "normal", mean: 0, sd: 5 },
        "scenarios.0.price": { distribution: "normal", mean: 0, sd: 5 },
      },
      efficiencyPoints: fixed,
      carbonPrice: fixed,
      operatingHours: fixed,
      correlations: rho === null ? [] : [{ a: "price:baseline.price", b: "price:scenarios.0.price", rho }],
    },
  };
}

describe("Monte Carlo ranking against closed forms", () => {
  // B's price minus A's is normal: mean 2, variance 2² + 2.1² − 2ρ·2·2.1; P(B first) = Φ(−2/σ)
  // (difference of two normals; any probability text). Φ is checked against A&S Table 26.1 elsewhere.
  const closedForm = (rho: number) => normalCdf(-2 / Math.sqrt(4 + 4.41 - 2 * rho * 2 * 2.1));

  it.each([
    [null, 0],
    [0.6, 0.6],
  ])("P(first) of two options with normal prices (correlation %s) is Φ(μ/σ) within 3 standard errors", (stated, rho) => {
    const study = studySchema.parse(twoOptions(stated));
    const draws = 20_000;
    const r = uncertaintyRanking(study, { draws, seed: 5, metric: "cost-per-useful-MWh" });
    const b = r.scenarios.find((s) => s.name === "B")!;
    const a = r.scenarios.find((s) => s.isBaseline)!;
    const p = closedForm(rho);
    expect(b.pFirstSE).toBeCloseTo(Math.sqrt((b.pFirst * (1 - b.pFirst)) / draws), 12);
    expect(Math.abs(b.pFirst - p)).toBeLessThan(3 * Math.sqrt((p * (1 - p)) / draws));
    expect(a.pFirst + b.pFirst).toBeCloseTo(1, 12);
  });

  it("the estimate lies within 3 standard errors √(p(1−p)/N) of Φ(μ/σ) at 500, 2,000 and 8,000 draws", () => {
    const study = studySchema.parse(twoOptions(null));
    const p = closedForm(0);
    for (const draws of [500, 2_000, 8_000]) {
      const b = uncertaintyRanking(study, { draws, seed: 17, metric: "cost-per-useful-MWh" }).scenarios[1];
      const se = Math.sqrt((p * (1 - p)) / draws);
      expect(Math.abs(b.pFirst - p)).toBeLessThan(3 * se);
    }
  });

  it("reproduces the stated correlation: Spearman of the sampled prices is (6/π)·asin(ρ/2) within sampling error", () => {
    // For a bivariate normal (Gaussian copula) the rank correlation is (6/π)·asin(ρ/2) (Pearson 1907; Kruskal, JASA 53, 1958).
    const study = studySchema.parse(twoOptions(0.6));
    const r = uncertaintyRanking(study, { draws: 20_000, seed: 3 });
    const expected = (6 / Math.PI) * Math.asin(0.3);
    // Standard error of a rank correlation near 0.6 at N = 20,000 is about (1 − ρ²)/√N ≈ 0.005 (common practice); allow 4 SE.
    expect(Math.abs(r.correlations[0].sampled! - expected)).toBeLessThan(0.02);
  });

  it("seeded runs are identical; another seed gives other draws", () => {
    const study = studySchema.parse(twentyScenarioStudy());
    const strip = (x: ReturnType<typeof uncertaintyRanking>) => ({ ...x, elapsedMs: 0, timingsMs: null });
    const a = uncertaintyRanking(study, { draws: 400, seed: 99 });
    const b = uncertaintyRanking(study, { draws: 400, seed: 99 });
    const c = uncertaintyRanking(study, { draws: 400, seed: 100 });
    expect(strip(b)).toEqual(strip(a));
    expect(c.scenarios.map((s) => s.metric?.p50)).not.toEqual(a.scenarios.map((s) => s.metric?.p50));
  });

  it("run in steps, it reports the set-up and every 500 draws, and ends with the figures of the run at once", () => {
    const study = studySchema.parse(twentyScenarioStudy());
    const strip = (x: ReturnType<typeof uncertaintyRanking>) => ({ ...x, elapsedMs: 0, timingsMs: null });
    const steps = uncertaintyRankingSteps(study, { draws: 1_200, seed: 99 });
    const seen: string[] = [];
    let s = steps.next();
    while (!s.done) {
      seen.push(`${s.value.phase} ${s.value.done}/${s.value.total}`);
      s = steps.next();
    }
    expect(seen).toEqual(["setup 0/1200", "draws 500/1200", "draws 1000/1200"]);
    expect(strip(s.value)).toEqual(strip(uncertaintyRanking(study, { draws: 1_200, seed: 99 })));
  });
});

describe("Monte Carlo ranking of the 20-scenario study", () => {
  const study = studySchema.parse(twentyScenarioStudy());
  const r = uncertaintyRanking(study, { draws: 1_000, seed: 1 });
  const det = evaluateStudy(study, { sweep: false, tornado: false });

  it("keeps infeasible scenarios out of ranking first and says why", () => {
    const infeasible = [det.baseline, ...det.scenarios].filter((s) => s.status === "infeasible").map((s) => s.name);
    expect(infeasible.length).toBeGreaterThan(0);
    for (const s of r.scenarios.filter((x) => infeasible.includes(x.name))) {
      expect(s.ranked).toBe(false);
      expect(s.pFirst).toBe(0);
      expect(s.excludedReason).toMatch(/infeasible/);
    }
    expect(r.notes.join(" ")).toMatch(/left out of "ranks first"/);
    expect(r.scenarios.reduce((t, s) => t + s.pFirst, 0)).toBeCloseTo(1, 12);
  });

  it("puts each scenario's deterministic metric inside its P10–P90 band when every range is centred on the stated value", () => {
    for (const s of r.scenarios) {
      if (s.deterministicValue === null || !s.metric) continue;
      expect(s.metric.p10).toBeLessThanOrEqual(s.deterministicValue);
      expect(s.metric.p90).toBeGreaterThanOrEqual(s.deterministicValue);
    }
  });

  it("names the inputs that decide between the top two, ordered by |Spearman|, only inputs that can move them", () => {
    expect(r.topTwo).not.toBeNull();
    const d = r.topTwo!.drivers;
    expect(d.length).toBeGreaterThan(0);
    for (let k = 1; k < d.length; k++) expect(Math.abs(d[k].spearman)).toBeLessThanOrEqual(Math.abs(d[k - 1].spearman));
    const names = [r.topTwo!.first, r.topTwo!.second];
    for (const x of d) {
      if (x.key.startsWith("capex:") || x.key.startsWith("efficiency:")) expect(names).toContain(x.key.split(":")[1]);
    }
  });

  it("writes one CSV row per scenario under a header", () => {
    const rows = uncertaintyCsvRows(r);
    expect(rows.length).toBe(1 + 21);
    expect(rows[0][5]).toBe("P(first)");
  });

  it("names the field of an unknown quote key and of an unknown correlated input", () => {
    const bad = studySchema.parse({
      ...twentyScenarioStudy(),
      uncertainty: { fuelPrices: { "scenarios.99.price": { distribution: "normal", sd: 5 } } },
    });
    expect(() => uncertaintyRanking(bad, { draws: 100, seed: 1 })).toThrow(InputError);
    try {
      uncertaintyRanking(bad, { draws: 100, seed: 1 });
    } catch (e) {
      expect((e as InputError).field).toBe("uncertainty.fuelPrices.scenarios.99.price");
    }
    const bad2 = studySchema.parse({
      ...twentyScenarioStudy(),
      uncertainty: { correlations: [{ a: "carbon", b: "price:nowhere", rho: 0.5 }] },
    });
    try {
      uncertaintyRanking(bad2, { draws: 100, seed: 1 });
      expect.unreachable();
    } catch (e) {
      expect((e as InputError).field).toBe("uncertainty.correlations.0.b");
    }
  });
});

describe("paths in the study", () => {
  it("without stated paths, the year-by-year NPV, abatement cost and payback equal the closed-form figures of evaluateStudy", () => {
    // The reference is the geometric-series closed form of lib/economics/finance.ts (presentValueFactor),
    // an independent formula from the year-by-year sums.
    const study = studySchema.parse(twentyScenarioStudy());
    const setup = studyPathSetup(study);
    const pe = pathEconomics(setup);
    let compared = 0;
    pe.scenarios.forEach((p, i) => {
      const c = setup.evaluation.scenarios[i].comparison;
      if (!p || !c) return;
      compared++;
      expect(p.npv).toBeCloseTo(c.npv, 4);
      if (c.abatementCost_per_t === null) expect(p.abatementCost_per_t).toBeNull();
      else expect(p.abatementCost_per_t!).toBeCloseTo(c.abatementCost_per_t, 6);
      if (c.discountedPaybackYears === null) expect(p.discountedPaybackYears).toBeNull();
      else expect(p.discountedPaybackYears!).toBeCloseTo(c.discountedPaybackYears, 9);
      if (c.simplePaybackYears === null) expect(p.simplePaybackYears).toBeNull();
      else expect(p.simplePaybackYears!).toBeCloseTo(c.simplePaybackYears, 9);
      expect(p.costPerUsefulMWhYear1).toBeCloseTo(setup.evaluation.scenarios[i].costs!.costPerUsefulMWh.total, 9);
    });
    expect(compared).toBe(20);
  });

  it("a study file without paths or ranges evaluates exactly as before (the new fields are optional)", () => {
    const parsed = studySchema.parse(example);
    expect(parsed.paths ?? null).toBeNull();
    expect(parsed.uncertainty ?? null).toBeNull();
  });

  it("a carbon path raises the NPV of a CO2-saving switch by the present value of the extra carbon cost avoided", () => {
    // Hand relation: NPV(with path) − NPV(flat) = Σ_t Δt_CO2 · (path_t − flat_t) / (1 + d)^t.
    const input = twentyScenarioStudy();
    const flat = studyPathSetup(studySchema.parse({ ...input, priceEscalationPercent: 0 }));
    const path = {
      kind: "stepped",
      points: [
        { year: 1, value: input.carbonPrice_per_t ?? 0 },
        { year: 6, value: 200 },
      ],
    } as const;
    const stepped = studyPathSetup(studySchema.parse({ ...input, priceEscalationPercent: 0, paths: { carbon: path } }));
    const i = flat.evaluation.scenarios.findIndex((s) => s.name === "biomethane");
    const avoided = flat.evaluation.scenarios[i].comparison!.annualCo2Avoided_t;
    const d = 1 + input.discountRatePercent / 100;
    let extra = 0;
    for (let t = 6; t <= input.horizonYears; t++) extra += (avoided * (200 - (input.carbonPrice_per_t ?? 0))) / d ** t;
    const npvFlat = pathEconomics(flat).scenarios[i]!.npv;
    const npvPath = pathEconomics(stepped).scenarios[i]!.npv;
    expect(npvPath - npvFlat).toBeCloseTo(extra, 4);
    // The comparison of evaluateStudy follows the stated path as well, and says so.
    const ev = evaluateStudy(studySchema.parse({ ...input, priceEscalationPercent: 0, paths: { carbon: path } }), {
      sweep: false,
      tornado: false,
    });
    expect(ev.scenarios[i].comparison!.npv - npvFlat).toBeCloseTo(extra, 4);
    expect(ev.audit.notes.join(" ")).toMatch(/price paths stated/);
  });

  it("a paths object that states nothing but the defaults leaves every figure of evaluateStudy as without paths", () => {
    const input = twentyScenarioStudy();
    const plain = evaluateStudy(studySchema.parse(input), { sweep: false, tornado: false });
    const withPaths = evaluateStudy(studySchema.parse({ ...input, paths: {} }), { sweep: false, tornado: false });
    plain.scenarios.forEach((s, i) => {
      const a = s.comparison,
        b = withPaths.scenarios[i].comparison;
      if (!a || !b) {
        expect(b).toBe(a);
        return;
      }
      expect(b.npv).toBeCloseTo(a.npv, 4);
      for (const k of ["abatementCost_per_t", "simplePaybackYears", "discountedPaybackYears"] as const) {
        if (a[k] === null) expect(b[k]).toBeNull();
        else expect(b[k]!).toBeCloseTo(a[k]!, 8);
      }
      expect(withPaths.scenarios[i].rank).toBe(s.rank);
    });
  });
});
