/**
 * The burner through the database: a plant's burner, permit and liquid train stored and read back
 * (the liquid train's reference liquid named by library id), the demo study evaluated with the flame
 * solves found in FlameSolve, each stored once. No flame is solved here: the rows come from the
 * precomputed fixture (tests/fixtures/flames, how it was made is written there).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { tempDb } from "./temp-db";
import { seedIfEmpty } from "../../seed/index";
import { createPlant, getPlant } from "../../lib/services/plants";
import { evaluateStoredStudy } from "../../lib/services/studies";
import { flameKeyHash, flameLookup, storeFlameOutcome } from "../../lib/services/flames";
import { exampleStudyFlames, seedFlameFixture } from "../support/flame-fixture";

const t = await tempDb();
let ngId = 0;
let gasOilId = 0;
let demoStudyId = 0;
beforeAll(async () => {
  await seedIfEmpty(t.client);
  ngId = (await t.client.fuel.findFirstOrThrow({ where: { name: "Pipeline natural gas" } })).id;
  gasOilId = (await t.client.fuel.findFirstOrThrow({ where: { name: "Gas oil" } })).id;
  demoStudyId = (await t.client.study.findFirstOrThrow({ where: { name: "Hydrogen blending and biomethane" } })).id;
});
afterAll(() => t.cleanup());

// Invented test plant (common practice, no source).
const plant = (extra: Record<string, unknown>) => ({
  name: "Dual-fuel test boiler",
  equipmentType: "steam-boiler",
  ratedInput_kW: 3000,
  operatingHours: 5000,
  averageLoadFraction: 0.6,
  stackTemperatureC: 160,
  flueO2DryPercent: 3,
  combustionAirC: 20,
  radiationLossPercent: 1,
  condensing: false,
  baselineFuelId: ngId,
  ...extra,
});

describe("the burner in the database", () => {
  it("stores a plant's burner, permit and liquid train and reads them back", async () => {
    const r = await createPlant(
      t.client,
      plant({
        burner: { type: "premixed", airControl: "o2-trim", flashbackWarnRatio: 1.1, flashbackFailRatio: 1.3, regulatedSupply: true },
        noxLimit_mg_per_m3: 100,
        so2Limit_mg_per_m3: 35,
        gasBurnerPressure_kPa: 2,
        gasSupplyPressure_kPa: 2.5,
        liquidTrain: {
          flowCapacity: 400,
          flowUnit: "L/h",
          viscosityMin_mm2_per_s: 1.6,
          viscosityMax_mm2_per_s: 6,
          referenceFuelId: gasOilId,
        },
      }),
    );
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const p = (await getPlant(t.client, r.value.id))!.plant;
    expect(p.burner).toEqual({
      type: "premixed",
      airControl: "o2-trim",
      flashbackWarnRatio: 1.1,
      flashbackFailRatio: 1.3,
      regulatedSupply: true,
    });
    expect(p.noxLimit_mg_per_m3).toBe(100);
    expect(p.gasSupplyPressure_kPa).toBe(2.5);
    expect(p.liquidTrain?.flowCapacity).toBe(400);
    expect(p.liquidTrain?.firingTemperatureC).toBe(20);
    expect(p.liquidTrain?.referenceFuel.name).toBe("Gas oil");
    expect("ultimate" in (p.liquidTrain?.referenceFuel ?? {})).toBe(true);
  });

  it("names the field when the liquid train's reference is not a liquid", async () => {
    const r = await createPlant(
      t.client,
      plant({ name: "Bad train", liquidTrain: { flowCapacity: 400, flowUnit: "kg/h", referenceFuelId: ngId } }),
    );
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.fieldErrors["liquidTrain.referenceFuel"]).toMatch(/not a liquid/);
  });

  it("evaluates the demo study with the stored flame solves, each stored once", async () => {
    const before = await evaluateStoredStudy(t.client, demoStudyId, { sweep: true, tornado: false });
    if (!before.ok) throw new Error(before.message);
    expect(before.result.flameSolves.pending).toBe(12);
    expect(before.result.scenarios[1].burner.burningVelocityRatio).toBeNull();

    expect(await seedFlameFixture(t.client)).toBe(12);
    const after = await evaluateStoredStudy(t.client, demoStudyId, { sweep: true, tornado: false });
    if (!after.ok) throw new Error(after.message);
    expect(after.result.flameSolves.pending).toBe(0);
    const h20 = after.result.scenarios.find((s) => s.name === "20 % hydrogen")!;
    expect(h20.burner.burningVelocityRatio!).toBeGreaterThan(1.08);
    expect(h20.checks.find((c) => c.id === "flashback")!.status).toBe("pass");

    // A second writer of the same solve changes nothing: one row per key, the first outcome kept.
    const [key, outcome] = [...exampleStudyFlames()][0];
    await storeFlameOutcome(t.client, key, { error: "a later writer" });
    expect(await t.client.flameSolve.count({ where: { key: flameKeyHash(key) } })).toBe(1);
    const row = await t.client.flameSolve.findUniqueOrThrow({ where: { key: flameKeyHash(key) } });
    expect(JSON.parse(row.result!)).toEqual(outcome);
    expect((await flameLookup(t.client)).get(key)).toEqual(outcome);
  });
});
