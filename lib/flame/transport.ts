/**
 * Mixture-averaged transport properties of an ideal gas from the mechanism's Lennard-Jones data
 * (kinetic theory of dilute gases, Chapman–Enskog first approximation). References:
 * Hirschfelder, Curtiss & Bird, Molecular Theory of Gases and Liquids (Wiley 1954), ch. 8;
 * Kee, Coltrin & Glarborg, Chemically Reacting Flow (Wiley 2003), ch. 12; Warnatz, in Numerical
 * Methods in Laminar Flame Propagation (Vieweg 1982) for the conductivity of polyatomic species.
 *
 * Pure species k (mass m_k = W_k/N_A, diameter σ_k, well depth ε_k, reduced dipole δ*_k = μ_k²/(2ε_kσ_k³)):
 *   η_k   = (5/16) √(π m_k k_B T) / (π σ_k² Ω(2,2)*(T*, δ*_k))
 *   ρD_kk = self-diffusion from D_jk below with j = k (independent of p)
 *   λ_k   = (η_k/W_k) (f_tr·C_v,tr + f_rot·C_v,rot + f_vib·C_v,vib)            (Warnatz)
 *     f_tr  = 5/2 (1 − (2/π)(C_v,rot/C_v,tr)(A/B)),  f_rot = (ρD_kk/η_k)(1 + (2/π)A/B),  f_vib = ρD_kk/η_k,
 *     A = 5/2 − ρD_kk/η_k,  B = Z_rot(T) + (2/π)((5/3)C_v,rot/R + ρD_kk/η_k),
 *     C_v,tr = 3R/2; C_v,rot = 0 (atom), R (linear), 3R/2 (nonlinear); C_v,vib = c_v − C_v,tr − C_v,rot
 *     (≥ 0) with c_v = c_p − R from the mechanism's NASA-7 thermo; atoms: λ = (15/4) R η/W.
 *     Z_rot(T) = Z_rot(298 K)·F(298 K)/F(T), F(T) = 1 + (π^1.5/2)(ε/kT)^½ + (π²/4 + 2)(ε/kT) + π^1.5 (ε/kT)^1.5
 *     (Parker, Phys. Fluids 2 (1959) 449; Brau & Jonkman, J. Chem. Phys. 52 (1970) 477).
 * Pairs j, k (reduced mass m_jk, σ_jk = (σ_j+σ_k)/2, ε_jk = √(ε_jε_k), δ*_jk = μ_jμ_k/(2ε_jkσ_jk³)):
 *   D_jk = (3/16) √(2π (k_B T)³/m_jk) / (p π σ_jk² Ω(1,1)*(T*_jk, δ*_jk))
 *   A polar–non-polar pair (one dipole zero) gets the induced-dipole correction
 *   ξ = 1 + ¼ α*_n μ*_p² √(ε_p/ε_n) (α*_n = α_n/σ_n³, μ*_p² = μ_p²/(ε_pσ_p³)): ε_jk → ε_jk ξ², σ_jk → σ_jk ξ^(−1/6)
 *   (Hirschfelder, Curtiss & Bird ch. 8; Kee, Coltrin & Glarborg ch. 12).
 * Collision integrals: collision-integrals.ts (Monchick–Mason tables).
 *
 * Fits (made once per mechanism and option set, at creation): on 50 temperatures spaced evenly in ln T
 * over FIT_RANGE_K, weighted least-squares polynomials in u = (ln T − c)/h of
 *   √η_k / T^¼ and T^1.5 / (p D_jk) (degree 4), λ_k / √T (degree 6; it carries c_p(T))
 * (relative residuals minimised; largest fit deviations from the kinetic theory over 200–3500 K:
 * 0.5 % for η and D_jk near the ends of the range, 1.1 % for λ_k near c_p's joint at 1000 K),
 * and of the Soret coefficients θ_kj (absolute). Outside FIT_RANGE_K the polynomials are extrapolated
 * (smoothly; kinetic theory itself is valid there, the fit is only less checked).
 *
 * Mixture rules:
 *   viscosity   Wilke (J. Chem. Phys. 18 (1950) 517): η = Σ X_k η_k / Σ_j X_j Φ_kj,
 *               Φ_kj = [1 + (η_k/η_j)^½ (W_j/W_k)^¼]² / √(8(1 + W_k/W_j))
 *   conductivity λ = ½ (Σ X_k λ_k + 1/Σ X_k/λ_k) (Mathur, Tondon & Saxena, Mol. Phys. 12 (1967) 569)
 *   diffusion   D_km = (1 − Y_k) / Σ_{j≠k} X_j/D_jk (Bird, Stewart & Lightfoot, Transport Phenomena; Kee, Coltrin & Glarborg ch. 12),
 *               with 1 − Y_k evaluated as Σ_{j≠k} X_j W_j / Σ_j X_j W_j (no cancellation near pure k).
 *   Mole fractions are used as max(X_k, 0) + 1e-12 and renormalised, so that a pure species or an
 *   absent one gives finite, continuous D_km (the 1e-12 floor changes any result by < 1e-9 relative).
 *   The correction velocity that makes the diffusive fluxes sum to zero is the flame solver's job.
 *
 * Thermal diffusion (option `soret`): for the light species H and H2 (W < 5 g/mol) only, the
 * thermal diffusion ratio Θ_k = Σ_{j≠k} θ_kj X_k X_j with the Chapman–Cowling first approximation
 *   θ_kj = (15/2) (2A* + 5)(6C* − 5) / (A*(16A* − 12B* + 55)) · (W_k − W_j)/(W_k + W_j)
 * (Chapman & Cowling, The Mathematical Theory of Non-Uniform Gases, 3rd ed. 1970, chs. 8–9; Kee, Coltrin &
 * Glarborg ch. 12), A*, C* at (T*_kj, δ*_kj) from the tables, B* of the LJ potential by recursion.
 * Sign convention: the thermal diffusion velocity is V_k^T = −(D_km Θ_k / X_k)(1/T) dT/dz, so the mass
 * flux is j_k^T = −ρ (W_k/W̄) D_km Θ_k (1/T) dT/dz; Θ_k < 0 for H and H2 (they drift to the hot side).
 * Θ_k is zero for every other species, and for all species when the option is off.
 */
import { kB_J_per_K, NA_per_mol, R_J_per_molK } from "../units/constants";
import { aStar, cStar, omega11Star, omega22Star, ratiosLJFromRecursion } from "./collision-integrals";
import type { Mechanism } from "./mechanism";
import { speciesThermoInto } from "./thermo";

export interface TransportOptions {
  /** Thermal diffusion (Soret effect) for the light species H and H2. Default false. */
  soret?: boolean;
}

export interface MixtureTransportOut {
  viscosity_Pa_s: number;
  conductivity_W_per_mK: number;
  /** mixture-averaged diffusion coefficients D_km [m²/s], length nSpecies */
  Dkm_m2_per_s: Float64Array;
  /** thermal diffusion ratios Θ_k (zeros for species other than H, H2, or when off); convention in the module note */
  thermalDiffusionRatio: Float64Array;
}

export interface MixtureTransport {
  readonly soret: boolean;
  /** One line saying what the model is (for the flame result's `transport` field). */
  readonly description: string;
  /** Species indices that carry thermal diffusion when `soret` is on (H, H2). */
  readonly lightSpecies: readonly number[];
  /** Mixture properties at T [K], p [Pa] and mole fractions X (length nSpecies). Allocates nothing. */
  evaluate(T: number, p_Pa: number, X: Float64Array, out: MixtureTransportOut): void;
  newOutput(): MixtureTransportOut;
  pureViscosity_Pa_s(k: number, T: number): number;
  pureConductivity_W_per_mK(k: number, T: number): number;
  binaryDiffusion_m2_per_s(j: number, k: number, T: number, p_Pa: number): number;
}

/** Temperature range of the polynomial fits, K (the mechanism's thermo range for GRI-Mech 3.0). */
export const TRANSPORT_FIT_RANGE_K: readonly [number, number] = [200, 3500];
const FIT_POINTS = 50;
const NC = 5; // coefficients per fit of viscosity, diffusion and θ (degree 4)
/** Conductivity carries c_p(T), which is less smooth (NASA-7 ranges joined at 1000 K): degree 6. */
const NCL = 7;
/** Species lighter than this (kg/mol) carry thermal diffusion when the Soret option is on: H and H2. */
const LIGHT_SPECIES_MAX_kg_per_mol = 5e-3;
/** Floor added to every mole fraction in the diffusion closure (see the module note). */
const X_FLOOR = 1e-12;

// Gaussian (CGS) units for the dipole reductions: μ [statC·cm] = D × 1e-18, ε [erg], σ [cm].
const DEBYE_statC_cm = 1e-18;
const ERG_PER_J = 1e7;
const CM_PER_ANGSTROM = 1e-8;
const M_PER_ANGSTROM = 1e-10;

/** Kinetic-theory parameters of the species and pairs (SI unless said), before fitting. */
interface KineticData {
  K: number;
  W: Float64Array; // kg/mol
  mass: Float64Array; // kg per molecule
  eps: Float64Array; // ε/k_B, K
  sigma: Float64Array; // m
  deltaSelf: Float64Array; // δ*_kk
  geometry: Uint8Array;
  zrot298: Float64Array;
  /** pair (j,k) parameters, full K×K symmetric */
  pairEps: Float64Array; // ε_jk/k_B, K (ξ-corrected)
  pairSigma: Float64Array; // m (ξ-corrected)
  pairDelta: Float64Array;
  pairMass: Float64Array; // reduced mass, kg
}

function kineticData(mech: Mechanism): KineticData {
  const K = mech.nSpecies;
  const tr = mech.transport;
  const W = new Float64Array(mech.molarMass_kg_per_mol);
  const mass = new Float64Array(K);
  const eps = new Float64Array(K);
  const sigma = new Float64Array(K);
  const deltaSelf = new Float64Array(K);
  // reduced dipole squared μ*² = μ²/(εσ³) (Gaussian), and reduced polarizability α* = α/σ³
  const muStar2 = new Float64Array(K);
  const alphaStar = new Float64Array(K);
  for (let k = 0; k < K; k++) {
    const name = mech.speciesNames[k];
    const e = tr.wellDepthK[k],
      s = tr.diameterAngstrom[k];
    if (!(e > 0) || !(s > 0) || !(W[k] > 0)) {
      throw new Error(`transport: species ${name} of mechanism ${mech.name} lacks Lennard-Jones data (ε/k=${e}, σ=${s})`);
    }
    mass[k] = W[k] / NA_per_mol;
    eps[k] = e;
    sigma[k] = s * M_PER_ANGSTROM;
    const mu = tr.dipoleDebye[k] * DEBYE_statC_cm;
    const epsErg = e * kB_J_per_K * ERG_PER_J;
    const s3 = (s * CM_PER_ANGSTROM) ** 3;
    muStar2[k] = (mu * mu) / (epsErg * s3);
    deltaSelf[k] = 0.5 * muStar2[k];
    alphaStar[k] = tr.polarizabilityAngstrom3[k] / (s * s * s);
  }
  const pairEps = new Float64Array(K * K);
  const pairSigma = new Float64Array(K * K);
  const pairDelta = new Float64Array(K * K);
  const pairMass = new Float64Array(K * K);
  for (let j = 0; j < K; j++) {
    for (let k = j; k < K; k++) {
      let e = Math.sqrt(eps[j] * eps[k]);
      let s = 0.5 * (sigma[j] + sigma[k]);
      const polarJ = tr.dipoleDebye[j] > 0,
        polarK = tr.dipoleDebye[k] > 0;
      if (polarJ !== polarK) {
        const p = polarJ ? j : k,
          n = polarJ ? k : j;
        const xi = 1 + 0.25 * alphaStar[n] * muStar2[p] * Math.sqrt(eps[p] / eps[n]);
        e *= xi * xi;
        s *= xi ** (-1 / 6);
      }
      // δ*_jk = μ_j μ_k / (2 ε_jk σ_jk³), zero unless both are polar
      let d = 0;
      if (polarJ && polarK) {
        const mu2 = tr.dipoleDebye[j] * tr.dipoleDebye[k] * DEBYE_statC_cm * DEBYE_statC_cm;
        d = (0.5 * mu2) / (e * kB_J_per_K * ERG_PER_J * (s * 100) ** 3);
      }
      const m = (mass[j] * mass[k]) / (mass[j] + mass[k]);
      for (const idx of [j * K + k, k * K + j]) {
        pairEps[idx] = e;
        pairSigma[idx] = s;
        pairDelta[idx] = d;
        pairMass[idx] = m;
      }
    }
  }
  return {
    K,
    W,
    mass,
    eps,
    sigma,
    deltaSelf,
    geometry: new Uint8Array(tr.geometry),
    zrot298: new Float64Array(tr.rotationalRelaxation),
    pairEps,
    pairSigma,
    pairDelta,
    pairMass,
  };
}

/** Chapman–Enskog binary diffusion coefficient times pressure, D_jk·p [m²·Pa/s], from kinetic theory. */
function binaryDp(kd: KineticData, j: number, k: number, T: number): number {
  const i = j * kd.K + k;
  const Ts = T / kd.pairEps[i];
  const kT = kB_J_per_K * T;
  const s = kd.pairSigma[i];
  return ((3 / 16) * Math.sqrt((2 * Math.PI * kT * kT * kT) / kd.pairMass[i])) / (Math.PI * s * s * omega11Star(Ts, kd.pairDelta[i]));
}

/** Chapman–Enskog viscosity of pure species k, Pa·s, from kinetic theory. */
function viscosityKT(kd: KineticData, k: number, T: number): number {
  const s = kd.sigma[k];
  return ((5 / 16) * Math.sqrt(Math.PI * kd.mass[k] * kB_J_per_K * T)) / (Math.PI * s * s * omega22Star(T / kd.eps[k], kd.deltaSelf[k]));
}

/** Parker's F(T) for the temperature dependence of Z_rot. */
function parkerF(epsOverT: number): number {
  const pi15 = Math.PI ** 1.5;
  return 1 + (pi15 / 2) * Math.sqrt(epsOverT) + (Math.PI ** 2 / 4 + 2) * epsOverT + pi15 * epsOverT ** 1.5;
}

/** Warnatz-type conductivity of pure species k, W/(m·K), given its c_p/R at T. */
function conductivityKT(kd: KineticData, k: number, T: number, cp_R: number): number {
  const R = R_J_per_molK;
  const eta = viscosityKT(kd, k, T);
  const W = kd.W[k];
  const cvTr = 1.5 * R;
  if (kd.geometry[k] === 0) return (eta / W) * 2.5 * cvTr;
  // ρ D_kk / η with ρ = pW/(RT): p cancels
  const rhoD = (binaryDp(kd, k, k, T) * W) / (R * T);
  const f = rhoD / eta;
  const cvRot = kd.geometry[k] === 1 ? R : 1.5 * R;
  const cvVib = Math.max(0, (cp_R - 1) * R - cvTr - cvRot);
  const eps = kd.eps[k];
  const zrot = (kd.zrot298[k] * parkerF(eps / 298)) / parkerF(eps / T);
  const A = 2.5 - f;
  const B = zrot + (2 / Math.PI) * ((5 / 3) * (cvRot / R) + f);
  const fTr = 2.5 * (1 - (2 / Math.PI) * (cvRot / cvTr) * (A / B));
  const fRot = f * (1 + (2 / Math.PI) * (A / B));
  const fVib = f;
  return (eta / W) * (fTr * cvTr + fRot * cvRot + fVib * cvVib);
}

/** Chapman–Cowling first-approximation coefficient θ_kj of the thermal diffusion ratio. */
function soretTheta(kd: KineticData, k: number, j: number, T: number): number {
  const i = k * kd.K + j;
  const Ts = T / kd.pairEps[i];
  const d = kd.pairDelta[i];
  const A = aStar(Ts, d);
  const C = cStar(Ts, d);
  const B = ratiosLJFromRecursion(Ts).bStar;
  const Wk = kd.W[k],
    Wj = kd.W[j];
  return ((7.5 * (2 * A + 5) * (6 * C - 5)) / (A * (16 * A - 12 * B + 55))) * ((Wk - Wj) / (Wk + Wj));
}

/** Solves the small dense system M c = b in place (Gaussian elimination, partial pivoting). */
function solveDense(M: Float64Array, b: Float64Array, n: number): void {
  for (let c = 0; c < n; c++) {
    let piv = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(M[r * n + c]) > Math.abs(M[piv * n + c])) piv = r;
    if (piv !== c) {
      for (let q = 0; q < n; q++) {
        const t = M[c * n + q];
        M[c * n + q] = M[piv * n + q];
        M[piv * n + q] = t;
      }
      const t = b[c];
      b[c] = b[piv];
      b[piv] = t;
    }
    const d = M[c * n + c];
    if (d === 0) throw new Error("transport: singular least-squares system in the property fits");
    for (let r = c + 1; r < n; r++) {
      const f = M[r * n + c] / d;
      if (f === 0) continue;
      for (let q = c; q < n; q++) M[r * n + q] -= f * M[c * n + q];
      b[r] -= f * b[c];
    }
  }
  for (let c = n - 1; c >= 0; c--) {
    let s = b[c];
    for (let q = c + 1; q < n; q++) s -= M[c * n + q] * b[q];
    b[c] = s / M[c * n + c];
  }
}

/** Weighted least-squares polynomial (nc coefficients) of y(u) with weights w; writes into out[at..at+nc). */
function fitPoly(u: Float64Array, y: Float64Array, w: Float64Array, out: Float64Array, at: number, nc = NC): void {
  const NC = nc;
  const M = new Float64Array(NC * NC);
  const b = new Float64Array(NC);
  const pw = new Float64Array(NC);
  for (let i = 0; i < u.length; i++) {
    pw[0] = 1;
    for (let q = 1; q < NC; q++) pw[q] = pw[q - 1] * u[i];
    const wi = w[i] * w[i];
    for (let r = 0; r < NC; r++) {
      b[r] += wi * pw[r] * y[i];
      for (let q = 0; q < NC; q++) M[r * NC + q] += wi * pw[r] * pw[q];
    }
  }
  solveDense(M, b, NC);
  out.set(b, at);
}

function describe(mech: Mechanism, soret: boolean): string {
  return (
    `mixture-averaged (${mech.name} Lennard-Jones data; Chapman–Enskog with Monchick–Mason collision integrals; ` +
    `Warnatz conductivity; Wilke viscosity; D_km = (1 − Y_k)/Σ X_j/D_jk); ` +
    `thermal diffusion of H and H2: ${soret ? "on" : "off"}`
  );
}

/** The fitted, read-only part of a transport model: made once per mechanism and option set. */
interface TransportFits {
  K: number;
  soret: boolean;
  W: Float64Array;
  uc: number;
  uh: number;
  viscFit: Float64Array; // √η_k / T^¼, K × NC
  condFit: Float64Array; // λ_k / √T, K × NCL
  diffFit: Float64Array; // T^1.5 / (p D_jk), K × K × NC (symmetric, full)
  light: number[];
  thetaFit: Float64Array; // θ_kj of light species l: (l·K + j) × NC
  wq: Float64Array; // (W_j/W_k)^¼ at k·K + j
  wd: Float64Array; // 1/√(8(1 + W_k/W_j)) at k·K + j
  wr: Float64Array; // W_k/W_j at k·K + j
}

function buildFits(mech: Mechanism, soret: boolean): TransportFits {
  const kd = kineticData(mech);
  const K = kd.K;
  const [Tmin, Tmax] = TRANSPORT_FIT_RANGE_K;
  const lnMin = Math.log(Tmin),
    lnMax = Math.log(Tmax);
  const uc = 0.5 * (lnMin + lnMax);
  const uh = 0.5 * (lnMax - lnMin);

  // Fit temperatures, evenly spaced in ln T
  const Tfit = new Float64Array(FIT_POINTS);
  const ufit = new Float64Array(FIT_POINTS);
  for (let i = 0; i < FIT_POINTS; i++) {
    const ln = lnMin + ((lnMax - lnMin) * i) / (FIT_POINTS - 1);
    Tfit[i] = Math.exp(ln);
    ufit[i] = (ln - uc) / uh;
  }
  const cpR = new Float64Array(FIT_POINTS * K);
  {
    const cp = new Float64Array(K),
      h = new Float64Array(K),
      s = new Float64Array(K);
    for (let i = 0; i < FIT_POINTS; i++) {
      speciesThermoInto(mech, Tfit[i], cp, h, s);
      cpR.set(cp, i * K);
    }
  }

  const viscFit = new Float64Array(K * NC);
  const condFit = new Float64Array(K * NCL);
  const diffFit = new Float64Array(K * K * NC);
  const y = new Float64Array(FIT_POINTS);
  const w = new Float64Array(FIT_POINTS);
  for (let k = 0; k < K; k++) {
    for (let i = 0; i < FIT_POINTS; i++) {
      y[i] = Math.sqrt(viscosityKT(kd, k, Tfit[i])) / Tfit[i] ** 0.25;
      w[i] = 1 / y[i];
    }
    fitPoly(ufit, y, w, viscFit, k * NC);
    for (let i = 0; i < FIT_POINTS; i++) {
      y[i] = conductivityKT(kd, k, Tfit[i], cpR[i * K + k]) / Math.sqrt(Tfit[i]);
      w[i] = 1 / y[i];
    }
    fitPoly(ufit, y, w, condFit, k * NCL, NCL);
  }
  for (let j = 0; j < K; j++) {
    for (let k = j; k < K; k++) {
      for (let i = 0; i < FIT_POINTS; i++) {
        y[i] = Tfit[i] ** 1.5 / binaryDp(kd, j, k, Tfit[i]);
        w[i] = 1 / y[i];
      }
      fitPoly(ufit, y, w, diffFit, (j * K + k) * NC);
      diffFit.copyWithin((k * K + j) * NC, (j * K + k) * NC, (j * K + k) * NC + NC);
    }
  }

  const light: number[] = [];
  if (soret) for (let k = 0; k < K; k++) if (kd.W[k] < LIGHT_SPECIES_MAX_kg_per_mol) light.push(k);
  const nL = light.length;
  const thetaFit = new Float64Array(nL * K * NC);
  w.fill(1);
  for (let l = 0; l < nL; l++) {
    for (let j = 0; j < K; j++) {
      if (j === light[l]) continue;
      for (let i = 0; i < FIT_POINTS; i++) y[i] = soretTheta(kd, light[l], j, Tfit[i]);
      fitPoly(ufit, y, w, thetaFit, (l * K + j) * NC);
    }
  }

  const wq = new Float64Array(K * K);
  const wd = new Float64Array(K * K);
  const wr = new Float64Array(K * K);
  for (let k = 0; k < K; k++) {
    for (let j = 0; j < K; j++) {
      wr[k * K + j] = kd.W[k] / kd.W[j];
      wq[k * K + j] = (kd.W[j] / kd.W[k]) ** 0.25;
      wd[k * K + j] = 1 / Math.sqrt(8 * (1 + kd.W[k] / kd.W[j]));
    }
  }
  return { K, soret, W: kd.W, uc, uh, viscFit, condFit, diffFit, light, thetaFit, wq, wd, wr };
}

const fitCache = new WeakMap<Mechanism, Map<boolean, TransportFits>>();

function fitsFor(mech: Mechanism, soret: boolean): TransportFits {
  let m = fitCache.get(mech);
  if (!m) {
    m = new Map();
    fitCache.set(mech, m);
  }
  let f = m.get(soret);
  if (!f) {
    f = buildFits(mech, soret);
    m.set(soret, f);
  }
  return f;
}

/**
 * The transport evaluator of a mechanism. The kinetic theory and the polynomial fits are computed
 * once per mechanism and option set (a few hundred milliseconds) and cached; each call returns an
 * evaluator with its own work arrays. evaluate() allocates nothing and keeps the temperature-only
 * part (pure-species values, Wilke's Φ_kj, D_jk·p, θ_kj) from its previous call when T is the same,
 * so perturbing only the composition (Jacobian columns) costs two K×K sums.
 */
export function createMixtureTransport(mech: Mechanism, options: TransportOptions = {}): MixtureTransport {
  const soret = options.soret === true;
  const F = fitsFor(mech, soret);
  const { K, uc, uh, viscFit, condFit, diffFit, light, thetaFit, wq, wd, wr } = F;
  const Wm = F.W;
  const nL = light.length;

  // Work arrays for evaluate(): T-only quantities (kept while T is unchanged) and composition ones
  let lastT = Number.NaN;
  const etaK = new Float64Array(K); // η_k / √T  (√T cancels in Wilke's rule)
  const lamK = new Float64Array(K); // λ_k
  const phi = new Float64Array(K * K); // Wilke Φ_kj
  const invDp = new Float64Array(K * K); // T^1.5 / (p D_jk), zero diagonal
  const theta = new Float64Array(nL * K); // θ_kj of the light species
  const sv = new Float64Array(K);
  const invSv = new Float64Array(K);
  const Xc = new Float64Array(K);

  const poly = (c: Float64Array, at: number, u: number): number =>
    c[at] + u * (c[at + 1] + u * (c[at + 2] + u * (c[at + 3] + u * c[at + 4])));
  const uOf = (T: number): number => (Math.log(T) - uc) / uh;
  const checkState = (T: number, p: number): void => {
    if (!(T > 0 && T < Infinity)) throw new Error(`transport: temperature ${T} K is not a positive finite number`);
    if (!(p > 0 && p < Infinity)) throw new Error(`transport: pressure ${p} Pa is not a positive finite number`);
  };

  function temperaturePart(T: number): void {
    const u = uOf(T);
    const u2 = u * u,
      u3 = u2 * u,
      u4 = u3 * u;
    const sqrtT = Math.sqrt(T);
    for (let k = 0; k < K; k++) {
      const o = k * NC;
      const s = viscFit[o] + viscFit[o + 1] * u + viscFit[o + 2] * u2 + viscFit[o + 3] * u3 + viscFit[o + 4] * u4;
      sv[k] = s;
      invSv[k] = 1 / s;
      etaK[k] = s * s;
      const c = k * NCL;
      lamK[k] =
        sqrtT *
        (condFit[c] +
          u *
            (condFit[c + 1] +
              u * (condFit[c + 2] + u * (condFit[c + 3] + u * (condFit[c + 4] + u * (condFit[c + 5] + u * condFit[c + 6]))))));
    }
    // Wilke: Φ_kj = [1 + (η_k/η_j)^½ (W_j/W_k)^¼]² / √(8(1 + W_k/W_j)); Φ_jk = Φ_kj (η_j/η_k)(W_k/W_j)
    for (let k = 0; k < K; k++) {
      const row = k * K;
      phi[row + k] = 1;
      const sk = sv[k];
      for (let j = k + 1; j < K; j++) {
        const r = sk * invSv[j] * wq[row + j]; // (η_k/η_j)^½ (W_j/W_k)^¼
        const a = 1 + r;
        const p = a * a * wd[row + j];
        phi[row + j] = p;
        const t = sv[j] * invSv[k]; // (η_j/η_k)^½
        phi[j * K + k] = p * t * t * wr[row + j]; // Φ_jk = Φ_kj (η_j/η_k)(W_k/W_j)
      }
    }
    for (let j = 0; j < K; j++) {
      invDp[j * K + j] = 0;
      for (let k = j + 1; k < K; k++) {
        const o = (j * K + k) * NC;
        const g = diffFit[o] + diffFit[o + 1] * u + diffFit[o + 2] * u2 + diffFit[o + 3] * u3 + diffFit[o + 4] * u4;
        invDp[j * K + k] = g;
        invDp[k * K + j] = g;
      }
    }
    for (let l = 0; l < nL; l++) {
      for (let j = 0; j < K; j++) {
        const o = (l * K + j) * NC;
        theta[l * K + j] =
          j === light[l] ? 0 : thetaFit[o] + thetaFit[o + 1] * u + thetaFit[o + 2] * u2 + thetaFit[o + 3] * u3 + thetaFit[o + 4] * u4;
      }
    }
    lastT = T;
  }

  function evaluate(T: number, p_Pa: number, X: Float64Array, out: MixtureTransportOut): void {
    checkState(T, p_Pa);
    if (T !== lastT) temperaturePart(T);
    // floored, normalised mole fractions
    let sumX = 0;
    for (let k = 0; k < K; k++) {
      const x = X[k] > 0 ? X[k] + X_FLOOR : X_FLOOR;
      Xc[k] = x;
      sumX += x;
    }
    const invSumX = 1 / sumX;
    let Wbar = 0,
      sumXlam = 0,
      sumXoverLam = 0;
    for (let k = 0; k < K; k++) {
      const x = Xc[k] * invSumX;
      Xc[k] = x;
      Wbar += x * Wm[k];
      sumXlam += x * lamK[k];
      sumXoverLam += x / lamK[k];
    }
    out.conductivity_W_per_mK = 0.5 * (sumXlam + 1 / sumXoverLam);

    // Wilke's sums and the diffusion closure D_km = Σ_{j≠k} X_j W_j / (W̄ Σ_{j≠k} X_j / D_jk)
    const scale = (T * Math.sqrt(T)) / p_Pa; // D_jk = scale / invDp
    const Dkm = out.Dkm_m2_per_s;
    let eta = 0;
    for (let k = 0; k < K; k++) {
      const row = k * K;
      let den = 0,
        dsum = 0;
      for (let j = 0; j < K; j++) {
        const x = Xc[j];
        den += x * phi[row + j];
        dsum += x * invDp[row + j];
      }
      eta += (Xc[k] * etaK[k]) / den;
      let num = Wbar - Xc[k] * Wm[k];
      if (num < 1e-6 * Wbar) {
        // nearly pure k: sum the others explicitly (no cancellation)
        num = 0;
        for (let j = 0; j < K; j++) if (j !== k) num += Xc[j] * Wm[j];
      }
      Dkm[k] = (num * scale) / (Wbar * dsum);
    }
    out.viscosity_Pa_s = eta * Math.sqrt(T);

    if (soret) {
      const kT = out.thermalDiffusionRatio;
      for (let l = 0; l < nL; l++) {
        const k = light[l];
        let s = 0;
        for (let j = 0; j < K; j++) s += Xc[j] * theta[l * K + j];
        kT[k] = s * Xc[k];
      }
    }
  }

  return {
    soret,
    description: describe(mech, soret),
    lightSpecies: light,
    evaluate,
    newOutput: () => ({
      viscosity_Pa_s: Number.NaN,
      conductivity_W_per_mK: Number.NaN,
      Dkm_m2_per_s: new Float64Array(K),
      thermalDiffusionRatio: new Float64Array(K),
    }),
    pureViscosity_Pa_s(k: number, T: number): number {
      checkState(T, 1);
      const s = poly(viscFit, k * NC, uOf(T));
      return s * s * Math.sqrt(T);
    },
    pureConductivity_W_per_mK(k: number, T: number): number {
      checkState(T, 1);
      const u = uOf(T);
      let v = 0;
      for (let q = NCL - 1; q >= 0; q--) v = v * u + condFit[k * NCL + q];
      return Math.sqrt(T) * v;
    },
    binaryDiffusion_m2_per_s(j: number, k: number, T: number, p_Pa: number): number {
      checkState(T, p_Pa);
      return (T * Math.sqrt(T)) / (p_Pa * poly(diffFit, (j * K + k) * NC, uOf(T)));
    },
  };
}
