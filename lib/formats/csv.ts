/**
 * Stoke's one CSV reader and writer (csv-parse and csv-stringify underneath).
 *
 * Writing follows RFC 4180: comma-separated, CRLF after every record, a field in double quotes
 * (quotes doubled) when it holds a comma, quote, CR or LF, or starts or ends with white space.
 * A cell that a spreadsheet would read as a formula (it starts with =, +, -, @, tab or CR and is
 * not a plain number) is written with a leading apostrophe, as OWASP's "CSV injection" advice
 * says; cells that already start with apostrophes before such a character get one more, so
 * that reading undoes exactly what writing did.
 *
 * Reading takes CRLF, LF or CR line ends and a leading byte-order mark, skips blank lines, removes
 * the apostrophe the writer added, and throws an InputError naming the line for malformed text.
 */
import { CsvError, parse } from "csv-parse/sync";
import { stringify } from "csv-stringify/sync";
import { InputError } from "../errors";

const FORMULA_START = /^[=+\-@\t\r]/;
const PLAIN_NUMBER = /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/;

/** Would a spreadsheet take this cell (after any leading apostrophes) for a formula? */
function formulaLike(cell: string): boolean {
  const rest = cell.replace(/^'+/, "");
  return FORMULA_START.test(rest) && !PLAIN_NUMBER.test(rest);
}

/** The cell as written: a leading apostrophe when a spreadsheet would read it as a formula. */
export function neutraliseFormula(cell: string): string {
  return formulaLike(cell) ? `'${cell}` : cell;
}

/** The inverse of `neutraliseFormula`. */
export function restoreFormula(cell: string): string {
  return cell.startsWith("'") && formulaLike(cell) ? cell.slice(1) : cell;
}

/** CSV text of the records (each a list of cells), CRLF after every record. */
export function writeCsv(records: readonly (readonly string[])[]): string {
  return stringify(
    records.map((r) => r.map(neutraliseFormula)),
    { record_delimiter: "windows", quoted_match: [/[\r\n]/, /^\s|\s$/] },
  );
}

/** Reads CSV text into records of cells. Throws InputError("line N", …) when the text is malformed. */
export function readCsv(text: string): string[][] {
  let records: string[][];
  try {
    records = parse(text, { bom: true, skip_empty_lines: true, relax_column_count: true, record_delimiter: ["\r\n", "\n", "\r"] });
  } catch (e) {
    if (e instanceof CsvError) {
      const line = typeof e.lines === "number" ? e.lines : 0;
      throw new InputError(line ? `line ${line}` : "file", e.message.replace(/ at line \d+/, ""));
    }
    throw e;
  }
  return records.map((r) => r.map(restoreFormula));
}
