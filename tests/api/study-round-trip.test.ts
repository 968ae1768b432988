/**
 * A stored study sent back unchanged through PUT /api/studies/{id} is stored unchanged: every field
 * of every scenario (per-scenario limits and operating-point overrides, the chosen quotes), the
 * sensitivity ranges and the report's cover. The demo study "Hydrogen blending and biomethane"
 * carries a scenario whose new burner allows 30 vol % H2 (invented demo data, seed/demo.ts).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeSeededApi, jsonRequest, openSeededApi, type SeededApi } from "./seeded-api";

let api: SeededApi;
let study: typeof import("../../app/api/studies/[id]/route");
let duplicate: typeof import("../../app/api/studies/[id]/duplicate/route");
let results: typeof import("../../app/api/studies/[id]/results/route");
let demoStudyId = 0;

beforeAll(async () => {
  api = await openSeededApi();
  demoStudyId = await api.studyId("Hydrogen blending and biomethane");
  study = await import("../../app/api/studies/[id]/route");
  duplicate = await import("../../app/api/studies/[id]/duplicate/route");
  results = await import("../../app/api/studies/[id]/results/route");
});
afterAll(async () => {
  await closeSeededApi(api);
});

const req = jsonRequest;
const ctx = (id: number) => ({ params: Promise.resolve({ id: String(id) }) });

type Stored = Record<string, unknown> & { scenarios: { name: string; overrides: Record<string, unknown> }[] };
const get = async (id: number): Promise<Stored> => (await study.GET(req(`/api/studies/${id}`), ctx(id))).json();
/** The study as the form sends it: the stored record without what the server adds (id, links, flags). */
const body = ({ id: _i, url: _u, results: _r, isDemo: _d, storedProblems: _p, ...rest }: Stored) => rest;
const put = (id: number, b: unknown) => study.PUT(req(`/api/studies/${id}`, "PUT", b), ctx(id));

async function hydrogenCheck(id: number, scenario: string): Promise<string | undefined> {
  const r = await (await results.GET(req(`/api/studies/${id}/results`), ctx(id))).json();
  const sc = (r.result.scenarios as { name: string; checks: { id: string; status: string }[] }[]).find((s) => s.name === scenario);
  return sc?.checks.find((c) => c.id === "hydrogen-share")?.status;
}

describe("study round trip through the API", () => {
  it("a duplicated demo study saved unchanged is stored identically and keeps its 30 % hydrogen burner limit", async () => {
    const dup = await duplicate.POST(req(`/api/studies/${demoStudyId}/duplicate`, "POST", {}), ctx(demoStudyId));
    expect(dup.status).toBe(201);
    const id = (await dup.json()).id as number;
    const before = await get(id);
    expect(before.scenarios.find((s) => s.name === "30 % hydrogen, new burner")?.overrides).toEqual({ maxH2SharePercent: 30 });
    const checkBefore = await hydrogenCheck(id, "30 % hydrogen, new burner");
    // 30 vol % against its own 30 % limit: at the limit, so a warning (the plant's 20 % would fail it).
    expect(checkBefore).toBe("warn");
    expect((await put(id, body(before))).status).toBe(200);
    expect(await get(id)).toEqual(before);
    expect(await hydrogenCheck(id, "30 % hydrogen, new burner")).toBe(checkBefore);
  });

  it("every override, a removed limit (null), a chosen quote and the cover survive a second save", async () => {
    const dup = await duplicate.POST(
      req(`/api/studies/${demoStudyId}/duplicate`, "POST", { name: "Round trip, every field" }),
      ctx(demoStudyId),
    );
    const id = (await dup.json()).id as number;
    const start = body(await get(id)) as Stored;
    // The baseline gas's older quote (per MMBtu), not the one in force: a choice the form must keep.
    const baseline = start.baseline as { fuelId: number };
    const quote = await api.t.client.priceQuote.findFirstOrThrow({ where: { fuelId: baseline.fuelId, unit: "MMBtu" } });
    const edited = {
      ...start,
      reportTitle: "Fuel options for Boiler 1",
      preparedFor: "Example Dairy Ltd",
      preparedBy: "A. Engineer",
      reportDate: "2026-11-30",
      reportNotes: "Prices are indicative.",
      baseline: { ...baseline, priceQuoteId: quote.id },
      sensitivity: { fuelPricePercent: 15, carbonPricePercent: 40, efficiencyPoints: 1.5, capexPercent: 25 },
      scenarios: start.scenarios.map((s, i) =>
        i === 0
          ? {
              ...s,
              overrides: {
                maxH2SharePercent: null,
                maxFlameTempRiseK: 120,
                wobbeTolerancePercent: 6,
                stackTemperatureC: 130,
                flueO2DryPercent: 3.5,
                combustionAirC: 30,
                radiationLossPercent: 1.2,
                condensing: false,
                returnWaterC: 50,
                condensingApproachK: 6,
                flueCODryPpm: 40,
                unburntCarbonInAshPercent: 0,
              },
            }
          : s,
      ),
    };
    const first = await put(id, edited);
    expect(first.status).toBe(200);
    const stored = await get(id);
    expect(body(stored)).toEqual(edited);
    expect((await put(id, body(stored))).status).toBe(200);
    expect(await get(id)).toEqual(stored);
  });
});
