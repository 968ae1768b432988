import { describe, expect, it } from "vitest";
import { neutraliseCell, readCsv, writeCsv } from "../../lib/csv";

describe("CSV writer and reader", () => {
  // RFC 4180 (2005), section 2, rules 5–7: fields holding commas, double quotes or line breaks are
  // enclosed in double quotes, and a double quote inside is written twice; records end with CRLF.
  it("quotes fields as RFC 4180 section 2 prescribes", () => {
    expect(writeCsv(["name", "note"], [["Gas, pipeline", 'the "H" group'], ["two\r\nlines", 3.5]])).toBe(
      'name,note\r\n"Gas, pipeline","the ""H"" group"\r\n"two\r\nlines",3.5\r\n',
    );
  });

  // OWASP "CSV Injection" guidance (common practice, no published standard): cells beginning with
  // =, +, -, @, tab or carriage return are prefixed so a spreadsheet shows them as text.
  it("neutralises text a spreadsheet would run as a formula, not numbers", () => {
    expect(neutraliseCell("=HYPERLINK(1)")).toBe("'=HYPERLINK(1)");
    expect(neutraliseCell("+1")).toBe("'+1");
    expect(neutraliseCell("-2")).toBe("'-2");
    expect(neutraliseCell("@SUM(A1)")).toBe("'@SUM(A1)");
    expect(neutraliseCell(-2)).toBe(-2);
    expect(writeCsv(["n"], [["=1+2"], [-4]])).toBe("n\r\n'=1+2\r\n-4\r\n");
  });

  it("writes figures that do not exist as empty cells", () => {
    expect(writeCsv(["a", "b", "c"], [[null, Number.NaN, undefined]])).toBe("a,b,c\r\n,,\r\n");
  });

  it("reads back what it writes, and names the line of a malformed record", () => {
    const text = writeCsv(["name", "share"], [["Biogas, raw", "0.6"], ['say "hi"', "0.4"]]);
    expect(readCsv(text)).toEqual([
      { name: "Biogas, raw", share: "0.6" },
      { name: 'say "hi"', share: "0.4" },
    ]);
    expect(() => readCsv('name,share\n"open quote,1\n')).toThrow(expect.objectContaining({ kind: "input" }));
    expect(() => readCsv("name,share\na,1,2\n")).toThrow(/line 2/);
  });
});
