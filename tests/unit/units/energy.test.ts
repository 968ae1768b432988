import { describe, expect, it } from "vitest";
import {
  J_per_Btu,
  L_per_USgal,
  MJ_per_MMBtu,
  MJ_per_therm,
  MJ_per_kWh,
  MJ_per_MWh,
  convertEnergy,
  m3_per_ft3,
  VOLUME_UNITS_M3,
} from "../../../lib/units/energy";

/** Relative agreement to `digits` significant figures, as tables print them. */
function sameToSigFigs(a: number, b: number, digits: number) {
  expect(Number(a.toPrecision(digits))).toBe(Number(b.toPrecision(digits)));
}

describe("energy and volume units", () => {
  it("British thermal unit (IT) matches NIST SP 811", () => {
    // NIST SP 811 (2008 ed.), Appendix B.8: British thermal unit_IT = 1.055 056 E+03 J.
    sameToSigFigs(J_per_Btu, 1.055056e3, 7);
    // Definition: 1 Btu_IT/lb = 2.326 kJ/kg exactly (Fifth International Conference on the
    // Properties of Steam, London 1956), with 1 lb = 0.45359237 kg exactly (NIST SP 811, B.8).
    expect(J_per_Btu).toBeCloseTo(2326 * 0.45359237, 9);
    expect(MJ_per_MMBtu).toBeCloseTo(1055.05585262, 9);
  });

  it("therm (EC) matches NIST SP 811 and is not the US therm", () => {
    // NIST SP 811 (2008 ed.), Appendix B.8: therm (EC) = 1.055 06 E+08 J; therm (U.S.) = 1.054 804 E+08 J.
    sameToSigFigs(MJ_per_therm * 1e6, 1.05506e8, 6);
    expect(Math.abs(MJ_per_therm * 1e6 - 1.054804e8)).toBeGreaterThan(1e4);
  });

  it("US gallon and cubic foot match NIST SP 811", () => {
    // NIST SP 811 (2008 ed.), Appendix B.8: gallon (U.S.) = 3.785 412 E-03 m³; cubic foot = 2.831 685 E-02 m³.
    sameToSigFigs(VOLUME_UNITS_M3.USgal, 3.785412e-3, 7);
    sameToSigFigs(m3_per_ft3, 2.831685e-2, 7);
    // Definition: 1 US gal = 231 in³, 1 in = 0.0254 m (NIST SP 811, B.8).
    expect(L_per_USgal).toBeCloseTo(231 * 0.0254 ** 3 * 1000, 12);
  });

  it("kWh/MWh and the trade rule 1 kWh = 3412.14 Btu", () => {
    expect(MJ_per_kWh * 1000).toBe(MJ_per_MWh);
    // 1 kWh = 3412.14 Btu (IT) — common practice, no source (follows from the definitions above).
    expect(convertEnergy(1, "kWh", "MMBtu") * 1e6).toBeCloseTo(3412.14, 2);
    // 1 therm = 29.3071 kWh — common practice, no source (UK gas-bill conversion).
    expect(convertEnergy(1, "therm", "kWh")).toBeCloseTo(29.3071, 4);
    expect(convertEnergy(convertEnergy(7.3, "GJ", "MMBtu"), "MMBtu", "GJ")).toBeCloseTo(7.3, 12);
  });
});
