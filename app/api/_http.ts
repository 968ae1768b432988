/**
 * Small helpers shared by the route handlers: JSON bodies, ids, and the one place where what went
 * wrong becomes an HTTP status.
 *
 * - A service's problem kind: invalid 400, not-found 404, conflict 409, unprocessable 422.
 * - A lib/ error thrown through a route (`withErrors`): input 400, infeasible 422, not-converged 422,
 *   answered as `{ error, fieldErrors: { [field]: detail } }`. Anything else is a bug: Next answers 500.
 */
import type { ErrorKind, StokeError } from "@/lib/errors";
import { asStokeError, explain, type Problem, type ProblemKind } from "@/lib/services/result";
import { MAX_JSON_DEPTH, tooDeepAt } from "@/lib/formats/json-depth";

export const STATUS_OF_PROBLEM: Record<ProblemKind, number> = { invalid: 400, "not-found": 404, conflict: 409, unprocessable: 422 };
export const STATUS_OF_ERROR: Record<ErrorKind, number> = { input: 400, infeasible: 422, "not-converged": 422 };

export function json(body: unknown, status = 200): Response {
  return Response.json(body, { status, headers: { "cache-control": "no-store" } });
}

/** A service's problem with its status, the message and the per-field messages. */
export function failure(p: Problem): Response {
  return json({ error: p.message, fieldErrors: p.fieldErrors, ...(p.warnings ? { warnings: p.warnings } : {}) }, STATUS_OF_PROBLEM[p.kind]);
}

/** A lib/ error with its status; the field it names carries the detail. */
export function errorResponse(e: StokeError): Response {
  const detail = explain(e);
  return json({ error: e.field ? `${e.field}: ${detail}` : detail, fieldErrors: { [e.field || "_"]: detail } }, STATUS_OF_ERROR[e.kind]);
}

/** The handler, with the errors lib/ throws on purpose answered by their status; a bug propagates. */
export function withErrors<A extends unknown[]>(handler: (...args: A) => Promise<Response>): (...args: A) => Promise<Response> {
  return async (...args: A) => {
    try {
      return await handler(...args);
    } catch (e) {
      const se = asStokeError(e);
      if (se) return errorResponse(se);
      throw e;
    }
  };
}

export function notFound(what: string): Response {
  return json({ error: `${what} not found.`, fieldErrors: {} }, 404);
}

/** Parses a positive integer id from a route segment; null when it is not one. */
export function parseId(segment: string): number | null {
  return /^[1-9]\d{0,15}$/.test(segment) ? Number(segment) : null;
}

/** The request body as JSON: 400 when it is not JSON, or nests deeper than any document needs (the field named). */
export async function readJson(req: Request): Promise<{ ok: true; value: unknown } | { ok: false; response: Response }> {
  let value: unknown;
  try {
    value = await req.json();
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
