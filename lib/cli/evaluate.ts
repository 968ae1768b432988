/**
 * `stoke evaluate`: a self-contained study file — plant, baseline, candidates, ranking, fit checks,
 * sensitivity, hydrogen sweep and audit trail. `--format csv --table scenarios|checks|sweep`.
 * `--uncertainty N [--seed S]` adds the Monte Carlo ranking over N draws (JSON key `uncertainty`;
 * with --format csv its table, one row per scenario).
 */
import { studySchema, type Study } from "../schemas/study";
import { evaluateStudy, type StudyResult } from "../study/evaluate";
import { studyResultToCsv, type CsvTable as StudyCsvTable } from "../study/csv";
import { defineCommand } from "./command";
import { validate, type ParsedOptions } from "./io";
import { readCsv, writeCsv } from "../formats/csv";
import { uncertaintyCsvRows, uncertaintyRanking, type UncertaintyResult } from "../study/uncertainty";
import { UsageError } from "./io";
import { readFileSync, writeFileSync } from "node:fs";
import { solveFlames } from "../study/flame-solves";
import type { FlameOutcome } from "../plant/burner-flame";

/**
 * A flame cache file: `{ "format": "stoke-flames", "solves": { key: outcome } }`, read before and
 * written after the solves (keys are the requests' canonical JSON, so a cache serves any study).
 */
function readFlameCache(path: string): Map<string, FlameOutcome> {
  let text: string;
  try {
    text = readFileSync(path, "utf8");
  } catch {
    return new Map();
  }
  let doc: unknown;
  try {
    doc = JSON.parse(text);
  } catch (e) {
    throw new UsageError(`--flame-cache ${path}: not valid JSON (${(e as Error).message})`);
  }
  const solves = (doc as { format?: unknown; solves?: unknown }).solves;
  if ((doc as { format?: unknown }).format !== "stoke-flames" || typeof solves !== "object" || solves === null)
    throw new UsageError(`--flame-cache ${path}: not a flame cache (format "stoke-flames" with "solves")`);
  return new Map(Object.entries(solves as Record<string, FlameOutcome>));
}

/** The study with its flame solves: from the cache file, the rest computed here (unless --no-flame-speed). */
function evaluateWithFlames(study: Study, o: ParsedOptions): StudyResult {
  if (o["no-flame-speed"] === true) return evaluateStudy(study);
  const cachePath = typeof o["flame-cache"] === "string" ? o["flame-cache"] : null;
  const flames = cachePath ? readFlameCache(cachePath) : new Map<string, FlameOutcome>();
  const first = evaluateStudy(study, { flames });
  if (first.flameSolves.pending === 0) return first;
  const solved = solveFlames(first.flameSolves.needed, { known: (k) => flames.has(k) });
  for (const [k, v] of solved) flames.set(k, v);
  if (cachePath) writeFileSync(cachePath, `${JSON.stringify({ format: "stoke-flames", solves: Object.fromEntries(flames) }, null, 1)}\n`);
  return evaluateStudy(study, { flames });
}

/** A whole number option, or undefined when absent; a usage error naming the option otherwise. */
function wholeOption(o: ParsedOptions, name: string, min: number, max: number): number | undefined {
  const v = o[name];
  if (v === undefined) return undefined;
  const n = typeof v === "string" && /^\d+$/.test(v) ? Number(v) : Number.NaN;
  if (!(n >= min && n <= max)) throw new UsageError(`--${name} takes a whole number from ${min} to ${max}`);
  return n;
}

type EvaluateOutput = StudyResult & { uncertainty?: UncertaintyResult };

const tableOf = (o: ParsedOptions) => (typeof o.table === "string" ? o.table : "scenarios") as StudyCsvTable;

/** Rows of the uncertainty table as CSV text through the one writer. */
function uncertaintyTable(u: UncertaintyResult) {
  const [header, ...rows] = uncertaintyCsvRows(u);
  return { header, rows };
}

export const evaluateCommand = defineCommand({
  compute(input, o): EvaluateOutput {
    const study = validate(studySchema, input);
    const result = evaluateWithFlames(study, o);
    const draws = wholeOption(o, "uncertainty", 10, 100_000);
    if (draws === undefined) return result;
    const seed = wholeOption(o, "seed", 0, 0xffffffff) ?? 1;
    return { ...result, uncertainty: uncertaintyRanking(study, { draws, seed }) };
  },
  singleCsv(result: EvaluateOutput, o) {
    if (result.uncertainty && o.table === undefined) return writeCsv(uncertaintyCsvRows(result.uncertainty));
    return studyResultToCsv(result, tableOf(o));
  },
  csv(result: EvaluateOutput, o) {
    if (result.uncertainty && o.table === undefined) return uncertaintyTable(result.uncertainty);
    // The study's own CSV tables (lib/study/csv.ts) are the one definition of these columns; read
    // back, they become rows of the batch table.
    const [header, ...rows] = readCsv(studyResultToCsv(result, tableOf(o)));
    return { header, rows };
  },
});
