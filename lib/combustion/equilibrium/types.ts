/**
 * Chemical equilibrium: the problem and result types, the product-species lists and the errors.
 */
import { InfeasibleChargeError, NotConvergedError } from "../../errors";
import type { Element } from "../../thermo/nasa7";

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
export class EquilibriumNotConvergedError extends NotConvergedError {
  readonly iterations: number;
  /** Largest scaled correction (or balance error) at the last iteration. */
  readonly lastResidual: number;
  constructor(message: string, iterations: number, lastResidual: number) {
    super("equilibrium", message, { iterations, lastResidual });
    this.name = "EquilibriumNotConvergedError";
    this.iterations = iterations;
    this.lastResidual = lastResidual;
  }
}

/**
 * The charge cannot form an all-gas equilibrium with the product species given (e.g. too little oxygen
 * to turn all carbon into CO with the default species: solid carbon would form, which is not modelled).
 */
export class EquilibriumInfeasibleError extends InfeasibleChargeError {
  constructor(field: string, message: string) {
    super(field, message, "soot");
    this.name = "EquilibriumInfeasibleError";
  }
}

/** Default product species: products of hydrocarbon, hydrogen and ammonia flames in air or oxygen. */
export const DEFAULT_PRODUCT_SPECIES: readonly string[] = Object.freeze(["CO2", "CO", "H2O", "H2", "O2", "N2", "OH", "H", "O", "NO", "Ar"]);
export const DEFAULT_WITH_SULFUR: readonly string[] = Object.freeze([...DEFAULT_PRODUCT_SPECIES, "SO2", "H2S"]);
