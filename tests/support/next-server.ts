/**
 * Starting and stopping the production server (`npm start`'s dist/server/serve.mjs: Next behind
 * the response cache) for tests and benchmarks: the server bundle built afresh, a free loopback
 * port, a server process of our own (so it can be stopped by its id), waiting until it answers.
 * Needs a current `next build`.
 */
import { spawn, type ChildProcess } from "node:child_process";
import net from "node:net";
import path from "node:path";

export const projectRoot = path.resolve(import.meta.dirname, "../..");

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.once("error", reject);
    s.listen(0, "127.0.0.1", () => {
      const port = (s.address() as net.AddressInfo).port;
      s.close(() => resolve(port));
    });
  });
}

export interface NextServer {
  child: ChildProcess;
  baseURL: string;
  output: () => string;
  stop: () => Promise<void>;
}

let serverBuilt: Promise<string> | null = null;

/** Bundles the server once per test process (app/_server/build.mjs). */
function serverFile(): Promise<string> {
  serverBuilt ??= import(path.join(projectRoot, "app", "_server", "build.mjs")).then((m: { buildServer: () => Promise<string> }) =>
    m.buildServer(),
  );
  return serverBuilt;
}

/** Starts the production server on 127.0.0.1 with the given environment and waits until `readyPath` answers. */
export async function startNextServer(env: Record<string, string>, readyPath = "/api/fuels", timeoutMs = 60_000): Promise<NextServer> {
  const [port, file] = await Promise.all([freePort(), serverFile()]);
  let output = "";
  const child = spawn(process.execPath, [file], {
    cwd: projectRoot,
    env: { ...process.env, NODE_ENV: "production", NEXT_TELEMETRY_DISABLED: "1", HOST: "127.0.0.1", PORT: String(port), ...env },
    stdio: ["ignore", "pipe", "pipe"],
  });
  child.stdout!.on("data", (d) => (output += d));
  child.stderr!.on("data", (d) => (output += d));
  const server: NextServer = { child, baseURL: `http://127.0.0.1:${port}`, output: () => output, stop: () => stopProcess(child) };
  const t0 = Date.now();
  while (Date.now() - t0 < timeoutMs) {
    if (child.exitCode !== null) throw new Error(`the server exited with ${child.exitCode}:\n${output}`);
    try {
      if ((await fetch(server.baseURL + readyPath)).ok) return server;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  await server.stop();
  throw new Error(`the server did not answer ${readyPath} within ${timeoutMs} ms:\n${output}`);
}

/** SIGTERM, then SIGKILL after 5 s. */
export async function stopProcess(child: ChildProcess): Promise<void> {
  if (child.exitCode !== null) return;
  child.kill("SIGTERM");
  await new Promise<void>((resolve) => {
    const timer = setTimeout(() => {
      if (child.exitCode === null) child.kill("SIGKILL");
      resolve();
    }, 5000);
    child.once("exit", () => {
      clearTimeout(timer);
      resolve();
    });
  });
}
