/**
 * POST /api/session/password {currentPassword, newPassword}: the signed-in person changes their own
 * password (team mode). Every session of the account ends, this one too: the cookie is cleared.
 */
import { db } from "@/lib/db/client";
import { changeOwnPassword } from "@/lib/services/accounts";
import { currentActor } from "@/lib/services/actor";
import { stokeMode } from "@/lib/services/mode";
import { secureCookie, sessionCookieHeader } from "../../../_auth/session-cookie";
import { failure, json, readJson, withErrors } from "../../_http";

export const dynamic = "force-dynamic";

export const POST = withErrors(async (req: Request): Promise<Response> => {
  const actor = currentActor();
  if (stokeMode() !== "team" || actor.accountId === null) {
    return json({ error: "Only a signed-in account has a password (team mode).", fieldErrors: {} }, 404);
  }
  const body = await readJson(req, 4 * 1024);
  if (!body.ok) return body.response;
  const r = await changeOwnPassword(db(), actor.accountId, body.value);
  if (!r.ok) return failure(r);
  return json({ changed: true, signInAgain: true }, 200, { "set-cookie": sessionCookieHeader(null, secureCookie(req)) });
});
