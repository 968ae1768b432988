/**
 * Runs before every page and API request (Next's proxy, Node.js runtime): a Host not on the allowed
 * list answers 421; in team mode a page without a valid session goes to the sign-in page and a page
 * whose role the account lacks answers 403 (the role table is lib/services/access.ts). API routes
 * decide for themselves in `withErrors` (401/403 as JSON), so that a handler is never reached unchecked.
 */
import { NextResponse, type NextRequest } from "next/server";
import { decide, hostRefusal } from "./app/_auth/gate";

const page = (status: number, title: string, text: string) =>
  new NextResponse(
    `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${title} · Stoke</title></head><body style="font-family:system-ui,sans-serif;max-width:40rem;margin:3rem auto"><h1>${title}</h1><p>${text}</p><p><a href="/">Stoke</a></p></body></html>`,
    { status, headers: { "content-type": "text/html; charset=utf-8", "cache-control": "no-store" } },
  );

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

export async function proxy(req: NextRequest): Promise<NextResponse> {
  const host = hostRefusal(req);
  if (host) {
    if (req.nextUrl.pathname.startsWith("/api/")) {
      return NextResponse.json({ error: host.message, fieldErrors: { host: "not on the allowed list" } }, { status: host.status });
    }
    return page(host.status, "Wrong host name", escapeHtml(host.message));
  }
  const path = req.nextUrl.pathname;
  if (path.startsWith("/api/")) return NextResponse.next();
  const d = await decide(req, path);
  if (d.ok) return NextResponse.next();
  if (d.status === 401) {
    const to = req.nextUrl.clone();
    to.pathname = "/sign-in";
    to.search = `?next=${encodeURIComponent(path + req.nextUrl.search)}`;
    return NextResponse.redirect(to);
  }
  return page(403, "Not allowed", escapeHtml(d.message));
}

export const config = {
  // Every page and API route; not Next's static files.
  matcher: ["/((?!_next/static|_next/image|favicon.ico).*)"],
};
