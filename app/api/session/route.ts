/**
 * Sign-in and sign-out (team mode).
 * POST /api/session {email, password}: opens a session and sets the sealed cookie; 401 wrong e-mail or
 * password, 429 after too many failures (Retry-After). GET: who is signed in. DELETE: signs out (the
 * session ends on the server too).
 */
import { db } from "@/lib/db/client";
import { signIn, signOut } from "@/lib/services/accounts";
import { currentActor } from "@/lib/services/actor";
import { stokeMode } from "@/lib/services/mode";
import {
  cookieFrom,
  SESSION_COOKIE,
  sealSessionKey,
  secureCookie,
  sessionCookieHeader,
  unsealSessionKey,
} from "../../_auth/session-cookie";
import { failure, json, readJson, withErrors } from "../_http";

export const dynamic = "force-dynamic";

const SIGN_IN_BODY_LIMIT_BYTES = 4 * 1024;

const personal = () => json({ error: "Personal mode has no sign-in: Stoke answers this machine only.", fieldErrors: {} }, 404);

/**
 * The caller's address for the per-client throttle: the last X-Forwarded-For entry — the one the
 * nearest reverse proxy appended, or the socket's address that the server fills in when the header
 * is absent. A client reaching the server directly could send its own header, so this limit is a
 * second line only: the per-account (and per-unknown-e-mail) waits do not depend on it.
 */
function clientOf(req: Request): string {
  return (req.headers.get("x-forwarded-for") ?? "").split(",").at(-1)?.trim() || "unknown";
}

export const POST = withErrors(async (req: Request): Promise<Response> => {
  if (stokeMode() !== "team") return personal();
  const body = await readJson(req, SIGN_IN_BODY_LIMIT_BYTES);
  if (!body.ok) return body.response;
  const r = await signIn(db(), body.value, clientOf(req));
  if (!r.ok) return failure(r);
  const cookie = sessionCookieHeader(await sealSessionKey(r.value.key), secureCookie(req));
  return json({ account: r.value.account, expiresAt: r.value.expiresAt.toISOString() }, 200, { "set-cookie": cookie });
});

export const GET = withErrors(async (): Promise<Response> => {
  const a = currentActor();
  return json({ mode: stokeMode(), name: a.name, role: a.role, accountId: a.accountId, via: a.via });
});

export const DELETE = withErrors(async (req: Request): Promise<Response> => {
  if (stokeMode() !== "team") return personal();
  const key = await unsealSessionKey(cookieFrom(req.headers.get("cookie"), SESSION_COOKIE));
  if (key) await signOut(db(), key);
  return json({ signedOut: true }, 200, { "set-cookie": sessionCookieHeader(null, secureCookie(req)) });
});
