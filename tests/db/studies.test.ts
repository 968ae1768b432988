/** Studies in the database: create, edit, duplicate, delete; evaluation of the stored study. */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { tempDb } from "./temp-db";
import { seedIfEmpty } from "../../seed/index";
import {
  createStudy,
  deleteStudy,
  duplicateStudy,
  evaluateStoredStudy,
  listStudies,
  recordFieldOf,
  studyRecord,
  updateStudy,
} from "../../lib/services/studies";

const t = await tempDb();
const fuel: Record<string, number> = {};
let plantId = 0;
beforeAll(async () => {
  await seedIfEmpty(t.client);
  for (const f of await t.client.fuel.findMany()) fuel[f.name] = f.id;
  plantId = (await t.client.plant.findFirstOrThrow({ where: { name: "Boiler 1 (gas)" } })).id;
});
afterAll(() => t.cleanup());

const record = () => ({
  plantId,
  name: "Three options",
  currency: "EUR",
  carbonPrice_per_t: 80,
  discountRatePercent: 8,
  horizonYears: 15,
  priceEscalationPercent: 0,
  rankingMetric: "cost-per-useful-MWh",
  baseline: { name: "Today", fuelId: fuel["Pipeline natural gas"], priceQuoteId: null },
  scenarios: [
    { name: "H2 10", fuelId: fuel["Natural gas + 10 % H2"], capex: 50000 },
    { name: "H2 30", fuelId: fuel["Natural gas + 30 % H2"], capex: 300000 },
    { name: "Bio", fuelId: fuel.Biomethane },
  ],
});

describe("studies", () => {
  let id = 0;
  it("creates a study with a baseline and three candidates and evaluates it", async () => {
    const r = await createStudy(t.client, record());
    expect(r.ok, JSON.stringify(r)).toBe(true);
    if (!r.ok) return;
    id = r.value.id;
    const ev = await evaluateStoredStudy(t.client, id);
    expect(ev.ok).toBe(true);
    if (!ev.ok) return;
    expect(ev.result.scenarios.map((s) => s.name)).toEqual(["H2 10", "H2 30", "Bio"]);
    expect(ev.result.ranking.entries).toHaveLength(4);
    // The demo plant's burner maker allows 20 vol % H2 (invented demo limit): 30 % fails that check.
    const h30 = ev.result.scenarios[1];
    expect(h30.checks.find((c) => c.id === "hydrogen-share")!.status).toBe("fail");
    expect(h30.status).toBe("infeasible");
    // The 10 % and 30 % blends have no quote of their own: priced from their components' quotes.
    expect(ev.bundle.meta.scenarios[0].price.kind).toBe("components");
    expect(ev.bundle.meta.anyInventedPrice).toBe(true);
    // Infeasible scenarios are ranked after the feasible ones, never dropped.
    expect(ev.result.ranking.entries.at(-1)!.name).toBe("H2 30");
  });

  it("re-ranks when the metric changes", async () => {
    const a = await evaluateStoredStudy(t.client, id, { metric: "cost-per-useful-MWh" });
    const b = await evaluateStoredStudy(t.client, id, { metric: "co2-per-useful-MJ" });
    if (!a.ok || !b.ok) throw new Error("evaluation failed");
    const first = (x: typeof a) => (x.ok ? x.result.ranking.entries[0].name : "");
    // Fossil natural gas is cheapest per useful MWh; biomethane (biogenic carbon) has the least fossil CO2.
    expect(first(a)).toBe("Today");
    expect(first(b)).toBe("Bio");
  });

  it("rejects bad input naming the field, stores nothing", async () => {
    const before = await t.client.study.count();
    const bad = record();
    bad.name = "Bad";
    (bad.scenarios[0] as Record<string, unknown>).capex = -1;
    bad.scenarios[1].fuelId = 999999;
    bad.scenarios[2].name = "today";
    const r = await createStudy(t.client, bad);
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.fieldErrors["scenarios.0.capex"]).toMatch(/≥ 0/);
      expect(r.fieldErrors["scenarios.2.name"]).toMatch(/already used/);
    }
    const bad2 = record();
    bad2.name = "Bad 2";
    bad2.scenarios[1].fuelId = 999999;
    const r2 = await createStudy(t.client, bad2);
    expect(r2.ok).toBe(false);
    if (!r2.ok) expect(r2.fieldErrors["scenarios.1.fuelId"]).toMatch(/no stored fuel/);
    expect(await t.client.study.count()).toBe(before);
  });

  it("refuses a price quote of another fuel, and one in another currency", async () => {
    const h2Quote = await t.client.priceQuote.findFirstOrThrow({ where: { fuelId: fuel.Hydrogen } });
    const bad = record();
    bad.name = "Wrong quote";
    (bad.scenarios[2] as Record<string, unknown>).priceQuoteId = h2Quote.id;
    const r = await createStudy(t.client, bad);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.fieldErrors["scenarios.2.priceQuoteId"]).toMatch(/not a price quote of the chosen fuel/);
    const usd = record();
    usd.name = "Dollars";
    usd.currency = "USD";
    const bioQuote = await t.client.priceQuote.findFirstOrThrow({ where: { fuelId: fuel.Biomethane } });
    (usd.scenarios[2] as Record<string, unknown>).priceQuoteId = bioQuote.id;
    const r2 = await createStudy(t.client, usd);
    expect(r2.ok).toBe(false);
    if (!r2.ok) expect(r2.fieldErrors["scenarios.2.priceQuoteId"]).toMatch(/EUR; the study is in USD/);
  });

  it("refuses a study that cannot be evaluated (condensing override without return water)", async () => {
    const bad = record();
    bad.name = "Condensing";
    (bad.scenarios[0] as Record<string, unknown>).overrides = { condensing: true };
    const r = await createStudy(t.client, bad);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.fieldErrors["scenarios.0.overrides.returnWaterC"]).toMatch(/return-water/);
    expect(recordFieldOf("scenarios.3.price.unit")).toBe("scenarios.3.priceQuoteId");
    expect(recordFieldOf("baseline.fuel.composition")).toBe("baseline.fuelId");
  });

  it("a duplicate name on the same plant is a 409", async () => {
    const r = await createStudy(t.client, { ...record(), name: "three OPTIONS" });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.kind).toBe("conflict");
  });

  it("edits, duplicates and deletes", async () => {
    const rec = (await studyRecord(t.client, id))!;
    expect(rec.scenarios).toHaveLength(3);
    expect(rec.storedProblems).toEqual({});
    const { id: _id, isDemo: _d, storedProblems: _p, ...body } = rec;
    body.scenarios = body.scenarios.slice(0, 2);
    body.carbonPrice_per_t = 120;
    body.includeUpstream = true;
    body.sensitivity = { fuelPricePercent: 35, carbonPricePercent: 50, efficiencyPoints: 1, capexPercent: 30 };
    const up = await updateStudy(t.client, id, body);
    expect(up.ok, JSON.stringify(up)).toBe(true);
    const after = (await studyRecord(t.client, id))!;
    expect(after.scenarios).toHaveLength(2);
    expect(after.includeUpstream).toBe(true);
    expect(after.sensitivity).toMatchObject({ fuelPricePercent: 35, efficiencyPoints: 1 });
    // The stored settings are what an evaluation uses unless a view overrides them.
    const stored = await evaluateStoredStudy(t.client, id);
    expect(stored.ok && stored.result.study.includeUpstream).toBe(true);
    expect(stored.ok && stored.result.study.sensitivity.fuelPricePercent).toBe(35);
    const viewed = await evaluateStoredStudy(t.client, id, { includeUpstream: false });
    expect(viewed.ok && viewed.result.study.includeUpstream).toBe(false);

    const dup = await duplicateStudy(t.client, id);
    expect(dup.ok).toBe(true);
    if (!dup.ok) return;
    expect(dup.value.name).toBe("Three options (copy)");
    expect((await studyRecord(t.client, dup.value.id))!.scenarios).toHaveLength(2);
    expect((await studyRecord(t.client, dup.value.id))!.includeUpstream).toBe(true);
    const dup2 = await duplicateStudy(t.client, id);
    expect(dup2.ok && dup2.value.name).toBe("Three options (copy 2)");

    expect((await deleteStudy(t.client, dup.value.id)).ok).toBe(true);
    expect(await t.client.scenario.count({ where: { studyId: dup.value.id } })).toBe(0);
    expect((await deleteStudy(t.client, dup.value.id)).ok).toBe(false);
    expect((await listStudies(t.client, { plantId })).map((s) => s.name)).toContain("Three options (copy 2)");
  });

  it("the seeded demo studies evaluate, with the hydrogen sweep priced from the study's hydrogen", async () => {
    for (const s of await listStudies(t.client)) {
      const ev = await evaluateStoredStudy(t.client, s.id, { sweep: "if-chosen" });
      expect(ev.ok, s.name).toBe(true);
    }
    const demo = (await listStudies(t.client)).find((s) => s.name === "Hydrogen blending and biomethane")!;
    const ev = await evaluateStoredStudy(t.client, demo.id, { sweep: true });
    if (!ev.ok) throw new Error(ev.message);
    expect(ev.bundle.meta.hydrogen.price.kind).toBe("current");
    const sw = ev.result.hydrogenSweep!;
    expect(sw.available).toBe(true);
    expect(sw.points.every((p) => p.costPerUsefulMWh !== null)).toBe(true);
    expect(sw.crossings.find((c) => c.checkId === "hydrogen-share")!.firstFailPercent).toBeGreaterThan(20);
  });

  it("reports stored values that cannot be read, naming the field, instead of replacing them silently", async () => {
    const made = await createStudy(t.client, { ...record(), name: "Unreadable settings" });
    expect(made.ok).toBe(true);
    if (!made.ok) return;
    const sid = made.value.id;
    await t.client.study.update({ where: { id: sid }, data: { sensitivityRanges: "{not json" } });
    const first = await t.client.scenario.findFirstOrThrow({ where: { studyId: sid, isBaseline: false }, orderBy: { position: "asc" } });
    await t.client.scenario.update({ where: { id: first.id }, data: { overrides: '{"stackTemperatureC":"hot"}' } });

    const ev = await evaluateStoredStudy(t.client, sid);
    expect(ev.ok).toBe(false);
    if (!ev.ok) {
      expect(ev.kind).toBe("unprocessable");
      expect(ev.fieldErrors.sensitivity).toMatch(/not valid JSON/);
      expect(ev.fieldErrors["scenarios.0.overrides"]).toMatch(/stackTemperatureC/);
      expect(ev.message).toMatch(/sensitivity, scenarios\.0\.overrides/);
    }
    const rec = await studyRecord(t.client, sid);
    expect(Object.keys(rec!.storedProblems).sort()).toEqual(["scenarios.0.overrides", "sensitivity"]);
    await deleteStudy(t.client, sid);
  });
});
