/**
 * Stored Monte Carlo rankings, run off the request path. `startUncertaintyRun` checks the request,
 * then runs `uncertaintyRankingSteps` in slices of at most SLICE_MS between which the server answers
 * other requests; a job reports its progress (`uncertaintyJob`) and can be cancelled between two
 * slices. A finished run is stored (UncertaintyRun) with what was asked and the hash of the study
 * file it evaluated, so that its figures can be shown again — and printed with a revision whose
 * inputs carry the same hash — without recomputing; a run whose hash differs from the live study's
 * is stale (the inputs changed since).
 *
 * Jobs live in this server process only (a restart forgets running jobs, never stored runs).
 */
import { randomUUID } from "node:crypto";
import type { Db } from "../db/client";
import {
  findUncertaintyRun,
  insertUncertaintyRun,
  latestUncertaintyRun,
  listUncertaintyRunRows,
  type UncertaintyRunRow,
} from "../db/uncertainty-run-rows";
import { listRevisionRows } from "../db/revision-rows";
import { uncertaintyRankingSteps, type UncertaintyResult } from "../study/uncertainty";
import { pathAssumptions, type PathAssumptions } from "../study/price-paths";
import { createEvaluationCaches, type StudyResult } from "../study/evaluate";
import type { Study } from "../schemas/study";
import { liveStudyHash } from "./revisions";
import { ok, problem, type Problem, type Result } from "./result";
import { prepareUncertainty, uncertaintyProblem, type UncertaintyRequest, type UncertaintyRunSettings } from "./uncertainty";

/** Longest stretch of computation between two pauses, ms. */
export const SLICE_MS = 40;
/** How long a finished job's status stays readable, ms. */
const JOB_TTL_MS = 15 * 60_000;

export type JobState = "running" | "done" | "failed" | "cancelled";

export interface UncertaintyJob {
  id: string;
  studyId: number;
  state: JobState;
  phase: "queued" | "setup" | "draws" | "summary" | "storing";
  done: number;
  total: number;
  /** The stored run, once done. */
  runId: number | null;
  problem: Problem | null;
  startedAt: string;
  finishedAt: string | null;
}

interface JobEntry extends UncertaintyJob {
  cancelRequested: boolean;
  finishedMs: number | null;
}

const jobs = new Map<string, JobEntry>();

function forgetOldJobs(now: number): void {
  for (const [id, j] of jobs) if (j.finishedMs !== null && now - j.finishedMs > JOB_TTL_MS) jobs.delete(id);
}

const snapshot = (j: JobEntry): UncertaintyJob => {
  const { cancelRequested: _c, finishedMs: _f, ...view } = j;
  return { ...view };
};

/**
 * Pacing of runs, for a shared server that should favour other requests (and for the browser test,
 * which must see a run in progress on a fast machine): STOKE_UNCERTAINTY_SLICE_MS (longest slice,
 * default SLICE_MS) and STOKE_UNCERTAINTY_PAUSE_MS (pause between slices, default 0: the next turn
 * of the event loop).
 */
function pacing(env: NodeJS.ProcessEnv = process.env): { sliceMs: number; pauseMs: number } {
  const num = (v: string | undefined, fallback: number) => {
    const n = Number(v);
    return v !== undefined && v.trim() !== "" && Number.isFinite(n) && n >= 0 ? Math.min(n, 10_000) : fallback;
  };
  return { sliceMs: num(env.STOKE_UNCERTAINTY_SLICE_MS, SLICE_MS), pauseMs: num(env.STOKE_UNCERTAINTY_PAUSE_MS, 0) };
}
const nextTurn = (pauseMs: number) => new Promise<void>((resolve) => (pauseMs > 0 ? setTimeout(resolve, pauseMs) : setImmediate(resolve)));

/**
 * Starts a run of stored study `studyId`: answers at once with the job (or the problem of the
 * request, naming the field); the work goes on in slices and ends stored.
 */
export async function startUncertaintyRun(db: Db, studyId: number, req: UncertaintyRequest): Promise<Result<UncertaintyJob>> {
  const asOf = new Date();
  const prepared = await prepareUncertainty(db, studyId, { ...req, asOf });
  if (!prepared.ok) return prepared;
  const inputsHash = await liveStudyHash(db, studyId, asOf);
  if (inputsHash === null) return problem("unprocessable", `Study ${studyId} cannot be assembled.`);
  forgetOldJobs(Date.now());
  const job: JobEntry = {
    id: randomUUID(),
    studyId,
    state: "running",
    phase: "queued",
    done: 0,
    total: req.draws,
    runId: null,
    problem: null,
    startedAt: asOf.toISOString(),
    finishedAt: null,
    cancelRequested: false,
    finishedMs: null,
  };
  jobs.set(job.id, job);
  const finish = (state: JobState, p: Problem | null = null) => {
    job.state = state;
    job.problem = p;
    job.finishedMs = Date.now();
    job.finishedAt = new Date(job.finishedMs).toISOString();
  };
  const { study, options, settings } = prepared.value;
  void (async () => {
    let result: UncertaintyResult | null = null;
    const { sliceMs, pauseMs } = pacing();
    try {
      const steps = uncertaintyRankingSteps(study, options);
      for (;;) {
        await nextTurn(pauseMs);
        if (job.cancelRequested) return finish("cancelled");
        const t0 = performance.now();
        for (;;) {
          const s = steps.next();
          if (s.done) {
            result = s.value;
            break;
          }
          job.phase = s.value.phase;
          job.done = s.value.done;
          if (performance.now() - t0 > sliceMs) break;
        }
        if (result) break;
      }
      job.phase = "storing";
      job.done = job.total;
      const row = await insertUncertaintyRun(db, studyId, {
        inputsHash,
        settings: JSON.stringify(settings),
        results: JSON.stringify(result),
      });
      job.runId = row.id;
      finish("done");
    } catch (e) {
      try {
        finish("failed", uncertaintyProblem(e));
      } catch (bug) {
        // Not one of Stoke's errors: a bug. The job says so; the server log keeps the stack.
        console.error(bug);
        finish("failed", problem("unprocessable", "The uncertainty ranking failed with an internal error."));
      }
    }
  })();
  return ok(snapshot(job));
}

/** A job's progress (null when unknown or forgotten). */
export function uncertaintyJob(studyId: number, jobId: string): UncertaintyJob | null {
  const j = jobs.get(jobId);
  return j && j.studyId === studyId ? snapshot(j) : null;
}

/** Asks a running job to stop before its next slice; answers the job (null when unknown). */
export function cancelUncertaintyJob(studyId: number, jobId: string): UncertaintyJob | null {
  const j = jobs.get(jobId);
  if (!j || j.studyId !== studyId) return null;
  if (j.state === "running") j.cancelRequested = true;
  return snapshot(j);
}

export interface StoredRunSummary {
  id: number;
  createdAt: string;
  inputsHash: string;
  settings: UncertaintyRunSettings;
  /** The inputs changed since the run (its hash is not the live study's). */
  stale: boolean;
  /** Revisions whose inputs are the ones the run evaluated. */
  revisions: number[];
}

export interface StoredRun extends StoredRunSummary {
  result: UncertaintyResult;
}

async function context(db: Db, studyId: number) {
  const [live, revisions] = await Promise.all([liveStudyHash(db, studyId), listRevisionRows(db, studyId)]);
  return { live, revisions };
}

function summary(
  row: Pick<UncertaintyRunRow, "id" | "createdAt" | "inputsHash" | "settings">,
  ctx: { live: string | null; revisions: { number: number; hash: string }[] },
): StoredRunSummary {
  return {
    id: row.id,
    createdAt: row.createdAt.toISOString(),
    inputsHash: row.inputsHash,
    settings: JSON.parse(row.settings) as UncertaintyRunSettings,
    stale: row.inputsHash !== ctx.live,
    revisions: ctx.revisions
      .filter((r) => r.hash === row.inputsHash)
      .map((r) => r.number)
      .sort((a, b) => a - b),
  };
}

const full = (row: UncertaintyRunRow, ctx: Awaited<ReturnType<typeof context>>): StoredRun => ({
  ...summary(row, ctx),
  result: JSON.parse(row.results) as UncertaintyResult,
});

export async function listUncertaintyRuns(db: Db, studyId: number): Promise<StoredRunSummary[]> {
  const [rows, ctx] = await Promise.all([listUncertaintyRunRows(db, studyId), context(db, studyId)]);
  return rows.map((r) => summary(r, ctx));
}

export async function getUncertaintyRun(db: Db, studyId: number, runId: number): Promise<Result<StoredRun>> {
  const row = await findUncertaintyRun(db, studyId, runId);
  if (!row) return problem("not-found", `Study ${studyId} has no stored uncertainty run ${runId}.`);
  return ok(full(row, await context(db, studyId)));
}

/**
 * The run to show beside a study's figures: for a revision, the newest run on exactly its inputs
 * (same hash; null when none was made); for the live study, its newest run (stale or not).
 */
export async function runForReport(db: Db, studyId: number, revisionHash?: string): Promise<StoredRun | null> {
  const row = await latestUncertaintyRun(db, studyId, revisionHash);
  return row ? full(row, await context(db, studyId)) : null;
}

export interface ReportUncertainty {
  /** The price and carbon paths the figures use. */
  paths: PathAssumptions;
  /** The stored run to print: for a revision, the newest on exactly its inputs; for the live study, the newest (maybe stale). */
  run: StoredRun | null;
}

/** What the report prints about paths and uncertainty, beside an evaluated study (live or a revision). */
export async function reportUncertainty(
  db: Db,
  studyId: number,
  evaluated: { study: Study; result: StudyResult; revisionHash: string | null },
): Promise<ReportUncertainty> {
  const { study, result, revisionHash } = evaluated;
  const paths = pathAssumptions(study, [result.baseline, ...result.scenarios], createEvaluationCaches());
  return { paths, run: await runForReport(db, studyId, revisionHash ?? undefined) };
}
