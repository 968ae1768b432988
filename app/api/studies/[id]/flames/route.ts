import { db } from "@/lib/db/client";
import { studyFlameProgress } from "@/lib/services/studies";
import { failure, json, notFound, parseId, withErrors } from "../../../_http";

export const dynamic = "force-dynamic";

/**
 * GET /api/studies/{id}/flames[?sweep=0]: how many of the study's flame solves (scenarios and hydrogen sweep)
 * are solved, failed or pending, and the background job's state; queues the missing ones.
 */
export const GET = withErrors(async (req: Request, { params }: { params: Promise<{ id: string }> }): Promise<Response> => {
  const id = parseId((await params).id);
  if (id === null) return notFound("Study");
  const sweep = new URL(req.url).searchParams.get("sweep") !== "0";
  const r = await studyFlameProgress(db(), id, { sweep });
  if (!r.ok) return failure(r);
  return json(r.value);
});
