/**
 * Small helpers shared by the route handlers: JSON bodies, ids, and the one place where what went
 * wrong becomes an HTTP status.
 *
 * - A service's problem kind: invalid 400, not-found 404, conflict 409, unprocessable 422.
 * - A lib/ error thrown through a route (`withErrors`): input 400, infeasible 422, not-converged 422,
 *   answered as `{ error, fieldErrors: { [field]: detail } }`. Anything else is a bug: Next answers 500.
 * - The database locked by another connection beyond the busy timeout (or a PostgreSQL lock
 *   timeout, serialisation failure or deadlock): 503 "busy, try again" with Retry-After.
 */
import type { ErrorKind, StokeError } from "@/lib/errors";
import { isDatabaseBusy } from "@/lib/db/client";
import { asStokeError, explain, type Problem, type ProblemKind } from "@/lib/services/result";
import { MAX_JSON_DEPTH, tooDeepAt } from "@/lib/formats/json-depth";
import { actingAs } from "@/lib/services/actor";
import { decide, hostRefusal } from "../_auth/gate";

export const STATUS_OF_PROBLEM: Record<ProblemKind, number> = {
  invalid: 400,
  "not-found": 404,
  conflict: 409,
  unprocessable: 422,
  unauthorized: 401,
  throttled: 429,
};
export const STATUS_OF_ERROR: Record<ErrorKind, number> = { input: 400, infeasible: 422, "not-converged": 422 };

export function json(body: unknown, status = 200, headers: Record<string, string> = {}): Response {
  return Response.json(body, { status, headers: { "cache-control": "no-store", ...headers } });
}

/** Longest message an error answer carries: a message never echoes a huge input back in full. */
const MAX_MESSAGE_CHARS = 500;
const capped = (m: string) => (m.length > MAX_MESSAGE_CHARS ? `${m.slice(0, MAX_MESSAGE_CHARS)}… (cut)` : m);
const cappedFields = (f: Record<string, string>) =>
  Object.fromEntries(
    Object.entries(f)
      .slice(0, 100)
      .map(([k, v]) => [capped(k), capped(v)]),
  );

/** A service's problem with its status, the message and the per-field messages. */
export function failure(p: Problem): Response {
  return json(
    { error: capped(p.message), fieldErrors: cappedFields(p.fieldErrors), ...(p.warnings ? { warnings: p.warnings } : {}) },
    STATUS_OF_PROBLEM[p.kind],
    p.retryAfterS !== undefined ? { "retry-after": String(p.retryAfterS) } : {},
  );
}

/** A lib/ error with its status; the field it names carries the detail. */
export function errorResponse(e: StokeError): Response {
  const detail = explain(e);
  return json(
    { error: capped(e.field ? `${e.field}: ${detail}` : detail), fieldErrors: cappedFields({ [e.field || "_"]: detail }) },
    STATUS_OF_ERROR[e.kind],
  );
}

/** Body size limits: JSON documents (fuels, plants, studies) and import files. */
export const JSON_BODY_LIMIT_BYTES = 1024 * 1024;
export const IMPORT_BODY_LIMIT_BYTES = 16 * 1024 * 1024;

const WRITE_METHODS = new Set(["POST", "PUT", "PATCH", "DELETE"]);

/**
 * A write from another site is refused: browsers send the page's Origin with every cross-site
 * write, so a request whose Origin is not this server's own (by its Host) answers 403. Requests
 * without an Origin (the command line, scripts on this machine) pass.
 */
export function crossSiteWrite(req: Request): Response | null {
  if (!WRITE_METHODS.has(req.method)) return null;
  const origin = req.headers.get("origin");
  if (origin === null) return null;
  let originHost: string;
  try {
    originHost = new URL(origin).host;
  } catch {
    originHost = "";
  }
  const host = req.headers.get("host") ?? new URL(req.url).host;
  if (originHost === host) return null;
  return json(
    {
      error: "Writes are accepted only from Stoke's own pages (the request came from another site).",
      fieldErrors: { origin: "not this server" },
    },
    403,
  );
}

/** The body as text, refused (413) past `limitBytes` without reading further. */
export async function readBodyText(
  req: Request,
  limitBytes: number,
): Promise<{ ok: true; text: string } | { ok: false; response: Response }> {
  const tooLarge = () => ({
    ok: false as const,
    response: json(
      { error: `The request body is larger than ${Math.round(limitBytes / 1024)} KiB.`, fieldErrors: { _: "body too large" } },
      413,
    ),
  });
  const declared = Number(req.headers.get("content-length") ?? "NaN");
  if (Number.isFinite(declared) && declared > limitBytes) return tooLarge();
  if (!req.body) return { ok: true, text: "" };
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > limitBytes) {
      await reader.cancel();
      return tooLarge();
    }
    chunks.push(value);
  }
  return { ok: true, text: Buffer.concat(chunks).toString("utf8") };
}

/**
 * The handler, with the errors lib/ throws on purpose answered by their status; a bug propagates.
 * First, in this order: a Host not on the allowed list answers 421; in team mode a request without
 * a valid session or API token answers 401 and one whose account lacks the route's role 403 naming
 * it (`lib/services/access.ts`); a cross-site write answers 403 (a request with an API token is not
 * one a browser could forge, so it skips that check). The handler then runs as the actor, whom the
 * change log records.
 */
export function withErrors<A extends unknown[]>(handler: (...args: A) => Promise<Response>): (...args: A) => Promise<Response> {
  return async (...args: A) => {
    const req = args[0];
    if (!(req instanceof Request)) return run(handler, args);
    const host = hostRefusal(req);
    if (host) return json({ error: host.message, fieldErrors: { host: "not on the allowed list" } }, host.status);
    let d: Awaited<ReturnType<typeof decide>>;
    try {
      d = await decide(req, new URL(req.url).pathname);
    } catch (e) {
      if (isDatabaseBusy(e)) return busy();
      throw e;
    }
    if (!d.ok) {
      const body = { error: d.message, fieldErrors: { _: d.status === 401 ? "not signed in" : `needs the ${d.need} role` }, needs: d.need };
      return json(body, d.status, d.status === 401 ? { "www-authenticate": 'Bearer realm="stoke"' } : {});
    }
    if (d.actor.via !== "token") {
      const refused = crossSiteWrite(req);
      if (refused) return refused;
    }
    return actingAs(d.actor, () => run(handler, args));
  };
}

async function run<A extends unknown[]>(handler: (...args: A) => Promise<Response>, args: A): Promise<Response> {
  try {
    return await handler(...args);
  } catch (e) {
    const se = asStokeError(e);
    if (se) return errorResponse(se);
    if (isDatabaseBusy(e)) return busy();
    throw e;
  }
}

/** Seconds a client is asked to wait before it tries again after a 503. */
export const BUSY_RETRY_AFTER_S = 2;

/** 503: the database is held by another writer; nothing was changed and the request may be sent again. */
export function busy(): Response {
  return Response.json(
    {
      error: "The database is busy (another process is writing to it); nothing was changed. Try again in a moment.",
      fieldErrors: {},
    },
    { status: 503, headers: { "cache-control": "no-store", "retry-after": String(BUSY_RETRY_AFTER_S) } },
  );
}

export function notFound(what: string): Response {
  return json({ error: `${what} not found.`, fieldErrors: {} }, 404);
}

/** Parses a positive integer id from a route segment; null when it is not one. */
export function parseId(segment: string): number | null {
  return /^[1-9]\d{0,15}$/.test(segment) ? Number(segment) : null;
}

/**
 * The request body as JSON: 415 unless it is sent as application/json (so a plain form or text post
 * from another page cannot write), 413 past the size limit, 400 when it is not JSON or nests deeper
 * than any document needs (the field named).
 */
export async function readJson(
  req: Request,
  limitBytes = JSON_BODY_LIMIT_BYTES,
): Promise<{ ok: true; value: unknown } | { ok: false; response: Response }> {
  const type = (req.headers.get("content-type") ?? "").split(";")[0].trim().toLowerCase();
  if (type !== "application/json") {
    return {
      ok: false,
      response: json(
        { error: "Send the body as JSON (content-type: application/json).", fieldErrors: { "content-type": "must be application/json" } },
        415,
      ),
    };
  }
  const body = await readBodyText(req, limitBytes);
  if (!body.ok) return body;
  let value: unknown;
  try {
    value = JSON.parse(body.text);
  } catch (e) {
    if (!(e instanceof SyntaxError)) throw e;
    return { ok: false, response: json({ error: "The request body must be JSON.", fieldErrors: {} }, 400) };
  }
  const deep = tooDeepAt(value);
  if (deep !== null) {
    const field = deep.split(".")[0] || "_";
    const detail = `nested more than ${MAX_JSON_DEPTH} levels deep (at ${deep.length > 80 ? `${deep.slice(0, 80)}…` : deep})`;
    return { ok: false, response: json({ error: `${field}: ${detail}`, fieldErrors: { [field]: detail } }, 400) };
  }
  return { ok: true, value };
}
