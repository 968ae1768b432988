import { db } from "@/lib/db/client";
import { createPlant, listPlants, plantJson } from "@/lib/services/plants";
import { failure, json, readJson, withErrors } from "../_http";

export const dynamic = "force-dynamic";

/** GET /api/plants: every plant with its limits and the studies that use it. */
export const GET = withErrors(async (): Promise<Response> => {
  const plants = await listPlants(db());
  return json({ plants: plants.map((p) => ({ ...plantJson(p), studies: p.studies })) });
});

/** POST /api/plants: creates a plant. 400 with field errors; 409 on a duplicate name. */
export const POST = withErrors(async (req: Request): Promise<Response> => {
  const body = await readJson(req);
  if (!body.ok) return body.response;
  const r = await createPlant(db(), body.value);
  if (!r.ok) return failure(r);
  return json({ id: r.value.id, name: r.value.name, url: `/plants/${r.value.id}` }, 201);
});
