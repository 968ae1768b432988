/** Choices the plant form offers (server side). */
import { db } from "@/lib/db/client";
import { fuelChoices } from "@/lib/services/lookups";
import { EQUIPMENT_TYPES, EQUIPMENT_TYPE_LABELS, METERING_REFERENCE_KEYS, WOBBE_COMBUSTION_REFERENCES_C } from "@/lib/schemas/plant";
import type { PlantFormOptions } from "./PlantForm";
import { METERING_REFERENCES, meteringLabelWithPressure } from "@/lib/units/metering";

export async function plantFormOptions(): Promise<PlantFormOptions> {
  const fuels = await fuelChoices(db());
  return {
    fuels,
    equipmentTypes: EQUIPMENT_TYPES.map((t) => ({ value: t, label: EQUIPMENT_TYPE_LABELS[t] })),
    meteringReferences: METERING_REFERENCE_KEYS.map((k) => ({
      value: k,
      label: meteringLabelWithPressure(METERING_REFERENCES[k].temperatureC),
    })),
    wobbeCombustionReferences: [...WOBBE_COMBUSTION_REFERENCES_C],
  };
}
