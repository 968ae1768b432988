import { db } from "@/lib/db/client";
import { issueRevision, listRevisions } from "@/lib/services/revisions";
import { failure, json, notFound, parseId, withErrors } from "../../../_http";

export const dynamic = "force-dynamic";

type Ctx = { params: Promise<{ id: string }> };

/** GET /api/studies/{id}/revisions: the issued revisions, newest first (number, hash, date). */
export const GET = withErrors(async (_req: Request, ctx: Ctx): Promise<Response> => {
  const id = parseId((await ctx.params).id);
  if (id === null) return notFound("Study");
  const r = await listRevisions(db(), id);
  if (!r.ok) return failure(r);
  return json({ studyId: id, revisions: r.value });
});

/** POST /api/studies/{id}/revisions: issues the next revision, 201 `{ revision, hash }`. */
export const POST = withErrors(async (_req: Request, ctx: Ctx): Promise<Response> => {
  const id = parseId((await ctx.params).id);
  if (id === null) return notFound("Study");
  const r = await issueRevision(db(), id);
  if (!r.ok) return failure(r);
  return json(r.value, 201);
});
