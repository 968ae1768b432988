/**
 * Plant rows: the queries, and one mapper per direction between a row and the plant-schema object
 * (`plantInputFromRow`, `plantColumns`).
 */
import type { Plant as PlantRow } from "./generated/client";
import type { DbOrTx, Tx } from "./client";
import { plantSchema, type Plant, type PlantInput } from "../schemas/plant";
import { groupBy, inChunks } from "./chunks";
import type { Burner } from "../schemas/burner";

export type { PlantRow };

export interface PlantRecord {
  id: number;
  plant: Plant;
  baselineFuelId: number | null;
  baselineFuelName: string | null;
  isDemo: boolean;
  createdAt: Date;
  updatedAt: Date;
}

export interface PlantListItem extends PlantRecord {
  studies: { id: number; name: string; scenarioCount: number }[];
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
    burner:
      row.burnerType === null
        ? null
        : {
            type: row.burnerType as Burner["type"],
            airControl: (row.burnerAirControl ?? "fixed-linkage") as Burner["airControl"],
            ...(row.burnerFlashbackWarnRatio === null ? {} : { flashbackWarnRatio: row.burnerFlashbackWarnRatio }),
            ...(row.burnerFlashbackFailRatio === null ? {} : { flashbackFailRatio: row.burnerFlashbackFailRatio }),
            ...(row.burnerRegulatedSupply === null ? {} : { regulatedSupply: row.burnerRegulatedSupply }),
          },
    noxLimit_mg_per_m3: row.noxLimit_mg_per_m3,
    noxReferenceO2Percent: row.noxReferenceO2Percent,
    noxMeasuredBaseline_mg_per_m3: row.noxMeasuredBaseline_mg_per_m3,
    so2Limit_mg_per_m3: row.so2Limit_mg_per_m3,
    gasBurnerPressure_kPa: row.gasBurnerPressure_kPa,
    gasSupplyPressure_kPa: row.gasSupplyPressure_kPa,
    liquidTrain: row.liquidTrain === null ? null : (JSON.parse(row.liquidTrain) as PlantInput["liquidTrain"]),
    notes: row.notes,
  };
}

/** Columns of a validated plant. */
export function plantColumns(p: Plant) {
  const { ambientAir, burner, liquidTrain, ...rest } = p;
  return {
    ...rest,
    burnerType: burner?.type ?? null,
    burnerAirControl: burner?.airControl ?? null,
    burnerFlashbackWarnRatio: burner?.flashbackWarnRatio ?? null,
    burnerFlashbackFailRatio: burner?.flashbackFailRatio ?? null,
    burnerRegulatedSupply: burner?.regulatedSupply ?? null,
    noxLimit_mg_per_m3: rest.noxLimit_mg_per_m3 ?? null,
    noxReferenceO2Percent: rest.noxReferenceO2Percent ?? null,
    noxMeasuredBaseline_mg_per_m3: rest.noxMeasuredBaseline_mg_per_m3 ?? null,
    so2Limit_mg_per_m3: rest.so2Limit_mg_per_m3 ?? null,
    gasBurnerPressure_kPa: rest.gasBurnerPressure_kPa ?? null,
    gasSupplyPressure_kPa: rest.gasSupplyPressure_kPa ?? null,
    liquidTrain: liquidTrain ? JSON.stringify(liquidTrain) : null,
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

/** Rows not in the trash. */
const LIVE = { deletedAt: null };

const WITH_STUDIES = {
  baselineFuel: { select: { name: true } },
  studies: { where: LIVE, orderBy: { name: "asc" as const }, select: { id: true, name: true, _count: { select: { scenarios: true } } } },
};

function listItemOf(
  r: PlantRow & { baselineFuel: { name: string } | null; studies: { id: number; name: string; _count: { scenarios: number } }[] },
): PlantListItem {
  return { ...recordOf(r), studies: r.studies.map((s) => ({ id: s.id, name: s.name, scenarioCount: s._count.scenarios })) };
}

/* ------------------------------------------------------------------ queries */

/** Adds to plant rows their baseline fuel's name and their studies (by name, with scenario counts), in chunked queries. */
async function withStudies(db: DbOrTx, rows: PlantRow[]): Promise<PlantListItem[]> {
  const fuelNames = new Map(
    (
      await inChunks(
        rows.flatMap((r) => (r.baselineFuelId === null ? [] : [r.baselineFuelId])),
        (chunk) => db.fuel.findMany({ where: { id: { in: chunk } }, select: { id: true, name: true } }),
      )
    ).map((f) => [f.id, f.name]),
  );
  const studies = await inChunks(
    rows.map((r) => r.id),
    (chunk) =>
      db.study.findMany({
        where: { plantId: { in: chunk }, ...LIVE },
        orderBy: [{ plantId: "asc" }, { name: "asc" }],
        select: { id: true, name: true, plantId: true },
      }),
  );
  const counts = new Map(
    (
      await inChunks(
        studies.map((s) => s.id),
        (chunk) => db.scenario.groupBy({ by: ["studyId"], where: { studyId: { in: chunk } }, _count: { _all: true } }),
      )
    ).map((c) => [c.studyId, c._count._all]),
  );
  const byPlant = groupBy(studies, (s) => s.plantId);
  return rows.map((r) =>
    listItemOf({
      ...r,
      baselineFuel: r.baselineFuelId === null ? null : { name: fuelNames.get(r.baselineFuelId) ?? "" },
      studies: (byPlant.get(r.id) ?? []).map((s) => ({ id: s.id, name: s.name, _count: { scenarios: counts.get(s.id) ?? 0 } })),
    }),
  );
}

/** Plants by name with their studies; a page of them when `page` is given. */
export async function listPlants(db: DbOrTx, page?: { offset: number; limit: number }): Promise<PlantListItem[]> {
  const rows = await db.plant.findMany({
    where: LIVE,
    orderBy: [{ name: "asc" }, { id: "asc" }],
    ...(page ? { skip: page.offset, take: page.limit } : {}),
  });
  return withStudies(db, rows);
}

export function countPlants(db: DbOrTx): Promise<number> {
  return db.plant.count({ where: LIVE });
}

export async function getPlant(db: DbOrTx, id: number): Promise<PlantListItem | null> {
  const r = await db.plant.findUnique({ where: { id, ...LIVE }, include: WITH_STUDIES });
  return r ? listItemOf(r) : null;
}

export function findPlant(db: DbOrTx, id: number): Promise<PlantRow | null> {
  return db.plant.findUnique({ where: { id, ...LIVE } });
}

/** A plant in the trash. */
export function findTrashedPlant(db: DbOrTx, id: number): Promise<PlantRow | null> {
  return db.plant.findFirst({ where: { id, deletedAt: { not: null } } });
}

/** Plants in the trash, latest first. */
export function trashedPlants(db: DbOrTx): Promise<PlantRow[]> {
  return db.plant.findMany({ where: { deletedAt: { not: null } }, orderBy: [{ deletedAt: "desc" }, { id: "desc" }] });
}

/** Moves a plant to the trash (`at` set) or back (`at` null). */
export function setPlantTrashed(tx: Tx, id: number, at: Date | null, by: string | null): Promise<PlantRow> {
  return tx.plant.update({ where: { id }, data: { deletedAt: at, deletedBy: by } });
}

/** A plant with its baseline fuel's row. */
export function findPlantWithBaselineFuel(db: DbOrTx, id: number) {
  return db.plant.findUnique({ where: { id, ...LIVE }, include: { baselineFuel: true } });
}

/** A plant (live, or in the trash with `trashed`) with the names of the studies that use it, those in the trash too. */
export function findPlantWithStudyNames(db: DbOrTx, id: number, trashed = false) {
  return db.plant.findFirst({
    where: { id, deletedAt: trashed ? { not: null } : null },
    include: { studies: { select: { name: true, deletedAt: true } } },
  });
}

/** Ids and names of every plant, those in the trash too (their names stay taken). */
export function plantNames(db: DbOrTx): Promise<{ id: number; name: string; deletedAt: Date | null }[]> {
  return db.plant.findMany({ select: { id: true, name: true, deletedAt: true } });
}

/** Plants for the study form's choices. */
export function plantChoices(db: DbOrTx): Promise<{ id: number; name: string; baselineFuelId: number | null; equipmentType: string }[]> {
  return db.plant.findMany({
    where: LIVE,
    orderBy: { name: "asc" },
    select: { id: true, name: true, baselineFuelId: true, equipmentType: true },
  });
}

/** Plants with their baseline fuel and studies (ids and names), oldest first (the home page); the first `limit` when given. */
export async function plantsOverview(db: DbOrTx, limit?: number) {
  const rows = await db.plant.findMany({ where: LIVE, orderBy: { id: "asc" }, ...(limit ? { take: limit } : {}) });
  const fuels = new Map(
    (
      await inChunks(
        rows.flatMap((r) => (r.baselineFuelId === null ? [] : [r.baselineFuelId])),
        (chunk) => db.fuel.findMany({ where: { id: { in: chunk } }, select: { id: true, name: true } }),
      )
    ).map((f) => [f.id, f]),
  );
  const studies = groupBy(
    await inChunks(
      rows.map((r) => r.id),
      (chunk) =>
        db.study.findMany({
          where: { plantId: { in: chunk }, ...LIVE },
          orderBy: { id: "asc" },
          select: { id: true, name: true, plantId: true },
        }),
    ),
    (s) => s.plantId,
  );
  return rows.map((r) => ({
    ...r,
    baselineFuel: r.baselineFuelId === null ? null : (fuels.get(r.baselineFuelId) ?? null),
    studies: (studies.get(r.id) ?? []).map(({ id, name }) => ({ id, name })),
  }));
}

export function insertPlant(tx: Tx, plant: Plant, baselineFuelId: number): Promise<PlantRow> {
  return tx.plant.create({ data: { ...plantColumns(plant), baselineFuelId } });
}

export function updatePlantRow(tx: Tx, id: number, plant: Plant, baselineFuelId: number): Promise<PlantRow> {
  return tx.plant.update({ where: { id }, data: { ...plantColumns(plant), baselineFuelId } });
}

export function deletePlantRow(tx: Tx, id: number): Promise<PlantRow> {
  return tx.plant.delete({ where: { id } });
}
