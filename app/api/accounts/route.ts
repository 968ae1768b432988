/** GET /api/accounts: every account (admin). POST: creates one {email, displayName, role, password} (admin). */
import { db } from "@/lib/db/client";
import { createAccount, listAccounts } from "@/lib/services/accounts";
import { stokeMode } from "@/lib/services/mode";
import { failure, json, readJson, withErrors } from "../_http";
import { personalModeAnswer } from "./_personal";

export const dynamic = "force-dynamic";

export const GET = withErrors(async (): Promise<Response> => {
  if (stokeMode() !== "team") return personalModeAnswer();
  return json({ accounts: await listAccounts(db()) });
});

export const POST = withErrors(async (req: Request): Promise<Response> => {
  if (stokeMode() !== "team") return personalModeAnswer();
  const body = await readJson(req, 16 * 1024);
  if (!body.ok) return body.response;
  const r = await createAccount(db(), body.value);
  if (!r.ok) return failure(r);
  return json(r.value, 201);
});
