import { describe, expect, it } from "vitest";
import { DEFAULT_GRID_CRITERIA, interpolateField, markIntervals, removablePoints, splitIntervals } from "../../../lib/flame/grid";

/** A flame-like analytic profile: a tanh front of width w at z0 (common practice, no source). */
const front = (z: number, z0 = 0.01, w = 2e-4) => 0.5 * (1 + Math.tanh((z - z0) / w));
/** A radical-like analytic peak: a Gaussian of width s at z0. */
const peak = (z: number, z0 = 0.0102, s = 1.5e-4) => Math.exp(-(((z - z0) / s) ** 2));

function refineUntilDone(fns: ((z: number) => number)[], criteria = DEFAULT_GRID_CRITERIA, start?: Float64Array) {
  let z: Float64Array = start ?? new Float64Array(12).map((_, i) => (0.03 * i) / 11);
  for (let pass = 0; pass < 60; pass++) {
    const m = markIntervals(z, fns.length, (c, j) => fns[c](z[j]), criteria);
    const next = splitIntervals(z, m, criteria.maxPoints);
    if (!next) return { z, passes: pass };
    z = next;
  }
  throw new Error("refinement did not finish");
}

describe("grid refinement criteria", () => {
  it("refines a tanh front until every interval meets the slope, curve and ratio criteria", () => {
    const c = { ratio: 3, slope: 0.06, curve: 0.12, maxPoints: 1000, threshold: 1e-8, curveThreshold: 0 };
    const { z } = refineUntilDone([front], c);
    const N = z.length;
    const v = Array.from(z, (x) => front(x));
    const range = Math.max(...v) - Math.min(...v);
    for (let j = 0; j < N - 1; j++) expect(Math.abs(v[j + 1] - v[j])).toBeLessThanOrEqual(0.06 * range + 1e-15);
    const s = Array.from({ length: N - 1 }, (_, j) => (v[j + 1] - v[j]) / (z[j + 1] - z[j]));
    const sr = Math.max(...s) - Math.min(...s);
    for (let j = 0; j < N - 2; j++) expect(Math.abs(s[j + 1] - s[j])).toBeLessThanOrEqual(0.12 * sr + 1e-9);
    for (let j = 1; j < N - 1; j++) {
      const r = (z[j + 1] - z[j]) / (z[j] - z[j - 1]);
      expect(r).toBeLessThanOrEqual(3 + 1e-12);
      expect(r).toBeGreaterThanOrEqual(1 / 3 - 1e-12);
    }
    // the points gather at the front: the smallest interval lies within 3 widths of its centre
    let jmin = 0;
    for (let j = 0; j < N - 1; j++) if (z[j + 1] - z[j] < z[jmin + 1] - z[jmin]) jmin = j;
    expect(Math.abs(z[jmin] - 0.01)).toBeLessThan(6e-4);
  });

  it("resolves a narrow peak as well as the front and stops adding points", () => {
    const { z } = refineUntilDone([front, peak]);
    const m = markIntervals(z, 2, (c, j) => [front, peak][c](z[j]), DEFAULT_GRID_CRITERIA);
    expect(m.every((x) => x === 0)).toBe(true);
    // the peak maximum is captured within 3 % by some grid point
    expect(Math.max(...Array.from(z, (x) => peak(x)))).toBeGreaterThan(0.97);
  });

  it("ignores components whose range is below the threshold", () => {
    const z = new Float64Array([0, 1, 2, 3]);
    const m = markIntervals(z, 1, (_c, j) => 1e-12 * j * j, DEFAULT_GRID_CRITERIA);
    expect(Array.from(m)).toEqual([0, 0, 0]);
  });

  it("applies the curvature criterion only to components whose range exceeds curveThreshold", () => {
    // a kink: flat, then rising at 0.05 per unit length; each interval changes it by 5 % of its range (slope criterion met)
    const z = Float64Array.from({ length: 41 }, (_, i) => i * 0.025);
    const kink = (scale: number) => (_c: number, j: number) => scale * Math.max(0, z[j] - 0.5) * 0.05;
    const marked = (m: Uint8Array) => Array.from(m).reduce((a, b) => a + b, 0);
    // above the curvature threshold: the two intervals around the kink are split
    expect(marked(markIntervals(z, 1, kink(1), DEFAULT_GRID_CRITERIA))).toBe(2);
    // a trace component of the same shape (range 2.5e-7): slope criterion only, nothing to split
    expect(marked(markIntervals(z, 1, kink(1e-5), DEFAULT_GRID_CRITERIA))).toBe(0);
    expect(marked(markIntervals(z, 1, kink(1e-5), { ...DEFAULT_GRID_CRITERIA, curveThreshold: 0 }))).toBe(2);
  });

  it("splits only as many intervals as the point budget allows, longest first", () => {
    const z = new Float64Array([0, 1, 3, 4]);
    const next = splitIntervals(z, new Uint8Array([1, 1, 1]), 5);
    expect(Array.from(next ?? [])).toEqual([0, 1, 2, 3, 4]);
  });

  it("interpolates a linear field exactly", () => {
    const z = new Float64Array([0, 1, 3]);
    const f = new Float64Array([0, 10, 1, 11, 3, 13]); // two components: z and z + 10
    const out = interpolateField(z, f, 2, new Float64Array([0.5, 2, 3]));
    expect(Array.from(out)).toEqual([0.5, 10.5, 2, 12, 3, 13]);
  });

  it("leaves out the points flagged for removal while it splits the marked intervals", () => {
    const z = new Float64Array([0, 1, 2, 3, 4]);
    const next = splitIntervals(z, new Uint8Array([0, 0, 0, 1]), 10, new Uint8Array([0, 1, 0, 0, 0]));
    expect(Array.from(next ?? [])).toEqual([0, 2, 3, 3.5, 4]);
    expect(splitIntervals(z, new Uint8Array(4), 10, new Uint8Array(5))).toBeNull();
  });
});

describe("grid pruning (a warm start on a neighbour's grid)", () => {
  const c = { ratio: 3, slope: 0.06, curve: 0.12, maxPoints: 2000, threshold: 1e-8, curveThreshold: 0 };
  // a front that moved and got thinner, as a sweep's next flame does (profiles: common practice, no source)
  const oldFront = (z: number) => front(z, 0.01, 4e-4);
  const newFront = (z: number) => front(z, 0.012, 2e-4);

  it("removes only interior points away from marked intervals, never two neighbours, and keeps what it is told to", () => {
    const { z } = refineUntilDone([oldFront], c);
    const N = z.length;
    const mark = markIntervals(z, 1, (_c, j) => newFront(z[j]), c);
    const keep = [Math.floor(N / 2)];
    const remove = removablePoints(z, 1, (_c, j) => newFront(z[j]), c, mark, keep, 0.6);
    expect(remove.reduce((a, b) => a + b, 0)).toBeGreaterThan(0);
    expect(remove[0]).toBe(0);
    expect(remove[N - 1]).toBe(0);
    expect(remove[keep[0]]).toBe(0);
    for (let j = 1; j < N; j++) expect(remove[j] && remove[j - 1]).toBeFalsy();
    for (let j = 0; j < N; j++) {
      if (!remove[j]) continue;
      for (let i = Math.max(0, j - 2); i <= Math.min(N - 2, j + 1); i++) expect(mark[i]).toBe(0);
    }
  });

  it("prunes and refines the old grid to one that meets every criterion for the new profile, with fewer points than without pruning", () => {
    const { z: old } = refineUntilDone([oldFront], c);
    const values = (zz: Float64Array) => (_c: number, j: number) => newFront(zz[j]);
    // without pruning: refinement of the old grid until done
    const { z: plain } = refineUntilDone([newFront], c, old);
    // with pruning on the first pass, as a warm start does
    const mark = markIntervals(old, 1, values(old), c);
    const remove = removablePoints(old, 1, values(old), c, mark, [], 0.6);
    const first = splitIntervals(old, mark, c.maxPoints, remove) ?? old;
    const { z: pruned } = refineUntilDone([newFront], c, first);
    expect(pruned.length).toBeLessThan(plain.length);
    expect(markIntervals(pruned, 1, values(pruned), c).every((m) => m === 0)).toBe(true);
    const v = Array.from(pruned, (x) => newFront(x));
    const range = Math.max(...v) - Math.min(...v);
    for (let j = 0; j < pruned.length - 1; j++) expect(Math.abs(v[j + 1] - v[j])).toBeLessThanOrEqual(0.06 * range + 1e-15);
    for (let j = 1; j < pruned.length - 1; j++) {
      const r = (pruned[j + 1] - pruned[j]) / (pruned[j] - pruned[j - 1]);
      expect(r).toBeLessThanOrEqual(3 + 1e-12);
      expect(r).toBeGreaterThanOrEqual(1 / 3 - 1e-12);
    }
  });
});
