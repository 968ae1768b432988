import { db } from "@/lib/db/client";
import { correctPriceQuote, deletePriceQuote } from "@/lib/services/fuels";
import { failure, json, notFound, parseId, readJson, withErrors } from "../../../../_http";

export const dynamic = "force-dynamic";

type Ctx = { params: Promise<{ id: string; priceId: string }> };

/**
 * PUT /api/fuels/{id}/prices/{priceId}: corrects a quote by adding a new version that supersedes
 * it (201 with the new id); the old one stays on record. `"confirmImplausible": true` stores a
 * price outside the plausible range.
 */
export const PUT = withErrors(async (req: Request, ctx: Ctx): Promise<Response> => {
  const p = await ctx.params;
  const id = parseId(p.id);
  const priceId = parseId(p.priceId);
  if (id === null || priceId === null) return notFound("Price quote");
  const body = await readJson(req);
  if (!body.ok) return body.response;
  const r = await correctPriceQuote(db(), id, priceId, body.value);
  if (!r.ok) return failure(r);
  return json({ id: r.value.id, fuelId: id, supersedes: priceId, warnings: r.value.warnings }, 201);
});

/** DELETE /api/fuels/{id}/prices/{priceId}: only a quote nothing relies on (409 naming what does). */
export const DELETE = withErrors(async (_req: Request, ctx: Ctx): Promise<Response> => {
  const p = await ctx.params;
  const id = parseId(p.id);
  const priceId = parseId(p.priceId);
  if (id === null || priceId === null) return notFound("Price quote");
  const r = await deletePriceQuote(db(), id, priceId);
  if (!r.ok) return failure(r);
  return json({ deleted: r.value.id });
});
