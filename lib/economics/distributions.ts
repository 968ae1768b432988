/**
 * Distributions a user states in plain terms, each with its quantile function (inverse CDF) so
 * that stratified uniforms (Latin hypercube) map onto it:
 *
 * - triangular (low, most likely, high): closed-form quantile; mean (a+m+b)/3, variance
 *   (a²+b²+m²−ab−am−bm)/18 (e.g. Evans, Hastings & Peacock, "Statistical Distributions", 3rd ed., ch. 40).
 * - PERT (low, most likely, high): the beta distribution on [a, b] with shape
 *   α = 1 + 4(m−a)/(b−a), β = 1 + 4(b−m)/(b−a) (Malcolm, Roseboom, Clark & Fazar, Oper. Res. 7, 1959;
 *   the "modified PERT" form with λ = 4, Vose, "Risk Analysis", 3rd ed., §9.1): mean (a+4m+b)/6.
 *   Its quantile is taken from a tabulated CDF (composite Simpson on 1,024 cells, cached per
 *   distribution) and polished with one Newton step on the exact density: P(X ≤ quantile(u)) is
 *   within 1e−8 of u.
 * - normal (mean, standard deviation): μ + σ·Φ⁻¹(u).
 */
import { normalQuantile } from "./random";

export type DistributionSpec =
  | { distribution: "triangular" | "pert"; low: number; mode: number; high: number }
  | { distribution: "normal"; mean: number; sd: number };

export interface Distribution {
  spec: DistributionSpec;
  /** Closed-form mean and variance. */
  mean: number;
  variance: number;
  /** x such that P(X ≤ x) = u, 0 < u < 1. */
  quantile(u: number): number;
  /** True when the distribution is a single value (nothing to sample). */
  degenerate: boolean;
}

export function distributionOf(spec: DistributionSpec): Distribution {
  if (spec.distribution === "normal") {
    const { mean, sd } = spec;
    if (!(sd >= 0)) throw new RangeError(`standard deviation must be ≥ 0, got ${sd}`);
    return { spec, mean, variance: sd * sd, degenerate: sd === 0, quantile: (u) => mean + sd * normalQuantile(u) };
  }
  const { low: a, mode: m, high: b } = spec;
  if (!(a <= m && m <= b)) throw new RangeError(`need low ≤ most likely ≤ high, got ${a}, ${m}, ${b}`);
  if (a === b) return { spec, mean: a, variance: 0, degenerate: true, quantile: () => a };
  if (spec.distribution === "triangular") {
    const w = b - a;
    const fm = (m - a) / w;
    return {
      spec,
      mean: (a + m + b) / 3,
      variance: (a * a + b * b + m * m - a * b - a * m - b * m) / 18,
      degenerate: false,
      quantile: (u) => (u < fm ? a + Math.sqrt(u * w * (m - a)) : b - Math.sqrt((1 - u) * w * (b - m))),
    };
  }
  return pert(spec, a, m, b);
}

const PERT_CELLS = 1024;
const pertTables = new Map<string, Float64Array>();

function lnBeta(x: number, y: number): number {
  return lnGamma(x) + lnGamma(y) - lnGamma(x + y);
}

/** ln Γ(x), x > 0: Lanczos approximation (g = 7, n = 9; as in Press et al., Numerical Recipes, 3rd ed., §6.1). */
function lnGamma(x: number): number {
  const g = 7;
  const c = [
    0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059, 12.507343278686905,
    -0.13857109526572012, 9.9843695780195716e-6, 1.5056327351493116e-7,
  ];
  if (x < 0.5) return Math.log(Math.PI / Math.sin(Math.PI * x)) - lnGamma(1 - x);
  x -= 1;
  let s = c[0];
  for (let i = 1; i < g + 2; i++) s += c[i] / (x + i);
  const t = x + g + 0.5;
  return 0.5 * Math.log(2 * Math.PI) + (x + 0.5) * Math.log(t) - t + Math.log(s);
}

function pert(spec: DistributionSpec, a: number, m: number, b: number): Distribution {
  const w = b - a;
  const alpha = 1 + (4 * (m - a)) / w;
  const beta = 1 + (4 * (b - m)) / w;
  const lnB = lnBeta(alpha, beta);
  // Density of the standard beta on [0, 1].
  const pdf = (y: number) =>
    y <= 0 || y >= 1
      ? y <= 0
        ? alpha === 1
          ? Math.exp(-lnB)
          : 0
        : beta === 1
          ? Math.exp(-lnB)
          : 0
      : Math.exp((alpha - 1) * Math.log(y) + (beta - 1) * Math.log1p(-y) - lnB);
  const key = `${alpha}|${beta}`;
  let cdf = pertTables.get(key);
  if (!cdf) {
    // Last element: the Simpson integral of the density before normalisation.
    cdf = new Float64Array(PERT_CELLS + 2);
    const h = 1 / PERT_CELLS;
    for (let k = 0; k < PERT_CELLS; k++) {
      const y0 = k * h;
      cdf[k + 1] = cdf[k] + (h / 6) * (pdf(y0) + 4 * pdf(y0 + h / 2) + pdf(y0 + h));
    }
    const total = cdf[PERT_CELLS];
    for (let k = 0; k <= PERT_CELLS; k++) cdf[k] /= total;
    cdf[PERT_CELLS + 1] = total;
    pertTables.set(key, cdf);
  }
  const table = cdf;
  const h = 1 / PERT_CELLS;
  /** CDF inside cell k at y (Simpson from the cell's start). */
  const cdfAt = (k: number, y: number) => {
    const y0 = k * h;
    const d = y - y0;
    return table[k] + ((d / 6) * (pdf(y0) + 4 * pdf(y0 + d / 2) + pdf(y))) / table[PERT_CELLS + 1];
  };
  const mean = (a + 4 * m + b) / 6;
  return {
    spec,
    mean,
    // Beta variance αβ/((α+β)²(α+β+1)) scaled by (b−a)²; with α+β = 6 this is (μ−a)(b−μ)/7.
    variance: ((mean - a) * (b - mean)) / 7,
    degenerate: false,
    quantile: (u) => {
      // Cell by bisection, linear start inside it, one Newton step on the exact density.
      let lo = 0,
        hi = PERT_CELLS;
      while (hi - lo > 1) {
        const mid = (lo + hi) >> 1;
        if (table[mid] <= u) lo = mid;
        else hi = mid;
      }
      const span = table[lo + 1] - table[lo];
      let y = (lo + (span > 0 ? (u - table[lo]) / span : 0.5)) * h;
      const f = pdf(y) / table[PERT_CELLS + 1];
      if (f > 0) {
        const yn = y - (cdfAt(lo, y) - u) / f;
        if (yn >= lo * h && yn <= (lo + 1) * h) y = yn;
      }
      return a + w * y;
    },
  };
}
