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
 *
 * The solver lives in this folder: types.ts (problem, result, errors, species lists), settings.ts
 * (numerical settings), workspace.ts (pre-allocated state and the set-up of a charge), start.ts
 * (starting estimates), newton.ts (the iteration and its verification), linear.ts (dense solver) and
 * front.ts (EquilibriumSolver and the cached one-shot functions).
 */
export {
  DEFAULT_PRODUCT_SPECIES,
  EquilibriumInfeasibleError,
  EquilibriumNotConvergedError,
  type EquilibriumProblem,
  type EquilibriumResult,
  type EquilibriumTPProblem,
} from "./types";
export { createEquilibriumSolver, EquilibriumSolver, solveEquilibriumHP, solveEquilibriumTP } from "./front";
