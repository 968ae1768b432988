/**
 * The sign-in cookie: the session key sealed with iron-session (AES-256-CBC + HMAC-SHA-256, keyed by
 * STOKE_SESSION_SECRET), http-only, SameSite=Lax, Secure unless the server is reached on a loopback
 * address over plain HTTP, and no longer-lived than the session row it names.
 */
import { sealData, unsealData } from "iron-session";
import { SESSION_HOURS } from "@/lib/services/accounts";
import { sessionSecret } from "@/lib/services/mode";

export const SESSION_COOKIE = "stoke_session";
const TTL_S = SESSION_HOURS * 3600;

export async function sealSessionKey(key: string): Promise<string> {
  return sealData({ k: key }, { password: sessionSecret(), ttl: TTL_S });
}

/** The session key in a sealed cookie value, or null when it is absent, forged or expired. */
export async function unsealSessionKey(value: string | null | undefined): Promise<string | null> {
  if (!value || value.length > 4096) return null;
  try {
    const data = await unsealData<{ k?: unknown }>(value, { password: sessionSecret(), ttl: TTL_S });
    return typeof data.k === "string" ? data.k : null;
  } catch {
    return null;
  }
}

/** A cookie's value from a Cookie header. */
export function cookieFrom(header: string | null, name: string): string | null {
  if (!header) return null;
  for (const part of header.split(";")) {
    const i = part.indexOf("=");
    if (i > 0 && part.slice(0, i).trim() === name) return part.slice(i + 1).trim();
  }
  return null;
}

/** The token of an `Authorization: Bearer …` header, or null. */
export function bearerFrom(header: string | null): string | null {
  const m = /^Bearer\s+(\S+)\s*$/i.exec(header ?? "");
  return m ? m[1] : null;
}

const isLoopback = (host: string) => /^(localhost|127\.\d+\.\d+\.\d+|\[::1\])(:\d+)?$/i.test(host);

/** Whether the cookie is marked Secure: always, except plain HTTP to a loopback address (a browser would drop it). */
export function secureCookie(req: Request): boolean {
  const proto = (req.headers.get("x-forwarded-proto") ?? new URL(req.url).protocol.replace(":", "")).toLowerCase();
  const host = req.headers.get("host") ?? new URL(req.url).host;
  return proto === "https" || !isLoopback(host);
}

/** The Set-Cookie header that stores the sealed key, or (value null) clears it. */
export function sessionCookieHeader(sealed: string | null, secure: boolean): string {
  const parts = [`${SESSION_COOKIE}=${sealed ?? ""}`, "Path=/", "HttpOnly", "SameSite=Lax", `Max-Age=${sealed ? TTL_S - 60 : 0}`];
  if (secure) parts.push("Secure");
  return parts.join("; ");
}
