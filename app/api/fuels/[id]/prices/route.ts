import { db } from "@/lib/db/client";
import { addPriceQuote } from "@/lib/services/fuels";
import { fuelSheet } from "@/lib/services/fuel-views";
import { failure, json, notFound, parseId, readJson, withErrors } from "../../../_http";

export const dynamic = "force-dynamic";

type Ctx = { params: Promise<{ id: string }> };

/** GET /api/fuels/{id}/prices: the price history, newest first, each normalised. */
export const GET = withErrors(async (_req: Request, ctx: Ctx): Promise<Response> => {
  const id = parseId((await ctx.params).id);
  if (id === null) return notFound("Fuel");
  const sheet = await fuelSheet(db(), id, { flame: false });
  if (!sheet) return notFound("Fuel");
  return json({
    fuelId: id,
    name: sheet.fuel.name,
    prices: sheet.prices.map((p) => ({
      ...p.quote,
      unitLabel: p.unitLabel,
      inForce: p.current,
      supersededBy: p.supersededBy,
      withdrawn: p.withdrawn,
      delivered: p.normalised,
      error: p.error,
    })),
  });
});

/** POST /api/fuels/{id}/prices: adds a quote (history is kept). */
export const POST = withErrors(async (req: Request, ctx: Ctx): Promise<Response> => {
  const id = parseId((await ctx.params).id);
  if (id === null) return notFound("Fuel");
  const body = await readJson(req);
  if (!body.ok) return body.response;
  const r = await addPriceQuote(db(), id, body.value);
  if (!r.ok) return failure(r);
  return json({ id: r.value.id, fuelId: id, warnings: r.value.warnings }, 201);
});
