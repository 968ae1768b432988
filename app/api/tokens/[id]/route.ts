/** DELETE /api/tokens/{id}: revokes an API token (admin). */
import { db } from "@/lib/db/client";
import { revokeToken } from "@/lib/services/accounts";
import { stokeMode } from "@/lib/services/mode";
import { failure, json, notFound, parseId, withErrors } from "../../_http";
import { personalModeAnswer } from "../../accounts/_personal";

export const dynamic = "force-dynamic";

type Ctx = { params: Promise<{ id: string }> };

export const DELETE = withErrors(async (_req: Request, { params }: Ctx): Promise<Response> => {
  if (stokeMode() !== "team") return personalModeAnswer();
  const id = parseId((await params).id);
  if (id === null) return notFound("API token");
  const r = await revokeToken(db(), id);
  if (!r.ok) return failure(r);
  return json({ revoked: r.value.id });
});
