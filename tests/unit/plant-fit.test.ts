import { describe, expect, it } from "vitest";
import { studySchema, type StudyInput } from "../../lib/schemas/study";
import { evaluateStudy } from "../../lib/study/evaluate";
import { fitChecks, worstStatus, type FuelInPlant } from "../../lib/plant/fit-checks";
import { FuelContextCache } from "../../lib/plant/fuel-context";
import { PerformanceCache } from "../../lib/plant/performance";
import { efficiencyAtUseful, flowsForUseful, plantDuty } from "../../lib/plant/duty";
import { operatingPointOf } from "../../lib/schemas/plant";

const METHANE = { composition: { CH4: 1 } };
const blend = (x: number) => ({
  blend: [
    { fuel: METHANE, share: 1 - x },
    { fuel: { compound: "H2", phase: "gas" as const }, share: x },
  ],
  basis: "volume" as const,
});

function evaluate(plant: Record<string, unknown>, scenarios: StudyInput["scenarios"]) {
  const study = studySchema.parse({
    name: "fit",
    currency: "EUR",
    discountRatePercent: 5,
    horizonYears: 10,
    plant: {
      name: "unit",
      equipmentType: "process-furnace",
      ratedInput_kW: 3000,
      operatingHours: 4000,
      averageLoadFraction: 0.7,
      stackTemperatureC: 200,
      flueO2DryPercent: 3,
      combustionAirC: 20,
      radiationLossPercent: 1.5,
      condensing: false,
      ...plant,
    },
    baseline: { name: "methane", fuel: METHANE },
    scenarios,
  });
  return evaluateStudy(study, { sweep: false });
}
const check = (r: ReturnType<typeof evaluate>, i: number, id: string) =>
  (i < 0 ? r.baseline : r.scenarios[i]).checks.find((c) => c.id === id)!;

describe("fit checks: pass / warn / fail against the plant's limits", () => {
  it("without limits every limit check is not-checked but still reports its number", () => {
    const r = evaluate({}, [{ name: "10 %", fuel: blend(0.1) }]);
    for (const id of ["wobbe-band", "wobbe-range", "flame-temperature-rise", "flue-gas-fan", "combustion-air-fan", "fuel-supply"]) {
      const c = check(r, 0, id);
      expect(c.status).toBe("not-checked");
      expect(c.value).not.toBeNull();
    }
    // Hydrogen without a burner limit: warn and ask the burner maker.
    expect(check(r, 0, "hydrogen-share").status).toBe("warn");
    expect(check(r, -1, "hydrogen-share").status).toBe("pass");
  });

  it("fan capacity: pass below 90 % of capacity, warn up to 100 %, fail above", () => {
    const probe = evaluate({}, []);
    const flow = probe.baseline.ratedFlows.flueGas_m3_per_h_actual;
    const air = probe.baseline.ratedFlows.air_m3_per_h_actual;
    expect(check(evaluate({ flueGasCapacity_m3_per_h: flow * 1.2, airCapacity_m3_per_h: air * 1.2 }, []), -1, "flue-gas-fan").status).toBe(
      "pass",
    );
    expect(check(evaluate({ flueGasCapacity_m3_per_h: flow * 1.0 }, []), -1, "flue-gas-fan").status).toBe("warn");
    expect(check(evaluate({ flueGasCapacity_m3_per_h: flow * 0.99 }, []), -1, "flue-gas-fan").status).toBe("fail");
    expect(check(evaluate({ airCapacity_m3_per_h: air * 0.95 }, []), -1, "combustion-air-fan").status).toBe("fail");
    // On the normal basis the same fan looks bigger (0 °C instead of 200 °C).
    const normal = evaluate({ flueGasCapacity_m3_per_h: flow, flueGasCapacityBasis: "normal" }, []);
    expect(check(normal, -1, "flue-gas-fan").status).toBe("pass");
    expect(check(normal, -1, "flue-gas-fan").value!).toBeCloseTo(probe.baseline.ratedFlows.flueGas_m3_per_h_normal, 6);
    // Ideal gas: actual = normal × T/273.15 K.
    expect(flow / probe.baseline.ratedFlows.flueGas_m3_per_h_normal).toBeCloseTo(473.15 / 273.15, 10);
  });

  it("hydrogen share exactly at the burner limit warns (not fails); above it fails", () => {
    const r = evaluate({ maxH2SharePercent: 20 }, [
      { name: "20 %", fuel: blend(0.2) },
      { name: "21 %", fuel: blend(0.21) },
      { name: "new burner", fuel: blend(0.21), overrides: { maxH2SharePercent: 30 } },
    ]);
    expect(check(r, 0, "hydrogen-share").status).toBe("warn");
    expect(check(r, 1, "hydrogen-share").status).toBe("fail");
    expect(check(r, 2, "hydrogen-share").status).toBe("pass");
  });

  it("flame-temperature rise against the limit; the rise is measured at the plant's O2 and air temperature", () => {
    const probe = evaluate({}, [{ name: "30 %", fuel: blend(0.3) }]);
    const rise = check(probe, 0, "flame-temperature-rise").value!;
    expect(rise).toBeGreaterThan(5);
    expect(probe.scenarios[0].flame!.shiftK).toBeCloseTo(rise, 10);
    expect(check(evaluate({ maxFlameTempRiseK: rise * 2 }, [{ name: "30 %", fuel: blend(0.3) }]), 0, "flame-temperature-rise").status).toBe(
      "pass",
    );
    expect(
      check(evaluate({ maxFlameTempRiseK: rise * 1.05 }, [{ name: "30 %", fuel: blend(0.3) }]), 0, "flame-temperature-rise").status,
    ).toBe("warn");
    expect(
      check(evaluate({ maxFlameTempRiseK: rise * 0.9 }, [{ name: "30 %", fuel: blend(0.3) }]), 0, "flame-temperature-rise").status,
    ).toBe("fail");
  });

  it("Wobbe: ± band relative to the baseline and an absolute range", () => {
    // Methane gross Wobbe at 15 °C/15 °C ≈ 50.7 MJ/m³ (ISO 6976:2016 Table values, value from memory).
    const r = evaluate({ wobbeTolerancePercent: 5, wobbeMin_MJ_per_m3: 47.2, wobbeMax_MJ_per_m3: 51.41 }, [
      { name: "10 %", fuel: blend(0.1) },
      { name: "propane", fuel: { compound: "C3H8", phase: "gas" } },
    ]);
    expect(r.baseline.fuel.wobbe!.gross_MJ_per_m3).toBeGreaterThan(50.5);
    expect(r.baseline.fuel.wobbe!.gross_MJ_per_m3).toBeLessThan(50.9);
    expect(check(r, 0, "wobbe-band").status).toBe("pass");
    expect(check(r, 1, "wobbe-band").status).toBe("fail");
    expect(check(r, 1, "wobbe-range").status).toBe("fail");
    // Great Britain's range 47.20–51.41 MJ/m³ (value from memory): methane sits inside, at usage |W − mid| / half-width.
    const c = check(r, -1, "wobbe-range");
    expect(c.status).toBe("pass");
    expect(c.usage!).toBeCloseTo(Math.abs(r.baseline.fuel.wobbe!.gross_MJ_per_m3 - 49.305) / 2.105, 10);
    expect(c.limit).toBe(51.41);
  });

  it("liquid candidate in a gas plant: Wobbe not applicable, fuel train warned", () => {
    const r = evaluate({ wobbeTolerancePercent: 5, fuelSupplyCapacity_m3_per_h: 500 }, [
      { name: "methanol", fuel: { compound: "CH3OH", phase: "liquid" } },
    ]);
    expect(check(r, 0, "wobbe-band").status).toBe("not-applicable");
    expect(check(r, 0, "fuel-supply").status).toBe("warn");
    expect(check(r, 0, "hydrogen-share").status).toBe("not-applicable");
  });

  it("fuel supply capacity against the gas volume flow at the metering reference", () => {
    const probe = evaluate({}, [{ name: "30 %", fuel: blend(0.3) }]);
    const v0 = probe.baseline.ratedFlows.fuelVolume_per_h!.value;
    const v30 = probe.scenarios[0].ratedFlows.fuelVolume_per_h!.value;
    expect(v30).toBeGreaterThan(v0 * 1.2); // hydrogen carries about a third of methane's energy per m³
    const r = evaluate({ fuelSupplyCapacity_m3_per_h: v0 * 1.15 }, [{ name: "30 %", fuel: blend(0.3) }]);
    expect(check(r, -1, "fuel-supply").status).toBe("pass");
    expect(check(r, 0, "fuel-supply").status).toBe("fail");
    expect(r.scenarios[0].status).toBe("infeasible");
  });

  it("a flame temperature that did not converge is reported as not-checked with the solver's message, never guessed", () => {
    const study = studySchema.parse({
      name: "x",
      currency: "EUR",
      discountRatePercent: 5,
      horizonYears: 5,
      plant: {
        name: "u",
        equipmentType: "kiln",
        ratedInput_kW: 1000,
        operatingHours: 1000,
        averageLoadFraction: 1,
        stackTemperatureC: 200,
        flueO2DryPercent: 3,
        combustionAirC: 20,
        radiationLossPercent: 1,
        condensing: false,
        maxFlameTempRiseK: 50,
      },
      baseline: { name: "m", fuel: METHANE },
      scenarios: [],
    });
    const ctx = new FuelContextCache().fromDefinition(METHANE);
    const perf = new PerformanceCache().get(ctx, operatingPointOf(study.plant));
    const duty = plantDuty(study.plant, ctx, perf);
    const rated = efficiencyAtUseful(perf, duty, duty.ratedUseful_kW);
    const ok: FuelInPlant = { ctx, perf, rated, flows: flowsForUseful(study.plant, ctx, perf, rated, duty.ratedUseful_kW) };
    const failed: FuelInPlant = {
      ...ok,
      perf: { ...perf, flame: null, flameError: "equilibrium flame temperature did not converge: test" },
    };
    const c = fitChecks(study.plant, ok, failed).find((x) => x.id === "flame-temperature-rise")!;
    expect(c.status).toBe("not-checked");
    expect(c.value).toBeNull();
    expect(c.message).toMatch(/did not converge/);
  });

  it("worst status ordering", () => {
    expect(worstStatus(["pass", "not-checked", "warn"])).toBe("warn");
    expect(worstStatus(["not-applicable", "fail", "warn"])).toBe("fail");
    expect(worstStatus(["not-checked"])).toBe("not-checked");
  });
});

describe("fit-check wording for a report", () => {
  it("a baseline that fails its own fan capacity is told to check the entered capacity; a candidate is not", () => {
    const flow = check(evaluate({}, []), -1, "flue-gas-fan").value!;
    const r = evaluate({ flueGasCapacity_m3_per_h: flow * 0.8 }, [{ name: "10 %", fuel: blend(0.1) }]);
    const base = check(r, -1, "flue-gas-fan");
    expect(base.status).toBe("fail");
    expect(base.message).toMatch(/the baseline itself exceeds the flue-gas fan capacity.*check the entered capacity/);
    const cand = check(r, 0, "flue-gas-fan");
    expect(cand.status).toBe("fail");
    expect(cand.message).not.toMatch(/check the entered/);
  });

  it("a ± Wobbe band is stated as its positive half-width for a lower and for a higher Wobbe index", () => {
    // Hydrogen lowers the Wobbe index of methane, propane raises it (ISO 6976:2016 gross Wobbe index of H2 ≈ 46 MJ/m³ and of C3H8 ≈ 81 MJ/m³ against methane ≈ 50.7 MJ/m³ at 15/15 °C, value from memory).
    const r = evaluate({ wobbeTolerancePercent: 5 }, [
      { name: "30 %", fuel: blend(0.3) },
      { name: "propane", fuel: { compound: "C3H8", phase: "gas" } },
    ]);
    expect(check(r, 0, "wobbe-band").value!).toBeLessThan(0);
    expect(check(r, 1, "wobbe-band").value!).toBeGreaterThan(0);
    for (const i of [-1, 0, 1]) expect(check(r, i, "wobbe-band").limit).toBe(5);
  });
});
