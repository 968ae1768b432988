/**
 * The flame solves a study needs, by content: each request (fuel gas, air factor, unburnt
 * temperature, oxidiser, grid) has a key — its canonical JSON, with the flame engine's revision
 * (FLAME_ENGINE_REVISION) — so a solve is computed once and
 * found again by whoever asks for the same flame (a scenario, a sweep point, another study). The
 * figures kept of a solve are compact (`FlameFigures`); the store that holds them is the caller's:
 * a Map in the command line, the database in the app (lib/services/flames.ts).
 *
 * Surrogates (stated in the notes of every figure they touch): GRI-Mech 3.0 covers C1–C3, H2, CO,
 * NH3 and inerts. Butanes and heavier are counted as propane mole for mole and H2S as nitrogen,
 * when together at most `SURROGATE_MAX_FRACTION` of the gas; beyond that the burning velocity is
 * unknown.
 */
import { canonicalJson } from "../formats/canonical-json";
import type { ResolvedFuel } from "../fuels/resolve";
import type { Oxidizer } from "../combustion/stoichiometry";
import type { FlameSpeedInput } from "../schemas/flame-speed";
import { FLAME_ENGINE_REVISION, FLAME_SPEED_MECHANISM, type FlameSpeedResult } from "../flame/flame-speed";
import { atReferenceO2, ppmToMg_per_m3Normal } from "../units/emissions";
import { MOLAR_MASS_g_per_mol } from "../thermo/species-data";

/** Grid of the study's flame solves: the flame tests' moderate grid (about 100–130 points; burning velocity within 1 % of a fine grid). */
export const STUDY_FLAME_GRID = Object.freeze({ ratio: 3, slope: 0.1, curve: 0.2, maxPoints: 600 });

/** Largest mole fraction of a gas that may be represented by a surrogate species in a flame solve. */
export const SURROGATE_MAX_FRACTION = 0.02;

/** Species the flame engine's mechanism (GRI-Mech 3.0) holds, by Stoke's keys. */
const MECHANISM_SPECIES = new Set(["CH4", "C2H6", "C3H8", "H2", "CO", "CO2", "H2O", "N2", "O2", "Ar", "NH3", "C2H4", "C2H2", "CH3OH"]);
const SURROGATE: Readonly<Record<string, string>> = {
  nC4H10: "C3H8",
  iC4H10: "C3H8",
  nC5H12: "C3H8",
  nC6H14: "C3H8",
  H2S: "N2",
};

/** What a study keeps of one flame solve. */
export interface FlameFigures {
  burningVelocity_cm_per_s: number;
  burntTemperatureK: number;
  /** NO + NO2 after the post-flame residence time, ppm of the dry gas, and the O2 of that dry gas. */
  NOx_ppm_dry: number;
  O2_percent_dry: number;
  residenceMs: number;
  gridPoints: number;
  /** CPU seconds of the solve (diagnostics; null when unknown). */
  cpuSeconds: number | null;
}

/** A solve that did not converge or was refused: its figures are unknown, with the reason. */
export interface FlameFailure {
  error: string;
}

export type FlameOutcome = FlameFigures | FlameFailure;

export const isFlameFailure = (o: FlameOutcome): o is FlameFailure => "error" in o;

/** Where evaluated studies find flame solves: undefined = not solved (yet). */
export interface FlameLookup {
  get(key: string): FlameOutcome | undefined;
}

export interface FlameRequest {
  key: string;
  request: FlameSpeedInput;
  /** Surrogates used, in words. */
  notes: string[];
}

const round = (v: number, digits: number) => Number(v.toPrecision(digits));

/**
 * The flame request of a gas at an air factor, or why there is none (not a gas, species beyond the
 * mechanism and its surrogates).
 */
export function flameRequestFor(
  fuel: ResolvedFuel,
  lambda: number,
  unburntTemperatureK: number,
  oxidizer: Oxidizer,
  grid: Readonly<{ ratio: number; slope: number; curve: number; maxPoints: number }> = STUDY_FLAME_GRID,
): FlameRequest | { unknown: string } {
  if (fuel.kind !== "gas" || !fuel.gasComposition)
    return { unknown: `a ${fuel.kind} fuel burns as a spray or bed, not as a premixed gas: no laminar burning velocity` };
  const comp: Record<string, number> = {};
  let surrogate = 0;
  const lumped: string[] = [];
  for (const [k, x] of Object.entries(fuel.gasComposition)) {
    if (!(x > 0)) continue;
    let key = k;
    if (!MECHANISM_SPECIES.has(k)) {
      const s = SURROGATE[k];
      if (!s) return { unknown: `${k} is not in the flame mechanism (GRI-Mech 3.0): the burning velocity of this gas cannot be computed` };
      surrogate += x;
      lumped.push(`${k} as ${s}`);
      key = s;
    }
    comp[key] = (comp[key] ?? 0) + x;
  }
  if (surrogate > SURROGATE_MAX_FRACTION)
    return {
      unknown: `${(100 * surrogate).toFixed(1)} vol % of the gas (${lumped.join(", ")}) lies outside the flame mechanism, more than the ${100 * SURROGATE_MAX_FRACTION} % a surrogate may stand in for`,
    };
  const rounded: Record<string, number> = {};
  for (const k of Object.keys(comp).sort()) rounded[k] = round(comp[k], 10);
  const ox: Record<string, number> = {};
  for (const k of Object.keys(oxidizer).sort()) {
    const v = oxidizer[k as keyof Oxidizer];
    if (v) ox[k] = round(v, 8);
  }
  const Tu = Math.min(900, Math.max(250, unburntTemperatureK));
  const request: FlameSpeedInput = {
    fuel: { composition: rounded },
    oxidizer: ox,
    phi: round(1 / lambda, 8),
    unburntTemperatureK: round(Tu, 6),
    pressurePa: 101325,
    grid: { ...grid },
  };
  const notes = lumped.length
    ? [
        `flame solve: ${(100 * surrogate).toFixed(2)} vol % of the gas counted as surrogates (${lumped.join(", ")}), as GRI-Mech 3.0 does not hold them`,
      ]
    : [];
  if (Tu !== unburntTemperatureK)
    notes.push(`flame solve: unburnt mixture taken at ${Tu.toFixed(0)} K, the nearest the flame engine accepts`);
  return { key: flameKeyOf(request), request, notes };
}

/** The engine's revision is part of the key: a changed engine solves again instead of reusing old figures. */
const FLAME_KEY_ENGINE = `${FLAME_SPEED_MECHANISM} r${FLAME_ENGINE_REVISION}`;

function flameKeyOf(request: FlameSpeedInput): string {
  return canonicalJson({ engine: FLAME_KEY_ENGINE, request });
}

/** The request behind a key of flameRequestFor. */
export function flameRequestOfKey(key: string): FlameSpeedInput {
  return (JSON.parse(key) as { request: FlameSpeedInput }).request;
}

/** The compact figures of a solve. */
export function flameFiguresOf(r: FlameSpeedResult): FlameFigures {
  return {
    burningVelocity_cm_per_s: r.burningVelocity_cm_per_s,
    burntTemperatureK: r.burntTemperatureK,
    NOx_ppm_dry: r.NO.ppm_dry + (r.NO.NO2_ppm_dry ?? 0),
    O2_percent_dry: r.NO.O2_percent_dry,
    residenceMs: r.NO.residenceMs,
    gridPoints: r.gridPoints,
    cpuSeconds: r.diagnostics.cpuSeconds ?? null,
  };
}

/** NOx as NO2, mg/m³ dry (0 °C, 101.325 kPa) at the reference O2; null where the correction is undefined. */
export function noxAtReferenceO2(f: FlameFigures, referenceO2Percent: number): number | null {
  const v = atReferenceO2(ppmToMg_per_m3Normal(f.NOx_ppm_dry, MOLAR_MASS_g_per_mol.NO2), f.O2_percent_dry, referenceO2Percent);
  return Number.isFinite(v) ? v : null;
}
