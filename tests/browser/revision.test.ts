/**
 * A study issued as a revision keeps its figures when the library changes, in a real browser: issue
 * revision 1 from the study page, correct the baseline gas's quote (a new version), and the report of
 * revision 1 reads exactly as before while the live report moves and the study page says what differs.
 */
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Page } from "playwright-core";
import { openBrowser } from "./browser";

const base = inject("baseURL");
let page: Page;
let close: () => Promise<void>;
let studyId = 0;
let gasId = 0;

const api = async (path: string, init?: RequestInit) => {
  const r = await fetch(`${base}${path}`, { ...init, headers: { "content-type": "application/json" } });
  return { status: r.status, body: await r.json() };
};

beforeAll(async () => {
  ({ page, close } = await openBrowser());
  await page.emulateMedia({ reducedMotion: "reduce" });
  const fuels = (await api("/api/fuels")).body as { fuels: { id: number; name: string }[] };
  const fuel = (name: string) => fuels.fuels.find((f) => f.name === name)!.id;
  gasId = fuel("Pipeline natural gas");
  const plants = (await api("/api/plants")).body as { plants: { id: number; name: string }[] };
  const plantId = plants.plants.find((p) => p.name === "Boiler 1 (gas)")!.id; // invented demo plant (seed/demo.ts)
  const made = await api("/api/studies", {
    method: "POST",
    body: JSON.stringify({
      plantId,
      name: "Browser revision study",
      currency: "EUR",
      carbonPrice_per_t: 80,
      discountRatePercent: 8,
      horizonYears: 15,
      baseline: { name: "Gas today", fuelId: gasId },
      scenarios: [{ name: "Biomethane", fuelId: fuel("Biomethane") }],
    }),
  });
  expect(made.status).toBe(201);
  studyId = made.body.id;
});
afterAll(async () => {
  await close?.();
});

async function reportText(query: string): Promise<string> {
  await page.goto(`${base}/studies/${studyId}/report${query}`);
  const report = page.getByTestId("report");
  await report.waitFor();
  // The charts draw in the browser: read the report once all three have drawn.
  await page.waitForFunction(() => document.querySelectorAll("[data-testid=report] figure.chart svg.recharts-surface").length >= 3);
  await page.waitForTimeout(300);
  return (await report.textContent()) ?? "";
}

describe("a revision survives a change of the library", () => {
  it("issues revision 1 from the study page; after a quote correction its report is unchanged, the live one moves", async () => {
    await page.goto(`${base}/studies/${studyId}`);
    await page.getByRole("button", { name: "Issue revision" }).click();
    await page.getByRole("link", { name: "Report" }).first().waitFor();
    const before = await reportText("?revision=1");
    expect(before).toMatch(/Revision 1 of \d{4}-\d{2}-\d{2}/);
    const liveBefore = await reportText("");

    // Correct the gas quote in force: a new version at a higher price (the old one is kept).
    const prices = (await api(`/api/fuels/${gasId}/prices`)).body as { prices: Record<string, unknown>[] };
    const q = prices.prices.find((p) => p.inForce)!;
    const corrected = await api(`/api/fuels/${gasId}/prices/${q.id}`, {
      method: "PUT",
      body: JSON.stringify({
        amount: (q.amount as number) * 1.5,
        currency: q.currency,
        unit: q.unit,
        energyBasis: q.energyBasis,
        validFrom: q.validFrom,
      }),
    });
    expect(corrected.status).toBe(201);

    const after = await reportText("?revision=1");
    expect(after).toBe(before);
    const liveAfter = await reportText("");
    expect(liveAfter).not.toBe(liveBefore);
    await page.goto(`${base}/studies/${studyId}`);
    expect(await page.getByTestId("revision-differs").textContent()).toMatch(/Live inputs differ from revision 1/);
  });
});
