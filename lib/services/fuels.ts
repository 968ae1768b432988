/**
 * The fuel library: create, update and delete fuels, blends of stored fuels and their price
 * quotes. Every write is validated first (lib/schemas/library.ts, then the fuel is resolved by
 * lib/fuels so that unknown species or impossible blends are caught, then the quote's fit to the
 * fuel) and nothing is stored from rejected input. Problems name the field.
 */
import { inTransaction, type Db, type DbOrTx, type Tx } from "../db/client";
import {
  blendComponentsOf,
  deleteFuelRow,
  dependentBlendIds,
  effectiveDefinition,
  findFuel,
  findFuels,
  fuelColumns,
  fuelJson,
  fuelNames,
  fuelUsers,
  insertFuel,
  replaceFuel,
  setFuelTrashed,
  updateFuelColumns,
  type BlendComponentColumns,
  type FuelColumns,
  type FuelRow,
} from "../db/fuel-rows";
import {
  deleteQuoteRow,
  findQuote,
  findQuoteWithFuel,
  insertQuote,
  insertQuoteVersion,
  quoteSuccessors,
  revisionsUsingFuelQuotes,
  revisionsUsingQuote,
  scenariosChoosingQuote,
  withdrawQuoteRow,
  type PriceQuoteRow,
} from "../db/price-quote-rows";
import { listRates, rateJson } from "../db/exchange-rate-rows";
import { rateInForce } from "../economics/currency";
import { liveQuotes } from "./quote-choice";
import { PLAUSIBILITY_CURRENCY, priceWarning, type PlausibilityWarning } from "../economics/plausibility";
import type { FuelDefinition } from "../schemas/fuel";
import { fieldErrors } from "../schemas/fuel";
import { METERING_REFERENCE_C, type MeteringReferenceKey } from "../schemas/plant";
import {
  fuelInputSchema,
  kindOfDefinition,
  priceQuoteInputSchema,
  type FuelInputParsed,
  type FuelKind,
  type PriceQuoteInputParsed,
} from "../schemas/library";
import { resolveFuel, type ResolvedFuel } from "../fuels/resolve";
import { heatingValues } from "../combustion/heating-values";
import { PRICE_UNITS, priceQuoteIssues, type EnergyBasis, type PriceQuoteTerms, type PriceUnit } from "../economics/prices";
import { MAX_JSON_DEPTH, tooDeepAt } from "../formats/json-depth";
import { asStokeError, ok, problem, problemFromError, type FieldErrors, type Problem, type Result } from "./result";
import { InfeasibleChargeError } from "../errors";
import { lookAlikeKey } from "../schemas/names";
import { currentActor } from "./actor";
import { trashEnabled } from "./mode";
import { recordChange } from "./change-log";

export { effectiveDefinition, findFuel, fuelJson };

/** Resolves a stored fuel (throws the resolver's input error when a stored record is broken). */
export function resolveRow(row: FuelRow): ResolvedFuel {
  return resolveFuel(effectiveDefinition(row), "definition");
}

interface PreparedFuel {
  columns: FuelColumns;
  components: BlendComponentColumns[];
}

/** Checks that the definition describes a fuel lib/ can evaluate and that releases heat. */
function checkResolvable(def: FuelDefinition, fieldPrefix: string, blendField?: string): Result<ResolvedFuel> {
  let fuel: ResolvedFuel | undefined;
  let lhv_MJ_per_kg: number;
  try {
    fuel = resolveFuel(def, fieldPrefix);
    lhv_MJ_per_kg = heatingValues(fuel, 25).lhv_MJ_per_kg;
  } catch (e) {
    // Nothing combustible is a property of the definition the user typed: a field error, not an infeasible charge.
    if (e instanceof InfeasibleChargeError && e.reason === "no-combustible") lhv_MJ_per_kg = 0;
    else return problemFromError(e, { fieldOf: (f) => blendField ?? f });
  }
  if (!(lhv_MJ_per_kg > 0) || !Number.isFinite(lhv_MJ_per_kg)) {
    return problem("invalid", "This fuel releases no heat.", {
      [blendField ?? fieldPrefix]: "releases no heat when burnt (no combustible component); it cannot be priced or fired",
    });
  }
  return ok(fuel as ResolvedFuel);
}

async function prepareFuel(tx: DbOrTx, input: FuelInputParsed, selfId?: number): Promise<Result<PreparedFuel>> {
  const base = { name: input.name, notes: input.notes, source: input.source, isDemo: input.isDemo };
  if (input.definition) {
    const def = input.definition;
    // Attributes inside the definition are accepted when the top level does not give them.
    const densityKgPerM3 = input.densityKgPerM3 ?? def.densityKgPerM3 ?? null;
    const kind = kindOfDefinition(def);
    if (kind === "gas" && densityKgPerM3 !== null) {
      return problem("invalid", "A gas's density follows from its composition.", {
        densityKgPerM3: "a gas's density follows from its composition; leave this empty",
      });
    }
    const columns = fuelColumns({
      ...base,
      kind,
      definition: def,
      densityKgPerM3,
      biogenicCarbonShare: input.biogenicCarbonShare ?? def.biogenicCarbonShare ?? 0,
      upstreamCo2e_kg_per_GJ: input.upstreamCo2e_kg_per_GJ ?? def.upstreamCo2e_kg_per_GJ ?? null,
    });
    const check = checkResolvable(effectiveDefinition(columns), "definition");
    if (!check.ok) return check;
    return ok({ columns, components: [] });
  }

  // A blend of stored fuels (the schema requires a definition or a blend).
  const blend = input.blend;
  if (!blend) return problem("invalid", "Give a definition or a blend.", { definition: "give a definition or a blend" });
  const rows = await findFuels(
    tx,
    blend.components.map((c) => c.fuelId),
  );
  const byId = new Map(rows.map((r) => [r.id, r]));
  const errs: FieldErrors = {};
  blend.components.forEach((c, i) => {
    if (!byId.has(c.fuelId)) errs[`blend.components.${i}.fuelId`] = `no stored fuel with id ${c.fuelId}`;
  });
  if (Object.keys(errs).length) return problem("invalid", "A blend component does not exist.", errs);
  const component = (id: number): FuelRow => byId.get(id) as FuelRow; // present: checked above
  if (selfId !== undefined) {
    const dependents = new Set(await dependentBlendIds(tx, selfId));
    for (const [i, c] of blend.components.entries()) {
      if (c.fuelId === selfId || dependents.has(c.fuelId)) {
        errs[`blend.components.${i}.fuelId`] = `${component(c.fuelId).name} contains this blend; a blend cannot contain itself`;
      }
    }
    if (Object.keys(errs).length) return problem("invalid", "A blend cannot contain itself.", errs);
  }
  const kinds = new Set(blend.components.map((c) => component(c.fuelId).kind as FuelKind));
  if (kinds.size > 1) {
    return problem("invalid", "Blend components must all be of one kind.", {
      "blend.components": "components must all be gases, all liquids or all solids",
    });
  }
  const [kind] = kinds;
  if (input.kind !== undefined && input.kind !== kind) {
    return problem("invalid", "The kind does not match the components.", {
      kind: `the components are ${kind === "gas" ? "gases" : `${kind}s`}`,
    });
  }
  const def: FuelDefinition = {
    blend: blend.components.map((c) => ({ fuel: effectiveDefinition(component(c.fuelId)), share: c.share })),
    basis: blend.basis,
  };
  const check = checkResolvable({ ...def, name: input.name }, "blend", "blend.components");
  if (!check.ok) return check;
  const resolved = check.value;
  return ok({
    columns: fuelColumns({
      ...base,
      kind,
      definition: def,
      densityKgPerM3: null,
      biogenicCarbonShare: resolved.biogenicCarbonShare,
      upstreamCo2e_kg_per_GJ: resolved.upstreamCo2e_kg_per_GJ ?? null,
    }),
    components: blend.components.map((c, position) => ({ componentFuelId: c.fuelId, share: c.share, basis: blend.basis, position })),
  });
}

/**
 * The fuel that already carries this name or one that looks the same (any letter case, full-width or
 * ligature forms, repeated spaces: lookAlikeKey), other than `exceptId`.
 */
async function nameTaken(tx: DbOrTx, name: string, exceptId?: number, known?: NameKeys): Promise<string | null> {
  const key = lookAlikeKey(name);
  if (known) return known.get(key) ?? null;
  const f = (await fuelNames(tx, true)).find((f) => lookAlikeKey(f.name) === key && f.id !== exceptId);
  return f ? takenName(f) : null;
}

/** Look-alike key → name of every fuel, for a bulk writer that creates many fuels (an import) to check names without reading them all each time. */
export type NameKeys = Map<string, string>;

export async function fuelNameKeys(tx: DbOrTx): Promise<NameKeys> {
  return new Map((await fuelNames(tx, true)).map((f) => [lookAlikeKey(f.name), takenName(f)]));
}

/** A taken name as the conflict message quotes it (the message closes the quote), saying when it is in the trash. */
const takenName = (f: { name: string; deletedAt: Date | null }) => `${f.name}${f.deletedAt ? '" (in the trash)' : '"'}`;

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
  // Blends nest: refuse a document deeper than any fuel needs before the recursive schema walks it.
  const deep = tooDeepAt(raw);
  if (deep !== null) {
    const field = deep.split(".")[0] || "_";
    return problem("invalid", `The fuel is nested more than ${MAX_JSON_DEPTH} levels deep; nothing was saved.`, {
      [field]: `nested more than ${MAX_JSON_DEPTH} levels deep`,
    });
  }
  const parsed = fuelInputSchema.safeParse(raw);
  if (!parsed.success) return problem("invalid", "The fuel has errors; nothing was saved.", friendlyMessages(fieldErrors(parsed.error)));
  return ok(parsed.data);
}

/** A rejected input also learns whether its name is taken, so that one round trip shows every problem. */
async function withNameCheck(tx: DbOrTx, failure: Problem, raw: unknown, exceptId?: number): Promise<Problem> {
  const name = typeof raw === "object" && raw !== null && "name" in raw ? raw.name : undefined;
  if (typeof name !== "string" || name.trim() === "" || failure.fieldErrors.name) return failure;
  const taken = await nameTaken(tx, name.trim(), exceptId);
  if (!taken) return failure;
  return { ...failure, fieldErrors: { name: `a fuel named "${taken} already exists`, ...failure.fieldErrors } };
}

/** `taken` is the name with its closing quote and, for a fuel in the trash, a note (nameTaken). */
const nameConflict = (taken: string) =>
  problem("conflict", `A fuel named "${taken} already exists.`, {
    name: `a fuel named "${taken} already exists (or one that looks the same)`,
  });

/** A fuel as the change log keeps it: its JSON form and, for a blend, its component rows. */
async function fuelRecord(tx: DbOrTx, row: FuelRow) {
  const comps = isBlendDefinition(row) ? await blendComponentsOf(tx, row.id) : [];
  const { createdAt: _c, updatedAt: _u, ...rest } = fuelJson(row);
  return {
    ...rest,
    blend: comps.length ? { basis: comps[0].basis, components: comps.map((c) => ({ fuelId: c.componentFuelId, share: c.share })) } : null,
  };
}

const isBlendDefinition = (row: FuelRow) => row.definition.includes('"blend"');

/** A price quote as the change log keeps it. */
function quoteRecord(q: PriceQuoteRow) {
  const { createdAt: _c, ...rest } = q;
  return rest;
}

/** Re-derives every blend that depends on `fuelId` (after an edit of that fuel). */
async function refreshDependentBlends(tx: Tx, fuelId: number): Promise<Result<null>> {
  for (const id of await dependentBlendIds(tx, fuelId)) {
    const blendRow = await findFuel(tx, id);
    const comps = await blendComponentsOf(tx, id);
    const basis = comps[0]?.basis;
    if (!blendRow || (basis !== "volume" && basis !== "mass" && basis !== "energy")) {
      throw new Error(`stored blend ${id} is missing or has no valid basis (${String(basis)})`);
    }
    const prepared = await prepareFuel(
      tx,
      {
        name: blendRow.name,
        notes: blendRow.notes,
        source: blendRow.source,
        isDemo: blendRow.isDemo,
        blend: { basis, components: comps.map((c) => ({ fuelId: c.componentFuelId, share: c.share })) },
      },
      id,
    );
    if (!prepared.ok) {
      return problem("conflict", `This change would break the blend "${blendRow.name}": ${prepared.message}`, {
        _: `blend "${blendRow.name}" uses this fuel: ${Object.values(prepared.fieldErrors)[0] ?? prepared.message}`,
      });
    }
    const before = await fuelRecord(tx, blendRow);
    const after = await fuelRecord(tx, await updateFuelColumns(tx, id, prepared.value.columns));
    await recordChange(tx, {
      subject: { type: "fuel", id },
      entity: "fuel",
      entityId: id,
      action: "update",
      summary: `re-derived after its component #${fuelId} changed`,
      before,
      after,
    });
  }
  return ok(null);
}

/** Creates a fuel inside an open transaction (used by the API, by imports and by the seeder). */
/**
 * Creates a fuel inside an open transaction (used by the API, by imports and by the seeder).
 * `known`: the library's names by look-alike key, kept current by the caller's writes (bulk imports).
 */
export async function createFuelIn(tx: Tx, raw: unknown, known?: NameKeys): Promise<Result<FuelRow>> {
  const input = parseFuelInput(raw);
  if (!input.ok) return withNameCheck(tx, input, raw);
  const taken = await nameTaken(tx, input.value.name, undefined, known);
  if (taken) return nameConflict(taken);
  const prepared = await prepareFuel(tx, input.value);
  if (!prepared.ok) return prepared;
  const row = await insertFuel(tx, prepared.value.columns, prepared.value.components);
  known?.set(lookAlikeKey(row.name), takenName({ name: row.name, deletedAt: null }));
  await recordChange(tx, {
    subject: { type: "fuel", id: row.id },
    entity: "fuel",
    entityId: row.id,
    action: "create",
    after: await fuelRecord(tx, row),
  });
  return ok(row);
}

export function createFuel(db: Db, raw: unknown): Promise<Result<FuelRow>> {
  return inTransaction(db, (tx) => createFuelIn(tx, raw));
}

export async function updateFuel(db: Db, id: number, raw: unknown): Promise<Result<FuelRow>> {
  const existing = await findFuel(db, id);
  if (!existing) return problem("not-found", `No fuel with id ${id}.`);
  const input = parseFuelInput(raw);
  if (!input.ok) return withNameCheck(db, input, raw, id);
  return inTransaction(db, async (tx): Promise<Result<FuelRow>> => {
    const taken = await nameTaken(tx, input.value.name, id);
    if (taken) return nameConflict(taken);
    const prepared = await prepareFuel(tx, input.value, id);
    if (!prepared.ok) return prepared;
    const before = await fuelRecord(tx, existing);
    const fuel = await replaceFuel(tx, id, prepared.value.columns, prepared.value.components);
    await recordChange(tx, {
      subject: { type: "fuel", id },
      entity: "fuel",
      entityId: id,
      action: "update",
      before,
      after: await fuelRecord(tx, fuel),
    });
    const refreshed = await refreshDependentBlends(tx, id);
    if (!refreshed.ok) return refreshed;
    return ok(fuel);
  });
}

/** What stops a fuel from being deleted (blends, plants, scenarios and hydrogen sweeps of studies that use it). */
export async function fuelUsage(db: DbOrTx, id: number): Promise<string[]> {
  const u = await fuelUsers(db, id);
  return [
    ...u.blends.map((b) => `blend "${b}"`),
    ...u.plants.map((p) => `baseline fuel of plant "${p}"`),
    ...u.scenarios.map((s) => `scenario "${s.scenario}" in study "${s.study}"`),
    ...u.hydrogenOfStudies.map((s) => `hydrogen of the sweep of study "${s}"`),
  ];
}

/**
 * DELETE /api/fuels/{id}: refused while a blend, plant or scenario uses the fuel — those in the trash
 * too, so that whatever is restored finds its fuel — or an issued revision used its quotes. With the
 * trash on (team mode) the fuel moves there: lists, look-ups, exports and studies no longer see it,
 * its name stays taken. Without it (personal mode) it is deleted at once with its quotes.
 */
export function deleteFuel(db: Db, id: number): Promise<Result<FuelRow>> {
  return inTransaction(db, async (tx): Promise<Result<FuelRow>> => {
    const existing = await findFuel(tx, id);
    if (!existing) return problem("not-found", `No fuel with id ${id}.`);
    if (!trashEnabled()) return purgeFuelIn(tx, existing, "delete");
    const blocked = await fuelDeletionBlockers(tx, existing);
    if (blocked) return blocked;
    const trashed = await setFuelTrashed(tx, id, new Date(), currentActor().name);
    await recordChange(tx, { subject: { type: "fuel", id }, entity: "fuel", entityId: id, action: "trash", summary: "moved to the trash" });
    return ok(trashed);
  });
}

/** Why a fuel cannot leave the library (a conflict naming its users), or null. */
export async function fuelDeletionBlockers(tx: DbOrTx, existing: FuelRow): Promise<Problem | null> {
  const usage = await fuelUsage(tx, existing.id);
  const revs = (await revisionsUsingFuelQuotes(tx, existing.id)).map(
    (u) => `revision ${u.revision.number} of study "${u.revision.study.name}" (its quotes)`,
  );
  usage.push(...new Set(revs));
  if (!usage.length) return null;
  return problem("conflict", `"${existing.name}" is in use: ${usage.join("; ")}. Change or delete those first.`, {
    _: `in use: ${usage.join("; ")}`,
  });
}

/** Deletes a fuel for good with its quotes (the trash's purge, or a delete without the trash; nothing may use it). */
export async function purgeFuelIn(tx: Tx, existing: FuelRow, action: "purge" | "delete" = "purge"): Promise<Result<FuelRow>> {
  const blocked = await fuelDeletionBlockers(tx, existing);
  if (blocked) return blocked;
  const before = await fuelRecord(tx, existing);
  await deleteFuelRow(tx, existing.id);
  await recordChange(tx, { subject: { type: "fuel", id: existing.id }, entity: "fuel", entityId: existing.id, action, before });
  return ok(existing);
}

/* ---------------------------------------------------------------- price quotes */

/** The quote's terms in the form lib/economics/prices.ts takes them. */
export function quoteTerms(
  q: Pick<PriceQuoteRow, "amount" | "unit" | "energyBasis" | "meteringReference" | "transportAdder" | "handlingAdder">,
): PriceQuoteTerms {
  return {
    amount: q.amount,
    unit: q.unit as PriceUnit,
    energyBasis: (q.energyBasis as EnergyBasis | null) ?? null,
    meteringReferenceC: q.meteringReference ? METERING_REFERENCE_C[q.meteringReference as MeteringReferenceKey] : null,
    transportAdder: q.transportAdder,
    handlingAdder: q.handlingAdder,
  };
}

/** The quote in force on `asOf`: the latest valid-from not after it (quotes sorted newest first). */
export function currentQuote(quotesNewestFirst: PriceQuoteRow[], asOf: Date = new Date()): PriceQuoteRow | undefined {
  // Withdrawn quotes and quotes a correction superseded price nothing.
  return liveQuotes(quotesNewestFirst).find((q) => q.validFrom.getTime() <= asOf.getTime());
}

const isPriceUnit = (u: unknown): u is PriceUnit => (PRICE_UNITS as readonly unknown[]).includes(u);
const isEnergyBasis = (b: unknown): b is EnergyBasis => b === "gross" || b === "net";
const isMeteringReference = (m: unknown): m is MeteringReferenceKey => typeof m === "string" && m in METERING_REFERENCE_C;

/** Validates a quote against its fuel (unit, basis, metering reference, density). */
export function checkQuoteForFuel(fuel: FuelRow, raw: unknown): Result<PriceQuoteInputParsed> {
  const parsed = priceQuoteInputSchema.safeParse(raw);
  if (!parsed.success) {
    // Also say what is wrong with the unit, basis and reference, so that one answer lists every problem.
    const errs = friendlyMessages(fieldErrors(parsed.error));
    const r: Record<string, unknown> = typeof raw === "object" && raw !== null ? { ...raw } : {};
    if (isPriceUnit(r.unit) && !errs.energyBasis && !errs.meteringReference) {
      const fit = quoteFitErrors(fuel, {
        unit: r.unit,
        energyBasis: isEnergyBasis(r.energyBasis) ? r.energyBasis : null,
        meteringReference: isMeteringReference(r.meteringReference) ? r.meteringReference : null,
      });
      for (const [k, v] of Object.entries(fit)) if (!(k in errs)) errs[k] = v;
    }
    return problem("invalid", "The price quote has errors; nothing was saved.", errs);
  }
  const q = parsed.data;
  const errs = quoteFitErrors(fuel, q);
  if (Object.keys(errs).length) return problem("invalid", "The price quote does not fit this fuel; nothing was saved.", errs);
  return ok(q);
}

function quoteFitErrors(
  fuel: FuelRow,
  q: { unit: PriceUnit; energyBasis?: EnergyBasis | null; meteringReference?: MeteringReferenceKey | null },
): FieldErrors {
  let hasDensity = false;
  if (fuel.kind !== "gas") {
    try {
      hasDensity = (resolveRow(fuel).density_kg_per_m3 ?? 0) > 0;
    } catch (e) {
      // A stored fuel that no longer resolves: its density column is all that can be known.
      if (!asStokeError(e)) throw e;
      hasDensity = fuel.densityKgPerM3 !== null;
    }
  }
  const issues = priceQuoteIssues(
    {
      unit: q.unit,
      energyBasis: q.energyBasis ?? null,
      meteringReferenceC: q.meteringReference ? METERING_REFERENCE_C[q.meteringReference] : null,
    },
    { kind: fuel.kind as FuelKind, hasDensity },
  );
  const errs: FieldErrors = {};
  for (const i of issues) {
    const field = i.field === "density" ? "unit" : i.field === "meteringReferenceC" ? "meteringReference" : i.field;
    if (!(field in errs)) errs[field] = i.message;
  }
  return errs;
}

/** A stored quote with the plausibility warnings the user confirmed or that could not be checked. */
export type QuoteSaved = PriceQuoteRow & { warnings: string[] };

/** Splits the confirmation flag off a quote body (it is not part of the quote). */
function confirmation(raw: unknown): { body: unknown; confirm: boolean } {
  if (typeof raw !== "object" || raw === null || Array.isArray(raw) || !("confirmImplausible" in raw)) return { body: raw, confirm: false };
  const { confirmImplausible, ...body } = raw as Record<string, unknown>;
  return { body, confirm: confirmImplausible === true };
}

/** The plausibility warning of a delivered price (lib/economics/plausibility.ts), converting to EUR at the rate in force. */
export async function quotePlausibility(tx: DbOrTx, q: PriceQuoteInputParsed): Promise<PlausibilityWarning | null> {
  const delivered = q.amount + q.transportAdder + q.handlingAdder;
  let factor: number | null = 1;
  if (q.currency !== PLAUSIBILITY_CURRENCY) {
    factor = rateInForce((await listRates(tx)).map(rateJson), q.currency, PLAUSIBILITY_CURRENCY, q.validFrom)?.factor ?? null;
  }
  return priceWarning(delivered, q.unit, q.currency, factor);
}

/** Validates a quote for its fuel and checks its plausibility; an implausible price needs `confirmImplausible: true`. */
export async function checkQuoteWrite(
  tx: DbOrTx,
  fuel: FuelRow,
  raw: unknown,
): Promise<Result<{ quote: PriceQuoteInputParsed; warnings: string[] }>> {
  const { body, confirm } = confirmation(raw);
  const checked = checkQuoteForFuel(fuel, body);
  if (!checked.ok) return checked;
  const w = await quotePlausibility(tx, checked.value);
  if (w?.blocking && !confirm) {
    return {
      ...problem(
        "unprocessable",
        `The price looks implausible; nothing was saved. Check it, or send it again with "confirmImplausible": true to store it.`,
        { [w.field]: w.message },
      ),
      warnings: [w.message],
    };
  }
  return ok({ quote: checked.value, warnings: w ? [w.message] : [] });
}

/** Adds a quote inside an open transaction (used by the API, by imports and by the seeder). */
export async function addPriceQuoteIn(tx: DbOrTx, fuelId: number, raw: unknown): Promise<Result<QuoteSaved>> {
  const fuel = await findFuel(tx, fuelId);
  if (!fuel) return problem("not-found", `No fuel with id ${fuelId}.`);
  const checked = await checkQuoteWrite(tx, fuel, raw);
  if (!checked.ok) return checked;
  const row = await insertQuote(tx, fuelId, checked.value.quote);
  await recordChange(tx, {
    subject: { type: "fuel", id: fuelId },
    entity: "quote",
    entityId: row.id,
    action: "create",
    after: quoteRecord(row),
  });
  return ok({ ...row, warnings: checked.value.warnings });
}

export function addPriceQuote(db: Db, fuelId: number, raw: unknown): Promise<Result<QuoteSaved>> {
  return inTransaction(db, (tx) => addPriceQuoteIn(tx, fuelId, raw));
}

/**
 * Corrects a quote: never in place. The correction is a new quote that supersedes the old one; the
 * old one stays on record (shown as superseded) and whatever chose it now uses the newest version
 * (an issued revision keeps its own frozen copy). A superseded or withdrawn quote cannot be corrected.
 */
export function correctPriceQuote(db: Db, fuelId: number, quoteId: number, raw: unknown): Promise<Result<QuoteSaved>> {
  return inTransaction(db, async (tx): Promise<Result<QuoteSaved>> => {
    const existing = await findQuoteWithFuel(tx, quoteId);
    if (!existing || existing.fuelId !== fuelId || existing.fuel.deletedAt !== null)
      return problem("not-found", `No price quote ${quoteId} for fuel ${fuelId}.`);
    const later = await quoteSuccessors(tx, quoteId);
    if (later.length)
      return problem("conflict", `Quote #${quoteId} was already corrected by quote #${later[0].id}; correct that one.`, {
        _: `superseded by quote #${later[0].id}`,
      });
    if (existing.withdrawnAt)
      return problem(
        "conflict",
        `Quote #${quoteId} was withdrawn on ${existing.withdrawnAt.toISOString().slice(0, 10)}; add a new quote instead.`,
        { _: "withdrawn" },
      );
    const checked = await checkQuoteWrite(tx, existing.fuel, raw);
    if (!checked.ok) return checked;
    const row = await insertQuoteVersion(tx, fuelId, quoteId, checked.value.quote);
    const { fuel: _f, ...old } = existing;
    await recordChange(tx, {
      subject: { type: "fuel", id: fuelId },
      entity: "quote",
      entityId: row.id,
      action: "correct",
      summary: `quote #${row.id} corrects quote #${quoteId}`,
      before: quoteRecord(old),
      after: quoteRecord(row),
    });
    return ok({ ...row, warnings: checked.value.warnings });
  });
}

/** The issued revisions that used a quote, as "revision N of study "name"". */
async function revisionUsers(tx: DbOrTx, quoteId: number): Promise<string[]> {
  return (await revisionsUsingQuote(tx, quoteId)).map((u) => `revision ${u.revision.number} of study "${u.revision.study.name}"`);
}

/**
 * Deletes a quote that nothing relies on. Refused (conflict) when an issued revision used it (naming
 * the revision), when a live study chose it (withdraw it instead: those studies then say which quote
 * they use), or when it is part of a correction history.
 */
export function deletePriceQuote(db: Db, fuelId: number, quoteId: number): Promise<Result<PriceQuoteRow>> {
  return inTransaction(db, async (tx): Promise<Result<PriceQuoteRow>> => {
    const existing = await findQuote(tx, quoteId);
    if (!existing || existing.fuelId !== fuelId || !(await findFuel(tx, fuelId)))
      return problem("not-found", `No price quote ${quoteId} for fuel ${fuelId}.`);
    const revs = await revisionUsers(tx, quoteId);
    if (revs.length)
      return problem("conflict", `Quote #${quoteId} cannot be deleted: ${revs.join(", ")} used it. Withdraw it instead.`, {
        _: `used by ${revs.join(", ")}`,
      });
    const studies = await scenariosChoosingQuote(tx, quoteId);
    if (studies.length) {
      const names = [...new Set(studies.map((s) => `study "${s.study.name}" (scenario "${s.name}")`))];
      return problem(
        "conflict",
        `Quote #${quoteId} is chosen by ${names.join(", ")}. Withdraw it instead: those studies then say which quote they use.`,
        {
          _: `chosen by ${names.join(", ")}`,
        },
      );
    }
    if (existing.supersedesId !== null || (await quoteSuccessors(tx, quoteId)).length)
      return problem("conflict", `Quote #${quoteId} is part of a correction history; withdraw it instead.`, {
        _: "part of a correction history",
      });
    await deleteQuoteRow(tx, quoteId);
    await recordChange(tx, {
      subject: { type: "fuel", id: fuelId },
      entity: "quote",
      entityId: quoteId,
      action: "delete",
      before: quoteRecord(existing),
    });
    return ok(existing);
  });
}

/** Withdraws a quote: it stays on record, prices nothing any more; studies that chose it fall back to their rule. */
export function withdrawPriceQuote(
  db: Db,
  fuelId: number,
  quoteId: number,
): Promise<Result<{ quote: PriceQuoteRow; affectedStudies: { id: number; name: string; scenario: string }[] }>> {
  return inTransaction(db, async (tx) => {
    const existing = await findQuote(tx, quoteId);
    if (!existing || existing.fuelId !== fuelId || !(await findFuel(tx, fuelId)))
      return problem("not-found", `No price quote ${quoteId} for fuel ${fuelId}.`);
    if (existing.withdrawnAt) return problem("conflict", `Quote #${quoteId} is already withdrawn.`, { _: "already withdrawn" });
    const quote = await withdrawQuoteRow(tx, quoteId, new Date());
    await recordChange(tx, {
      subject: { type: "fuel", id: fuelId },
      entity: "quote",
      entityId: quoteId,
      action: "withdraw",
      before: quoteRecord(existing),
      after: quoteRecord(quote),
    });
    const affected = (await scenariosChoosingQuote(tx, quoteId)).map((s) => ({ id: s.study.id, name: s.study.name, scenario: s.name }));
    return ok({ quote, affectedStudies: affected });
  });
}
