import { db } from "@/lib/db/client";
import { deleteStudy, studyRecord, updateStudy } from "@/lib/services/studies";
import { failure, json, notFound, parseId, readJson, withErrors } from "../../_http";

export const dynamic = "force-dynamic";

type Ctx = { params: Promise<{ id: string }> };

/** GET /api/studies/{id}: the stored study (plant, assumptions, baseline, candidates with fuel and quote ids). */
export const GET = withErrors(async (_req: Request, { params }: Ctx): Promise<Response> => {
  const id = parseId((await params).id);
  const rec = id === null ? null : await studyRecord(db(), id);
  if (!rec) return notFound("Study");
  return json({ ...rec, url: `/studies/${rec.id}`, results: `/api/studies/${rec.id}/results` });
});

export const PUT = withErrors(async (req: Request, { params }: Ctx): Promise<Response> => {
  const id = parseId((await params).id);
  if (id === null) return notFound("Study");
  const body = await readJson(req);
  if (!body.ok) return body.response;
  const r = await updateStudy(db(), id, body.value);
  if (!r.ok) return failure(r);
  return json({ id: r.value.id, name: r.value.name, url: `/studies/${r.value.id}` });
});

export const DELETE = withErrors(async (_req: Request, { params }: Ctx): Promise<Response> => {
  const id = parseId((await params).id);
  if (id === null) return notFound("Study");
  const r = await deleteStudy(db(), id);
  if (!r.ok) return failure(r);
  return json({ deleted: r.value.id });
});
