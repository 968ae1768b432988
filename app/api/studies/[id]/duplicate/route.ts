import { db } from "@/lib/db/client";
import { duplicateStudy } from "@/lib/services/studies";
import { failure, json, notFound, parseId, readJson, withErrors } from "../../../_http";

export const dynamic = "force-dynamic";

/** POST /api/studies/{id}/duplicate [{ "name": "…" }]: copies the study and its scenarios. */
export const POST = withErrors(async (req: Request, { params }: { params: Promise<{ id: string }> }): Promise<Response> => {
  const id = parseId((await params).id);
  if (id === null) return notFound("Study");
  const body = await readJson(req);
  if (!body.ok) return body.response;
  const name =
    body.value && typeof body.value === "object" && typeof (body.value as { name?: unknown }).name === "string"
      ? (body.value as { name: string }).name
      : undefined;
  const r = await duplicateStudy(db(), id, name);
  if (!r.ok) return failure(r);
  return json({ id: r.value.id, name: r.value.name, url: `/studies/${r.value.id}` }, 201);
});
