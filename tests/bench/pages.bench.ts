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
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { migrateSqlite } from "../../lib/db/migrate";
import { createClient } from "../../lib/db/client";
import { createStudy } from "../../lib/services/studies";
import { seedIfEmpty } from "../../seed/index";
import type { BenchResult } from "./bench-types";
import { projectRoot, startNextServer, type NextServer } from "../support/next-server";

const root = projectRoot;

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

export async function benchPages(): Promise<BenchResult[]> {
  if (!fs.existsSync(path.join(root, ".next", "BUILD_ID"))) {
    throw new Error("compare_page_ms needs a production build: run `npm run build` first.");
  }
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "stoke-bench-"));
  const url = `file:${path.join(dir, "bench.db")}`;
  let server: NextServer | null = null;
  try {
    const studyId = await seedTwentyScenarioStudy(url);
    server = await startNextServer({ DATABASE_URL: url, STOKE_SEED: "off", NODE_ENV: "production" });
    const page = `${server.baseURL}/studies/${studyId}`;

    const get = async () => {
      const t0 = performance.now();
      const res = await fetch(page);
      const html = await res.text();
      const ms = performance.now() - t0;
      if (!res.ok)
        throw new Error(
          `comparison page answered ${res.status}${res.status === 404 ? " (is the build older than the study pages? run `npm run build`)" : ""}`,
        );
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
    if (server) await server.stop();
    fs.rmSync(dir, { recursive: true, force: true });
  }
}
