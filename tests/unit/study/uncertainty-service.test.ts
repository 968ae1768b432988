/**
 * The uncertainty ranking of a stored study (lib/services/uncertainty.ts) and its JSON/CSV route,
 * on a temp SQLite file migrated like production and seeded with the invented demo.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { tempDb, type TempDb } from "../../db/temp-db";
import { seedIfEmpty } from "../../../seed/index";
import { uncertaintyOfStoredStudy } from "../../../lib/services/uncertainty";

let t: TempDb;
let id = 0;
let route: typeof import("../../../app/api/studies/[id]/uncertainty/route");

beforeAll(async () => {
  t = await tempDb();
  process.env.DATABASE_URL = t.url;
  await seedIfEmpty(t.client);
  id = (await t.client.study.findFirstOrThrow({ orderBy: { id: "asc" } })).id;
  route = await import("../../../app/api/studies/[id]/uncertainty/route");
});
afterAll(async () => {
  const { db } = await import("../../../lib/db/client");
  await db().$disconnect();
  await t.cleanup();
});

const get = (q: string) =>
  route.GET(new Request(`http://x/api/studies/${id}/uncertainty${q}`), { params: Promise.resolve({ id: String(id) }) });

describe("uncertainty of a stored study", () => {
  it("ranks the demo study with ranges stated for the view, and names the field of a bad request", async () => {
    const ans = await uncertaintyOfStoredStudy(t.client, id, {
      draws: 500,
      seed: 2,
      shape: "pert",
      ranges: { fuelPricePercent: 30 },
      fuelPriceCorrelation: 0.5,
    });
    if (!ans.ok) throw new Error(ans.message);
    expect(ans.result.scenarios.reduce((s, x) => s + x.pFirst, 0)).toBeCloseTo(1, 12);
    const price = ans.result.inputs.find((i) => i.kind === "price")!;
    // PERT on (−30, 0, 30): standard deviation √((μ−a)(b−μ)/7) = 30/√7 (Vose, Risk Analysis, 3rd ed., §9.1).
    expect(price.sd).toBeCloseTo(30 / Math.sqrt(7), 9);
    const bad = await uncertaintyOfStoredStudy(t.client, id, { draws: 5, seed: 1 });
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(Object.keys(bad.fieldErrors)).toContain("draws");
    const missing = await uncertaintyOfStoredStudy(t.client, 999_999, { draws: 500, seed: 1 });
    expect(!missing.ok && missing.kind).toBe("not-found");
  });

  it("answers JSON and CSV through its route, 400 naming the address field of a value out of range", async () => {
    const res = await get("?draws=300&seed=4&metric=npv");
    expect(res.status).toBe(200);
    const body = (await res.json()) as { result: { draws: number; metric: string; scenarios: unknown[] } };
    expect(body.result.draws).toBe(300);
    expect(body.result.metric).toBe("npv");
    const csv = await get("?draws=300&format=csv");
    expect(csv.headers.get("content-type")).toMatch(/text\/csv/);
    expect((await csv.text()).split("\r\n")[0]).toMatch(/^scenario,baseline,status/);
    const bad = await get("?draws=300&fp=500");
    expect(bad.status).toBe(400);
    expect(Object.keys(((await bad.json()) as { fieldErrors: Record<string, string> }).fieldErrors)).toEqual(["fp"]);
  });
});
