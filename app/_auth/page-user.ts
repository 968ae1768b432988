/**
 * Who is looking at a page (server components): the signed-in account in team mode, "local user"
 * in personal mode. The proxy has already let the request in; this only names the user, and says
 * which actions the page may offer them (the role table of `lib/services/access.ts`).
 */
import { cookies } from "next/headers";
import { cache } from "react";
import { db } from "@/lib/db/client";
import { allowedActions, type AllowedActions } from "@/lib/services/access";
import { sessionActor } from "@/lib/services/accounts";
import { LOCAL_USER, type Actor } from "@/lib/services/actor";
import { stokeMode } from "@/lib/services/mode";
import { SESSION_COOKIE, unsealSessionKey } from "./session-cookie";

/** The signed-in account (looked up once per request however many components ask). */
export const pageUser = cache(async (): Promise<Actor | null> => {
  if (stokeMode() !== "team") return LOCAL_USER;
  const key = await unsealSessionKey((await cookies()).get(SESSION_COOKIE)?.value);
  return key ? sessionActor(db(), key) : null;
});

/** The actions this page may show the one looking at it: all in personal mode, by role in team mode. */
export async function pageActions(): Promise<AllowedActions> {
  const mode = stokeMode();
  return allowedActions(mode, mode === "team" ? ((await pageUser())?.role ?? null) : null);
}
