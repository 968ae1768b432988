/**
 * Flame solves off the request path, cached in the database by content.
 *
 * - A solve is keyed by its request's canonical JSON with the engine's revision
 *   (lib/plant/burner-flame.ts), so a changed engine solves again; the row's key is
 *   the SHA-256 of that text. A row is written once and never changed; every study that needs the
 *   same flame finds it.
 * - `flameLookup(db)` brings this process's in-memory copy up to date (rows newer than the last
 *   read) and answers the evaluation's synchronous look-ups from it.
 * - `ensureFlameSolves(db, needs)` queues what is missing and runs it in a child process — the
 *   command line's `flame-speed --ndjson --warm-chain` (the same engine, each solve from its
 *   neighbour), records arriving one by one — so a page never waits for a flame and the server
 *   stays responsive. One job at a time per process; solves queued meanwhile run next.
 * - `STOKE_FLAME_SOLVES=off` stops new jobs (look-ups still answer from the database).
 */
import { spawn } from "node:child_process";
import { createHash } from "node:crypto";
import { existsSync } from "node:fs";
import { join } from "node:path";
import { createInterface } from "node:readline";
import type { Db } from "../db/client";
import { flameFiguresOf, type FlameFigures, type FlameLookup, type FlameOutcome } from "../plant/burner-flame";
import type { FlameSolveNeed } from "../study/evaluate";
import type { FlameSpeedResult } from "../flame/flame-speed";

export const flameKeyHash = (key: string) => createHash("sha256").update(key).digest("hex");

interface FlameState {
  cache: Map<string, FlameOutcome>;
  lastRead: Date | null;
  queue: FlameSolveNeed[];
  queued: Set<string>;
  running: { keys: string[]; done: number; startedAt: Date; pid: number | undefined } | null;
  lastProblem: string | null;
}

declare global {
  var __stokeFlames: FlameState | undefined;
}

function state(): FlameState {
  globalThis.__stokeFlames ??= { cache: new Map(), lastRead: null, queue: [], queued: new Set(), running: null, lastProblem: null };
  return globalThis.__stokeFlames;
}

function outcomeOfRow(r: { result: string | null; error: string | null }): FlameOutcome {
  if (r.result !== null) return JSON.parse(r.result) as FlameFigures;
  return { error: r.error ?? "the flame solve failed" };
}

/** The stored solves as a look-up (rows written since the last call are read first). */
export async function flameLookup(db: Db): Promise<FlameLookup> {
  const s = state();
  const rows = await db.flameSolve.findMany({
    where: s.lastRead ? { createdAt: { gte: s.lastRead } } : {},
    select: { request: true, result: true, error: true, createdAt: true },
  });
  for (const r of rows) {
    s.cache.set(r.request, outcomeOfRow(r));
    if (!s.lastRead || r.createdAt > s.lastRead) s.lastRead = r.createdAt;
  }
  // Outcomes are only ever added (a solve is written once): their count names the state.
  return { get: (key) => s.cache.get(key) };
}

/** Stores one outcome (once; a second writer of the same key changes nothing). */
export async function storeFlameOutcome(db: Db, key: string, outcome: FlameOutcome): Promise<void> {
  const isFailure = "error" in outcome;
  const row = await db.flameSolve.upsert({
    where: { key: flameKeyHash(key) },
    create: {
      key: flameKeyHash(key),
      request: key,
      result: isFailure ? null : JSON.stringify(outcome),
      error: isFailure ? outcome.error : null,
      cpuSeconds: isFailure ? null : outcome.cpuSeconds,
    },
    update: {},
  });
  // The stored row wins: a solve is written once, whoever comes second.
  state().cache.set(key, outcomeOfRow(row));
}

export interface FlameJobStatus {
  running: boolean;
  /** Solves of the running job done / in it, and those queued behind it. */
  done: number;
  inJob: number;
  queued: number;
  enabled: boolean;
  problem: string | null;
}

export function flameJobStatus(): FlameJobStatus {
  const s = state();
  return {
    running: s.running !== null,
    done: s.running?.done ?? 0,
    inJob: s.running?.keys.length ?? 0,
    queued: s.queue.length,
    enabled: flameSolvesEnabled(),
    problem: s.lastProblem,
  };
}

export const flameSolvesEnabled = () => process.env.STOKE_FLAME_SOLVES !== "off";

/** Queues the needs whose outcome is not known and starts a job if none runs. Returns how many were queued. */
export function ensureFlameSolves(db: Db, needs: readonly FlameSolveNeed[]): number {
  if (!flameSolvesEnabled()) return 0;
  const s = state();
  let added = 0;
  for (const n of needs) {
    if (s.cache.has(n.key) || s.queued.has(n.key)) continue;
    s.queue.push(n);
    s.queued.add(n.key);
    added++;
  }
  if (!s.running && s.queue.length) startJob(db);
  return added;
}

/** The command line that runs the solves: the bundle's launcher in this project. */
function solverCommand(): { cmd: string; args: string[] } {
  const launcher = join(process.cwd(), "lib", "cli", "launcher", "stoke.cjs");
  if (!existsSync(launcher)) throw new Error(`the flame solver's launcher is missing (${launcher})`);
  return { cmd: process.execPath, args: [launcher, "flame-speed", "--ndjson", "--warm-chain", "--no-progress"] };
}

/** Starts a job; a solver that cannot start is reported in the job status (the pages say so), not thrown at a page. */
function startJob(db: Db): void {
  const s = state();
  try {
    runJob(db);
  } catch (e) {
    s.lastProblem = `the flame solver could not start: ${(e as Error).message}`;
    s.running = null;
    for (const n of s.queue.splice(0, s.queue.length)) s.queued.delete(n.key);
  }
}

function runJob(db: Db): void {
  const s = state();
  const { cmd, args } = solverCommand();
  const batch = s.queue.splice(0, s.queue.length);
  const child = spawn(cmd, args, { stdio: ["pipe", "pipe", "pipe"], env: { ...process.env, STOKE_DEBUG: "" } });
  s.running = { keys: batch.map((b) => b.key), done: 0, startedAt: new Date(), pid: child.pid };
  s.lastProblem = null;
  let stderr = "";
  child.stderr.on("data", (d: Buffer) => {
    stderr = (stderr + d.toString()).slice(-2000);
  });
  const pending: Promise<void>[] = [];
  createInterface({ input: child.stdout }).on("line", (line) => {
    let rec: { line?: number; ok?: boolean; result?: FlameSpeedResult; error?: { message?: string; field?: string } };
    try {
      rec = JSON.parse(line);
    } catch {
      return;
    }
    const need = rec.line ? batch[rec.line - 1] : undefined;
    if (!need) return;
    const outcome: FlameOutcome =
      rec.ok && rec.result
        ? flameFiguresOf(rec.result)
        : { error: `${rec.error?.field ? `${rec.error.field}: ` : ""}${rec.error?.message ?? "the flame solve failed"}` };
    pending.push(
      storeFlameOutcome(db, need.key, outcome).then(
        () => {
          if (s.running) s.running.done++;
          s.queued.delete(need.key);
        },
        (e: unknown) => {
          s.lastProblem = `storing a flame solve failed: ${(e as Error).message}`;
        },
      ),
    );
  });
  child.on("error", (e) => {
    s.lastProblem = `the flame solver could not start: ${e.message}`;
    for (const b of batch) if (!s.cache.has(b.key)) s.queued.delete(b.key);
    s.running = null;
  });
  child.on("close", async (code) => {
    await Promise.allSettled(pending);
    // What the child left unsolved (it died) goes back to be asked for again by the next page view.
    for (const b of batch) if (!s.cache.has(b.key)) s.queued.delete(b.key);
    if (code !== 0 && code !== 1 && !s.lastProblem)
      s.lastProblem = `the flame solver stopped (exit ${code}): ${stderr.trim().split("\n").pop() ?? ""}`;
    s.running = null;
    if (s.queue.length) startJob(db);
  });
  child.stdin.end(`${batch.map((b) => JSON.stringify(b.request)).join("\n")}\n`);
}
