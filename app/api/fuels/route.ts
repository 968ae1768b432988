import { db } from "@/lib/db/client";
import { createFuel } from "@/lib/services/fuels";
import { countFuels, fuelList } from "@/lib/services/fuel-views";
import { pageFromQuery, pageInfo } from "@/lib/services/paging";
import { FUEL_KINDS } from "@/lib/schemas/library";
import { failure, json, readJson, withErrors } from "../_http";

export const dynamic = "force-dynamic";

/**
 * GET /api/fuels[?kind=gas|liquid|solid][&limit=N&offset=M]: the library by kind and name with
 * headline figures and the price in force, at most 1,000 a request (`page.next` is the next page's address).
 */
export const GET = withErrors(async (req: Request): Promise<Response> => {
  const params = new URL(req.url).searchParams;
  const kind = params.get("kind");
  if (kind && !(FUEL_KINDS as readonly string[]).includes(kind)) {
    return json({ error: `kind must be one of ${FUEL_KINDS.join(", ")}`, fieldErrors: { kind: "unknown kind" } }, 400);
  }
  const page = pageFromQuery(params);
  if (!page.ok) return failure(page);
  const [items, total] = await Promise.all([
    fuelList(db(), { kind: kind ?? undefined, page: page.value }),
    countFuels(db(), kind ?? undefined),
  ]);
  return json({
    page: pageInfo(page.value, total, req.url),
    basis: {
      heatingValues: "combustion reference 25 °C",
      volumes: "real gas at 15 °C, 101.325 kPa (ISO 6976); liquids per litre at 15 °C",
      prices: "delivered (commodity + transport + handling) in the quote's currency",
    },
    fuels: items.map((f) => ({
      id: f.id,
      name: f.name,
      kind: f.kind,
      isDemo: f.isDemo,
      isBlend: f.isBlend,
      error: f.error,
      hhv: f.properties?.hhv ?? null,
      lhv: f.properties?.lhv ?? null,
      wobbe: f.properties?.wobbe ?? null,
      co2: f.properties?.co2 ?? null,
      currentPrice: f.price
        ? {
            quote: f.price.quote,
            unitLabel: f.price.unitLabel,
            error: f.price.error,
            delivered: f.price.normalised
              ? {
                  perMWh_gross: f.price.normalised.perMWh_gross,
                  perMWh_net: f.price.normalised.perMWh_net,
                  perGJ_gross: f.price.normalised.perGJ_gross,
                  perGJ_net: f.price.normalised.perGJ_net,
                  perKg: f.price.normalised.perKg,
                }
              : null,
          }
        : null,
    })),
  });
});

/** POST /api/fuels: creates a fuel or blend. 400 with field errors, 409 on a duplicate name. */
export const POST = withErrors(async (req: Request): Promise<Response> => {
  const body = await readJson(req);
  if (!body.ok) return body.response;
  const r = await createFuel(db(), body.value);
  if (!r.ok) return failure(r);
  return json({ id: r.value.id, name: r.value.name, kind: r.value.kind, url: `/fuels/${r.value.id}` }, 201);
});
