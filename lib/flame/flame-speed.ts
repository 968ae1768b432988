/**
 * Laminar burning velocity of a fuel gas in air (or enriched/humid air): the flame engine's public
 * entry. Builds the fresh mixture from Stoke's fuel and oxidiser definitions, starts from Stoke's
 * equilibrium solver (the burnt state at the inlet enthalpy), solves the freely propagating flame
 * with GRI-Mech 3.0 and mixture-averaged transport on an adaptive grid, checks conservation, and
 * continues the burnt gas as a plug flow for the post-flame NO figure.
 *
 * Thermo: the flame, its kinetics and the post-flame reactor use the mechanism's own NASA-7 data;
 * the starting estimate and the equilibrium check use Stoke's species data (lib/thermo), as the
 * equilibrium solver does. The two differ by a few kelvin in the burnt temperature; the check says
 * by how much.
 */
import { flameTemperature, lambdaOf } from "../combustion/flame";
import { normaliseOxidizer, type Oxidizer, OXIDIZER_SPECIES } from "../combustion/stoichiometry";
import { InputError, NotConvergedError, StokeError } from "../errors";
import { resolveFuel, type ResolvedFuel } from "../fuels/resolve";
import { stoichiometricO2_mol_per_kg } from "../combustion/stoichiometry";
import type { FlameSpeedInput, FlameSpeedRequest } from "../schemas/flame-speed";
import { flameSpeedRequestSchema } from "../schemas/flame-speed";
import { firstIssueLine } from "../schemas/fuel";
import { R_J_per_molK } from "../units/constants";
import type { BlockTridiagonal } from "./block-tridiagonal";
import { DEFAULT_GRID_CRITERIA, type GridCriteria } from "./grid";
import { createKinetics, type Kinetics } from "./kinetics";
import { loadMechanism, type Mechanism } from "./mechanism";
import { DEFAULT_POST_FLAME_RESIDENCE_MS, DEFAULT_REFERENCE_O2_PERCENT, integratePostFlame, noReport, type NOReport } from "./post-flame";
import {
  DEFAULT_SOLVER_SETTINGS,
  inletDensity,
  solvePremixed,
  type SolverSettings,
  type FlameSolution,
  type PremixedProblem,
  type ProgressInfo,
  type SolveStats,
} from "./premixed";
import {
  burningVelocityGuess_m_per_s,
  coldStart,
  extrapolateWarmStart,
  inletVector,
  massFractionsFromMoles,
  thinSolution,
  warmCorrection,
  warmStart,
  type WarmCorrection,
} from "./start";
import { speciesThermoInto } from "./thermo";
import { createMixtureTransport, type MixtureTransport } from "./transport";

export const FLAME_SPEED_MECHANISM = "gri30" as const;
/**
 * Revision of the engine's answers: raised whenever a change of the numerics changes what a solve
 * returns for the same request (start, solver, grid criteria, discretisation), so that stores keyed
 * by request (lib/plant/burner-flame.ts) do not serve an older engine's figures or failures.
 * 2: the start's mass flux follows the burnt temperature; C·|C| in the rates; negative mass
 * fractions cleared from a refined grid's start and after pseudo-time steps; the curvature criterion
 * only for components whose range exceeds 1e-6.
 */
export const FLAME_ENGINE_REVISION = 2;

/** Warm start, first try: the neighbour's grid with at most one round of pseudo-time steps. */
const WARM_FIRST_GRID: SolverSettings = { ...DEFAULT_SOLVER_SETTINGS, maxTimeStepAttempts: 1 };
/** Warm start, second try: a coarse copy of the neighbour's grid of about this many points. */
const WARM_COARSE_POINTS = 30;

/**
 * The factorised Jacobian of the most recent solve, kept for a warm start from exactly that
 * solution (a sweep's next step starts on the same grid): one slot, taken by its first use, so at
 * most one Jacobian (a few tens of MB) is held however many results a caller keeps.
 */
let lastJacobian: { of: FlameSolution; jacobian: BlockTridiagonal } | undefined;
function keepLastJacobian(of: FlameSolution, jacobian: BlockTridiagonal | undefined): void {
  lastJacobian = jacobian ? { of, jacobian } : undefined;
}
function takeLastJacobian(of: FlameSolution): BlockTridiagonal | undefined {
  if (lastJacobian?.of !== of) return undefined;
  const { jacobian } = lastJacobian;
  lastJacobian = undefined;
  return jacobian;
}

/** Stoke's species keys that the mechanism names differently. */
const MECHANISM_NAME: Readonly<Record<string, string>> = { Ar: "AR" };
const STOKE_NAME: Readonly<Record<string, string>> = { AR: "Ar" };

/** Notes that travel with every result. */
export const FLAME_SPEED_NOTES = [
  "Laminar burning velocity of the unstretched, adiabatic, freely propagating 1D flame: GRI-Mech 3.0 with mixture-averaged transport. The mechanism reproduces measured burning velocities of methane, ethane and near-stoichiometric hydrogen flames to about ±10 %; propane flames come out high (of the order of +10–20 %).",
  "Burner flashback and blow-off depend on the burner as well as on the burning velocity: the figure is a screening input, not a burner rating.",
];
export const AMMONIA_NOTE =
  "Ammonia: GRI-Mech 3.0 is not validated for ammonia flames (it over-predicts their burning velocity and their NO); treat the figures as indicative only.";

export interface FlameSpeedOptions {
  onProgress?: (p: ProgressInfo) => void;
  signal?: AbortSignal;
  /** A neighbouring solution (the `solution` of an earlier result) to start from. */
  warmStart?: FlameSpeedState;
  /** Refinement criteria (default: DEFAULT_FLAME_GRID, ratio 3, slope 0.06, curve 0.12, ≤ 1500 points). */
  grid?: Partial<GridCriteria>;
}

/** What a warm start needs of a previous result. */
export interface FlameSpeedState {
  flame: FlameSolution;
  unburntTemperatureK: number;
  inletDensity_kg_per_m3: number;
  /** Inlet mass fractions of that solution. */
  inletY: Float64Array;
  /** The equilibrium estimate of its burnt state (the start's end state). */
  burntEstimate: { temperatureK: number; Y: Float64Array };
  mechanism: string;
  pressurePa: number;
  /** When this solution was warm-started: what the solve changed beyond its estimate (for the next step's predictor). */
  correction?: WarmCorrection;
}

export interface FlameSpeedResult {
  burningVelocity_cm_per_s: number;
  burntTemperatureK: number;
  /** Thermal thickness (T_b − T_u)/max dT/dz, mm. */
  flameThickness_mm: number;
  gridPoints: number;
  mechanism: { name: string; citation: string };
  transport: { model: "mixture-averaged"; thermalDiffusion: boolean; label: string };
  unburnt: { temperatureK: number; pressurePa: number; phi: number; density_kg_per_m3: number; moleFractions: Record<string, number> };
  /** Mole fractions at the burnt end of the domain (≥ 1e-6). */
  products: Record<string, number>;
  NO: NOReport;
  checks: {
    /** Largest |Σ_k Y_k − 1| over the grid. */
    massFractionSumMaxError: number;
    /** Largest relative difference of an element's mass-specific amount between the inlet and the burnt end. */
    elementBalanceMaxRelError: number;
    /** (h_burnt − h_unburnt)/(c_p (T_b − T_u)) with the mechanism's thermo. */
    enthalpyBalanceRelError: number;
    /** Stoke's equilibrium solver at the inlet enthalpy and pressure (its own species data). */
    equilibriumTemperatureK: number;
    burntMinusEquilibriumK: number;
    /** Burning velocity on the grids of the refinement sequence, cm/s. */
    refinementHistory: { gridPoints: number; burningVelocity_cm_per_s: number }[];
  };
  solution: FlameSpeedState;
  diagnostics: SolveStats & { refinementPasses: number; cpuSeconds?: number };
  notes: string[];
}

// ---- cached mechanism, kinetics and transport -----------------------------------------------------

let cachedKinetics: Kinetics | undefined;
const cachedTransport = new Map<boolean, MixtureTransport>();

function engine(soret: boolean): { mech: Mechanism; kinetics: Kinetics; transport: MixtureTransport } {
  const mech = loadMechanism(FLAME_SPEED_MECHANISM);
  cachedKinetics ??= createKinetics(mech);
  let tr = cachedTransport.get(soret);
  if (!tr) {
    tr = createMixtureTransport(mech, { soret });
    cachedTransport.set(soret, tr);
  }
  return { mech, kinetics: cachedKinetics, transport: tr };
}

// ---- the fresh mixture ----------------------------------------------------------------------------

export interface FlameMixture {
  fuel: ResolvedFuel;
  oxidizer: Oxidizer;
  lambda: number;
  /** Fresh-mixture moles per kg of fuel, keyed by mechanism species name. */
  moles: Record<string, number>;
  notes: string[];
}

function mechName(key: string): string {
  return MECHANISM_NAME[key] ?? key;
}

/** The fresh mixture of a request; refuses fuels with species outside the mechanism, naming them. */
export function flameMixture(
  req: Pick<FlameSpeedRequest, "fuel" | "oxidizer" | "phi" | "excessAirPercent" | "flueO2DryPercent">,
  mech: Mechanism,
): FlameMixture {
  const fuel: ResolvedFuel = resolveFuel(req.fuel, "fuel");
  if (fuel.kind !== "gas" || !fuel.gasComposition) {
    throw new InputError("fuel", `the flame engine takes gaseous fuels only (this is a ${fuel.kind} fuel)`);
  }
  const missing = Object.keys(fuel.gasComposition).filter((k) => !mech.speciesIndex.has(mechName(k)));
  if (missing.length) {
    throw new InputError(
      "fuel",
      `${missing.join(", ")} ${missing.length > 1 ? "are" : "is"} not in the ${mech.name} mechanism (it covers C1–C3 hydrocarbons, H2, CO, NH3 and inerts); the burning velocity of this fuel cannot be computed`,
    );
  }
  const oxidizer = normaliseOxidizer(req.oxidizer);
  let lambda: number;
  try {
    lambda = lambdaOf(fuel, req, oxidizer);
  } catch (e) {
    if (!(e instanceof StokeError)) throw e;
    const field = req.flueO2DryPercent !== undefined ? "flueO2DryPercent" : req.excessAirPercent !== undefined ? "excessAirPercent" : "phi";
    throw new InputError(field, e.detail);
  }
  if (!(lambda > 0) || !Number.isFinite(lambda)) throw new InputError("phi", "must give a positive oxidiser supply");
  const nFuel = 1000 / (fuel.molarMass_g_per_mol ?? Number.NaN);
  const moles: Record<string, number> = {};
  for (const [k, x] of Object.entries(fuel.gasComposition)) moles[mechName(k)] = (moles[mechName(k)] ?? 0) + nFuel * x;
  const nOx = (lambda * stoichiometricO2_mol_per_kg(fuel.elements_mol_per_kg)) / (oxidizer.O2 ?? 0);
  for (const k of OXIDIZER_SPECIES) {
    const xk = oxidizer[k];
    if (xk) moles[mechName(k)] = (moles[mechName(k)] ?? 0) + nOx * xk;
  }
  const notes: string[] = [];
  if ((fuel.gasComposition.NH3 ?? 0) > 0) notes.push(AMMONIA_NOTE);
  return { fuel, oxidizer, lambda, moles, notes };
}

// ---- the computation ------------------------------------------------------------------------------

/**
 * A flame without any hydrogen atom in fuel or oxidiser (dry CO in dry air) has no OH chemistry to
 * carry it: the solve does not converge. Its not-converged error then says so and what to give.
 */
function withoutHydrogenHint(e: unknown, mech: Mechanism, inletY: Float64Array): unknown {
  if (!(e instanceof NotConvergedError) || e.diagnostics.cancelled) return e;
  const h = mech.elementNames.indexOf("H");
  if (h < 0) return e;
  let hydrogen = 0;
  for (let k = 0; k < mech.nSpecies; k++)
    hydrogen += (mech.elementMatrix[h * mech.nSpecies + k] * inletY[k]) / mech.molarMass_kg_per_mol[k];
  if (hydrogen > 0) return e;
  return new NotConvergedError(
    e.solver,
    `${e.detail}; the mixture holds no hydrogen (neither the fuel nor the oxidiser): a dry CO flame has no OH chemistry to carry it — give the air's moisture (oxidizer H2O)`,
    e.diagnostics,
    e.field,
  );
}

/** Laminar burning velocity and the flame's figures; throws InputError / NotConvergedError. */
export function computeFlameSpeed(input: FlameSpeedInput, opts: FlameSpeedOptions = {}): FlameSpeedResult {
  const parsed = flameSpeedRequestSchema.safeParse(input);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    throw new InputError(issue.path.map(String).join("."), firstIssueLine(parsed.error).replace(/^[^:]*: /, ""));
  }
  const req = parsed.data;
  const soret = req.thermalDiffusion;
  const { mech, kinetics, transport } = engine(soret);
  const mix = flameMixture(req, mech);
  const Tu = req.unburntTemperatureK;
  const p = req.pressurePa;
  const K = mech.nSpecies;
  const n = K + 2;

  const totalMoles = Object.values(mix.moles).reduce((a, b) => a + b, 0);
  const unburntX: Record<string, number> = {};
  for (const [k, v] of Object.entries(mix.moles)) unburntX[k] = v / totalMoles;
  const inletY = massFractionsFromMoles(mech, unburntX);
  const prob: PremixedProblem = { mech, kinetics, transport, pressurePa: p, unburntTemperatureK: Tu, inletY };
  const rhoU = inletDensity(prob);

  // Stoke's equilibrium solver: the burnt state at the inlet enthalpy (start profile and check)
  const eq = flameTemperature({
    fuel: mix.fuel,
    oxidizer: mix.oxidizer,
    phi: 1 / mix.lambda,
    fuelTemperatureK: Tu,
    oxidizerTemperatureK: Tu,
    pressurePa: p,
    method: "equilibrium",
  });
  const burntX: Record<string, number> = {};
  for (const [k, v] of Object.entries(eq.products)) {
    const name = mechName(k);
    // NO is left out of the start: in the flame it stays far below its equilibrium amount
    if (k === "NO" || !mech.speciesIndex.has(name)) continue;
    burntX[name] = v;
  }
  const burntY = massFractionsFromMoles(mech, burntX);

  const criteria: GridCriteria = { ...DEFAULT_GRID_CRITERIA, ...(req.grid ?? {}), ...(opts.grid ?? {}) };
  const burnt = { temperatureK: eq.temperatureK, Y: burntY };
  const xH2 = mix.fuel.h2MoleFraction ?? 0;
  const cold = () => coldStart(prob, burnt, burningVelocityGuess_m_per_s(xH2, eq.temperatureK, Tu, p));
  const cpu0 = typeof process !== "undefined" && process.cpuUsage ? process.cpuUsage() : undefined;
  const runFrom = (start: FlameSolution, firstGridSettings?: SolverSettings, startJacobian?: BlockTridiagonal, inheritedGrid?: boolean) =>
    solvePremixed(prob, start, {
      criteria,
      onProgress: opts.onProgress,
      signal: opts.signal,
      firstGridSettings,
      startJacobian,
      inheritedGrid,
    });
  let run: ReturnType<typeof solvePremixed>;
  const ws = opts.warmStart;
  let correctionBase: { estimate: FlameSolution; inletChange: Float64Array } | undefined;
  try {
    if (ws && ws.mechanism === mech.name) {
      const estimate = warmStart(
        prob,
        ws.flame,
        ws.unburntTemperatureK,
        ws.inletY,
        ws.burntEstimate,
        ws.inletDensity_kg_per_m3,
        rhoU,
        burnt,
      );
      const inletChange = inletVector(inletY, Tu, p);
      const before = inletVector(ws.inletY, ws.unburntTemperatureK, ws.pressurePa);
      for (let i = 0; i < inletChange.length; i++) inletChange[i] -= before[i];
      // along a sweep: add the previous step's correction, scaled to this step (secant predictor)
      let guess = estimate;
      if (ws.correction) {
        const extrapolated = { ...estimate, x: Float64Array.from(estimate.x) };
        if (extrapolateWarmStart(extrapolated, ws.correction, inletChange) > 0) guess = extrapolated;
      }
      correctionBase = { estimate, inletChange };
      const retryable = (e: unknown) => e instanceof NotConvergedError && !e.diagnostics.cancelled;
      try {
        // a near neighbour: Newton on its grid, at most one round of pseudo-time steps
        run = runFrom(guess, WARM_FIRST_GRID, takeLastJacobian(ws.flame), true);
      } catch (e) {
        if (!retryable(e)) throw e;
        try {
          // further away: pseudo-time steps on a coarse copy of its grid, then refinement
          run = runFrom(thinSolution(guess, WARM_COARSE_POINTS));
        } catch (e2) {
          // too far: start again from the equilibrium-based estimate
          if (!retryable(e2)) throw e2;
          run = runFrom(cold());
        }
      }
    } else {
      run = runFrom(cold());
    }
  } catch (e) {
    throw withoutHydrogenHint(e, mech, inletY);
  }
  const sol = run.solution;
  keepLastJacobian(sol, run.jacobian);
  const correction = correctionBase ? warmCorrection(sol, correctionBase.estimate, correctionBase.inletChange) : undefined;
  const N = sol.z.length;
  const x = sol.x;
  const mdot = x[K + 1];
  const S = mdot / rhoU;
  const Tb = x[(N - 1) * n];

  // flame thickness from the steepest temperature gradient
  let gmax = 0;
  for (let j = 0; j < N - 1; j++) gmax = Math.max(gmax, (x[(j + 1) * n] - x[j * n]) / (sol.z[j + 1] - sol.z[j]));
  // the flame must sit inside the domain: no temperature rise at the inlet
  const inletRiseK = x[n] - Tu;
  if (inletRiseK > 0.01 * (Tb - Tu) || !(S > 0)) {
    throw new NotConvergedError("premixed-flame", "the flame is not contained in the domain (it reaches the inlet)", {
      inletRiseK,
      burningVelocity_m_per_s: S,
      gridPoints: N,
    });
  }

  // checks: Σ Y, elements, enthalpy
  let sumErr = 0;
  for (let j = 0; j < N; j++) {
    let s = 0;
    for (let k = 0; k < K; k++) s += x[j * n + 1 + k];
    sumErr = Math.max(sumErr, Math.abs(s - 1));
  }
  const nE = mech.elementNames.length;
  let elemErr = 0;
  for (let e = 0; e < nE; e++) {
    let a = 0;
    let b = 0;
    for (let k = 0; k < K; k++) {
      const c = mech.elementMatrix[e * K + k] / mech.molarMass_kg_per_mol[k];
      a += c * inletY[k];
      b += c * x[(N - 1) * n + 1 + k];
    }
    if (a > 0) elemErr = Math.max(elemErr, Math.abs(b - a) / a);
  }
  const cpR = new Float64Array(K);
  const hRT = new Float64Array(K);
  const sR = new Float64Array(K);
  const enthalpy = (T: number, Y: ArrayLike<number>, off: number) => {
    speciesThermoInto(mech, T, cpR, hRT, sR);
    let h = 0;
    let cp = 0;
    for (let k = 0; k < K; k++) {
      h += (Y[off + k] * hRT[k] * R_J_per_molK * T) / mech.molarMass_kg_per_mol[k];
      cp += (Y[off + k] * cpR[k] * R_J_per_molK) / mech.molarMass_kg_per_mol[k];
    }
    return { h, cp };
  };
  const hu = enthalpy(Tu, inletY, 0);
  const hb = enthalpy(Tb, x, (N - 1) * n + 1);
  const enthalpyErr = (hb.h - hu.h) / (hb.cp * (Tb - Tu));

  // post-flame NO
  const Yb = x.slice((N - 1) * n + 1, (N - 1) * n + 1 + K);
  const pf = integratePostFlame(mech, kinetics, {
    temperatureK: Tb,
    pressurePa: p,
    massFractions: Yb,
    residenceMs: req.postFlameResidenceMs ?? DEFAULT_POST_FLAME_RESIDENCE_MS,
    referenceO2Percent: req.referenceO2Percent ?? DEFAULT_REFERENCE_O2_PERCENT,
    signal: opts.signal,
  });

  const products: Record<string, number> = {};
  {
    let s = 0;
    for (let k = 0; k < K; k++) s += Yb[k] / mech.molarMass_kg_per_mol[k];
    for (let k = 0; k < K; k++) {
      const X = Yb[k] / mech.molarMass_kg_per_mol[k] / s;
      if (X >= 1e-6) products[STOKE_NAME[mech.speciesNames[k]] ?? mech.speciesNames[k]] = X;
    }
  }
  const unburntOut: Record<string, number> = {};
  for (const [k, v] of Object.entries(unburntX)) unburntOut[STOKE_NAME[k] ?? k] = v;
  const cpu = cpu0 ? process.cpuUsage(cpu0) : undefined;
  return {
    burningVelocity_cm_per_s: 100 * S,
    burntTemperatureK: Tb,
    flameThickness_mm: (1000 * (Tb - Tu)) / gmax,
    gridPoints: N,
    mechanism: { name: mech.name, citation: mech.citation },
    transport: {
      model: "mixture-averaged",
      thermalDiffusion: soret,
      label: soret ? "mixture-averaged, with thermal diffusion (Soret) of H and H2" : "mixture-averaged, without thermal diffusion",
    },
    unburnt: { temperatureK: Tu, pressurePa: p, phi: 1 / mix.lambda, density_kg_per_m3: rhoU, moleFractions: unburntOut },
    products,
    NO: noReport(pf),
    checks: {
      massFractionSumMaxError: sumErr,
      elementBalanceMaxRelError: elemErr,
      enthalpyBalanceRelError: enthalpyErr,
      equilibriumTemperatureK: eq.temperatureK,
      burntMinusEquilibriumK: Tb - eq.temperatureK,
      refinementHistory: run.velocityHistory.map((h) => ({
        gridPoints: h.gridPoints,
        burningVelocity_cm_per_s: 100 * h.burningVelocity_m_per_s,
      })),
    },
    solution: {
      flame: sol,
      unburntTemperatureK: Tu,
      inletDensity_kg_per_m3: rhoU,
      inletY,
      burntEstimate: burnt,
      mechanism: mech.name,
      pressurePa: p,
      ...(correction ? { correction } : {}),
    },
    diagnostics: { ...run.stats, refinementPasses: run.refinementPasses, ...(cpu ? { cpuSeconds: (cpu.user + cpu.system) / 1e6 } : {}) },
    notes: [...FLAME_SPEED_NOTES, ...mix.notes],
  };
}
