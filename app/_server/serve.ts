/**
 * The production server: Next's request handler behind a response cache (lib/services/response-cache.ts).
 *
 * Every GET of a cacheable path passes the same door as in Next's proxy (Host allow-list, access
 * check by the role table): a request refused there goes on to Next unanswered here, which refuses
 * it as always. An allowed request is answered from the cache when a response for its key is
 * stored; otherwise Next makes it, the bytes going out are kept, and the response is stored when it
 * may be. Answers carry `x-stoke-cache: hit | miss | shared | pass`.
 *
 * Bundled by app/_server/build.mjs into dist/server/serve.mjs; `npm start` runs it. HOST and PORT
 * choose the address (default 127.0.0.1:3000).
 */
import http from "node:http";
import path from "node:path";
import next from "next";
import { db } from "@/lib/db/client";
import {
  cacheablePath,
  cookiesBut,
  currentDataRevision,
  replayHeaders,
  ResponseCache,
  responseCacheBytes,
  responseKey,
  storable,
  type StoredResponse,
} from "@/lib/services/response-cache";
import { decide, hostRefusal } from "../_auth/gate";
import { SESSION_COOKIE } from "../_auth/session-cookie";

/** A server setting that cannot be used. */
class SettingError extends Error {}

type Handler = (req: http.IncomingMessage, res: http.ServerResponse) => Promise<void>;

function webRequest(req: http.IncomingMessage): Request {
  const headers = new Headers();
  const raw = req.rawHeaders;
  for (let i = 0; i + 1 < raw.length; i += 2) headers.append(raw[i], raw[i + 1]);
  return new Request(`http://${req.headers.host ?? "localhost"}${req.url ?? "/"}`, { method: req.method, headers });
}

function send(res: http.ServerResponse, r: StoredResponse, how: "hit" | "shared"): void {
  res.writeHead(r.status, { ...r.headers, "content-length": String(r.body.length), "x-stoke-cache": how });
  res.end(r.body);
}

const asBuffer = (chunk: unknown, encoding?: unknown): Buffer | null => {
  if (chunk === undefined || chunk === null || typeof chunk === "function") return null;
  if (Buffer.isBuffer(chunk)) return chunk;
  if (typeof chunk === "string") return Buffer.from(chunk, typeof encoding === "string" ? (encoding as BufferEncoding) : "utf8");
  if (chunk instanceof Uint8Array) return Buffer.from(chunk.buffer, chunk.byteOffset, chunk.byteLength);
  return null;
};

/**
 * Lets Next answer `req` while keeping a copy of the bytes; the stored form once it has finished,
 * null when it may not be stored or the client went away, a rejection when Next's handler failed.
 */
function makeWhileCopying(handle: Handler, req: http.IncomingMessage, res: http.ServerResponse): Promise<StoredResponse | null> {
  const chunks: Buffer[] = [];
  let copying = true;
  const write = res.write.bind(res) as (...a: unknown[]) => boolean;
  const end = res.end.bind(res) as (...a: unknown[]) => http.ServerResponse;
  res.write = ((chunk: unknown, encoding?: unknown, cb?: unknown) => {
    const b = copying ? asBuffer(chunk, encoding) : null;
    if (b) chunks.push(Buffer.from(b));
    return write(chunk, encoding, cb);
  }) as typeof res.write;
  res.end = ((chunk?: unknown, encoding?: unknown, cb?: unknown) => {
    const b = copying ? asBuffer(chunk, encoding) : null;
    if (b) chunks.push(Buffer.from(b));
    return end(chunk, encoding, cb);
  }) as typeof res.end;
  res.setHeader("x-stoke-cache", "miss");
  return new Promise((resolve, reject) => {
    res.once("finish", () => {
      copying = false;
      const headers = res.getHeaders() as Record<string, unknown>;
      resolve(
        storable(res.statusCode, headers) ? { status: res.statusCode, headers: replayHeaders(headers), body: Buffer.concat(chunks) } : null,
      );
    });
    res.once("close", () => resolve(null));
    handle(req, res).catch(reject);
  });
}

export function cachingHandler(handle: Handler, cache: ResponseCache): Handler {
  return async (req, res) => {
    const url = req.url ?? "/";
    const pathname = url.split("?", 1)[0];
    if (req.method !== "GET" || cache.capacityBytes === 0 || !cacheablePath(pathname)) {
      res.setHeader("x-stoke-cache", "pass");
      return handle(req, res);
    }
    const request = webRequest(req);
    if (hostRefusal(request)) return handle(req, res);
    const decision = await decide(request, pathname);
    if (!decision.ok) return handle(req, res);
    const key = responseKey({
      method: "GET",
      url,
      headers: req.headers,
      cookies: cookiesBut(req.headers.cookie, SESSION_COOKIE),
      actor: decision.actor,
      dataRevision: await currentDataRevision(db()),
    });
    const hit = cache.get(key);
    if (hit) {
      cache.hits++;
      return send(res, hit, "hit");
    }
    const pending = cache.pending(key);
    if (pending) {
      // A failed or unstorable making leaves this request to be made on its own.
      const shared = await pending.catch(() => null);
      if (shared) {
        cache.hits++;
        return send(res, shared, "shared");
      }
    }
    cache.misses++;
    await cache.fill(key, () => makeWhileCopying(handle, req, res));
  };
}

async function main(): Promise<void> {
  const hostname = process.env.HOST || "127.0.0.1";
  const port = Number(process.env.PORT || 3000);
  if (!Number.isInteger(port) || port < 1 || port > 65535)
    throw new SettingError(`PORT must be a whole number from 1 to 65535, not "${process.env.PORT}".`);
  let bytes: number;
  try {
    bytes = responseCacheBytes();
  } catch (e) {
    throw new SettingError((e as Error).message);
  }
  const dir = path.resolve(path.dirname(new URL(import.meta.url).pathname), "..", "..");
  const app = next({ dev: false, dir, hostname, port });
  await app.prepare();
  const handle = app.getRequestHandler() as Handler;
  const cache = new ResponseCache(bytes);
  const serve = cachingHandler(handle, cache);
  const server = http.createServer((req, res) => {
    serve(req, res).catch((e: unknown) => {
      console.error(e);
      if (!res.headersSent) {
        res.writeHead(500, { "content-type": "text/plain; charset=utf-8" });
        res.end("Internal error; the server's log has the details.");
      } else res.destroy();
    });
  });
  server.listen(port, hostname, () => {
    console.log(`Stoke: listening on http://${hostname}:${port} (response cache ${Math.round(cache.capacityBytes / 1048576)} MB)`);
  });
  const stop = () => server.close(() => process.exit(0));
  process.once("SIGTERM", stop);
  process.once("SIGINT", stop);
}

if (process.argv[1] && /serve\.m?[jt]s$/.test(process.argv[1])) {
  main().catch((e: unknown) => {
    // A setting refused by name (e.g. STOKE_RESPONSE_CACHE_MB) is said in one line; anything else with its stack.
    console.error(e instanceof SettingError ? `Stoke: ${e.message}` : e);
    process.exit(1);
  });
}
