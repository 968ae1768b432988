import { db } from "@/lib/db/client";
import { countStudies, createStudy, listStudies } from "@/lib/services/studies";
import { pageFromQuery, pageInfo } from "@/lib/services/paging";
import { failure, json, readJson, withErrors } from "../_http";

export const dynamic = "force-dynamic";

/** GET /api/studies[?plant=id][&limit=N&offset=M]: the studies by plant and name, with their plant and scenario count, at most 1,000 a request. */
export const GET = withErrors(async (req: Request): Promise<Response> => {
  const params = new URL(req.url).searchParams;
  const p = params.get("plant");
  const plantId = p && /^\d{1,9}$/.test(p) ? Number(p) : undefined;
  const page = pageFromQuery(params);
  if (!page.ok) return failure(page);
  const [studies, total] = await Promise.all([listStudies(db(), { plantId }, page.value), countStudies(db(), plantId)]);
  return json({ page: pageInfo(page.value, total, req.url), studies: studies.map((s) => ({ ...s, url: `/studies/${s.id}` })) });
});

/** POST /api/studies: creates a study with its baseline and candidates. 400 with field errors; 409 on a duplicate name for the plant. */
export const POST = withErrors(async (req: Request): Promise<Response> => {
  const body = await readJson(req);
  if (!body.ok) return body.response;
  const r = await createStudy(db(), body.value);
  if (!r.ok) return failure(r);
  return json({ id: r.value.id, name: r.value.name, url: `/studies/${r.value.id}` }, 201);
});
