import { cancelUncertaintyJob, uncertaintyJob } from "@/lib/services/uncertainty-runs";
import { json, notFound, parseId, withErrors } from "../../../../../_http";

export const dynamic = "force-dynamic";

type Ctx = { params: Promise<{ id: string; job: string }> };

/** GET /api/studies/{id}/uncertainty/jobs/{job}: progress of a run (state, phase, draws done of total, the stored run id when done, the problem when it failed). */
export const GET = withErrors(async (_req: Request, ctx: Ctx): Promise<Response> => {
  const p = await ctx.params;
  const id = parseId(p.id);
  if (id === null) return notFound("Study");
  const job = uncertaintyJob(id, p.job);
  return job ? json({ job }) : notFound("Uncertainty job");
});

/** DELETE /api/studies/{id}/uncertainty/jobs/{job}: cancels a running job before its next slice (nothing is stored). */
export const DELETE = withErrors(async (_req: Request, ctx: Ctx): Promise<Response> => {
  const p = await ctx.params;
  const id = parseId(p.id);
  if (id === null) return notFound("Study");
  const job = cancelUncertaintyJob(id, p.job);
  return job ? json({ job }) : notFound("Uncertainty job");
});
