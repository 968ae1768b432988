/** Shared plumbing of the command line: argument parsing, input reading, error lines. */
import { readFileSync } from "node:fs";
import type { z } from "zod";
import { firstIssueLine } from "../schemas/fuel";

export interface CliResult {
  stdout: string;
  stderr: string;
  exitCode: number;
}

export class UsageError extends Error {}

/** Parses `--name value` pairs; flags without a value are rejected. */
export function parseFlags(argv: readonly string[], allowed: readonly string[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (!a.startsWith("--")) throw new UsageError(`unexpected argument "${a}"`);
    const name = a.slice(2);
    if (!allowed.includes(name)) throw new UsageError(`unknown option --${name} (options: ${allowed.map((o) => "--" + o).join(", ")})`);
    const v = argv[i + 1];
    if (v === undefined || (v.startsWith("--") && v !== "-")) throw new UsageError(`--${name} needs a value`);
    out[name] = v;
    i++;
  }
  return out;
}

/** Reads and parses the JSON input named by --input (a path, or "-" for standard input). */
export function readJsonInput(path: string | undefined, stdin: () => string): unknown {
  if (path === undefined) throw new UsageError("--input is required (a JSON file, or - for standard input)");
  let text: string;
  try {
    text = path === "-" ? stdin() : readFileSync(path, "utf8");
  } catch (e) {
    throw new UsageError(`input: cannot read "${path}" (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})`);
  }
  try {
    return JSON.parse(text);
  } catch (e) {
    throw new UsageError(`input: not valid JSON (${(e as Error).message})`);
  }
}

/** Validates with a zod schema; on failure throws a UsageError whose one line names the field. */
export function validate<T>(schema: z.ZodType<T>, value: unknown): T {
  const r = schema.safeParse(value);
  if (!r.success) throw new UsageError(firstIssueLine(r.error));
  return r.data;
}

export function ok(value: unknown): CliResult {
  return { stdout: JSON.stringify(value, null, 2) + "\n", stderr: "", exitCode: 0 };
}
export function usageFailure(message: string): CliResult {
  return { stdout: "", stderr: `stoke: ${message.replace(/\s*\n\s*/g, " ")}\n`, exitCode: 2 };
}
