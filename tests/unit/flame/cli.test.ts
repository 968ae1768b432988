import { describe, expect, it } from "vitest";
import { runCli } from "../../../lib/cli/main";

const run = (input: unknown) => runCli(["flame-speed", "--input", "-"], () => JSON.stringify(input));

describe("stoke flame-speed (runner)", () => {
  it("exits 2 naming the field of a bad input", async () => {
    const r = await run({ fuel: { composition: { CH4: 1 } }, phi: 0 });
    expect(r.exitCode).toBe(2);
    expect(r.stderr).toMatch(/^stoke: phi: /);
  });

  it("exits 2 naming the species the mechanism lacks", async () => {
    const r = await run({ fuel: { composition: { CH4: 0.95, H2S: 0.05 } }, phi: 1 });
    expect(r.exitCode).toBe(2);
    expect(r.stderr).toMatch(/H2S/);
  });

  it("exits 2 when phi and excessAirPercent are both given", async () => {
    const r = await run({ fuel: { composition: { CH4: 1 } }, phi: 1, excessAirPercent: 10 });
    expect(r.exitCode).toBe(2);
    expect(r.stderr).toMatch(/phi: give only one/);
  });

  it("prints one JSON object with the burning velocity and the NO figure (coarse grid)", async () => {
    const r = await run({
      fuel: { composition: { CH4: 1 } },
      excessAirPercent: 10,
      postFlameResidenceMs: 5,
      grid: { slope: 0.3, curve: 0.6 },
    });
    expect(r.exitCode).toBe(0);
    const out = JSON.parse(r.stdout);
    for (const key of [
      "burningVelocity_cm_per_s",
      "burntTemperatureK",
      "flameThickness_mm",
      "gridPoints",
      "mechanism",
      "transport",
      "products",
      "NO",
    ]) {
      expect(out).toHaveProperty(key);
    }
    expect(out.unburnt.phi).toBeCloseTo(1 / 1.1, 10); // excess air 10 % ⇒ λ = 1.1 (definition)
    expect(out.NO).toMatchObject({ residenceMs: 5, referenceO2Percent: 3 });
    expect(out.solution).toBeUndefined();
  }, 300_000);
});
