/**
 * Study and scenario rows: the queries, and one mapper per direction between the rows and a stored
 * study (`studyFromRows`, `studyColumns` / `scenarioColumns`). JSON columns (sensitivity ranges,
 * scenario overrides) are read through their schemas; a value that cannot be read is reported in
 * `unreadable` under its field, never silently replaced.
 */
import type { z } from "zod";
import type { Scenario as ScenarioRow, Study as StudyRow } from "./generated/client";
import type { DbOrTx, Tx } from "./client";
import { WITH_QUOTES } from "./fuel-rows";
import { groupBy, inChunks } from "./chunks";
import { operatingOverridesSchema, type OperatingOverrides } from "../schemas/plant";
import { RANKING_METRICS, sensitivitySchema, type RankingMetric } from "../schemas/study";
import type { StudyRecord } from "../schemas/study-record";

export type { ScenarioRow, StudyRow };

type Sensitivity = z.output<typeof sensitivitySchema>;

/** Baseline first, then the candidates in their order. */
const SCENARIO_ORDER = [{ isBaseline: "desc" as const }, { position: "asc" as const }, { id: "asc" as const }];

/* ------------------------------------------------------------------ row → domain */

export interface StoredScenario {
  id: number;
  name: string;
  fuelId: number;
  priceQuoteId: number | null;
  /** The quote rule's date (YYYY-MM-DD), null = the day of evaluation. */
  priceValidOn: string | null;
  capex: number;
  fixedOpexChange: number;
  overrides: OperatingOverrides;
}

export interface StoredStudy {
  id: number;
  plantId: number;
  name: string;
  currency: string;
  carbonPrice_per_t: number;
  discountRatePercent: number;
  horizonYears: number;
  priceEscalationPercent: number;
  rankingMetric: RankingMetric;
  includeUpstream: boolean;
  sensitivity: Sensitivity;
  notes: string;
  reportTitle: string;
  preparedFor: string;
  preparedBy: string;
  reportDate: string | null;
  reportNotes: string;
  /** The hydrogen the sweep blends (a stored gas); null = none chosen. */
  hydrogenFuelId: number | null;
  isDemo: boolean;
  updatedAt: Date;
  baseline: StoredScenario | null;
  scenarios: StoredScenario[];
  /**
   * Stored values that could not be read, by field (`sensitivity`, `rankingMetric`,
   * `scenarios.2.overrides`): the value beside it is the schema's default, shown only so that the
   * study can be opened and saved again.
   */
  unreadable: Record<string, string>;
}

function readJson<S extends z.ZodType>(text: string, schema: S): { value: z.output<S> } | { error: string } {
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch (e) {
    if (!(e instanceof SyntaxError)) throw e;
    return { error: "the stored value is not valid JSON" };
  }
  const parsed = schema.safeParse(raw);
  if (parsed.success) return { value: parsed.data };
  const issue = parsed.error.issues[0];
  return { error: `the stored value does not fit: ${issue.path.length ? `${issue.path.join(".")}: ` : ""}${issue.message}` };
}

const SENSITIVITY_DEFAULTS: Sensitivity = sensitivitySchema.parse({});
const isRankingMetric = (m: string): m is RankingMetric => (RANKING_METRICS as readonly string[]).includes(m);

/** The stored study: its columns, its scenarios (overrides read) and what could not be read. */
export function studyFromRows(row: StudyRow, scenarioRows: ScenarioRow[]): StoredStudy {
  const unreadable: Record<string, string> = {};
  const sensitivity = readJson(row.sensitivityRanges, sensitivitySchema);
  if ("error" in sensitivity) unreadable.sensitivity = `${sensitivity.error}; edit the study to set the ranges again`;
  if (!isRankingMetric(row.rankingMetric))
    unreadable.rankingMetric = `"${row.rankingMetric}" is not a ranking metric; choose one and save the study`;
  const ordered = [...scenarioRows].sort((a, b) => Number(b.isBaseline) - Number(a.isBaseline) || a.position - b.position || a.id - b.id);
  const scenario = (s: ScenarioRow, field: string): StoredScenario => {
    const overrides = readJson(s.overrides, operatingOverridesSchema);
    if ("error" in overrides)
      unreadable[`${field}.overrides`] = `${overrides.error}; edit the scenario's operating changes and save the study`;
    return {
      id: s.id,
      name: s.name,
      fuelId: s.fuelId,
      priceQuoteId: s.priceQuoteId,
      priceValidOn: s.priceValidOn ? s.priceValidOn.toISOString().slice(0, 10) : null,
      capex: s.capex,
      fixedOpexChange: s.fixedOpexChange,
      overrides: "value" in overrides ? overrides.value : {},
    };
  };
  const base = ordered.find((s) => s.isBaseline);
  return {
    id: row.id,
    plantId: row.plantId,
    name: row.name,
    currency: row.currency,
    carbonPrice_per_t: row.carbonPrice_per_t,
    discountRatePercent: row.discountRatePercent,
    horizonYears: row.horizonYears,
    priceEscalationPercent: row.priceEscalationPercent,
    rankingMetric: isRankingMetric(row.rankingMetric) ? row.rankingMetric : RANKING_METRICS[0],
    includeUpstream: row.includeUpstream,
    sensitivity: "value" in sensitivity ? sensitivity.value : SENSITIVITY_DEFAULTS,
    notes: row.notes,
    reportTitle: row.reportTitle,
    preparedFor: row.preparedFor,
    preparedBy: row.preparedBy,
    reportDate: row.reportDate,
    reportNotes: row.reportNotes,
    hydrogenFuelId: row.hydrogenFuelId,
    isDemo: row.isDemo,
    updatedAt: row.updatedAt,
    baseline: base ? scenario(base, "baseline") : null,
    scenarios: ordered.filter((s) => !s.isBaseline).map((s, i) => scenario(s, `scenarios.${i}`)),
    unreadable,
  };
}

/* ------------------------------------------------------------------ domain → row */

export function studyColumns(r: StudyRecord) {
  return {
    plantId: r.plantId,
    name: r.name,
    currency: r.currency,
    carbonPrice_per_t: r.carbonPrice_per_t,
    discountRatePercent: r.discountRatePercent,
    horizonYears: r.horizonYears,
    priceEscalationPercent: r.priceEscalationPercent,
    rankingMetric: r.rankingMetric,
    includeUpstream: r.includeUpstream,
    sensitivityRanges: JSON.stringify(r.sensitivity),
    notes: r.notes,
    reportTitle: r.reportTitle,
    preparedFor: r.preparedFor,
    preparedBy: r.preparedBy,
    reportDate: r.reportDate ?? null,
    reportNotes: r.reportNotes,
    hydrogenFuelId: r.hydrogenFuelId ?? null,
  };
}

/** The scenario rows of a study record: the baseline at position 0, the candidates after it. */
export function scenarioColumns(studyId: number, r: StudyRecord) {
  return [{ ...r.baseline, isBaseline: true }, ...r.scenarios.map((s) => ({ ...s, isBaseline: false }))].map((s, position) => ({
    studyId,
    name: s.name,
    fuelId: s.fuelId,
    priceQuoteId: s.priceQuoteId ?? null,
    priceValidOn: s.priceValidOn ? new Date(`${s.priceValidOn}T00:00:00Z`) : null,
    capex: s.capex,
    fixedOpexChange: s.fixedOpexChange,
    overrides: JSON.stringify(s.overrides ?? {}),
    isBaseline: s.isBaseline,
    position,
  }));
}

/* ------------------------------------------------------------------ queries */

/** Rows not in the trash. */
const LIVE = { deletedAt: null };

/** A study in the trash. */
export function findTrashedStudy(db: DbOrTx, id: number): Promise<StudyRow | null> {
  return db.study.findFirst({ where: { id, deletedAt: { not: null } } });
}

/** Studies in the trash with their plant's name, latest first. */
export function trashedStudies(db: DbOrTx) {
  return db.study.findMany({
    where: { deletedAt: { not: null } },
    orderBy: [{ deletedAt: "desc" }, { id: "desc" }],
    include: { plant: { select: { id: true, name: true, deletedAt: true } } },
  });
}

/** Moves a study to the trash (`at` set) or back (`at` null). */
export function setStudyTrashed(tx: Tx, id: number, at: Date | null, by: string | null): Promise<StudyRow> {
  return tx.study.update({ where: { id }, data: { deletedAt: at, deletedBy: by } });
}

/** A study with its plant (and the plant's baseline fuel name) and its scenarios with fuels, quotes and components' quotes. */
export function loadStudyGraph(db: DbOrTx, id: number) {
  return db.study.findUnique({
    where: { id, ...LIVE },
    include: {
      plant: { include: { baselineFuel: { select: { id: true, name: true } } } },
      hydrogenFuel: { include: WITH_QUOTES },
      scenarios: { orderBy: SCENARIO_ORDER, include: { fuel: { include: WITH_QUOTES }, priceQuote: true } },
    },
  });
}
export type StudyGraphRow = NonNullable<Awaited<ReturnType<typeof loadStudyGraph>>>;

/** A study with its scenario rows, live or in the trash. */
export function findStudyWithScenariosAny(db: DbOrTx, id: number) {
  return db.study.findUnique({ where: { id }, include: { scenarios: { orderBy: SCENARIO_ORDER } } });
}

/** A study with its scenario rows. */
export function findStudyWithScenarios(db: DbOrTx, id: number) {
  return db.study.findUnique({ where: { id, ...LIVE }, include: { scenarios: { orderBy: SCENARIO_ORDER } } });
}

export function findStudy(db: DbOrTx, id: number): Promise<StudyRow | null> {
  return db.study.findUnique({ where: { id, ...LIVE } });
}

/** The header a study's pages show: name, plant, currency, number of scenarios. */
export function studyHeader(db: DbOrTx, id: number) {
  return db.study.findUnique({
    where: { id, ...LIVE },
    select: {
      id: true,
      name: true,
      isDemo: true,
      currency: true,
      plant: { select: { id: true, name: true } },
      _count: { select: { scenarios: true } },
    },
  });
}

/**
 * Studies (optionally of one plant) by plant and name, with the plant's name and each scenario's
 * name, role and fuel kind; a page of them when `page` is given. Relations in chunked queries.
 */
export async function listStudyRows(db: DbOrTx, plantId?: number, page?: { offset: number; limit: number }) {
  const rows = await db.study.findMany({
    where: plantId ? { plantId, ...LIVE } : LIVE,
    orderBy: [{ plant: { name: "asc" } }, { name: "asc" }, { id: "asc" }],
    ...(page ? { skip: page.offset, take: page.limit } : {}),
  });
  const plants = new Map(
    (
      await inChunks(
        rows.map((r) => r.plantId),
        (chunk) => db.plant.findMany({ where: { id: { in: chunk } }, select: { id: true, name: true } }),
      )
    ).map((p) => [p.id, p.name]),
  );
  const scenarios = await inChunks(
    rows.map((r) => r.id),
    (chunk) =>
      db.scenario.findMany({
        where: { studyId: { in: chunk } },
        orderBy: [{ studyId: "asc" }, { position: "asc" }, { id: "asc" }],
        select: { studyId: true, name: true, isBaseline: true, fuelId: true },
      }),
  );
  const kinds = new Map(
    (
      await inChunks(
        scenarios.map((s) => s.fuelId),
        (chunk) => db.fuel.findMany({ where: { id: { in: chunk } }, select: { id: true, kind: true } }),
      )
    ).map((f) => [f.id, f.kind]),
  );
  const byStudy = groupBy(scenarios, (s) => s.studyId);
  return rows.map((r) => ({
    ...r,
    plant: { name: plants.get(r.plantId) ?? "" },
    scenarios: (byStudy.get(r.id) ?? []).map((s) => ({
      name: s.name,
      isBaseline: s.isBaseline,
      fuel: { kind: kinds.get(s.fuelId) ?? "" },
    })),
  }));
}

export function countStudies(db: DbOrTx, plantId?: number): Promise<number> {
  return db.study.count({ where: plantId ? { plantId, ...LIVE } : LIVE });
}

/** Ids and names of a plant's studies, those in the trash too (their names stay taken). */
export function studyNamesOfPlant(db: DbOrTx, plantId: number): Promise<{ id: number; name: string; deletedAt: Date | null }[]> {
  return db.study.findMany({ where: { plantId }, select: { id: true, name: true, deletedAt: true } });
}

export async function insertStudy(tx: Tx, r: StudyRecord): Promise<StudyRow> {
  const row = await tx.study.create({ data: studyColumns(r) });
  for (const data of scenarioColumns(row.id, r)) await tx.scenario.create({ data });
  return row;
}

export async function replaceStudy(tx: Tx, id: number, r: StudyRecord): Promise<StudyRow> {
  const row = await tx.study.update({ where: { id }, data: studyColumns(r) });
  await tx.scenario.deleteMany({ where: { studyId: id } });
  for (const data of scenarioColumns(id, r)) await tx.scenario.create({ data });
  return row;
}

export function deleteStudyRow(tx: Tx, id: number): Promise<StudyRow> {
  return tx.study.delete({ where: { id } });
}

/** Copies a study row and its scenario rows under a new name (not a demo). */
export async function copyStudy(tx: Tx, src: StudyRow & { scenarios: ScenarioRow[] }, name: string): Promise<StudyRow> {
  const { id: _id, createdAt: _c, updatedAt: _u, deletedAt: _d, deletedBy: _b, scenarios, ...columns } = src;
  const row = await tx.study.create({ data: { ...columns, name, isDemo: false } });
  for (const s of scenarios) {
    const { id: _sid, studyId: _st, createdAt: _sc, updatedAt: _su, ...sc } = s;
    await tx.scenario.create({ data: { ...sc, studyId: row.id } });
  }
  return row;
}

/** The most recently changed study that uses a fuel in a scenario: its name, currency and carbon price. */
export function latestStudyUsingFuel(db: DbOrTx, fuelId: number) {
  return db.study.findFirst({
    where: { scenarios: { some: { fuelId } }, ...LIVE },
    orderBy: [{ updatedAt: "desc" }, { id: "desc" }],
    select: { id: true, name: true, currency: true, carbonPrice_per_t: true },
  });
}
