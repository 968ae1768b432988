/**
 * The command registry. Adding a command is one entry here plus a module exporting a
 * `CommandImpl` (see `combustion.ts`): single input, batch mode (NDJSON, folders), CSV and help
 * come from `run.ts` and `help.ts` for every command alike. Implementations load on first use, so
 * `stoke --version` and `stoke help` run none of the engine's set-up.
 */
import { UsageError, type OptionSpec, type ParsedOptions } from "./io";

export type OutputFormat = "json" | "ndjson" | "csv";

/** A table for CSV output: column names carry units. */
export interface CsvTable {
  header: string[];
  rows: unknown[][];
}

export interface CommandImpl<R = unknown> {
  /** Validates one parsed JSON input and computes its result. Throws the lib/errors.ts errors. */
  compute(input: unknown, options: ParsedOptions): R;
  /** The result as a table (commands that offer `--format csv`). */
  csv?(result: R, options: ParsedOptions): CsvTable;
  /** The single-input CSV text, when it differs from the generic writer's (evaluate keeps its tables). */
  singleCsv?(result: R, options: ParsedOptions): string;
}

/** Erases the result type of an implementation for the registry. */
export function defineCommand<R>(impl: CommandImpl<R>): CommandImpl {
  return impl as unknown as CommandImpl;
}

export interface CommandSpec {
  name: string;
  /** One line for `stoke help`. */
  summary: string;
  /** What one input is (a JSON object), for `stoke help COMMAND`. */
  input: string;
  output: string;
  /** Output formats beside json (single input) and ndjson (batch). */
  csv: boolean;
  /** `--input DIR` evaluates every `*.json` file of a folder. */
  folder: boolean;
  /** Options of this command beside the common ones. */
  options: readonly OptionSpec[];
  /** Checks across options, e.g. an option that applies to one format only. */
  checkOptions?(options: ParsedOptions): void;
  examples: readonly string[];
  load(): Promise<CommandImpl>;
}

/** Options every command takes. */
export function commonOptions(spec: Pick<CommandSpec, "csv" | "folder">): OptionSpec[] {
  const formats = spec.csv ? ["json", "ndjson", "csv"] : ["json", "ndjson"];
  return [
    {
      name: "input",
      value: spec.folder ? "FILE|DIR|-" : "FILE|-",
      help:
        "one JSON input (FILE, or - for standard input); a .ndjson or .jsonl FILE is a batch, one input per line" +
        (spec.folder ? "; a DIR is a batch of its *.json files (in name order)" : ""),
    },
    { name: "ndjson", help: "the input is newline-delimited JSON, one input per line (standard input when --input is not given)" },
    {
      name: "format",
      value: formats.join("|"),
      choices: formats,
      help:
        "output: json (single input, default), ndjson (batch, default: one record per input line)" +
        (spec.csv ? ", csv (one row per input, units in the headers)" : ""),
    },
    { name: "no-progress", help: "no progress line on standard error (it is shown only when standard error is a terminal)" },
    { name: "help", help: "this help" },
  ];
}

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
        help: "which table --format csv writes (default scenarios)",
      },
    ],
    checkOptions(o) {
      if (o.table !== undefined && o.format !== "csv") throw new UsageError("--table applies to --format csv only");
    },
    examples: [
      "stoke evaluate --input study.json",
      "stoke evaluate --input study.json --format csv --table checks",
      "stoke evaluate --input studies/ --format csv > portfolio.csv",
    ],
    load: async () => (await import("./evaluate")).evaluateCommand,
  },
];

export function findCommand(name: string): CommandSpec | undefined {
  return COMMANDS.find((c) => c.name === name);
}
