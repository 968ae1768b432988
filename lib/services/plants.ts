/**
 * Plants: create, update and delete fired units with their operating point and limits, and what a
 * plant does today on its baseline fuel. Every write is validated by the plant schema
 * (lib/schemas/plant.ts) and the baseline fuel must exist; nothing is stored from rejected input.
 */
import { inTransaction, type Db, type DbOrTx, type Tx } from "../db/client";
import { effectiveDefinition, findFuel } from "../db/fuel-rows";
import {
  deletePlantRow,
  findPlant,
  findPlantWithBaselineFuel,
  findPlantWithStudyNames,
  getPlant,
  insertPlant,
  countPlants,
  listPlants,
  plantFromRow,
  plantInputFromRow,
  plantNames,
  setPlantTrashed,
  updatePlantRow,
  type PlantListItem,
  type PlantRecord,
  type PlantRow,
} from "../db/plant-rows";
import { fieldErrors } from "../schemas/fuel";
import { plantSchema, type Plant, type PlantInput } from "../schemas/plant";
import { studySchema } from "../schemas/study";
import { evaluateStudy, type ScenarioResult } from "../study/evaluate";
import type { PlantDuty } from "../plant/duty";
import { sharedCaches } from "./eval-cache";
import { ok, problem, reasonOf, type FieldErrors, type Problem, type Result } from "./result";
import { currentActor } from "./actor";
import { trashEnabled } from "./mode";
import { recordChange } from "./change-log";

/** A plant as the change log keeps it: its fields and its baseline fuel. */
function plantRecord(row: PlantRow) {
  return { ...plantInputFromRow(row), baselineFuelId: row.baselineFuelId };
}

export { countPlants, getPlant, listPlants, type PlantListItem, type PlantRecord };

/** What a plant form or the API sends: the plant schema's fields plus the baseline fuel's id. */
export type PlantRecordInput = PlantInput & { baselineFuelId: number | null };

/** Validates a plant form / API body. Both parts are checked so every field error shows at once. */
async function parsePlant(tx: DbOrTx, raw: unknown): Promise<Result<{ plant: Plant; baselineFuelId: number }>> {
  if (typeof raw !== "object" || raw === null || Array.isArray(raw))
    return problem("invalid", "The plant must be an object.", { _: "expected an object" });
  const { baselineFuelId, isDemo: _ignored, ...rest } = raw as Record<string, unknown>;
  const errs: FieldErrors = {};
  // The forms name the liquid train's reference fuel by its library id: its definition is stored with the plant.
  const lt = rest.liquidTrain as Record<string, unknown> | null | undefined;
  if (lt && typeof lt === "object" && "referenceFuelId" in lt) {
    const { referenceFuelId, ...train } = lt;
    const f = typeof referenceFuelId === "number" ? await findFuel(tx, referenceFuelId) : null;
    if (!f) errs["liquidTrain.referenceFuel"] = "choose the liquid the train is set up on";
    else if (f.kind !== "liquid") errs["liquidTrain.referenceFuel"] = `${f.name} is not a liquid`;
    else rest.liquidTrain = { ...train, referenceFuel: { ...effectiveDefinition(f), name: f.name } };
    if (f?.kind !== "liquid") rest.liquidTrain = { ...train, referenceFuel: { compound: "C16H34", phase: "liquid" } };
  }
  const parsed = plantSchema.safeParse(rest);
  if (!parsed.success) Object.assign(errs, fieldErrors(parsed.error));
  let fuelId: number | null = null;
  if (baselineFuelId === undefined || baselineFuelId === null || baselineFuelId === "") {
    errs.baselineFuelId = "choose the fuel the plant burns today";
  } else if (typeof baselineFuelId !== "number" || !Number.isInteger(baselineFuelId) || baselineFuelId <= 0) {
    errs.baselineFuelId = "must be the id of a stored fuel";
  } else {
    const fuel = await findFuel(tx, baselineFuelId);
    if (!fuel) errs.baselineFuelId = `no stored fuel with id ${baselineFuelId}`;
    else fuelId = fuel.id;
  }
  if (Object.keys(errs).length || !parsed.success || fuelId === null)
    return problem("invalid", "The plant has errors; nothing was saved.", errs);
  return ok({ plant: parsed.data, baselineFuelId: fuelId });
}

async function nameTaken(tx: DbOrTx, name: string, exceptId?: number): Promise<string | null> {
  const lower = name.toLowerCase();
  const p = (await plantNames(tx)).find((p) => p.name.toLowerCase() === lower && p.id !== exceptId);
  return p ? `${p.name}"${p.deletedAt ? " (in the trash)" : ""}` : null;
}

/** `taken` is the name with its closing quote and, for a plant in the trash, a note (nameTaken). */
const nameConflict = (taken: string) =>
  problem("conflict", `A plant named "${taken} already exists.`, { name: `a plant named "${taken} already exists` });

export function createPlant(db: Db, raw: unknown): Promise<Result<PlantRow>> {
  return inTransaction(db, async (tx): Promise<Result<PlantRow>> => {
    const p = await parsePlant(tx, raw);
    if (!p.ok) return p;
    const taken = await nameTaken(tx, p.value.plant.name);
    if (taken) return nameConflict(taken);
    const row = await insertPlant(tx, p.value.plant, p.value.baselineFuelId);
    await recordChange(tx, {
      subject: { type: "plant", id: row.id },
      entity: "plant",
      entityId: row.id,
      action: "create",
      after: plantRecord(row),
    });
    return ok(row);
  });
}

export function updatePlant(db: Db, id: number, raw: unknown): Promise<Result<PlantRow>> {
  return inTransaction(db, async (tx): Promise<Result<PlantRow>> => {
    const existing = await findPlant(tx, id);
    if (!existing) return problem("not-found", `No plant with id ${id}.`);
    const p = await parsePlant(tx, raw);
    if (!p.ok) return p;
    const taken = await nameTaken(tx, p.value.plant.name, id);
    if (taken) return nameConflict(taken);
    const row = await updatePlantRow(tx, id, p.value.plant, p.value.baselineFuelId);
    await recordChange(tx, {
      subject: { type: "plant", id },
      entity: "plant",
      entityId: id,
      action: "update",
      before: plantRecord(existing),
      after: plantRecord(row),
    });
    return ok(row);
  });
}

/** Why a plant cannot leave: its studies (a study's results depend on its plant), those in the trash too. */
function plantBlockers(existing: { name: string; studies: { name: string; deletedAt: Date | null }[] }): Problem | null {
  if (!existing.studies.length) return null;
  const names = existing.studies.map((s) => `"${s.name}"${s.deletedAt ? " (in the trash)" : ""}`).join(", ");
  return problem("conflict", `"${existing.name}" has studies (${names}). Delete those studies first.`, {
    _: `used by studies ${names}`,
  });
}

/** DELETE /api/plants/{id}: a plant no study uses moves to the trash (team mode) or is deleted at once (personal mode). */
export function deletePlant(db: Db, id: number): Promise<Result<PlantRow>> {
  return inTransaction(db, async (tx): Promise<Result<PlantRow>> => {
    if (!trashEnabled()) return purgePlantIn(tx, id, "delete");
    const existing = await findPlantWithStudyNames(tx, id);
    if (!existing) return problem("not-found", `No plant with id ${id}.`);
    const blocked = plantBlockers(existing);
    if (blocked) return blocked;
    const row = await setPlantTrashed(tx, id, new Date(), currentActor().name);
    await recordChange(tx, {
      subject: { type: "plant", id },
      entity: "plant",
      entityId: id,
      action: "trash",
      summary: "moved to the trash",
    });
    return ok(row);
  });
}

/** Deletes a plant for good: one in the trash (purge) or, without the trash, a live one (delete). */
export async function purgePlantIn(tx: Tx, id: number, action: "purge" | "delete" = "purge"): Promise<Result<PlantRow>> {
  const existing = await findPlantWithStudyNames(tx, id, action === "purge");
  if (!existing) return problem("not-found", `No plant with id ${id}${action === "purge" ? " in the trash" : ""}.`);
  const blocked = plantBlockers(existing);
  if (blocked) return blocked;
  const { studies: _s, ...row } = existing;
  await deletePlantRow(tx, id);
  await recordChange(tx, { subject: { type: "plant", id }, entity: "plant", entityId: id, action, before: plantRecord(row) });
  return ok(row);
}

/** The JSON form of a plant for the API. */
export function plantJson(r: PlantRecord) {
  return {
    id: r.id,
    ...r.plant,
    baselineFuelId: r.baselineFuelId,
    baselineFuelName: r.baselineFuelName,
    isDemo: r.isDemo,
    url: `/plants/${r.id}`,
  };
}

export interface PlantBaseline {
  duty: PlantDuty;
  baseline: ScenarioResult;
}

/**
 * What the plant does today on its baseline fuel: duty, efficiency, flows at rated duty and the fit
 * checks against its own limits (a baseline-only evaluation, no prices, no sweep). Null without a
 * plant or a baseline fuel; a problem naming the field when lib/ refuses to evaluate it.
 */
export async function plantBaseline(db: Db, id: number): Promise<Result<PlantBaseline> | null> {
  const row = await findPlantWithBaselineFuel(db, id);
  if (!row?.baselineFuel) return null;
  const study = studySchema.parse({
    name: row.name,
    currency: "EUR",
    discountRatePercent: 0,
    horizonYears: 1,
    rankingMetric: "co2-per-useful-MJ",
    hydrogenSweep: { enabled: false },
    plant: plantFromRow(row),
    baseline: { name: row.baselineFuel.name, fuel: effectiveDefinition(row.baselineFuel) },
    scenarios: [],
  });
  try {
    const r = evaluateStudy(study, { sweep: false, tornado: false, caches: sharedCaches() });
    return ok({ duty: r.duty, baseline: r.baseline });
  } catch (e) {
    const reason = reasonOf(e);
    return problem("unprocessable", reason, { _: reason });
  }
}
