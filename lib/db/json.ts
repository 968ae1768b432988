/** JSON forms of stored records, as the API answers them and the pages read them. */
import type { BlendComponent, Fuel } from "./generated/client";
import { storedDefinition, isBlendRow } from "./fuels";

export function fuelJson(row: Fuel, components: (BlendComponent & { component: Pick<Fuel, "id" | "name"> })[] = []) {
  const blend = isBlendRow(row);
  return {
    id: row.id,
    name: row.name,
    kind: row.kind,
    definition: storedDefinition(row),
    blend: blend
      ? { basis: components[0]?.basis ?? null, components: components.map((c) => ({ fuelId: c.componentFuelId, name: c.component.name, share: c.share })) }
      : null,
    densityKgPerM3: row.densityKgPerM3,
    biogenicCarbonShare: row.biogenicCarbonShare,
    upstreamCo2e_kg_per_GJ: row.upstreamCo2e_kg_per_GJ,
    notes: row.notes,
    source: row.source,
    isDemo: row.isDemo,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}
