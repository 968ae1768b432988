/**
 * Benchmark of the chemical-equilibrium solver (lib/combustion/equilibrium).
 *
 * - equilibrium_cold_us: one constant-enthalpy, constant-pressure solve of stoichiometric methane in
 *   dry air (O2 20.95, N2 78.09, Ar 0.93, CO2 0.03 mol %) at 298.15 K and 101.325 kPa, 11 product
 *   species, from a cold start (no warm start, no temperature hint), on a reused solver workspace.
 * - equilibrium_sweep_point_us: per point of a 101-point φ sweep 0.5–2.0 of the same mixture, each
 *   point warm-started from the previous solution (the first point starts cold).
 *
 * Each sample is the mean over a batch of solves (timer resolution); set-up of the problems (element
 * amounts and reactant enthalpy) happens outside the timed region.
 */
import {
  createEquilibriumSolver,
  DEFAULT_PRODUCT_SPECIES,
  type EquilibriumProblem,
  type EquilibriumResult,
} from "../../lib/combustion/equilibrium";
import { h_J_per_mol } from "../../lib/thermo/nasa7";
import { SPECIES } from "../../lib/thermo/species-data";
import type { BenchResult } from "./bench-types";

/** Dry air by volume (common practice, no source: rounded standard composition). */
const AIR: Record<string, number> = { O2: 0.2095, N2: 0.7809, Ar: 0.0093, CO2: 0.0003 };

function methaneAirCharge(phi: number): EquilibriumProblem {
  const T = 298.15;
  const airMoles = 2 / phi / AIR.O2; // CH4 + 2 O2 → CO2 + 2 H2O
  const elementMoles: Record<string, number> = { C: 1, H: 4 };
  let enthalpyJ = h_J_per_mol(SPECIES.CH4, T);
  for (const [key, x] of Object.entries(AIR)) {
    const sp = SPECIES[key];
    for (const [el, c] of Object.entries(sp.elements)) elementMoles[el] = (elementMoles[el] ?? 0) + airMoles * x * (c ?? 0);
    enthalpyJ += airMoles * x * h_J_per_mol(sp, T);
  }
  return { elementMoles, enthalpyJ, pressurePa: 101325 };
}

export async function benchEquilibrium(): Promise<BenchResult[]> {
  const solver = createEquilibriumSolver(DEFAULT_PRODUCT_SPECIES);
  const cold = methaneAirCharge(1);
  const sweep: EquilibriumProblem[] = [];
  for (let i = 0; i <= 100; i++) sweep.push(methaneAirCharge(0.5 + (1.5 * i) / 100));

  const runSweep = (): number => {
    let prev: EquilibriumResult | undefined;
    let acc = 0;
    for (const p of sweep) {
      prev = solver.solveHP(prev === undefined ? p : { ...p, warmStart: prev });
      acc += prev.temperatureK;
    }
    return acc;
  };

  // warm-up (JIT)
  let sink = 0;
  for (let i = 0; i < 3000; i++) sink += solver.solveHP(cold).temperatureK;
  for (let i = 0; i < 20; i++) sink += runSweep();

  const coldSamples: number[] = [];
  const batch = 200;
  for (let s = 0; s < 60; s++) {
    const t0 = performance.now();
    for (let i = 0; i < batch; i++) sink += solver.solveHP(cold).temperatureK;
    coldSamples.push(((performance.now() - t0) * 1000) / batch);
  }

  const sweepSamples: number[] = [];
  for (let s = 0; s < 40; s++) {
    const t0 = performance.now();
    sink += runSweep();
    sweepSamples.push(((performance.now() - t0) * 1000) / sweep.length);
  }
  if (!Number.isFinite(sink)) throw new Error("benchmark produced a non-finite result");

  return [
    { name: "equilibrium_cold_us", unit: "us", samples: coldSamples },
    { name: "equilibrium_sweep_point_us", unit: "us", samples: sweepSamples },
  ];
}
