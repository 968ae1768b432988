import { db } from "@/lib/db/client";
import { listUncertaintyRuns, startUncertaintyRun } from "@/lib/services/uncertainty-runs";
import { failure, json, notFound, parseId, withErrors } from "../../../../_http";
import { uncertaintyRequest } from "../_request";

export const dynamic = "force-dynamic";

type Ctx = { params: Promise<{ id: string }> };

/** GET /api/studies/{id}/uncertainty/runs: the stored runs, newest first (settings, stale or not, revisions on the same inputs). */
export const GET = withErrors(async (_req: Request, ctx: Ctx): Promise<Response> => {
  const id = parseId((await ctx.params).id);
  if (id === null) return notFound("Study");
  return json({ studyId: id, runs: await listUncertaintyRuns(db(), id) });
});

/**
 * POST /api/studies/{id}/uncertainty/runs?draws=…&seed=…&… (the page's address parameters):
 * starts a run off the request path; 202 with the job (`id`, progress). Follow it at
 * GET …/uncertainty/jobs/{job}; it ends stored (`runId`).
 */
export const POST = withErrors(async (req: Request, ctx: Ctx): Promise<Response> => {
  const id = parseId((await ctx.params).id);
  if (id === null) return notFound("Study");
  const r = uncertaintyRequest(new URL(req.url).searchParams);
  if (!r.ok) return r.response;
  const started = await startUncertaintyRun(db(), id, r.request);
  if (!started.ok) return failure(started);
  return json({ job: started.value }, 202);
});
