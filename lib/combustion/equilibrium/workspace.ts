/**
 * The workspace of one equilibrium solver: the product species' data and every array the iteration
 * uses, allocated once; and the set-up of a charge (validation, active elements and species, the
 * sparse element-matrix entries).
 */
import { InputError } from "../../errors";
import { ELEMENTS, type Nasa7Species } from "../../thermo/nasa7";
import { SPECIES } from "../../thermo/species-data";
import { MATRIX_STRIDE } from "./linear";
import * as settings from "./settings";
import { EquilibriumInfeasibleError, type EquilibriumProblem } from "./types";

// Settings as module-level constants (plain locals in the hot loops, not live import bindings).
const { E_O, MIN_ELEMENT_RATIO, NE_ALL, T_EXTRAPOLATE_DOWN_TO } = settings;

function fail(field: string, msg: string): never {
  throw new InputError(field, msg);
}

/**
 * Pre-allocated state of an equilibrium solver for one list of product species. Fields are public to
 * the modules of this folder (starting estimates, Newton iteration); nothing outside it uses them.
 */
export class Workspace {
  readonly productSpecies: readonly string[];
  readonly data: Nasa7Species[];
  readonly ns: number;
  /** a_ij for all six elements, flat [element * ns + species]. */
  readonly aAll: Float64Array;
  readonly elementInList: Uint8Array;
  /** ln(P°_j / Pa) of each species' standard state. */
  readonly lnPstd: Float64Array;
  /** Temperature range in which each species' data are used, K (see T_EXTRAPOLATE_DOWN_TO). */
  readonly tLowOf: Float64Array;
  readonly tHighOf: Float64Array;
  /** The same for the active species of the current charge. */
  tLow = 0;
  tHigh = Infinity;
  // thermo at the current temperature, by list index j
  readonly cpR: Float64Array;
  readonly hRT: Float64Array;
  readonly sR: Float64Array;
  // active sets of the current charge (rebuilt only when the set of elements present changes)
  activeMask = -1;
  /** Largest element amount of the current charge, mol: the iteration works on amounts divided by it. */
  scale = 1;
  /** ln of the floor for n_j (scaled), from the scarcest element of the current charge. */
  lnFloorAbs = -Infinity;
  readonly b0All: Float64Array;
  readonly actSp: Int32Array;
  readonly actEl: Int32Array;
  /** Least oxygen atoms per atom of each element that the active species allow. */
  readonly oxygenPerAtom: Float64Array;
  /** Active index k of list species j, −1 if switched off. */
  readonly kOf: Int32Array;
  nS = 0;
  nE = 0;
  /** a_ij of active elements × active species, flat [ie * ns + k]. */
  readonly a: Float64Array;
  /** Non-zero a_ik as (element row, species, value) triples. */
  readonly entI: Int32Array;
  readonly entK: Int32Array;
  readonly entA: Float64Array;
  nEnt = 0;
  /** Non-zero a_ik a_i'k (i ≤ i') as (matrix slot, species, value) triples. */
  readonly pairSlot: Int32Array;
  readonly pairK: Int32Array;
  readonly pairC: Float64Array;
  nPair = 0;
  activeKeys: readonly string[] = [];
  fractionsTemplate: Record<string, number> = {};
  readonly b0: Float64Array;
  // iteration state, by active species k
  readonly lnn: Float64Array;
  readonly n: Float64Array;
  readonly mu: Float64Array;
  readonly dln: Float64Array;
  readonly H: Float64Array;
  readonly isMajorGuess: Uint8Array;
  /** ln of the largest amount of each species the charge's elements allow. */
  readonly lnLimit: Float64Array;
  // linear system (at most MATRIX_STRIDE × MATRIX_STRIDE), row stride MATRIX_STRIDE
  readonly M: Float64Array;
  readonly rhs: Float64Array;
  readonly x: Float64Array;
  // list indices of the named majors (−1 if absent), for the cold-start estimate
  readonly iCO2: number;
  readonly iCO: number;
  readonly iH2O: number;
  readonly iH2: number;
  readonly iO2: number;
  readonly iN2: number;
  readonly iAr: number;
  readonly iSO2: number;
  readonly scratchN: Float64Array;
  readonly warmMap: Int32Array;

  constructor(productSpecies: readonly string[]) {
    if (!Array.isArray(productSpecies) || productSpecies.length === 0) {
      fail("productSpecies", "give at least one product species");
    }
    const seen = new Set<string>();
    const data: Nasa7Species[] = [];
    for (const key of productSpecies) {
      const sp = Object.hasOwn(SPECIES, key) ? SPECIES[key] : undefined;
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
    this.M = new Float64Array(MATRIX_STRIDE * MATRIX_STRIDE);
    this.rhs = new Float64Array(MATRIX_STRIDE);
    this.x = new Float64Array(MATRIX_STRIDE);
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

  /** Validates the charge and (re)builds the active element and species sets. */
  setup(p: Omit<EquilibriumProblem, "enthalpyJ">): void {
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
        "elementMoles",
        `too little oxygen for an all-gas equilibrium with these product species (O = ` +
          `${b0All[E_O] * scale} mol, at least ${oNeed * scale} mol needed); solid carbon or sulfur species outside the ` +
          `product list would form`,
      );
    }
  }

  buildActiveSets(mask: number): void {
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
          this.pairSlot[nPair] = i * MATRIX_STRIDE + i2;
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

  /** Largest amount of active species k that the charge's elements allow, mol. */
  elementLimit(k: number): number {
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
}
