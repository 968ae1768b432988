/**
 * Whole responses kept in memory, so that a page or list asked for again with nothing changed is
 * answered without rendering it again (the server in app/_server/serve.ts uses it in front of Next).
 *
 * A response is stored under a key made of everything it can depend on:
 * - the request: method, path and query, Host, and the headers Next varies its answers by (RSC
 *   navigation headers, Accept-Encoding), and every cookie but the session's;
 * - who asks: the account and its role as the one access check decided it (personal mode: the
 *   local user) — the check itself runs on every request, hit or not;
 * - the data: `DataRevision.n`, which database triggers raise at every committed change to any
 *   table (migration 20261202121000_data_revision). It is read before the response is made, so a
 *   change that commits while a response is being made moves the counter past the key it is
 *   stored under, and it is never served;
 * - state kept only in this process's memory that pages show (the background flame job);
 * - the calendar day (quotes are chosen by the day).
 *
 * Only answers 200 of type HTML or JSON with no Set-Cookie are stored. The cache holds at most
 * `STOKE_RESPONSE_CACHE_MB` (default 64) MB, least recently used first out. Requests for the same
 * key that arrive while it is being made wait for that one answer instead of making it again.
 */
import { createHash } from "node:crypto";
import type { Db } from "../db/client";
import { readDataRevision } from "../db/data-revision-rows";
import { flameJobStatus } from "./flames";

export interface StoredResponse {
  status: number;
  headers: Record<string, string | string[]>;
  body: Buffer;
}

/** Request headers whose value changes what Next answers (its own `Vary`, and compression). */
export const VARYING_HEADERS = [
  "host",
  "accept-encoding",
  "rsc",
  "next-router-state-tree",
  "next-router-prefetch",
  "next-router-segment-prefetch",
  "next-url",
] as const;

/** Response headers not replayed from the cache (they belong to one connection or are recomputed). */
const HOP_HEADERS = new Set(["connection", "keep-alive", "transfer-encoding", "date", "content-length", "x-stoke-cache"]);

/**
 * Whether a GET of `pathname` may be answered from the cache. Pages may, but the sign-in page;
 * of the API, the reads whose answer is made from the database alone. Exports (a time stamp,
 * streamed), uncertainty jobs (progress kept in one module's memory), sessions, accounts and
 * tokens never are.
 */
export function cacheablePath(pathname: string): boolean {
  if (pathname.startsWith("/_next/") || pathname === "/favicon.ico") return false;
  if (!pathname.startsWith("/api/")) return !(pathname === "/sign-in" || pathname.startsWith("/sign-in/"));
  return CACHEABLE_API.some((re) => re.test(pathname));
}

const CACHEABLE_API = [
  /^\/api\/fuels\/?$/,
  /^\/api\/fuels\/\d+\/?$/,
  /^\/api\/fuels\/\d+\/prices\/?$/,
  /^\/api\/plants\/?$/,
  /^\/api\/plants\/\d+\/?$/,
  /^\/api\/studies\/?$/,
  /^\/api\/studies\/\d+\/?$/,
  /^\/api\/studies\/\d+\/results\/?$/,
  /^\/api\/studies\/\d+\/flames\/?$/,
  /^\/api\/studies\/\d+\/revisions(\/\d+)?\/?$/,
  /^\/api\/studies\/\d+\/uncertainty\/runs(\/\d+)?\/?$/,
  /^\/api\/exchange-rates\/?$/,
  /^\/api\/history\/[a-z]+\/\d+\/?$/,
];

/** The cookies of a Cookie header but `omit`, sorted by name, as one string. */
export function cookiesBut(header: string | undefined, omit: string): string {
  if (!header) return "";
  return header
    .split(";")
    .map((c) => c.trim())
    .filter((c) => c && !c.startsWith(`${omit}=`))
    .sort()
    .join("; ");
}

export interface KeyParts {
  method: string;
  url: string;
  headers: Record<string, string | string[] | undefined>;
  cookies: string;
  /** Who the access check decided the request comes from. */
  actor: { name: string; accountId: number | null; role: string };
  dataRevision: number;
}

/** The state kept in this process's memory that pages show, as text for the key. */
export function volatileState(): string {
  const f = flameJobStatus();
  return `${f.running}:${f.done}/${f.inJob}+${f.queued}:${f.enabled}:${f.problem ?? ""}`;
}

/** The calendar day (UTC, as the services choose quotes by it). */
export const cacheDay = (now = new Date()) => now.toISOString().slice(0, 10);

/** SHA-256 (hex) of everything a response can depend on. */
export function responseKey(p: KeyParts, volatile = volatileState(), day = cacheDay()): string {
  const h = createHash("sha256");
  h.update(`${p.method}\n${p.url}\n`);
  for (const name of VARYING_HEADERS) {
    const v = p.headers[name];
    h.update(`${name}:${Array.isArray(v) ? v.join(",") : (v ?? "")}\n`);
  }
  h.update(`cookie:${p.cookies}\nactor:${p.actor.accountId ?? "-"}:${p.actor.role}:${p.actor.name}\n`);
  h.update(`rev:${p.dataRevision}\nmem:${volatile}\nday:${day}`);
  return h.digest("hex");
}

/** Whether a finished response may be stored, from its status and headers. */
export function storable(status: number, headers: Record<string, unknown>): boolean {
  if (status !== 200 || headers["set-cookie"] !== undefined) return false;
  const type = String(headers["content-type"] ?? "");
  return type.startsWith("text/html") || type.startsWith("application/json") || type.startsWith("text/x-component");
}

/** The headers to replay from a finished response's headers. */
export function replayHeaders(headers: Record<string, unknown>): Record<string, string | string[]> {
  const out: Record<string, string | string[]> = {};
  for (const [k, v] of Object.entries(headers)) {
    if (v === undefined || HOP_HEADERS.has(k)) continue;
    out[k] = Array.isArray(v) ? v.map(String) : String(v);
  }
  return out;
}

export const RESPONSE_CACHE_DEFAULT_MB = 64;

export function responseCacheBytes(env: string | undefined = process.env.STOKE_RESPONSE_CACHE_MB): number {
  const mb = env === undefined || env === "" ? RESPONSE_CACHE_DEFAULT_MB : Number(env);
  if (!Number.isFinite(mb) || mb < 0) throw new Error(`STOKE_RESPONSE_CACHE_MB must be a number of megabytes ≥ 0, not "${env}".`);
  return Math.round(mb * 1024 * 1024);
}

/** A least-recently-used store of responses bounded by their bodies' total size. */
export class ResponseCache {
  private readonly map = new Map<string, StoredResponse>();
  private readonly inflight = new Map<string, Promise<StoredResponse | null>>();
  private bytes = 0;
  hits = 0;
  misses = 0;
  constructor(readonly capacityBytes: number) {}

  get(key: string): StoredResponse | undefined {
    const v = this.map.get(key);
    if (v === undefined) return undefined;
    this.map.delete(key);
    this.map.set(key, v);
    return v;
  }

  set(key: string, v: StoredResponse): void {
    if (v.body.length > this.capacityBytes) return;
    const old = this.map.get(key);
    if (old) {
      this.bytes -= old.body.length;
      this.map.delete(key);
    }
    this.map.set(key, v);
    this.bytes += v.body.length;
    while (this.bytes > this.capacityBytes) {
      const [k, oldest] = this.map.entries().next().value as [string, StoredResponse];
      this.map.delete(k);
      this.bytes -= oldest.body.length;
    }
  }

  /** The response being made for `key` now, if one is. */
  pending(key: string): Promise<StoredResponse | null> | undefined {
    return this.inflight.get(key);
  }

  /** Makes the response for `key` once: `make` answers the stored form, or null when not storable. */
  async fill(key: string, make: () => Promise<StoredResponse | null>): Promise<StoredResponse | null> {
    const p = make();
    this.inflight.set(key, p);
    try {
      const r = await p;
      if (r) this.set(key, r);
      return r;
    } finally {
      this.inflight.delete(key);
    }
  }

  get size(): number {
    return this.map.size;
  }

  get sizeBytes(): number {
    return this.bytes;
  }
}

/** The data revision the key of a response made now would carry. */
export const currentDataRevision = (db: Db): Promise<number> => readDataRevision(db);
