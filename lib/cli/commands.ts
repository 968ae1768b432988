/**
 * The command registry. Adding a command is one entry here plus a module exporting a
 * `CommandImpl` (see `combustion.ts`): single input, batch mode (NDJSON, folders), CSV and help
 * come from `run.ts` and `help.ts` for every command alike. Implementations load on first use, so
 * `stoke --version` and `stoke help` run none of the engine's set-up.
 */
import { UsageError } from "./io";
import type { CommandSpec } from "./command";

const FUEL =
  'FUEL is {"composition": {"CH4": 0.9, "H2": 0.1}} (mole fractions), {"compound": "C2H5OH", "phase": "liquid"}, {"ultimate": {...}, ...} or {"blend": [{"fuel": FUEL, "share": 0.8}, ...], "basis": "volume|mass|energy"}';

export const COMMANDS: readonly CommandSpec[] = [
  {
    name: "properties",
    summary: "heating values, Wobbe index, air demand, flue gas and CO2 factors of a fuel",
    input: `{"fuel": FUEL, "combustionReferenceC": 25, "meteringReferenceC": 15} (references optional: 0, 15, 15.55, 20, 25 °C and 0, 15, 15.56, 20 °C). ${FUEL}`,
    output: "the property sheet; with --format csv one row per input",
    csv: true,
    folder: false,
    options: [],
    examples: [
      `echo '{"fuel": {"composition": {"CH4": 0.9, "H2": 0.1}}}' | stoke properties --input -`,
      "stoke properties --ndjson < analyses.ndjson > sheets.ndjson",
      "stoke properties --input analyses.ndjson --format csv > sheets.csv",
    ],
    load: async () => (await import("./combustion")).propertiesCommand,
  },
  {
    name: "flame",
    summary: "adiabatic flame temperature and products (method: mean-cp | complete | equilibrium)",
    input: `{"fuel": FUEL, "phi": 1, "oxidizer": {"O2": 0.21, "N2": 0.79}, "fuelTemperatureK": 298.15, "oxidizerTemperatureK": 298.15, "pressurePa": 101325, "method": "equilibrium"}; excessAirPercent or flueO2DryPercent may replace phi; all but fuel optional (dry air, φ = 1). ${FUEL}`,
    output:
      "temperatureK, temperatureC, method, phi, lambda, products (mole fractions) and the solver's balances; with --format csv one row per input, a column per product species",
    csv: true,
    folder: false,
    options: [],
    examples: [
      `echo '{"fuel": {"compound": "CH4"}, "phi": 0.9}' | stoke flame --input -`,
      "stoke flame --input charges.ndjson > flames.ndjson",
      "stoke flame --input charges.ndjson --format csv > flames.csv",
    ],
    load: async () => (await import("./combustion")).flameCommand,
  },
  {
    name: "flame-speed",
    summary: "laminar burning velocity by a 1D premixed flame (GRI-Mech 3.0, mixture-averaged transport) and post-flame NO",
    input: `{"fuel": FUEL, "phi": 1, "unburntTemperatureK": 298.15, "pressurePa": 101325, "oxidizer": {"O2": 0.21, "N2": 0.79}, "postFlameResidenceMs": 20}; excessAirPercent or flueO2DryPercent may replace phi; all but fuel optional. Gases whose species GRI-Mech 3.0 holds (CH4, C2H6, C3H8, H2, CO, CO2, N2, Ar, H2O, NH3 …). ${FUEL}`,
    output:
      "burningVelocity_cm_per_s, burntTemperatureK, flameThickness_mm, gridPoints, mechanism, transport, products (burnt-end mole fractions), NO {ppm_dry, mg_per_m3_dry_at_ref_O2, referenceO2Percent, residenceMs} (a screening indicator), diagnostics; with --format csv one row per input",
    csv: true,
    folder: false,
    options: [
      {
        name: "warm-chain",
        help: "batch: start each input from the previous input's converged flame (neighbouring mixtures such as a hydrogen sweep converge in a few steps)",
      },
    ],
    examples: [
      `echo '{"fuel": {"composition": {"CH4": 0.8, "H2": 0.2}}, "phi": 0.9}' | stoke flame-speed --input -`,
      "stoke flame-speed --input mixtures.ndjson --format csv > speeds.csv",
    ],
    load: async () => (await import("./flame-speed")).flameSpeedCommand,
  },
  {
    name: "evaluate",
    summary: "a whole study: plant, baseline and candidates, ranked, with fit checks and audit trail",
    input: "a study file (plant, baseline, scenarios, prices; see seed/example-study.json in the source)",
    output:
      "the ranked study; with --format csv the table chosen by --table (batch: one block of rows per study, named in the first column)",
    csv: true,
    folder: true,
    options: [
      {
        name: "table",
        value: "scenarios|checks|sweep",
        choices: ["scenarios", "checks", "sweep"],
        help: "which table --format csv writes (default scenarios; with --uncertainty the uncertainty table)",
      },
      {
        name: "uncertainty",
        value: "N",
        help: "add the Monte Carlo ranking over N draws (10–100000; Latin hypercube, the study's ranges)",
      },
      { name: "seed", value: "S", help: "seed of the Monte Carlo draws (default 1; the same seed gives the same figures)" },
      {
        name: "no-flame-speed",
        help: "skip the flame solves (burning velocity, flashback, NOx): quick runs; those figures are then unknown (null), never 0",
      },
      {
        name: "flame-cache",
        value: "FILE",
        help: "read flame solves from FILE and write the new ones back (JSON; a solve is keyed by its inputs, so each is computed once)",
      },
    ],
    checkOptions(o) {
      if (o.table !== undefined && o.format !== "csv") throw new UsageError("--table applies to --format csv only");
      if (o.seed !== undefined && o.uncertainty === undefined) throw new UsageError("--seed applies to --uncertainty only");
      if (o["flame-cache"] !== undefined && o["no-flame-speed"] !== undefined)
        throw new UsageError("--flame-cache and --no-flame-speed exclude each other");
    },
    examples: [
      "stoke evaluate --input study.json",
      "stoke evaluate --input study.json --format csv --table checks",
      "stoke evaluate --input studies/ --format csv > portfolio.csv",
      "stoke evaluate --input study.json --uncertainty 10000 --format csv > chances.csv",
    ],
    load: async () => (await import("./evaluate")).evaluateCommand,
  },
];

export function findCommand(name: string): CommandSpec | undefined {
  return COMMANDS.find((c) => c.name === name);
}
