/** Choices the fuel form offers, read on the server from lib/ and the database. */
import type { Db } from "@/lib/db/client";
import { fuelChoices } from "@/lib/services/lookups";
import { SPECIES } from "@/lib/thermo/species-data";
import { LIQUID_COMPOUNDS } from "@/lib/fuels/compounds";
import type { FuelFormOptions } from "./FuelForm";

/** Radicals and atoms are equilibrium products, not fuel-gas components. */
const NOT_IN_FUEL_GAS = new Set(["OH", "H", "O"]);

export async function fuelFormOptions(db: Db): Promise<FuelFormOptions> {
  const stored = await fuelChoices(db, "name");
  return {
    species: Object.values(SPECIES)
      .filter((s) => s.phase === "gas" && !NOT_IN_FUEL_GAS.has(s.key))
      .map((s) => ({ key: s.key, name: s.name })),
    compounds: Object.values(LIQUID_COMPOUNDS).map((c) => ({ key: c.key, name: c.name, role: c.role })),
    storedFuels: stored,
  };
}
