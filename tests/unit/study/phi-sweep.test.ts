/** φ sweep: equilibrium and complete-combustion flame temperatures against the equivalence ratio. */
import { describe, expect, it } from "vitest";
import { phiSweep } from "../../../lib/study/phi-sweep";
import { InputError } from "../../../lib/errors";
import { flameTemperature } from "../../../lib/combustion/flame";

describe("phi sweep", () => {
  const methane = phiSweep({ fuel: { composition: { CH4: 1 } } });

  it("methane–air at 298 K, 1 atm: equilibrium peak on the rich side near φ ≈ 1.035, about 2236 K", () => {
    // Turns, An Introduction to Combustion, 3rd ed. (2012), §2 (Fig. 2.14 and text): the equilibrium
    // adiabatic flame temperature of methane–air peaks slightly rich, at φ ≈ 1.035, about 2236 K
    // (value from memory).
    const peak = methane.peak.equilibrium!;
    expect(peak.method).toBe("golden-section search on the solver");
    expect(peak.phi).toBeGreaterThan(1.01);
    expect(peak.phi).toBeLessThan(1.06);
    expect(peak.temperatureK).toBeGreaterThan(2236 - 15);
    expect(peak.temperatureK).toBeLessThan(2236 + 15);
  });

  it("methane–air at φ = 1: the sweep's equilibrium point is the single equilibrium solve", () => {
    // The published stoichiometric flame temperature is checked once, in tests/unit/equilibrium.test.ts;
    // here the sweep must return the same state as a direct solve of the same charge (within 0.5 K).
    const p = methane.points.find((x) => Math.abs(x.phi - 1) < 1e-9)!;
    const single = flameTemperature({ fuel: { composition: { CH4: 1 } }, phi: 1, method: "equilibrium" });
    expect(Math.abs(p.equilibriumK! - single.temperatureK)).toBeLessThan(0.5);
    // Complete combustion ignores dissociation and is hotter there (common practice, no source).
    expect(p.completeK!).toBeGreaterThan(p.equilibriumK! + 50);
  });

  it("complete combustion peaks at stoichiometry; equilibrium never exceeds it", () => {
    // Without dissociation the heat release per mole of products is largest at φ = 1 (textbook fact, no source).
    expect(Math.abs(methane.peak.complete!.phi - 1)).toBeLessThan(0.01);
    for (const p of methane.points) {
      expect(p.errors).toEqual([]);
      expect(p.equilibriumK!).toBeLessThanOrEqual(p.completeK! + 1e-6);
    }
  });

  it("lean flames converge: at φ = 0.5 dissociation is negligible (within 10 K)", () => {
    // Common practice, no source: below about 1800 K equilibrium and complete combustion agree closely.
    const p = methane.points[0];
    expect(p.phi).toBeCloseTo(0.5, 9);
    expect(Math.abs(p.equilibriumK! - p.completeK!)).toBeLessThan(10);
  });

  it("hydrogen–air also peaks rich of stoichiometric, near φ ≈ 1.05–1.1, about 2400 K", () => {
    // Hydrogen–air flames peak on the rich side, at about 2400 K at 298 K and 1 atm (common textbook
    // figure, e.g. Glassman & Yetter, Combustion, 4th ed. (2008); value from memory).
    const h2 = phiSweep({ fuel: { composition: { H2: 1 } }, meanCp: false });
    expect(h2.peak.equilibrium!.phi).toBeGreaterThan(1.02);
    expect(h2.peak.equilibrium!.phi).toBeLessThan(1.12);
    expect(h2.peak.equilibrium!.temperatureK).toBeGreaterThan(2350);
    expect(h2.peak.equilibrium!.temperatureK).toBeLessThan(2450);
    expect(h2.points.every((p) => p.meanCpK === null)).toBe(true);
  });

  it("preheated air raises every point", () => {
    const hot = phiSweep({ fuel: { composition: { CH4: 1 } }, oxidizerTemperatureK: 573.15, steps: 4, phiMin: 0.8, phiMax: 1.2 });
    const cold = phiSweep({ fuel: { composition: { CH4: 1 } }, steps: 4, phiMin: 0.8, phiMax: 1.2 });
    hot.points.forEach((p, i) => {
      expect(p.equilibriumK!).toBeGreaterThan(cold.points[i].equilibriumK! + 100);
    });
  });

  it("a liquid fed above its boiling point is refused once, naming fuelTemperatureK; below it the sweep runs", () => {
    // Methanol boils at 64.7 °C at 101.325 kPa and at about 112 °C at 5 bar (NIST Chemistry WebBook,
    // methanol phase-change data, value from memory); the model's Clausius–Clapeyron estimate must be within 3 K.
    const fuel = { compound: "CH3OH", phase: "liquid" as const };
    expect(() => phiSweep({ fuel, fuelTemperatureK: 273.15 + 66, steps: 2 })).toThrow(/^fuelTemperatureK: methanol boils at 337\.8 K/);
    expect(() => phiSweep({ fuel, fuelTemperatureK: 273.15 + 63, steps: 2, meanCp: false })).not.toThrow();
    expect(() => phiSweep({ fuel, fuelTemperatureK: 273.15 + 109, pressurePa: 5e5, steps: 2, meanCp: false })).not.toThrow();
    expect(() => phiSweep({ fuel, fuelTemperatureK: 273.15 + 115, pressurePa: 5e5, steps: 2 })).toThrow(InputError);
  });

  it("rejects an impossible range with an input error naming the field", () => {
    expect(() => phiSweep({ fuel: { composition: { CH4: 1 } }, phiMin: 1.2, phiMax: 1.0 })).toThrow(
      expect.objectContaining({ kind: "input", field: "phiMax" }),
    );
    expect(() => phiSweep({ fuel: { composition: { CH4: 1 } }, phiMin: 0, phiMax: 1.0 })).toThrow(
      expect.objectContaining({ kind: "input", field: "phiMin" }),
    );
  });
});

describe("phi sweep in a plant", () => {
  it("uses the plant's preheated humid air and reports its operating φ from the flue O2", async () => {
    const { plantSchema } = await import("../../../lib/schemas/plant");
    // Invented plant (common practice, no source): 3 % O2 dry, air preheated to 200 °C.
    const plant = plantSchema.parse({
      name: "p",
      equipmentType: "steam-boiler",
      ratedInput_kW: 1000,
      operatingHours: 1000,
      averageLoadFraction: 0.5,
      stackTemperatureC: 150,
      flueO2DryPercent: 3,
      combustionAirC: 200,
      radiationLossPercent: 1,
      condensing: false,
    });
    const { phiSweepInPlant } = await import("../../../lib/study/phi-sweep");
    const r = phiSweepInPlant({ composition: { CH4: 1 } }, plant, {}, { steps: 10, phiMin: 0.6, phiMax: 1.4 });
    // 3 % O2 dry in methane flue gas ≈ 15 % excess air, φ ≈ 0.87 (common practice, e.g. λ = 21/(21 − O2) ≈ 1.17).
    expect(r.operatingPhi!).toBeGreaterThan(0.84);
    expect(r.operatingPhi!).toBeLessThan(0.88);
    // Preheating the air by 175 K raises the peak well above the 298 K dry-air value of about 2236 K,
    // by less than 175 K because dissociation grows (common practice, no source).
    expect(r.peak.equilibrium!.temperatureK).toBeGreaterThan(2236 + 30);
    expect(r.peak.equilibrium!.temperatureK).toBeLessThan(2236 + 175);
    expect(r.conditions.combustionAirC).toBe(200);
  });
});
