import { db } from "@/lib/db/client";
import { deletePlant, getPlant, plantJson, updatePlant } from "@/lib/services/plants";
import { failure, json, notFound, parseId, readJson, withErrors } from "../../_http";

export const dynamic = "force-dynamic";

type Ctx = { params: Promise<{ id: string }> };

export const GET = withErrors(async (_req: Request, { params }: Ctx): Promise<Response> => {
  const id = parseId((await params).id);
  const p = id === null ? null : await getPlant(db(), id);
  if (!p) return notFound("Plant");
  return json({ ...plantJson(p), studies: p.studies });
});

/** PUT /api/plants/{id}: replaces the plant's data. 400 / 404 / 409. */
export const PUT = withErrors(async (req: Request, { params }: Ctx): Promise<Response> => {
  const id = parseId((await params).id);
  if (id === null) return notFound("Plant");
  const body = await readJson(req);
  if (!body.ok) return body.response;
  const r = await updatePlant(db(), id, body.value);
  if (!r.ok) return failure(r);
  return json({ id: r.value.id, name: r.value.name, url: `/plants/${r.value.id}` });
});

/** DELETE /api/plants/{id}: 409 while studies use the plant. */
export const DELETE = withErrors(async (_req: Request, { params }: Ctx): Promise<Response> => {
  const id = parseId((await params).id);
  if (id === null) return notFound("Plant");
  const r = await deletePlant(db(), id);
  if (!r.ok) return failure(r);
  return json({ deleted: r.value.id });
});
