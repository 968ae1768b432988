/**
 * Plant rows: the queries, and one mapper per direction between a row and the plant-schema object
 * (`plantInputFromRow`, `plantColumns`).
 */
import type { Plant as PlantRow } from "./generated/client";
import type { DbOrTx, Tx } from "./client";
import { plantSchema, type Plant, type PlantInput } from "../schemas/plant";
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

const WITH_STUDIES = {
  baselineFuel: { select: { name: true } },
  studies: { orderBy: { name: "asc" as const }, select: { id: true, name: true, _count: { select: { scenarios: true } } } },
};

function listItemOf(
  r: PlantRow & { baselineFuel: { name: string } | null; studies: { id: number; name: string; _count: { scenarios: number } }[] },
): PlantListItem {
  return { ...recordOf(r), studies: r.studies.map((s) => ({ id: s.id, name: s.name, scenarioCount: s._count.scenarios })) };
}

/* ------------------------------------------------------------------ queries */

export async function listPlants(db: DbOrTx): Promise<PlantListItem[]> {
  return (await db.plant.findMany({ orderBy: [{ name: "asc" }], include: WITH_STUDIES })).map(listItemOf);
}

export async function getPlant(db: DbOrTx, id: number): Promise<PlantListItem | null> {
  const r = await db.plant.findUnique({ where: { id }, include: WITH_STUDIES });
  return r ? listItemOf(r) : null;
}

export function findPlant(db: DbOrTx, id: number): Promise<PlantRow | null> {
  return db.plant.findUnique({ where: { id } });
}

/** A plant with its baseline fuel's row. */
export function findPlantWithBaselineFuel(db: DbOrTx, id: number) {
  return db.plant.findUnique({ where: { id }, include: { baselineFuel: true } });
}

/** A plant with the names of the studies that use it. */
export function findPlantWithStudyNames(db: DbOrTx, id: number) {
  return db.plant.findUnique({ where: { id }, include: { studies: { select: { name: true } } } });
}

export function plantNames(db: DbOrTx): Promise<{ id: number; name: string }[]> {
  return db.plant.findMany({ select: { id: true, name: true } });
}

/** Plants for the study form's choices. */
export function plantChoices(db: DbOrTx): Promise<{ id: number; name: string; baselineFuelId: number | null; equipmentType: string }[]> {
  return db.plant.findMany({ orderBy: { name: "asc" }, select: { id: true, name: true, baselineFuelId: true, equipmentType: true } });
}

/** Every plant with its baseline fuel and studies (ids and names), oldest first (the home page). */
export function plantsOverview(db: DbOrTx) {
  return db.plant.findMany({
    orderBy: { id: "asc" },
    include: { baselineFuel: { select: { id: true, name: true } }, studies: { select: { id: true, name: true } } },
  });
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
