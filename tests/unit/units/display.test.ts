/** Display-unit switch: factors checked against published conversion tables. */
import { describe, expect, it } from "vitest";
import {
  energyDensityFromMJPerM3,
  energyFromMWh,
  formatDisplayUnits,
  parseDisplayUnits,
  perEnergyFromPerMWh,
  SI_DISPLAY,
  temperatureDifferenceFromK,
  temperatureFromC,
  volumeFromM3,
} from "../../../lib/units/display";

describe("display units", () => {
  it("energy: 1 MWh = 3.6 GJ = 3.412 142 MMBtu", () => {
    // 1 MWh = 3600 MJ exactly (SI definition of the watt-hour).
    expect(energyFromMWh(1, "GJ")).toBeCloseTo(3.6, 12);
    // NIST SP 811 (2008), App. B.8: 1 Btu_IT = 1.055 056 E+03 J → 1 MWh = 3.6e9 / 1.055056e9 MMBtu = 3.41214.
    expect(energyFromMWh(1, "MMBtu")).toBeCloseTo(3.41214, 4);
    expect(energyFromMWh(123.4, "MWh")).toBe(123.4);
  });

  it("cost per energy scales inversely: 36 per MWh = 10 per GJ", () => {
    // 1 GJ = 1/3.6 MWh (exact).
    expect(perEnergyFromPerMWh(36, "GJ")).toBeCloseTo(10, 12);
    // 1 MMBtu = 1.055056 GJ (NIST SP 811 (2008), App. B.8) → 36 per MWh = 10.55056 per MMBtu.
    expect(perEnergyFromPerMWh(36, "MMBtu")).toBeCloseTo(10.55056, 4);
  });

  it("temperatures: 100 °C = 373.15 K = 212 °F; differences 10 K = 18 °F", () => {
    // Definitions of the kelvin and Fahrenheit scales (NIST SP 811 (2008), App. B.8 / B.9).
    expect(temperatureFromC(100, "K")).toBeCloseTo(373.15, 10);
    expect(temperatureFromC(100, "F")).toBeCloseTo(212, 10);
    expect(temperatureFromC(-40, "F")).toBeCloseTo(-40, 10);
    expect(temperatureFromC(25, "C")).toBe(25);
    expect(temperatureDifferenceFromK(10, "F")).toBeCloseTo(18, 10);
    expect(temperatureDifferenceFromK(10, "K")).toBe(10);
    expect(temperatureDifferenceFromK(10, "C")).toBe(10);
  });

  it("volumes: 1 m³ = 35.3147 ft³ at the same reference conditions", () => {
    // NIST SP 811 (2008), App. B.8: 1 ft³ = 2.831 685 E-02 m³.
    expect(volumeFromM3(1, "ft3")).toBeCloseTo(1 / 0.02831685, 3);
    expect(volumeFromM3(7, "m3")).toBe(7);
  });

  it("Wobbe index: 50 MJ/m³ ≈ 1342 Btu/ft³", () => {
    // 50e6 J/m³ × 0.02831685 m³/ft³ ÷ 1055.056 J/Btu (NIST SP 811 factors) = 1341.96 Btu/ft³.
    expect(energyDensityFromMJPerM3(50, "ft3")).toBeCloseTo(1341.96, 1);
    expect(energyDensityFromMJPerM3(50, "m3")).toBe(50);
  });

  it("parses the stored choice and falls back to SI on anything unknown", () => {
    expect(parseDisplayUnits(undefined)).toEqual(SI_DISPLAY);
    expect(parseDisplayUnits("energy=GJ;temperature=F;volume=ft3")).toEqual({ energy: "GJ", temperature: "F", volume: "ft3" });
    expect(parseDisplayUnits("energy=kcal;temperature=R")).toEqual(SI_DISPLAY);
    const u = { energy: "MMBtu", temperature: "K", volume: "m3" } as const;
    expect(parseDisplayUnits(formatDisplayUnits(u))).toEqual(u);
  });
});
