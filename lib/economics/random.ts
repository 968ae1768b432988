/**
 * Seeded, reproducible random numbers and the standard normal distribution, for Monte Carlo
 * sampling (lib/economics/sampling.ts).
 *
 * - Generator: xoshiro128** 1.0 (D. Blackman, S. Vigna, "Scrambled linear pseudorandom number
 *   generators", ACM Trans. Math. Softw. 47(4), 2021; reference C code at prng.di.unimi.it),
 *   32-bit state words, period 2^128 − 1. Seeded from one 32-bit integer through SplitMix32
 *   (the 32-bit variant of SplitMix, G. Steele, D. Lea, C. Flood, OOPSLA 2014) so that no seed
 *   gives the all-zero state.
 * - Standard normal quantile: P. J. Acklam's rational approximation (relative error < 1.15e−9),
 *   refined by one Halley step on the CDF, which brings it to about machine precision.
 * - Standard normal CDF: W. J. Cody's rational Chebyshev approximations of erf/erfc
 *   (Math. Comp. 23, 1969), as in Cody's CALERF (relative error about 1e−16 in double precision).
 */

/** xoshiro128**: 4 × 32-bit state; next() returns an unsigned 32-bit integer. */
export class Xoshiro128ss {
  private s0: number;
  private s1: number;
  private s2: number;
  private s3: number;

  /** A generator from an explicit state (not all zero). */
  constructor(s0: number, s1: number, s2: number, s3: number) {
    this.s0 = s0 >>> 0;
    this.s1 = s1 >>> 0;
    this.s2 = s2 >>> 0;
    this.s3 = s3 >>> 0;
    if ((this.s0 | this.s1 | this.s2 | this.s3) === 0) throw new RangeError("xoshiro128** state must not be all zero");
  }

  /** A generator from one integer seed (SplitMix32 fills the state). */
  static fromSeed(seed: number): Xoshiro128ss {
    let x = seed >>> 0;
    const next = () => {
      x = (x + 0x9e3779b9) >>> 0;
      let z = x;
      z = Math.imul(z ^ (z >>> 16), 0x85ebca6b) >>> 0;
      z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35) >>> 0;
      return (z ^ (z >>> 16)) >>> 0;
    };
    const a = next(),
      b = next(),
      c = next(),
      d = next();
    return new Xoshiro128ss(a, b, c, d === 0 && (a | b | c) === 0 ? 1 : d);
  }

  next(): number {
    const s1 = this.s1;
    const result = Math.imul(rotl(Math.imul(s1, 5) >>> 0, 7), 9) >>> 0;
    const t = (s1 << 9) >>> 0;
    this.s2 = (this.s2 ^ this.s0) >>> 0;
    this.s3 = (this.s3 ^ this.s1) >>> 0;
    this.s1 = (this.s1 ^ this.s2) >>> 0;
    this.s0 = (this.s0 ^ this.s3) >>> 0;
    this.s2 = (this.s2 ^ t) >>> 0;
    this.s3 = rotl(this.s3, 11);
    return result;
  }

  /** Uniform in [0, 1) with 32 random bits. */
  uniform(): number {
    return this.next() / 4294967296;
  }

  /** Uniform in the open interval (0, 1): never 0, never 1. */
  uniformOpen(): number {
    return (this.next() + 0.5) / 4294967296;
  }

  /** Uniform integer in 0 … n−1 (n ≤ 2^32), without modulo bias (rejection). */
  below(n: number): number {
    const limit = Math.floor(4294967296 / n) * n;
    let x = this.next();
    while (x >= limit) x = this.next();
    return x % n;
  }
}

function rotl(x: number, k: number): number {
  return ((x << k) | (x >>> (32 - k))) >>> 0;
}

// Cody's erf/erfc coefficients (CALERF).
const A = [3.1611237438705656, 113.864154151050156, 377.485237685302021, 3209.37758913846947, 0.185777706184603153];
const B = [23.6012909523441209, 244.024637934444173, 1282.61652607737228, 2844.23683343917062];
const C = [
  0.564188496988670089, 8.88314979438837594, 66.1191906371416295, 298.635138197400131, 881.95222124176909, 1712.04761263407058,
  2051.07837782607147, 1230.33935479799725, 2.15311535474403846e-8,
];
const D = [
  15.7449261107098347, 117.693950891312499, 537.181101862009858, 1621.38957456669019, 3290.79923573345963, 4362.61909014324716,
  3439.36767414372164, 1230.33935480374942,
];
const P = [
  0.305326634961232344, 0.360344899949804439, 0.125781726111229246, 0.0160837851487422766, 6.58749161529837803e-4, 0.0163153871373020978,
];
const Q = [2.56852019228982242, 1.87295284992346725, 0.527905102951428412, 0.0605183413124413191, 0.00233520497626869185];
const SQRPI = 0.56418958354775628695; // 1/√π
const THRESH = 0.46875;

/** Complementary error function erfc(x) (Cody 1969). */
export function erfc(x: number): number {
  const y = Math.abs(x);
  let r: number;
  if (y <= THRESH) {
    const ysq = y > 1.11e-16 ? y * y : 0;
    let xnum = A[4] * ysq,
      xden = ysq;
    for (let i = 0; i < 3; i++) {
      xnum = (xnum + A[i]) * ysq;
      xden = (xden + B[i]) * ysq;
    }
    return 1 - (x * (xnum + A[3])) / (xden + B[3]);
  } else if (y <= 4) {
    let xnum = C[8] * y,
      xden = y;
    for (let i = 0; i < 7; i++) {
      xnum = (xnum + C[i]) * y;
      xden = (xden + D[i]) * y;
    }
    r = (xnum + C[7]) / (xden + D[7]);
    const ysq = Math.trunc(y * 16) / 16;
    const del = (y - ysq) * (y + ysq);
    r = Math.exp(-ysq * ysq) * Math.exp(-del) * r;
  } else {
    if (y >= 26.543) {
      r = 0;
    } else {
      const ysq = 1 / (y * y);
      let xnum = P[5] * ysq,
        xden = ysq;
      for (let i = 0; i < 4; i++) {
        xnum = (xnum + P[i]) * ysq;
        xden = (xden + Q[i]) * ysq;
      }
      r = (ysq * (xnum + P[4])) / (xden + Q[4]);
      r = (SQRPI - r) / y;
      const ysq2 = Math.trunc(y * 16) / 16;
      const del = (y - ysq2) * (y + ysq2);
      r = Math.exp(-ysq2 * ysq2) * Math.exp(-del) * r;
    }
  }
  return x < 0 ? 2 - r : r;
}

/** Standard normal cumulative distribution Φ(z). */
export function normalCdf(z: number): number {
  return 0.5 * erfc(-z / Math.SQRT2);
}

/** Standard normal density φ(z). */
export function normalPdf(z: number): number {
  return Math.exp(-0.5 * z * z) / Math.sqrt(2 * Math.PI);
}

const AQ = [-3.969683028665376e1, 2.209460984245205e2, -2.759285104469687e2, 1.38357751867269e2, -3.066479806614716e1, 2.506628277459239];
const BQ = [-5.447609879822406e1, 1.615858368580409e2, -1.556989798598866e2, 6.680131188771972e1, -1.328068155288572e1];
const CQ = [-7.784894002430293e-3, -3.223964580411365e-1, -2.400758277161838, -2.549732539343734, 4.374664141464968, 2.938163982698783];
const DQ = [7.784695709041462e-3, 3.224671290700398e-1, 2.445134137142996, 3.754408661907416];
const P_LOW = 0.02425;

/** Standard normal quantile Φ⁻¹(p), 0 < p < 1 (Acklam, one Halley refinement). */
export function normalQuantile(p: number): number {
  if (!(p > 0 && p < 1)) throw new RangeError(`normal quantile needs 0 < p < 1, got ${p}`);
  let x: number;
  if (p < P_LOW) {
    const q = Math.sqrt(-2 * Math.log(p));
    x =
      (((((CQ[0] * q + CQ[1]) * q + CQ[2]) * q + CQ[3]) * q + CQ[4]) * q + CQ[5]) /
      ((((DQ[0] * q + DQ[1]) * q + DQ[2]) * q + DQ[3]) * q + 1);
  } else if (p <= 1 - P_LOW) {
    const q = p - 0.5;
    const r = q * q;
    x =
      ((((((AQ[0] * r + AQ[1]) * r + AQ[2]) * r + AQ[3]) * r + AQ[4]) * r + AQ[5]) * q) /
      (((((BQ[0] * r + BQ[1]) * r + BQ[2]) * r + BQ[3]) * r + BQ[4]) * r + 1);
  } else {
    const q = Math.sqrt(-2 * Math.log(1 - p));
    x =
      -(((((CQ[0] * q + CQ[1]) * q + CQ[2]) * q + CQ[3]) * q + CQ[4]) * q + CQ[5]) /
      ((((DQ[0] * q + DQ[1]) * q + DQ[2]) * q + DQ[3]) * q + 1);
  }
  // Halley step on Φ(x) − p.
  const e = normalCdf(x) - p;
  const u = e * Math.sqrt(2 * Math.PI) * Math.exp(0.5 * x * x);
  return x - u / (1 + (x * u) / 2);
}
