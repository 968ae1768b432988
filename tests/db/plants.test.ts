/** Plants in the database: validated create/update/delete; nothing stored from rejected input. */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { tempDb } from "./temp-db";
import { seedIfEmpty } from "../../seed/index";
import { createPlant, deletePlant, getPlant, listPlants, updatePlant } from "../../lib/services/plants";
import { plantFromRow } from "../../lib/db/plant-rows";

const t = await tempDb();
let ngId = 0;
beforeAll(async () => {
  await seedIfEmpty(t.client);
  ngId = (await t.client.fuel.findFirstOrThrow({ where: { name: "Pipeline natural gas" } })).id;
});
afterAll(() => t.cleanup());

// Invented test plant (common practice, no source: typical small hot-water boiler figures).
const valid = () => ({
  name: "Test boiler",
  site: "Nowhere (invented)",
  equipmentType: "hot-water-boiler",
  ratedInput_kW: 2000,
  ratedInputBasis: "net",
  operatingHours: 4000,
  averageLoadFraction: 0.5,
  stackTemperatureC: 60,
  flueO2DryPercent: 3,
  combustionAirC: 20,
  radiationLossPercent: 1,
  condensing: true,
  returnWaterC: 35,
  wobbeTolerancePercent: 5,
  maxH2SharePercent: 10,
  baselineFuelId: 0,
});

describe("plants", () => {
  it("creates a plant and reads back the same figures", async () => {
    const r = await createPlant(t.client, { ...valid(), baselineFuelId: ngId });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const back = await getPlant(t.client, r.value.id);
    expect(back?.baselineFuelName).toBe("Pipeline natural gas");
    expect(back?.plant.returnWaterC).toBe(35);
    expect(back?.plant.ambientAir).toEqual({ temperatureC: 15, relativeHumidityPercent: 60 });
    expect(plantFromRow(r.value).maxH2SharePercent).toBe(10);
  });

  it("rejects bad input field by field and stores nothing", async () => {
    const before = await t.client.plant.count();
    const r = await createPlant(t.client, {
      ...valid(),
      name: "Broken",
      ratedInput_kW: -5,
      flueO2DryPercent: 25,
      condensing: true,
      returnWaterC: null,
      baselineFuelId: 99999,
    });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.kind).toBe("invalid");
    expect(r.fieldErrors.ratedInput_kW).toMatch(/> 0/);
    expect(r.fieldErrors.flueO2DryPercent).toMatch(/18/);
    expect(r.fieldErrors.returnWaterC).toMatch(/return-water/);
    expect(r.fieldErrors.baselineFuelId).toMatch(/no stored fuel/);
    expect(await t.client.plant.count()).toBe(before);
  });

  it("needs a baseline fuel and refuses unknown fields", async () => {
    const r = await createPlant(t.client, { ...valid(), name: "No fuel", baselineFuelId: null, colour: "red" });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.fieldErrors.baselineFuelId).toMatch(/choose/);
    expect(Object.keys(r.fieldErrors).join(" ")).toMatch(/_|colour/);
  });

  it("refuses a duplicate name (any case) with 409", async () => {
    const r = await createPlant(t.client, { ...valid(), name: "TEST BOILER", baselineFuelId: ngId });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.kind).toBe("conflict");
      expect(r.fieldErrors.name).toMatch(/already exists/);
    }
  });

  it("updates, and a rejected update leaves the row as it was", async () => {
    const row = await t.client.plant.findFirstOrThrow({ where: { name: "Test boiler" } });
    const ok = await updatePlant(t.client, row.id, { ...valid(), ratedInput_kW: 2500, baselineFuelId: ngId });
    expect(ok.ok).toBe(true);
    const bad = await updatePlant(t.client, row.id, { ...valid(), ratedInput_kW: "lots", baselineFuelId: ngId });
    expect(bad.ok).toBe(false);
    expect((await t.client.plant.findUniqueOrThrow({ where: { id: row.id } })).ratedInput_kW).toBe(2500);
    expect((await updatePlant(t.client, 999999, { ...valid(), baselineFuelId: ngId })).ok).toBe(false);
  });

  it("will not delete a plant that has studies; deletes one that has none", async () => {
    const seeded = (await listPlants(t.client)).find((p) => p.studies.length > 0)!;
    const refused = await deletePlant(t.client, seeded.id);
    expect(refused.ok).toBe(false);
    if (!refused.ok) expect(refused.kind).toBe("conflict");
    const row = await t.client.plant.findFirstOrThrow({ where: { name: "Test boiler" } });
    expect((await deletePlant(t.client, row.id)).ok).toBe(true);
    expect(await getPlant(t.client, row.id)).toBeNull();
  });
});
