import { db } from "@/lib/db/client";
import { uncertaintyOfStoredStudy } from "@/lib/services/uncertainty";
import { uncertaintyCsv } from "@/lib/study/uncertainty";
import { failure, json, notFound, parseId, withErrors } from "../../../_http";
import { uncertaintyRequest } from "./_request";

export const dynamic = "force-dynamic";

/**
 * GET /api/studies/{id}/uncertainty[?draws=…&seed=…&metric=…&shape=triangular|pert|normal&fp=…&cp=…&xp=…&ep=…&hp=…&sk=…&rho=…&format=csv]:
 * the Monte Carlo ranking of the stored study with the page's ranges, computed at once (nothing is
 * stored; a stored run with progress: POST …/uncertainty/runs). 400 naming the field for a bad
 * value; 422 when the study cannot be evaluated.
 */
export const GET = withErrors(async (req: Request, { params }: { params: Promise<{ id: string }> }): Promise<Response> => {
  const id = parseId((await params).id);
  if (id === null) return notFound("Study");
  const q = new URL(req.url).searchParams;
  const r = uncertaintyRequest(q);
  if (!r.ok) return r.response;
  const ans = await uncertaintyOfStoredStudy(db(), id, r.request);
  if (!ans.ok) return failure(ans);
  if (q.get("format") === "csv") {
    return new Response(uncertaintyCsv(ans.result), {
      headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="study-${id}-uncertainty.csv"` },
    });
  }
  return json({ studyId: id, result: ans.result });
});
