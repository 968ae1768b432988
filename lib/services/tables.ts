/**
 * Rows of an import file (CSV with a header, or a JSON list of objects), each with the place a
 * person finds it: CSV rows are numbered as in the file (the header is row 1, the first data row
 * row 2; blank lines are not counted), JSON items from 1. Errors are keyed "row N, column" (CSV)
 * or "item N, field" (JSON), with the column named as in the header.
 */
import { readCsv } from "../formats/csv";
import { tooDeepAt } from "../formats/json-depth";
import { asStokeError, problem, type Problem } from "./result";

export type TableFormat = "csv" | "json";

export interface TableRow {
  /** "row 3" or "item 2" */
  where: string;
  values: Record<string, unknown>;
  /** Column names as written in the header (CSV) or the keys (JSON), by canonical field name. */
  columnOf: (field: string) => string;
}

/** Columns whose CSV cells are numbers (an empty cell is left out). */
export function readTable(
  text: string,
  format: TableFormat,
  numeric: readonly string[],
  known: readonly string[],
): { ok: true; rows: TableRow[] } | Problem {
  if (format === "json") {
    let raw: unknown;
    try {
      raw = JSON.parse(text);
    } catch (e) {
      if (!(e instanceof SyntaxError)) throw e;
      return problem("invalid", `The file is not JSON: ${e.message}`, { file: "not JSON" });
    }
    if (tooDeepAt(raw) !== null) return problem("invalid", "The file nests too deeply.", { file: "nested too deeply" });
    const list = Array.isArray(raw)
      ? raw
      : raw && typeof raw === "object" && Array.isArray((raw as { rows?: unknown }).rows)
        ? (raw as { rows: unknown[] }).rows
        : null;
    if (!list) return problem("invalid", 'The file must be a JSON list of objects (or { "rows": [...] }).', { file: "must be a list" });
    const rows: TableRow[] = [];
    for (const [i, item] of list.entries()) {
      if (!item || typeof item !== "object" || Array.isArray(item))
        return problem("invalid", `item ${i + 1} must be an object`, { [`item ${i + 1}`]: "must be an object" });
      rows.push({ where: `item ${i + 1}`, values: item as Record<string, unknown>, columnOf: (f) => f });
    }
    return { ok: true, rows };
  }
  let records: string[][];
  try {
    records = readCsv(text);
  } catch (e) {
    const se = asStokeError(e);
    if (se) return problem("invalid", `The CSV cannot be read: ${se.field}: ${se.message}`, { [se.field || "file"]: se.message });
    throw e;
  }
  if (!records.length) return problem("invalid", "The file is empty.", { file: "empty" });
  const header = records[0].map((h) => h.trim());
  const byLower = new Map(known.map((k) => [k.toLowerCase(), k]));
  const fieldOfColumn = header.map((h) => byLower.get(h.toLowerCase()) ?? null);
  const unknown = header.filter((h, i) => h && !fieldOfColumn[i]);
  if (unknown.length)
    return problem(
      "invalid",
      `Unknown column${unknown.length > 1 ? "s" : ""} ${unknown.map((u) => `"${u}"`).join(", ")}; the columns are ${known.join(", ")}.`,
      {
        "row 1": `unknown column ${unknown.map((u) => `"${u}"`).join(", ")}`,
      },
    );
  const columnOf = (f: string) => header[fieldOfColumn.indexOf(f)] ?? f;
  const rows: TableRow[] = records.slice(1).map((cells, i) => {
    const values: Record<string, unknown> = {};
    fieldOfColumn.forEach((f, j) => {
      if (!f) return;
      const cell = (cells[j] ?? "").trim();
      if (cell === "") return;
      values[f] = numeric.includes(f) && /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(cell) ? Number(cell) : cell;
    });
    return { where: `row ${i + 2}`, values, columnOf };
  });
  return { ok: true, rows };
}

/** A row's field errors keyed "row N, column" / "item N, field". */
export function rowErrors(row: TableRow, errs: Record<string, string>): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [k, v] of Object.entries(errs)) out[`${row.where}, ${row.columnOf(k.split(".")[0])}`] = v;
  return out;
}
