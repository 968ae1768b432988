/**
 * Benchmark of the flame engine's mixture-averaged transport (lib/flame/transport, GRI-Mech 3.0: 53 species).
 *
 * - transport_evaluate_us: one evaluate() call at a new temperature each call (pure-species fits,
 *   Wilke's Φ_kj, the 1378 binary-diffusion fits, then the mixture sums).
 * - transport_evaluate_same_T_us: one evaluate() call at an unchanged temperature with a changed
 *   composition (what a composition-perturbed Jacobian column costs: the mixture sums only).
 * State: a partly burnt stoichiometric methane-air mixture near 1500 K, 1 atm, every species present.
 * Each sample is the mean over a batch of calls (timer resolution). The one-off set-up (kinetic
 * theory and fits, cached per mechanism) is not included.
 */
import { loadMechanism } from "../../lib/flame/mechanism";
import { createMixtureTransport } from "../../lib/flame/transport";
import type { BenchResult } from "./bench-types";
import { flameZoneMoleFractions } from "../support/flame-mixture";

export async function benchTransport(): Promise<BenchResult[]> {
  const mech = loadMechanism();
  const tr = createMixtureTransport(mech);
  const X = flameZoneMoleFractions(mech);
  const out = tr.newOutput();
  let sink = 0;
  let t = 1500;
  const next = () => (t = t === 1500 ? 1500.5 : 1500);
  const o2 = mech.speciesIndex.get("O2") as number;
  for (let i = 0; i < 5000; i++) {
    tr.evaluate(next(), 101325, X, out);
    sink += out.viscosity_Pa_s;
  }
  const newT: number[] = [],
    sameT: number[] = [];
  for (let s = 0; s < 30; s++) {
    let t0 = performance.now();
    for (let i = 0; i < 1000; i++) {
      tr.evaluate(next(), 101325, X, out);
      sink += out.Dkm_m2_per_s[0];
    }
    newT.push(performance.now() - t0); // ms per 1000 calls = µs per call
    t0 = performance.now();
    for (let i = 0; i < 1000; i++) {
      X[o2] = 0.08 + (i & 1) * 1e-7;
      tr.evaluate(1500, 101325, X, out);
      sink += out.Dkm_m2_per_s[0];
    }
    sameT.push(performance.now() - t0);
  }
  if (!Number.isFinite(sink)) throw new Error("transport bench: non-finite result");
  return [
    { name: "transport_evaluate_us", unit: "µs", samples: newT },
    { name: "transport_evaluate_same_T_us", unit: "µs", samples: sameT },
  ];
}
