/**
 * Benchmark of the study evaluation (lib/study/evaluate).
 *
 * - study_20x101_ms: one evaluation of a 20-scenario study of the demo boiler (hydrogen blends at
 *   shares on and off the sweep grid, biomethane, biogas, LPG, liquid fuels, scenarios with their
 *   own stack temperature and O2) with its 101-point hydrogen sweep, fit checks, economics and
 *   tornado data, from fresh caches each time (nothing carried over between samples).
 */
import { readFileSync } from "node:fs";
import { studySchema, type StudyInput } from "../../lib/schemas/study";
import { evaluateStudy } from "../../lib/study/evaluate";
import type { BenchResult } from "./bench-types";

export function twentyScenarioStudy(): StudyInput {
  const ex = JSON.parse(readFileSync(new URL("../../seed/example-study.json", import.meta.url), "utf8")) as StudyInput;
  const ng = ex.baseline.fuel;
  const gasPrice = ex.baseline.price!;
  const h2 = ex.hydrogenSweep!.hydrogen!;
  const h2Price = ex.hydrogenSweep!.hydrogenPrice!;
  const scenarios: StudyInput["scenarios"] = [];
  for (const x of [0.05, 0.1, 0.15, 0.2, 0.25, 0.3, 0.125, 0.175, 0.4, 0.6]) {
    scenarios.push({
      name: `H2 ${100 * x} %`,
      fuel: {
        blend: [
          { fuel: ng, share: 1 - x },
          { fuel: h2, share: x },
        ],
        basis: "volume",
      },
      componentPrices: [gasPrice, h2Price],
      capex: 400_000 * x,
      fixedOpexChange: 20_000 * x,
    });
  }
  const eur = (amount: number, unit: string, extra: Record<string, unknown> = {}) => ({ amount, currency: "EUR", unit, ...extra }) as never;
  scenarios.push(
    {
      name: "biomethane",
      fuel: { composition: { CH4: 0.97, CO2: 0.02, N2: 0.01 }, biogenicCarbonShare: 1, upstreamCo2e_kg_per_GJ: 12 },
      price: eur(92, "MWh", { energyBasis: "gross" }),
    },
    {
      name: "biogas 60/40",
      fuel: { composition: { CH4: 0.598, CO2: 0.4, H2S: 0.002 }, biogenicCarbonShare: 1 },
      price: eur(0.26, "m3", { meteringReference: "0C" }),
      capex: 250_000,
    },
    {
      name: "LPG",
      fuel: { composition: { C3H8: 0.95, nC4H10: 0.03, iC4H10: 0.02 } },
      price: eur(720, "t", { transportAdder: 45 }),
      capex: 90_000,
    },
    { name: "methanol", fuel: { compound: "CH3OH", phase: "liquid" }, price: eur(420, "t"), capex: 300_000 },
    { name: "ethanol", fuel: { compound: "C2H5OH", phase: "liquid", biogenicCarbonShare: 1 }, price: eur(0.78, "L"), capex: 300_000 },
    {
      name: "gas oil",
      fuel: {
        ultimate: { C: 0.8655, H: 0.133, O: 0, N: 0.0005, S: 0.001, moisture: 0, ash: 0 },
        kind: "liquid",
        lhv_MJ_per_kg: 42.9,
        densityKgPerM3: 845,
      },
      price: eur(0.92, "L"),
      capex: 150_000,
    },
    {
      name: "HVO",
      fuel: { compound: "C16H34", phase: "liquid", densityKgPerM3: 780, biogenicCarbonShare: 1 },
      price: eur(2150, "t"),
      capex: 150_000,
    },
    { name: "natural gas, economiser upgrade", fuel: ng, price: gasPrice, capex: 120_000, overrides: { stackTemperatureC: 110 } },
    { name: "natural gas, O2 trim", fuel: ng, price: gasPrice, capex: 40_000, overrides: { flueO2DryPercent: 2 } },
    {
      name: "H2 20 %, condensing retrofit",
      fuel: {
        blend: [
          { fuel: ng, share: 0.8 },
          { fuel: h2, share: 0.2 },
        ],
        basis: "volume",
      },
      componentPrices: [gasPrice, h2Price],
      capex: 350_000,
      overrides: { condensing: true, returnWaterC: 40, stackTemperatureC: 55 },
    },
  );
  return { ...ex, name: "benchmark: 20 scenarios", scenarios };
}

export async function benchStudy(): Promise<BenchResult[]> {
  const study = studySchema.parse(twentyScenarioStudy());
  if (study.scenarios.length !== 20) throw new Error(`benchmark study has ${study.scenarios.length} scenarios, expected 20`);
  let sink = 0;
  for (let i = 0; i < 15; i++) sink += evaluateStudy(study).scenarios.length; // warm-up (JIT)
  const samples: number[] = [];
  for (let i = 0; i < 40; i++) {
    const t0 = performance.now();
    const r = evaluateStudy(study);
    samples.push(performance.now() - t0);
    sink += r.hydrogenSweep!.points.length;
  }
  if (sink === 0) throw new Error("unreachable");
  return [{ name: "study_20x101_ms", unit: "ms", samples }];
}
