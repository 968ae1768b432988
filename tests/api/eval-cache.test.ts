/**
 * Evaluated studies and fuel property sheets are cached by the content of what they depend on: a
 * repeated request is served from the cache, and an edited quote or fuel is reflected at once.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeSeededApi, jsonRequest as req, openSeededApi, type SeededApi } from "./seeded-api";
import { createEvaluationCaches, evaluateStudy } from "../../lib/study/evaluate";
import type { StudyResult } from "../../lib/study/evaluate";

let s: SeededApi;
let studies: typeof import("../../lib/services/studies");
let fuelsService: typeof import("../../lib/services/fuels");
let cache: typeof import("../../lib/services/eval-cache");
let fuelsRoute: typeof import("../../app/api/fuels/route");

const STUDY = "Hydrogen blending and biomethane"; // seed/demo.ts

beforeAll(async () => {
  s = await openSeededApi();
  studies = await import("../../lib/services/studies");
  fuelsService = await import("../../lib/services/fuels");
  cache = await import("../../lib/services/eval-cache");
  fuelsRoute = await import("../../app/api/fuels/route");
});
afterAll(async () => {
  await closeSeededApi(s);
});

async function evaluated(id: number) {
  const ev = await studies.evaluateStoredStudy(s.t.client, id);
  if (!ev.ok) throw new Error(ev.message);
  return ev;
}

/** The same study evaluated afresh, without any cache. */
function uncached(study: Parameters<typeof evaluateStudy>[0]): StudyResult {
  return evaluateStudy(study, { sweep: false, tornado: true, caches: createEvaluationCaches() });
}

describe("evaluated studies cached by content", () => {
  it("a repeated evaluation is the cached result", async () => {
    const id = await s.studyId(STUDY);
    const a = await evaluated(id);
    const hits = cache.resultCache().hits;
    const b = await evaluated(id);
    expect(b.result).toBe(a.result);
    expect(cache.resultCache().hits).toBe(hits + 1);
  });

  it("a corrected quote is reflected at once: doubling the delivered price doubles the baseline's annual fuel cost", async () => {
    const id = await s.studyId(STUDY);
    const before = await evaluated(id);
    const baseline = before.result.baseline;
    const source = before.bundle.meta.baseline.price;
    if (source.kind !== "quote" && source.kind !== "current") throw new Error(`the demo baseline is priced by ${source.kind}`);
    const q = await s.t.client.priceQuote.findUniqueOrThrow({ where: { id: source.quoteId } });
    const delivered = q.amount + q.transportAdder + q.handlingAdder;
    const r = await fuelsService.correctPriceQuote(s.t.client, q.fuelId, q.id, {
      amount: 2 * delivered - q.transportAdder - q.handlingAdder,
      currency: q.currency,
      unit: q.unit,
      energyBasis: q.energyBasis,
      meteringReference: q.meteringReference,
      transportAdder: q.transportAdder,
      handlingAdder: q.handlingAdder,
      validFrom: q.validFrom.toISOString().slice(0, 10),
      supplier: q.supplier,
      sourceNote: "doubled (test)",
      confirmImplausible: true,
    });
    expect(r.ok).toBe(true);
    const after = await evaluated(id);
    expect(after.result).not.toBe(before.result);
    // Fuel cost is linear in the delivered price at an unchanged fuel input (common practice, no source).
    expect(after.result.baseline.costs!.annualFuelCost).toBeCloseTo(2 * baseline.costs!.annualFuelCost, 6);
    expect(after.result.baseline.costs!.fuelInput_MWh_gross).toBe(baseline.costs!.fuelInput_MWh_gross);
  });

  it("an edited fuel is reflected at once: the result equals a fresh evaluation of the changed study", async () => {
    const id = await s.studyId(STUDY);
    const before = await evaluated(id);
    const fuelId = before.bundle.meta.baseline.fuelId;
    const row = await s.t.client.fuel.findUniqueOrThrow({ where: { id: fuelId } });
    const def = JSON.parse(row.definition) as { composition: Record<string, number> };
    const composition = { ...def.composition, CH4: (def.composition.CH4 ?? 0) - 0.02, C2H6: (def.composition.C2H6 ?? 0) + 0.02 };
    const u = await fuelsService.updateFuel(s.t.client, fuelId, {
      name: row.name,
      definition: { ...def, composition },
      densityKgPerM3: row.densityKgPerM3,
      biogenicCarbonShare: row.biogenicCarbonShare,
      upstreamCo2e_kg_per_GJ: row.upstreamCo2e_kg_per_GJ,
      notes: row.notes,
      source: row.source,
    });
    expect(u.ok).toBe(true);
    const after = await evaluated(id);
    expect(after.result).not.toBe(before.result);
    expect(after.result.baseline.costs!.fuelInput_MWh_gross).not.toBe(before.result.baseline.costs!.fuelInput_MWh_gross);
    // `stats` counts the evaluation caches' hits, which differ between shared and fresh caches.
    const { stats: _a, ...cached } = after.result;
    const { stats: _b, ...fresh } = uncached(after.bundle.study);
    expect(JSON.stringify(cached)).toBe(JSON.stringify(fresh));
  });
});

describe("evaluated studies and their flame solves", () => {
  it("a solve stored for another study keeps this study's cached result; one it asked for makes a new one", async () => {
    const flames = await import("../../lib/services/flames");
    const id = (await s.t.client.study.findFirstOrThrow({ where: { name: STUDY } })).id;
    const first = await evaluated(id);
    const needed = first.result.flameSolves.needed;
    expect(needed.length).toBeGreaterThan(0);
    expect(first.result.flameSolves.pending).toBe(needed.length); // none solved in this database yet
    // A solve no part of this study asks for.
    await flames.storeFlameOutcome(s.t.client, JSON.stringify({ unrelated: "flame request", at: 1 }), {
      error: "a solve of another study",
    });
    expect((await evaluated(id)).result).toBe(first.result);
    // One of its own: the result changes, counting it.
    await flames.storeFlameOutcome(s.t.client, needed[0].key, { error: "stored for this test" });
    const after = await evaluated(id);
    expect(after.result).not.toBe(first.result);
    expect(after.result.flameSolves.failed).toBe(first.result.flameSolves.failed + 1);
  });
});

describe("fuel property sheets cached by content", () => {
  it("an edited fuel's figures change at once and equal those of a new fuel with the same definition", async () => {
    const created = await fuelsService.createFuel(s.t.client, { name: "Cache test gas", definition: { composition: { CH4: 1 } } });
    if (!created.ok) throw new Error(created.message);
    const figures = async (name: string) =>
      ((await (await fuelsRoute.GET(req("/api/fuels?kind=gas"))).json()).fuels as { name: string; hhv: unknown; wobbe: unknown }[]).find(
        (f) => f.name === name,
      )!;
    const first = await figures("Cache test gas");
    expect(await figures("Cache test gas")).toEqual(first);
    const edited = await fuelsService.updateFuel(s.t.client, created.value.id, {
      name: "Cache test gas",
      definition: { composition: { CH4: 0.8, C2H6: 0.2 } },
    });
    expect(edited.ok).toBe(true);
    const twin = await fuelsService.createFuel(s.t.client, {
      name: "Cache twin gas",
      definition: { composition: { CH4: 0.8, C2H6: 0.2 } },
    });
    expect(twin.ok).toBe(true);
    const after = await figures("Cache test gas");
    expect(after.hhv).not.toEqual(first.hhv);
    const fresh = await figures("Cache twin gas");
    expect({ hhv: after.hhv, wobbe: after.wobbe }).toEqual({ hhv: fresh.hhv, wobbe: fresh.wobbe });
  });
});
