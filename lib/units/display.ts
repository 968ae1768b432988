/**
 * Display units: the unit switch of the decision pages (energy MWh / GJ / MMBtu, temperature
 * °C / K / °F, gas volume m³ / ft³). It changes how a stored or computed figure is shown, never
 * the figure itself. Every factor comes from energy.ts and constants.ts; this module only picks
 * them and labels the result.
 *
 * Gas volumes keep their reference conditions: a volume at 0 °C and 101.325 kPa shown in ft³ is
 * still at 0 °C and 101.325 kPa (the label says so). Standard cubic feet at 60 °F are what the
 * pages show when the plant's metering reference is 60 °F.
 */
import { ENERGY_UNITS_MJ, J_per_Btu, m3_per_ft3 } from "./energy";
import { T0CK, celsiusToKelvin, kelvinToFahrenheit } from "./constants";

export const DISPLAY_ENERGY_UNITS = ["MWh", "GJ", "MMBtu"] as const;
export type DisplayEnergyUnit = (typeof DISPLAY_ENERGY_UNITS)[number];
export const DISPLAY_TEMPERATURE_UNITS = ["C", "K", "F"] as const;
export type DisplayTemperatureUnit = (typeof DISPLAY_TEMPERATURE_UNITS)[number];
export const DISPLAY_VOLUME_UNITS = ["m3", "ft3"] as const;
export type DisplayVolumeUnit = (typeof DISPLAY_VOLUME_UNITS)[number];

export interface DisplayUnits {
  energy: DisplayEnergyUnit;
  temperature: DisplayTemperatureUnit;
  volume: DisplayVolumeUnit;
}

/** SI display: MWh, °C, m³. */
export const SI_DISPLAY: DisplayUnits = { energy: "MWh", temperature: "C", volume: "m3" };

export const ENERGY_UNIT_LABEL: Record<DisplayEnergyUnit, string> = { MWh: "MWh", GJ: "GJ", MMBtu: "MMBtu" };
export const TEMPERATURE_UNIT_LABEL: Record<DisplayTemperatureUnit, string> = { C: "°C", K: "K", F: "°F" };
/** Unit of a temperature difference. */
export const TEMPERATURE_DIFFERENCE_LABEL: Record<DisplayTemperatureUnit, string> = { C: "K", K: "K", F: "°F" };
export const VOLUME_UNIT_LABEL: Record<DisplayVolumeUnit, string> = { m3: "m³", ft3: "ft³" };

/** Size of one display volume unit in m³. */
const M3_PER_VOLUME_UNIT: Record<DisplayVolumeUnit, number> = { m3: 1, ft3: m3_per_ft3 };

/** An amount of energy stated in MWh, shown in the display unit. */
export function energyFromMWh(value_MWh: number, unit: DisplayEnergyUnit): number {
  return (value_MWh * ENERGY_UNITS_MJ.MWh) / ENERGY_UNITS_MJ[unit];
}

/** A cost (or anything) per MWh, shown per display unit. */
export function perEnergyFromPerMWh(value_per_MWh: number, unit: DisplayEnergyUnit): number {
  return (value_per_MWh * ENERGY_UNITS_MJ[unit]) / ENERGY_UNITS_MJ.MWh;
}

/** A temperature in °C, shown in the display unit. */
export function temperatureFromC(temperatureC: number, unit: DisplayTemperatureUnit): number {
  if (unit === "C") return temperatureC;
  if (unit === "K") return celsiusToKelvin(temperatureC);
  return kelvinToFahrenheit(celsiusToKelvin(temperatureC));
}

/** A temperature difference in K, shown in the display unit (°F differences are 1.8 × K). */
export function temperatureDifferenceFromK(differenceK: number, unit: DisplayTemperatureUnit): number {
  if (unit !== "F") return differenceK;
  // Slope of the °F scale against the kelvin scale, taken from the one conversion function.
  return kelvinToFahrenheit(T0CK + differenceK) - kelvinToFahrenheit(T0CK);
}

/** A volume (or volume flow) in m³, shown in the display unit at the same reference conditions. */
export function volumeFromM3(value_m3: number, unit: DisplayVolumeUnit): number {
  return value_m3 / M3_PER_VOLUME_UNIT[unit];
}

/** Energy per volume (e.g. a Wobbe index) in MJ/m³, shown per display volume unit: MJ/m³ or Btu/ft³. */
export function energyDensityFromMJPerM3(value_MJ_per_m3: number, unit: DisplayVolumeUnit): number {
  if (unit === "m3") return value_MJ_per_m3;
  return (value_MJ_per_m3 * 1e6 * M3_PER_VOLUME_UNIT.ft3) / J_per_Btu;
}
export const ENERGY_DENSITY_LABEL: Record<DisplayVolumeUnit, string> = { m3: "MJ/m³", ft3: "Btu/ft³" };

/** Parses the unit switch's stored choice ("energy=GJ;temperature=K;volume=ft3"); unknown parts fall back to SI. */
export function parseDisplayUnits(text: string | null | undefined): DisplayUnits {
  const out: DisplayUnits = { ...SI_DISPLAY };
  if (!text) return out;
  for (const part of text.split(/[;&,]/)) {
    const [k, v] = part.split("=").map((s) => (s ?? "").trim());
    if (k === "energy" && (DISPLAY_ENERGY_UNITS as readonly string[]).includes(v)) out.energy = v as DisplayEnergyUnit;
    if (k === "temperature" && (DISPLAY_TEMPERATURE_UNITS as readonly string[]).includes(v)) out.temperature = v as DisplayTemperatureUnit;
    if (k === "volume" && (DISPLAY_VOLUME_UNITS as readonly string[]).includes(v)) out.volume = v as DisplayVolumeUnit;
  }
  return out;
}

export function formatDisplayUnits(u: DisplayUnits): string {
  return `energy=${u.energy};temperature=${u.temperature};volume=${u.volume}`;
}
