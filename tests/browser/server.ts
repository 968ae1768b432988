/**
 * Global setup of the browser tests: starts `next start` on 127.0.0.1 (a free port) against a
 * fresh SQLite file in a temp folder; the server migrates and seeds it on start, as in
 * production. Stops the server (by its own process id) and removes the folder afterwards.
 */
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";
import type { TestProject } from "vitest/node";

declare module "vitest" {
  export interface ProvidedContext {
    baseURL: string;
    databaseUrl: string;
  }
}

const root = path.resolve(import.meta.dirname, "../..");

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.once("error", reject);
    s.listen(0, "127.0.0.1", () => {
      const port = (s.address() as net.AddressInfo).port;
      s.close(() => resolve(port));
    });
  });
}

async function waitFor(url: string, child: ChildProcess, log: () => string, timeoutMs = 60_000): Promise<void> {
  const t0 = Date.now();
  while (Date.now() - t0 < timeoutMs) {
    if (child.exitCode !== null) throw new Error(`next start exited with ${child.exitCode}:\n${log()}`);
    try {
      const res = await fetch(url);
      if (res.ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`next start did not answer ${url} within ${timeoutMs} ms:\n${log()}`);
}

export default async function setup(project: TestProject): Promise<() => Promise<void>> {
  if (!fs.existsSync(path.join(root, ".next", "BUILD_ID"))) {
    const b = spawnSync(path.join(root, "node_modules", ".bin", "next"), ["build"], {
      cwd: root,
      stdio: "inherit",
      env: { ...process.env, NEXT_TELEMETRY_DISABLED: "1" },
    });
    if (b.status !== 0) throw new Error("next build failed");
  }
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "stoke-browser-"));
  const databaseUrl = `file:${path.join(dir, "browser.db")}`;
  const port = await freePort();
  let output = "";
  const child = spawn(path.join(root, "node_modules", ".bin", "next"), ["start", "-H", "127.0.0.1", "-p", String(port)], {
    cwd: root,
    env: { ...process.env, DATABASE_URL: databaseUrl, NEXT_TELEMETRY_DISABLED: "1", STOKE_SEED: "on" },
    stdio: ["ignore", "pipe", "pipe"],
  });
  child.stdout!.on("data", (d) => (output += d));
  child.stderr!.on("data", (d) => (output += d));
  const baseURL = `http://127.0.0.1:${port}`;
  try {
    await waitFor(`${baseURL}/api/fuels`, child, () => output);
  } catch (e) {
    child.kill("SIGTERM");
    throw e;
  }
  project.provide("baseURL", baseURL);
  project.provide("databaseUrl", databaseUrl);
  return async () => {
    if (child.exitCode === null) {
      child.kill("SIGTERM");
      await new Promise((r) => {
        const timer = setTimeout(() => {
          if (child.exitCode === null) child.kill("SIGKILL");
          r(null);
        }, 5000);
        child.once("exit", () => {
          clearTimeout(timer);
          r(null);
        });
      });
    }
    fs.rmSync(dir, { recursive: true, force: true });
  };
}
