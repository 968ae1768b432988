import { db } from "@/lib/db/client";
import { deleteFuel, fuelJson, updateFuel } from "@/lib/services/fuels";
import { fuelSheet } from "@/lib/services/fuel-views";
import { failure, json, notFound, parseId, readJson, withErrors } from "../../_http";

export const dynamic = "force-dynamic";

type Ctx = { params: Promise<{ id: string }> };

/** GET /api/fuels/{id}: the fuel with its computed properties, flame temperatures, prices and cautions. */
export const GET = withErrors(async (_req: Request, ctx: Ctx): Promise<Response> => {
  const id = parseId((await ctx.params).id);
  if (id === null) return notFound("Fuel");
  const sheet = await fuelSheet(db(), id);
  if (!sheet) return notFound("Fuel");
  return json({
    ...fuelJson(sheet.fuel, sheet.components),
    usedInBlends: sheet.usedInBlends,
    properties: sheet.properties,
    propertiesError: sheet.error,
    flameTemperatures: sheet.flame,
    prices: sheet.prices.map((p) => ({ ...p.quote, unitLabel: p.unitLabel, inForce: p.current, delivered: p.normalised, error: p.error })),
    cautions: sheet.cautions,
    cautionPreamble: sheet.cautionPreamble,
  });
});

/** PUT /api/fuels/{id}: replaces the fuel's record (same body as POST). */
export const PUT = withErrors(async (req: Request, ctx: Ctx): Promise<Response> => {
  const id = parseId((await ctx.params).id);
  if (id === null) return notFound("Fuel");
  const body = await readJson(req);
  if (!body.ok) return body.response;
  const r = await updateFuel(db(), id, body.value);
  if (!r.ok) return failure(r);
  return json({ id: r.value.id, name: r.value.name, kind: r.value.kind, url: `/fuels/${r.value.id}` });
});

/** DELETE /api/fuels/{id}: 409 when a blend, plant or scenario uses the fuel. */
export const DELETE = withErrors(async (_req: Request, ctx: Ctx): Promise<Response> => {
  const id = parseId((await ctx.params).id);
  if (id === null) return notFound("Fuel");
  const r = await deleteFuel(db(), id);
  if (!r.ok) return failure(r);
  return json({ deleted: r.value.id, name: r.value.name });
});
