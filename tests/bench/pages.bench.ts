/**
 * Benchmark of the decision pages against the production server.
 *
 * - compare_page_ms: server response time of the comparison page (`/studies/{id}`, the full
 *   streamed HTML) for a 20-scenario study of the demo boiler, measured from the request to the
 *   last byte, 40 requests after 5 warm-up requests, against `next start` on 127.0.0.1 and a fresh
 *   SQLite file in a temp folder.
 *
 * Needs a production build (`npm run build`); it does not build one.
 */
import { spawn, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";
import { migrateSqlite } from "../../lib/db/migrate";
import { createClient } from "../../lib/db/client";
import { createStudy } from "../../lib/db/studies";
import { seedIfEmpty } from "../../seed/index";
import type { BenchResult } from "./bench-types";

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

/** The demo database plus a study of Boiler 1 with 20 candidates (every other library fuel, hydrogen blends at several capex levels). */
async function seedTwentyScenarioStudy(url: string): Promise<number> {
  migrateSqlite({ databaseUrl: url });
  const db = createClient(url);
  try {
    await seedIfEmpty(db);
    const plant = await db.plant.findFirstOrThrow({ where: { name: "Boiler 1 (gas)" } });
    const fuels = await db.fuel.findMany({ orderBy: { id: "asc" } });
    const byName = new Map(fuels.map((f) => [f.name, f.id]));
    const baselineId = plant.baselineFuelId!;
    const candidates: { name: string; fuelId: number; capex: number }[] = fuels
      .filter((f) => f.id !== baselineId)
      .map((f, i) => ({ name: f.name, fuelId: f.id, capex: 20_000 * (i + 1) }));
    for (const [share, capex] of [
      ["10", 120_000],
      ["20", 240_000],
      ["30", 480_000],
      ["20", 90_000],
    ] as const) {
      if (candidates.length >= 20) break;
      candidates.push({ name: `${share} % H2, capex ${capex}`, fuelId: byName.get(`Natural gas + ${share} % H2`)!, capex });
    }
    const r = await createStudy(db, {
      plantId: plant.id,
      name: "Twenty options (benchmark)",
      currency: "EUR",
      carbonPrice_per_t: 80,
      discountRatePercent: 8,
      horizonYears: 15,
      priceEscalationPercent: 2,
      rankingMetric: "cost-per-useful-MWh",
      baseline: { name: "Today", fuelId: baselineId },
      scenarios: candidates.slice(0, 20),
    });
    if (!r.ok) throw new Error(`benchmark study rejected: ${r.message} ${JSON.stringify(r.fieldErrors)}`);
    const n = await db.scenario.count({ where: { studyId: r.value.id, isBaseline: false } });
    if (n !== 20) throw new Error(`benchmark study has ${n} candidates, expected 20`);
    return r.value.id;
  } finally {
    await db.$disconnect();
  }
}

async function waitFor(url: string, child: ChildProcess, log: () => string, timeoutMs = 60_000): Promise<void> {
  const t0 = Date.now();
  while (Date.now() - t0 < timeoutMs) {
    if (child.exitCode !== null) throw new Error(`next start exited with ${child.exitCode}:\n${log()}`);
    try {
      if ((await fetch(url)).ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`next start did not answer ${url} within ${timeoutMs} ms:\n${log()}`);
}

async function stop(child: ChildProcess): Promise<void> {
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

export async function benchPages(): Promise<BenchResult[]> {
  if (!fs.existsSync(path.join(root, ".next", "BUILD_ID"))) {
    throw new Error("compare_page_ms needs a production build: run `npm run build` first.");
  }
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "stoke-bench-"));
  const url = `file:${path.join(dir, "bench.db")}`;
  let child: ChildProcess | null = null;
  try {
    const studyId = await seedTwentyScenarioStudy(url);
    const port = await freePort();
    let output = "";
    child = spawn(path.join(root, "node_modules", ".bin", "next"), ["start", "-H", "127.0.0.1", "-p", String(port)], {
      cwd: root,
      env: { ...process.env, DATABASE_URL: url, NEXT_TELEMETRY_DISABLED: "1", STOKE_SEED: "off", NODE_ENV: "production" },
      stdio: ["ignore", "pipe", "pipe"],
    });
    child.stdout!.on("data", (d) => (output += d));
    child.stderr!.on("data", (d) => (output += d));
    const page = `http://127.0.0.1:${port}/studies/${studyId}`;
    await waitFor(`http://127.0.0.1:${port}/api/fuels`, child, () => output);

    const get = async () => {
      const t0 = performance.now();
      const res = await fetch(page);
      const html = await res.text();
      const ms = performance.now() - t0;
      if (!res.ok) throw new Error(`comparison page answered ${res.status}${res.status === 404 ? " (is the build older than the study pages? run `npm run build`)" : ""}`);
      // The streamed page must hold the ranked table with all 21 scenarios, not just the loading state.
      const rows = html.match(/data-scenario="/g)?.length ?? 0;
      if (rows < 21) throw new Error(`comparison page shows ${rows} scenario rows, expected at least 21`);
      return ms;
    };
    for (let i = 0; i < 5; i++) await get();
    const samples: number[] = [];
    for (let i = 0; i < 40; i++) samples.push(await get());
    return [{ name: "compare_page_ms", unit: "ms", samples }];
  } finally {
    if (child) await stop(child);
    fs.rmSync(dir, { recursive: true, force: true });
  }
}
