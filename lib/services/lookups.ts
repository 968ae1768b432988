/**
 * Read-only look-ups the pages need beside the services (names for titles, counts, choices for
 * forms). They are database queries as they stand; pages reach them here so that app/ talks to
 * the database through lib/services only.
 */
import type { Db } from "../db/client";
import { countFuelsAndQuotes, findFuel, findFuelWithComponents, fuelChoices, fuelJson, type FuelJson } from "../db/fuel-rows";
import { findPlant, plantsOverview } from "../db/plant-rows";
import { findStudy, studyHeader } from "../db/study-rows";

export { countFuelsAndQuotes, findFuel, fuelChoices, plantsOverview, studyHeader };

export async function fuelName(db: Db, id: number): Promise<string | null> {
  return (await findFuel(db, id))?.name ?? null;
}

export async function plantName(db: Db, id: number): Promise<string | null> {
  return (await findPlant(db, id))?.name ?? null;
}

export async function studyName(db: Db, id: number): Promise<string | null> {
  return (await findStudy(db, id))?.name ?? null;
}

/** A stored fuel in the JSON form the edit form starts from; null when there is none. */
export async function fuelForEdit(db: Db, id: number): Promise<FuelJson | null> {
  const row = await findFuelWithComponents(db, id);
  if (!row) return null;
  const { components, ...fuel } = row;
  return fuelJson(fuel, components);
}
