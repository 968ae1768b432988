/**
 * CSV as RFC 4180 describes it: comma-separated, fields with a comma, quote or line break in
 * double quotes (quotes doubled), CRLF between records. The reader also takes LF line ends
 * and a leading byte-order mark.
 */

export function csvField(value: string): string {
  return /[",\r\n]/.test(value) || /^\s|\s$/.test(value) ? `"${value.replace(/"/g, '""')}"` : value;
}

export function toCsv(rows: string[][]): string {
  return rows.map((r) => r.map(csvField).join(",")).join("\r\n") + "\r\n";
}

export class CsvSyntaxError extends Error {
  constructor(
    public readonly line: number,
    message: string,
  ) {
    super(`CSV line ${line}: ${message}`);
    this.name = "CsvSyntaxError";
  }
}

/** Parses CSV text into records of fields. Blank lines are skipped. */
export function parseCsv(text: string): string[][] {
  const s = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const rows: string[][] = [];
  let row: string[] = [];
  let field = "";
  let i = 0;
  let line = 1;
  let quoted = false;
  let fieldStarted = false;
  const endField = () => {
    row.push(field);
    field = "";
    fieldStarted = false;
  };
  const endRow = () => {
    endField();
    if (!(row.length === 1 && row[0] === "")) rows.push(row);
    row = [];
  };
  while (i < s.length) {
    const c = s[i];
    if (quoted) {
      if (c === '"') {
        if (s[i + 1] === '"') {
          field += '"';
          i += 2;
          continue;
        }
        quoted = false;
        i++;
        const next = s[i];
        if (next !== undefined && next !== "," && next !== "\r" && next !== "\n") {
          throw new CsvSyntaxError(line, "text after a closing quote");
        }
        continue;
      }
      if (c === "\n") line++;
      field += c;
      i++;
      continue;
    }
    if (c === '"') {
      if (fieldStarted) throw new CsvSyntaxError(line, "a quote inside an unquoted field");
      quoted = true;
      fieldStarted = true;
      i++;
      continue;
    }
    if (c === ",") {
      endField();
      i++;
      continue;
    }
    if (c === "\r" || c === "\n") {
      endRow();
      i += c === "\r" && s[i + 1] === "\n" ? 2 : 1;
      line++;
      continue;
    }
    field += c;
    fieldStarted = true;
    i++;
  }
  if (quoted) throw new CsvSyntaxError(line, "a quoted field is not closed");
  if (field !== "" || row.length) endRow();
  return rows;
}
