/**
 * GET /api/tokens: the API tokens with their expiry (admin; never the tokens themselves).
 * POST {accountId, tokenName, lifetimeDays?}: issues one valid for `lifetimeDays` (the default and
 * the maximum are in lib/schemas/accounts.ts); the answer holds the token once — it is stored only
 * as a hash.
 */
import { db } from "@/lib/db/client";
import { issueToken, listTokens } from "@/lib/services/accounts";
import { stokeMode } from "@/lib/services/mode";
import { failure, json, readJson, withErrors } from "../_http";
import { personalModeAnswer } from "../accounts/_personal";

export const dynamic = "force-dynamic";

export const GET = withErrors(async (): Promise<Response> => {
  if (stokeMode() !== "team") return personalModeAnswer();
  return json({ tokens: await listTokens(db()) });
});

export const POST = withErrors(async (req: Request): Promise<Response> => {
  if (stokeMode() !== "team") return personalModeAnswer();
  const body = await readJson(req, 4 * 1024);
  if (!body.ok) return body.response;
  const r = await issueToken(db(), body.value);
  if (!r.ok) return failure(r);
  return json(r.value, 201);
});
