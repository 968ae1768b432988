import { describe, expect, it } from "vitest";
import { checkSum, normaliseComposition, toMoleFractions } from "../../lib/schemas/composition-entry";
import { compositionFuelSchema } from "../../lib/schemas/fuel";

describe("gas compositions as certificates give them", () => {
  it("takes mol % and stores mole fractions the schema accepts", () => {
    const entry = { CH4: 92, C2H6: 4, C3H8: 1, N2: 2, CO2: 1 };
    expect(checkSum(Object.values(entry), "percent").exact).toBe(true);
    const fractions = toMoleFractions(entry, "percent");
    expect(fractions.CH4).toBeCloseTo(0.92, 12);
    expect(compositionFuelSchema.safeParse({ composition: fractions }).success).toBe(true);
  });

  it("notices mol % typed where fractions are expected", () => {
    expect(checkSum([92, 4, 1, 2, 1], "fraction").looksLike).toBe("percent");
    expect(checkSum([0.92, 0.08], "fraction").looksLike).toBeNull();
  });

  it("normalises a certificate summing to 99.98 % and records the residual", () => {
    const n = normaliseComposition({ CH4: 91.98, C2H6: 4, C3H8: 1, N2: 2, CO2: 1 }, "percent", "2026-12-02");
    expect(n).not.toBeNull();
    expect(n!.residualPercent).toBeCloseTo(0.02, 10);
    expect(Object.values(n!.values).reduce((a, b) => a + b, 0)).toBeCloseTo(100, 10);
    // In proportion: the ratio of two components is unchanged.
    expect(n!.values.C2H6 / n!.values.N2).toBeCloseTo(2, 12);
    expect(n!.note).toContain("99.980 mol %");
    expect(n!.note).toContain("+0.020 mol %");
  });

  it("refuses to normalise a total more than 0.5 mol % off", () => {
    expect(normaliseComposition({ CH4: 90, N2: 9 }, "percent", "2026-12-02")).toBeNull();
    expect(checkSum([90, 9], "percent").normalisable).toBe(false);
  });
});
