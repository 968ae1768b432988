import { db } from "@/lib/db/client";
import { getUncertaintyRun } from "@/lib/services/uncertainty-runs";
import { uncertaintyCsv } from "@/lib/study/uncertainty";
import { failure, json, notFound, parseId, withErrors } from "../../../../../_http";

export const dynamic = "force-dynamic";

type Ctx = { params: Promise<{ id: string; run: string }> };

/** GET /api/studies/{id}/uncertainty/runs/{run}[?format=csv]: a stored run as it was computed (settings, result, stale or not). */
export const GET = withErrors(async (req: Request, ctx: Ctx): Promise<Response> => {
  const p = await ctx.params;
  const id = parseId(p.id);
  const runId = parseId(p.run);
  if (id === null) return notFound("Study");
  if (runId === null) return notFound("Uncertainty run");
  const r = await getUncertaintyRun(db(), id, runId);
  if (!r.ok) return failure(r);
  if (new URL(req.url).searchParams.get("format") === "csv") {
    return new Response(uncertaintyCsv(r.value.result), {
      headers: {
        "content-type": "text/csv; charset=utf-8",
        "content-disposition": `attachment; filename="study-${id}-uncertainty-run-${runId}.csv"`,
      },
    });
  }
  return json({ studyId: id, run: r.value });
});
