/**
 * Nesting depth of parsed JSON, measured without recursion, so that a document nested thousands of
 * levels deep is refused with its place named instead of overflowing the stack of a recursive
 * validator later.
 */

/** Far deeper than any fuel, plant or study document needs (a blend level takes three). */
export const MAX_JSON_DEPTH = 64;

/** Where a value first nests deeper than `maxDepth` objects/arrays (dotted path), or null. */
export function tooDeepAt(value: unknown, maxDepth: number = MAX_JSON_DEPTH): string | null {
  const stack: { v: unknown; path: string[] }[] = [{ v: value, path: [] }];
  for (let top = stack.pop(); top; top = stack.pop()) {
    const { v, path } = top;
    if (typeof v !== "object" || v === null) continue;
    if (path.length >= maxDepth) return path.join(".");
    for (const [k, child] of Object.entries(v)) stack.push({ v: child, path: [...path, k] });
  }
  return null;
}
