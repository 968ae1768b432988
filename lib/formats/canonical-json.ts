/**
 * Canonical JSON: object keys sorted (by UTF-16 code unit), no whitespace, `undefined` members
 * left out, numbers as JavaScript writes them. Two equal documents give the same text, so its
 * SHA-256 identifies the content (a study revision's hash).
 */
export function canonicalJson(value: unknown): string {
  return JSON.stringify(sortKeys(value));
}

function sortKeys(v: unknown): unknown {
  if (Array.isArray(v)) return v.map((x) => (x === undefined ? null : sortKeys(x)));
  if (v && typeof v === "object" && !(v instanceof Date)) {
    const out: Record<string, unknown> = {};
    for (const k of Object.keys(v).sort()) {
      const x = (v as Record<string, unknown>)[k];
      if (x !== undefined) out[k] = sortKeys(x);
    }
    return out;
  }
  return v;
}

/** A structural difference between two JSON documents: the dotted path and both values. */
export interface JsonDifference {
  path: string;
  before: unknown;
  after: unknown;
}

/** Differences between two JSON values, leaves first found first; at most `limit`. */
export function jsonDifferences(before: unknown, after: unknown, limit = 100): JsonDifference[] {
  const out: JsonDifference[] = [];
  const walk = (a: unknown, b: unknown, path: string[]) => {
    if (out.length >= limit) return;
    const isObj = (x: unknown): x is Record<string, unknown> => !!x && typeof x === "object" && !Array.isArray(x);
    if (Array.isArray(a) && Array.isArray(b)) {
      for (let i = 0; i < Math.max(a.length, b.length); i++) walk(a[i], b[i], [...path, String(i)]);
      return;
    }
    if (isObj(a) && isObj(b)) {
      for (const k of [...new Set([...Object.keys(a), ...Object.keys(b)])].sort()) walk(a[k], b[k], [...path, k]);
      return;
    }
    if (canonicalJson(a ?? null) !== canonicalJson(b ?? null)) out.push({ path: path.join("."), before: a ?? null, after: b ?? null });
  };
  walk(before, after, []);
  return out;
}
