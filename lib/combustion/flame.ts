/**
 * Adiabatic flame temperature, three labelled methods:
 *  - "mean-cp": the hand estimate, T = T_ref + ΔH / (Σ nᵢ cp,ᵢ) with the products' cp taken at a
 *    stated mean temperature (1200 K, as in the common textbook estimate);
 *  - "complete": complete-combustion products with temperature-dependent cp (NASA polynomials);
 *    on the rich side the major products CO2, CO, H2O, H2 in water-gas-shift equilibrium;
 *  - "equilibrium": Gibbs energy minimisation at constant enthalpy and pressure (element
 *    potentials, Gordon & McBride, NASA RP-1311) with dissociation products.
 * All work per kg of fuel: the reactant charge is 1 kg of fuel and its oxidiser.
 */
import type { FuelDefinition } from "../schemas/fuel";
import { checkLiquidFeed, resolveFuel, type ResolvedFuel } from "../fuels/resolve";
import { InfeasibleChargeError, InputError, NotConvergedError } from "../errors";
import { cp_J_per_molK, g_J_per_mol, h_J_per_mol, ELEMENTS, type Element } from "../thermo/nasa7";
import { SPECIES } from "../thermo/species-data";
import { R_J_per_molK, T298K, atmospherePa } from "../units/constants";
import {
  DRY_AIR,
  OXIDIZER_SPECIES,
  assertCombustible,
  stoichiometricO2_mol_per_kg,
  lambdaFromExcessAirPercent,
  lambdaFromFlueO2Dry,
  type Oxidizer,
} from "./stoichiometry";
import { flueGasPerKgFuel, FLUE_SPECIES } from "./flue-gas";
import { solveEquilibriumHP, type EquilibriumResult } from "./equilibrium";

export const FLAME_METHODS = ["mean-cp", "complete", "equilibrium"] as const;
export type FlameMethod = (typeof FLAME_METHODS)[number];

export const FLAME_METHOD_LABELS: Record<FlameMethod, string> = {
  "mean-cp": "hand estimate: complete combustion, products' mean cp at 1200 K",
  complete: "complete combustion, temperature-dependent cp (NASA polynomials); rich side with water-gas shift equilibrium",
  equilibrium: "chemical equilibrium at constant H and P (Gibbs minimisation, element potentials, NASA RP-1311)",
};

/** Temperature at which the hand estimate takes the products' cp, K (textbook practice). */
export const MEAN_CP_TEMPERATURE_K = 1200;

export interface FlameInput {
  fuel: FuelDefinition | ResolvedFuel;
  oxidizer?: Oxidizer;
  /** Exactly one of phi, excessAirPercent, flueO2DryPercent (default φ = 1). */
  phi?: number;
  excessAirPercent?: number;
  flueO2DryPercent?: number;
  fuelTemperatureK?: number;
  oxidizerTemperatureK?: number;
  pressurePa?: number;
  method: FlameMethod;
  /** Equilibrium only: start from a neighbouring solution (sweeps). */
  warmStart?: EquilibriumResult;
}

export interface FlameResult {
  temperatureK: number;
  method: FlameMethod;
  methodLabel: string;
  phi: number;
  lambda: number;
  pressurePa: number;
  /** Product mole fractions keyed by formula. */
  products: Record<string, number>;
  /** Equilibrium only: the solver result (for warm starts and balances). */
  equilibrium?: EquilibriumResult;
}

function isResolved(f: FuelDefinition | ResolvedFuel): f is ResolvedFuel {
  return (f as ResolvedFuel).elements_mol_per_kg !== undefined;
}

type SupplyField = "phi" | "excessAirPercent" | "flueO2DryPercent";

/** The field the user stated the oxidiser supply with (φ when none: the default φ = 1). */
export function supplyFieldOf(input: Pick<FlameInput, SupplyField>): SupplyField {
  if (input.excessAirPercent !== undefined) return "excessAirPercent";
  if (input.flueO2DryPercent !== undefined) return "flueO2DryPercent";
  return "phi";
}

/** Oxidiser supply λ from whichever of φ / excess air / flue O2 is given. Throws InputError naming it. */
export function lambdaOf(fuel: ResolvedFuel, input: Pick<FlameInput, SupplyField>, oxidizer: Oxidizer): number {
  const given = (["phi", "excessAirPercent", "flueO2DryPercent"] as const).filter((k) => input[k] !== undefined);
  if (given.length > 1)
    throw new InputError(given[1], `give only one of phi, excessAirPercent, flueO2DryPercent (got ${given.join(", ")})`);
  const field = supplyFieldOf(input);
  const value = input[field];
  if (value !== undefined && !Number.isFinite(value)) throw new InputError(field, `must be a finite number, got ${String(value)}`);
  let lambda: number;
  if (input.excessAirPercent !== undefined) lambda = lambdaFromExcessAirPercent(input.excessAirPercent);
  else if (input.flueO2DryPercent !== undefined) lambda = lambdaFromFlueO2Dry(fuel, input.flueO2DryPercent, oxidizer);
  else lambda = 1 / (input.phi ?? 1);
  if (!(lambda > 0) || !Number.isFinite(lambda)) {
    throw new InputError(
      field,
      field === "excessAirPercent" ? `must be above −100 %, got ${String(value)}` : `must be > 0, got ${String(value)}`,
    );
  }
  return lambda;
}

interface Charge {
  elements: Record<Element, number>;
  enthalpyJ: number;
  oxidizerMoles: Partial<Record<(typeof OXIDIZER_SPECIES)[number], number>>;
}

/** Reactant charge: 1 kg fuel at T_fuel plus its oxidiser at T_ox. */
export function reactantCharge(
  fuel: ResolvedFuel,
  lambda: number,
  oxidizer: Oxidizer,
  fuelTemperatureK: number,
  oxidizerTemperatureK: number,
): Charge {
  const nO2 = stoichiometricO2_mol_per_kg(fuel.elements_mol_per_kg);
  const nOx = (lambda * nO2) / (oxidizer.O2 ?? 0);
  const elements = { ...fuel.elements_mol_per_kg };
  let H = fuel.formationEnthalpy_J_per_kg + fuel.sensibleEnthalpy_J_per_kg(fuelTemperatureK);
  const oxidizerMoles: Charge["oxidizerMoles"] = {};
  for (const k of OXIDIZER_SPECIES) {
    const n = nOx * (oxidizer[k] ?? 0);
    if (n <= 0) continue;
    oxidizerMoles[k] = n;
    const sp = SPECIES[k];
    for (const e of ELEMENTS) elements[e] += n * (sp.elements[e] ?? 0);
    H += n * h_J_per_mol(sp, oxidizerTemperatureK);
  }
  return { elements, enthalpyJ: H, oxidizerMoles };
}

type Products = Record<string, number>;

function enthalpyOf(p: Products, T: number): number {
  let h = 0;
  for (const [k, n] of Object.entries(p)) h += n * h_J_per_mol(SPECIES[k], T);
  return h;
}
function cpOf(p: Products, T: number): number {
  let c = 0;
  for (const [k, n] of Object.entries(p)) c += n * cp_J_per_molK(SPECIES[k], T);
  return c;
}
function fractions(p: Products): Products {
  const tot = Object.values(p).reduce((a, b) => a + b, 0);
  const out: Products = {};
  for (const [k, n] of Object.entries(p)) if (n > 0) out[k] = n / tot;
  return out;
}

/** Rich-side element bookkeeping: C, H, O (after SO2), N, Ar of a charge that passed assertGasPhaseCharge. */
function richBudget(c: Charge) {
  const { C, H, O, N, S, Ar } = c.elements;
  return { C, H, Oav: O - 2 * S, N, S, Ar };
}

/**
 * The one feasibility rule of all three methods: a gas-phase product model needs at least the oxygen
 * that turns all carbon into CO and all sulfur into SO2; with less, soot would form. Names the field
 * the user stated the supply with, and the richest φ that can be computed.
 */
function assertGasPhaseCharge(fuel: ResolvedFuel, oxidizer: Oxidizer, lambda: number, field: SupplyField, value: number | undefined): void {
  const f = fuel.elements_mol_per_kg;
  const need = f.C + 2 * f.S; // O atoms for C → CO, S → SO2
  if (!(need > 0)) return;
  // O atoms the oxidiser brings per unit λ (summed as reactantCharge sums them, without its enthalpies), and the fuel's own
  const nOx = stoichiometricO2_mol_per_kg(f) / (oxidizer.O2 ?? 0);
  let withOxidizer = f.O;
  for (const k of OXIDIZER_SPECIES) {
    const n = nOx * (oxidizer[k] ?? 0);
    if (n > 0) withOxidizer += n * (SPECIES[k].elements.O ?? 0);
  }
  const perLambda = withOxidizer - f.O;
  const have = f.O + lambda * perLambda;
  if (have > need * (1 + 1e-9)) return;
  const phiMax = need > f.O ? perLambda / (need - f.O) : Infinity;
  const stated = value === undefined ? "φ = 1" : field === "phi" ? `φ = ${value}` : `${value} (φ = ${(1 / lambda).toPrecision(3)})`;
  throw new InfeasibleChargeError(
    field,
    `${stated} is too rich for a gas-phase product model: the oxygen cannot turn all ` +
      `carbon into CO, so soot would form; the richest mixture that can be computed is φ ≈ ${phiMax.toPrecision(3)}`,
    "soot",
  );
}

/** Hand rule for rich products: oxygen first to CO, then to H2O, any rest turns CO into CO2. */
function richHandProducts(c: Charge): Products {
  const { C, H, Oav, N, S, Ar } = richBudget(c);
  let o = Oav - C;
  const h2o = Math.min(H / 2, o);
  o -= h2o;
  const co2 = Math.min(C, o);
  return { CO2: co2, CO: C - co2, H2O: h2o, H2: H / 2 - h2o, N2: N / 2, SO2: S, Ar };
}

/** Rich products in water-gas-shift equilibrium CO + H2O ⇌ CO2 + H2 at T (K from NASA g°). */
function richShiftProducts(c: Charge, T: number): Products {
  const { C, H, Oav, N, S, Ar } = richBudget(c);
  // Δn = 0: the standard-state pressure drops out of K
  const dG = g_J_per_mol(SPECIES.CO2, T) + g_J_per_mol(SPECIES.H2, T) - g_J_per_mol(SPECIES.CO, T) - g_J_per_mol(SPECIES.H2O, T);
  const K = Math.exp(-dG / (R_J_per_molK * T));
  // a = CO2; CO = C − a; H2O = Oav − C − a; H2 = H/2 − (Oav − C − a)
  const lo = Math.max(0, Oav - C - H / 2);
  const hi = Math.min(C, Oav - C);
  const f = (a: number) => K * (C - a) * (Oav - C - a) - a * (H / 2 - (Oav - C - a));
  let a: number;
  if (hi - lo <= 0) a = lo;
  else {
    let x0 = lo,
      x1 = hi;
    for (let i = 0; i < 200 && x1 - x0 > 1e-15 * Math.max(1, C); i++) {
      const m = 0.5 * (x0 + x1);
      if (f(m) > 0) x0 = m;
      else x1 = m;
    }
    a = 0.5 * (x0 + x1);
  }
  return { CO2: a, CO: C - a, H2O: Oav - C - a, H2: H / 2 - (Oav - C - a), N2: N / 2, SO2: S, Ar };
}

function leanProducts(fuel: ResolvedFuel, lambda: number, oxidizer: Oxidizer): Products {
  const fg = flueGasPerKgFuel(fuel, { lambda, oxidizer });
  const p: Products = {};
  for (const k of FLUE_SPECIES) if (fg.mol_per_kg[k] > 0) p[k] = fg.mol_per_kg[k];
  return p;
}

const ENERGY_BALANCE_MAX_ITERATIONS = 100;

/** Solves H_products(T) = H for fixed products (or products that depend on T). */
function solveEnergyBalance(products: (T: number) => Products, H: number): number {
  let T = 2000;
  let step = NaN;
  let residual = NaN;
  for (let i = 0; i < ENERGY_BALANCE_MAX_ITERATIONS; i++) {
    const p = products(T);
    const f = enthalpyOf(p, T) - H;
    const dT = -f / cpOf(p, T);
    step = Math.max(-800, Math.min(800, dT));
    T = Math.max(200, T + step);
    if (Math.abs(step) < 1e-8 * T) {
      const pf = products(T);
      residual = Math.abs(enthalpyOf(pf, T) - H);
      if (residual <= 1e-9 * Math.abs(H) + 1e-6) return T;
    }
  }
  throw new NotConvergedError(
    "flame-temperature",
    `the energy balance of the products did not converge in ${ENERGY_BALANCE_MAX_ITERATIONS} Newton steps`,
    { iterations: ENERGY_BALANCE_MAX_ITERATIONS, lastTemperatureK: T, lastStepK: step, enthalpyResidualJ: residual },
  );
}

export function flameTemperature(input: FlameInput): FlameResult {
  const fuel = isResolved(input.fuel) ? input.fuel : resolveFuel(input.fuel);
  const oxidizer = input.oxidizer ?? DRY_AIR;
  if (!((oxidizer.O2 ?? 0) > 0)) throw new InputError("oxidizer.O2", "the oxidiser must contain oxygen");
  assertCombustible(fuel);
  const lambda = lambdaOf(fuel, input, oxidizer);
  const supplyField = supplyFieldOf(input);
  assertGasPhaseCharge(fuel, oxidizer, lambda, supplyField, input[supplyField]);
  const phi = 1 / lambda;
  const Tf = input.fuelTemperatureK ?? T298K;
  const Tox = input.oxidizerTemperatureK ?? T298K;
  const P = input.pressurePa ?? atmospherePa;
  checkLiquidFeed(fuel, Tf, P);
  const charge = reactantCharge(fuel, lambda, oxidizer, Tf, Tox);
  const methodLabel = FLAME_METHOD_LABELS[input.method];
  // Fields written out (an object spread of a shared head was the costliest line of a sweep point).
  const result = (temperatureK: number, products: Record<string, number>): FlameResult => ({
    method: input.method,
    methodLabel,
    phi,
    lambda,
    pressurePa: P,
    temperatureK,
    products,
  });

  if (input.method === "equilibrium") {
    const eq = solveEquilibriumHP({
      elementMoles: charge.elements,
      enthalpyJ: charge.enthalpyJ,
      pressurePa: P,
      warmStart: input.warmStart,
    });
    // The solver's own mole fractions (a fresh object of this solve, never changed after): no copy.
    const r = result(eq.temperatureK, eq.moleFractions);
    r.equilibrium = eq;
    return r;
  }
  const lean = lambda >= 1;
  if (input.method === "complete") {
    const fixed = lean ? leanProducts(fuel, lambda, oxidizer) : null;
    const T = solveEnergyBalance((T) => fixed ?? richShiftProducts(charge, T), charge.enthalpyJ);
    return result(T, fractions(fixed ?? richShiftProducts(charge, T)));
  }
  // mean-cp hand estimate
  const p = lean ? leanProducts(fuel, lambda, oxidizer) : richHandProducts(charge);
  const T = T298K + (charge.enthalpyJ - enthalpyOf(p, T298K)) / cpOf(p, MEAN_CP_TEMPERATURE_K);
  return result(T, fractions(p));
}
