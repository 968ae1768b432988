/**
 * Equivalence-ratio sweep of the adiabatic flame temperature: chemical equilibrium and complete
 * combustion (and, for reference, the mean-cp hand estimate) against φ, with the peak of each
 * curve located by solving again around the highest grid point (golden-section search on the
 * real function, not an interpolation). With dissociation the equilibrium peak sits slightly on
 * the rich side of φ = 1; the complete-combustion curve peaks at or near φ = 1.
 *
 * Every point is a full solve through lib/combustion/flame.ts; a point whose solver does not
 * converge is reported with its error, never with a number.
 */
import type { FuelDefinition } from "../schemas/fuel";
import { checkLiquidFeed, resolveFuel, type ResolvedFuel } from "../fuels/resolve";
import { flameTemperature, lambdaOf, FLAME_METHOD_LABELS, type FlameMethod } from "../combustion/flame";
import type { Oxidizer } from "../combustion/stoichiometry";
import type { EquilibriumResult } from "../combustion/equilibrium";
import { T298K, atmospherePa, celsiusToKelvin, kelvinToCelsius } from "../units/constants";
import { operatingPointOf, type OperatingOverrides, type Plant } from "../schemas/plant";
import { plantOxidizer } from "../plant/performance";
import { InfeasibleChargeError, InputError, NotConvergedError } from "../errors";

export interface PhiSweepOptions {
  fuel: FuelDefinition | ResolvedFuel;
  oxidizer?: Oxidizer;
  phiMin?: number;
  phiMax?: number;
  /** Number of grid intervals (points = steps + 1). */
  steps?: number;
  fuelTemperatureK?: number;
  oxidizerTemperatureK?: number;
  pressurePa?: number;
  /** Include the mean-cp hand estimate (default true). */
  meanCp?: boolean;
}

export interface PhiSweepPoint {
  phi: number;
  equilibriumK: number | null;
  completeK: number | null;
  meanCpK: number | null;
  /** Equilibrium CO and H2 mole fractions (show why the rich side dissociates less). */
  equilibriumCO: number | null;
  equilibriumH2: number | null;
  errors: string[];
}

export interface PhiPeak {
  phi: number;
  temperatureK: number;
  /** How the peak was found. */
  method: "golden-section search on the solver" | "grid maximum at the sweep's edge" | "grid maximum (refinement did not converge)";
}

export interface PhiSweepResult {
  points: PhiSweepPoint[];
  peak: { equilibrium: PhiPeak | null; complete: PhiPeak | null };
  methods: Record<"equilibrium" | "complete" | "mean-cp", string>;
  basis: string;
}

export const PHI_SWEEP_DEFAULTS = { phiMin: 0.5, phiMax: 1.6, steps: 44 } as const;

/**
 * A point that cannot be computed (too rich for a gas-phase product model, or a solve that did not
 * converge) is reported on that point; any other error is a bug and escapes.
 */
function pointProblem(e: unknown): string {
  if (e instanceof InfeasibleChargeError || e instanceof NotConvergedError) return e.detail;
  throw e;
}

/** Maximum of a unimodal function on [a, b] by golden-section search (tolerance in φ). */
function goldenMax(f: (x: number) => number, a: number, b: number, tol = 1e-4): { x: number; fx: number } {
  const g = (Math.sqrt(5) - 1) / 2;
  let c = b - g * (b - a);
  let d = a + g * (b - a);
  let fc = f(c);
  let fd = f(d);
  for (let i = 0; i < 60 && b - a > tol; i++) {
    if (fc >= fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - g * (b - a);
      fc = f(c);
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + g * (b - a);
      fd = f(d);
    }
  }
  return fc >= fd ? { x: c, fx: fc } : { x: d, fx: fd };
}

export function phiSweep(opts: PhiSweepOptions): PhiSweepResult {
  const fuel: ResolvedFuel =
    (opts.fuel as ResolvedFuel).elements_mol_per_kg !== undefined ? (opts.fuel as ResolvedFuel) : resolveFuel(opts.fuel as FuelDefinition);
  const phiMin = opts.phiMin ?? PHI_SWEEP_DEFAULTS.phiMin;
  const phiMax = opts.phiMax ?? PHI_SWEEP_DEFAULTS.phiMax;
  const steps = Math.max(2, Math.round(opts.steps ?? PHI_SWEEP_DEFAULTS.steps));
  if (!(phiMin > 0)) throw new InputError("phiMin", "must be > 0");
  if (!(phiMax > phiMin)) throw new InputError("phiMax", "must be greater than phiMin");
  const common = {
    fuel,
    oxidizer: opts.oxidizer,
    fuelTemperatureK: opts.fuelTemperatureK ?? T298K,
    oxidizerTemperatureK: opts.oxidizerTemperatureK ?? T298K,
    pressurePa: opts.pressurePa ?? atmospherePa,
  };
  // One input error for the whole sweep, not the same refusal at every point.
  checkLiquidFeed(fuel, common.fuelTemperatureK, common.pressurePa);
  let warm: EquilibriumResult | undefined;
  const solve = (phi: number, method: FlameMethod) =>
    flameTemperature({ ...common, phi, method, warmStart: method === "equilibrium" ? warm : undefined });

  const points: PhiSweepPoint[] = [];
  for (let i = 0; i <= steps; i++) {
    const phi = Math.round((phiMin + ((phiMax - phiMin) * i) / steps) * 1e9) / 1e9;
    const p: PhiSweepPoint = {
      phi,
      equilibriumK: null,
      completeK: null,
      meanCpK: null,
      equilibriumCO: null,
      equilibriumH2: null,
      errors: [],
    };
    try {
      const r = solve(phi, "equilibrium");
      p.equilibriumK = r.temperatureK;
      p.equilibriumCO = r.products.CO ?? 0;
      p.equilibriumH2 = r.products.H2 ?? 0;
      if (r.equilibrium) warm = r.equilibrium;
    } catch (e) {
      p.errors.push(`equilibrium: ${pointProblem(e)}`);
      warm = undefined;
    }
    try {
      p.completeK = solve(phi, "complete").temperatureK;
    } catch (e) {
      p.errors.push(`complete combustion: ${pointProblem(e)}`);
    }
    if (opts.meanCp !== false) {
      try {
        p.meanCpK = solve(phi, "mean-cp").temperatureK;
      } catch (e) {
        p.errors.push(`mean-cp estimate: ${pointProblem(e)}`);
      }
    }
    points.push(p);
  }

  const peakOf = (key: "equilibriumK" | "completeK", method: FlameMethod): PhiPeak | null => {
    let best = -1;
    points.forEach((p, i) => {
      const v = p[key];
      if (v !== null && (best < 0 || v > (points[best][key] as number))) best = i;
    });
    if (best < 0) return null;
    const atEdge = best === 0 || best === points.length - 1 || points[best - 1][key] === null || points[best + 1][key] === null;
    if (atEdge) return { phi: points[best].phi, temperatureK: points[best][key] as number, method: "grid maximum at the sweep's edge" };
    warm = undefined;
    try {
      const m = goldenMax((phi) => solve(phi, method).temperatureK, points[best - 1].phi, points[best + 1].phi);
      return { phi: m.x, temperatureK: m.fx, method: "golden-section search on the solver" };
    } catch {
      return { phi: points[best].phi, temperatureK: points[best][key] as number, method: "grid maximum (refinement did not converge)" };
    }
  };

  return {
    points,
    peak: { equilibrium: peakOf("equilibriumK", "equilibrium"), complete: peakOf("completeK", "complete") },
    methods: {
      equilibrium: FLAME_METHOD_LABELS.equilibrium,
      complete: FLAME_METHOD_LABELS.complete,
      "mean-cp": FLAME_METHOD_LABELS["mean-cp"],
    },
    basis: `adiabatic, at ${(common.pressurePa / 1000).toFixed(3)} kPa; fuel at ${kelvinToCelsius(common.fuelTemperatureK).toFixed(0)} °C, oxidiser at ${kelvinToCelsius(common.oxidizerTemperatureK).toFixed(0)} °C`,
  };
}

/** The sweep in a plant's conditions: its humid combustion air at the air temperature, fuel at 25 °C, 1 atm. */
export interface PlantPhiSweep extends PhiSweepResult {
  /** φ at the plant's flue O2 (the operating point), or null when it cannot be computed. */
  operatingPhi: number | null;
  conditions: { combustionAirC: number; flueO2DryPercent: number; ambientAir: { temperatureC: number; relativeHumidityPercent: number } };
}

export function phiSweepInPlant(
  fuel: FuelDefinition,
  plant: Plant,
  overrides: OperatingOverrides = {},
  opts: Pick<PhiSweepOptions, "phiMin" | "phiMax" | "steps"> = {},
): PlantPhiSweep {
  const op = operatingPointOf(plant, overrides);
  const oxidizer = plantOxidizer(op);
  const resolved = resolveFuel(fuel);
  const r = phiSweep({ ...opts, fuel: resolved, oxidizer, oxidizerTemperatureK: celsiusToKelvin(op.combustionAirC) });
  let operatingPhi: number | null = null;
  try {
    operatingPhi = 1 / lambdaOf(resolved, { flueO2DryPercent: op.flueO2DryPercent }, oxidizer);
  } catch {
    operatingPhi = null;
  }
  return {
    ...r,
    operatingPhi,
    conditions: { combustionAirC: op.combustionAirC, flueO2DryPercent: op.flueO2DryPercent, ambientAir: op.ambientAir },
    basis: `${r.basis}; humid combustion air (ambient ${op.ambientAir.temperatureC} °C, ${op.ambientAir.relativeHumidityPercent} % RH)`,
  };
}
