import { db } from "@/lib/db/client";
import { countPlants, createPlant, listPlants, plantJson } from "@/lib/services/plants";
import { pageFromQuery, pageInfo } from "@/lib/services/paging";
import { failure, json, readJson, withErrors } from "../_http";

export const dynamic = "force-dynamic";

/** GET /api/plants[?limit=N&offset=M]: the plants by name with their limits and studies, at most 1,000 a request. */
export const GET = withErrors(async (req: Request): Promise<Response> => {
  const page = pageFromQuery(new URL(req.url).searchParams);
  if (!page.ok) return failure(page);
  const [plants, total] = await Promise.all([listPlants(db(), page.value), countPlants(db())]);
  return json({ page: pageInfo(page.value, total, req.url), plants: plants.map((p) => ({ ...plantJson(p), studies: p.studies })) });
});

/** POST /api/plants: creates a plant. 400 with field errors; 409 on a duplicate name. */
export const POST = withErrors(async (req: Request): Promise<Response> => {
  const body = await readJson(req);
  if (!body.ok) return body.response;
  const r = await createPlant(db(), body.value);
  if (!r.ok) return failure(r);
  return json({ id: r.value.id, name: r.value.name, url: `/plants/${r.value.id}` }, 201);
});
