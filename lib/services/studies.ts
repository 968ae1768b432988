/**
 * Stored studies: a study of one plant holds a baseline and candidate scenarios, each a stored fuel
 * or blend priced by a stored quote. This module validates and stores them (nothing is stored from
 * rejected input; problems name the field), duplicates and deletes them, chooses the price of each
 * scenario, and assembles the self-contained study object that lib/study/evaluate.ts evaluates.
 */
import { inTransaction, type Db, type DbOrTx, type Tx } from "../db/client";
import {
  effectiveDefinition,
  fuelsWithQuotes,
  gasesMentioningHydrogen,
  listFuelsWithQuotes,
  storedDefinition,
  type FuelRow,
  type FuelWithQuotesRow,
} from "../db/fuel-rows";
import { findQuotes, quoteJson, type PriceQuoteRow } from "../db/price-quote-rows";
import { findPlant, plantChoices, plantInputFromRow, type PlantRow } from "../db/plant-rows";
import {
  copyStudy,
  deleteStudyRow,
  findStudy,
  findStudyWithScenarios,
  findStudyWithScenariosAny,
  setStudyTrashed,
  insertStudy,
  countStudies,
  listStudyRows,
  loadStudyGraph,
  replaceStudy,
  studyFromRows,
  studyNamesOfPlant,
  type StoredScenario,
  type StoredStudy,
  type StudyRow,
} from "../db/study-rows";
import { fieldErrors, type FuelDefinition } from "../schemas/fuel";
import { studySchema, type RankingMetric, type Study, type StudyInput, type StudyPriceInput } from "../schemas/study";
import { studyRecordSchema, type ScenarioRecord, type StudyRecord, type StudyRecordInput } from "../schemas/study-record";
import type { SensitivityRanges } from "../economics/sensitivity";
import { evaluateStudy, type StudyResult } from "../study/evaluate";
import { resolveFuel } from "../fuels/resolve";
import { ensureFlameSolves, flameJobStatus, flameLookup, type FlameJobStatus } from "./flames";
import { listRates, rateJson } from "../db/exchange-rate-rows";
import { countRevisions } from "../db/revision-rows";
import { rateInForce } from "../economics/currency";
import { day, inCurrency, latestVersion, quoteByRule, ruleText, type PriceSource, type PricingContext } from "./quote-choice";
import { isFlameFailure, type FlameLookup } from "../plant/burner-flame";
import { contentKey, flameKeysAsked, parsedStudyCache, resultCache, sharedCaches } from "./eval-cache";
import { ok, problem, problemFromError, type FieldErrors, type Problem, type Result } from "./result";
import { currentActor } from "./actor";
import { trashEnabled } from "./mode";
import { recordChange } from "./change-log";

/** A study as the change log keeps it: its columns and its scenarios (without row bookkeeping). */
async function studyLogRecord(tx: DbOrTx, id: number, includeTrashed = false) {
  const row = includeTrashed ? await findStudyWithScenariosAny(tx, id) : await findStudyWithScenarios(tx, id);
  if (!row) return null;
  const { createdAt: _c, updatedAt: _u, deletedAt: _d, deletedBy: _b, scenarios, ...study } = row;
  return {
    ...study,
    scenarios: scenarios.map(({ id: _i, studyId: _s, createdAt: _sc, updatedAt: _su, ...s }) => s),
  };
}
import { isStokeError } from "../errors";

/* ---------------------------------------------------------------- pricing policy */

/**
 * How a scenario is priced (lib/services/quote-choice.ts): the quote the study names (its newest
 * version; the rule when it was withdrawn); else the rule "latest quote in the study's currency
 * valid on D"; else, for a blend, its components' quotes by the same rule (mixed per kg); else none,
 * with the reason. Quotes in another currency are converted at the rate in force on their date.
 */
export type { PriceSource };

function priceFor(
  fuel: FuelWithQuotesRow,
  chosen: PriceQuoteRow | null,
  validOn: string | null,
  ctx: PricingContext,
  asOf: Date,
): { price: StudyPriceInput | null; componentPrices: StudyPriceInput[] | null; source: PriceSource; quoteIds: number[] } {
  const rule = ruleText(ctx.currency, validOn);
  const on = validOn ? new Date(`${validOn}T00:00:00Z`) : asOf;
  const notes: string[] = [];
  if (chosen) {
    const q = latestVersion(chosen, fuel.priceQuotes);
    if (q.id !== chosen.id) notes.push(`quote #${chosen.id} was corrected: its newest version #${q.id} applies`);
    if (q.withdrawnAt === null) {
      const c = inCurrency(q, ctx);
      if (c.ok) {
        if (c.note) notes.push(c.note);
        return {
          price: c.price,
          componentPrices: null,
          source: {
            kind: "quote",
            quoteId: q.id,
            invented: q.isInvented,
            validFrom: day(q.validFrom),
            rule: `chosen quote #${chosen.id}`,
            notes,
          },
          quoteIds: [q.id],
        };
      }
      notes.push(c.reason);
    } else {
      notes.push(`the chosen quote #${q.id} was withdrawn on ${day(q.withdrawnAt)}; the rule applies instead`);
    }
  }
  const byRule = quoteByRule(fuel.priceQuotes, on, ctx);
  if (byRule.quote) {
    if (byRule.converted.note) notes.push(byRule.converted.note);
    const q = byRule.quote;
    return {
      price: byRule.converted.price,
      componentPrices: null,
      source: { kind: "current", quoteId: q.id, invented: q.isInvented, validFrom: day(q.validFrom), rule, notes },
      quoteIds: [q.id],
    };
  }
  if (fuel.components.length) {
    const picks = fuel.components.map((c) => ({ name: c.component.name, pick: quoteByRule(c.component.priceQuotes, on, ctx) }));
    const missing = picks.find((p) => !p.pick.quote);
    if (!missing) {
      const qs = picks.map((p) => p.pick as Extract<typeof p.pick, { quote: PriceQuoteRow }>);
      for (const p of qs) if (p.converted.note) notes.push(p.converted.note);
      return {
        price: null,
        componentPrices: qs.map((p) => p.converted.price),
        source: {
          kind: "components",
          quoteIds: qs.map((p) => p.quote.id),
          invented: qs.some((p) => p.quote.isInvented),
          rule: `components: ${rule}`,
          notes,
        },
        quoteIds: qs.map((p) => p.quote.id),
      };
    }
    notes.push(
      `${fuel.name}: ${(byRule as { reason: string }).reason}; component ${missing.name}: ${(missing.pick as { reason: string }).reason}`,
    );
  } else {
    notes.push(`${fuel.name}: ${(byRule as { reason: string }).reason}`);
  }
  return {
    price: null,
    componentPrices: null,
    source: { kind: "none", invented: false, currency: ctx.currency, rule, notes },
    quoteIds: [],
  };
}

type HydrogenRow = FuelWithQuotesRow;

/** Whether a stored fuel is pure hydrogen (a gas of H2 only): the default the study form offers. */
function isPureHydrogen(row: FuelRow): boolean {
  let def: FuelDefinition;
  try {
    def = storedDefinition(row);
  } catch (e) {
    if (e instanceof SyntaxError) return false; // a record whose JSON cannot be read is not the hydrogen
    throw e;
  }
  if (!("composition" in def)) return "compound" in def && def.compound === "H2" && def.phase !== "liquid";
  const keys = Object.keys(def.composition).filter((k) => def.composition[k] > 0);
  return keys.length === 1 && keys[0] === "H2";
}

/** The hydrogen the study form offers by default: the library's first pure hydrogen, or null. */
export async function defaultHydrogenFuelId(db: DbOrTx): Promise<number | null> {
  for (const g of await gasesMentioningHydrogen(db)) if (isPureHydrogen(g)) return g.id;
  return null;
}

/**
 * A study's hydrogen must be mostly hydrogen (mole fraction of H2 at least this): the sweep's axis
 * is "vol % of this gas" and its labels speak of hydrogen (e.g. electrolytic H2 with impurities,
 * not a natural-gas blend with some hydrogen).
 */
export const HYDROGEN_FUEL_MIN_H2_FRACTION = 0.5;

const h2FractionOf = (row: FuelRow, field: string) => resolveFuel(effectiveDefinition(row), field).h2MoleFraction;

/** What the sweep answers when the study names no hydrogen (the field is the study form's). */
export const NO_HYDROGEN_CHOSEN = "choose the hydrogen to blend (a stored gas) in the study's settings: the hydrogen sweep needs one";

/* ---------------------------------------------------------------- assembling the study */

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

export interface HydrogenMeta {
  /** The study's hydrogen (Study.hydrogenFuelId), null when none is chosen (then there is no sweep). */
  fuelId: number | null;
  fuelName: string | null;
  price: PriceSource;
}

export interface StudyBundle {
  study: Study;
  /** SHA-256 of the canonical study input `study` was parsed from (what its evaluation depends on); absent for revisions. */
  inputKey?: string;
  meta: {
    studyId: number | null;
    plantId: number;
    plantName: string;
    isDemo: boolean;
    updatedAt: Date | null;
    baseline: ScenarioMeta;
    scenarios: ScenarioMeta[];
    hydrogen: HydrogenMeta;
    /** Any figure rests on an invented (demo) price. */
    anyInventedPrice: boolean;
    /** Every quote the prices rest on (what an issued revision records). */
    quoteIds: number[];
    /** The revision this bundle was read from (null: the live study). */
    revision: { number: number; hash: string; issuedAt: string } | null;
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
  fuel: FuelWithQuotesRow;
  quote: PriceQuoteRow | null;
  priceValidOn: string | null;
  capex: number;
  fixedOpexChange: number;
  overrides: StoredScenario["overrides"];
}

type StudyFields = Omit<
  Pick<
    StoredStudy,
    | "name"
    | "currency"
    | "carbonPrice_per_t"
    | "discountRatePercent"
    | "horizonYears"
    | "priceEscalationPercent"
    | "rankingMetric"
    | "includeUpstream"
    | "sensitivity"
    | "notes"
    | "reportTitle"
    | "preparedFor"
    | "preparedBy"
    | "reportDate"
    | "reportNotes"
  >,
  "reportDate"
> & { reportDate?: string | null };

function build(
  fields: StudyFields,
  plant: PlantRow,
  baseline: ScenarioSource,
  scenarios: ScenarioSource[],
  hydrogen: HydrogenRow | null,
  settings: ViewSettings,
  rates: PricingContext["rates"],
): { input: StudyInput; baseline: ScenarioMeta; scenarios: ScenarioMeta[]; hydrogen: HydrogenMeta; quoteIds: number[] } {
  const asOf = settings.asOf ?? new Date();
  const ctx: PricingContext = { currency: fields.currency, rates };
  const quoteIds = new Set<number>();
  const one = (src: ScenarioSource, index: number) => {
    const p = priceFor(src.fuel, src.quote, src.priceValidOn, ctx, asOf);
    for (const q of p.quoteIds) quoteIds.add(q);
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
        fuel: effectiveDefinition(src.fuel),
        price: p.price,
        componentPrices: p.componentPrices,
        capex: src.capex,
        fixedOpexChange: src.fixedOpexChange,
        overrides: src.overrides,
      },
    };
  };
  const b = one(baseline, -1);
  const cs = scenarios.map((s, i) => one(s, i));
  const h2 = hydrogen ? quoteByRule(hydrogen.priceQuotes, asOf, ctx) : null;
  const h2Quote = h2?.quote ?? null;
  if (h2Quote) quoteIds.add(h2Quote.id);
  const input: StudyInput = {
    name: fields.name,
    currency: fields.currency,
    carbonPrice_per_t: fields.carbonPrice_per_t,
    discountRatePercent: fields.discountRatePercent,
    horizonYears: fields.horizonYears,
    priceEscalationPercent: fields.priceEscalationPercent,
    rankingMetric: settings.metric ?? fields.rankingMetric,
    includeUpstream: settings.includeUpstream ?? fields.includeUpstream,
    sensitivity: { ...fields.sensitivity, ...settings.sensitivity },
    // The study's own hydrogen; without one there is no sweep (the sweep page asks for the field).
    hydrogenSweep: {
      enabled: hydrogen !== null,
      stepPercent: settings.sweepStepPercent ?? 1,
      ...(hydrogen ? { hydrogen: effectiveDefinition(hydrogen) } : {}),
      hydrogenPrice: h2?.quote ? h2.converted.price : null,
    },
    plant: plantInputFromRow(plant),
    baseline: b.input,
    scenarios: cs.map((c) => c.input),
    notes: fields.notes,
    reportTitle: fields.reportTitle,
    preparedFor: fields.preparedFor,
    preparedBy: fields.preparedBy,
    reportDate: fields.reportDate ?? null,
    reportNotes: fields.reportNotes,
  };
  return {
    input,
    baseline: b.meta,
    scenarios: cs.map((c) => c.meta),
    hydrogen: {
      fuelId: hydrogen?.id ?? null,
      fuelName: hydrogen?.name ?? null,
      price: h2?.quote
        ? {
            kind: "current",
            quoteId: h2.quote.id,
            invented: h2.quote.isInvented,
            validFrom: day(h2.quote.validFrom),
            rule: ruleText(fields.currency, null),
            notes: h2.converted.note ? [h2.converted.note] : [],
          }
        : {
            kind: "none",
            invented: false,
            currency: fields.currency,
            rule: ruleText(fields.currency, null),
            notes: h2 && !h2.quote ? [h2.reason] : [],
          },
    },
    quoteIds: [...quoteIds].sort((a, b) => a - b),
  };
}

export type StudyLoad = { ok: true; bundle: StudyBundle } | Problem;

const unreadableProblem = (name: string, unreadable: FieldErrors): Problem =>
  problem(
    "unprocessable",
    `Study "${name}" has stored values that cannot be read (${Object.keys(unreadable).join(", ")}). Edit the study, check those fields and save it.`,
    unreadable,
  );

/** The stored study as the self-contained study object lib/ evaluates, with ids and price origins. */
export async function studyBundle(db: Db, id: number, settings: ViewSettings = {}): Promise<StudyLoad> {
  const row = await loadStudyGraph(db, id);
  if (!row) return problem("not-found", `No study with id ${id}.`);
  const stored = studyFromRows(row, row.scenarios);
  if (Object.keys(stored.unreadable).length) return unreadableProblem(row.name, stored.unreadable);
  if (!stored.baseline)
    return problem("unprocessable", `Study "${row.name}" has no baseline scenario; edit the study and choose one.`, {
      baseline: "missing",
    });
  const rowOf = new Map(row.scenarios.map((s) => [s.id, s]));
  const src = (s: StoredScenario): ScenarioSource => {
    const r = rowOf.get(s.id);
    if (!r) throw new Error(`scenario ${s.id} vanished while the study was read`);
    return {
      id: s.id,
      name: s.name,
      fuel: r.fuel,
      quote: r.priceQuote,
      priceValidOn: s.priceValidOn,
      capex: s.capex,
      fixedOpexChange: s.fixedOpexChange,
      overrides: s.overrides,
    };
  };
  const rates = (await listRates(db)).map(rateJson);
  const built = build(stored, row.plant, src(stored.baseline), stored.scenarios.map(src), row.hydrogenFuel, settings, rates);
  // The same input parses to the same study: parse each distinct input once.
  const inputKey = contentKey("study-input", built.input);
  const parsed = parsedStudyCache<ReturnType<typeof studySchema.safeParse>>().getOrCompute(inputKey, () =>
    studySchema.safeParse(built.input),
  );
  if (!parsed.success) {
    const errs = fieldErrors(parsed.error);
    const [k, v] = Object.entries(errs)[0];
    return problem("unprocessable", `The stored study cannot be evaluated: ${k}: ${v}. Edit the study to fix it.`, errs);
  }
  const anyInvented = [built.baseline, ...built.scenarios].some((m) => m.price.invented);
  return {
    ok: true,
    bundle: {
      study: parsed.data,
      inputKey,
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
        quoteIds: built.quoteIds,
        revision: null,
      },
    },
  };
}

/* ---------------------------------------------------------------- evaluation */

export { sharedCaches, countStudies };

export type Evaluated = { ok: true; bundle: StudyBundle; result: StudyResult } | Problem;

export interface EvaluateStoredOptions extends ViewSettings {
  /**
   * Run the hydrogen sweep: true asks for it (a study without a chosen hydrogen is then a problem
   * naming `hydrogenFuelId`); "if-chosen" runs it when the study names its hydrogen.
   */
  sweep?: boolean | "if-chosen";
  tornado?: boolean;
  /** Queue the flame solves still missing (default false; pages ask for it; a background job, never awaited). */
  solveFlames?: boolean;
}

/** A study result's cache key: its input's key and the outcome of every flame solve it asked for. */
function resultKeyOf(inputKey: string, asked: string[], flames: FlameLookup): string {
  return contentKey(
    inputKey,
    asked.map((k) => {
      const o = flames.get(k);
      return [k, o === undefined ? "pending" : isFlameFailure(o) ? "failed" : "solved"];
    }),
  );
}

/** The problem of a sweep asked for on a study that names no hydrogen. */
export function noHydrogenProblem(name: string): Problem {
  return problem("invalid", `Study "${name}" has no hydrogen for its sweep: ${NO_HYDROGEN_CHOSEN}.`, {
    hydrogenFuelId: NO_HYDROGEN_CHOSEN,
  });
}

/**
 * Loads and evaluates a stored study. What lib/ refuses (bad stored input, an infeasible charge, a
 * solver that did not converge) comes back as an `unprocessable` problem naming the field.
 */
export async function evaluateStoredStudy(db: Db, id: number, opts: EvaluateStoredOptions = {}): Promise<Evaluated> {
  const loaded = await studyBundle(db, id, opts);
  if (!loaded.ok) return loaded;
  const chosen = loaded.bundle.meta.hydrogen.fuelId !== null;
  if (opts.sweep === true && !chosen) return noHydrogenProblem(loaded.bundle.study.name);
  try {
    const options = { sweep: opts.sweep === true || (opts.sweep === "if-chosen" && chosen), tornado: opts.tornado ?? true };
    // Keyed by everything the evaluation reads: the self-contained study object, the options and the
    // outcome of each flame solve the evaluation asked for (stored solves never change; a solve
    // arriving for this study makes a new key, one for another study does not).
    const flames = await flameLookup(db);
    const inputKey = contentKey("study-result", loaded.bundle.inputKey ?? loaded.bundle.study, options);
    const results = resultCache<StudyResult>();
    const asked = flameKeysAsked().get(inputKey);
    let result = asked ? results.get(resultKeyOf(inputKey, asked, flames)) : undefined;
    if (!result) {
      const seen = new Set<string>();
      const recording: FlameLookup = {
        get: (k) => {
          seen.add(k);
          return flames.get(k);
        },
      };
      result = evaluateStudy(loaded.bundle.study, { ...options, caches: sharedCaches(), flames: recording });
      const keys = [...seen];
      flameKeysAsked().set(inputKey, keys);
      results.set(resultKeyOf(inputKey, keys, flames), result);
    }
    if (result.flameSolves.pending > 0 && opts.solveFlames === true) ensureFlameSolves(db, result.flameSolves.needed);
    return { ok: true, bundle: loaded.bundle, result };
  } catch (e) {
    return problemFromError(e, {
      kind: "unprocessable",
      message: (s, field) => `The study cannot be evaluated: ${field ? `${field}: ` : ""}${s}. Edit the study or the fuel to fix it.`,
    });
  }
}

export interface FlameProgress {
  needed: number;
  solved: number;
  failed: number;
  pending: number;
  job: FlameJobStatus;
}

/**
 * How far the flame solves of a study (its scenarios and hydrogen sweep) have come; queues the
 * missing ones (what the pages poll while they fill in).
 */
export async function studyFlameProgress(db: Db, id: number, opts: { sweep?: boolean } = {}): Promise<Result<FlameProgress>> {
  const ev = await evaluateStoredStudy(db, id, { sweep: opts.sweep ?? true, tornado: false, solveFlames: true });
  if (!ev.ok) return ev;
  const f = ev.result.flameSolves;
  return { ok: true, value: { needed: f.needed.length, solved: f.solved, failed: f.failed, pending: f.pending, job: flameJobStatus() } };
}

/* ---------------------------------------------------------------- lists and records */

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

export async function listStudies(
  db: Db,
  where: { plantId?: number } = {},
  page?: { offset: number; limit: number },
): Promise<StudyListItem[]> {
  const rows = await listStudyRows(db, where.plantId, page);
  return rows.map((r) => {
    const base = r.scenarios.find((s) => s.isBaseline);
    return {
      id: r.id,
      name: r.name,
      plantId: r.plantId,
      plantName: r.plant.name,
      currency: r.currency,
      rankingMetric: r.rankingMetric,
      scenarioCount: r.scenarios.filter((s) => !s.isBaseline).length,
      baselineName: base?.name ?? null,
      baselineFuelKind: base?.fuel.kind ?? null,
      isDemo: r.isDemo,
      updatedAt: r.updatedAt,
    };
  });
}

/** A stored study as the study form edits it (and the API returns it), with what could not be read. */
export type StudyRecordView = StudyRecordInput & { id: number; isDemo: boolean; storedProblems: FieldErrors };

export async function studyRecord(db: Db, id: number): Promise<StudyRecordView | null> {
  const row = await findStudyWithScenarios(db, id);
  if (!row) return null;
  const s = studyFromRows(row, row.scenarios);
  const sc = ({ id: _id, ...rest }: StoredScenario) => rest;
  return {
    id: s.id,
    isDemo: s.isDemo,
    plantId: s.plantId,
    name: s.name,
    currency: s.currency,
    carbonPrice_per_t: s.carbonPrice_per_t,
    discountRatePercent: s.discountRatePercent,
    horizonYears: s.horizonYears,
    priceEscalationPercent: s.priceEscalationPercent,
    rankingMetric: s.rankingMetric,
    includeUpstream: s.includeUpstream,
    sensitivity: s.sensitivity,
    notes: s.notes,
    reportTitle: s.reportTitle,
    preparedFor: s.preparedFor,
    preparedBy: s.preparedBy,
    reportDate: s.reportDate,
    reportNotes: s.reportNotes,
    hydrogenFuelId: s.hydrogenFuelId,
    baseline: s.baseline
      ? sc(s.baseline)
      : { name: "Baseline", fuelId: 0, priceQuoteId: null, capex: 0, fixedOpexChange: 0, overrides: {} },
    scenarios: s.scenarios.map(sc),
    storedProblems: s.unreadable,
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
  if (path.startsWith("hydrogenSweep")) return "hydrogenFuelId";
  return path;
}

async function prepare(tx: Tx, raw: unknown, selfId?: number): Promise<Result<StudyRecord>> {
  const parsed = studyRecordSchema.safeParse(raw);
  if (!parsed.success) return problem("invalid", "The study has errors; nothing was saved.", fieldErrors(parsed.error));
  const r = parsed.data;
  const errs: FieldErrors = {};
  const plant = await findPlant(tx, r.plantId);
  if (!plant) errs.plantId = `no plant with id ${r.plantId}`;
  const all: [string, ScenarioRecord][] = [
    ["baseline", r.baseline],
    ...r.scenarios.map((s, i): [string, ScenarioRecord] => [`scenarios.${i}`, s]),
  ];
  const h2Id = r.hydrogenFuelId ?? null;
  const fuelIds = new Set(all.map(([, s]) => s.fuelId));
  if (h2Id !== null) fuelIds.add(h2Id);
  const fuels = new Map((await fuelsWithQuotes(tx, [...fuelIds])).map((f) => [f.id, f]));
  const quoteIds = all.map(([, s]) => s.priceQuoteId).filter((q): q is number => typeof q === "number");
  const quotes = new Map((await findQuotes(tx, quoteIds)).map((q) => [q.id, q]));
  const rates = (await listRates(tx)).map(rateJson);
  for (const [path, s] of all) {
    if (!fuels.has(s.fuelId)) errs[`${path}.fuelId`] = `no stored fuel with id ${s.fuelId}`;
    if (s.priceQuoteId != null) {
      const q = quotes.get(s.priceQuoteId);
      if (!q || q.fuelId !== s.fuelId) errs[`${path}.priceQuoteId`] = "is not a price quote of the chosen fuel";
      else if (q.currency !== r.currency && !rateInForce(rates, q.currency, r.currency, day(q.validFrom)))
        errs[`${path}.priceQuoteId`] =
          `is in ${q.currency}; the study is in ${r.currency} and no exchange rate from ${q.currency} to ${r.currency} is in force on ${day(q.validFrom)} (add one, or choose a quote in ${r.currency})`;
    }
  }
  const hydrogen = h2Id === null ? null : (fuels.get(h2Id) ?? null);
  if (h2Id !== null) {
    if (!hydrogen) errs.hydrogenFuelId = `no stored fuel with id ${h2Id}`;
    else if (hydrogen.kind !== "gas")
      errs.hydrogenFuelId = `"${hydrogen.name}" is not a gas: the sweep blends a gas into the baseline gas by volume`;
    else if (!(h2FractionOf(hydrogen, "hydrogenFuelId") >= HYDROGEN_FUEL_MIN_H2_FRACTION))
      errs.hydrogenFuelId = `"${hydrogen.name}" is not mostly hydrogen (needs at least ${100 * HYDROGEN_FUEL_MIN_H2_FRACTION} mol % H2)`;
  }
  if (Object.keys(errs).length || !plant) return problem("invalid", "The study has errors; nothing was saved.", errs);
  const clash = (await studyNamesOfPlant(tx, r.plantId)).find((o) => o.name.toLowerCase() === r.name.toLowerCase() && o.id !== selfId);
  if (clash) {
    const where = clash.deletedAt ? " (in the trash)" : "";
    return problem("conflict", `This plant already has a study named "${clash.name}"${where}.`, {
      name: `this plant already has a study named "${clash.name}"${where}`,
    });
  }

  // Evaluate once, so that a study that cannot be evaluated is never stored.
  const src = (s: ScenarioRecord): ScenarioSource => {
    const fuel = fuels.get(s.fuelId);
    if (!fuel) throw new Error(`fuel ${s.fuelId} vanished while the study was checked`);
    return {
      id: null,
      name: s.name,
      fuel,
      quote: s.priceQuoteId != null ? (quotes.get(s.priceQuoteId) ?? null) : null,
      priceValidOn: s.priceValidOn ?? null,
      capex: s.capex,
      fixedOpexChange: s.fixedOpexChange,
      overrides: s.overrides,
    };
  };
  const built = build(r, plant, src(r.baseline), r.scenarios.map(src), hydrogen, { metric: r.rankingMetric }, rates);
  const study = studySchema.safeParse(built.input);
  if (!study.success) {
    const e: FieldErrors = {};
    for (const [k, v] of Object.entries(fieldErrors(study.error))) e[recordFieldOf(k)] ??= v;
    return problem("invalid", "The study cannot be evaluated; nothing was saved.", e);
  }
  try {
    evaluateStudy(study.data, { sweep: false, tornado: false, caches: sharedCaches() });
  } catch (e) {
    return problemFromError(e, { fieldOf: recordFieldOf, message: (s) => `The study cannot be evaluated: ${s}; nothing was saved.` });
  }
  return ok(r);
}

export function createStudy(db: Db, raw: unknown): Promise<Result<StudyRow>> {
  return inTransaction(db, async (tx): Promise<Result<StudyRow>> => {
    const p = await prepare(tx, raw);
    if (!p.ok) return p;
    const row = await insertStudy(tx, p.value);
    await recordChange(tx, {
      subject: { type: "study", id: row.id },
      entity: "study",
      entityId: row.id,
      action: "create",
      after: await studyLogRecord(tx, row.id),
    });
    return ok(row);
  });
}

export function updateStudy(db: Db, id: number, raw: unknown): Promise<Result<StudyRow>> {
  return inTransaction(db, async (tx): Promise<Result<StudyRow>> => {
    if (!(await findStudy(tx, id))) return problem("not-found", `No study with id ${id}.`);
    const p = await prepare(tx, raw, id);
    if (!p.ok) return p;
    const before = await studyLogRecord(tx, id);
    const row = await replaceStudy(tx, id, p.value);
    await recordChange(tx, {
      subject: { type: "study", id },
      entity: "study",
      entityId: id,
      action: "update",
      before,
      after: await studyLogRecord(tx, id),
    });
    return ok(row);
  });
}

/** Why a study cannot leave: an issued study is kept on record. */
async function studyBlockers(tx: DbOrTx, existing: StudyRow): Promise<Problem | null> {
  const issued = await countRevisions(tx, existing.id);
  if (!issued) return null;
  return problem(
    "conflict",
    `Study "${existing.name}" has ${issued} issued revision${issued > 1 ? "s" : ""}; an issued study is kept on record and cannot be deleted.`,
    {
      _: `${issued} issued revision${issued > 1 ? "s" : ""}`,
    },
  );
}

/** DELETE /api/studies/{id}: to the trash (team mode) or deleted at once (personal mode); an issued study stays. */
export function deleteStudy(db: Db, id: number): Promise<Result<StudyRow>> {
  return inTransaction(db, async (tx): Promise<Result<StudyRow>> => {
    const existing = await findStudy(tx, id);
    if (!existing) return problem("not-found", `No study with id ${id}.`);
    if (!trashEnabled()) return purgeStudyIn(tx, existing, "delete");
    const blocked = await studyBlockers(tx, existing);
    if (blocked) return blocked;
    const row = await setStudyTrashed(tx, id, new Date(), currentActor().name);
    await recordChange(tx, {
      subject: { type: "study", id },
      entity: "study",
      entityId: id,
      action: "trash",
      summary: "moved to the trash",
    });
    return ok(row);
  });
}

/** Deletes a study for good with its scenarios (the trash's purge, or a delete without the trash). */
export async function purgeStudyIn(tx: Tx, existing: StudyRow, action: "purge" | "delete" = "purge"): Promise<Result<StudyRow>> {
  const blocked = await studyBlockers(tx, existing);
  if (blocked) return blocked;
  const before = await studyLogRecord(tx, existing.id, true);
  await deleteStudyRow(tx, existing.id);
  await recordChange(tx, { subject: { type: "study", id: existing.id }, entity: "study", entityId: existing.id, action, before });
  return ok(existing);
}

/** Copies a study with all its scenarios under a free name ("… (copy)", "… (copy 2)", …). */
export function duplicateStudy(db: Db, id: number, name?: string): Promise<Result<StudyRow>> {
  return inTransaction(db, async (tx): Promise<Result<StudyRow>> => {
    const src = await findStudyWithScenarios(tx, id);
    if (!src) return problem("not-found", `No study with id ${id}.`);
    const taken = new Set((await studyNamesOfPlant(tx, src.plantId)).map((s) => s.name.toLowerCase()));
    let newName = name?.trim() ?? "";
    if (newName) {
      if (newName.length > 200) return problem("invalid", "The name is too long.", { name: "must be ≤ 200 characters" });
      if (taken.has(newName.toLowerCase()))
        return problem("conflict", `This plant already has a study named "${newName}".`, {
          name: `this plant already has a study named "${newName}"`,
        });
    } else {
      for (let i = 1; ; i++) {
        const n = `${src.name} (copy${i > 1 ? ` ${i}` : ""})`.slice(0, 200);
        if (!taken.has(n.toLowerCase())) {
          newName = n;
          break;
        }
      }
    }
    const row = await copyStudy(tx, src, newName);
    await recordChange(tx, {
      subject: { type: "study", id: row.id },
      entity: "study",
      entityId: row.id,
      action: "duplicate",
      summary: `copy of study #${id} "${src.name}"`,
      after: await studyLogRecord(tx, row.id),
    });
    return ok(row);
  });
}

/* ---------------------------------------------------------------- form options */

export interface QuoteChoice {
  id: number;
  amount: number;
  transportAdder: number;
  handlingAdder: number;
  currency: string;
  unit: string;
  energyBasis: string | null;
  meteringReference: string | null;
  validFrom: string;
  isInvented: boolean;
  supplier: string;
  /** Withdrawn quotes price nothing (a scenario that chose one falls back to its rule). */
  withdrawn: boolean;
  /** The correction that replaced this quote (its newest version applies). */
  supersededBy: number | null;
}

export interface StudyFormOptions {
  plants: { id: number; name: string; baselineFuelId: number | null; equipmentType: string }[];
  fuels: { id: number; name: string; kind: string; isBlend: boolean; quotes: QuoteChoice[] }[];
  /** Stored gases that contain hydrogen (what the sweep may blend), and the default a new study is offered (pure hydrogen). */
  hydrogenFuels: { id: number; name: string }[];
  defaultHydrogenFuelId: number | null;
}

/** Plants, fuels and their quotes (newest first) for the study form's choices. */
export async function studyFormOptions(db: Db): Promise<StudyFormOptions> {
  const [plants, fuels, h2Gases, defaultH2] = await Promise.all([
    plantChoices(db),
    listFuelsWithQuotes(db),
    gasesMentioningHydrogen(db),
    defaultHydrogenFuelId(db),
  ]);
  const hydrogenFuels = h2Gases
    .filter((g) => {
      try {
        return h2FractionOf(g, "fuel") >= HYDROGEN_FUEL_MIN_H2_FRACTION;
      } catch (e) {
        if (e instanceof SyntaxError || isStokeError(e)) return false; // not offered: its own page reports what is wrong
        throw e;
      }
    })
    .map((g) => ({ id: g.id, name: g.name }));
  return {
    plants,
    hydrogenFuels,
    defaultHydrogenFuelId: defaultH2,
    fuels: fuels.map((f) => ({
      id: f.id,
      name: f.name,
      kind: f.kind,
      isBlend: f.components.length > 0,
      quotes: f.priceQuotes.map((q) => {
        const j = quoteJson(q);
        return {
          id: j.id,
          amount: j.amount,
          transportAdder: j.transportAdder,
          handlingAdder: j.handlingAdder,
          currency: j.currency,
          unit: j.unit,
          energyBasis: j.energyBasis,
          meteringReference: j.meteringReference,
          validFrom: j.validFrom,
          isInvented: j.isInvented,
          supplier: j.supplier,
          withdrawn: j.withdrawnAt !== null,
          supersededBy: f.priceQuotes.find((x) => x.supersedesId === q.id)?.id ?? null,
        };
      }),
    })),
  };
}
