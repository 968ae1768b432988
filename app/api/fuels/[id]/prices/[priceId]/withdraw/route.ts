import { db } from "@/lib/db/client";
import { withdrawPriceQuote } from "@/lib/services/fuels";
import { failure, json, notFound, parseId, withErrors } from "../../../../../_http";

export const dynamic = "force-dynamic";

type Ctx = { params: Promise<{ id: string; priceId: string }> };

/**
 * POST /api/fuels/{id}/prices/{priceId}/withdraw: the quote stays on record but prices nothing any
 * more; the studies that chose it (listed) fall back to their rule and say which quote they use.
 */
export const POST = withErrors(async (_req: Request, ctx: Ctx): Promise<Response> => {
  const p = await ctx.params;
  const id = parseId(p.id);
  const priceId = parseId(p.priceId);
  if (id === null || priceId === null) return notFound("Price quote");
  const r = await withdrawPriceQuote(db(), id, priceId);
  if (!r.ok) return failure(r);
  return json({ id: priceId, withdrawnAt: r.value.quote.withdrawnAt?.toISOString() ?? null, affectedStudies: r.value.affectedStudies });
});
