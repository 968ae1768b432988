/** GET /api/history/{fuel|plant|study|account}/{id}[?limit=N]: the object's change log, newest first, with before, after and the fields that differ. */
import { db } from "@/lib/db/client";
import { historyOf, type SubjectType } from "@/lib/services/change-log";
import { json, notFound, parseId, withErrors } from "../../../_http";

export const dynamic = "force-dynamic";

const SUBJECTS: readonly SubjectType[] = ["fuel", "plant", "study", "account"];

type Ctx = { params: Promise<{ kind: string; id: string }> };

export const GET = withErrors(async (req: Request, { params }: Ctx): Promise<Response> => {
  const { kind, id } = await params;
  const n = parseId(id);
  if (!SUBJECTS.includes(kind as SubjectType) || n === null) return notFound("History");
  const limit = Math.min(200, Math.max(1, Number(new URL(req.url).searchParams.get("limit")) || 30));
  return json(await historyOf(db(), kind as SubjectType, n, limit));
});
