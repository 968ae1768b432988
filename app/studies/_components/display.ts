/**
 * Formatting of study figures in the chosen display units. Conversions come from
 * lib/units/display.ts (display only: stored and computed values stay SI).
 */
import {
  ENERGY_DENSITY_LABEL,
  ENERGY_UNIT_LABEL,
  TEMPERATURE_DIFFERENCE_LABEL,
  TEMPERATURE_UNIT_LABEL,
  VOLUME_UNIT_LABEL,
  energyDensityFromMJPerM3,
  energyFromMWh,
  perEnergyFromPerMWh,
  temperatureDifferenceFromK,
  temperatureFromC,
  volumeFromM3,
  type DisplayUnits,
} from "@/lib/units/display";
import type { FitCheck } from "@/lib/plant/fit-checks";
import { fmt } from "../../_ui/format";

export function signed(v: number | null | undefined, decimals = 1): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return "–";
  const s = fmt(Math.abs(v), decimals);
  if (Number(s.replace(/,/g, "")) === 0) return fmt(0, decimals);
  return `${v < 0 ? "−" : "+"}${s}`;
}

export interface Display {
  units: DisplayUnits;
  currency: string;
  energyUnit: string;
  /** e.g. "EUR/MWh". */
  costPerEnergyUnit: string;
  costPerEnergy(value_per_MWh: number | null | undefined, decimals?: number): string;
  costPerEnergyValue(value_per_MWh: number): number;
  energy(value_MWh: number | null | undefined, decimals?: number): string;
  energyValue(value_MWh: number): number;
  tempUnit: string;
  temp(valueC: number | null | undefined, decimals?: number): string;
  tempValue(valueC: number): number;
  dTUnit: string;
  dT(valueK: number | null | undefined, decimals?: number, withSign?: boolean): string;
  dTValue(valueK: number): number;
  volUnit: string;
  vol(value_m3: number | null | undefined, decimals?: number): string;
  volValue(value_m3: number): number;
  wobbeUnit: string;
  wobbe(value_MJ_per_m3: number | null | undefined, decimals?: number): string;
  wobbeValue(value_MJ_per_m3: number): number;
  /** A fit check's value and limit in display units, with the unit. */
  check(c: Pick<FitCheck, "value" | "limit" | "unit"> & { id?: FitCheck["id"] }): { value: string; limit: string; unit: string };
}

/** Decimals of check figures by unit (burning-velocity ratio, air factor, concentrations, pressures, viscosity, liquid flows). */
const UNIT_DECIMALS: Record<string, number> = { "×": 2, λ: 3, "mg/m³": 0, kPa: 2, "mm²/s": 2, "L/h": 0, "kg/h": 0 };

const ok = (v: number | null | undefined): v is number => v !== null && v !== undefined && Number.isFinite(v);

export function makeDisplay(units: DisplayUnits, currency: string): Display {
  const energyUnit = ENERGY_UNIT_LABEL[units.energy];
  const volUnit = VOLUME_UNIT_LABEL[units.volume];
  const d: Display = {
    units,
    currency,
    energyUnit,
    costPerEnergyUnit: `${currency}/${energyUnit}`,
    costPerEnergyValue: (v) => perEnergyFromPerMWh(v, units.energy),
    costPerEnergy: (v, decimals = 2) => (ok(v) ? fmt(perEnergyFromPerMWh(v, units.energy), decimals) : "–"),
    energyValue: (v) => energyFromMWh(v, units.energy),
    energy: (v, decimals = 0) => (ok(v) ? fmt(energyFromMWh(v, units.energy), decimals) : "–"),
    tempUnit: TEMPERATURE_UNIT_LABEL[units.temperature],
    tempValue: (v) => temperatureFromC(v, units.temperature),
    temp: (v, decimals = 0) => (ok(v) ? fmt(temperatureFromC(v, units.temperature), decimals) : "–"),
    dTUnit: TEMPERATURE_DIFFERENCE_LABEL[units.temperature],
    dTValue: (v) => temperatureDifferenceFromK(v, units.temperature),
    dT: (v, decimals = 0, withSign = true) =>
      ok(v)
        ? withSign
          ? signed(temperatureDifferenceFromK(v, units.temperature), decimals)
          : fmt(temperatureDifferenceFromK(v, units.temperature), decimals)
        : "–",
    volUnit,
    volValue: (v) => volumeFromM3(v, units.volume),
    vol: (v, decimals = 0) => (ok(v) ? fmt(volumeFromM3(v, units.volume), decimals) : "–"),
    wobbeUnit: ENERGY_DENSITY_LABEL[units.volume],
    wobbeValue: (v) => energyDensityFromMJPerM3(v, units.volume),
    wobbe: (v, decimals = 2) => (ok(v) ? fmt(energyDensityFromMJPerM3(v, units.volume), units.volume === "ft3" ? 0 : decimals) : "–"),
    check: (c) => {
      switch (c.unit) {
        case "K":
          return { value: d.dT(c.value, 1, false), limit: d.dT(c.limit, 0, false), unit: d.dTUnit };
        case "°C":
          return { value: d.temp(c.value, 1), limit: d.temp(c.limit, 0), unit: d.tempUnit };
        case "m³/h":
          return {
            value: d.vol(c.value, c.value !== null && Math.abs(c.value) < 10 ? 2 : 0),
            limit: d.vol(c.limit, c.limit !== null && Math.abs(c.limit) < 10 ? 2 : 0),
            unit: `${volUnit}/h`,
          };
        case "MJ/m³":
          return { value: d.wobbe(c.value), limit: d.wobbe(c.limit), unit: d.wobbeUnit };
        default:
          // A ± band (the Wobbe band) reads "±5.0 %" for every scenario, the shift with its sign.
          if (c.id === "wobbe-band")
            return { value: signed(c.value, 1), limit: c.limit === null ? "–" : `±${fmt(Math.abs(c.limit), 1)}`, unit: c.unit };
          {
            const dec = UNIT_DECIMALS[c.unit] ?? 1;
            return { value: fmt(c.value, dec), limit: fmt(c.limit, dec), unit: c.unit };
          }
      }
    },
  };
  return d;
}

/** A yearly saving in words: "saves 12,000 EUR/yr" or "costs 3,500 EUR/yr more". */
export function savingText(v: number | null | undefined, currency: string): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return "–";
  return v >= 0 ? `saves ${fmt(v, 0)} ${currency}/yr` : `costs ${fmt(-v, 0)} ${currency}/yr more`;
}
