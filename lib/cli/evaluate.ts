/**
 * `stoke evaluate`: a self-contained study file — plant, baseline, candidates, ranking, fit checks,
 * sensitivity, hydrogen sweep and audit trail. `--format csv --table scenarios|checks|sweep`.
 * `--uncertainty N [--seed S]` adds the Monte Carlo ranking over N draws (JSON key `uncertainty`;
 * with --format csv its table, one row per scenario).
 */
import { studySchema } from "../schemas/study";
import { evaluateStudy, type StudyResult } from "../study/evaluate";
import { studyResultToCsv, type CsvTable as StudyCsvTable } from "../study/csv";
import { defineCommand } from "./command";
import { validate, type ParsedOptions } from "./io";
import { readCsv, writeCsv } from "../formats/csv";
import { uncertaintyCsvRows, uncertaintyRanking, type UncertaintyResult } from "../study/uncertainty";
import { UsageError } from "./io";

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
    const result = evaluateStudy(study);
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
