import { db } from "@/lib/db/client";
import { evaluateStoredStudy } from "@/lib/services/studies";
import { RANKING_METRICS, type RankingMetric } from "@/lib/economics/sensitivity";
import { failure, json, notFound, parseId, withErrors } from "../../../_http";
import { upstreamParam } from "@/app/studies/_components/settings";
import { labelledPriceSource } from "@/app/studies/_components/price-labels";

export const dynamic = "force-dynamic";

/**
 * GET /api/studies/{id}/results[?metric=…&upstream=1|0&sweep=1]: the evaluated study — every
 * scenario's figures, fit checks, ranking, cautions and audit trail (and the hydrogen sweep).
 * 422 with the field when the stored study cannot be evaluated.
 */
export const GET = withErrors(async (req: Request, { params }: { params: Promise<{ id: string }> }): Promise<Response> => {
  const id = parseId((await params).id);
  if (id === null) return notFound("Study");
  const q = new URL(req.url).searchParams;
  const m = q.get("metric");
  if (m && !(RANKING_METRICS as readonly string[]).includes(m)) {
    return json({ error: `metric must be one of ${RANKING_METRICS.join(", ")}`, fieldErrors: { metric: "unknown metric" } }, 400);
  }
  const ev = await evaluateStoredStudy(db(), id, {
    metric: (m as RankingMetric) ?? undefined,
    includeUpstream: upstreamParam(q.get("upstream")),
    sweep: q.get("sweep") === "1",
  });
  if (!ev.ok) return failure(ev);
  return json({
    studyId: id,
    priceSources: {
      baseline: labelledPriceSource(ev.bundle.meta.baseline.price),
      scenarios: ev.bundle.meta.scenarios.map((s) => labelledPriceSource(s.price)),
    },
    result: ev.result,
  });
});
