/** The demo seed: fills an empty database once, with data every page can show. */
import { afterAll, describe, expect, it } from "vitest";
import { tempDb } from "./temp-db";
import { seedIfEmpty } from "../../seed/index";
import { fuelList, fuelSheet } from "../../lib/services/fuel-views";
import { DEMO_FUELS } from "../../seed/demo";

const t = await tempDb();
afterAll(() => t.cleanup());

describe("demo seed", () => {
  it("seeds an empty database once", async () => {
    const first = await seedIfEmpty(t.client);
    expect(first.seeded).toBe(true);
    expect(first.fuels).toBeGreaterThanOrEqual(15);
    expect(first.plants).toBeGreaterThanOrEqual(2);
    const second = await seedIfEmpty(t.client);
    expect(second.seeded).toBe(false);
    expect(await t.client.fuel.count()).toBe(first.fuels);
  });

  it("holds the fuels the story needs, every price marked invented, units mixed", async () => {
    const names = (await t.client.fuel.findMany()).map((f) => f.name);
    for (const n of [
      "Pipeline natural gas",
      "Hydrogen",
      "Natural gas + 10 % H2",
      "Natural gas + 20 % H2",
      "Natural gas + 30 % H2",
      "Biomethane",
      "Biogas 60/40",
      "Landfill gas",
      "LPG (propane)",
      "Methanol",
      "Ethanol",
      "FAME biodiesel",
      "HVO",
      "Gas oil",
      "Heavy fuel oil",
      "Ammonia",
      "Wood pellets",
    ]) {
      expect(names).toContain(n);
    }
    const quotes = await t.client.priceQuote.findMany();
    expect(quotes.every((q) => q.isInvented)).toBe(true);
    const units = new Set(quotes.map((q) => q.unit));
    for (const u of ["MWh", "t", "L", "MMBtu"]) expect(units).toContain(u);
    expect((await t.client.fuel.findMany()).every((f) => f.isDemo)).toBe(true);
    expect(DEMO_FUELS.length).toBe(names.length);
  });

  it("every demo fuel computes and every price in force normalises", async () => {
    const list = await fuelList(t.client);
    for (const f of list) {
      expect(f.error, f.name).toBeNull();
      if (f.price) expect(f.price.error, f.name).toBeNull();
    }
    // Blends by volume: the 20 % blend's hydrogen mole fraction is 0.2.
    const blend = list.find((f) => f.name === "Natural gas + 20 % H2")!;
    expect(blend.properties!.h2MoleFraction).toBeCloseTo(0.2, 12);
    // Biomethane's carbon is biogenic: no fossil CO2.
    expect(list.find((f) => f.name === "Biomethane")!.properties!.co2.fossil_kg_per_GJ_lhv).toBe(0);
  });

  it("a blend without a quote of its own is priced from its components' quotes, mass-weighted per kg", async () => {
    const list = await fuelList(t.client);
    const blend = list.find((f) => f.name === "Natural gas + 10 % H2")!;
    expect(blend.price).toBeNull();
    const est = blend.estimatedPrice!;
    expect(est).not.toBeNull();
    // By hand: 10 vol % H2 in the pipeline gas → mass fractions from the molar masses.
    const ng = list.find((f) => f.name === "Pipeline natural gas")!;
    const h2 = list.find((f) => f.name === "Hydrogen")!;
    const mNg = 0.9 * ng.properties!.molarMass_g_per_mol!,
      mH2 = 0.1 * h2.properties!.molarMass_g_per_mol!;
    const perKg = (mNg * ng.price!.normalised!.perKg + mH2 * h2.price!.normalised!.perKg) / (mNg + mH2);
    expect(est.normalised.perKg).toBeCloseTo(perKg, 10);
    expect(est.normalised.perMWh_net).toBeCloseTo((perKg * 3600) / blend.properties!.lhv.MJ_per_kg, 8);
  });

  it("plants and studies refer to stored fuels; the sheet of a seeded fuel shows flame temperatures", async () => {
    const plants = await t.client.plant.findMany({ include: { baselineFuel: true, studies: { include: { scenarios: true } } } });
    expect(plants.every((p) => p.baselineFuel !== null)).toBe(true);
    const scenarios = plants.flatMap((p) => p.studies.flatMap((s) => s.scenarios));
    expect(scenarios.length).toBeGreaterThan(4);
    const ng = await t.client.fuel.findUniqueOrThrow({ where: { name: "Pipeline natural gas" } });
    const sheet = (await fuelSheet(t.client, ng.id))!;
    expect(sheet.flame.filter((r) => r.temperatureK !== null).length).toBe(6);
    expect(sheet.prices.length).toBe(2);
  });
});
