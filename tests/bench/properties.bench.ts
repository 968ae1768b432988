/**
 * properties_us: one full property sheet (resolve + heating values + ISO 6976 volumetric figures +
 * stoichiometry + flue gas + CO2) of a five-component natural gas, microseconds.
 */
import { computeFuelProperties } from "../../lib/combustion/properties";
import type { BenchResult } from "./bench-types";

export async function benchProperties(): Promise<BenchResult[]> {
  const def = { composition: { CH4: 0.92, C2H6: 0.04, C3H8: 0.01, N2: 0.02, CO2: 0.01 } };
  let sink = 0;
  for (let i = 0; i < 5000; i++) sink += computeFuelProperties(def).hhv.MJ_per_kg;
  const samples: number[] = [];
  const batch = 500;
  for (let s = 0; s < 40; s++) {
    const t0 = performance.now();
    for (let i = 0; i < batch; i++) sink += computeFuelProperties(def).wobbe!.gross_MJ_per_m3;
    samples.push(((performance.now() - t0) * 1000) / batch);
  }
  if (!Number.isFinite(sink)) throw new Error("non-finite result");
  return [{ name: "properties_us", unit: "us", samples }];
}
