import { describe, expect, it } from "vitest";
import { atReferenceO2, molarVolumeNormal_L_per_mol, ppmToMg_per_m3Normal } from "../../../lib/units/emissions";

describe("emission-concentration conversions", () => {
  it("molar volume at 0 °C, 101.325 kPa is 22.414 L/mol", () => {
    // CODATA 2018: molar volume of an ideal gas at 273.15 K, 101.325 kPa = 22.413 969 54 L/mol.
    expect(molarVolumeNormal_L_per_mol).toBeCloseTo(22.41396954, 7);
  });
  it("1 ppm NO2 is 2.053 mg/m³ at normal conditions", () => {
    // 46.0055 g/mol (NO2 from the IUPAC 2005 atomic weights) / 22.414 L/mol = 2.0525 mg/m³ per ppm;
    // the rounded factor 2.05 mg/m³ per ppm NO2 is common practice, no source.
    expect(ppmToMg_per_m3Normal(1, 46.0055)).toBeCloseTo(2.0525, 4);
  });
  it("reference-O2 correction follows (21 − O2ref)/(21 − O2meas)", () => {
    // Directive 2010/75/EU, Annex VI Part 2: 100 mg/m³ at 6 % O2 is 120 mg/m³ at 3 % O2 (100 × 18/15).
    expect(atReferenceO2(100, 6, 3)).toBeCloseTo(120, 10);
    expect(Number.isNaN(atReferenceO2(100, 21, 3))).toBe(true);
  });
});
