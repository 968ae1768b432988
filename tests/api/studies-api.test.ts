/**
 * The plants and studies JSON API through its route handlers, on a temp SQLite file migrated like
 * production and seeded with the invented demo.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeSeededApi, jsonRequest, openSeededApi, type SeededApi } from "./seeded-api";
import { studySchema } from "../../lib/schemas/study";

let api: SeededApi;
let routes: {
  plants: typeof import("../../app/api/plants/route");
  plant: typeof import("../../app/api/plants/[id]/route");
  studies: typeof import("../../app/api/studies/route");
  study: typeof import("../../app/api/studies/[id]/route");
  duplicate: typeof import("../../app/api/studies/[id]/duplicate/route");
  results: typeof import("../../app/api/studies/[id]/results/route");
  exporter: typeof import("../../app/api/studies/[id]/export/route");
};
const fuel: Record<string, number> = {};
let plantId = 0;
let demoStudyId = 0;

beforeAll(async () => {
  api = await openSeededApi();
  Object.assign(fuel, api.fuel);
  plantId = api.plantId;
  demoStudyId = await api.studyId("Hydrogen blending and biomethane");
  routes = {
    plants: await import("../../app/api/plants/route"),
    plant: await import("../../app/api/plants/[id]/route"),
    studies: await import("../../app/api/studies/route"),
    study: await import("../../app/api/studies/[id]/route"),
    duplicate: await import("../../app/api/studies/[id]/duplicate/route"),
    results: await import("../../app/api/studies/[id]/results/route"),
    exporter: await import("../../app/api/studies/[id]/export/route"),
  };
});
afterAll(async () => {
  await closeSeededApi(api);
});

const req = jsonRequest;
const ctx = (id: number | string) => ({ params: Promise.resolve({ id: String(id) }) });

describe("plants API", () => {
  it("lists the demo plants and answers one with its limits", async () => {
    const list = await (await routes.plants.GET(req("/api/plants"))).json();
    expect(list.plants.map((p: { name: string }) => p.name)).toContain("Boiler 1 (gas)");
    const one = await routes.plant.GET(req(`/api/plants/${plantId}`), ctx(plantId));
    expect(one.status).toBe(200);
    const body = await one.json();
    expect(body.maxH2SharePercent).toBe(20); // invented demo limit (seed/demo.ts)
    expect(body.baselineFuelName).toBe("Pipeline natural gas");
    expect((await routes.plant.GET(req("/api/plants/99999"), ctx(99999))).status).toBe(404);
    expect((await routes.plant.GET(req("/api/plants/abc"), ctx("abc"))).status).toBe(404);
  });

  it("answers 400 with field errors for bad input and for a body that is not JSON", async () => {
    const bad = await routes.plants.POST(req("/api/plants", "POST", { name: "", equipmentType: "boiler" }));
    expect(bad.status).toBe(400);
    const b = await bad.json();
    expect(Object.keys(b.fieldErrors)).toEqual(expect.arrayContaining(["name", "equipmentType", "baselineFuelId"]));
    expect((await routes.plants.POST(req("/api/plants", "POST", "{not json"))).status).toBe(400);
  });

  it("refuses to delete a plant that has studies (409)", async () => {
    const res = await routes.plant.DELETE(req(`/api/plants/${plantId}`, "DELETE"), ctx(plantId));
    expect(res.status).toBe(409);
    expect((await res.json()).error).toMatch(/studies/);
  });
});

describe("studies API", () => {
  let id = 0;
  const body = () => ({
    plantId,
    name: "API study",
    currency: "EUR",
    carbonPrice_per_t: 100,
    discountRatePercent: 7,
    horizonYears: 12,
    baseline: { name: "Gas today", fuelId: fuel["Pipeline natural gas"] },
    scenarios: [
      { name: "20 % H2", fuelId: fuel["Natural gas + 20 % H2"], capex: 150000 },
      { name: "LPG", fuelId: fuel["LPG (propane)"], capex: 50000 },
    ],
  });

  it("creates (201), refuses a duplicate name (409) and bad input (400)", async () => {
    const res = await routes.studies.POST(req("/api/studies", "POST", body()));
    expect(res.status).toBe(201);
    id = (await res.json()).id;
    expect((await routes.studies.POST(req("/api/studies", "POST", body()))).status).toBe(409);
    const bad = await routes.studies.POST(req("/api/studies", "POST", { ...body(), name: "x", horizonYears: 0.5 }));
    expect(bad.status).toBe(400);
    expect((await bad.json()).fieldErrors.horizonYears).toMatch(/whole number/);
  });

  it("answers the stored study and its evaluated results; the metric can be chosen", async () => {
    const rec = await (await routes.study.GET(req(`/api/studies/${id}`), ctx(id))).json();
    expect(rec.scenarios).toHaveLength(2);
    const r1 = await routes.results.GET(req(`/api/studies/${id}/results`), ctx(id));
    expect(r1.status).toBe(200);
    const res1 = (await r1.json()).result;
    expect(res1.ranking.metric).toBe("cost-per-useful-MWh");
    expect(res1.scenarios).toHaveLength(2);
    const r2 = await (await routes.results.GET(req(`/api/studies/${id}/results?metric=npv`), ctx(id))).json();
    expect(r2.result.ranking.metric).toBe("npv");
    expect((await routes.results.GET(req(`/api/studies/${id}/results?metric=fastest`), ctx(id))).status).toBe(400);
  });

  it("exports CSV tables and a JSON file whose study part is a valid self-contained study", async () => {
    const csv = await routes.exporter.GET(req(`/api/studies/${id}/export?format=csv&table=checks`), ctx(id));
    expect(csv.headers.get("content-type")).toMatch(/text\/csv/);
    expect(csv.headers.get("content-disposition")).toMatch(/api-study-checks\.csv/);
    expect((await csv.text()).split("\n")[0]).toMatch(/^scenario,check,/);
    const sweep = await (
      await routes.exporter.GET(req(`/api/studies/${demoStudyId}/export?format=csv&table=sweep`), ctx(demoStudyId))
    ).text();
    expect(sweep.trim().split("\n")).toHaveLength(102); // header + 0..100 % in 1 % steps
    const json = await (await routes.exporter.GET(req(`/api/studies/${id}/export?format=json`), ctx(id))).json();
    expect(json.format).toBe("stoke-study-results");
    expect(studySchema.safeParse(json.study).success).toBe(true);
    // This study names no hydrogen: the file has no sweep, and asking for the sweep table names the field.
    expect(json.results.hydrogenSweep).toBeNull();
    const noSweep = await routes.exporter.GET(req(`/api/studies/${id}/export?format=csv&table=sweep`), ctx(id));
    expect(noSweep.status).toBe(400);
    expect(Object.keys((await noSweep.json()).fieldErrors)).toEqual(["hydrogenFuelId"]);
    const demoJson = await (await routes.exporter.GET(req(`/api/studies/${demoStudyId}/export?format=json`), ctx(demoStudyId))).json();
    expect(demoJson.results.hydrogenSweep.available).toBe(true);
    expect(demoJson.study.hydrogenSweep.hydrogen.name).toBe("Hydrogen");
    expect((await routes.exporter.GET(req(`/api/studies/${id}/export?format=xml`), ctx(id))).status).toBe(400);
    expect((await routes.exporter.GET(req(`/api/studies/99999/export`), ctx(99999))).status).toBe(404);
  });

  it("study CSV: CRLF line ends, and a scenario name a spreadsheet would run as a formula gets a leading apostrophe", async () => {
    // RFC 4180 (2005), section 2: CRLF line breaks. OWASP, "CSV Injection": =, +, -, @ start a formula.
    const made = await routes.studies.POST(
      req("/api/studies", "POST", { ...body(), name: "Formula names", scenarios: [{ name: "=1+1", fuelId: fuel["LPG (propane)"] }] }),
    );
    expect(made.status).toBe(201);
    const sid = (await made.json()).id;
    const text = await (await routes.exporter.GET(req(`/api/studies/${sid}/export?format=csv`), ctx(sid))).text();
    expect(text.endsWith("\r\n")).toBe(true);
    expect(text.split("\r\n").some((line) => line.split(",")[1] === "'=1+1")).toBe(true);
    expect((await routes.study.DELETE(req(`/api/studies/${sid}`, "DELETE"), ctx(sid))).status).toBe(200);
  });

  it("duplicates, updates and deletes", async () => {
    const dup = await routes.duplicate.POST(req(`/api/studies/${id}/duplicate`, "POST", {}), ctx(id));
    expect(dup.status).toBe(201);
    const dupId = (await dup.json()).id;
    const named = await routes.duplicate.POST(req(`/api/studies/${id}/duplicate`, "POST", { name: "API study" }), ctx(id));
    expect(named.status).toBe(409);
    const up = await routes.study.PUT(
      req(`/api/studies/${dupId}`, "PUT", { ...body(), name: "API study, one option", scenarios: body().scenarios.slice(0, 1) }),
      ctx(dupId),
    );
    expect(up.status).toBe(200);
    expect((await (await routes.study.GET(req(`/api/studies/${dupId}`), ctx(dupId))).json()).scenarios).toHaveLength(1);
    expect((await routes.study.DELETE(req(`/api/studies/${dupId}`, "DELETE"), ctx(dupId))).status).toBe(200);
    expect((await routes.study.GET(req(`/api/studies/${dupId}`), ctx(dupId))).status).toBe(404);
    const list = await (await routes.studies.GET(req(`/api/studies?plant=${plantId}`))).json();
    expect(list.studies.map((s: { name: string }) => s.name)).toEqual(
      expect.arrayContaining(["API study", "Hydrogen blending and biomethane"]),
    );
  });
});
