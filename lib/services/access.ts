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
import { sessionActor, tokenActor, utcMinute } from "./accounts";
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
export async function authorize(db: DbOrTx, mode: Mode, need: Need, creds: Credentials, now: Date = new Date()): Promise<Decision> {
  if (mode === "personal") return { ok: true, actor: LOCAL_USER };
  if (need === "public") return { ok: true, actor: { name: "anonymous", accountId: null, role: "viewer", via: "session" } };
  let actor: Actor | null = null;
  if (creds.bearer !== null) {
    const t = await tokenActor(db, creds.bearer, now);
    if (t && "expiredAt" in t)
      return {
        ok: false,
        status: 401,
        message: `The API token expired on ${utcMinute(t.expiredAt)}; an admin can issue a new one on the Accounts page.`,
        need,
      };
    if (!t) return { ok: false, status: 401, message: "The API token is not valid (unknown, revoked, or its account is disabled).", need };
    actor = t;
  } else if (creds.sessionKey) {
    actor = await sessionActor(db, creds.sessionKey, now);
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

/**
 * The actions pages offer (buttons, links to forms, forms), each named by the requests it makes:
 * `METHOD /api/…` calls and `PAGE /…` form pages it opens, with `:name` for ids. A page shows an
 * action only when `allowedActions` says the account may make every one of its requests, so the
 * pages read the same table (`apiNeed`, `pageNeed`) the gate enforces and hold no rules of their own.
 */
export const PAGE_ACTIONS = {
  createFuel: ["PAGE /fuels/new", "POST /api/fuels"],
  editFuel: ["PAGE /fuels/:id/edit", "PUT /api/fuels/:id"],
  deleteFuel: ["DELETE /api/fuels/:id"],
  editQuotes: [
    "POST /api/fuels/:id/prices",
    "PUT /api/fuels/:id/prices/:priceId",
    "POST /api/fuels/:id/prices/:priceId/withdraw",
    "DELETE /api/fuels/:id/prices/:priceId",
  ],
  importLibrary: ["POST /api/fuels/import"],
  importQuotes: ["POST /api/fuels/quotes/import"],
  addExchangeRate: ["POST /api/exchange-rates"],
  createPlant: ["PAGE /plants/new", "POST /api/plants"],
  editPlant: ["PAGE /plants/:id/edit", "PUT /api/plants/:id"],
  deletePlant: ["DELETE /api/plants/:id"],
  createStudy: ["PAGE /studies/new", "POST /api/studies"],
  editStudy: ["PAGE /studies/:id/edit", "PUT /api/studies/:id"],
  deleteStudy: ["DELETE /api/studies/:id"],
  duplicateStudy: ["POST /api/studies/:id/duplicate"],
  issueRevision: ["POST /api/studies/:id/revisions"],
  runUncertainty: ["POST /api/studies/:id/uncertainty/runs", "DELETE /api/studies/:id/uncertainty/jobs/:job"],
  restoreFromTrash: ["POST /api/trash/:kind/:id/restore"],
  purgeFromTrash: ["POST /api/trash/:kind/:id/purge"],
  manageAccounts: ["PAGE /accounts", "GET /api/accounts", "POST /api/accounts", "POST /api/tokens"],
} as const satisfies Record<string, readonly string[]>;

export type PageAction = keyof typeof PAGE_ACTIONS;
export type AllowedActions = Readonly<Record<PageAction, boolean>>;

/** A sample value for each `:name` of an action's path (the table looks at the path's shape only). */
const SAMPLE: Record<string, string> = { kind: "fuel" };

/** The need of one request of `PAGE_ACTIONS` ("METHOD /path" or "PAGE /path"). */
export function requestNeed(request: string): Need {
  const [method, pattern] = request.split(" ");
  const path = pattern.replace(/:(\w+)/g, (_, name: string) => SAMPLE[name] ?? "1");
  return method === "PAGE" ? pageNeed(path) : apiNeed(method, path);
}

const meets = (role: Role, need: Need) => need === "public" || need === "signed-in" || roleAtLeast(role, need);

const allowedMemo = new Map<string, AllowedActions>();

/**
 * Which page actions an account may take: in personal mode every one; in team mode those whose
 * every request the role meets; none without an account (`role` null).
 */
export function allowedActions(mode: Mode, role: Role | null): AllowedActions {
  const key = mode === "personal" ? "personal" : (role ?? "none");
  const known = allowedMemo.get(key);
  if (known) return known;
  const entries = (Object.keys(PAGE_ACTIONS) as PageAction[]).map((a) => {
    const ok = mode === "personal" || (role !== null && PAGE_ACTIONS[a].every((r) => meets(role, requestNeed(r))));
    return [a, ok] as const;
  });
  const allowed = Object.freeze(Object.fromEntries(entries) as Record<PageAction, boolean>);
  allowedMemo.set(key, allowed);
  return allowed;
}
