/**
 * Metering reference conditions for gas volumes, all at 101.325 kPa: one record each, carrying
 * its key (as stored and sent), its temperature in °C (60 °F = 15.56 °C, as ISO 6976:2016
 * tabulates it) and the label every page and report prints.
 */
export const METERING_REFERENCE_KEYS = ["0C", "15C", "20C", "60F"] as const;
export type MeteringReferenceKey = (typeof METERING_REFERENCE_KEYS)[number];

export interface MeteringReference {
  readonly key: MeteringReferenceKey;
  readonly temperatureC: number;
  /** Short label, e.g. "15 °C" or "60 °F". */
  readonly label: string;
}

export const METERING_REFERENCES: Readonly<Record<MeteringReferenceKey, MeteringReference>> = Object.freeze({
  "0C": { key: "0C", temperatureC: 0, label: "0 °C" },
  "15C": { key: "15C", temperatureC: 15, label: "15 °C" },
  "20C": { key: "20C", temperatureC: 20, label: "20 °C" },
  "60F": { key: "60F", temperatureC: 15.56, label: "60 °F" },
});

/** Metering reference temperatures in °C, in key order. */
export const METERING_REFERENCE_TEMPERATURES_C: readonly number[] = METERING_REFERENCE_KEYS.map((k) => METERING_REFERENCES[k].temperatureC);

/** The reference at a metering temperature in °C, or undefined when none is tabulated there. */
export function meteringReferenceAtC(temperatureC: number): MeteringReference | undefined {
  return METERING_REFERENCE_KEYS.map((k) => METERING_REFERENCES[k]).find((r) => r.temperatureC === temperatureC);
}

/** The label of a metering temperature: "60 °F" at 15.56 °C, otherwise "t °C". */
export function meteringLabel(temperatureC: number): string {
  return meteringReferenceAtC(temperatureC)?.label ?? `${temperatureC} °C`;
}

/** The label with its pressure, e.g. "15 °C, 101.325 kPa". */
export function meteringLabelWithPressure(temperatureC: number): string {
  return `${meteringLabel(temperatureC)}, 101.325 kPa`;
}
