/**
 * The front end of the equilibrium solver: EquilibriumSolver (one workspace per species list, the fast
 * path for sweeps) and the one-shot functions, which reuse cached solvers keyed by the species list.
 */
import { InputError } from "../../errors";
import type { Element } from "../../thermo/nasa7";
import { solveEquilibrium } from "./newton";
import {
  DEFAULT_PRODUCT_SPECIES,
  DEFAULT_WITH_SULFUR,
  type EquilibriumProblem,
  type EquilibriumResult,
  type EquilibriumTPProblem,
} from "./types";
import { Workspace } from "./workspace";

function fail(field: string, msg: string): never {
  throw new InputError(field, msg);
}

/**
 * Equilibrium solver for one list of product species with its own pre-allocated workspace: create it
 * once and call solveHP / solveTP many times (the fast path; nothing is allocated inside the iteration,
 * only the result object at the end). Species whose elements are absent from a charge are switched off
 * for that solve. Not re-entrant (one workspace): use one solver per concurrent caller.
 */
export class EquilibriumSolver {
  readonly productSpecies: readonly string[];
  private readonly ws: Workspace;

  constructor(productSpecies: readonly string[]) {
    this.ws = new Workspace(productSpecies);
    this.productSpecies = this.ws.productSpecies;
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
    return solveEquilibrium(this.ws, p, true, p.enthalpyJ, T0 ?? NaN);
  }

  /** Equilibrium at fixed temperature and pressure. */
  solveTP(p: EquilibriumTPProblem): EquilibriumResult {
    const T = p.temperatureK;
    if (typeof T !== "number" || !Number.isFinite(T) || T <= 0) {
      fail("temperatureK", `must be a positive finite number, got ${String(T)}`);
    }
    return solveEquilibrium(this.ws, p, false, 0, T);
  }
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
    if ((p.elementMoles?.S ?? 0) > 0) {
      if (defaultSulfurSolver === undefined) defaultSulfurSolver = new EquilibriumSolver(DEFAULT_WITH_SULFUR);
      return defaultSulfurSolver;
    }
    if (defaultSolver === undefined) defaultSolver = new EquilibriumSolver(DEFAULT_PRODUCT_SPECIES);
    return defaultSolver;
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
