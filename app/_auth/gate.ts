/**
 * The door every request passes: the Host must be on the allowed list (both modes), and in team
 * mode the request needs the role `lib/services/access.ts` names for its route — the proxy asks for
 * pages, `withErrors` for every API route handler. Answers what to refuse with, or the actor.
 */
import { db } from "@/lib/db/client";
import { apiNeed, authorize, pageNeed, type Decision } from "@/lib/services/access";
import { hostAllowed, stokeMode } from "@/lib/services/mode";
import { bearerFrom, cookieFrom, SESSION_COOKIE, unsealSessionKey } from "./session-cookie";

/**
 * A refusal for a Host header not on the list (421), or null. The list guards against a browser
 * being pointed at this server under another name (DNS rebinding) and against requests meant for
 * another site; browsers always send Host. A request without one (a route handler called
 * in-process) has no name to check.
 */
export function hostRefusal(req: Request): { status: 421; message: string } | null {
  const host = req.headers.get("host");
  if (host === null || hostAllowed(host)) return null;
  return {
    status: 421,
    message: `This server does not answer for the host "${host.slice(0, 100)}". Add it to STOKE_ALLOWED_HOSTS if it is this server's name.`,
  };
}

/** The decision for a request to `pathname` (an API route when it starts with /api/). */
export async function decide(req: Request, pathname: string): Promise<Decision> {
  const mode = stokeMode();
  const need = pathname.startsWith("/api/") ? apiNeed(req.method, pathname) : pageNeed(pathname);
  if (mode === "personal") return authorize(db(), mode, need, { sessionKey: null, bearer: null });
  const bearer = bearerFrom(req.headers.get("authorization"));
  const sessionKey = bearer === null ? await unsealSessionKey(cookieFrom(req.headers.get("cookie"), SESSION_COOKIE)) : null;
  return authorize(db(), mode, need, { sessionKey, bearer });
}
