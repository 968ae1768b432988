import { describe, expect, it } from "vitest";
import { resolveFuel } from "../../../lib/fuels/resolve";
import { DRY_AIR } from "../../../lib/combustion/stoichiometry";
import { burnerShift, burnerRisks, type BurnerGas } from "../../../lib/plant/burner";

/*
 * Hand calculation (ideal gas, ISO 6976:2016 molar values at 25 °C: NCV CH4 802.60 kJ/mol, H2 241.81 kJ/mol;
 * M CH4 16.04246, H2 2.01588, air 28.96546 g/mol):
 *   methane:          d = 16.04246/28.96546 = 0.553848, W_net ∝ 802.60/√0.553848
 *   80 % CH4 + 20 % H2: NCV = 690.442 kJ/mol, M = 13.237144 g/mol, d = 0.456998
 *   W_blend/W_CH4 = (690.442/√0.456998)/(802.60/√0.553848) = 0.947036 → heat input −5.296 %
 *   gas volume through a fixed orifice: √(0.553848/0.456998) = 1.100876
 *   O2 per mol of gas: CH4 2, blend 0.8·2 + 0.2·0.5 = 1.7 → air demand ratio 0.85 (exact)
 * Set-up on methane at 3 % dry flue O2 in dry air (O2 0.20946, N2 + Ar 0.79018, CO2 0.00036):
 *   per mol CH4 the dry flue gas is 9.54836 λ − 1 mol (air 9.54836 λ less its O2 consumed 2, plus CO2 1);
 *   2(λ − 1) = 0.03 (9.54836 λ − 1 + …) → λ0 = 1.97/(2 − 0.03 (7.548362 + 2)) = 1.149661
 * Untuned on the blend:
 *   fixed linkage (air volume kept):    λ = λ0 / (0.85 × 1.100876) = 1.228605
 *   pneumatic ratio (volume ratio kept): λ = λ0 / 0.85 = 1.352542
 *   O2 trim (3 % restored):             1.7(λ − 1) = 0.03(8.116119·0.79054·λ + 0.8 + 1.7λ − 1.7) → λ = 1.148631
 */
const d = (M: number) => M / 28.96546;
const methane: BurnerGas = {
  fuel: resolveFuel({ composition: { CH4: 1 } }),
  relativeDensity: d(16.04246),
  wobbeNet_MJ_per_m3: 802.6 / Math.sqrt(d(16.04246)),
};
const blendM = 0.8 * 16.04246 + 0.2 * 2.01588;
const blend: BurnerGas = {
  fuel: resolveFuel({ composition: { CH4: 0.8, H2: 0.2 } }),
  relativeDensity: d(blendM),
  wobbeNet_MJ_per_m3: (0.8 * 802.6 + 0.2 * 241.81) / Math.sqrt(d(blendM)),
};
const common = {
  baseline: methane,
  candidate: blend,
  regulatedSupply: true,
  setupFlueO2DryPercent: 3,
  oxidizer: DRY_AIR,
  oxidizerTemperatureK: 298.15,
};

describe("the untuned burner on the day the gas changes", () => {
  it("heat input follows the Wobbe index and the air factor the control type (hand calculation above)", () => {
    const fixed = burnerShift({ ...common, airControl: "fixed-linkage" });
    expect(fixed.untuned.heatInputChangePercent!).toBeCloseTo(-5.2964, 3);
    expect(fixed.gasVolumeRatio).toBeCloseTo(1.100876, 5);
    expect(fixed.airDemandRatio).toBeCloseTo(0.85, 10);
    expect(fixed.untuned.lambda).toBeCloseTo(1.228605, 4);
    expect(burnerShift({ ...common, airControl: "pneumatic-ratio" }).untuned.lambda).toBeCloseTo(1.352542, 4);
    const trim = burnerShift({ ...common, airControl: "o2-trim" });
    expect(trim.untuned.lambda).toBeCloseTo(1.148631, 4);
    expect(trim.untuned.flueO2DryPercent).toBeCloseTo(3, 9);
  });

  it("the retuned burner holds the flue O2 and the rated input", () => {
    const r = burnerShift({ ...common, airControl: "fixed-linkage" }).retuned;
    expect(r.lambda).toBeCloseTo(1.148631, 4);
    expect(r.heatInputChangePercent).toBe(0);
    expect(r.flueO2DryPercent).toBe(3);
  });

  it("a leaner untuned flame is cooler than the retuned one, and the rise of λ is named as a risk", () => {
    const s = burnerShift({ ...common, airControl: "pneumatic-ratio" });
    expect(s.untuned.adiabaticFlameTemperatureK!).toBeLessThan(s.retuned.adiabaticFlameTemperatureK! - 50);
    // λ rises by 1.352542/1.149661 − 1 = 17.6 %, inside the 20 % rule of thumb; the input falls 5.3 %.
    expect(burnerRisks(s, 1.149661).map((r) => r.risk)).toEqual(["derating"]);
    // 40 % H2: air demand ratio (0.6·2 + 0.4·0.5)/2 = 0.7, so λ = 1.149661/0.7 = 1.6424, 42.9 % above set-up.
    const h40: BurnerGas = {
      fuel: resolveFuel({ composition: { CH4: 0.6, H2: 0.4 } }),
      relativeDensity: d(0.6 * 16.04246 + 0.4 * 2.01588),
      wobbeNet_MJ_per_m3: 1,
    };
    const s40 = burnerShift({ ...common, candidate: h40, airControl: "pneumatic-ratio", regulatedSupply: false });
    expect(s40.untuned.lambda).toBeCloseTo(1.149661 / 0.7, 4);
    expect(burnerRisks(s40, 1.149661).map((r) => r.risk)).toContain("lean-blow-off");
  });

  it("without a regulated supply the heat input is unknown, not 0", () => {
    expect(burnerShift({ ...common, airControl: "fixed-linkage", regulatedSupply: false }).untuned.heatInputChangePercent).toBeNull();
  });
});
