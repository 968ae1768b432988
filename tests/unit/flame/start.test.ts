/**
 * The secant predictor of sweeps (lib/flame/start.ts): values worked by hand (common practice, no source).
 */
import { describe, expect, it } from "vitest";
import type { FlameSolution } from "../../../lib/flame/premixed";
import { extrapolateWarmStart, type WarmCorrection } from "../../../lib/flame/start";

/** Two points, one species: per point T, Y, ṁ. */
function guess(): FlameSolution {
  return {
    z: Float64Array.of(0, 1),
    x: Float64Array.of(300, 0.2, 0.5, 2000, 0.01, 0.5),
    nSpecies: 1,
    zFix: 0.5,
    tFix: 1000,
    speciesNames: ["A"],
  };
}
const correction: WarmCorrection = {
  delta: Float64Array.of(10, -0.05, Math.log(1.1), -20, -0.02, Math.log(1.1)),
  inletChange: Float64Array.of(0.1, 0, 0),
};

describe("secant predictor of a sweep's warm start", () => {
  it("adds the last step's correction scaled by the ratio of the inlet changes", () => {
    const g = guess();
    expect(extrapolateWarmStart(g, correction, Float64Array.of(0.15, 0, 0))).toBeCloseTo(1.5, 12);
    expect(g.x[0]).toBeCloseTo(315, 10);
    expect(g.x[1]).toBeCloseTo(0.125, 12);
    expect(g.x[2]).toBeCloseTo(0.5 * 1.1 ** 1.5, 12); // the mass flux as a factor
    expect(g.x[3]).toBeCloseTo(1970, 10);
    expect(g.x[4]).toBe(0); // 0.01 − 1.5·0.02 < 0: kept at 0
  });

  it("extrapolates at most twice the last correction", () => {
    const g = guess();
    expect(extrapolateWarmStart(g, correction, Float64Array.of(0.5, 0, 0))).toBe(2);
    expect(g.x[0]).toBeCloseTo(320, 10);
  });

  it("leaves the estimate alone when the inlet changes in another direction", () => {
    const g = guess();
    expect(extrapolateWarmStart(g, correction, Float64Array.of(0.1, 0.1, 0))).toBe(0);
    expect(Array.from(g.x)).toEqual(Array.from(guess().x));
    expect(extrapolateWarmStart(g, correction, Float64Array.of(-0.1, 0, 0))).toBe(0);
  });
});
