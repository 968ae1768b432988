/**
 * Pages of a list: `offset` and `limit` from an address's query, bounded before they reach the
 * database, and what an answer says about the page it holds. API lists answer at most
 * `API_PAGE_MAX` items a request (default that many); the list pages show `UI_PAGE_SIZE` a page.
 */
import { ok, problem, type Result } from "./result";

export interface Page {
  offset: number;
  limit: number;
}

export const API_PAGE_MAX = 1000;
export const UI_PAGE_SIZE = 200;
/** Beyond this an offset is no page of any library Stoke is meant for. */
const MAX_OFFSET = 10_000_000;

/** Reads `limit` and `offset` (whole numbers) from a query; missing ones take the defaults. */
export function pageFromQuery(params: URLSearchParams, defaultLimit = API_PAGE_MAX, maxLimit = API_PAGE_MAX): Result<Page> {
  const errs: Record<string, string> = {};
  const read = (key: string, fallback: number, min: number, max: number): number => {
    const text = params.get(key);
    if (text === null || text.trim() === "") return fallback;
    if (!/^\d{1,9}$/.test(text.trim()) || Number(text) < min || Number(text) > max) {
      errs[key] = `must be a whole number from ${min} to ${max}`;
      return fallback;
    }
    return Number(text);
  };
  const limit = read("limit", defaultLimit, 1, maxLimit);
  const offset = read("offset", 0, 0, MAX_OFFSET);
  if (Object.keys(errs).length) return problem("invalid", "The page asked for is out of range.", errs);
  return ok({ offset, limit });
}

/** What an answer says about its page: where it starts, its size, the total, the next page's address (null on the last). */
export function pageInfo(page: Page, total: number, requestUrl: string) {
  const nextOffset = page.offset + page.limit;
  let next: string | null = null;
  if (nextOffset < total) {
    const u = new URL(requestUrl);
    u.searchParams.set("offset", String(nextOffset));
    u.searchParams.set("limit", String(page.limit));
    next = `${u.pathname}${u.search}`;
  }
  return { offset: page.offset, limit: page.limit, total, next };
}

/** The UI page number (1-based, from `?page=`) as an offset and limit; out-of-range numbers give page 1. */
export function uiPage(pageParam: string | string[] | undefined): Page & { number: number } {
  const n = typeof pageParam === "string" && /^\d{1,6}$/.test(pageParam) && Number(pageParam) >= 1 ? Number(pageParam) : 1;
  return { number: n, offset: (n - 1) * UI_PAGE_SIZE, limit: UI_PAGE_SIZE };
}
