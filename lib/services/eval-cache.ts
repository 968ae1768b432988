/**
 * Caches shared by every page and API call in this process.
 *
 * - `sharedCaches()`: the evaluation's own caches (fuel figures per fuel state, performance per
 *   operating point), reused across studies.
 * - `resultCache()`: evaluated studies, keyed by the SHA-256 of the canonical JSON of the complete,
 *   self-contained study object lib/ evaluates (plant, every fuel definition, every price as chosen
 *   and converted, the settings of the view) and the evaluation options. Whatever changes an input —
 *   a corrected or new quote, an edited fuel or component, the plant, an exchange rate, the day that
 *   picks a quote — changes that object and so the key: the old entry is simply never asked for again.
 * - `propertyCache()`: fuel property sheets, keyed by the hash of the effective definition and the
 *   reference temperatures.
 * - `parsedStudyCache()`: a stored study's assembled input as the study schema parses it, keyed by
 *   that input's hash (the result cache is keyed by the same hash and the options).
 *
 * Entries are the caller's to read, not to change. Each cache keeps the most recently used entries
 * up to its size.
 */
import { createHash } from "node:crypto";
import { canonicalJson } from "../formats/canonical-json";
import { createEvaluationCaches, type EvaluationCaches } from "../study/evaluate";

/** A least-recently-used map from content keys to values, at most `capacity` entries. */
export class ContentCache<V> {
  private readonly map = new Map<string, V>();
  hits = 0;
  misses = 0;
  constructor(readonly capacity: number) {}

  get(key: string): V | undefined {
    const v = this.map.get(key);
    if (v === undefined) {
      this.misses++;
      return undefined;
    }
    this.hits++;
    this.map.delete(key);
    this.map.set(key, v);
    return v;
  }

  set(key: string, value: V): void {
    this.map.delete(key);
    this.map.set(key, value);
    if (this.map.size > this.capacity) this.map.delete(this.map.keys().next().value as string);
  }

  /** The cached value of `key`, or `compute()` stored under it. */
  getOrCompute(key: string, compute: () => V): V {
    const hit = this.get(key);
    if (hit !== undefined) return hit;
    const v = compute();
    this.set(key, v);
    return v;
  }

  get size(): number {
    return this.map.size;
  }

  clear(): void {
    this.map.clear();
  }
}

/** SHA-256 (hex) of the canonical JSON of the parts: equal content, equal key. */
export function contentKey(...parts: unknown[]): string {
  return createHash("sha256").update(canonicalJson(parts)).digest("hex");
}

/** Evaluated studies kept per process (a 20-scenario result is a few hundred kB). */
export const RESULT_CACHE_ENTRIES = 200;
/** Fuel property sheets kept per process (a few kB each). */
export const PROPERTY_CACHE_ENTRIES = 20_000;

declare global {
  // One set of caches per process, kept across hot reloads in development.
  var __stokeStudyCaches: EvaluationCaches | undefined;
  var __stokeResultCache: ContentCache<unknown> | undefined;
  var __stokePropertyCache: ContentCache<unknown> | undefined;
  var __stokeParsedStudyCache: ContentCache<unknown> | undefined;
  var __stokeFlameKeysAsked: ContentCache<string[]> | undefined;
}

export function sharedCaches(): EvaluationCaches {
  let c = globalThis.__stokeStudyCaches;
  // Sweeps add about a hundred fuel states each; start afresh before the cache grows without bound.
  if (!c || c.fuels.size > 20000) c = globalThis.__stokeStudyCaches = createEvaluationCaches();
  return c;
}

export function resultCache<V>(): ContentCache<V> {
  globalThis.__stokeResultCache ??= new ContentCache<unknown>(RESULT_CACHE_ENTRIES);
  return globalThis.__stokeResultCache as ContentCache<V>;
}

/** Study inputs as the study schema parsed them, keyed by the input's content (parsing a 20-scenario study takes milliseconds). */
export function parsedStudyCache<V>(): ContentCache<V> {
  globalThis.__stokeParsedStudyCache ??= new ContentCache<unknown>(RESULT_CACHE_ENTRIES);
  return globalThis.__stokeParsedStudyCache as ContentCache<V>;
}

/**
 * The flame-solve keys an evaluation of a study input asked the look-up for, keyed like the result
 * (input and options): the result cache's key adds the outcome of each of these solves, so a solve
 * arriving for one study leaves every other study's cached result in place.
 */
export function flameKeysAsked(): ContentCache<string[]> {
  globalThis.__stokeFlameKeysAsked ??= new ContentCache<string[]>(RESULT_CACHE_ENTRIES);
  return globalThis.__stokeFlameKeysAsked;
}

export function propertyCache<V>(): ContentCache<V> {
  globalThis.__stokePropertyCache ??= new ContentCache<unknown>(PROPERTY_CACHE_ENTRIES);
  return globalThis.__stokePropertyCache as ContentCache<V>;
}
