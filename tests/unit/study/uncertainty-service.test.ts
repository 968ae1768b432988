/** The uncertainty ranking of a stored study (lib/services/uncertainty.ts) on the seeded demo. */
import { afterAll, describe, expect, it } from "vitest";
import { tempDb } from "../../db/temp-db";
import { seedIfEmpty } from "../../../seed/index";
import { uncertaintyOfStoredStudy } from "../../../lib/services/uncertainty";

const t = tempDb();
afterAll(() => t.cleanup());

describe("uncertainty of a stored study", () => {
  it("ranks the demo study with ranges stated for the view, and names the field of a bad request", async () => {
    await seedIfEmpty(t.client);
    const study = await t.client.study.findFirst({ orderBy: { id: "asc" } });
    expect(study).not.toBeNull();
    const id = study!.id;
    const ans = await uncertaintyOfStoredStudy(t.client, id, { draws: 500, seed: 2, shape: "pert", ranges: { fuelPricePercent: 30 }, fuelPriceCorrelation: 0.5 });
    if (!ans.ok) throw new Error(ans.message);
    const total = ans.result.scenarios.reduce((s, x) => s + x.pFirst, 0);
    expect(total).toBeCloseTo(1, 12);
    const price = ans.result.inputs.find((i) => i.kind === "price")!;
    // PERT on (−30, 0, 30): standard deviation √((μ−a)(b−μ)/7) = 30/√7 (Vose, Risk Analysis, 3rd ed., §9.1).
    expect(price.sd).toBeCloseTo(30 / Math.sqrt(7), 9);
    const bad = await uncertaintyOfStoredStudy(t.client, id, { draws: 5 , seed: 1 });
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(Object.keys(bad.fieldErrors)).toContain("draws");
    const missing = await uncertaintyOfStoredStudy(t.client, 999_999, { draws: 500, seed: 1 });
    expect(!missing.ok && missing.kind).toBe("not-found");
  });
});
