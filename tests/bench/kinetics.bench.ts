/**
 * Benchmark of the flame engine's kinetics (lib/flame/kinetics, GRI-Mech 3.0: 53 species, 325 reactions).
 *
 * - kinetics_rates_us: one netProductionRates call (rate constants, equilibrium constants, fall-off
 *   factors and rates of progress at a new temperature each call, so no temperature cache helps).
 * - kinetics_jacobian_us: one jacobian call (dense analytic ∂ω̇/∂C plus ∂ω̇/∂T by a forward difference)
 *   at a new temperature each call.
 * State: a partly burnt stoichiometric methane-air mixture near 1500 K, 1 atm, every species present.
 * Each sample is the mean over a batch of calls (timer resolution).
 */
import { createKinetics } from "../../lib/flame/kinetics";
import { loadMechanism } from "../../lib/flame/mechanism";
import { R_J_per_molK } from "../../lib/units/constants";
import type { BenchResult } from "./bench-types";

export async function benchKinetics(): Promise<BenchResult[]> {
  const mech = loadMechanism();
  const kin = createKinetics(mech);
  const nS = mech.nSpecies;
  const X = new Float64Array(nS).fill(1e-6);
  const major: Record<string, number> = { N2: 0.7, O2: 0.08, CH4: 0.03, H2O: 0.1, CO2: 0.04, CO: 0.02, H2: 0.01, OH: 0.003, H: 0.002, O: 0.001, AR: 0.008 };
  for (const [n, x] of Object.entries(major)) X[mech.speciesIndex.get(n) as number] = x;
  const s = X.reduce((a, b) => a + b, 0);
  const C = X.map((x) => (x / s) * (101325 / (R_J_per_molK * 1500)));
  const w = new Float64Array(nS), J = new Float64Array(nS * nS), dT = new Float64Array(nS);
  let sink = 0;
  let t = 1500;
  const next = () => (t = t === 1500 ? 1500.5 : 1500);
  for (let i = 0; i < 5000; i++) { kin.netProductionRates(next(), C, w); sink += w[0]; }
  for (let i = 0; i < 500; i++) { kin.jacobian(next(), C, J, dT); sink += J[0]; }
  const rates: number[] = [], jac: number[] = [];
  for (let sIdx = 0; sIdx < 30; sIdx++) {
    let t0 = performance.now();
    for (let i = 0; i < 1000; i++) { kin.netProductionRates(next(), C, w); sink += w[0]; }
    rates.push(performance.now() - t0); // ms per 1000 calls = µs per call
    t0 = performance.now();
    for (let i = 0; i < 200; i++) { kin.jacobian(next(), C, J, dT); sink += J[0]; }
    jac.push(((performance.now() - t0) * 1000) / 200);
  }
  if (!Number.isFinite(sink)) throw new Error("kinetics bench: non-finite result");
  return [
    { name: "kinetics_rates_us", unit: "µs", samples: rates },
    { name: "kinetics_jacobian_us", unit: "µs", samples: jac },
  ];
}
