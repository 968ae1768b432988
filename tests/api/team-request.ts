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
