import { db } from "@/lib/db/client";
import { createStudy, listStudies } from "@/lib/services/studies";
import { failure, json, readJson, withErrors } from "../_http";

export const dynamic = "force-dynamic";

/** GET /api/studies[?plant=id]: the studies, with their plant and scenario count. */
export const GET = withErrors(async (req: Request): Promise<Response> => {
  const p = new URL(req.url).searchParams.get("plant");
  const plantId = p && /^\d{1,9}$/.test(p) ? Number(p) : undefined;
  const studies = await listStudies(db(), { plantId });
  return json({ studies: studies.map((s) => ({ ...s, url: `/studies/${s.id}` })) });
});

/** POST /api/studies: creates a study with its baseline and candidates. 400 with field errors; 409 on a duplicate name for the plant. */
export const POST = withErrors(async (req: Request): Promise<Response> => {
  const body = await readJson(req);
  if (!body.ok) return body.response;
  const r = await createStudy(db(), body.value);
  if (!r.ok) return failure(r);
  return json({ id: r.value.id, name: r.value.name, url: `/studies/${r.value.id}` }, 201);
});
