/**
 * Benchmark of the flame engine's kinetics (lib/flame/kinetics, GRI-Mech 3.0: 53 species, 325 reactions).
 *
 * - kinetics_rates_us: one netProductionRates call (rate constants, equilibrium constants, fall-off
 *   factors and rates of progress at a new temperature each call, so no temperature cache helps).
 * - kinetics_jacobian_us: one jacobian call (dense analytic ∂ω̇/∂C plus ∂ω̇/∂T by a forward difference)
 *   at a new temperature each call.
 * - post_flame_20ms_ms: one post-flame NO run (lib/flame/post-flame: adiabatic plug flow, 20 ms) from
 *   the HP-equilibrium products of stoichiometric methane in dry air at 298.15 K, 1 atm (Stoke's
 *   equilibrium solver, 11 species mapped onto the mechanism).
 * State for the kinetics calls: a partly burnt stoichiometric methane-air mixture near 1500 K, 1 atm,
 * every species present. Each kinetics sample is the mean over a batch of calls (timer resolution).
 */
import { solveEquilibriumHP } from "../../lib/combustion/equilibrium";
import { createKinetics } from "../../lib/flame/kinetics";
import { integratePostFlame } from "../../lib/flame/post-flame";
import { moleToMass } from "../../lib/flame/thermo";
import { h_J_per_mol } from "../../lib/thermo/nasa7";
import { SPECIES } from "../../lib/thermo/species-data";
import { loadMechanism } from "../../lib/flame/mechanism";
import { R_J_per_molK } from "../../lib/units/constants";
import type { BenchResult } from "./bench-types";
import { flameZoneMoleFractions } from "../support/flame-mixture";

export async function benchKinetics(): Promise<BenchResult[]> {
  const mech = loadMechanism();
  const kin = createKinetics(mech);
  const nS = mech.nSpecies;
  const X = flameZoneMoleFractions(mech);
  const C = X.map((x) => x * (101325 / (R_J_per_molK * 1500)));
  const w = new Float64Array(nS),
    J = new Float64Array(nS * nS),
    dT = new Float64Array(nS);
  let sink = 0;
  let t = 1500;
  const next = () => (t = t === 1500 ? 1500.5 : 1500);
  for (let i = 0; i < 5000; i++) {
    kin.netProductionRates(next(), C, w);
    sink += w[0];
  }
  for (let i = 0; i < 500; i++) {
    kin.jacobian(next(), C, J, dT);
    sink += J[0];
  }
  const rates: number[] = [],
    jac: number[] = [];
  for (let sIdx = 0; sIdx < 30; sIdx++) {
    let t0 = performance.now();
    for (let i = 0; i < 1000; i++) {
      kin.netProductionRates(next(), C, w);
      sink += w[0];
    }
    rates.push(performance.now() - t0); // ms per 1000 calls = µs per call
    t0 = performance.now();
    for (let i = 0; i < 200; i++) {
      kin.jacobian(next(), C, J, dT);
      sink += J[0];
    }
    jac.push(((performance.now() - t0) * 1000) / 200);
  }
  // post-flame run from stoichiometric methane-air equilibrium products
  const AIR: Record<string, number> = { O2: 0.2095, N2: 0.7809, Ar: 0.0093, CO2: 0.0003 }; // common practice, no source
  const air = 2 / AIR.O2;
  const elementMoles: Record<string, number> = {
    C: 1 + air * AIR.CO2,
    H: 4,
    O: air * 2 * (AIR.O2 + AIR.CO2),
    N: air * 2 * AIR.N2,
    Ar: air * AIR.Ar,
  };
  let enthalpyJ = h_J_per_mol(SPECIES.CH4, 298.15);
  for (const [k, x] of Object.entries(AIR)) enthalpyJ += air * x * h_J_per_mol(SPECIES[k], 298.15);
  const eq = solveEquilibriumHP({ elementMoles, enthalpyJ, pressurePa: 101325 });
  const Xb = new Float64Array(nS);
  for (const [k, x] of Object.entries(eq.moleFractions)) Xb[mech.speciesIndex.get(k === "Ar" ? "AR" : k) as number] = x;
  const Yb = new Float64Array(nS);
  moleToMass(mech, Xb, Yb);
  const post: number[] = [];
  for (let i = 0; i < 6; i++) {
    const t0 = performance.now();
    const r = integratePostFlame(mech, kin, { temperatureK: eq.temperatureK, pressurePa: 101325, massFractions: Yb, residenceMs: 20 });
    if (i > 0) post.push(performance.now() - t0);
    sink += r.NO_ppm_dry;
  }
  if (!Number.isFinite(sink)) throw new Error("kinetics bench: non-finite result");
  return [
    { name: "kinetics_rates_us", unit: "µs", samples: rates },
    { name: "kinetics_jacobian_us", unit: "µs", samples: jac },
    { name: "post_flame_20ms_ms", unit: "ms", samples: post },
  ];
}
