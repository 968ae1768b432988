import { describe, expect, it } from "vitest";
import { capacityToKW, decimalSeparatorOf, parseNumberEntry } from "../../../lib/units/number-entry";

const value = (text: string, sep: "." | "," = ".") => {
  const r = parseNumberEntry(text, sep);
  return r.ok ? r.value : r.reason;
};

describe("numbers as people type them", () => {
  // Decimal and grouping symbols of the Unicode CLDR number data (en: "." and ","; de: "," and ".";
  // fr: "," and a narrow no-break space; de-CH: "." and "’") — common practice, no single source.
  it("reads the locale's own separators", () => {
    expect(value("8,500")).toBe(8500);
    expect(value("8.500", ",")).toBe(8500);
    expect(value("0,92", ",")).toBe(0.92);
    expect(value("1\u202f234,5", ",")).toBe(1234.5);
    expect(value("1’234.5")).toBe(1234.5);
    expect(value("5 000")).toBe(5000);
  });

  it("reads an unambiguous text the one possible way, whatever the setting", () => {
    expect(value("0,92")).toBe(0.92); // a comma before two digits cannot group thousands
    expect(value("1.234,56")).toBe(1234.56);
    expect(value("1,234.56", ",")).toBe(1234.56);
    expect(value("1,234,567")).toBe(1234567);
    expect(value("\u22125.5")).toBe(-5.5);
    expect(value("2.5e3")).toBe(2500);
  });

  it("follows the setting where a text could be read two ways", () => {
    expect(value("5,000", ".")).toBe(5000);
    expect(value("5,000", ",")).toBe(5);
  });

  it("refuses what is not a number, saying so", () => {
    for (const t of ["", "abc", "1,23,4", "1.2.3,4,5", "12 34,5.6", "--1"]) expect(typeof value(t)).toBe("string");
  });

  it("knows the decimal separator of a locale from the platform's data", () => {
    expect(decimalSeparatorOf("de-DE")).toBe(",");
    expect(decimalSeparatorOf("en-GB")).toBe(".");
  });

  // 1 Btu (International Table) = 1055.05585262 J (NIST SP 811, 2008 ed., appendix B.8), so
  // 1 MMBtu/h = 1055.05585262e6 J / 3600 s = 293.0711 kW.
  it("converts heat-input capacities to kW", () => {
    expect(capacityToKW(1, "MMBtu/h")).toBeCloseTo(293.0711, 3);
    expect(capacityToKW(8.5, "MW")).toBe(8500);
  });
});
