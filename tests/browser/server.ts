/**
 * Global setup of the browser tests: starts the production server (dist/server/serve.mjs) on 127.0.0.1 (a free port) against a
 * fresh SQLite file in a temp folder; the server migrates and seeds it on start, as in
 * production. Stops the server (by its own process id) and removes the folder afterwards.
 */
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import type { TestProject } from "vitest/node";
import { projectRoot, startNextServer } from "../support/next-server";
import { createClient } from "../../lib/db/client";
import { seedFlameFixture } from "../support/flame-fixture";

declare module "vitest" {
  export interface ProvidedContext {
    baseURL: string;
    databaseUrl: string;
  }
}

const root = projectRoot;

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
  const server = await startNextServer({
    DATABASE_URL: databaseUrl,
    STOKE_SEED: "on",
    // an uncertainty run paced so that its progress can be seen on a fast machine: one step
    // (500 draws) per slice, 20 ms between slices
    STOKE_UNCERTAINTY_SLICE_MS: "0",
    STOKE_UNCERTAINTY_PAUSE_MS: "20",
  });
  const baseURL = server.baseURL;
  // The demo study's flame solves, precomputed (tests/fixtures/flames): no page waits for them, and
  // only a study with other fuels starts a background solve.
  const client = createClient(databaseUrl);
  await seedFlameFixture(client);
  await client.$disconnect();
  project.provide("baseURL", baseURL);
  project.provide("databaseUrl", databaseUrl);
  return async () => {
    await server.stop();
    fs.rmSync(dir, { recursive: true, force: true });
  };
}
