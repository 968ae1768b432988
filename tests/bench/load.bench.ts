/**
 * Speed under load against the production server (`npm start`'s server, on 127.0.0.1, a fresh SQLite file
 * seeded with the invented demo): CLIENTS concurrent clients, each sending its next request as soon
 * as the previous one has answered, for DURATION_S seconds per address.
 *
 * - compare_page_p95_ms: 95th percentile response time of the comparison page of the demo study
 *   (`/studies/{id}`, the whole streamed HTML); min and max of all its requests beside it.
 * - fuels_api_p95_ms: the same for `GET /api/fuels` (the demo library with figures and prices).
 * - *_rps: answered requests per second; *_errors: answers that were not 200 or failed;
 * - server_rss_mb: the server's resident memory (its process tree) at the end of each run, and
 *   its largest value sampled every 250 ms.
 *
 * The load generator runs on the same machine as the server and takes CPU from it. Needs a current
 * production build (`npm run build`); it does not build one.
 */
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { migrateSqlite } from "../../lib/db/migrate";
import { createClient } from "../../lib/db/client";
import { seedIfEmpty } from "../../seed/index";
import type { BenchResult } from "./bench-types";
import { projectRoot, startNextServer, type NextServer } from "../support/next-server";

const CLIENTS = Number(process.env.STOKE_BENCH_CLIENTS ?? 20);
const DURATION_S = Number(process.env.STOKE_BENCH_SECONDS ?? 15);
const DEMO_STUDY = "Hydrogen blending and biomethane"; // seed/demo.ts

/** Resident memory of a process and its descendants, MB (Linux /proc). */
function treeRssMb(pid: number): number {
  let kb = 0;
  const visit = (p: number) => {
    try {
      const status = fs.readFileSync(`/proc/${p}/status`, "utf8");
      kb += Number(/VmRSS:\s+(\d+)/.exec(status)?.[1] ?? 0);
      for (const task of fs.readdirSync(`/proc/${p}/task`)) {
        const children = fs.readFileSync(`/proc/${p}/task/${task}/children`, "utf8").trim();
        for (const c of children ? children.split(/\s+/) : []) visit(Number(c));
      }
    } catch {
      // the process ended meanwhile
    }
  };
  visit(pid);
  return kb / 1024;
}

interface LoadRun {
  latencies: number[];
  errors: number;
  seconds: number;
  rssPeakMb: number;
  rssEndMb: number;
}

async function load(url: string, check: (body: string) => boolean, pid: number): Promise<LoadRun> {
  const latencies: number[] = [];
  let errors = 0;
  let rssPeakMb = 0;
  const sampler = setInterval(() => {
    rssPeakMb = Math.max(rssPeakMb, treeRssMb(pid));
  }, 250);
  const t0 = performance.now();
  const end = t0 + DURATION_S * 1000;
  const client = async () => {
    while (performance.now() < end) {
      const s = performance.now();
      try {
        const res = await fetch(url);
        const body = await res.text();
        if (!res.ok || !check(body)) errors++;
        else latencies.push(performance.now() - s);
      } catch {
        errors++;
      }
    }
  };
  await Promise.all(Array.from({ length: CLIENTS }, client));
  const seconds = (performance.now() - t0) / 1000;
  clearInterval(sampler);
  const rssEndMb = treeRssMb(pid);
  return { latencies, errors, seconds, rssPeakMb: Math.max(rssPeakMb, rssEndMb), rssEndMb };
}

function percentile(v: number[], p: number): number {
  if (v.length === 0) return Number.NaN;
  const s = [...v].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.ceil((p / 100) * s.length) - 1)];
}

function report(prefix: string, r: LoadRun): BenchResult[] {
  return [
    { name: `${prefix}_p95_ms`, unit: "ms", samples: r.latencies, value: percentile(r.latencies, 95) },
    { name: `${prefix}_rps`, unit: "req/s", samples: [r.latencies.length / r.seconds] },
    { name: `${prefix}_errors`, unit: "count", samples: [r.errors] },
    { name: `${prefix}_server_rss_mb`, unit: "MB", samples: [r.rssEndMb, r.rssPeakMb], value: r.rssPeakMb },
  ];
}

/** Waits until the study's flame solves are all stored (10 minutes at most). */
async function flamesSolved(url: string): Promise<void> {
  const t0 = performance.now();
  for (;;) {
    const p = (await (await fetch(url)).json()) as { pending: number; job: { running: boolean; problem: string | null } };
    if (p.pending === 0) return;
    if (!p.job.running && p.job.problem) throw new Error(`the demo study's flame solves failed: ${p.job.problem}`);
    if (performance.now() - t0 > 600_000) throw new Error("the demo study's flame solves took more than 10 minutes");
    await new Promise((r) => setTimeout(r, 1000));
  }
}

export async function benchLoad(): Promise<BenchResult[]> {
  if (!fs.existsSync(path.join(projectRoot, ".next", "BUILD_ID"))) {
    throw new Error("compare_page_p95_ms needs a production build: run `npm run build` first.");
  }
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "stoke-load-"));
  const url = `file:${path.join(dir, "load.db")}`;
  let server: NextServer | null = null;
  try {
    migrateSqlite({ databaseUrl: url });
    const db = createClient(url);
    let studyId: number;
    try {
      await seedIfEmpty(db);
      studyId = (await db.study.findFirstOrThrow({ where: { name: DEMO_STUDY } })).id;
    } finally {
      await db.$disconnect();
    }
    server = await startNextServer({ DATABASE_URL: url, STOKE_SEED: "off", NODE_ENV: "production" });
    const pid = server.child.pid!;
    const compare = `${server.baseURL}/studies/${studyId}`;
    const fuels = `${server.baseURL}/api/fuels`;
    const isComparison = (html: string) => (html.match(/data-scenario="/g)?.length ?? 0) >= 5;
    const isFuelList = (text: string) => text.startsWith("{") && text.includes('"fuels":[');
    // Warm-up: compile paths, fill caches, as a running server would be.
    for (let i = 0; i < 5; i++) {
      await (await fetch(compare)).text();
      await (await fetch(fuels)).text();
    }
    // The first look at the demo study queues its flame solves in the background; a running
    // server has them stored. Wait for them, so the child process solving them does not share
    // the CPU with the measurement.
    await flamesSolved(`${server.baseURL}/api/studies/${studyId}/flames`);
    await (await fetch(compare)).text();
    const out: BenchResult[] = [];
    out.push(...report("compare_page", await load(compare, isComparison, pid)));
    out.push(...report("fuels_api", await load(fuels, isFuelList, pid)));
    return out;
  } finally {
    if (server) await server.stop();
    fs.rmSync(dir, { recursive: true, force: true });
  }
}
