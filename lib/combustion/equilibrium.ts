/**
 * Chemical equilibrium of an ideal-gas product mixture by Gibbs energy minimisation, after the
 * element-potential method of S. Gordon & B.J. McBride, "Computer Program for Calculation of
 * Complex Chemical Equilibrium Compositions and Applications, I. Analysis", NASA RP-1311 (1994):
 *
 * - ch. 2: the reduced Gibbs iteration equations. Unknowns are the element potentials π_i (one per
 *   element present), Δln n (n = total moles) and, for a problem at fixed enthalpy and pressure
 *   (HP), Δln T. The species corrections follow from them:
 *     Δln n_j = −μ_j/RT + Σ_i a_ij π_i + Δln n + (h°_j/RT) Δln T.
 * - ch. 3: the control factor λ that limits each Newton step (λ1 keeps |Δln T|, |Δln n| ≤ 0.4 and
 *   |Δln n_j| ≤ 2 for species above the size threshold n_j/n = 1e-8; λ2 keeps species below that
 *   threshold from jumping above n_j/n = 1e-4 in one step), and the convergence tests
 *   (n_j |Δln n_j| / Σn_j ≤ 0.5e-5, n |Δln n| / Σn_j ≤ 0.5e-5, |Δln T| ≤ 1e-4, element
 *   residuals ≤ 1e-6 of the largest element amount).
 *
 * Chemical potentials are those of ideal gases: μ_j/RT = g°_j/RT + ln(n_j/n) + ln(P/P°_j), with
 * P°_j the standard-state pressure of the species' data (1 bar). All ln n_j are kept (no species is
 * removed as "trace"); a species far below any physical amount is held at a floor of
 * n_j/n = e^-300 (lower if an element is scarcer) so that nothing underflows. Only gaseous products are modelled: no condensed
 * water, no solid carbon.
 *
 * After the RP-1311 tests pass, Newton steps continue (they converge quadratically: usually one more)
 * until a full step changes no ln n_j, ln n or ln T by more than 1e-7, which leaves errors of order
 * its square. The result is then verified: element balance ≤ 1e-10 relative for every element and
 * enthalpy balance ≤ 1e-6 relative (HP), otherwise EquilibriumNotConvergedError is thrown. The solver
 * never returns an unverified number.
 *
 * Cold start (no warm start given): the products of complete combustion (on the rich side CO and H2
 * share the oxygen deficit), a temperature from the enthalpy balance of those products (capped at
 * 3000 K), O2/CO/H2 seeded near φ = 1 in hot mixtures, and the remaining species from element
 * potentials fitted to that estimate. Typical cold solves take 3–7 Newton iterations.
 */
import { ELEMENTS, evalInto, type Element, type Nasa7Species } from "../thermo/nasa7";
import { SPECIES } from "../thermo/species-data";
import { R_J_per_molK } from "../units/constants";

export interface EquilibriumProblem {
  /** Moles of each element in the reactant charge (any consistent amount; e.g. per mole of fuel). */
  elementMoles: Partial<Record<Element, number>>;
  /** Total reactant enthalpy of that charge, J, NASA convention (includes formation enthalpies). HP only. */
  enthalpyJ: number;
  pressurePa: number;
  /**
   * Product species (keys of SPECIES, gases). Default: CO2, CO, H2O, H2, O2, N2, OH, H, O, NO, Ar, and
   * SO2 and H2S when sulfur is present. Species containing an element absent from the charge are dropped.
   */
  productSpecies?: readonly string[];
  /** Starting temperature for the iteration, K (HP). */
  initialTemperatureK?: number;
  /** Start from a previous solution (its moles and temperature). */
  warmStart?: EquilibriumResult;
}

export interface EquilibriumResult {
  temperatureK: number;
  pressurePa: number;
  /** Product species actually used (species with an absent element are dropped). */
  species: readonly string[];
  /**
   * Moles of each species, in the order of `species`, for the charge given by elementMoles. (A view into
   * a buffer shared with other results: copy it before transferring its buffer.)
   */
  moles: Float64Array;
  moleFractions: Record<string, number>;
  totalMoles: number;
  /** Newton iterations used. */
  iterations: number;
  /** max over elements of |b°_i − Σ_j a_ij n_j| / b°_i. */
  elementBalanceRelError: number;
  /**
   * HP: |Σ n_j h_j(T) − H°| / max(Σ n_j |h_j(T)|, R T Σ n_j); TP: 0 (no enthalpy constraint).
   */
  enthalpyBalanceRelError: number;
}

export type EquilibriumTPProblem = Omit<EquilibriumProblem, "enthalpyJ"> & { temperatureK: number };

/** The iteration did not reach a verified solution. Never accompanied by a result. */
export class EquilibriumNotConvergedError extends Error {
  readonly iterations: number;
  /** Largest scaled correction (or balance error) at the last iteration. */
  readonly lastResidual: number;
  constructor(message: string, iterations: number, lastResidual: number) {
    super(message);
    this.name = "EquilibriumNotConvergedError";
    this.iterations = iterations;
    this.lastResidual = lastResidual;
  }
}

/**
 * The charge cannot form an all-gas equilibrium with the product species given (e.g. too little oxygen
 * to turn all carbon into CO with the default species: solid carbon would form, which is not modelled).
 */
export class EquilibriumInfeasibleError extends EquilibriumNotConvergedError {
  constructor(message: string) {
    super(message, 0, Number.POSITIVE_INFINITY);
    this.name = "EquilibriumInfeasibleError";
  }
}

/** Default product species: products of hydrocarbon, hydrogen and ammonia flames in air or oxygen. */
export const DEFAULT_PRODUCT_SPECIES: readonly string[] = Object.freeze([
  "CO2", "CO", "H2O", "H2", "O2", "N2", "OH", "H", "O", "NO", "Ar",
]);
const DEFAULT_WITH_SULFUR: readonly string[] = Object.freeze([...DEFAULT_PRODUCT_SPECIES, "SO2", "H2S"]);

// ---- numerical settings ---------------------------------------------------------------------------

const NE_ALL = ELEMENTS.length; // 6
const E_C = ELEMENTS.indexOf("C");
const E_H = ELEMENTS.indexOf("H");
const E_O = ELEMENTS.indexOf("O");
const E_N = ELEMENTS.indexOf("N");
const E_S = ELEMENTS.indexOf("S");
const E_AR = ELEMENTS.indexOf("Ar");
/** RP-1311 size threshold: ln(1e-8). */
const SIZE = 18.420681;
/** RP-1311 λ2 target: ln(1e-4). */
const LN_1E4 = 9.2103404;
/** Floor for ln(n_j/n): species are held at e^-300 of the total at least (lower for trace elements). */
const LN_FLOOR = 300;
/** RP-1311 convergence tolerances. */
const TOL_MOLES = 0.5e-5;
const TOL_LNT = 1e-4;
const TOL_ELEMENT_RP1311 = 1e-6;
/**
 * After the RP-1311 tests pass, Newton steps continue until the last full step changed no ln n_j, ln n
 * or ln T by more than this; Newton's quadratic convergence leaves errors of its square (~1e-14).
 */
const TOL_FINAL_STEP = 1e-7;
/** The RP-1311 tests weigh species by amount; trace elements may need further steps. */
const MAX_POLISH_ITERATIONS = 60;
/** Verification limits: element balance (relative, per element) and enthalpy balance (relative). */
const LIMIT_ELEMENT_BALANCE = 1e-10;
const LIMIT_ENTHALPY_BALANCE = 1e-6;
const MAX_ITERATIONS = 300;
/** Element amounts below this fraction of the largest are refused (give 0 instead). */
const MIN_ELEMENT_RATIO = 1e-200;
/** Temperature bounds during the iteration, K. */
const T_ITER_MIN = 150;
const T_ITER_MAX = 7000;
/**
 * Species whose data start at 298.15 K or 300 K (older fits: H2S, SO2, n-pentane) are used down to this
 * temperature, K; their polynomials are smooth there. Otherwise no extrapolation beyond the data ranges.
 */
const T_EXTRAPOLATE_DOWN_TO = 200;
/** Cold-start temperature estimate is capped here, K (dissociation keeps real flames below it). */
const T_GUESS_MAX = 3000;
const T_GUESS_MIN = 200;
/** Cold start: amount of every non-major species relative to the total, just below the size threshold. */
const TRACE_START = Math.exp(-SIZE - 1);
/** Cold start near φ = 1: O2, CO and H2 seeded at this fraction of (C + H/2). */
const SEED_NEAR_STOICH = 0.02;
/** ... only when the temperature estimate is at least this, K. */
const T_SEED_MIN = 1500;

function fail(field: string, msg: string): never {
  throw new Error(`${field}: ${msg}`);
}

/**
 * Equilibrium solver for one list of product species with its own pre-allocated workspace: create it
 * once and call solveHP / solveTP many times (the fast path; nothing is allocated inside the iteration,
 * only the result object at the end). Species whose elements are absent from a charge are switched off
 * for that solve. Not re-entrant (one workspace): use one solver per concurrent caller.
 */
export class EquilibriumSolver {
  readonly productSpecies: readonly string[];
  private readonly data: Nasa7Species[];
  private readonly ns: number;
  /** a_ij for all six elements, flat [element * ns + species]. */
  private readonly aAll: Float64Array;
  private readonly elementInList: Uint8Array;
  /** ln(P°_j / Pa) of each species' standard state. */
  private readonly lnPstd: Float64Array;
  /** Temperature range in which each species' data are used, K (see T_EXTRAPOLATE_DOWN_TO). */
  private readonly tLowOf: Float64Array;
  private readonly tHighOf: Float64Array;
  /** The same for the active species of the current charge. */
  private tLow = 0;
  private tHigh = Infinity;
  // thermo at the current temperature, by list index j
  private readonly cpR: Float64Array;
  private readonly hRT: Float64Array;
  private readonly sR: Float64Array;
  // active sets of the current charge (rebuilt only when the set of elements present changes)
  private activeMask = -1;
  /** Largest element amount of the current charge, mol: the iteration works on amounts divided by it. */
  private scale = 1;
  /** ln of the floor for n_j (scaled), from the scarcest element of the current charge. */
  private lnFloorAbs = -Infinity;
  private readonly b0All: Float64Array;
  private readonly actSp: Int32Array;
  private readonly actEl: Int32Array;
  /** Least oxygen atoms per atom of each element that the active species allow. */
  private readonly oxygenPerAtom: Float64Array;
  /** Active index k of list species j, −1 if switched off. */
  private readonly kOf: Int32Array;
  private nS = 0;
  private nE = 0;
  /** a_ij of active elements × active species, flat [ie * ns + k]. */
  private readonly a: Float64Array;
  /** Non-zero a_ik as (element row, species, value) triples. */
  private readonly entI: Int32Array;
  private readonly entK: Int32Array;
  private readonly entA: Float64Array;
  private nEnt = 0;
  /** Non-zero a_ik a_i'k (i ≤ i') as (matrix slot, species, value) triples. */
  private readonly pairSlot: Int32Array;
  private readonly pairK: Int32Array;
  private readonly pairC: Float64Array;
  private nPair = 0;
  private activeKeys: readonly string[] = [];
  private fractionsTemplate: Record<string, number> = {};
  private readonly b0: Float64Array;
  // iteration state, by active species k
  private readonly lnn: Float64Array;
  private readonly n: Float64Array;
  private readonly mu: Float64Array;
  private readonly dln: Float64Array;
  private readonly H: Float64Array;
  private readonly isMajorGuess: Uint8Array;
  /** ln of the largest amount of each species the charge's elements allow. */
  private readonly lnLimit: Float64Array;
  // linear system (≤ 8 × 8), row stride 8
  private readonly M: Float64Array;
  private readonly rhs: Float64Array;
  private readonly x: Float64Array;
  // list indices of the named majors (−1 if absent), for the cold-start estimate
  private readonly iCO2: number;
  private readonly iCO: number;
  private readonly iH2O: number;
  private readonly iH2: number;
  private readonly iO2: number;
  private readonly iN2: number;
  private readonly iAr: number;
  private readonly iSO2: number;
  private readonly scratchN: Float64Array;
  private readonly warmMap: Int32Array;

  constructor(productSpecies: readonly string[]) {
    if (!Array.isArray(productSpecies) || productSpecies.length === 0) {
      fail("productSpecies", "give at least one product species");
    }
    const seen = new Set<string>();
    const data: Nasa7Species[] = [];
    for (const key of productSpecies) {
      const sp = Object.prototype.hasOwnProperty.call(SPECIES, key) ? SPECIES[key] : undefined;
      if (!sp) fail("productSpecies", `unknown species "${key}"`);
      if (sp.phase !== "gas") fail("productSpecies", `"${key}" is not a gas; only gaseous products are modelled`);
      if (seen.has(key)) fail("productSpecies", `"${key}" is listed twice`);
      seen.add(key);
      data.push(sp);
    }
    this.productSpecies = Object.freeze([...productSpecies]);
    this.data = data;
    const ns = data.length;
    this.ns = ns;
    this.aAll = new Float64Array(NE_ALL * ns);
    this.elementInList = new Uint8Array(NE_ALL);
    this.lnPstd = new Float64Array(ns);
    this.tLowOf = new Float64Array(ns);
    this.tHighOf = new Float64Array(ns);
    for (let j = 0; j < ns; j++) {
      const sp = data[j];
      for (let e = 0; e < NE_ALL; e++) {
        const c = sp.elements[ELEMENTS[e]] ?? 0;
        this.aAll[e * ns + j] = c;
        if (c > 0) this.elementInList[e] = 1;
      }
      this.lnPstd[j] = Math.log(sp.standardPressurePa);
      this.tLowOf[j] = sp.rangesK[0] <= 300 ? Math.min(sp.rangesK[0], T_EXTRAPOLATE_DOWN_TO) : sp.rangesK[0];
      this.tHighOf[j] = sp.rangesK[2];
    }
    this.cpR = new Float64Array(ns);
    this.hRT = new Float64Array(ns);
    this.sR = new Float64Array(ns);
    this.b0All = new Float64Array(NE_ALL);
    this.actSp = new Int32Array(ns);
    this.actEl = new Int32Array(NE_ALL);
    this.kOf = new Int32Array(ns);
    this.oxygenPerAtom = new Float64Array(NE_ALL);
    this.a = new Float64Array(NE_ALL * ns);
    this.entI = new Int32Array(NE_ALL * ns);
    this.entK = new Int32Array(NE_ALL * ns);
    this.entA = new Float64Array(NE_ALL * ns);
    const maxPairs = ((NE_ALL * (NE_ALL + 1)) / 2) * ns;
    this.pairSlot = new Int32Array(maxPairs);
    this.pairK = new Int32Array(maxPairs);
    this.pairC = new Float64Array(maxPairs);
    this.b0 = new Float64Array(NE_ALL);
    this.lnn = new Float64Array(ns);
    this.n = new Float64Array(ns);
    this.mu = new Float64Array(ns);
    this.dln = new Float64Array(ns);
    this.H = new Float64Array(ns);
    this.isMajorGuess = new Uint8Array(ns);
    this.lnLimit = new Float64Array(ns);
    this.M = new Float64Array(64);
    this.rhs = new Float64Array(8);
    this.x = new Float64Array(8);
    const list = this.productSpecies;
    this.iCO2 = list.indexOf("CO2");
    this.iCO = list.indexOf("CO");
    this.iH2O = list.indexOf("H2O");
    this.iH2 = list.indexOf("H2");
    this.iO2 = list.indexOf("O2");
    this.iN2 = list.indexOf("N2");
    this.iAr = list.indexOf("Ar");
    this.iSO2 = list.indexOf("SO2");
    this.scratchN = new Float64Array(ns);
    this.warmMap = new Int32Array(ns);
  }

  /** Equilibrium at fixed enthalpy and pressure (adiabatic flame). */
  solveHP(p: EquilibriumProblem): EquilibriumResult {
    if (typeof p.enthalpyJ !== "number" || !Number.isFinite(p.enthalpyJ)) {
      fail("enthalpyJ", `must be a finite number, got ${String(p.enthalpyJ)}`);
    }
    const T0 = p.initialTemperatureK;
    if (T0 !== undefined && !(typeof T0 === "number" && T0 > 0 && Number.isFinite(T0))) {
      fail("initialTemperatureK", `must be a positive finite number, got ${String(T0)}`);
    }
    return this.solve(p, true, p.enthalpyJ, T0 ?? NaN);
  }

  /** Equilibrium at fixed temperature and pressure. */
  solveTP(p: EquilibriumTPProblem): EquilibriumResult {
    const T = p.temperatureK;
    if (typeof T !== "number" || !Number.isFinite(T) || T <= 0) {
      fail("temperatureK", `must be a positive finite number, got ${String(T)}`);
    }
    return this.solve(p, false, 0, T);
  }

  /** Validates the charge and (re)builds the active element and species sets. */
  private setup(p: Omit<EquilibriumProblem, "enthalpyJ">): void {
    const ps = p.productSpecies;
    if (ps !== undefined && ps !== this.productSpecies) {
      let same = Array.isArray(ps) && ps.length === this.ns;
      for (let j = 0; same && j < this.ns; j++) same = ps[j] === this.productSpecies[j];
      if (!same) fail("productSpecies", "differs from the species list this solver was created for");
    }
    const P = p.pressurePa;
    if (typeof P !== "number" || !Number.isFinite(P) || P <= 0) {
      fail("pressurePa", `must be a positive finite number, got ${String(P)}`);
    }
    const em = p.elementMoles;
    if (em === null || typeof em !== "object") fail("elementMoles", "must be an object of element amounts");
    for (const key in em) {
      if (!(ELEMENTS as readonly string[]).includes(key)) {
        fail("elementMoles", `unknown element "${key}" (known: ${ELEMENTS.join(", ")})`);
      }
    }
    const b0All = this.b0All;
    let mask = 0;
    for (let e = 0; e < NE_ALL; e++) {
      const v = em[ELEMENTS[e]] ?? 0;
      if (typeof v !== "number" || !Number.isFinite(v) || v < 0) {
        fail(`elementMoles.${ELEMENTS[e]}`, `must be a finite number ≥ 0, got ${String(v)}`);
      }
      b0All[e] = v;
      if (v > 0) {
        if (!this.elementInList[e]) {
          fail(`elementMoles.${ELEMENTS[e]}`, `no product species contains element ${ELEMENTS[e]}`);
        }
        mask |= 1 << e;
      }
    }
    if (mask === 0) fail("elementMoles", "the charge contains no element");
    // The iteration works on amounts scaled so that the largest element amount is 1.
    let scale = 0;
    for (let e = 0; e < NE_ALL; e++) if (b0All[e] > scale) scale = b0All[e];
    for (let e = 0; e < NE_ALL; e++) {
      if (b0All[e] > 0 && b0All[e] < MIN_ELEMENT_RATIO * scale) {
        fail(
          `elementMoles.${ELEMENTS[e]}`,
          `${b0All[e]} is below ${MIN_ELEMENT_RATIO} of the largest element amount; give 0 or a meaningful amount`,
        );
      }
      b0All[e] /= scale;
    }
    this.scale = scale;
    let bmin = 1;
    for (let e = 0; e < NE_ALL; e++) if (b0All[e] > 0 && b0All[e] < bmin) bmin = b0All[e];
    // floor for ln n_j: far below the scarcest element (a species parked at the floor does not follow
    // the linearised step, so its amount must be negligible for every element)
    this.lnFloorAbs = Math.log(bmin) - 50;
    if (mask !== this.activeMask) this.buildActiveSets(mask);
    for (let ie = 0; ie < this.nE; ie++) this.b0[ie] = b0All[this.actEl[ie]];
    // A lower bound on the oxygen any all-gas composition of these species needs: if the charge has
    // less, no gaseous equilibrium exists (with the default species: O must exceed C + 2 S).
    let oNeed = 0;
    for (let e = 0; e < NE_ALL; e++) oNeed += b0All[e] * this.oxygenPerAtom[e];
    if (oNeed > 0 && b0All[E_O] <= oNeed * (1 + 1e-9)) {
      throw new EquilibriumInfeasibleError(
        `elementMoles: too little oxygen for an all-gas equilibrium with these product species (O = ` +
          `${b0All[E_O] * scale} mol, at least ${oNeed * scale} mol needed); solid carbon or sulfur species outside the ` +
          `product list would form`,
      );
    }
  }

  private buildActiveSets(mask: number): void {
    const ns = this.ns;
    const aAll = this.aAll;
    this.activeMask = -1;
    let nE = 0;
    for (let e = 0; e < NE_ALL; e++) if (mask & (1 << e)) this.actEl[nE++] = e;
    let nS = 0;
    for (let j = 0; j < ns; j++) {
      let ok = true;
      for (let e = 0; e < NE_ALL; e++) if (aAll[e * ns + j] > 0 && !(mask & (1 << e))) ok = false;
      this.kOf[j] = ok ? nS : -1;
      if (ok) this.actSp[nS++] = j;
    }
    let nEnt = 0;
    for (let ie = 0; ie < nE; ie++) {
      const e = this.actEl[ie];
      let has = false;
      for (let k = 0; k < nS; k++) {
        const c = aAll[e * ns + this.actSp[k]];
        this.a[ie * ns + k] = c;
        if (c !== 0) {
          has = true;
          this.entI[nEnt] = ie;
          this.entK[nEnt] = k;
          this.entA[nEnt] = c;
          nEnt++;
        }
      }
      if (!has) fail(`elementMoles.${ELEMENTS[e]}`, `no usable product species contains element ${ELEMENTS[e]}`);
    }
    let nPair = 0;
    for (let k = 0; k < nS; k++) {
      for (let i = 0; i < nE; i++) {
        const ai = this.a[i * ns + k];
        if (ai === 0) continue;
        for (let i2 = i; i2 < nE; i2++) {
          const ai2 = this.a[i2 * ns + k];
          if (ai2 === 0) continue;
          this.pairSlot[nPair] = i * 8 + i2;
          this.pairK[nPair] = k;
          this.pairC[nPair] = ai * ai2;
          nPair++;
        }
      }
    }
    // least oxygen per atom of each other element among the active species (shared between the
    // non-oxygen elements of a species, so that the sum is a true lower bound)
    for (let e = 0; e < NE_ALL; e++) {
      let r = Infinity;
      if (e !== E_O && mask & (1 << e)) {
        for (let k = 0; k < nS; k++) {
          const j = this.actSp[k];
          const ae = aAll[e * ns + j];
          if (ae === 0) continue;
          let others = 0;
          for (let e2 = 0; e2 < NE_ALL; e2++) if (e2 !== E_O && aAll[e2 * ns + j] > 0) others++;
          const v = aAll[E_O * ns + j] / (ae * others);
          if (v < r) r = v;
        }
      }
      this.oxygenPerAtom[e] = r === Infinity ? 0 : r;
    }
    let tLow = 0;
    let tHigh = Infinity;
    for (let k = 0; k < nS; k++) {
      tLow = Math.max(tLow, this.tLowOf[this.actSp[k]]);
      tHigh = Math.min(tHigh, this.tHighOf[this.actSp[k]]);
    }
    this.tLow = tLow;
    this.tHigh = tHigh;
    const keys: string[] = [];
    const template: Record<string, number> = {};
    for (let k = 0; k < nS; k++) {
      const key = this.productSpecies[this.actSp[k]];
      keys.push(key);
      template[key] = 0;
    }
    this.nE = nE;
    this.nS = nS;
    this.nEnt = nEnt;
    this.nPair = nPair;
    this.activeKeys = Object.freeze(keys);
    this.fractionsTemplate = template;
    this.activeMask = mask;
  }

  /**
   * Cold start, first part: the products of complete combustion (CO2, H2O, SO2, N2, Ar, excess O2; on
   * the rich side the oxygen beyond CO shared between CO2 and H2O in proportion to C and H/2), with
   * every other species at a trace amount. Returns ln(total moles).
   */
  private coldGuess(): number {
    const nS = this.nS;
    const actSp = this.actSp;
    const sn = this.scratchN;
    const b = this.b0All;
    sn.fill(0);
    const C = b[E_C], Hh = b[E_H], O = b[E_O], N = b[E_N], S = b[E_S], Ar = b[E_AR];
    const majorsAvailable =
      (C === 0 || (this.iCO2 >= 0 && this.iCO >= 0)) &&
      (Hh === 0 || (this.iH2O >= 0 && this.iH2 >= 0)) &&
      (O === 0 || this.iO2 >= 0) &&
      (N === 0 || this.iN2 >= 0) &&
      (S === 0 || this.iSO2 >= 0) &&
      (Ar === 0 || this.iAr >= 0);
    let total = 0;
    const Oleft = O - 2 * S;
    if (majorsAvailable && Oleft >= 0 && (C === 0 || Oleft > C)) {
      if (S > 0) sn[this.iSO2] = S;
      if (Oleft >= 2 * C + Hh / 2) {
        if (C > 0) sn[this.iCO2] = C;
        if (Hh > 0) sn[this.iH2O] = Hh / 2;
        if (O > 0) sn[this.iO2] = (Oleft - 2 * C - Hh / 2) / 2;
      } else {
        const f = (Oleft - C) / (C + Hh / 2);
        if (C > 0) {
          sn[this.iCO2] = f * C;
          sn[this.iCO] = (1 - f) * C;
        }
        if (Hh > 0) {
          sn[this.iH2O] = (f * Hh) / 2;
          sn[this.iH2] = ((1 - f) * Hh) / 2;
        }
      }
      if (N > 0) sn[this.iN2] = N / 2;
      if (Ar > 0) sn[this.iAr] = Ar;
      for (let k = 0; k < nS; k++) total += sn[actSp[k]];
    }
    if (!(total > 0)) {
      // generic start (as in RP-1311): equal amounts of every species
      let atoms = 0;
      for (let ie = 0; ie < this.nE; ie++) atoms += this.b0[ie];
      total = atoms;
      for (let k = 0; k < nS; k++) sn[actSp[k]] = atoms / nS;
    }
    const trace = TRACE_START * total;
    let sum = 0;
    for (let k = 0; k < nS; k++) {
      const v = sn[actSp[k]];
      // any positive complete-combustion amount counts, however small (the carrier of a trace element)
      const major = v > 0;
      this.isMajorGuess[k] = major ? 1 : 0;
      const nk = major ? v : Math.min(trace, 1e-3 * this.elementLimit(k));
      this.n[k] = nk;
      this.lnn[k] = Math.log(nk);
      sum += nk;
    }
    return Math.log(sum);
  }

  /**
   * Near φ = 1 the complete-combustion majors (CO2, H2O) leave the oxygen potential undetermined; in a
   * hot mixture a little O2, CO and H2 fix it and save several damped steps. Returns ln(total moles).
   */
  private seedNearStoichiometric(T: number, lnNtot: number): number {
    if (T < T_SEED_MIN) return lnNtot;
    const b = this.b0All;
    const C = b[E_C], Hh = b[E_H];
    const ref = C + Hh / 2;
    const kO2 = this.iO2 >= 0 ? this.kOf[this.iO2] : -1;
    const kCO = this.iCO >= 0 ? this.kOf[this.iCO] : -1;
    const kH2 = this.iH2 >= 0 ? this.kOf[this.iH2] : -1;
    if (!(ref > 0) || kO2 < 0 || (C > 0 && kCO < 0) || (Hh > 0 && kH2 < 0)) return lnNtot;
    const n = this.n;
    const seed = SEED_NEAR_STOICH * ref;
    const free = (C > 0 ? n[kCO] : 0) + (Hh > 0 ? n[kH2] : 0);
    if (n[kO2] >= seed || free >= seed) return lnNtot;
    const set = (k: number, v: number) => {
      if (n[k] < v) {
        n[k] = v;
        this.lnn[k] = Math.log(v);
        this.isMajorGuess[k] = 1;
      }
    };
    set(kO2, seed);
    if (C > 0) set(kCO, (seed * C) / ref);
    if (Hh > 0) set(kH2, (seed * Hh) / 2 / ref);
    let sum = 0;
    for (let k = 0; k < this.nS; k++) sum += n[k];
    return Math.log(sum);
  }

  /** Temperature at which the estimated majors have the enthalpy H0 (1-D Newton), capped at T_GUESS_MAX. */
  private temperatureGuess(H0_J: number): number {
    const nS = this.nS;
    const h0R = H0_J / R_J_per_molK;
    let T = 2000;
    for (let it = 0; it < 30; it++) {
      evalInto(this.data, T, this.cpR, this.hRT, this.sR);
      let h = 0; // Σ n h / R, K·mol
      let cp = 0; // Σ n cp / R, mol
      for (let k = 0; k < nS; k++) {
        if (!this.isMajorGuess[k]) continue;
        const j = this.actSp[k];
        h += this.n[k] * this.hRT[j] * T;
        cp += this.n[k] * this.cpR[j];
      }
      const dT = (h0R - h) / cp;
      let Tn = T + dT;
      if (!(Tn > T_GUESS_MIN)) Tn = T_GUESS_MIN;
      if (Tn > T_GUESS_MAX) Tn = T_GUESS_MAX;
      const done = Math.abs(Tn - T) < 1 || (Tn === T_GUESS_MAX && T === T_GUESS_MAX) || (Tn === T_GUESS_MIN && T === T_GUESS_MIN);
      T = Tn;
      if (done) break;
    }
    return T;
  }

  /**
   * Cold start, last part: element potentials fitted (least squares weighted by amount) to the
   * chemical potentials of the estimated composition at temperature T, and every other species set to the
   * amount those potentials give it, ln(n_k/n) = −μ°_k/RT + Σ_i a_ik π_i, capped at 5 %.
   * Returns ln(total moles). Leaves the estimate unchanged if the fit is singular.
   */
  private traceEstimate(T: number, lnP: number, lnNtot: number): number {
    const nS = this.nS;
    const nE = this.nE;
    const ns = this.ns;
    const a = this.a;
    const M = this.M;
    const r = this.rhs;
    const x = this.x;
    evalInto(this.data, T, this.cpR, this.hRT, this.sR);
    for (let i = 0; i < nE; i++) {
      r[i] = 0;
      for (let c = 0; c < nE; c++) M[i * 8 + c] = 0;
    }
    const N = Math.exp(lnNtot);
    for (let k = 0; k < nS; k++) {
      // trace species enter with their tiny weights: they only settle directions the majors leave open
      const j = this.actSp[k];
      const w = this.n[k] / N;
      const muk = this.hRT[j] - this.sR[j] + lnP - this.lnPstd[j] + this.lnn[k] - lnNtot;
      for (let i = 0; i < nE; i++) {
        const aik = a[i * ns + k];
        if (aik === 0) continue;
        const t = w * aik;
        for (let i2 = 0; i2 < nE; i2++) M[i * 8 + i2] += t * a[i2 * ns + k];
        r[i] += t * muk;
      }
    }
    if (!solveDense(M, r, x, nE)) return lnNtot;
    const lnCap = Math.log(0.05);
    let sum = 0;
    for (let k = 0; k < nS; k++) {
      if (!this.isMajorGuess[k]) {
        const j = this.actSp[k];
        let lnx = -(this.hRT[j] - this.sR[j] + lnP - this.lnPstd[j]);
        for (let i = 0; i < nE; i++) lnx += a[i * ns + k] * x[i];
        if (lnx > lnCap) lnx = lnCap;
        // never more of an element in one estimated species than the charge holds
        const lnLimit = Math.log(this.elementLimit(k)) - lnNtot;
        if (lnx > lnLimit) lnx = lnLimit;
        const lnLo = Math.min(-LN_FLOOR, this.lnFloorAbs - lnNtot) + 1;
        if (lnx < lnLo) lnx = lnLo;
        this.lnn[k] = lnNtot + lnx;
        this.n[k] = Math.exp(this.lnn[k]);
      }
      sum += this.n[k];
    }
    return Math.log(sum);
  }

  /** Largest amount of active species k that the charge's elements allow, mol. */
  private elementLimit(k: number): number {
    let lim = Infinity;
    for (let i = 0; i < this.nE; i++) {
      const aik = this.a[i * this.ns + k];
      if (aik > 0) {
        const v = this.b0[i] / aik;
        if (v < lim) lim = v;
      }
    }
    return lim;
  }

  /** Warm start from a previous result (species matched by key). Returns ln(total moles) or NaN. */
  private warm(w: EquilibriumResult): number {
    const nS = this.nS;
    const map = this.warmMap;
    const ws = w.species;
    const wm = w.moles;
    if (!ws || !wm || ws.length !== wm.length) fail("warmStart", "must be a result of this solver (species and moles)");
    let total = 0;
    for (let k = 0; k < nS; k++) {
      const key = this.activeKeys[k];
      let idx = -1;
      if (k < ws.length && ws[k] === key) idx = k;
      else {
        for (let i = 0; i < ws.length; i++) {
          if (ws[i] === key) {
            idx = i;
            break;
          }
        }
      }
      map[k] = idx;
      const v = idx >= 0 ? wm[idx] : 0;
      if (v > 0 && Number.isFinite(v)) total += v;
    }
    if (!(total > 0)) return NaN;
    total /= this.scale;
    const floor = TRACE_START * total;
    const n = this.n;
    for (let k = 0; k < nS; k++) {
      const idx = map[k];
      const v = idx >= 0 ? wm[idx] : 0;
      n[k] = v > 0 && Number.isFinite(v) ? v / this.scale : floor; // floor: absent from the previous solution
    }
    // The charge may differ from the previous one: scale each species by the ratio new/old of the
    // amount of its scarcest element, so that trace elements start near their new amounts.
    const x = this.x;
    for (let i = 0; i < this.nE; i++) x[i] = 0;
    for (let q = 0; q < this.nEnt; q++) x[this.entI[q]] += this.entA[q] * n[this.entK[q]];
    let sum = 0;
    for (let k = 0; k < nS; k++) {
      let iMin = -1;
      for (let i = 0; i < this.nE; i++) {
        if (this.a[i * this.ns + k] > 0 && (iMin < 0 || this.b0[i] < this.b0[iMin])) iMin = i;
      }
      if (iMin >= 0 && x[iMin] > 0) n[k] *= this.b0[iMin] / x[iMin];
      this.lnn[k] = Math.log(n[k]);
      sum += n[k];
    }
    return Math.log(sum);
  }

  private solve(p: Omit<EquilibriumProblem, "enthalpyJ">, hp: boolean, H0_J: number, Tgiven: number): EquilibriumResult {
    this.setup(p);
    if (!hp && (Tgiven < this.tLow || Tgiven > this.tHigh)) {
      fail("temperatureK", `${Tgiven} K is outside the range of the species data (${this.tLow}–${this.tHigh} K)`);
    }
    const nS = this.nS;
    const nE = this.nE;
    const n = this.n;
    const lnn = this.lnn;
    const mu = this.mu;
    const dln = this.dln;
    const Hk = this.H;
    const cpR = this.cpR;
    const hRT = this.hRT;
    const sR = this.sR;
    const b0 = this.b0;
    const M = this.M;
    const rhs = this.rhs;
    const x = this.x;
    const actSp = this.actSp;
    const lnPstd = this.lnPstd;
    const entI = this.entI;
    const entK = this.entK;
    const entA = this.entA;
    const nEnt = this.nEnt;
    const pairSlot = this.pairSlot;
    const pairK = this.pairK;
    const pairC = this.pairC;
    const nPair = this.nPair;
    const data = this.data;
    const lnP = Math.log(p.pressurePa);
    const lnLimit = this.lnLimit;
    for (let k = 0; k < nS; k++) lnLimit[k] = Math.log(this.elementLimit(k));

    // ---- starting point
    let lnNtot = NaN;
    let T = NaN;
    const w = p.warmStart;
    if (w !== undefined) {
      lnNtot = this.warm(w);
      if (hp && typeof w.temperatureK === "number" && w.temperatureK > 0 && Number.isFinite(w.temperatureK)) {
        T = w.temperatureK;
      }
    }
    const cold = !Number.isFinite(lnNtot);
    if (cold) lnNtot = this.coldGuess();
    else for (let k = 0; k < nS; k++) this.isMajorGuess[k] = 1;
    if (Tgiven > 0) T = Tgiven; // TP temperature, or the HP initialTemperatureK
    if (!(T > 0)) T = this.temperatureGuess(H0_J / this.scale);
    if (T < T_ITER_MIN) T = T_ITER_MIN;
    if (T > T_ITER_MAX) T = T_ITER_MAX;
    if (cold) {
      lnNtot = this.seedNearStoichiometric(T, lnNtot);
      lnNtot = this.traceEstimate(T, lnP, lnNtot);
    }
    let lnT = Math.log(T);
    const lnTmin = Math.log(T_ITER_MIN);
    const lnTmax = Math.log(T_ITER_MAX);
    const h0R = H0_J / this.scale / R_J_per_molK; // K·mol per scaled charge

    let bmax = 0;
    for (let ie = 0; ie < nE; ie++) if (b0[ie] > bmax) bmax = b0[ie];
    // floor for ln n_j: e^-300 of the total, or lower for a trace element
    const lnFloorAbs = this.lnFloorAbs;
    let lnFloor = Math.min(lnNtot - LN_FLOOR, lnFloorAbs);

    const m = hp ? nE + 2 : nE + 1; // size of the reduced system
    const iN = nE; // row/column of Δln n
    const iT = nE + 1; // row/column of Δln T (HP)

    let iter = 0;
    let rp1311Converged = false;
    let polish = 0;
    let lastResidual = Infinity;
    let sumN = 0;
    let thermoT = NaN;

    for (;;) {
      // ---- state at the current point: thermo once per iteration, n_j, μ_j/RT
      T = hp ? Math.exp(lnT) : Tgiven;
      if (T !== thermoT) {
        evalInto(data, T, cpR, hRT, sR);
        thermoT = T;
      }
      const Ntot = Math.exp(lnNtot);
      sumN = 0;
      for (let k = 0; k < nS; k++) {
        const j = actSp[k];
        const nk = Math.exp(lnn[k]);
        n[k] = nk;
        sumN += nk;
        const h = hRT[j];
        Hk[k] = h;
        mu[k] = h - sR[j] + lnP - lnPstd[j] + lnn[k] - lnNtot;
      }

      if (rp1311Converged) {
        // the last step passed the RP-1311 tests; stop once it was also at round-off level
        if (lastResidual <= TOL_FINAL_STEP || polish >= MAX_POLISH_ITERATIONS) break;
        polish++;
      }
      if (iter >= MAX_ITERATIONS) {
        throw new EquilibriumNotConvergedError(
          `chemical equilibrium did not converge in ${MAX_ITERATIONS} iterations (last scaled correction ${lastResidual.toExponential(3)})`,
          iter,
          lastResidual,
        );
      }
      iter++;

      // ---- reduced Gibbs iteration matrix (symmetric: upper triangle assembled, then mirrored)
      for (let r = 0; r < m; r++) {
        rhs[r] = 0;
        for (let c = r; c < m; c++) M[r * 8 + c] = 0;
      }
      for (let q = 0; q < nPair; q++) M[pairSlot[q]] += pairC[q] * n[pairK[q]];
      for (let q = 0; q < nEnt; q++) {
        const k = entK[q];
        const row = entI[q] * 8;
        const t = entA[q] * n[k];
        M[row + iN] += t; // Σ_j a_ij n_j = b_i
        M[row + iT] += t * Hk[k];
        rhs[entI[q]] += t * mu[k];
      }
      let sNH = 0; // Σ n_j H_j
      let sNCp = 0; // Σ n_j (Cp_j + H_j²)
      let sNmu = 0; // Σ n_j μ_j
      let sNHmu = 0; // Σ n_j H_j μ_j
      for (let k = 0; k < nS; k++) {
        const nk = n[k];
        const h = Hk[k];
        const nh = nk * h;
        sNH += nh;
        sNCp += nk * (cpR[actSp[k]] + h * h);
        sNmu += nk * mu[k];
        sNHmu += nh * mu[k];
      }
      let elemRes = 0;
      for (let i = 0; i < nE; i++) {
        const res = b0[i] - M[i * 8 + iN];
        rhs[i] += res;
        const r = Math.abs(res) / bmax;
        if (r > elemRes) elemRes = r;
      }
      M[iN * 8 + iN] = sumN - Ntot;
      rhs[iN] = Ntot - sumN + sNmu;
      if (hp) {
        M[iN * 8 + iT] = sNH;
        M[iT * 8 + iT] = sNCp;
        rhs[iT] = h0R / T - sNH + sNHmu;
      }
      for (let r = 1; r < m; r++) for (let c = 0; c < r; c++) M[r * 8 + c] = M[c * 8 + r];

      if (!solveDense(M, rhs, x, m)) {
        throw new EquilibriumNotConvergedError(
          `chemical equilibrium iteration matrix became singular at iteration ${iter}`,
          iter,
          lastResidual,
        );
      }
      const dlnN = x[iN];
      const dlnT = hp ? x[iT] : 0;

      // ---- species corrections Δln n_j
      for (let k = 0; k < nS; k++) dln[k] = dlnN + Hk[k] * dlnT - mu[k];
      for (let q = 0; q < nEnt; q++) dln[entK[q]] += entA[q] * x[entI[q]];

      // ---- control factor λ (RP-1311 ch. 3) and convergence measures
      let maxBig = 5 * Math.abs(dlnN);
      if (5 * Math.abs(dlnT) > maxBig) maxBig = 5 * Math.abs(dlnT);
      let lambda2 = 1;
      let convMoles = 0; // max n_j |Δln n_j| / Σ n_j
      let maxStep = 0; // max |Δln n_j| of species not parked at the floor
      for (let k = 0; k < nS; k++) {
        const d = dln[k];
        const ad = Math.abs(d);
        const lnx = lnn[k] - lnNtot;
        if (lnx > -SIZE) {
          if (ad > maxBig) maxBig = ad;
        } else if (d >= 0) {
          const den = d - dlnN;
          if (den > 0) {
            const l2 = Math.abs((-lnx - LN_1E4) / den);
            if (l2 < lambda2) lambda2 = l2;
          }
        }
        const c = (n[k] * ad) / sumN;
        if (c > convMoles) convMoles = c;
        if ((d > 0 || lnn[k] > lnFloor + 1) && ad > maxStep) maxStep = ad;
      }
      let lambda = maxBig > 2 ? 2 / maxBig : 1;
      if (lambda2 < lambda) lambda = lambda2;

      // ---- convergence tests (RP-1311 ch. 3) on this correction
      const cN = (Ntot * Math.abs(dlnN)) / sumN;
      rp1311Converged =
        lambda === 1 &&
        convMoles <= TOL_MOLES &&
        cN <= TOL_MOLES &&
        Math.abs(dlnT) <= TOL_LNT &&
        elemRes <= TOL_ELEMENT_RP1311;
      lastResidual = Math.max(maxStep, Math.abs(dlnN), Math.abs(dlnT), convMoles, cN);

      // ---- update
      lnNtot += lambda * dlnN;
      lnFloor = Math.min(lnNtot - LN_FLOOR, lnFloorAbs);
      const lnLo = lnFloor;
      for (let k = 0; k < nS; k++) {
        let v = lnn[k] + lambda * dln[k];
        if (v < lnLo) v = lnLo;
        // no species beyond what its scarcest element allows (a linearised step from far below can
        // overshoot a trace element by orders of magnitude, and coming down costs one step per e-fold)
        if (v > lnLimit[k]) v = lnLimit[k];
        lnn[k] = v;
      }
      if (hp) {
        lnT += lambda * dlnT;
        if (lnT < lnTmin) lnT = lnTmin;
        if (lnT > lnTmax) lnT = lnTmax;
      }
      if (!Number.isFinite(lnNtot) || !Number.isFinite(lnT) || !Number.isFinite(lastResidual)) {
        throw new EquilibriumNotConvergedError(`chemical equilibrium iteration diverged at iteration ${iter}`, iter, lastResidual);
      }
    }

    // ---- verification at the final state (thermo was evaluated at the final T above)
    let elemErr = 0;
    for (let i = 0; i < nE; i++) x[i] = 0;
    for (let q = 0; q < nEnt; q++) x[entI[q]] += entA[q] * n[entK[q]];
    for (let i = 0; i < nE; i++) {
      const r = Math.abs(b0[i] - x[i]) / b0[i];
      if (!(r <= elemErr)) elemErr = r;
    }
    let enthErr = 0;
    if (hp) {
      let hSum = 0; // Σ n h / R
      let hAbs = 0;
      for (let k = 0; k < nS; k++) {
        const hk = Hk[k] * T;
        hSum += n[k] * hk;
        hAbs += n[k] * Math.abs(hk);
      }
      enthErr = Math.abs(hSum - h0R) / Math.max(hAbs, T * sumN);
    }
    if (!(elemErr <= LIMIT_ELEMENT_BALANCE) || !(enthErr <= LIMIT_ENTHALPY_BALANCE)) {
      throw new EquilibriumNotConvergedError(
        `chemical equilibrium failed verification after ${iter} iterations: element balance error ` +
          `${elemErr.toExponential(3)} (limit ${LIMIT_ELEMENT_BALANCE}), enthalpy balance error ` +
          `${enthErr.toExponential(3)} (limit ${LIMIT_ENTHALPY_BALANCE})`,
        iter,
        Math.max(elemErr, enthErr),
      );
    }
    if (T < this.tLow || T > this.tHigh) {
      throw new EquilibriumNotConvergedError(
        `equilibrium temperature ${T.toFixed(1)} K lies outside the range of the species data (${this.tLow}–${this.tHigh} K)`,
        iter,
        0,
      );
    }

    // ---- result (the only allocations of a solve)
    const keys = this.activeKeys;
    const scale = this.scale;
    const moles = allocMoles(nS);
    const moleFractions: Record<string, number> = { ...this.fractionsTemplate };
    for (let k = 0; k < nS; k++) {
      moles[k] = n[k] * scale;
      moleFractions[keys[k]] = n[k] / sumN;
    }
    return {
      temperatureK: T,
      pressurePa: p.pressurePa,
      species: keys,
      moles,
      moleFractions,
      totalMoles: sumN * scale,
      iterations: iter,
      elementBalanceRelError: elemErr,
      enthalpyBalanceRelError: enthErr,
    };
  }
}

// Result arrays are views into shared slabs: allocating a separate small Float64Array per result costs
// more than a whole Newton iteration.
const SLAB_LENGTH = 4096;
let slab = new ArrayBuffer(SLAB_LENGTH * 8);
let slabUsed = 0;
function allocMoles(length: number): Float64Array {
  if (slabUsed + length > SLAB_LENGTH) {
    slab = new ArrayBuffer(SLAB_LENGTH * 8);
    slabUsed = 0;
  }
  const v = new Float64Array(slab, slabUsed * 8, length);
  slabUsed += length;
  return v;
}

/**
 * Solves M x = rhs in place (M: m×m, row stride 8) by Gaussian elimination with scaled partial pivoting.
 * Returns false if the matrix is singular to working precision.
 */
function solveDense(M: Float64Array, rhs: Float64Array, x: Float64Array, m: number): boolean {
  // row scaling: divide each row by its largest magnitude
  for (let r = 0; r < m; r++) {
    let s = 0;
    for (let c = 0; c < m; c++) {
      const v = Math.abs(M[r * 8 + c]);
      if (v > s) s = v;
    }
    if (!(s > 0) || !Number.isFinite(s)) return false;
    const inv = 1 / s;
    for (let c = 0; c < m; c++) M[r * 8 + c] *= inv;
    rhs[r] *= inv;
  }
  for (let col = 0; col < m; col++) {
    let piv = col;
    let best = Math.abs(M[col * 8 + col]);
    for (let r = col + 1; r < m; r++) {
      const v = Math.abs(M[r * 8 + col]);
      if (v > best) {
        best = v;
        piv = r;
      }
    }
    if (!(best > 1e-300)) return false;
    if (piv !== col) {
      for (let c = col; c < m; c++) {
        const t = M[col * 8 + c];
        M[col * 8 + c] = M[piv * 8 + c];
        M[piv * 8 + c] = t;
      }
      const t = rhs[col];
      rhs[col] = rhs[piv];
      rhs[piv] = t;
    }
    const inv = 1 / M[col * 8 + col];
    for (let r = col + 1; r < m; r++) {
      const f = M[r * 8 + col] * inv;
      if (f === 0) continue;
      for (let c = col + 1; c < m; c++) M[r * 8 + c] -= f * M[col * 8 + c];
      rhs[r] -= f * rhs[col];
    }
  }
  for (let r = m - 1; r >= 0; r--) {
    let s = rhs[r];
    for (let c = r + 1; c < m; c++) s -= M[r * 8 + c] * x[c];
    x[r] = s / M[r * 8 + r];
    if (!Number.isFinite(x[r])) return false;
  }
  return true;
}

/** A solver with its own workspace for this list of product species (reuse it: the fast path). */
export function createEquilibriumSolver(productSpecies: readonly string[]): EquilibriumSolver {
  return new EquilibriumSolver(productSpecies);
}

const solverCache = new Map<string, EquilibriumSolver>();
let defaultSolver: EquilibriumSolver | undefined;
let defaultSulfurSolver: EquilibriumSolver | undefined;

function solverFor(p: { elementMoles: Partial<Record<Element, number>>; productSpecies?: readonly string[] }): EquilibriumSolver {
  const list = p.productSpecies;
  if (list === undefined) {
    if ((p.elementMoles?.S ?? 0) > 0) return (defaultSulfurSolver ??= new EquilibriumSolver(DEFAULT_WITH_SULFUR));
    return (defaultSolver ??= new EquilibriumSolver(DEFAULT_PRODUCT_SPECIES));
  }
  if (!Array.isArray(list)) fail("productSpecies", "must be an array of species keys");
  const key = list.join(",");
  let s = solverCache.get(key);
  if (s === undefined) {
    s = new EquilibriumSolver(list);
    solverCache.set(key, s);
  }
  return s;
}

/**
 * Equilibrium at constant enthalpy and pressure (adiabatic flame temperature and composition).
 * Throws EquilibriumNotConvergedError when no verified solution is reached.
 */
export function solveEquilibriumHP(p: EquilibriumProblem): EquilibriumResult {
  const s = solverFor(p);
  return s.solveHP(p);
}

/** Equilibrium at constant temperature and pressure. */
export function solveEquilibriumTP(p: EquilibriumTPProblem): EquilibriumResult {
  const s = solverFor(p);
  return s.solveTP(p);
}
