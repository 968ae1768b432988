/**
 * Studies in the database: a study of one plant holds a baseline and candidate scenarios, each a
 * stored fuel or blend priced by a stored quote. This module validates and stores them (nothing
 * is stored from rejected input; errors name the field), duplicates and deletes them, and turns a
 * stored study into the self-contained study object that lib/study/evaluate.ts evaluates.
 */
import type { BlendComponent, Fuel, Plant as PlantRow, PriceQuote, PrismaClient, Scenario as ScenarioRow, Study as StudyRow } from "./generated/client";
import { fieldErrors } from "../schemas/fuel";
import type { FuelDefinition } from "../schemas/fuel";
import { sensitivitySchema, studySchema, type Study, type StudyInput, type StudyPriceInput } from "../schemas/study";
import { studyRecordSchema, type StudyRecord, type StudyRecordInput, type ScenarioRecord } from "../schemas/study-record";
import { operatingOverridesSchema } from "../schemas/plant";
import { RANKING_METRICS, type RankingMetric, type SensitivityRanges } from "../economics/sensitivity";
import { evaluateStudy, StudyInputError, type StudyResult } from "../study/evaluate";
import { sharedCaches } from "./eval-cache";
import { currentQuote, effectiveDefinition, fail, inTransaction, quoteJson, type FieldErrors, type Result, type Tx } from "./fuels";
import { plantInputFromRow } from "./plants";

/* ---------------------------------------------------------------- loading */

const quotesNewestFirst = { orderBy: [{ validFrom: "desc" as const }, { createdAt: "desc" as const }, { id: "desc" as const }] };

/** A fuel row with what pricing needs: its quotes and, for a blend, its components' quotes. */
type FuelForStudy = Fuel & {
  priceQuotes: PriceQuote[];
  components: (BlendComponent & { component: Fuel & { priceQuotes: PriceQuote[] } })[];
};

const fuelInclude = {
  priceQuotes: quotesNewestFirst,
  components: { orderBy: { position: "asc" as const }, include: { component: { include: { priceQuotes: quotesNewestFirst } } } },
};

type StudyWithAll = StudyRow & {
  plant: PlantRow & { baselineFuel: { id: number; name: string } | null };
  scenarios: (ScenarioRow & { fuel: FuelForStudy; priceQuote: PriceQuote | null })[];
};

async function loadStudy(db: PrismaClient | Tx, id: number): Promise<StudyWithAll | null> {
  return (await db.study.findUnique({
    where: { id },
    include: {
      plant: { include: { baselineFuel: { select: { id: true, name: true } } } },
      scenarios: { orderBy: [{ isBaseline: "desc" }, { position: "asc" }, { id: "asc" }], include: { fuel: { include: fuelInclude }, priceQuote: true } },
    },
  })) as StudyWithAll | null;
}

/* ---------------------------------------------------------------- pricing */

/** How a scenario is priced. */
export type PriceSource =
  | { kind: "quote"; quoteId: number; invented: boolean; label: string }
  | { kind: "current"; quoteId: number; invented: boolean; label: string }
  | { kind: "components"; quoteIds: number[]; invented: boolean; label: string }
  | { kind: "none"; invented: false; label: string };

function studyPrice(q: PriceQuote): StudyPriceInput {
  const j = quoteJson(q);
  return {
    amount: j.amount,
    currency: j.currency,
    unit: j.unit as StudyPriceInput["unit"],
    energyBasis: (j.energyBasis as "gross" | "net" | null) ?? null,
    meteringReference: (j.meteringReference as "0C" | "15C" | "20C" | "60F" | null) ?? null,
    transportAdder: j.transportAdder,
    handlingAdder: j.handlingAdder,
    validFrom: j.validFrom,
    sourceNote: j.sourceNote,
    isInvented: j.isInvented,
  };
}

function quoteInCurrency(quotes: PriceQuote[], currency: string, asOf: Date): PriceQuote | undefined {
  return currentQuote(
    quotes.filter((q) => q.currency === currency),
    asOf,
  );
}

function priceFor(
  fuel: FuelForStudy,
  chosen: PriceQuote | null,
  currency: string,
  asOf: Date,
): { price: StudyPriceInput | null; componentPrices: StudyPriceInput[] | null; source: PriceSource } {
  if (chosen) {
    return { price: studyPrice(chosen), componentPrices: null, source: { kind: "quote", quoteId: chosen.id, invented: chosen.isInvented, label: `quote of ${chosen.validFrom.toISOString().slice(0, 10)}` } };
  }
  const cur = quoteInCurrency(fuel.priceQuotes, currency, asOf);
  if (cur) {
    return { price: studyPrice(cur), componentPrices: null, source: { kind: "current", quoteId: cur.id, invented: cur.isInvented, label: `quote in force (${cur.validFrom.toISOString().slice(0, 10)})` } };
  }
  if (fuel.components.length) {
    const qs = fuel.components.map((c) => quoteInCurrency(c.component.priceQuotes, currency, asOf));
    if (qs.every((q): q is PriceQuote => q !== undefined)) {
      return {
        price: null,
        componentPrices: qs.map(studyPrice),
        source: { kind: "components", quoteIds: qs.map((q) => q.id), invented: qs.some((q) => q.isInvented), label: "components' quotes in force, mixed per kg" },
      };
    }
  }
  return { price: null, componentPrices: null, source: { kind: "none", invented: false, label: `no quote in ${currency}` } };
}

/** The library's pure hydrogen (a gas of H2 only), if there is one, with its quotes. */
async function libraryHydrogen(db: PrismaClient | Tx): Promise<(Fuel & { priceQuotes: PriceQuote[] }) | null> {
  const gases = await db.fuel.findMany({ where: { kind: "gas", definition: { contains: '"H2"' } }, include: { priceQuotes: quotesNewestFirst }, orderBy: { id: "asc" } });
  for (const g of gases) {
    try {
      const def = JSON.parse(g.definition) as { composition?: Record<string, number> };
      const keys = Object.keys(def.composition ?? {});
      if (keys.length === 1 && keys[0] === "H2") return g;
    } catch {
      /* a broken record is not the hydrogen */
    }
  }
  return null;
}

/* ---------------------------------------------------------------- building the study */

export interface ScenarioMeta {
  /** Row id (null while a form is only being checked). */
  id: number | null;
  index: number;
  isBaseline: boolean;
  fuelId: number;
  fuelName: string;
  fuelKind: string;
  priceQuoteId: number | null;
  price: PriceSource;
}

export interface StudyBundle {
  study: Study;
  meta: {
    studyId: number | null;
    plantId: number;
    plantName: string;
    isDemo: boolean;
    updatedAt: Date | null;
    baseline: ScenarioMeta;
    scenarios: ScenarioMeta[];
    hydrogen: { fuelId: number | null; price: PriceSource };
    /** Any figure rests on an invented (demo) price. */
    anyInventedPrice: boolean;
  };
}

export interface ViewSettings {
  /** Rank by this metric instead of the study's own. */
  metric?: RankingMetric;
  /** Count upstream (well-to-tank) CO2e and price it. */
  includeUpstream?: boolean;
  sensitivity?: Partial<SensitivityRanges>;
  /** Hydrogen-sweep step, vol %. */
  sweepStepPercent?: number;
  asOf?: Date;
}

interface ScenarioSource {
  id: number | null;
  name: string;
  fuel: FuelForStudy;
  quote: PriceQuote | null;
  capex: number;
  fixedOpexChange: number;
  overrides: unknown;
}

/** Tornado ranges when a study stores none (the study schema's defaults). */
const SENSITIVITY_DEFAULTS: SensitivityRanges = sensitivitySchema.parse({});

/** The stored sensitivity ranges (JSON text); unreadable or absent values fall back to the defaults. */
function storedSensitivity(text: string): SensitivityRanges {
  try {
    return sensitivitySchema.safeParse(JSON.parse(text)).data ?? SENSITIVITY_DEFAULTS;
  } catch {
    return SENSITIVITY_DEFAULTS;
  }
}

function parseOverrides(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return { _unreadable: text };
  }
}

function build(
  fields: Pick<StudyRow, "name" | "currency" | "carbonPrice_per_t" | "discountRatePercent" | "horizonYears" | "priceEscalationPercent" | "rankingMetric" | "notes" | "includeUpstream"> & {
    sensitivity: Partial<SensitivityRanges>;
  },
  plant: PlantRow,
  baseline: ScenarioSource,
  scenarios: ScenarioSource[],
  hydrogen: (Fuel & { priceQuotes: PriceQuote[] }) | null,
  settings: ViewSettings,
): { input: StudyInput; baseline: ScenarioMeta; scenarios: ScenarioMeta[]; hydrogen: StudyBundle["meta"]["hydrogen"] } {
  const asOf = settings.asOf ?? new Date();
  const one = (src: ScenarioSource, index: number) => {
    const p = priceFor(src.fuel, src.quote, fields.currency, asOf);
    const def = effectiveDefinition(src.fuel) as FuelDefinition;
    const meta: ScenarioMeta = {
      id: src.id,
      index,
      isBaseline: index === -1,
      fuelId: src.fuel.id,
      fuelName: src.fuel.name,
      fuelKind: src.fuel.kind,
      priceQuoteId: src.quote?.id ?? null,
      price: p.source,
    };
    return {
      meta,
      input: {
        name: src.name,
        fuel: def,
        price: p.price,
        componentPrices: p.componentPrices,
        capex: src.capex,
        fixedOpexChange: src.fixedOpexChange,
        overrides: src.overrides as Record<string, unknown>,
      },
    };
  };
  const b = one(baseline, -1);
  const cs = scenarios.map((s, i) => one(s, i));
  const h2Quote = hydrogen ? quoteInCurrency(hydrogen.priceQuotes, fields.currency, asOf) : undefined;
  const metric = settings.metric ?? ((RANKING_METRICS as readonly string[]).includes(fields.rankingMetric) ? (fields.rankingMetric as RankingMetric) : "cost-per-useful-MWh");
  const input: StudyInput = {
    name: fields.name,
    currency: fields.currency,
    carbonPrice_per_t: fields.carbonPrice_per_t,
    discountRatePercent: fields.discountRatePercent,
    horizonYears: fields.horizonYears,
    priceEscalationPercent: fields.priceEscalationPercent,
    rankingMetric: metric,
    includeUpstream: settings.includeUpstream ?? fields.includeUpstream,
    sensitivity: { ...SENSITIVITY_DEFAULTS, ...fields.sensitivity, ...settings.sensitivity },
    hydrogenSweep: {
      enabled: true,
      stepPercent: settings.sweepStepPercent ?? 1,
      hydrogen: hydrogen ? (effectiveDefinition(hydrogen) as FuelDefinition) : ({ name: "Hydrogen", compound: "H2", phase: "gas" } as FuelDefinition),
      hydrogenPrice: h2Quote ? studyPrice(h2Quote) : null,
    },
    plant: plantInputFromRow(plant),
    baseline: b.input,
    scenarios: cs.map((c) => c.input),
    notes: fields.notes,
  };
  return {
    input,
    baseline: b.meta,
    scenarios: cs.map((c) => c.meta),
    hydrogen: {
      fuelId: hydrogen?.id ?? null,
      price: h2Quote
        ? { kind: "current", quoteId: h2Quote.id, invented: h2Quote.isInvented, label: `${hydrogen!.name}: quote in force (${h2Quote.validFrom.toISOString().slice(0, 10)})` }
        : { kind: "none", invented: false, label: hydrogen ? `${hydrogen.name} has no quote in ${fields.currency}` : "no pure hydrogen in the fuel library" },
    },
  };
}

export type StudyLoad = { ok: true; bundle: StudyBundle } | { ok: false; status: 404 | 422; message: string; fieldErrors: FieldErrors };

/** The stored study as the self-contained study object lib/ evaluates, with ids and price origins. */
export async function studyBundle(db: PrismaClient, id: number, settings: ViewSettings = {}): Promise<StudyLoad> {
  const row = await loadStudy(db, id);
  if (!row) return { ok: false, status: 404, message: `No study with id ${id}.`, fieldErrors: {} };
  const base = row.scenarios.find((s) => s.isBaseline);
  if (!base) return { ok: false, status: 422, message: `Study "${row.name}" has no baseline scenario; edit the study and choose one.`, fieldErrors: { baseline: "missing" } };
  const src = (s: StudyWithAll["scenarios"][number]): ScenarioSource => ({
    id: s.id,
    name: s.name,
    fuel: s.fuel,
    quote: s.priceQuote,
    capex: s.capex,
    fixedOpexChange: s.fixedOpexChange,
    overrides: parseOverrides(s.overrides),
  });
  const cands = row.scenarios.filter((s) => !s.isBaseline);
  const built = build({ ...row, sensitivity: storedSensitivity(row.sensitivityRanges) }, row.plant, src(base), cands.map(src), await libraryHydrogen(db), settings);
  const parsed = studySchema.safeParse(built.input);
  if (!parsed.success) {
    const errs = fieldErrors(parsed.error);
    const [k, v] = Object.entries(errs)[0];
    return { ok: false, status: 422, message: `The stored study cannot be evaluated: ${k}: ${v}. Edit the study to fix it.`, fieldErrors: errs };
  }
  const anyInvented = [built.baseline, ...built.scenarios].some((m) => m.price.invented);
  return {
    ok: true,
    bundle: {
      study: parsed.data,
      meta: {
        studyId: row.id,
        plantId: row.plantId,
        plantName: row.plant.name,
        isDemo: row.isDemo,
        updatedAt: row.updatedAt,
        baseline: built.baseline,
        scenarios: built.scenarios,
        hydrogen: built.hydrogen,
        anyInventedPrice: anyInvented,
      },
    },
  };
}

/* ---------------------------------------------------------------- evaluation */

export { sharedCaches };

export type Evaluated = { ok: true; bundle: StudyBundle; result: StudyResult } | { ok: false; status: 404 | 422; message: string; fieldErrors: FieldErrors };

export interface EvaluateStoredOptions extends ViewSettings {
  sweep?: boolean;
  tornado?: boolean;
}

/** Loads and evaluates a stored study. Errors a user can fix come back as messages naming the field. */
export async function evaluateStoredStudy(db: PrismaClient, id: number, opts: EvaluateStoredOptions = {}): Promise<Evaluated> {
  const loaded = await studyBundle(db, id, opts);
  if (!loaded.ok) return loaded;
  try {
    const result = evaluateStudy(loaded.bundle.study, { sweep: opts.sweep ?? false, tornado: opts.tornado ?? true, caches: sharedCaches() });
    return { ok: true, bundle: loaded.bundle, result };
  } catch (e) {
    if (e instanceof StudyInputError) {
      return { ok: false, status: 422, message: `The study cannot be evaluated: ${e.message}. Edit the study or the fuel to fix it.`, fieldErrors: { [e.field]: e.detail } };
    }
    if (e instanceof RangeError || (e instanceof Error && /converge/i.test(e.message))) {
      return { ok: false, status: 422, message: `The study cannot be evaluated: ${e.message}`, fieldErrors: {} };
    }
    throw e;
  }
}

/* ---------------------------------------------------------------- lists */

export interface StudyListItem {
  id: number;
  name: string;
  plantId: number;
  plantName: string;
  currency: string;
  rankingMetric: string;
  scenarioCount: number;
  baselineName: string | null;
  /** Kind of the baseline fuel (a hydrogen sweep needs a gas). */
  baselineFuelKind: string | null;
  isDemo: boolean;
  updatedAt: Date;
}

export async function listStudies(db: PrismaClient, where: { plantId?: number } = {}): Promise<StudyListItem[]> {
  const rows = await db.study.findMany({
    where: where.plantId ? { plantId: where.plantId } : undefined,
    orderBy: [{ plant: { name: "asc" } }, { name: "asc" }],
    include: { plant: { select: { name: true } }, scenarios: { select: { name: true, isBaseline: true, fuel: { select: { kind: true } } } } },
  });
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    plantId: r.plantId,
    plantName: r.plant.name,
    currency: r.currency,
    rankingMetric: r.rankingMetric,
    scenarioCount: r.scenarios.filter((s) => !s.isBaseline).length,
    baselineName: r.scenarios.find((s) => s.isBaseline)?.name ?? null,
    baselineFuelKind: r.scenarios.find((s) => s.isBaseline)?.fuel.kind ?? null,
    isDemo: r.isDemo,
    updatedAt: r.updatedAt,
  }));
}

/** The stored study in the form the study form edits (and the API returns). */
export async function studyRecord(db: PrismaClient, id: number): Promise<(StudyRecordInput & { id: number; isDemo: boolean }) | null> {
  const row = await db.study.findUnique({ where: { id }, include: { scenarios: { orderBy: [{ isBaseline: "desc" }, { position: "asc" }, { id: "asc" }] } } });
  if (!row) return null;
  const sc = (s: ScenarioRow) => ({
    name: s.name,
    fuelId: s.fuelId,
    priceQuoteId: s.priceQuoteId,
    capex: s.capex,
    fixedOpexChange: s.fixedOpexChange,
    overrides: operatingOverridesSchema.safeParse(parseOverrides(s.overrides)).data ?? {},
  });
  const base = row.scenarios.find((s) => s.isBaseline);
  return {
    id: row.id,
    isDemo: row.isDemo,
    plantId: row.plantId,
    name: row.name,
    currency: row.currency,
    carbonPrice_per_t: row.carbonPrice_per_t,
    discountRatePercent: row.discountRatePercent,
    horizonYears: row.horizonYears,
    priceEscalationPercent: row.priceEscalationPercent,
    rankingMetric: row.rankingMetric as RankingMetric,
    includeUpstream: row.includeUpstream,
    sensitivity: storedSensitivity(row.sensitivityRanges),
    notes: row.notes,
    baseline: base ? sc(base) : { name: "Baseline", fuelId: 0, priceQuoteId: null, capex: 0, fixedOpexChange: 0, overrides: {} },
    scenarios: row.scenarios.filter((s) => !s.isBaseline).map(sc),
  };
}

/* ---------------------------------------------------------------- writes */

/** Where an evaluation error's field (a path into the study object) sits in the study form. */
export function recordFieldOf(path: string): string {
  const m = /^(baseline|scenarios\.\d+)\.(\w+)/.exec(path);
  if (m) {
    const [, who, what] = m;
    if (what === "fuel") return `${who}.fuelId`;
    if (what === "price" || what === "componentPrices") return `${who}.priceQuoteId`;
    if (what === "overrides") return path;
    return `${who}.${what}`;
  }
  if (path.startsWith("plant")) return "plantId";
  if (path.startsWith("hydrogenSweep")) return "_";
  return path;
}

async function prepare(tx: Tx, raw: unknown, selfId?: number): Promise<Result<{ record: StudyRecord; plant: PlantRow }>> {
  const parsed = studyRecordSchema.safeParse(raw);
  if (!parsed.success) return fail(400, "The study has errors; nothing was saved.", fieldErrors(parsed.error));
  const r = parsed.data;
  const errs: FieldErrors = {};
  const plant = await tx.plant.findUnique({ where: { id: r.plantId } });
  if (!plant) errs.plantId = `no plant with id ${r.plantId}`;
  const all: [string, ScenarioRecord][] = [["baseline", r.baseline], ...r.scenarios.map((s, i): [string, ScenarioRecord] => [`scenarios.${i}`, s])];
  const fuelIds = [...new Set(all.map(([, s]) => s.fuelId))];
  const fuels = new Map((await tx.fuel.findMany({ where: { id: { in: fuelIds } }, include: fuelInclude })).map((f) => [f.id, f as FuelForStudy]));
  const quoteIds = all.map(([, s]) => s.priceQuoteId).filter((q): q is number => typeof q === "number");
  const quotes = new Map((await tx.priceQuote.findMany({ where: { id: { in: quoteIds } } })).map((q) => [q.id, q]));
  for (const [path, s] of all) {
    if (!fuels.has(s.fuelId)) errs[`${path}.fuelId`] = `no stored fuel with id ${s.fuelId}`;
    if (s.priceQuoteId != null) {
      const q = quotes.get(s.priceQuoteId);
      if (!q || q.fuelId !== s.fuelId) errs[`${path}.priceQuoteId`] = "is not a price quote of the chosen fuel";
      else if (q.currency !== r.currency) errs[`${path}.priceQuoteId`] = `is in ${q.currency}; the study is in ${r.currency} (no exchange rates are applied)`;
    }
  }
  if (Object.keys(errs).length || !plant) return fail(400, "The study has errors; nothing was saved.", errs);
  const others = await tx.study.findMany({ where: { plantId: r.plantId }, select: { id: true, name: true } });
  const clash = others.find((o) => o.name.toLowerCase() === r.name.toLowerCase() && o.id !== selfId);
  if (clash) return fail(409, `This plant already has a study named "${clash.name}".`, { name: `this plant already has a study named "${clash.name}"` });

  // Evaluate once, so that a study that cannot be evaluated is never stored.
  const src = (s: ScenarioRecord): ScenarioSource => ({
    id: null,
    name: s.name,
    fuel: fuels.get(s.fuelId)!,
    quote: s.priceQuoteId != null ? quotes.get(s.priceQuoteId)! : null,
    capex: s.capex,
    fixedOpexChange: s.fixedOpexChange,
    overrides: s.overrides,
  });
  const built = build({ ...r, notes: r.notes }, plant, src(r.baseline), r.scenarios.map(src), await libraryHydrogen(tx), { metric: r.rankingMetric });
  const study = studySchema.safeParse(built.input);
  if (!study.success) {
    const e: FieldErrors = {};
    for (const [k, v] of Object.entries(fieldErrors(study.error))) e[recordFieldOf(k)] ??= v;
    return fail(400, "The study cannot be evaluated; nothing was saved.", e);
  }
  try {
    evaluateStudy(study.data, { sweep: false, tornado: false, caches: sharedCaches() });
  } catch (e) {
    if (e instanceof StudyInputError) {
      return fail(400, `The study cannot be evaluated: ${e.detail}; nothing was saved.`, { [recordFieldOf(e.field)]: e.detail });
    }
    if (e instanceof RangeError) return fail(400, `The study cannot be evaluated: ${e.message}; nothing was saved.`, { _: e.message });
    throw e;
  }
  return { ok: true, value: { record: r, plant } };
}

function studyColumns(r: StudyRecord) {
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
  };
}

async function writeScenarios(tx: Tx, studyId: number, r: StudyRecord): Promise<void> {
  const rows = [
    { ...r.baseline, isBaseline: true, position: 0 },
    ...r.scenarios.map((s, i) => ({ ...s, isBaseline: false, position: i + 1 })),
  ];
  for (const s of rows) {
    await tx.scenario.create({
      data: {
        studyId,
        name: s.name,
        fuelId: s.fuelId,
        priceQuoteId: s.priceQuoteId ?? null,
        capex: s.capex,
        fixedOpexChange: s.fixedOpexChange,
        overrides: JSON.stringify(s.overrides ?? {}),
        isBaseline: s.isBaseline,
        position: s.position,
      },
    });
  }
}

export async function createStudy(db: PrismaClient, raw: unknown): Promise<Result<StudyRow>> {
  return inTransaction(db, async (tx) => {
    const p = await prepare(tx, raw);
    if (!p.ok) return p;
    const row = await tx.study.create({ data: studyColumns(p.value.record) });
    await writeScenarios(tx, row.id, p.value.record);
    return { ok: true, value: row };
  });
}

export async function updateStudy(db: PrismaClient, id: number, raw: unknown): Promise<Result<StudyRow>> {
  return inTransaction(db, async (tx) => {
    const existing = await tx.study.findUnique({ where: { id } });
    if (!existing) return fail(404, `No study with id ${id}.`);
    const p = await prepare(tx, raw, id);
    if (!p.ok) return p;
    const row = await tx.study.update({ where: { id }, data: studyColumns(p.value.record) });
    await tx.scenario.deleteMany({ where: { studyId: id } });
    await writeScenarios(tx, id, p.value.record);
    return { ok: true, value: row };
  });
}

export async function deleteStudy(db: PrismaClient, id: number): Promise<Result<StudyRow>> {
  return inTransaction(db, async (tx) => {
    const existing = await tx.study.findUnique({ where: { id } });
    if (!existing) return fail(404, `No study with id ${id}.`);
    await tx.study.delete({ where: { id } });
    return { ok: true, value: existing };
  });
}

/** Copies a study with all its scenarios under a free name ("… (copy)", "… (copy 2)", …). */
export async function duplicateStudy(db: PrismaClient, id: number, name?: string): Promise<Result<StudyRow>> {
  return inTransaction(db, async (tx) => {
    const src = await tx.study.findUnique({ where: { id }, include: { scenarios: true } });
    if (!src) return fail(404, `No study with id ${id}.`);
    const taken = new Set((await tx.study.findMany({ where: { plantId: src.plantId }, select: { name: true } })).map((s) => s.name.toLowerCase()));
    let newName = name?.trim() ?? "";
    if (newName) {
      if (newName.length > 200) return fail(400, "The name is too long.", { name: "must be ≤ 200 characters" });
      if (taken.has(newName.toLowerCase())) return fail(409, `This plant already has a study named "${newName}".`, { name: `this plant already has a study named "${newName}"` });
    } else {
      for (let i = 1; ; i++) {
        const n = `${src.name} (copy${i > 1 ? ` ${i}` : ""})`.slice(0, 200);
        if (!taken.has(n.toLowerCase())) {
          newName = n;
          break;
        }
      }
    }
    const row = await tx.study.create({
      data: {
        plantId: src.plantId,
        name: newName,
        carbonPrice_per_t: src.carbonPrice_per_t,
        currency: src.currency,
        discountRatePercent: src.discountRatePercent,
        horizonYears: src.horizonYears,
        priceEscalationPercent: src.priceEscalationPercent,
        rankingMetric: src.rankingMetric,
        includeUpstream: src.includeUpstream,
        sensitivityRanges: src.sensitivityRanges,
        notes: src.notes,
        isDemo: false,
      },
    });
    for (const s of src.scenarios) {
      await tx.scenario.create({
        data: {
          studyId: row.id,
          name: s.name,
          fuelId: s.fuelId,
          priceQuoteId: s.priceQuoteId,
          capex: s.capex,
          fixedOpexChange: s.fixedOpexChange,
          overrides: s.overrides,
          isBaseline: s.isBaseline,
          position: s.position,
        },
      });
    }
    return { ok: true, value: row };
  });
}

/* ---------------------------------------------------------------- form options */

export interface StudyFormOptions {
  plants: { id: number; name: string; baselineFuelId: number | null; equipmentType: string }[];
  fuels: {
    id: number;
    name: string;
    kind: string;
    isBlend: boolean;
    quotes: { id: number; label: string; currency: string; validFrom: string; isInvented: boolean }[];
  }[];
}

/** Plants, fuels and their quotes for the study form's choices. */
export async function studyFormOptions(db: PrismaClient): Promise<StudyFormOptions> {
  const [plants, fuels] = await Promise.all([
    db.plant.findMany({ orderBy: { name: "asc" }, select: { id: true, name: true, baselineFuelId: true, equipmentType: true } }),
    db.fuel.findMany({ orderBy: [{ kind: "asc" }, { name: "asc" }], include: { priceQuotes: quotesNewestFirst, components: { select: { id: true } } } }),
  ]);
  return {
    plants,
    fuels: fuels.map((f) => ({
      id: f.id,
      name: f.name,
      kind: f.kind,
      isBlend: f.components.length > 0,
      quotes: f.priceQuotes.map((q) => {
        const j = quoteJson(q);
        const per = j.unit === "m3" ? `m³ (${j.meteringReference ?? "?"})` : j.energyBasis ? `${j.unit} ${j.energyBasis}` : j.unit;
        const adders = j.transportAdder || j.handlingAdder ? ` + ${j.transportAdder + j.handlingAdder} adders` : "";
        return { id: q.id, label: `${j.amount}${adders} ${j.currency}/${per}, from ${j.validFrom}`, currency: j.currency, validFrom: j.validFrom, isInvented: j.isInvented };
      }),
    })),
  };
}
