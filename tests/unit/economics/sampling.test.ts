import { describe, expect, it } from "vitest";
import { erfc, normalCdf, normalQuantile, Xoshiro128ss } from "../../../lib/economics/random";
import { distributionOf } from "../../../lib/economics/distributions";
import {
  cholesky,
  imanConover,
  independentUniforms,
  latinHypercube,
  pearson,
  percentileSorted,
  percentilesUnsorted,
  proportionStandardError,
  spearman,
} from "../../../lib/economics/sampling";
import { InputError } from "../../../lib/errors";

describe("xoshiro128** generator", () => {
  it("gives the outputs of the reference algorithm from the state (1, 2, 3, 4)", () => {
    // Worked by hand from the reference C code of xoshiro128** 1.0 (Blackman & Vigna,
    // prng.di.unimi.it): result = rotl(s1·5, 7)·9, then the xorshift state update.
    // 1st: rotl(10, 7)·9 = 1280·9 = 11520; 2nd: s1 = 0 → 0; 3rd: s1 = 1029 → rotl(5145, 7)·9 = 5927040.
    const g = new Xoshiro128ss(1, 2, 3, 4);
    expect([g.next(), g.next(), g.next()]).toEqual([11520, 0, 5927040]);
  });

  it("repeats its sequence for the same seed and differs for another", () => {
    const a = Xoshiro128ss.fromSeed(42),
      b = Xoshiro128ss.fromSeed(42),
      c = Xoshiro128ss.fromSeed(43);
    const sa = Array.from({ length: 20 }, () => a.next());
    expect(Array.from({ length: 20 }, () => b.next())).toEqual(sa);
    expect(Array.from({ length: 20 }, () => c.next())).not.toEqual(sa);
  });

  it("draws uniforms whose mean and variance are 1/2 and 1/12 within 4 standard errors", () => {
    // Moments of U(0, 1): common practice, no source. SE of the mean √(1/12/N); of the variance √(1/180/N).
    const g = Xoshiro128ss.fromSeed(7);
    const n = 100_000;
    let s = 0,
      s2 = 0;
    for (let i = 0; i < n; i++) {
      const u = g.uniform();
      s += u;
      s2 += u * u;
    }
    const mean = s / n;
    const v = s2 / n - mean * mean;
    expect(Math.abs(mean - 0.5)).toBeLessThan(4 * Math.sqrt(1 / 12 / n));
    expect(Math.abs(v - 1 / 12)).toBeLessThan(4 * Math.sqrt(1 / 180 / n));
  });
});

describe("standard normal", () => {
  it("CDF and erfc agree with the published tables", () => {
    // Abramowitz & Stegun, Handbook of Mathematical Functions (1964), Table 26.1 (P(x)) and Table 7.1 (erf), 10 digits.
    expect(normalCdf(1)).toBeCloseTo(0.8413447461, 10);
    expect(normalCdf(1.96)).toBeCloseTo(0.9750021049, 10);
    expect(normalCdf(-3)).toBeCloseTo(1 - 0.998650102, 9);
    expect(normalCdf(0)).toBe(0.5);
    expect(erfc(2)).toBeCloseTo(1 - 0.995322265, 9);
    expect(erfc(0.4)).toBeCloseTo(1 - 0.428392355, 10);
    // erfc(5) = 1.5374597944e−12 (value from memory), relative 1e−9.
    expect(Math.abs(erfc(5) / 1.5374597944e-12 - 1)).toBeLessThan(1e-9);
  });

  it("quantile agrees with the published percentage points", () => {
    // Abramowitz & Stegun, Table 26.5 (percentage points of the normal distribution), 9 digits.
    expect(normalQuantile(0.975)).toBeCloseTo(1.959963985, 8);
    expect(normalQuantile(0.9)).toBeCloseTo(1.281551566, 8);
    expect(normalQuantile(0.999)).toBeCloseTo(3.090232306, 8);
    expect(normalQuantile(0.001)).toBeCloseTo(-3.090232306, 8);
    expect(normalQuantile(1e-6)).toBeCloseTo(-4.753424309, 8);
    expect(normalQuantile(0.5)).toBeCloseTo(0, 14);
  });
});

describe("distributions", () => {
  /** Mean and variance of X = Q(U) by the midpoint rule over u (exact to about 1e−8 here). */
  function momentsOfQuantile(q: (u: number) => number, n = 200_000) {
    let s = 0,
      s2 = 0;
    for (let i = 0; i < n; i++) {
      const x = q((i + 0.5) / n);
      s += x;
      s2 += x * x;
    }
    const m = s / n;
    return { mean: m, variance: s2 / n - m * m };
  }

  it("triangular: mean (a+m+b)/3 and variance (a²+b²+m²−ab−am−bm)/18", () => {
    // Evans, Hastings & Peacock, Statistical Distributions, 3rd ed., ch. 40: a = −20, m = 5, b = 30 →
    // mean 5, variance (400 + 900 + 25 + 600 + 100 − 150)/18 = 1875/18 = 104.1667.
    const d = distributionOf({ distribution: "triangular", low: -20, mode: 5, high: 30 });
    expect(d.mean).toBeCloseTo(5, 12);
    expect(d.variance).toBeCloseTo(1875 / 18, 10);
    const m = momentsOfQuantile(d.quantile);
    expect(m.mean).toBeCloseTo(5, 4);
    expect(m.variance).toBeCloseTo(1875 / 18, 2);
    // The mode splits the probability (m − a)/(b − a) = 0.5 below it.
    expect(d.quantile(0.5)).toBeCloseTo(5, 12);
  });

  it("PERT: mean (a+4m+b)/6 and variance (μ−a)(b−μ)/7, and the quantile inverts the beta CDF", () => {
    // Vose, Risk Analysis, 3rd ed., §9.1 (PERT as a beta with α = 1 + 4(m−a)/(b−a), β = 1 + 4(b−m)/(b−a)).
    // a = 0, m = 0.25, b = 1 → Beta(2, 4): mean 1/3, variance αβ/((α+β)²(α+β+1)) = 8/252 = 0.031746.
    const d = distributionOf({ distribution: "pert", low: 0, mode: 0.25, high: 1 });
    expect(d.mean).toBeCloseTo(1 / 3, 12);
    expect(d.variance).toBeCloseTo(8 / 252, 12);
    const m = momentsOfQuantile(d.quantile);
    expect(m.mean).toBeCloseTo(1 / 3, 6);
    expect(m.variance).toBeCloseTo(8 / 252, 6);
    // Regularised incomplete beta with integer shapes (a binomial sum; Abramowitz & Stegun 26.5.4/26.5.24):
    // I_x(2, 4) = Σ_{j=2..5} C(5, j) x^j (1−x)^(5−j).
    const C5 = [1, 5, 10, 10, 5, 1];
    const I = (x: number) => [2, 3, 4, 5].reduce((s, j) => s + C5[j] * x ** j * (1 - x) ** (5 - j), 0);
    // The tabulated quantile claims ≤ 1e−8 in probability.
    for (const u of [0.001, 0.1, 0.5, 0.9, 0.999]) expect(Math.abs(I(d.quantile(u)) - u)).toBeLessThan(1e-8);
    // A symmetric PERT (m at the centre) is Beta(3, 3), whose median is the centre.
    expect(distributionOf({ distribution: "pert", low: 10, mode: 20, high: 30 }).quantile(0.5)).toBeCloseTo(20, 9);
  });

  it("normal: mean and standard deviation as stated", () => {
    const d = distributionOf({ distribution: "normal", mean: 3, sd: 2 });
    expect(d.quantile(0.975)).toBeCloseTo(3 + 2 * 1.959963985, 7); // A&S Table 26.5
    expect(d.variance).toBe(4);
  });
});

describe("Latin hypercube sampling", () => {
  it("puts exactly one draw in each of the N strata of every input", () => {
    const n = 1000,
      dims = 3;
    const u = latinHypercube(Xoshiro128ss.fromSeed(1), n, dims);
    for (let j = 0; j < dims; j++) {
      const hit = new Uint8Array(n);
      for (let i = 0; i < n; i++) hit[Math.floor(u[j * n + i] * n)]++;
      expect(hit.every((h) => h === 1)).toBe(true);
    }
  });

  it("estimates a mean with less scatter than independent draws", () => {
    // Stein (Technometrics 29, 1987): LHS variance of a mean ≤ that of independent sampling (asymptotically).
    // For an additive function the LHS error almost vanishes; compare the spread over 40 repetitions.
    const f = (a: number, b: number) => a * a + 2 * b;
    const exact = 1 / 3 + 1;
    const spread = (sample: (seed: number) => Float64Array) => {
      let s2 = 0;
      for (let r = 0; r < 40; r++) {
        const u = sample(r + 1);
        const n = u.length / 2;
        let m = 0;
        for (let i = 0; i < n; i++) m += f(u[i], u[n + i]);
        s2 += (m / n - exact) ** 2;
      }
      return Math.sqrt(s2 / 40);
    };
    const lhs = spread((s) => latinHypercube(Xoshiro128ss.fromSeed(s), 500, 2));
    const mc = spread((s) => independentUniforms(Xoshiro128ss.fromSeed(s), 500, 2));
    expect(lhs).toBeLessThan(mc / 5);
  });
});

describe("correlation", () => {
  it("Cholesky factor reproduces the matrix and refuses contradictory correlations naming the field", () => {
    const a = Float64Array.from([4, 2, 2, 3]); // hand-computed: L = [[2, 0], [1, √2]]
    const l = cholesky(a, 2);
    expect([...l].map((v) => +v.toFixed(12))).toEqual([2, 0, 1, +Math.SQRT2.toFixed(12)]);
    // ρ12 = ρ13 = 0.9, ρ23 = −0.9 cannot hold together.
    const bad = Float64Array.from([1, 0.9, 0.9, 0.9, 1, -0.9, 0.9, -0.9, 1]);
    expect(() => cholesky(bad, 3, "uncertainty.correlations")).toThrow(InputError);
    try {
      cholesky(bad, 3, "uncertainty.correlations");
    } catch (e) {
      expect((e as InputError).field).toBe("uncertainty.correlations");
    }
  });

  it("Iman–Conover gives normal inputs their stated correlation within sampling error, marginals unchanged", () => {
    const n = 10_000;
    const rho = [
      [1, 0.8, -0.3],
      [0.8, 1, 0],
      [-0.3, 0, 1],
    ];
    const rng = Xoshiro128ss.fromSeed(11);
    const u = latinHypercube(rng, n, 3);
    const x = u.map((v) => normalQuantile(v));
    const before = [0, 1, 2].map((j) => [...x.subarray(j * n, (j + 1) * n)].sort((p, q) => p - q));
    imanConover(x, n, 3, Float64Array.from(rho.flat()), rng);
    const col = (j: number) => x.subarray(j * n, (j + 1) * n);
    for (let j = 0; j < 3; j++) expect([...col(j)].sort((p, q) => p - q)).toEqual(before[j]);
    // Standard error of a sample correlation ≈ (1 − ρ²)/√N (Fisher; common practice): allow 4 SE.
    for (const [a, b] of [
      [0, 1],
      [0, 2],
      [1, 2],
    ] as const) {
      const r = pearson(col(a), col(b))!;
      expect(Math.abs(r - rho[a][b])).toBeLessThan((4 * (1 - rho[a][b] ** 2)) / Math.sqrt(n));
    }
  });
});

describe("statistics", () => {
  it("Spearman rank correlation of a hand example is 1 − 6Σd²/(n(n²−1))", () => {
    // x = 1…5, y = 2,1,4,3,5: d = −1,1,−1,1,0, Σd² = 4, ρ = 1 − 24/120 = 0.8 (Spearman 1904 formula, no ties).
    expect(spearman([1, 2, 3, 4, 5], [2, 1, 4, 3, 5])).toBeCloseTo(0.8, 12);
    expect(spearman([1, 2, 3, 4], [1, 8, 27, 64])).toBeCloseTo(1, 12);
    expect(spearman([1, 2, 3], [5, 5, 5])).toBeNull();
  });

  it("percentiles interpolate between order statistics (Hyndman & Fan type 7)", () => {
    // Hand-computed: sample 1, 2, 3, 4, 10; p = 0.1 → h = 0.4 → 1.4; p = 0.9 → h = 3.6 → 4 + 0.6·6 = 7.6.
    const s = [1, 2, 3, 4, 10];
    expect(percentileSorted(s, 0.1)).toBeCloseTo(1.4, 12);
    expect(percentileSorted(s, 0.5)).toBe(3);
    expect(percentileSorted(s, 0.9)).toBeCloseTo(7.6, 12);
    expect(percentilesUnsorted(Float64Array.from([10, 3, 1, 4, 2]), [0.1, 0.5, 0.9]).map((v) => +v.toFixed(12))).toEqual([1.4, 3, 7.6]);
  });

  it("standard error of a proportion is √(p(1−p)/N)", () => {
    expect(proportionStandardError(0.5, 10_000)).toBeCloseTo(0.005, 12); // hand-computed
  });
});
