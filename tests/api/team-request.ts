import { tempDb, type TempDb } from "../db/temp-db";
/** A request to a route handler as a team-mode client sends it: JSON body, session cookie or API token. */
export interface TeamRequestOptions {
  method?: string;
  body?: unknown;
  cookie?: string;
  bearer?: string;
  headers?: Record<string, string>;
}

export function teamRequest(base: string, path: string, opts: TeamRequestOptions = {}): Request {
  const headers: Record<string, string> = { ...opts.headers };
  if (opts.body !== undefined) headers["content-type"] = "application/json";
  if (opts.cookie) headers.cookie = opts.cookie;
  if (opts.bearer) headers.authorization = `Bearer ${opts.bearer}`;
  return new Request(`${base}${path}`, {
    method: opts.method ?? "GET",
    body: opts.body === undefined ? undefined : JSON.stringify(opts.body),
    headers,
  });
}

/**
 * A throw-away database and the environment of a team-mode server over it: a session secret, and
 * none of the port, host allow-list or trash settings a developer's shell may carry.
 */
export async function teamServerDatabase(): Promise<TempDb> {
  const t = await tempDb();
  process.env.DATABASE_URL = t.url;
  process.env.STOKE_MODE = "team";
  process.env.STOKE_SESSION_SECRET = "a test secret of at least thirty-two characters";
  delete process.env.PORT;
  delete process.env.STOKE_ALLOWED_HOSTS;
  delete process.env.STOKE_TRASH;
  return t;
}
