/**
 * A partly burnt methane-air mixture with every species of a mechanism present (radicals at ppm
 * levels): a made-up state for exercising kinetics and transport in tests and benchmarks, not a
 * reference value. Mole fractions, normalised to 1.
 */
import type { Mechanism } from "../../lib/flame/mechanism";

const MAJOR: Readonly<Record<string, number>> = {
  N2: 0.7,
  O2: 0.08,
  CH4: 0.03,
  H2O: 0.1,
  CO2: 0.04,
  CO: 0.02,
  H2: 0.01,
  OH: 0.003,
  H: 0.002,
  O: 0.001,
  AR: 0.008,
};

export function flameZoneMoleFractions(mech: Mechanism, extra: Readonly<Record<string, number>> = {}): Float64Array {
  const X = new Float64Array(mech.nSpecies).fill(1e-6);
  for (const [n, x] of Object.entries({ ...MAJOR, ...extra })) X[mech.speciesIndex.get(n) as number] = x;
  const s = X.reduce((a, b) => a + b, 0);
  for (let k = 0; k < X.length; k++) X[k] /= s;
  return X;
}
