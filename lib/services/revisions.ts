/**
 * Issued study revisions. Issuing evaluates the live study once and stores a numbered, immutable
 * revision: the study file exactly as evaluated (plant, fuel definitions, the quotes used — already
 * in the study's currency —, settings), in canonical JSON with its SHA-256, the results, and what
 * the library supplied (fuel names and ids, price origins). A revision is re-evaluated from its
 * frozen inputs only, so its figures never move when the library changes; `stoke evaluate` on its
 * inputs gives the same results (fresh caches, sweep and tornado on, as the command line runs).
 */
import { recordChange } from "./change-log";
import { createHash } from "node:crypto";
import { inTransaction, type Db } from "../db/client";
import { findStudy } from "../db/study-rows";
import { findRevisionRow, insertRevision, latestRevisionRow, listRevisionRows, type StudyRevisionRow } from "../db/revision-rows";
import { canonicalJson, jsonDifferences } from "../formats/canonical-json";
import { STUDY_FORMAT, STUDY_FORMAT_VERSION, studySchema, type Study } from "../schemas/study";
import { labelOfPath } from "../schemas/labels";
import { createEvaluationCaches, evaluateStudy, type StudyResult } from "../study/evaluate";
import {
  evaluateStoredStudy,
  studyBundle,
  type EvaluateStoredOptions,
  type Evaluated,
  type StudyBundle,
  type ViewSettings,
} from "./studies";
import { ok, problem, problemFromError, type Result } from "./result";
import { flameLookup } from "./flames";
import type { FlameLookup } from "../plant/burner-flame";

/**
 * How a revision is evaluated, at issue and whenever it is shown again: as `stoke evaluate` does,
 * with the stored flame solves (content-keyed, so the same figures whenever they are read).
 */
export function evaluateFrozen(study: Study, flames?: FlameLookup): StudyResult {
  return evaluateStudy(study, { sweep: study.hydrogenSweep.enabled, tornado: true, caches: createEvaluationCaches(), flames });
}

/** The study file of a bundle, with its format tag, as stored in a revision. */
export function studyFile(study: Study): Study {
  return { ...study, format: STUDY_FORMAT, version: STUDY_FORMAT_VERSION };
}

export const sha256 = (text: string) => createHash("sha256").update(text, "utf8").digest("hex");

/** The hash a revision of the study's live inputs would carry (canonical study file, SHA-256); null when it cannot be assembled. */
export async function liveStudyHash(db: Db, studyId: number, asOf?: Date): Promise<string | null> {
  const loaded = await studyBundle(db, studyId, asOf ? { asOf } : {});
  return loaded.ok ? sha256(canonicalJson(studyFile(loaded.bundle.study))) : null;
}

type StoredMeta = Omit<StudyBundle["meta"], "updatedAt" | "revision">;

export interface RevisionSummary {
  number: number;
  hash: string;
  issuedAt: string;
  quotesUsed: number;
}

export interface RevisionView {
  studyId: number;
  number: number;
  hash: string;
  issuedAt: string;
  inputs: Study;
  results: StudyResult;
  library: StoredMeta;
}

/** Issues the next revision of a study: `{ revision, hash }`. A study that cannot be evaluated is not issued. */
export async function issueRevision(db: Db, studyId: number): Promise<Result<{ revision: number; hash: string }>> {
  const loaded = await studyBundle(db, studyId);
  if (!loaded.ok) return loaded;
  const inputs = canonicalJson(studyFile(loaded.bundle.study));
  let result: StudyResult;
  try {
    // Evaluate the stored document itself (canonical key order), exactly as it will be read again.
    result = evaluateFrozen(studySchema.parse(JSON.parse(inputs)), await flameLookup(db));
  } catch (e) {
    return problemFromError(e, {
      kind: "unprocessable",
      message: (s, field) => `The study cannot be issued: ${field ? `${field}: ` : ""}${s}.`,
    });
  }
  const { updatedAt: _u, revision: _r, ...meta } = loaded.bundle.meta;
  const hash = sha256(inputs);
  return inTransaction(db, async (tx) => {
    const row = await insertRevision(
      tx,
      studyId,
      { hash, inputs, results: JSON.stringify(result), meta: JSON.stringify(meta) },
      meta.quoteIds,
    );
    await recordChange(tx, {
      subject: { type: "study", id: studyId },
      entity: "study",
      entityId: studyId,
      action: "issue",
      summary: `revision ${row.number} issued (inputs SHA-256 ${row.hash.slice(0, 12)}…)`,
      after: { revision: row.number, hash: row.hash, quoteIds: meta.quoteIds },
    });
    return ok({ revision: row.number, hash: row.hash });
  });
}

export async function listRevisions(db: Db, studyId: number): Promise<Result<RevisionSummary[]>> {
  if (!(await findStudy(db, studyId))) return problem("not-found", `No study with id ${studyId}.`);
  const rows = await listRevisionRows(db, studyId);
  return ok(rows.map((r) => ({ number: r.number, hash: r.hash, issuedAt: r.createdAt.toISOString(), quotesUsed: r._count.quotes })));
}

function view(row: StudyRevisionRow): RevisionView {
  return {
    studyId: row.studyId,
    number: row.number,
    hash: row.hash,
    issuedAt: row.createdAt.toISOString(),
    inputs: JSON.parse(row.inputs) as Study,
    results: JSON.parse(row.results) as StudyResult,
    library: JSON.parse(row.meta) as StoredMeta,
  };
}

export async function getRevision(db: Db, studyId: number, number: number): Promise<Result<RevisionView>> {
  const row = await findRevisionRow(db, studyId, number);
  if (!row) return problem("not-found", `Study ${studyId} has no revision ${number}.`);
  return ok(view(row));
}

/** The report's data: the live study evaluated, or a revision evaluated from its frozen inputs. */
export async function studyReportData(
  db: Db,
  id: number,
  opts: ViewSettings & { revision?: number; sweep?: EvaluateStoredOptions["sweep"]; tornado?: boolean; solveFlames?: boolean } = {},
): Promise<Evaluated> {
  if (opts.revision === undefined) return evaluateStoredStudy(db, id, opts);
  const row = await findRevisionRow(db, id, opts.revision);
  if (!row) return problem("not-found", `Study ${id} has no revision ${opts.revision}.`);
  const parsed = studySchema.safeParse(JSON.parse(row.inputs));
  if (!parsed.success) return problem("unprocessable", `Revision ${row.number} of study ${id} cannot be read.`, {});
  const study: Study = {
    ...parsed.data,
    rankingMetric: opts.metric ?? parsed.data.rankingMetric,
    includeUpstream: opts.includeUpstream ?? parsed.data.includeUpstream,
  };
  const stored = JSON.parse(row.meta) as StoredMeta;
  try {
    const result = evaluateFrozen(study, await flameLookup(db));
    return {
      ok: true,
      bundle: {
        study,
        meta: { ...stored, updatedAt: null, revision: { number: row.number, hash: row.hash, issuedAt: row.createdAt.toISOString() } },
      },
      result,
    };
  } catch (e) {
    return problemFromError(e, {
      kind: "unprocessable",
      message: (s, field) => `Revision ${row.number} cannot be evaluated: ${field ? `${field}: ` : ""}${s}.`,
    });
  }
}

export interface LiveDifference {
  path: string;
  label: string;
  before: unknown;
  after: unknown;
}

export interface RevisionStatus {
  latest: { number: number; hash: string; issuedAt: string } | null;
  /** The live inputs' hash (null when the live study cannot be assembled). */
  liveHash: string | null;
  differences: LiveDifference[];
  /** Why the live study could not be compared. */
  problem: string | null;
}

/** Whether the live inputs differ from the latest revision, and what differs (field paths in words). */
export async function revisionStatus(db: Db, studyId: number): Promise<RevisionStatus> {
  const latest = await latestRevisionRow(db, studyId);
  const loaded = await studyBundle(db, studyId);
  const head = latest ? { number: latest.number, hash: latest.hash, issuedAt: latest.createdAt.toISOString() } : null;
  if (!loaded.ok) return { latest: head, liveHash: null, differences: [], problem: loaded.message };
  const live = canonicalJson(studyFile(loaded.bundle.study));
  const liveHash = sha256(live);
  if (!latest || latest.hash === liveHash) return { latest: head, liveHash, differences: [], problem: null };
  const differences = jsonDifferences(JSON.parse(latest.inputs), JSON.parse(live), 40).map((d) => ({ ...d, label: labelOfPath(d.path) }));
  return { latest: head, liveHash, differences, problem: null };
}
