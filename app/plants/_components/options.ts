/** Choices the plant form offers (server side). */
import { db } from "@/lib/db/client";
import { fuelChoices } from "@/lib/services/lookups";
import { EQUIPMENT_TYPES, EQUIPMENT_TYPE_LABELS, METERING_REFERENCE_KEYS, WOBBE_COMBUSTION_REFERENCES_C } from "@/lib/schemas/plant";
import type { PlantFormOptions } from "./PlantForm";

export const METERING_REFERENCE_LABELS: Record<string, string> = {
  "0C": "0 °C, 101.325 kPa",
  "15C": "15 °C, 101.325 kPa",
  "20C": "20 °C, 101.325 kPa",
  "60F": "60 °F, 101.325 kPa",
};

export async function plantFormOptions(): Promise<PlantFormOptions> {
  const fuels = await fuelChoices(db());
  return {
    fuels,
    equipmentTypes: EQUIPMENT_TYPES.map((t) => ({ value: t, label: EQUIPMENT_TYPE_LABELS[t] })),
    meteringReferences: METERING_REFERENCE_KEYS.map((k) => ({ value: k, label: METERING_REFERENCE_LABELS[k] })),
    wobbeCombustionReferences: [...WOBBE_COMBUSTION_REFERENCES_C],
  };
}
