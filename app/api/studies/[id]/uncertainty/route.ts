import { db } from "@/lib/db/client";
import { uncertaintyOfStoredStudy } from "@/lib/services/uncertainty";
import { uncertaintyCsv } from "@/lib/study/uncertainty";
import { RANKING_METRICS } from "@/lib/economics/sensitivity";
import { failure, json, notFound, parseId, withErrors } from "../../../_http";
import { uncertaintyParams } from "@/app/studies/[id]/uncertainty/params";

export const dynamic = "force-dynamic";

/**
 * GET /api/studies/{id}/uncertainty[?draws=…&seed=…&metric=…&shape=triangular|pert|normal&fp=…&cp=…&xp=…&ep=…&hp=…&rho=…&format=csv]:
 * the Monte Carlo ranking of the stored study with the page's ranges (nothing is stored). 400
 * naming the field for a bad value; 422 when the study cannot be evaluated.
 */
export const GET = withErrors(async (req: Request, { params }: { params: Promise<{ id: string }> }): Promise<Response> => {
  const id = parseId((await params).id);
  if (id === null) return notFound("Study");
  const q = new URL(req.url).searchParams;
  const m = q.get("metric");
  if (m && !(RANKING_METRICS as readonly string[]).includes(m)) {
    return json({ error: `metric must be one of ${RANKING_METRICS.join(", ")}`, fieldErrors: { metric: "unknown metric" } }, 400);
  }
  const p = uncertaintyParams(Object.fromEntries(q.entries()));
  if (p.ignored.length)
    return json(
      {
        error: `out of range: ${p.ignored.map((x) => x.label).join(", ")}`,
        fieldErrors: Object.fromEntries(p.ignored.map((x) => [x.field, `out of range: ${x.label}`])),
      },
      400,
    );
  const ans = await uncertaintyOfStoredStudy(db(), id, p.request);
  if (!ans.ok) return failure(ans);
  if (q.get("format") === "csv") {
    return new Response(uncertaintyCsv(ans.result), {
      headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="study-${id}-uncertainty.csv"` },
    });
  }
  return json({ studyId: id, result: ans.result });
});
