/** Choices the fuel form offers, read on the server from lib/ and the database. */
import type { PrismaClient } from "@/lib/db/generated/client";
import { SPECIES } from "@/lib/thermo/species-data";
import { LIQUID_COMPOUNDS } from "@/lib/fuels/compounds";
import type { FuelFormOptions } from "./FuelForm";

/** Radicals and atoms are equilibrium products, not fuel-gas components. */
const NOT_IN_FUEL_GAS = new Set(["OH", "H", "O"]);

export async function fuelFormOptions(db: PrismaClient): Promise<FuelFormOptions> {
  const stored = await db.fuel.findMany({ select: { id: true, name: true, kind: true }, orderBy: { name: "asc" } });
  return {
    species: Object.values(SPECIES)
      .filter((s) => s.phase === "gas" && !NOT_IN_FUEL_GAS.has(s.key))
      .map((s) => ({ key: s.key, name: s.name })),
    compounds: Object.values(LIQUID_COMPOUNDS).map((c) => ({ key: c.key, name: c.name, role: c.role })),
    storedFuels: stored,
  };
}
