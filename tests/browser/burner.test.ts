/**
 * The burner in the browser: a study on the demo boiler with a fuel whose flame is not yet solved
 * (a biogas made for this test). The hydrogen sweep page opens at once with the flame progress shown, stays usable while
 * the background solve runs, and fills in: the burning-velocity ratio, NOx and untuned-burner curves,
 * and the biogas row of the comparison page's burner section. The demo study's other flames are
 * precomputed (tests/fixtures/flames, seeded by the global setup), so one flame is solved here.
 */
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Page } from "playwright-core";
import { openBrowser } from "./browser";

const base = inject("baseURL");
let page: Page;
let close: () => Promise<void>;
let studyId = 0;

beforeAll(async () => {
  ({ page, close } = await openBrowser());
  await page.emulateMedia({ reducedMotion: "reduce" });
  const plants = (await (await fetch(`${base}/api/plants`)).json()) as { plants: { id: number; name: string }[] };
  const plantId = plants.plants.find((p) => p.name === "Boiler 1 (gas)")!.id;
  // A gas of its own (invented: no other test burns it), so its flame is the one solved here.
  const made = await fetch(`${base}/api/fuels`, {
    method: "POST",
    headers: { "content-type": "application/json", origin: base },
    body: JSON.stringify({ name: "Browser test gas 75/25", definition: { composition: { CH4: 0.75, CO2: 0.25 } }, biogenicCarbonShare: 1 }),
  });
  if (made.status !== 201) throw new Error(`creating the test gas answered ${made.status}: ${await made.text()}`);
  const fuels = (await (await fetch(`${base}/api/fuels`)).json()) as { fuels: { id: number; name: string }[] };
  const fuel = (name: string) => fuels.fuels.find((f) => f.name === name)!.id;
  const res = await fetch(`${base}/api/studies`, {
    method: "POST",
    headers: { "content-type": "application/json", origin: base },
    body: JSON.stringify({
      plantId,
      name: "Browser study: burner",
      currency: "EUR",
      carbonPrice_per_t: 80,
      discountRatePercent: 8,
      horizonYears: 15,
      priceEscalationPercent: 0,
      // the hydrogen the sweep blends in (a study without one has no sweep)
      hydrogenFuelId: fuel("Hydrogen"),
      baseline: { name: "Natural gas (today)", fuelId: fuel("Pipeline natural gas") },
      scenarios: [
        { name: "30 % hydrogen", fuelId: fuel("Natural gas + 30 % H2") },
        { name: "Biogas", fuelId: fuel("Browser test gas 75/25") },
      ],
    }),
  });
  if (res.status !== 201) throw new Error(`creating the test study answered ${res.status}: ${await res.text()}`);
  studyId = ((await res.json()) as { id: number }).id;
});

afterAll(async () => {
  await close?.();
});

describe("the burner on the hydrogen sweep page", () => {
  it("shows the flame progress, stays usable while a flame is solved, then draws the new curves", async () => {
    await page.goto(`${base}/studies/${studyId}/sweep`);
    const progress = page.getByTestId("flame-progress");
    await progress.waitFor();
    // 12 solves: the baseline (= 0 %), 30 %, the biogas, and the sweep's other flame shares; the biogas is new.
    expect(await progress.textContent()).toMatch(/Flame solves: 11 of 12 done/);
    expect(await progress.locator("progress").count()).toBe(1);

    // Usable meanwhile: the comparison page answers with its burner section, biogas pending.
    const t0 = Date.now();
    const other = await page.context().newPage();
    await other.goto(`${base}/studies/${studyId}`);
    await other.getByTestId("burner-section").waitFor();
    expect(Date.now() - t0).toBeLessThan(15_000);
    await other.close();

    // The new curves are there from the start (the flame shares of the sweep are precomputed).
    for (const id of ["chart-burning-velocity", "chart-nox", "chart-untuned-heat-input", "chart-untuned-lambda"]) {
      const d = await page.getByTestId(id).locator("path.recharts-line-curve").first().getAttribute("d");
      expect((d ?? "").length, id).toBeGreaterThan(20);
    }
    expect(await page.getByTestId("chart-burning-velocity").textContent()).toMatch(/fail 1\.50 ×/);
    expect(await page.getByTestId("chart-nox").textContent()).toMatch(/permit 100 mg\/m³/);
    expect(await page.getByTestId("crossings").textContent()).toMatch(/Flashback/);

    // The background solve finishes and the page refreshes itself.
    await page.getByTestId("flame-progress").filter({ hasText: "all 12 done" }).waitFor({ timeout: 150_000 });
  }, 200_000);

  it("the comparison page's burner section then shows the biogas flame beside the baseline's", async () => {
    await page.goto(`${base}/studies/${studyId}`);
    const row = page.getByTestId("burner-emissions").locator('tr[data-scenario="Biogas"]');
    await row.waitFor();
    const cells = await row.locator("td").allTextContents();
    // burning velocity in cm/s: a number, slower than natural gas (25 % CO2 dilutes the flame)
    expect(Number(cells[1])).toBeGreaterThan(5);
    expect(Number(cells[2])).toBeLessThan(1);
    expect(await page.getByTestId("burner-cautions").textContent()).toMatch(/burner maker/);
  });
});
