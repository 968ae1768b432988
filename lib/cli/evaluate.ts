/**
 * `stoke evaluate`: a self-contained study file — plant, baseline, candidates, ranking, fit checks,
 * sensitivity, hydrogen sweep and audit trail. `--format csv --table scenarios|checks|sweep`.
 */
import { studySchema } from "../schemas/study";
import { evaluateStudy, type StudyResult } from "../study/evaluate";
import { studyResultToCsv, type CsvTable as StudyCsvTable } from "../study/csv";
import { defineCommand } from "./command";
import { validate, type ParsedOptions } from "./io";
import { readCsv } from "../formats/csv";

const tableOf = (o: ParsedOptions) => (typeof o.table === "string" ? o.table : "scenarios") as StudyCsvTable;

export const evaluateCommand = defineCommand({
  compute(input): StudyResult {
    return evaluateStudy(validate(studySchema, input));
  },
  singleCsv(result: StudyResult, o) {
    return studyResultToCsv(result, tableOf(o));
  },
  csv(result: StudyResult, o) {
    // The study's own CSV tables (lib/study/csv.ts) are the one definition of these columns; read
    // back, they become rows of the batch table.
    const [header, ...rows] = readCsv(studyResultToCsv(result, tableOf(o)));
    return { header, rows };
  },
});
