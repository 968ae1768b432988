/**
 * Shared plumbing of the command line: option parsing, input reading, validation, output sinks —
 * and the one place where an error becomes an exit status and a message.
 *
 * Exit status (single input and batch alike):
 *   0  success
 *   1  a solver did not converge (NotConvergedError); nothing is printed as a number
 *   2  bad input: usage, JSON, schema (zod) and lib InputError / InfeasibleChargeError
 *  70  internal error: a bug in Stoke (EX_SOFTWARE of sysexits.h); stack with STOKE_DEBUG=1
 * A batch run exits with the most serious status of its inputs: 70 over 2 over 1 over 0.
 */
import { readFileSync, writeSync } from "node:fs";
import { z } from "zod";
import { NotConvergedError, StokeError, type Diagnostics } from "../errors";

export interface CliResult {
  stdout: string;
  stderr: string;
  exitCode: number;
}

/** Bad command line: unknown command or option, missing value, unreadable input. */
export class UsageError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "UsageError";
  }
}

export const EXIT_OK = 0;
export const EXIT_NOT_CONVERGED = 1;
export const EXIT_BAD_INPUT = 2;
export const EXIT_INTERNAL = 70;

export type FailureKind = "usage" | "input" | "infeasible" | "not-converged" | "internal";

/** An error as the command line reports it. */
export interface Failure {
  kind: FailureKind;
  /** Dotted field path as the user wrote it (`fuel.composition.CH4`); "" when no single field is to blame. */
  field: string;
  /** One line. */
  message: string;
  exitCode: number;
  solver?: string;
  diagnostics?: Diagnostics;
  /** Only with STOKE_DEBUG=1 (internal errors). */
  stack?: string;
}

function oneLine(s: string): string {
  return s.replace(/\s*\n\s*/g, " ").trim();
}

function zodPath(issue: z.core.$ZodIssue, suffix: readonly string[]): string {
  return [...issue.path.map(String), ...suffix].join(".");
}

/**
 * The error mapping of the command line: every error that reaches the edge goes through here.
 * `debug` (STOKE_DEBUG=1) adds the stack of internal errors.
 */
export function describeFailure(e: unknown, debug = false): Failure {
  if (e instanceof NotConvergedError) {
    return {
      kind: e.kind,
      field: e.field,
      message: oneLine(`${e.solver} did not converge: ${e.message}`),
      exitCode: EXIT_NOT_CONVERGED,
      solver: e.solver,
      diagnostics: e.diagnostics,
    };
  }
  if (e instanceof StokeError) {
    return { kind: e.kind, field: e.field, message: oneLine(e.message), exitCode: EXIT_BAD_INPUT };
  }
  if (e instanceof UsageError) return { kind: "usage", field: "", message: oneLine(e.message), exitCode: EXIT_BAD_INPUT };
  if (e instanceof z.core.$ZodError) {
    const issue = e.issues[0];
    if (issue?.code === "unrecognized_keys") {
      // Name the unknown field itself, not the object holding it.
      const field = zodPath(issue, issue.keys.slice(0, 1));
      const more = issue.keys.length > 1 ? ` (also ${issue.keys.slice(1).join(", ")})` : "";
      return { kind: "input", field, message: oneLine(`${field}: unknown field${more}`), exitCode: EXIT_BAD_INPUT };
    }
    const field = issue ? zodPath(issue, []) : "";
    return {
      kind: "input",
      field,
      message: oneLine(`${field || "(input)"}: ${issue?.message ?? "invalid input"}`),
      exitCode: EXIT_BAD_INPUT,
    };
  }
  const err = e instanceof Error ? e : new Error(String(e));
  return {
    kind: "internal",
    field: "",
    message: oneLine(`internal error (a bug in Stoke; STOKE_DEBUG=1 shows where): ${err.name}: ${err.message}`),
    exitCode: EXIT_INTERNAL,
    ...(debug && err.stack ? { stack: err.stack } : {}),
  };
}

/** The most serious of several exit statuses: internal over bad input over not converged over success. */
export function worstExit(a: number, b: number): number {
  const rank = (c: number) => (c === EXIT_INTERNAL ? 3 : c === EXIT_BAD_INPUT ? 2 : c === EXIT_NOT_CONVERGED ? 1 : 0);
  return rank(b) > rank(a) ? b : a;
}

/** The stderr text of a failure: `stoke: <message>` and, with STOKE_DEBUG=1, the stack below. */
export function failureText(f: Failure): string {
  return `stoke: ${f.message}\n${f.stack ? `${f.stack}\n` : ""}`;
}

/** A failure as a single-input command line reports it. */
export function failureResult(e: unknown, debug = false): CliResult {
  const f = describeFailure(e, debug);
  return { stdout: "", stderr: failureText(f), exitCode: f.exitCode };
}

// ---------------------------------------------------------------------------------------------
// Options

export interface OptionSpec {
  name: string;
  /** Placeholder of the value (`FILE`); absent for a switch (`--ndjson`). */
  value?: string;
  choices?: readonly string[];
  help: string;
}

export type ParsedOptions = Record<string, string | true>;

/** Parses `--name value`, `--name=value` and switches against `specs`; anything else is a UsageError. */
export function parseOptions(argv: readonly string[], specs: readonly OptionSpec[]): ParsedOptions {
  const out: ParsedOptions = {};
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (!a.startsWith("--")) throw new UsageError(`unexpected argument "${a}"`);
    const eq = a.indexOf("=");
    const name = eq > 0 ? a.slice(2, eq) : a.slice(2);
    const spec = specs.find((s) => s.name === name);
    if (!spec) throw new UsageError(`unknown option --${name} (options: ${specs.map((o) => `--${o.name}`).join(", ")})`);
    if (name in out) throw new UsageError(`--${name} given twice`);
    if (!spec.value) {
      if (eq > 0) throw new UsageError(`--${name} takes no value`);
      out[name] = true;
      continue;
    }
    let v: string | undefined;
    if (eq > 0) v = a.slice(eq + 1);
    else {
      v = argv[i + 1];
      if (v === undefined || (v.startsWith("--") && v !== "-")) throw new UsageError(`--${name} needs a value (${spec.value})`);
      i++;
    }
    if (spec.choices && !spec.choices.includes(v)) throw new UsageError(`--${name} must be one of ${spec.choices.join(", ")} (got "${v}")`);
    out[name] = v;
  }
  return out;
}

// ---------------------------------------------------------------------------------------------
// Input

/** Parses one JSON text; a syntax error is a UsageError naming the input. */
export function parseJson(text: string, what = "input"): unknown {
  try {
    return JSON.parse(text);
  } catch (e) {
    throw new UsageError(
      `${what}: not valid JSON (${(e as Error).message})${looksLikeNdjson(text) ? "; for one input per line use --ndjson" : ""}`,
    );
  }
}

function looksLikeNdjson(text: string): boolean {
  const lines = text.split("\n").filter((l) => l.trim() !== "");
  if (lines.length < 2) return false;
  try {
    JSON.parse(lines[0]);
    return true;
  } catch {
    return false;
  }
}

/** Drops a leading byte-order mark (files saved by some spreadsheet and Windows editors). */
export function stripBom(text: string): string {
  return text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
}

export function readTextFile(path: string): string {
  try {
    return stripBom(readFileSync(path, "utf8"));
  } catch (e) {
    throw new UsageError(`input: cannot read "${path}" (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})`);
  }
}

/** Reads and parses the JSON input named by --input (a path, or "-" for standard input). */
export function readJsonInput(path: string | undefined, stdin: () => string): unknown {
  if (path === undefined) throw new UsageError("--input is required (a JSON file, or - for standard input)");
  let text: string;
  if (path === "-") {
    try {
      text = stripBom(stdin());
    } catch (e) {
      throw new UsageError(`input: cannot read standard input (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})`);
    }
  } else text = readTextFile(path);
  return parseJson(text);
}

/** Validates with a zod schema; a failure throws the ZodError, which the mapping above names by field. */
export function validate<T>(schema: z.ZodType<T>, value: unknown): T {
  const r = schema.safeParse(value);
  if (!r.success) throw r.error;
  return r.data;
}

// ---------------------------------------------------------------------------------------------
// Output

/** Where output goes: a string buffer in tests, a file descriptor in the process. */
export interface Sink {
  write(s: string): void | Promise<void>;
  flush(): void | Promise<void>;
}

export class StringSink implements Sink {
  text = "";
  write(s: string): void {
    this.text += s;
  }
  flush(): void {}
}

/**
 * Buffers writes to a file descriptor (in chunks of `chunkChars`; 0 writes at once) and writes them
 * with blocking system calls. Node's `process.stdout` / `process.stderr` stream objects are never
 * created: building them is a measurable part of the command's start-up. A non-blocking reader that
 * is full (EAGAIN) is waited for; a closed reader (EPIPE) ends the process quietly, as `| head` expects.
 */
export class FdSink implements Sink {
  private buf = "";
  constructor(
    private readonly fd: number,
    private readonly chunkChars = 1 << 16,
  ) {}
  write(s: string): void {
    this.buf += s;
    if (this.buf.length >= this.chunkChars) this.flush();
  }
  flush(): void {
    if (!this.buf) return;
    let bytes = Buffer.from(this.buf, "utf8");
    this.buf = "";
    while (bytes.length > 0) {
      try {
        const n = writeSync(this.fd, bytes);
        bytes = bytes.subarray(n);
      } catch (e) {
        const code = (e as NodeJS.ErrnoException).code;
        if (code === "EAGAIN") Atomics.wait(PAUSE, 0, 0, 2);
        else if (code === "EPIPE") process.exit(0);
        else throw e;
      }
    }
  }
}
const PAUSE = new Int32Array(new SharedArrayBuffer(4));

export function ok(value: unknown): CliResult {
  return { stdout: `${JSON.stringify(value, null, 2)}\n`, stderr: "", exitCode: 0 };
}
