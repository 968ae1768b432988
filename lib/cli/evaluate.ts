/**
 * `stoke evaluate --input study.json [--format json|csv] [--table scenarios|checks|sweep]`
 * Evaluates a self-contained study file: plant, baseline, candidates, ranking, fit checks,
 * sensitivity, hydrogen sweep and audit trail. Bad input: exit 2 with one line naming the field.
 */
import { studySchema } from "../schemas/study";
import { evaluateStudy } from "../study/evaluate";
import { StudyInputError } from "../study/errors";
import { FuelDefinitionError } from "../fuels/resolve";
import { CSV_TABLES, studyResultToCsv, type CsvTable } from "../study/csv";
import { ok, parseFlags, readJsonInput, usageFailure, validate, UsageError, type CliResult } from "./io";

const FORMATS = ["json", "csv"] as const;

export function runEvaluate(argv: readonly string[], stdin: () => string): CliResult {
  try {
    const flags = parseFlags(argv, ["input", "format", "table"]);
    const format = (flags.format ?? "json") as (typeof FORMATS)[number];
    if (!FORMATS.includes(format)) throw new UsageError(`--format must be one of ${FORMATS.join(", ")} (got "${flags.format}")`);
    const tableName = (flags.table ?? "scenarios") as CsvTable;
    if (!CSV_TABLES.includes(tableName)) throw new UsageError(`--table must be one of ${CSV_TABLES.join(", ")} (got "${flags.table}")`);
    if (flags.table !== undefined && format !== "csv") throw new UsageError("--table applies to --format csv only");
    const study = validate(studySchema, readJsonInput(flags.input, stdin));
    const result = evaluateStudy(study);
    if (format === "csv") return { stdout: studyResultToCsv(result, tableName), stderr: "", exitCode: 0 };
    return ok(result);
  } catch (e) {
    if (e instanceof UsageError) return usageFailure(e.message);
    if (e instanceof StudyInputError || e instanceof FuelDefinitionError) return usageFailure(e.message);
    throw e;
  }
}
