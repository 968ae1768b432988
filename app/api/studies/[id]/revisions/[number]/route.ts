import { db } from "@/lib/db/client";
import { getRevision } from "@/lib/services/revisions";
import { failure, json, notFound, parseId, withErrors } from "../../../../_http";

export const dynamic = "force-dynamic";

type Ctx = { params: Promise<{ id: string; number: string }> };

/**
 * GET /api/studies/{id}/revisions/{N}: the revision — its inputs (a study file), results, hash,
 * what the library supplied. `?part=inputs` answers the study file alone (for `stoke evaluate`).
 */
export const GET = withErrors(async (req: Request, ctx: Ctx): Promise<Response> => {
  const p = await ctx.params;
  const id = parseId(p.id);
  const n = parseId(p.number);
  if (id === null || n === null) return notFound("Revision");
  const r = await getRevision(db(), id, n);
  if (!r.ok) return failure(r);
  if (new URL(req.url).searchParams.get("part") === "inputs") return json(r.value.inputs);
  return json({ ...r.value, revision: r.value.number });
});

const immutable = async (): Promise<Response> =>
  json({ error: "An issued revision cannot be changed or deleted; issue a new revision instead.", fieldErrors: {} }, 405);

export const PUT = immutable;
export const PATCH = immutable;
export const DELETE = immutable;
