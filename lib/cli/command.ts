/**
 * What a command is: its implementation (compute, CSV) and its description (options, help). The
 * registry of commands is commands.ts; command modules import only this file, so the registry's
 * lazy imports of them form no cycle.
 */
import type { OptionSpec, ParsedOptions } from "./io";

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
  /** Batch records leave one by one as they are computed (slow commands: a reader sees each as it finishes). */
  recordByRecord?: boolean;
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
