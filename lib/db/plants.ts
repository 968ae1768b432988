/**
 * Plants in the database: create, read, update and delete fired units with their operating
 * point and limits. Every write is validated by the plant schema (lib/schemas/plant.ts) and the
 * baseline fuel must exist; nothing is stored from rejected input. Results name the field.
 */
import type { Plant as PlantRow, PrismaClient } from "./generated/client";
import { fieldErrors } from "../schemas/fuel";
import { plantSchema, type Plant, type PlantInput } from "../schemas/plant";
import { effectiveDefinition, fail, inTransaction, type FieldErrors, type Result, type Tx } from "./fuels";
import type { FuelDefinition } from "../schemas/fuel";
import { evaluateStudy, StudyInputError, type ScenarioResult } from "../study/evaluate";
import type { PlantDuty } from "../plant/duty";
import { sharedCaches } from "./eval-cache";

/** What a plant form or the API sends: the plant schema's fields plus the baseline fuel's id. */
export type PlantRecordInput = PlantInput & { baselineFuelId: number | null };

export interface PlantRecord {
  id: number;
  plant: Plant;
  baselineFuelId: number | null;
  baselineFuelName: string | null;
  isDemo: boolean;
  createdAt: Date;
  updatedAt: Date;
}

/** The plant schema's object for a stored row (the shape the study evaluation takes). */
export function plantFromRow(row: PlantRow): Plant {
  return plantSchema.parse(plantInputFromRow(row));
}

/** The row as plant-schema input (also what the edit form starts from). */
export function plantInputFromRow(row: PlantRow): PlantInput {
  return {
    name: row.name,
    site: row.site,
    equipmentType: row.equipmentType as Plant["equipmentType"],
    ratedInput_kW: row.ratedInput_kW,
    ratedInputBasis: row.ratedInputBasis as Plant["ratedInputBasis"],
    annualUsefulHeat_MWh: row.annualUsefulHeat_MWh,
    operatingHours: row.operatingHours,
    averageLoadFraction: row.averageLoadFraction,
    stackTemperatureC: row.stackTemperatureC,
    flueO2DryPercent: row.flueO2DryPercent,
    combustionAirC: row.combustionAirC,
    radiationLossPercent: row.radiationLossPercent,
    condensing: row.condensing,
    returnWaterC: row.returnWaterC,
    condensingApproachK: row.condensingApproachK,
    flueCODryPpm: row.flueCODryPpm,
    unburntCarbonInAshPercent: row.unburntCarbonInAshPercent,
    ambientAir: { temperatureC: row.ambientAirTemperatureC, relativeHumidityPercent: row.ambientAirRelativeHumidityPercent },
    wobbeTolerancePercent: row.wobbeTolerancePercent,
    wobbeMin_MJ_per_m3: row.wobbeMin_MJ_per_m3,
    wobbeMax_MJ_per_m3: row.wobbeMax_MJ_per_m3,
    wobbeMeteringReference: row.wobbeMeteringReference as Plant["wobbeMeteringReference"],
    wobbeCombustionReferenceC: row.wobbeCombustionReferenceC,
    maxFlameTempRiseK: row.maxFlameTempRiseK,
    flueGasCapacity_m3_per_h: row.flueGasCapacity_m3_per_h,
    flueGasCapacityBasis: row.flueGasCapacityBasis as Plant["flueGasCapacityBasis"],
    airCapacity_m3_per_h: row.airCapacity_m3_per_h,
    airCapacityBasis: row.airCapacityBasis as Plant["airCapacityBasis"],
    fuelSupplyCapacity_m3_per_h: row.fuelSupplyCapacity_m3_per_h,
    fuelSupplyMeteringReference: row.fuelSupplyMeteringReference as Plant["fuelSupplyMeteringReference"],
    maxH2SharePercent: row.maxH2SharePercent,
    warnAtFractionOfLimit: row.warnAtFractionOfLimit,
    dewPointMarginK: row.dewPointMarginK,
    notes: row.notes,
  };
}

/** Columns of a validated plant. */
function plantColumns(p: Plant) {
  const { ambientAir, ...rest } = p;
  return {
    ...rest,
    annualUsefulHeat_MWh: rest.annualUsefulHeat_MWh ?? null,
    returnWaterC: rest.returnWaterC ?? null,
    wobbeTolerancePercent: rest.wobbeTolerancePercent ?? null,
    wobbeMin_MJ_per_m3: rest.wobbeMin_MJ_per_m3 ?? null,
    wobbeMax_MJ_per_m3: rest.wobbeMax_MJ_per_m3 ?? null,
    maxFlameTempRiseK: rest.maxFlameTempRiseK ?? null,
    flueGasCapacity_m3_per_h: rest.flueGasCapacity_m3_per_h ?? null,
    airCapacity_m3_per_h: rest.airCapacity_m3_per_h ?? null,
    fuelSupplyCapacity_m3_per_h: rest.fuelSupplyCapacity_m3_per_h ?? null,
    maxH2SharePercent: rest.maxH2SharePercent ?? null,
    ambientAirTemperatureC: ambientAir.temperatureC,
    ambientAirRelativeHumidityPercent: ambientAir.relativeHumidityPercent,
  };
}

function recordOf(row: PlantRow & { baselineFuel: { name: string } | null }): PlantRecord {
  return {
    id: row.id,
    plant: plantFromRow(row),
    baselineFuelId: row.baselineFuelId,
    baselineFuelName: row.baselineFuel?.name ?? null,
    isDemo: row.isDemo,
    createdAt: row.createdAt,
    updatedAt: row.updatedAt,
  };
}

/** Validates a plant form / API body. Both parts are checked so every field error shows at once. */
async function parsePlant(tx: Tx, raw: unknown): Promise<Result<{ plant: Plant; baselineFuelId: number }>> {
  if (typeof raw !== "object" || raw === null || Array.isArray(raw)) return fail(400, "The plant must be an object.", { _: "expected an object" });
  const { baselineFuelId, isDemo: _ignored, ...rest } = raw as Record<string, unknown>;
  const errs: FieldErrors = {};
  const parsed = plantSchema.safeParse(rest);
  if (!parsed.success) Object.assign(errs, fieldErrors(parsed.error));
  let fuelId: number | null = null;
  if (baselineFuelId === undefined || baselineFuelId === null || baselineFuelId === "") {
    errs.baselineFuelId = "choose the fuel the plant burns today";
  } else if (typeof baselineFuelId !== "number" || !Number.isInteger(baselineFuelId) || baselineFuelId <= 0) {
    errs.baselineFuelId = "must be the id of a stored fuel";
  } else {
    const fuel = await tx.fuel.findUnique({ where: { id: baselineFuelId }, select: { id: true } });
    if (!fuel) errs.baselineFuelId = `no stored fuel with id ${baselineFuelId}`;
    else fuelId = fuel.id;
  }
  if (Object.keys(errs).length || !parsed.success || fuelId === null) return fail(400, "The plant has errors; nothing was saved.", errs);
  return { ok: true, value: { plant: parsed.data, baselineFuelId: fuelId } };
}

async function nameTaken(tx: Tx, name: string, exceptId?: number): Promise<string | null> {
  const lower = name.toLowerCase();
  const all = await tx.plant.findMany({ select: { id: true, name: true } });
  return all.find((p) => p.name.toLowerCase() === lower && p.id !== exceptId)?.name ?? null;
}

export interface PlantListItem extends PlantRecord {
  studies: { id: number; name: string; scenarioCount: number }[];
}

export async function listPlants(db: PrismaClient): Promise<PlantListItem[]> {
  const rows = await db.plant.findMany({
    orderBy: [{ name: "asc" }],
    include: {
      baselineFuel: { select: { name: true } },
      studies: { orderBy: { name: "asc" }, select: { id: true, name: true, _count: { select: { scenarios: true } } } },
    },
  });
  return rows.map((r) => ({
    ...recordOf(r),
    studies: r.studies.map((s) => ({ id: s.id, name: s.name, scenarioCount: s._count.scenarios })),
  }));
}

export async function getPlant(db: PrismaClient, id: number): Promise<PlantListItem | null> {
  const r = await db.plant.findUnique({
    where: { id },
    include: {
      baselineFuel: { select: { name: true } },
      studies: { orderBy: { name: "asc" }, select: { id: true, name: true, _count: { select: { scenarios: true } } } },
    },
  });
  if (!r) return null;
  return { ...recordOf(r), studies: r.studies.map((s) => ({ id: s.id, name: s.name, scenarioCount: s._count.scenarios })) };
}

export async function createPlant(db: PrismaClient, raw: unknown): Promise<Result<PlantRow>> {
  return inTransaction(db, async (tx) => {
    const p = await parsePlant(tx, raw);
    if (!p.ok) return p;
    const taken = await nameTaken(tx, p.value.plant.name);
    if (taken) return fail(409, `A plant named "${taken}" already exists.`, { name: `a plant named "${taken}" already exists` });
    const row = await tx.plant.create({ data: { ...plantColumns(p.value.plant), baselineFuelId: p.value.baselineFuelId } });
    return { ok: true, value: row };
  });
}

export async function updatePlant(db: PrismaClient, id: number, raw: unknown): Promise<Result<PlantRow>> {
  return inTransaction(db, async (tx) => {
    const existing = await tx.plant.findUnique({ where: { id } });
    if (!existing) return fail(404, `No plant with id ${id}.`);
    const p = await parsePlant(tx, raw);
    if (!p.ok) return p;
    const taken = await nameTaken(tx, p.value.plant.name, id);
    if (taken) return fail(409, `A plant named "${taken}" already exists.`, { name: `a plant named "${taken}" already exists` });
    const row = await tx.plant.update({ where: { id }, data: { ...plantColumns(p.value.plant), baselineFuelId: p.value.baselineFuelId } });
    return { ok: true, value: row };
  });
}

/** Deletes a plant that no study uses (a study's results depend on its plant). */
export async function deletePlant(db: PrismaClient, id: number): Promise<Result<PlantRow>> {
  return inTransaction(db, async (tx) => {
    const existing = await tx.plant.findUnique({ where: { id }, include: { studies: { select: { name: true } } } });
    if (!existing) return fail(404, `No plant with id ${id}.`);
    if (existing.studies.length) {
      const names = existing.studies.map((s) => `"${s.name}"`).join(", ");
      return fail(409, `"${existing.name}" has studies (${names}). Delete those studies first.`, { _: `used by studies ${names}` });
    }
    const { studies: _s, ...row } = existing;
    await tx.plant.delete({ where: { id } });
    return { ok: true, value: row };
  });
}

/** The JSON form of a plant for the API. */
export function plantJson(r: PlantRecord) {
  return { id: r.id, ...r.plant, baselineFuelId: r.baselineFuelId, baselineFuelName: r.baselineFuelName, isDemo: r.isDemo, url: `/plants/${r.id}` };
}

export interface PlantBaseline {
  duty: PlantDuty;
  baseline: ScenarioResult;
}

/**
 * What the plant does today on its baseline fuel: duty, efficiency, flows at rated duty and the fit
 * checks against its own limits (a baseline-only evaluation, no prices). Null without a baseline fuel.
 */
export async function plantBaseline(db: PrismaClient, id: number): Promise<{ ok: true; value: PlantBaseline } | { ok: false; message: string } | null> {
  const row = await db.plant.findUnique({ where: { id }, include: { baselineFuel: true } });
  if (!row || !row.baselineFuel) return null;
  try {
    const r = evaluateStudy(
      {
        name: row.name,
        currency: "EUR",
        carbonPrice_per_t: 0,
        discountRatePercent: 0,
        horizonYears: 1,
        priceEscalationPercent: 0,
        rankingMetric: "co2-per-useful-MJ",
        includeUpstream: false,
        sensitivity: { fuelPricePercent: 20, carbonPricePercent: 50, efficiencyPoints: 2, capexPercent: 30 },
        hydrogenSweep: { enabled: false, stepPercent: 1, hydrogen: { compound: "H2", phase: "gas" } as FuelDefinition },
        plant: plantFromRow(row),
        baseline: { name: row.baselineFuel.name, fuel: effectiveDefinition(row.baselineFuel), capex: 0, fixedOpexChange: 0, overrides: {}, notes: "" },
        scenarios: [],
        notes: "",
      },
      { sweep: false, tornado: false, caches: sharedCaches() },
    );
    return { ok: true, value: { duty: r.duty, baseline: r.baseline } };
  } catch (e) {
    if (e instanceof StudyInputError || e instanceof RangeError) return { ok: false, message: e.message };
    throw e;
  }
}
