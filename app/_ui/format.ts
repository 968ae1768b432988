/** Display formatting only (no unit conversions here: those live in lib/units). */

const cache = new Map<string, Intl.NumberFormat>();
function nf(min: number, max: number): Intl.NumberFormat {
  const key = `${min}:${max}`;
  let f = cache.get(key);
  if (!f) {
    f = new Intl.NumberFormat("en-GB", { minimumFractionDigits: min, maximumFractionDigits: max });
    cache.set(key, f);
  }
  return f;
}

/** Fixed decimals; "–" for missing values. */
export function fmt(value: number | null | undefined, decimals = 2): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "–";
  return nf(decimals, decimals).format(value);
}

/** Up to `decimals` decimals, trailing zeros dropped (for entered values such as quotes). */
export function fmtUpTo(value: number | null | undefined, decimals = 6): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "–";
  return nf(0, decimals).format(value);
}

/** A percentage from a fraction. */
export function pct(fraction: number | null | undefined, decimals = 1): string {
  if (fraction === null || fraction === undefined || !Number.isFinite(fraction)) return "–";
  return `${fmt(fraction * 100, decimals)} %`;
}

export function money(value: number | null | undefined, currency: string, decimals = 2): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "–";
  return `${fmt(value, decimals)} ${currency}`;
}

export const KIND_LABEL: Record<string, string> = { gas: "gas", liquid: "liquid", solid: "solid" };
