import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { studySchema, type StudyInput } from "../../lib/schemas/study";
import { evaluateStudy, createEvaluationCaches } from "../../lib/study/evaluate";
import { presentValueFactor } from "../../lib/economics/finance";
import { runEvaluate } from "../../lib/cli/evaluate-sync";
import { sweepAgreement } from "../../lib/study/sweep-agreement";
import { DEMO_FUELS, DEMO_PLANTS, DEMO_STUDIES } from "../../seed/demo";
import { InputError } from "../../lib/errors";

const EXAMPLE_PATH = join(__dirname, "../../seed/example-study.json");
const example = (): StudyInput => JSON.parse(readFileSync(EXAMPLE_PATH, "utf8"));

const METHANE = { composition: { CH4: 1 }, name: "methane" };
const H2 = { compound: "H2", phase: "gas" as const };
const blend = (x: number) => ({
  blend: [
    { fuel: METHANE, share: 1 - x },
    { fuel: H2, share: x },
  ],
  basis: "volume" as const,
  name: `methane + ${100 * x} % H2`,
});
const perMWh = (amount: number) => ({ amount, currency: "EUR", unit: "MWh" as const, energyBasis: "gross" as const });

function baseStudy(over: Partial<StudyInput> = {}): StudyInput {
  return {
    name: "test study",
    currency: "EUR",
    carbonPrice_per_t: 80,
    discountRatePercent: 8,
    horizonYears: 10,
    plant: {
      name: "test boiler",
      equipmentType: "hot-water-boiler",
      ratedInput_kW: 2000,
      operatingHours: 5000,
      averageLoadFraction: 0.5,
      stackTemperatureC: 150,
      flueO2DryPercent: 3,
      combustionAirC: 20,
      radiationLossPercent: 1,
      condensing: false,
      wobbeTolerancePercent: 5,
      maxFlameTempRiseK: 40,
      maxH2SharePercent: 20,
    },
    baseline: { name: "methane", fuel: METHANE, price: perMWh(40) },
    scenarios: [],
    ...over,
  };
}

describe("hydrogen in methane: CO2 falls by hydrogen's share of the energy", () => {
  // At equal efficiency, CO2 per useful MJ falls by hydrogen's share of the net energy of the blend:
  // x·241.72 / (x·241.72 + (1 − x)·802.69) with the net heating values of hydrogen and methane at
  // 25 °C, ISO 6976:2016 Table 3 (value from memory) → 1.6 / 3.2 / 7.0 / 11.4 % for 5 / 10 / 20 / 30 vol %.
  // The efficiency moves by a few hundredths of a point between these blends: ±0.15 points.
  const study = studySchema.parse(
    baseStudy({ scenarios: [0.05, 0.1, 0.2, 0.3].map((x) => ({ name: `${100 * x} %`, fuel: blend(x), price: perMWh(50) })) }),
  );
  const r = evaluateStudy(study);
  const expected = [1.6, 3.2, 7.0, 11.4];
  r.scenarios.forEach((s, i) => {
    it(`${s.name} H2: CO2 per useful MJ −${expected[i]} % (±0.15 points), the same in the scenario and at the sweep point`, () => {
      expect(-s.comparison!.co2ChangePercent).toBeGreaterThan(expected[i] - 0.15);
      expect(-s.comparison!.co2ChangePercent).toBeLessThan(expected[i] + 0.15);
      const point = r.hydrogenSweep!.points.find((p) => Math.abs(p.h2Percent - [5, 10, 20, 30][i]) < 1e-9)!;
      expect(point.co2ChangePercent).toBeCloseTo(s.comparison!.co2ChangePercent, 8);
    });
  });
});

describe("study evaluation", () => {
  const study = studySchema.parse(
    baseStudy({
      scenarios: [
        { name: "H2 10 %", fuel: blend(0.1), price: perMWh(48), capex: 50_000 },
        { name: "H2 25 %", fuel: blend(0.25), price: perMWh(52), capex: 120_000 },
        { name: "biomethane", fuel: { composition: { CH4: 0.97, CO2: 0.02, N2: 0.01 }, biogenicCarbonShare: 1 }, price: perMWh(85) },
        { name: "propane", fuel: { compound: "C3H8", phase: "gas" }, price: { amount: 650, currency: "EUR", unit: "t" }, capex: 30_000 },
      ],
    }),
  );
  const r = evaluateStudy(study);

  it("every scenario delivers the same useful heat", () => {
    for (const s of [r.baseline, ...r.scenarios]) expect(s.annual.useful_MWh).toBeCloseTo(r.duty.annualUseful_MWh, 9);
  });

  it("a blend beyond the burner's hydrogen limit is flagged infeasible, not dropped, and ranked after feasible ones", () => {
    const h25 = r.scenarios.find((s) => s.name === "H2 25 %")!;
    expect(h25.checks.find((c) => c.id === "hydrogen-share")!.status).toBe("fail");
    expect(h25.status).toBe("infeasible");
    const entries = r.ranking.entries;
    expect(entries.map((e) => e.name).sort()).toEqual(["H2 10 %", "H2 25 %", "biomethane", "methane", "propane"].sort());
    const lastFeasible = Math.max(...entries.filter((e) => e.status !== "infeasible").map((e) => e.rank));
    for (const e of entries.filter((x) => x.status === "infeasible")) expect(e.rank).toBeGreaterThan(lastFeasible);
  });

  it("propane fails the Wobbe band (its Wobbe index is far above natural gas)", () => {
    const p = r.scenarios.find((s) => s.name === "propane")!;
    // Propane gross Wobbe ≈ 76 MJ/m³ vs methane ≈ 50.7 MJ/m³ at 15 °C/15 °C (ISO 6976:2016 table values, value from memory).
    expect(p.wobbeShiftPercent!).toBeGreaterThan(45);
    expect(p.checks.find((c) => c.id === "wobbe-band")!.status).toBe("fail");
  });

  it("the ranking changes with the metric", () => {
    const byCost = r.ranking.entries.filter((e) => e.status !== "infeasible").map((e) => e.name);
    const co2 = evaluateStudy({ ...study, rankingMetric: "co2-per-useful-MJ" }, { sweep: false });
    const byCo2 = co2.ranking.entries.filter((e) => e.status !== "infeasible").map((e) => e.name);
    expect(byCost[0]).toBe("methane"); // cheapest per useful MWh
    expect(byCo2[0]).toBe("biomethane"); // no fossil CO2
    expect(co2.ranking.better).toBe("lower");
    const npv = evaluateStudy({ ...study, rankingMetric: "npv" }, { sweep: false });
    expect(npv.ranking.better).toBe("higher");
    const values = npv.ranking.entries.filter((e) => e.status !== "infeasible" && e.value !== null).map((e) => e.value!);
    for (let i = 1; i < values.length; i++) expect(values[i - 1]).toBeGreaterThanOrEqual(values[i]);
  });

  it("economics per scenario agree with the cash flows", () => {
    const s = r.scenarios.find((x) => x.name === "H2 10 %")!;
    const saving = r.baseline.costs!.annualEnergyCost - s.costs!.annualEnergyCost;
    expect(s.comparison!.annualEnergySaving).toBeCloseTo(saving, 6);
    expect(s.comparison!.npv).toBeCloseTo(-50_000 + saving * presentValueFactor(8, 10), 4);
    // CO2 avoided = fossil CO2 of the baseline minus the candidate's, per year.
    expect(s.comparison!.annualCo2Avoided_t).toBeCloseTo(r.baseline.costs!.annualCo2Fossil_t - s.costs!.annualCo2Fossil_t, 8);
    // Cost per useful MWh of a candidate cannot depend on the baseline's price or efficiency, nor on capex.
    expect(s.tornado!.rows.length + s.tornado!.noEffect.length).toBe(6);
  });

  it("hydrogen sweep: 101 points, first crossings match the point statuses", () => {
    const sw = r.hydrogenSweep!;
    expect(sw.available).toBe(true);
    expect(sw.points.length).toBe(101);
    expect(sw.points[0].h2Percent).toBe(0);
    expect(sw.points[100].h2Percent).toBe(100);
    const h2 = sw.crossings.find((c) => c.checkId === "hydrogen-share")!;
    // Limit 20 vol %, warning from 90 % of it: first warn at 18 %, first fail at 21 %.
    expect(h2.firstWarnPercent).toBe(18);
    expect(h2.firstFailPercent).toBe(21);
    const wobbe = sw.crossings.find((c) => c.checkId === "wobbe-band")!;
    const first = sw.points.find((p) => Math.abs(p.wobbeShiftPercent!) > 5)!;
    expect(wobbe.firstFailPercent).toBe(first.h2Percent);
    // Hydrogen lowers the Wobbe index of methane at first and raises the flame temperature.
    expect(sw.points[20].wobbeShiftPercent!).toBeLessThan(0);
    expect(sw.points[20].flameShiftK).toBeGreaterThan(0);
    expect(sw.limitLines!.maxH2SharePercent).toBe(20);
    // Volume flow of fuel gas rises with hydrogen (lower volumetric heating value).
    for (let i = 1; i < sw.points.length; i++)
      expect(sw.points[i].fuelVolume_m3_per_h!).toBeGreaterThan(sw.points[i - 1].fuelVolume_m3_per_h!);
  });

  it("audit trail: methods with sources, assumptions, and each scenario's inputs", () => {
    expect(r.audit.methods.length).toBeGreaterThan(8);
    for (const m of r.audit.methods) {
      expect(m.method.length).toBeGreaterThan(0);
      expect(m.source.length).toBeGreaterThan(0);
    }
    expect(r.audit.assumptions.some((a) => /same useful heat/.test(a))).toBe(true);
    const s = r.scenarios[0];
    expect(s.audit.inputs.fuel).toEqual(study.scenarios[0].fuel);
    expect(s.audit.notes.some((n) => /per MWh \(net\)/.test(n))).toBe(true);
    expect(r.cautions.items.map((c) => c.hazard)).toContain("hydrogen");
    expect(r.cautions.items.map((c) => c.hazard)).toContain("burner-change");
  });
});

describe("caching: no state is solved twice", () => {
  it("scenario blends and sweep points that are the same fuel share one evaluation", () => {
    const study = studySchema.parse(baseStudy({ scenarios: [{ name: "20 %", fuel: blend(0.2), price: perMWh(50) }] }));
    const caches = createEvaluationCaches();
    const r = evaluateStudy(study, { caches });
    // 101 sweep points; the 0 % point is the baseline and the 20 % point the scenario.
    expect(caches.performance.misses).toBe(101);
    expect(r.stats.performanceCacheHits).toBeGreaterThanOrEqual(2);
    const again = evaluateStudy(study, { caches });
    expect(caches.performance.misses).toBe(101);
    expect(again.scenarios[0].efficiency.net).toBe(r.scenarios[0].efficiency.net);
  });
});

describe("blends priced from their components", () => {
  it("mass-weighted delivered price per kg", () => {
    const h2Price = { amount: 5, currency: "EUR", unit: "kg" as const, transportAdder: 1 };
    const gasPrice = perMWh(40);
    const study = studySchema.parse(baseStudy({ scenarios: [{ name: "20 %", fuel: blend(0.2), componentPrices: [gasPrice, h2Price] }] }));
    const r = evaluateStudy(study, { sweep: false });
    const s = r.scenarios[0];
    // Mass fraction of H2 in a 20 vol % blend with methane: 0.2 × 2.01588 / (0.2 × 2.01588 + 0.8 × 16.04246) (ISO 6976:2016 molar masses).
    const wH2 = (0.2 * 2.01588) / (0.2 * 2.01588 + 0.8 * 16.04246);
    const perKgGas = r.baseline.price!.perKg;
    expect(s.price!.origin).toBe("blend of component quotes");
    expect(s.price!.perKg).toBeCloseTo((1 - wH2) * perKgGas + wH2 * 6, 6);
    expect(() => studySchema.parse(baseStudy({ scenarios: [{ name: "x", fuel: METHANE, componentPrices: [gasPrice] }] }))).toThrow(
      /only to a blend/,
    );
  });
});

describe("condensing plant", () => {
  const condensing = (plant: Record<string, unknown>, scenarios: StudyInput["scenarios"] = []) => {
    const base = baseStudy();
    return { ...base, plant: { ...base.plant, condensing: true, returnWaterC: 30, stackTemperatureC: 45, ...plant }, scenarios };
  };
  it("net-basis efficiency above 100 %, gross below, condensate check passes, the model stated in the audit trail", () => {
    const r = evaluateStudy(studySchema.parse(condensing({})), { sweep: false });
    expect(r.baseline.efficiency.net).toBeGreaterThan(1);
    expect(r.baseline.efficiency.gross).toBeLessThan(1);
    expect(r.baseline.checks.find((c) => c.id === "stack-dew-point")!.status).toBe("pass");
    expect(r.baseline.ratedFlows.condensate_kg_per_h).toBeGreaterThan(0);
    expect(r.audit.assumptions.some((a) => /leaves at the stack temperature, saturated/.test(a) && /approach/.test(a))).toBe(true);
  });
  it("a stack below return water + approach is refused naming plant.stackTemperatureC", () => {
    const parsed = studySchema.safeParse(condensing({ stackTemperatureC: 34 }));
    expect(parsed.success).toBe(false);
    expect(parsed.error!.issues.map((i) => i.path.join("."))).toContain("plant.stackTemperatureC");
  });
  it("a scenario override below return water + approach is refused naming its override", () => {
    const study = studySchema.parse(condensing({}, [{ name: "colder", fuel: METHANE, overrides: { stackTemperatureC: 33 } }]));
    expect(() => evaluateStudy(study, { sweep: false })).toThrow(InputError);
    expect(() => evaluateStudy(study, { sweep: false })).toThrow(/^scenarios\.0\.overrides\.stackTemperatureC: .*≥ 35 °C/);
  });
  it("a non-condensing unit with its stack below the dew point fails that check", () => {
    const base = baseStudy();
    const r = evaluateStudy(studySchema.parse({ ...base, plant: { ...base.plant, stackTemperatureC: 50 } }), { sweep: false });
    expect(r.baseline.checks.find((c) => c.id === "stack-dew-point")!.status).toBe("fail");
  });
});

describe("radiation and casing loss at part load", () => {
  const at = (load: number) => {
    const base = baseStudy();
    return evaluateStudy(studySchema.parse({ ...base, plant: { ...base.plant, averageLoadFraction: load, radiationLossPercent: 2 } }), {
      sweep: false,
    });
  };
  it("the baseline's annual radiation share is the rated share ÷ the average load, and the rated-load efficiency does not change", () => {
    const full = at(1);
    const half = at(0.5);
    expect(full.baseline.efficiency.lossesNetPercent.radiation).toBeCloseTo(2, 9);
    expect(half.baseline.efficiency.lossesNetPercent.radiation).toBeCloseTo(4, 9);
    expect(half.baseline.efficiency.ratedLoad.net).toBeCloseTo(full.baseline.efficiency.ratedLoad.net, 12);
    expect(half.baseline.efficiency.net).toBeCloseTo(full.baseline.efficiency.net - 0.02, 9);
    expect(half.audit.assumptions.some((a) => /constant heat flow/.test(a) && /average load/.test(a))).toBe(true);
  });
  it("without a load, the load follows from the annual useful heat and the hours; beyond rated input it is refused naming plant.annualUsefulHeat_MWh", () => {
    const base = baseStudy();
    const withAnnual = (annualUsefulHeat_MWh: number) =>
      evaluateStudy(studySchema.parse({ ...base, plant: { ...base.plant, averageLoadFraction: 0, annualUsefulHeat_MWh } }), {
        sweep: false,
      });
    const r = withAnnual(4000);
    expect(r.duty.averageLoadOrigin).toBe("annual useful heat ÷ operating hours");
    expect(r.duty.averageUseful_kW).toBeCloseTo((4000 * 1000) / 5000, 9);
    expect(() => withAnnual(20_000)).toThrow(/^plant\.annualUsefulHeat_MWh: /);
  });
  it("a load at which the radiation loss takes all the heat is refused naming plant.averageLoadFraction", () => {
    expect(() => at(0.02)).toThrow(/^plant\.averageLoadFraction: /);
  });
});

describe("example study for the demo plant", () => {
  it("matches the demo seed: plant, fuels and scenario names", () => {
    const ex = example();
    const st = DEMO_STUDIES.find((s) => s.name === ex.name)!;
    expect(st).toBeDefined();
    const plant = DEMO_PLANTS.find((p) => p.name === st.plant)!;
    for (const [k, v] of Object.entries(plant.fields)) expect((ex.plant as Record<string, unknown>)[k]).toEqual(v);
    expect([ex.baseline.name, ...ex.scenarios.map((s) => s.name)]).toEqual(st.scenarios.map((s) => s.name));
    const ng = DEMO_FUELS.find((f) => f.name === (ex.baseline.fuel as { name: string }).name)!;
    expect((ex.baseline.fuel as { composition: unknown }).composition).toEqual((ng.definition as { composition: unknown }).composition);
  });

  it("evaluates from the command line (json and csv)", () => {
    const json = runEvaluate(["--no-flame-speed", "--input", EXAMPLE_PATH], () => "");
    expect(json.exitCode).toBe(0);
    const out = JSON.parse(json.stdout);
    expect(out.scenarios.length).toBe(example().scenarios.length);
    expect(out.hydrogenSweep.points.length).toBe(101);
    const csv = runEvaluate(["--no-flame-speed", "--input", EXAMPLE_PATH, "--format", "csv"], () => "");
    expect(csv.exitCode).toBe(0);
    const lines = csv.stdout.trim().split("\n");
    expect(lines.length).toBe(1 + 1 + example().scenarios.length);
    expect(lines[0]).toMatch(/^rank,scenario,baseline,fuel,status/);
    const sweep = runEvaluate(["--no-flame-speed", "--input", EXAMPLE_PATH, "--format", "csv", "--table", "sweep"], () => "");
    expect(sweep.stdout.trim().split("\n").length).toBe(102);
  });

  it("reads standard input with --input -", () => {
    const r = runEvaluate(["--no-flame-speed", "--input", "-"], () => readFileSync(EXAMPLE_PATH, "utf8"));
    expect(r.exitCode).toBe(0);
  });
});

describe("bad input: exit 2, one line naming the field", () => {
  // biome-ignore lint/suspicious/noExplicitAny: each case pokes one path of a parsed JSON study file
  type Doc = any;
  const cases: [string, (s: Doc) => void, RegExp][] = [
    ["mole fractions", (s) => (s.scenarios[3].fuel.composition.CH4 = 0.5), /^stoke: scenarios\.3\.fuel\.composition: /],
    ["a number", (s) => (s.plant.flueO2DryPercent = "x"), /^stoke: plant\.flueO2DryPercent: must be a number/],
    [
      "a gas priced per litre",
      (s) => (s.scenarios[3].price = { amount: 1, currency: "EUR", unit: "L" }),
      /^stoke: scenarios\.3\.price\.unit: /,
    ],
    [
      "unknown species in a blend",
      (s) => (s.scenarios[2].fuel.blend[0].fuel.composition = { XX: 1 }),
      /^stoke: scenarios\.2\.fuel\.blend\.0\.fuel\.composition\.XX: unknown species/,
    ],
    ["currency", (s) => (s.baseline.price.currency = "USD"), /^stoke: baseline\.price\.currency: must be EUR/],
    ["missing plant", (s) => delete s.plant, /^stoke: plant: required/],
    ["condensing without return water", (s) => (s.plant.condensing = true), /^stoke: plant\.returnWaterC: /],
    ["duplicate scenario name", (s) => (s.scenarios[1].name = s.scenarios[0].name), /^stoke: scenarios\.1\.name: /],
  ];
  for (const [what, mutate, pattern] of cases) {
    it(what, () => {
      const s: Doc = example();
      mutate(s);
      const r = runEvaluate(["--no-flame-speed", "--input", "-"], () => JSON.stringify(s));
      expect(r.exitCode).toBe(2);
      expect(r.stdout).toBe("");
      expect(r.stderr).toMatch(pattern);
      expect(r.stderr.trim().split("\n").length).toBe(1);
    });
  }
  it("not JSON, unknown format, missing --input", () => {
    expect(runEvaluate(["--no-flame-speed", "--input", "-"], () => "{").exitCode).toBe(2);
    expect(runEvaluate(["--no-flame-speed", "--input", EXAMPLE_PATH, "--format", "xml"], () => "").stderr).toMatch(/--format/);
    expect(runEvaluate([], () => "").stderr).toMatch(/--input is required/);
  });
});

describe("the hydrogen sweep and the comparison agree for the same blend, or say why not", () => {
  const h2Price = { amount: 5, currency: "EUR", unit: "kg" as const };
  it("a blend priced from the baseline gas and hydrogen prices agrees with the sweep at its share", () => {
    const study = studySchema.parse(
      baseStudy({
        hydrogenSweep: { enabled: true, stepPercent: 5, hydrogenPrice: h2Price },
        scenarios: [{ name: "20 %", fuel: blend(0.2), componentPrices: [perMWh(40), h2Price] }],
      }),
    );
    const [a] = sweepAgreement(evaluateStudy(study));
    expect(a.h2Percent).toBeCloseTo(20, 9);
    expect(a.exactPoint).toBe(true);
    expect(a.agrees).toBe(true);
    expect(a.reasons).toEqual([]);
  });

  it("a blend with its own quote and a changed stack temperature differs, and both reasons are given", () => {
    const study = studySchema.parse(
      baseStudy({
        hydrogenSweep: { enabled: true, stepPercent: 5, hydrogenPrice: h2Price },
        scenarios: [{ name: "20 %, own quote", fuel: blend(0.2), price: perMWh(55), overrides: { stackTemperatureC: 120 } }],
      }),
    );
    const [a] = sweepAgreement(evaluateStudy(study));
    expect(a.agrees).toBe(false);
    expect(a.reasons.join(" ")).toMatch(/own quote/);
    expect(a.reasons.join(" ")).toMatch(/stack temperature/);
  });
});

describe("upstream CO2e that no one stated is unknown, never 0", () => {
  it("a study counting upstream emissions leaves cost and ranked CO2 unknown for a fuel without a factor", () => {
    const withFactor = { ...METHANE, upstreamCo2e_kg_per_GJ: 10 };
    const r = evaluateStudy(
      studySchema.parse(
        baseStudy({
          includeUpstream: true,
          baseline: { name: "methane", fuel: withFactor, price: perMWh(40) },
          scenarios: [{ name: "no factor", fuel: METHANE, price: perMWh(40) }],
        }),
      ),
      { sweep: false },
    );
    expect(r.baseline.costs).not.toBeNull();
    const s = r.scenarios[0];
    expect(s.co2PerUsefulMJ_g.upstream).toBeNull();
    expect(s.co2PerUsefulMJ_g.ranked).toBeNull();
    expect(s.costs).toBeNull();
    // Left out of the count, the same fuel's fossil CO2 is still known.
    const r2 = evaluateStudy(studySchema.parse(baseStudy({ scenarios: [{ name: "no factor", fuel: METHANE, price: perMWh(40) }] })), {
      sweep: false,
    });
    expect(r2.scenarios[0].co2PerUsefulMJ_g.ranked).toBeCloseTo(r2.scenarios[0].co2PerUsefulMJ_g.fossil, 12);
    expect(r2.scenarios[0].co2PerUsefulMJ_g.upstream).toBeNull();
  });
});
