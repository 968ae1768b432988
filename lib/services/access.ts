/**
 * Who may do what: the one table of the role each page and API route needs, and the one decision
 * that turns a request's credentials into an actor or a refusal. The HTTP layer (every route
 * handler through `withErrors`, every page through the proxy) asks here and nowhere else.
 *
 * viewer: reads and exports; editor: every other write and restoring from the trash; admin:
 * accounts, API tokens and deleting from the trash for good. Personal mode needs nothing.
 */
import type { DbOrTx } from "../db/client";
import { roleAtLeast, type Role } from "../schemas/accounts";
import { sessionActor, tokenActor } from "./accounts";
import { LOCAL_USER, type Actor } from "./actor";
import type { Mode } from "./mode";

/** What a request needs: nothing, any signed-in account, or at least a role. */
export type Need = "public" | "signed-in" | Role;

const READ = new Set(["GET", "HEAD", "OPTIONS"]);

/** The role an API request needs. */
export function apiNeed(method: string, pathname: string): Need {
  const m = method.toUpperCase();
  const p = pathname.replace(/\/+$/, "");
  if (p === "/api/session") return m === "POST" ? "public" : "signed-in";
  if (p === "/api/session/password") return "signed-in";
  if (p === "/api/accounts" || p.startsWith("/api/accounts/") || p === "/api/tokens" || p.startsWith("/api/tokens/")) return "admin";
  if (p.startsWith("/api/trash/") && (p.endsWith("/purge") || m === "DELETE")) return "admin";
  if (p.startsWith("/api/history/account/")) return "admin";
  if (READ.has(m)) return "viewer";
  return "editor";
}

/** The role a page needs (the sign-in page needs none). */
export function pageNeed(pathname: string): Need {
  const p = pathname.replace(/\/+$/, "") || "/";
  if (p === "/sign-in") return "public";
  if (p === "/accounts" || p.startsWith("/accounts/")) return "admin";
  if (/\/(new|edit)$/.test(p)) return "editor";
  return "viewer";
}

/** The credentials a request carries (the HTTP layer unseals the cookie and reads the header). */
export interface Credentials {
  /** The session key from the sealed cookie, or null. */
  sessionKey: string | null;
  /** The bearer token of the Authorization header, or null. */
  bearer: string | null;
}

export type Decision = { ok: true; actor: Actor } | { ok: false; status: 401 | 403; message: string; need: Need };

/** Says whether the request may go on, and as whom. A bearer token, when sent, is the only credential looked at. */
export async function authorize(db: DbOrTx, mode: Mode, need: Need, creds: Credentials): Promise<Decision> {
  if (mode === "personal") return { ok: true, actor: LOCAL_USER };
  if (need === "public") return { ok: true, actor: { name: "anonymous", accountId: null, role: "viewer", via: "session" } };
  let actor: Actor | null = null;
  if (creds.bearer !== null) {
    actor = await tokenActor(db, creds.bearer);
    if (!actor)
      return { ok: false, status: 401, message: "The API token is not valid (unknown, revoked, or its account is disabled).", need };
  } else if (creds.sessionKey) {
    actor = await sessionActor(db, creds.sessionKey);
  }
  if (!actor) return { ok: false, status: 401, message: "Sign in first (or send an API token as Authorization: Bearer …).", need };
  if (need === "signed-in" || roleAtLeast(actor.role, need)) return { ok: true, actor };
  return {
    ok: false,
    status: 403,
    message: `This needs the ${need} role; ${actor.name} is ${/^[aeiou]/.test(actor.role) ? "an" : "a"} ${actor.role}.`,
    need,
  };
}
