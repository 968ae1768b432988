/**
 * Who is looking at a page (server components): the signed-in account in team mode, "local user"
 * in personal mode. The proxy has already let the request in; this only names the user.
 */
import { cookies } from "next/headers";
import { db } from "@/lib/db/client";
import { sessionActor } from "@/lib/services/accounts";
import { LOCAL_USER, type Actor } from "@/lib/services/actor";
import { stokeMode } from "@/lib/services/mode";
import { SESSION_COOKIE, unsealSessionKey } from "./session-cookie";

export async function pageUser(): Promise<Actor | null> {
  if (stokeMode() !== "team") return LOCAL_USER;
  const key = await unsealSessionKey((await cookies()).get(SESSION_COOKIE)?.value);
  return key ? sessionActor(db(), key) : null;
}
