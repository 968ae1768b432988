/**
 * CSV output of the command line, written by Stoke's one CSV writer (lib/formats/csv.ts: RFC 4180
 * through csv-stringify, formula-like text neutralised). Numbers go out to six significant digits, an unknown
 * figure as an empty cell (never 0).
 */
import { writeCsv } from "../formats/csv";
import type { CsvTable } from "./command";

const NUMBER = /^-?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i;

/** One cell: numbers (also numbers read back from another table's text) to 6 significant digits. */
export function csvCell(v: unknown): string {
  if (v === null || v === undefined || v === "") return "";
  if (typeof v === "number") return Number.isFinite(v) ? String(Number(v.toPrecision(6))) : "";
  if (typeof v === "boolean") return v ? "true" : "false";
  const s = String(v);
  return NUMBER.test(s) ? String(Number(Number(s).toPrecision(6))) : s;
}

/** Writes a table; every row is padded or cut to the header's width. */
export function toCsv(table: CsvTable): string {
  const width = table.header.length;
  return writeCsv([table.header.map(csvCell), ...table.rows.map((r) => Array.from({ length: width }, (_, i) => csvCell(r[i])))]);
}

/**
 * Collects the rows of many inputs into one table: the leading columns name the input and its
 * error; result columns are the union of the inputs' headers in first-seen order (inputs of
 * different currencies, say, fill different columns), empty where an input has no such column.
 */
export class CsvCollector {
  private readonly columns = new Map<string, number>();
  private readonly rows: unknown[][] = [];
  constructor(private readonly lead: readonly string[]) {}

  add(lead: readonly unknown[], table?: CsvTable): void {
    if (!table) {
      this.rows.push([...lead]);
      return;
    }
    const at = table.header.map((h) => {
      const known = this.columns.get(h);
      if (known !== undefined) return known;
      const i = this.columns.size;
      this.columns.set(h, i);
      return i;
    });
    for (const r of table.rows) {
      const row: unknown[] = [...lead];
      for (let j = 0; j < r.length; j++) row[this.lead.length + at[j]] = r[j];
      this.rows.push(row);
    }
  }

  toCsv(): string {
    return toCsv({ header: [...this.lead, ...this.columns.keys()], rows: this.rows });
  }
}
