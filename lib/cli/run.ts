/**
 * Runs one command of the registry, for every command alike: one JSON input, or a batch (NDJSON
 * lines, or the study files of a folder) with one output record per input, in order.
 *
 * Batch records (NDJSON, one per non-blank input line; `file` instead of `line` for a folder):
 *   {"line": 3, "ok": true, "result": {...}}
 *   {"line": 4, "ok": false, "error": {"kind": "input", "field": "fuel.composition.CH4", "message": "..."}}
 * A bad input never stops the run; the exit status is the most serious of all inputs (see io.ts).
 */
import { readdirSync, statSync } from "node:fs";
import { join } from "node:path";
import { InputError } from "../errors";
import { commonOptions, type CommandImpl, type CommandSpec, type OutputFormat } from "./command";
import { CsvCollector, toCsv } from "./csv";
import { helpFor } from "./help";
import {
  describeFailure,
  EXIT_OK,
  failureResult,
  failureText,
  ok,
  parseOptions,
  readJsonInput,
  readTextFile,
  stripBom,
  UsageError,
  worstExit,
  type CliResult,
  type ParsedOptions,
  type Sink,
} from "./io";

export interface CliIo {
  /** All of standard input (single input). */
  stdinText(): string;
  /** Standard input line by line (batch). */
  stdinLines(): AsyncIterable<string>;
  out: Sink;
  err: Sink;
  /** Standard error is a terminal: show progress. */
  errIsTTY: boolean;
  /** STOKE_DEBUG=1: stacks of internal errors. */
  debug: boolean;
}

type Mode = { kind: "single"; input: string } | { kind: "lines"; path: string | undefined } | { kind: "folder"; path: string };

function parseFor(spec: CommandSpec, argv: readonly string[]): ParsedOptions {
  const o = parseOptions(argv, [...commonOptions(spec), ...spec.options]);
  if (!o.help) spec.checkOptions?.(o);
  return o;
}

function modeOf(spec: CommandSpec, o: ParsedOptions): Mode {
  const input = typeof o.input === "string" ? o.input : undefined;
  if (input === undefined && !o.ndjson) {
    throw new UsageError(
      `--input is required (a JSON file, - for standard input${spec.folder ? ", a folder" : ""}, or an .ndjson file), or --ndjson to read one input per line from standard input`,
    );
  }
  if (input !== undefined && input !== "-") {
    let dir = false;
    try {
      dir = statSync(input).isDirectory();
    } catch {
      // not there: reading it below says so
    }
    if (dir) {
      if (!spec.folder) throw new UsageError(`--input: "${input}" is a folder; ${spec.name} reads a JSON or NDJSON file`);
      return { kind: "folder", path: input };
    }
  }
  if (o.ndjson || (input !== undefined && /\.(ndjson|jsonl)$/i.test(input)))
    return { kind: "lines", path: input === "-" ? undefined : input };
  return { kind: "single", input: input! };
}

function formatOf(mode: Mode, o: ParsedOptions): OutputFormat {
  const f = o.format as OutputFormat | undefined;
  if (mode.kind === "single") {
    if (f === "ndjson") throw new UsageError("--format ndjson is for batch input (--ndjson, an .ndjson file or a folder)");
    return f ?? "json";
  }
  if (f === "json") throw new UsageError("batch output is --format ndjson (default) or csv");
  return f ?? "ndjson";
}

function single(impl: CommandImpl, o: ParsedOptions, input: string, stdin: () => string): CliResult {
  const result = impl.compute(readJsonInput(input, stdin), o);
  if (o.format !== "csv") return ok(result);
  const text = impl.singleCsv ? impl.singleCsv(result, o) : toCsv(impl.csv!(result, o));
  return { stdout: text, stderr: "", exitCode: EXIT_OK };
}

/** One input, synchronously; batch options are refused. */
export function runSingleSync(
  spec: CommandSpec,
  impl: CommandImpl,
  argv: readonly string[],
  stdin: () => string,
  debug = false,
): CliResult {
  try {
    const o = parseFor(spec, argv);
    if (o.help) return { stdout: helpFor(spec), stderr: "", exitCode: EXIT_OK };
    const mode = modeOf(spec, o);
    if (mode.kind !== "single") throw new UsageError("batch input needs the stoke command");
    formatOf(mode, o);
    return single(impl, o, mode.input, stdin);
  } catch (e) {
    return failureResult(e, debug);
  }
}

interface Item {
  /** `{line: n}` or `{file: name}`. */
  key: Record<string, number | string>;
  read(): string;
}

function* linesOf(text: string): Generator<Item> {
  const lines = text.split("\n");
  for (let i = 0; i < lines.length; i++) {
    const t = lines[i];
    if (t.trim() !== "") yield { key: { line: i + 1 }, read: () => t };
  }
}

async function* stdinItems(lines: AsyncIterable<string>): AsyncGenerator<Item> {
  let n = 0;
  for await (const line of lines) {
    n++;
    const t = n === 1 ? stripBom(line) : line;
    if (t.trim() !== "") yield { key: { line: n }, read: () => t };
  }
}

function folderItems(dir: string): Item[] {
  let names: string[];
  try {
    names = readdirSync(dir).filter((f) => f.toLowerCase().endsWith(".json"));
  } catch (e) {
    throw new UsageError(`input: cannot read folder "${dir}" (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})`);
  }
  names.sort();
  if (names.length === 0) throw new UsageError(`input: no *.json files in "${dir}"`);
  return names.map((name) => ({ key: { file: name }, read: () => readTextFile(join(dir, name)) }));
}

/** Progress on standard error: count, failures, rate and (when the total is known) time left. */
class Progress {
  private readonly t0 = performance.now();
  private last = this.t0;
  private shown = false;
  constructor(
    private readonly err: Sink,
    private readonly total: number | undefined,
  ) {}
  tick(done: number, failed: number): void {
    const now = performance.now();
    if (now - this.last < 200) return;
    this.last = now;
    const s = (now - this.t0) / 1000;
    const rate = done / s;
    let line = `stoke: ${done}${this.total ? `/${this.total}` : ""} inputs, ${failed} failed, ${rate >= 10 ? rate.toFixed(0) : rate.toFixed(1)}/s`;
    if (this.total && rate > 0) {
      const left = Math.max(0, Math.round((this.total - done) / rate));
      line += `, ${Math.floor(left / 60)}:${String(left % 60).padStart(2, "0")} left`;
    }
    this.shown = true;
    this.err.write(`\r${line}\x1b[K`);
  }
  done(): void {
    if (this.shown) this.err.write("\r\x1b[K");
  }
}

async function batch(
  impl: CommandImpl,
  o: ParsedOptions,
  mode: Exclude<Mode, { kind: "single" }>,
  format: OutputFormat,
  io: CliIo,
): Promise<number> {
  let items: Iterable<Item> | AsyncIterable<Item>;
  let total: number | undefined;
  if (mode.kind === "folder") {
    const list = folderItems(mode.path);
    items = list;
    total = list.length;
  } else if (mode.path === undefined) {
    items = stdinItems(io.stdinLines());
  } else {
    const text = readTextFile(mode.path);
    const list = [...linesOf(text)];
    items = list;
    total = list.length;
  }
  const progress = io.errIsTTY && !o["no-progress"] ? new Progress(io.err, total) : undefined;
  const keyName = mode.kind === "folder" ? "file" : "line";
  const csv = format === "csv" ? new CsvCollector([keyName, "error"]) : undefined;
  let exit = EXIT_OK;
  let done = 0;
  const failedKeys: (string | number)[] = [];
  for await (const item of items) {
    done++;
    const keyValue = item.key[keyName];
    try {
      let input: unknown;
      const text = item.read();
      try {
        input = JSON.parse(text);
      } catch (e) {
        throw new InputError("", `not valid JSON (${(e as Error).message})`);
      }
      const result = impl.compute(input, o);
      if (csv) csv.add([keyValue, ""], impl.csv!(result, o));
      else {
        const w = io.out.write(`${JSON.stringify({ ...item.key, ok: true, result })}\n`);
        if (w) await w;
        if (impl.recordByRecord) await io.out.flush();
      }
    } catch (e) {
      const f = describeFailure(e, io.debug);
      exit = worstExit(exit, f.exitCode);
      failedKeys.push(keyValue);
      if (csv) csv.add([keyValue, f.message]);
      else {
        const error = {
          kind: f.kind,
          field: f.field,
          message: f.message,
          ...(f.solver ? { solver: f.solver, diagnostics: f.diagnostics } : {}),
          ...(f.stack ? { stack: f.stack } : {}),
        };
        const w = io.out.write(`${JSON.stringify({ ...item.key, ok: false, error })}\n`);
        if (w) await w;
        if (impl.recordByRecord) await io.out.flush();
      }
    }
    progress?.tick(done, failedKeys.length);
  }
  progress?.done();
  if (csv) await io.out.write(csv.toCsv());
  if (failedKeys.length) {
    const shown = failedKeys.slice(0, 10).join(", ") + (failedKeys.length > 10 ? ", …" : "");
    await io.err.write(`stoke: ${failedKeys.length} of ${done} inputs failed (${keyName}${failedKeys.length > 1 ? "s" : ""} ${shown})\n`);
  }
  return exit;
}

/** Runs `spec` with `argv` (the words after the command name); returns the exit status. */
export async function runCommand(spec: CommandSpec, argv: readonly string[], io: CliIo): Promise<number> {
  let exit: number;
  try {
    const o = parseFor(spec, argv);
    if (o.help) {
      await io.out.write(helpFor(spec));
      exit = EXIT_OK;
    } else {
      const mode = modeOf(spec, o);
      const format = formatOf(mode, o);
      const impl = await spec.load();
      if (mode.kind === "single") {
        const r = single(impl, o, mode.input, () => io.stdinText());
        await io.out.write(r.stdout);
        exit = r.exitCode;
      } else exit = await batch(impl, o, mode, format, io);
    }
  } catch (e) {
    const f = describeFailure(e, io.debug);
    await io.err.write(failureText(f));
    exit = f.exitCode;
  }
  await io.out.flush();
  await io.err.flush();
  return exit;
}
