/**
 * Numbers as people type them: with their own decimal separator ("0,92" or "0.92"), thousands
 * separators ("5,000", "5.000", "5 000", "5’000"), a typographic minus, and heat-input capacities in
 * kW, MW or MMBtu/h. The decimal separator comes from the user's setting or browser locale; a text
 * whose reading is unambiguous (both separators present, or a comma that cannot be a thousands
 * separator) is read the one possible way whatever the setting.
 */
import { J_per_Btu } from "./energy";

export type DecimalSeparator = "." | ",";
export type NumberEntry = { ok: true; value: number } | { ok: false; reason: string };

/** Spaces of every width and apostrophes used between digit groups (CLDR grouping symbols). */
const GROUP_SPACES = /[\s\u00a0\u202f\u2009'’]/g;
const VALID_GROUPS = /^[-+]?\d{1,3}(?:X\d{3})+(?:D\d+)?(?:[eE][-+]?\d+)?$/;

function other(sep: DecimalSeparator): DecimalSeparator {
  return sep === "." ? "," : ".";
}

/** Is `t` digits grouped by `group` in threes (optionally followed by a `decimal` part)? */
function groupedBy(t: string, group: string, decimal: string): boolean {
  const shape = t.split(group).join("X").split(decimal).join("D");
  return VALID_GROUPS.test(shape);
}

/** Reads a number typed by a person; `decimal` is the separator their locale uses. */
export function parseNumberEntry(text: string, decimal: DecimalSeparator = "."): NumberEntry {
  let t = text.trim().replace(/\u2212/g, "-");
  if (t === "") return { ok: false, reason: "is empty" };
  const hadSpaces = GROUP_SPACES.test(t);
  t = t.replace(GROUP_SPACES, "");
  const hasPoint = t.includes(".");
  const hasComma = t.includes(",");
  let dec: DecimalSeparator | null = null;
  if (hasPoint && hasComma) {
    // Both present: the one that comes last is the decimal separator, the other groups thousands.
    dec = t.lastIndexOf(".") > t.lastIndexOf(",") ? "." : ",";
    if (!groupedBy(t, other(dec), dec))
      return { ok: false, reason: `is not a number (thousands separators must group three digits: "${text.trim()}")` };
  } else if (hasPoint || hasComma) {
    const sep: DecimalSeparator = hasPoint ? "." : ",";
    const count = t.split(sep).length - 1;
    if (count > 1) {
      // Repeated: only a thousands separator can repeat.
      if (!groupedBy(t, sep, "\u0000")) return { ok: false, reason: `is not a number ("${text.trim()}")` };
      dec = null;
    } else if (sep === decimal) {
      dec = sep;
    } else {
      // The locale's thousands separator: read so when it groups three digits, else it can only be a decimal separator.
      dec = groupedBy(t, sep, "\u0000") ? null : sep;
    }
  }
  let plain = t;
  if (dec === null) plain = plain.replace(/[.,]/g, "");
  else plain = plain.split(other(dec)).join("").replace(dec, ".");
  if (hadSpaces && dec === null && !/^[-+]?\d+$/.test(plain)) return { ok: false, reason: `is not a number ("${text.trim()}")` };
  if (!/^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(plain)) return { ok: false, reason: `is not a number ("${text.trim()}")` };
  const value = Number(plain);
  return Number.isFinite(value) ? { ok: true, value } : { ok: false, reason: `is not a finite number ("${text.trim()}")` };
}

/** The decimal separator of a BCP 47 locale (e.g. "de-DE" → ","), by the platform's Intl data. */
export function decimalSeparatorOf(locale: string | undefined): DecimalSeparator {
  try {
    const part = new Intl.NumberFormat(locale).formatToParts(1.5).find((p) => p.type === "decimal");
    return part?.value === "," ? "," : ".";
  } catch {
    return ".";
  }
}

/** Units a heat-input capacity may be entered in, with their factor to kW. */
export const CAPACITY_UNITS_KW = {
  kW: 1,
  MW: 1000,
  // 1 MMBtu/h = 10^6 Btu (International Table) per hour = J_per_Btu × 10^6 / 3600 W.
  "MMBtu/h": (J_per_Btu * 1e6) / 3600 / 1000,
} as const;
export type CapacityUnit = keyof typeof CAPACITY_UNITS_KW;

export function capacityToKW(value: number, unit: CapacityUnit): number {
  return value * CAPACITY_UNITS_KW[unit];
}
