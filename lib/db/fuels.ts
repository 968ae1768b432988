/**
 * The fuel library in the database: create, read, update and delete fuels, blends of stored
 * fuels and their price quotes. Every write is validated first (lib/schemas/library.ts, then
 * the fuel is resolved by lib/fuels so that unknown species or impossible blends are caught)
 * and nothing is stored from rejected input. Results say what went wrong per field.
 */
import type { Fuel, PriceQuote, PrismaClient } from "./generated/client";
import type { FuelDefinition } from "../schemas/fuel";
import { fieldErrors } from "../schemas/fuel";
import { METERING_REFERENCE_C, type MeteringReferenceKey } from "../schemas/plant";
import {
  FUEL_ATTRIBUTE_KEYS,
  fuelInputSchema,
  kindOfDefinition,
  priceQuoteInputSchema,
  type FuelInputParsed,
  type FuelKind,
  type PriceQuoteInputParsed,
} from "../schemas/library";
import { FuelDefinitionError, resolveFuel, type ResolvedFuel } from "../fuels/resolve";
import { heatingValues } from "../combustion/heating-values";
import { PRICE_UNITS, priceQuoteIssues, type PriceQuoteTerms, type PriceUnit, type EnergyBasis } from "../economics/prices";

export type Tx = Omit<PrismaClient, "$connect" | "$disconnect" | "$on" | "$transaction" | "$extends">;

export type FieldErrors = Record<string, string>;
export interface Failure {
  ok: false;
  status: 400 | 404 | 409;
  message: string;
  fieldErrors: FieldErrors;
}
export type Result<T> = { ok: true; value: T } | Failure;

export function fail(status: Failure["status"], message: string, fields: FieldErrors = {}): Failure {
  return { ok: false, status, message, fieldErrors: fields };
}

/** The definition as stored (JSON text → object). */
export function storedDefinition(row: Pick<Fuel, "definition">): FuelDefinition {
  return JSON.parse(row.definition) as FuelDefinition;
}

export function isBlendRow(row: Pick<Fuel, "definition">): boolean {
  return "blend" in storedDefinition(row);
}

/**
 * The definition lib/ evaluates: the stored one plus the row's name and attributes. A blend
 * carries its components' attributes inside and derives its own.
 */
export function effectiveDefinition(row: Fuel): FuelDefinition {
  const def = { ...storedDefinition(row), name: row.name } as FuelDefinition & Record<string, unknown>;
  if ("blend" in def) return def;
  if (row.densityKgPerM3 !== null) def.densityKgPerM3 = row.densityKgPerM3;
  def.biogenicCarbonShare = row.biogenicCarbonShare;
  if (row.upstreamCo2e_kg_per_GJ !== null) def.upstreamCo2e_kg_per_GJ = row.upstreamCo2e_kg_per_GJ;
  return def;
}

/** Resolves a stored fuel (throws FuelDefinitionError when a stored record is broken). */
export function resolveRow(row: Fuel): ResolvedFuel {
  return resolveFuel(effectiveDefinition(row), "definition");
}

function stripAttributes(def: FuelDefinition): FuelDefinition {
  const out = { ...def } as Record<string, unknown>;
  for (const k of FUEL_ATTRIBUTE_KEYS) delete out[k];
  return out as FuelDefinition;
}

/** The columns a validated fuel input becomes. */
interface FuelColumns {
  name: string;
  kind: FuelKind;
  definition: string;
  densityKgPerM3: number | null;
  biogenicCarbonShare: number;
  upstreamCo2e_kg_per_GJ: number | null;
  notes: string;
  source: string;
  isDemo: boolean;
}

interface PreparedFuel {
  columns: FuelColumns;
  components: { componentFuelId: number; share: number; basis: string; position: number }[];
}

/** Checks that the definition describes a fuel lib/ can evaluate and that releases heat. */
function checkResolvable(def: FuelDefinition, fieldPrefix: string, blendField?: string): Result<ResolvedFuel> {
  try {
    const fuel = resolveFuel(def, fieldPrefix);
    const hv = heatingValues(fuel, 25);
    if (!(hv.lhv_MJ_per_kg > 0) || !Number.isFinite(hv.lhv_MJ_per_kg)) {
      return fail(400, "This fuel releases no heat.", {
        [blendField ?? fieldPrefix]: "releases no heat when burnt (no combustible component); it cannot be priced or fired",
      });
    }
    return { ok: true, value: fuel };
  } catch (e) {
    if (e instanceof FuelDefinitionError) {
      const field = blendField ?? e.field;
      return fail(400, e.message, { [field]: e.message.replace(/^[^:]*: /, "") });
    }
    throw e;
  }
}

/** Ids of the fuels that use `fuelId` as a component, directly or through other blends. */
async function dependentBlendIds(tx: Tx, fuelId: number): Promise<number[]> {
  const out: number[] = [];
  const seen = new Set<number>([fuelId]);
  let frontier = [fuelId];
  while (frontier.length) {
    const rows = await tx.blendComponent.findMany({ where: { componentFuelId: { in: frontier } }, select: { blendFuelId: true } });
    frontier = [];
    for (const r of rows) {
      if (!seen.has(r.blendFuelId)) {
        seen.add(r.blendFuelId);
        out.push(r.blendFuelId);
        frontier.push(r.blendFuelId);
      }
    }
  }
  return out;
}

async function prepareFuel(tx: Tx, input: FuelInputParsed, selfId?: number): Promise<Result<PreparedFuel>> {
  const base = {
    name: input.name,
    notes: input.notes,
    source: input.source,
    isDemo: input.isDemo,
  };
  if (input.definition) {
    const def = input.definition as FuelDefinition & Record<string, unknown>;
    // Attributes inside the definition are accepted when the top level does not give them.
    const densityKgPerM3 = input.densityKgPerM3 ?? (def.densityKgPerM3 as number | undefined) ?? null;
    const biogenicCarbonShare = input.biogenicCarbonShare ?? (def.biogenicCarbonShare as number | undefined) ?? 0;
    const upstream = input.upstreamCo2e_kg_per_GJ ?? (def.upstreamCo2e_kg_per_GJ as number | undefined) ?? null;
    const stored = stripAttributes(def);
    const kind = kindOfDefinition(stored);
    if (kind === "gas" && densityKgPerM3 !== null) {
      return fail(400, "A gas's density follows from its composition.", {
        densityKgPerM3: "a gas's density follows from its composition; leave this empty",
      });
    }
    const columns: FuelColumns = {
      ...base,
      kind,
      definition: JSON.stringify(stored),
      densityKgPerM3,
      biogenicCarbonShare,
      upstreamCo2e_kg_per_GJ: upstream,
    };
    const check = checkResolvable(effectiveDefinition({ ...columns, id: 0, createdAt: new Date(), updatedAt: new Date() }), "definition");
    if (!check.ok) return check;
    return { ok: true, value: { columns, components: [] } };
  }

  // A blend of stored fuels.
  const blend = input.blend!;
  const ids = blend.components.map((c) => c.fuelId);
  const rows = await tx.fuel.findMany({ where: { id: { in: ids } } });
  const byId = new Map(rows.map((r) => [r.id, r]));
  const errs: FieldErrors = {};
  blend.components.forEach((c, i) => {
    if (!byId.has(c.fuelId)) errs[`blend.components.${i}.fuelId`] = `no stored fuel with id ${c.fuelId}`;
  });
  if (Object.keys(errs).length) return fail(400, "A blend component does not exist.", errs);
  if (selfId !== undefined) {
    const dependents = new Set(await dependentBlendIds(tx, selfId));
    for (const [i, c] of blend.components.entries()) {
      if (c.fuelId === selfId || dependents.has(c.fuelId)) {
        errs[`blend.components.${i}.fuelId`] = `${byId.get(c.fuelId)!.name} contains this blend; a blend cannot contain itself`;
      }
    }
    if (Object.keys(errs).length) return fail(400, "A blend cannot contain itself.", errs);
  }
  const kinds = new Set(blend.components.map((c) => byId.get(c.fuelId)!.kind));
  if (kinds.size > 1) {
    return fail(400, "Blend components must all be of one kind.", {
      "blend.components": "components must all be gases, all liquids or all solids",
    });
  }
  const kind = [...kinds][0] as FuelKind;
  if (input.kind !== undefined && input.kind !== kind) {
    return fail(400, "The kind does not match the components.", { kind: `the components are ${kind === "gas" ? "gases" : kind + "s"}` });
  }
  const def: FuelDefinition = {
    blend: blend.components.map((c) => ({ fuel: effectiveDefinition(byId.get(c.fuelId)!), share: c.share })),
    basis: blend.basis,
  };
  const check = checkResolvable({ ...def, name: input.name }, "blend", "blend.components");
  if (!check.ok) return check;
  const resolved = check.value;
  const columns: FuelColumns = {
    ...base,
    kind,
    definition: JSON.stringify(def),
    densityKgPerM3: null,
    biogenicCarbonShare: resolved.biogenicCarbonShare,
    upstreamCo2e_kg_per_GJ: resolved.upstreamCo2e_kg_per_GJ ?? null,
  };
  return {
    ok: true,
    value: {
      columns,
      components: blend.components.map((c, position) => ({ componentFuelId: c.fuelId, share: c.share, basis: blend.basis, position })),
    },
  };
}

async function nameTaken(tx: Tx, name: string, exceptId?: number): Promise<Fuel | null> {
  const lower = name.toLowerCase();
  const all = await tx.fuel.findMany({ select: { id: true, name: true } });
  const hit = all.find((f) => f.name.toLowerCase() === lower && f.id !== exceptId);
  return hit ? await tx.fuel.findUnique({ where: { id: hit.id } }) : null;
}

/** zod's built-in type messages, reworded for people filling in a form. */
export function friendlyMessages(errs: FieldErrors): FieldErrors {
  const out: FieldErrors = {};
  for (const [k, v] of Object.entries(errs)) {
    const m = /^Invalid input: expected (\w+), received (\w+)$/.exec(v);
    if (!m) out[k] = v;
    else if (m[2] === "null" || m[2] === "undefined") out[k] = m[1] === "number" ? "enter a number" : "required";
    else out[k] = m[1] === "number" ? "must be a number" : m[1] === "string" ? "must be text" : `must be a ${m[1]}`;
  }
  return out;
}

function parseFuelInput(raw: unknown): Result<FuelInputParsed> {
  const parsed = fuelInputSchema.safeParse(raw);
  if (!parsed.success) return fail(400, "The fuel has errors; nothing was saved.", friendlyMessages(fieldErrors(parsed.error)));
  return { ok: true, value: parsed.data };
}

/** A rejected input also learns whether its name is taken, so that one round trip shows every problem. */
async function withNameCheck(tx: Tx, failure: Failure, raw: unknown, exceptId?: number): Promise<Failure> {
  const name = typeof raw === "object" && raw !== null ? (raw as { name?: unknown }).name : undefined;
  if (typeof name !== "string" || name.trim() === "" || failure.fieldErrors.name) return failure;
  const taken = await nameTaken(tx, name.trim(), exceptId);
  if (!taken) return failure;
  return { ...failure, fieldErrors: { name: `a fuel named "${taken.name}" already exists`, ...failure.fieldErrors } };
}

/** Re-derives every blend that depends on `fuelId` (after an edit of that fuel). */
async function refreshDependentBlends(tx: Tx, fuelId: number): Promise<Result<null>> {
  for (const id of await dependentBlendIds(tx, fuelId)) {
    const blendRow = await tx.fuel.findUniqueOrThrow({ where: { id } });
    const comps = await tx.blendComponent.findMany({ where: { blendFuelId: id }, orderBy: { position: "asc" } });
    const prepared = await prepareFuel(
      tx,
      {
        name: blendRow.name,
        notes: blendRow.notes,
        source: blendRow.source,
        isDemo: blendRow.isDemo,
        blend: { basis: comps[0].basis as "volume" | "mass" | "energy", components: comps.map((c) => ({ fuelId: c.componentFuelId, share: c.share })) },
      } as FuelInputParsed,
      id,
    );
    if (!prepared.ok) {
      return fail(409, `This change would break the blend "${blendRow.name}": ${prepared.message}`, {
        _: `blend "${blendRow.name}" uses this fuel: ${Object.values(prepared.fieldErrors)[0] ?? prepared.message}`,
      });
    }
    await tx.fuel.update({ where: { id }, data: prepared.value.columns });
  }
  return { ok: true, value: null };
}

class Rollback extends Error {
  constructor(public readonly failure: Failure) {
    super(failure.message);
  }
}

export async function inTransaction<T>(db: PrismaClient, fn: (tx: Tx) => Promise<Result<T>>): Promise<Result<T>> {
  try {
    return await db.$transaction(async (tx) => {
      const r = await fn(tx as Tx);
      if (!r.ok) throw new Rollback(r);
      return r;
    });
  } catch (e) {
    if (e instanceof Rollback) return e.failure;
    throw e;
  }
}

/** Creates a fuel inside an open transaction (used by the API and by imports). */
export async function createFuelIn(tx: Tx, raw: unknown): Promise<Result<Fuel>> {
  const input = parseFuelInput(raw);
  if (!input.ok) return withNameCheck(tx, input, raw);
  const taken = await nameTaken(tx, input.value.name);
  if (taken) return fail(409, `A fuel named "${taken.name}" already exists.`, { name: `a fuel named "${taken.name}" already exists` });
  const prepared = await prepareFuel(tx, input.value);
  if (!prepared.ok) return prepared;
  const fuel = await tx.fuel.create({ data: prepared.value.columns });
  for (const c of prepared.value.components) await tx.blendComponent.create({ data: { ...c, blendFuelId: fuel.id } });
  return { ok: true, value: fuel };
}

export async function createFuel(db: PrismaClient, raw: unknown): Promise<Result<Fuel>> {
  return inTransaction(db, (tx) => createFuelIn(tx, raw));
}

export async function updateFuel(db: PrismaClient, id: number, raw: unknown): Promise<Result<Fuel>> {
  const existing = await db.fuel.findUnique({ where: { id } });
  if (!existing) return fail(404, `No fuel with id ${id}.`);
  const input = parseFuelInput(raw);
  if (!input.ok) return withNameCheck(db, input, raw, id);
  return inTransaction(db, async (tx) => {
    const taken = await nameTaken(tx, input.value.name, id);
    if (taken) return fail(409, `A fuel named "${taken.name}" already exists.`, { name: `a fuel named "${taken.name}" already exists` });
    const prepared = await prepareFuel(tx, input.value, id);
    if (!prepared.ok) return prepared;
    const fuel = await tx.fuel.update({ where: { id }, data: prepared.value.columns });
    await tx.blendComponent.deleteMany({ where: { blendFuelId: id } });
    for (const c of prepared.value.components) await tx.blendComponent.create({ data: { ...c, blendFuelId: id } });
    const refreshed = await refreshDependentBlends(tx, id);
    if (!refreshed.ok) return refreshed;
    return { ok: true, value: fuel };
  });
}

/** What stops a fuel from being deleted (blends, plants, scenarios that use it). */
export async function fuelUsage(db: PrismaClient | Tx, id: number): Promise<string[]> {
  const [blends, plants, scenarios] = await Promise.all([
    db.blendComponent.findMany({ where: { componentFuelId: id }, include: { blend: { select: { name: true } } } }),
    db.plant.findMany({ where: { baselineFuelId: id }, select: { name: true } }),
    db.scenario.findMany({ where: { fuelId: id }, include: { study: { select: { name: true } } } }),
  ]);
  return [
    ...blends.map((b) => `blend "${b.blend.name}"`),
    ...plants.map((p) => `baseline fuel of plant "${p.name}"`),
    ...scenarios.map((s) => `scenario "${s.name}" in study "${s.study.name}"`),
  ];
}

export async function deleteFuel(db: PrismaClient, id: number): Promise<Result<Fuel>> {
  return inTransaction(db, async (tx) => {
    const existing = await tx.fuel.findUnique({ where: { id } });
    if (!existing) return fail(404, `No fuel with id ${id}.`);
    const usage = await fuelUsage(tx, id);
    if (usage.length) {
      return fail(409, `"${existing.name}" is in use: ${usage.join("; ")}. Change or delete those first.`, { _: `in use: ${usage.join("; ")}` });
    }
    await tx.fuel.delete({ where: { id } });
    return { ok: true, value: existing };
  });
}

/* ---------------------------------------------------------------- price quotes */

/** The quote's terms in the form lib/economics/prices.ts takes them. */
export function quoteTerms(q: Pick<PriceQuote, "amount" | "unit" | "energyBasis" | "meteringReference" | "transportAdder" | "handlingAdder">): PriceQuoteTerms {
  return {
    amount: q.amount,
    unit: q.unit as PriceUnit,
    energyBasis: (q.energyBasis as EnergyBasis | null) ?? null,
    meteringReferenceC: q.meteringReference ? METERING_REFERENCE_C[q.meteringReference as MeteringReferenceKey] : null,
    transportAdder: q.transportAdder,
    handlingAdder: q.handlingAdder,
  };
}

function quoteColumns(q: PriceQuoteInputParsed) {
  return {
    amount: q.amount,
    currency: q.currency,
    unit: q.unit,
    energyBasis: q.energyBasis ?? null,
    meteringReference: q.meteringReference ?? null,
    transportAdder: q.transportAdder,
    handlingAdder: q.handlingAdder,
    validFrom: new Date(q.validFrom + "T00:00:00Z"),
    sourceNote: q.sourceNote,
    isInvented: q.isInvented,
  };
}

/** Validates a quote against its fuel (unit, basis, metering reference, density). */
export function checkQuoteForFuel(fuel: Fuel, raw: unknown): Result<PriceQuoteInputParsed> {
  const parsed = priceQuoteInputSchema.safeParse(raw);
  if (!parsed.success) {
    // Also say what is wrong with the unit, basis and reference, so that one answer lists every problem.
    const errs = friendlyMessages(fieldErrors(parsed.error));
    const r = (typeof raw === "object" && raw !== null ? raw : {}) as Record<string, unknown>;
    if ((PRICE_UNITS as readonly unknown[]).includes(r.unit) && !errs.energyBasis && !errs.meteringReference) {
      const fit = quoteFitErrors(fuel, {
        unit: r.unit as PriceUnit,
        energyBasis: (r.energyBasis as EnergyBasis | null | undefined) ?? null,
        meteringReference: (r.meteringReference as MeteringReferenceKey | null | undefined) ?? null,
      });
      for (const [k, v] of Object.entries(fit)) if (!(k in errs)) errs[k] = v;
    }
    return fail(400, "The price quote has errors; nothing was saved.", errs);
  }
  const q = parsed.data;
  const errs = quoteFitErrors(fuel, q);
  if (Object.keys(errs).length) return fail(400, "The price quote does not fit this fuel; nothing was saved.", errs);
  return { ok: true, value: q };
}

function quoteFitErrors(
  fuel: Fuel,
  q: { unit: PriceUnit; energyBasis?: EnergyBasis | null; meteringReference?: MeteringReferenceKey | null },
): FieldErrors {
  let hasDensity = false;
  if (fuel.kind !== "gas") {
    try {
      hasDensity = (resolveRow(fuel).density_kg_per_m3 ?? 0) > 0;
    } catch {
      hasDensity = fuel.densityKgPerM3 !== null;
    }
  }
  const issues = priceQuoteIssues(
    { unit: q.unit, energyBasis: q.energyBasis ?? null, meteringReferenceC: q.meteringReference ? METERING_REFERENCE_C[q.meteringReference] : null },
    { kind: fuel.kind as FuelKind, hasDensity },
  );
  const errs: FieldErrors = {};
  for (const i of issues) {
    const field = i.field === "density" ? "unit" : i.field === "meteringReferenceC" ? "meteringReference" : i.field;
    if (!(field in errs)) errs[field] = i.message;
  }
  return errs;
}

/** Adds a quote inside an open transaction (used by the API and by imports). */
export async function addPriceQuoteIn(tx: Tx, fuelId: number, raw: unknown): Promise<Result<PriceQuote>> {
  const fuel = await tx.fuel.findUnique({ where: { id: fuelId } });
  if (!fuel) return fail(404, `No fuel with id ${fuelId}.`);
  const checked = checkQuoteForFuel(fuel, raw);
  if (!checked.ok) return checked;
  const quote = await tx.priceQuote.create({ data: { ...quoteColumns(checked.value), fuelId } });
  return { ok: true, value: quote };
}

export async function addPriceQuote(db: PrismaClient, fuelId: number, raw: unknown): Promise<Result<PriceQuote>> {
  return inTransaction(db, (tx) => addPriceQuoteIn(tx, fuelId, raw));
}

export async function updatePriceQuote(db: PrismaClient, fuelId: number, quoteId: number, raw: unknown): Promise<Result<PriceQuote>> {
  const existing = await db.priceQuote.findUnique({ where: { id: quoteId }, include: { fuel: true } });
  if (!existing || existing.fuelId !== fuelId) return fail(404, `No price quote ${quoteId} for fuel ${fuelId}.`);
  const checked = checkQuoteForFuel(existing.fuel, raw);
  if (!checked.ok) return checked;
  const quote = await db.priceQuote.update({ where: { id: quoteId }, data: quoteColumns(checked.value) });
  return { ok: true, value: quote };
}

export async function deletePriceQuote(db: PrismaClient, fuelId: number, quoteId: number): Promise<Result<PriceQuote>> {
  const existing = await db.priceQuote.findUnique({ where: { id: quoteId } });
  if (!existing || existing.fuelId !== fuelId) return fail(404, `No price quote ${quoteId} for fuel ${fuelId}.`);
  await db.priceQuote.delete({ where: { id: quoteId } });
  return { ok: true, value: existing };
}

/** Quotes of a fuel, newest valid-from first (then newest entered). */
export async function listPriceQuotes(db: PrismaClient, fuelId: number): Promise<PriceQuote[]> {
  return db.priceQuote.findMany({ where: { fuelId }, orderBy: [{ validFrom: "desc" }, { createdAt: "desc" }, { id: "desc" }] });
}

/** The quote in force on `asOf`: the latest valid-from not after it (quotes sorted newest first). */
export function currentQuote<Q extends Pick<PriceQuote, "validFrom">>(quotesNewestFirst: Q[], asOf: Date = new Date()): Q | undefined {
  return quotesNewestFirst.find((q) => q.validFrom.getTime() <= asOf.getTime());
}

/** The API/JSON form of a quote. */
export function quoteJson(q: PriceQuote) {
  return {
    id: q.id,
    fuelId: q.fuelId,
    amount: q.amount,
    currency: q.currency,
    unit: q.unit,
    energyBasis: q.energyBasis,
    meteringReference: q.meteringReference,
    transportAdder: q.transportAdder,
    handlingAdder: q.handlingAdder,
    validFrom: q.validFrom.toISOString().slice(0, 10),
    sourceNote: q.sourceNote,
    isInvented: q.isInvented,
    createdAt: q.createdAt.toISOString(),
  };
}
