/**
 * Stoke's one CSV reader and writer (RFC 4180 through csv-parse and csv-stringify): comma-separated,
 * CRLF line ends, fields quoted where they need it. Cells a spreadsheet would read as a formula
 * (text beginning with =, +, -, @, a tab or a carriage return) are written with a leading apostrophe,
 * so opening an export never runs anything; numbers are written as numbers.
 */
import { parse } from "csv-parse/sync";
import { stringify } from "csv-stringify/sync";
import { InputError } from "./errors";

export type CsvCell = string | number | boolean | null | undefined;

const FORMULA_START = /^[=+\-@\t\r]/;

/** A text cell made safe for spreadsheets; numbers, booleans and empty cells pass unchanged. */
export function neutraliseCell(v: CsvCell): CsvCell {
  return typeof v === "string" && FORMULA_START.test(v) ? `'${v}` : v;
}

/** Writes a header and rows; null, undefined and non-finite numbers become empty cells. */
export function writeCsv(header: readonly string[], rows: readonly (readonly CsvCell[])[]): string {
  const clean = (r: readonly CsvCell[]) => r.map((v) => (typeof v === "number" && !Number.isFinite(v) ? null : neutraliseCell(v)));
  return stringify([clean(header), ...rows.map(clean)], { record_delimiter: "\r\n", cast: { boolean: (b) => (b ? "true" : "false") } });
}

/**
 * Reads CSV text with a header line into records keyed by column name (values as text, trimmed of a
 * byte-order mark). A malformed file is an InputError naming the line.
 */
export function readCsv(text: string): Record<string, string>[] {
  try {
    return parse(text, { columns: true, bom: true, skip_empty_lines: true, relax_column_count: false, trim: false }) as Record<string, string>[];
  } catch (e) {
    const line = (e as { lines?: number }).lines;
    const reason = e instanceof Error ? e.message.replace(/^Invalid [A-Za-z ]+: /, "") : String(e);
    throw new InputError(line ? `line ${line}` : "csv", reason);
  }
}
