/** Small helpers shared by the route handlers: JSON bodies, ids and error answers. */
import type { Failure } from "@/lib/db/fuels";

export function json(body: unknown, status = 200): Response {
  return Response.json(body, { status, headers: { "cache-control": "no-store" } });
}

/** 400 / 404 / 409 with the message and the per-field messages. */
export function failure(f: Failure): Response {
  return json({ error: f.message, fieldErrors: f.fieldErrors }, f.status);
}

export function notFound(what: string): Response {
  return json({ error: `${what} not found.`, fieldErrors: {} }, 404);
}

/** Parses a positive integer id from a route segment; null when it is not one. */
export function parseId(segment: string): number | null {
  return /^[1-9]\d{0,15}$/.test(segment) ? Number(segment) : null;
}

export async function readJson(req: Request): Promise<{ ok: true; value: unknown } | { ok: false; response: Response }> {
  try {
    return { ok: true, value: await req.json() };
  } catch {
    return { ok: false, response: json({ error: "The request body must be JSON.", fieldErrors: {} }, 400) };
  }
}
