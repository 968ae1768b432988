/**
 * The decision pages in a real browser, from the seeded demo: build a study for the demo plant
 * with three candidates, watch the ranking change with the metric, see the fail flag of a blend
 * beyond the burner maker's hydrogen limit, open the hydrogen sweep and see its limit markers,
 * print-preview the report; plants get field errors and store nothing from bad input. Every
 * decision page is also opened at a desktop and a narrow (390 px) width and must not need
 * sideways scrolling of the whole page (wide tables scroll inside their own frame).
 *
 * Set STOKE_SCREENSHOT_DIR to keep a screenshot of every page at both widths.
 */
import fs from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Page } from "playwright-core";
import { openBrowser } from "./browser";

const base = inject("baseURL");
let page: Page;
let close: () => Promise<void>;
let studyId = 0;
let plantId = 0;
const STUDY = "Browser study: three options";
const FORM_STUDY = "Browser study built in the form";

// The demo plant and its burner maker's H2 limit (20 vol %) are invented demo data (seed/demo.ts).
const DEMO_PLANT = "Boiler 1 (gas)";

beforeAll(async () => {
  ({ page, close } = await openBrowser());
  await page.emulateMedia({ reducedMotion: "reduce" });
  const plants = (await (await fetch(`${base}/api/plants`)).json()) as { plants: { id: number; name: string }[] };
  plantId = plants.plants.find((p) => p.name === DEMO_PLANT)!.id;
  studyId = await createStudyThroughApi();
});

/**
 * The study the later tests read, made through the API with what the form makes of the same choices
 * (its defaults: EUR, carbon 80/t, 8 %, 15 years, no escalation; scenarios named after their fuels), so
 * no test depends on another having run first.
 */
async function createStudyThroughApi(): Promise<number> {
  const fuels = (await (await fetch(`${base}/api/fuels`)).json()) as { fuels: { id: number; name: string }[] };
  const fuel = (name: string) => fuels.fuels.find((f) => f.name === name)!.id;
  const body = {
    plantId,
    name: STUDY,
    currency: "EUR",
    carbonPrice_per_t: 80,
    discountRatePercent: 8,
    horizonYears: 15,
    priceEscalationPercent: 0,
    hydrogenFuelId: fuel("Hydrogen"),
    baseline: { name: "Pipeline natural gas (today)", fuelId: fuel("Pipeline natural gas") },
    scenarios: [
      { name: "Natural gas + 10 % H2", fuelId: fuel("Natural gas + 10 % H2"), capex: 60000 },
      { name: "Natural gas + 30 % H2", fuelId: fuel("Natural gas + 30 % H2"), capex: 420000 },
      { name: "Biomethane", fuelId: fuel("Biomethane") },
    ],
  };
  const res = await fetch(`${base}/api/studies`, {
    method: "POST",
    headers: { "content-type": "application/json", origin: base },
    body: JSON.stringify(body),
  });
  if (res.status !== 201) throw new Error(`creating the test study answered ${res.status}: ${await res.text()}`);
  return ((await res.json()) as { id: number }).id;
}
afterAll(async () => {
  await close?.();
});

async function rankedNames(): Promise<string[]> {
  await page.locator("[data-testid=rank-table] tbody tr").first().waitFor();
  return page.locator("[data-testid=rank-table] tbody tr").evaluateAll((rows) => rows.map((r) => r.getAttribute("data-scenario") ?? ""));
}

describe("decision pages in the browser", () => {
  it("builds a study for the seeded plant with three candidate scenarios", async () => {
    await page.goto(`${base}/studies/new?plant=${plantId}`);
    await page.getByRole("heading", { level: 1, name: "New study" }).waitFor();
    await page.getByLabel("Study name").fill(FORM_STUDY);
    // The baseline starts as the plant's present fuel.
    const baseline = page.getByTestId("baseline-card");
    expect(await baseline.getByLabel("Fuel or blend").locator("option:checked").textContent()).toContain("Pipeline natural gas");
    // A new study is offered the library's pure hydrogen for its sweep.
    expect(await page.locator("#f-hydrogenFuelId option:checked").textContent()).toBe("Hydrogen");

    await page.getByTestId("scenario-card-0").getByLabel("Fuel or blend").selectOption({ label: "Natural gas + 10 % H2 (blend)" });
    await page
      .getByTestId("scenario-card-0")
      .getByLabel(/Switching capex/)
      .fill("60000");
    await page.getByRole("button", { name: "+ Add candidate" }).click();
    await page.getByTestId("scenario-card-1").getByLabel("Fuel or blend").selectOption({ label: "Natural gas + 30 % H2 (blend)" });
    await page
      .getByTestId("scenario-card-1")
      .getByLabel(/Switching capex/)
      .fill("420000");
    await page.getByRole("button", { name: "+ Add candidate" }).click();
    await page.getByTestId("scenario-card-2").getByLabel("Fuel or blend").selectOption({ label: "Biomethane" });
    // Choosing a fuel names the scenario after it.
    expect(await page.getByTestId("scenario-card-2").getByLabel("Scenario name").inputValue()).toBe("Biomethane");

    await page.getByRole("button", { name: "Create study" }).click();
    await page.waitForURL(/\/studies\/\d+$/);
    await page.getByRole("heading", { level: 1, name: FORM_STUDY }).waitFor();
    expect((await rankedNames()).sort()).toEqual(
      ["Biomethane", "Natural gas + 10 % H2", "Natural gas + 30 % H2", "Pipeline natural gas (today)"].sort(),
    );
    // Charts rendered (recharts draws SVG in the browser, after the page has loaded).
    await page.waitForFunction(() => document.querySelectorAll("figure.chart svg.recharts-surface").length >= 3);
  });

  it("shows a field error and stores nothing for a study with a bad capex", async () => {
    const before = ((await (await fetch(`${base}/api/studies`)).json()) as { studies: unknown[] }).studies.length;
    await page.goto(`${base}/studies/new?plant=${plantId}`);
    await page.getByLabel("Study name").fill("Rejected study");
    await page.getByTestId("scenario-card-0").getByLabel("Fuel or blend").selectOption({ label: "Biomethane" });
    await page
      .getByTestId("scenario-card-0")
      .getByLabel(/Switching capex/)
      .fill("-5");
    await page.getByRole("button", { name: "Create study" }).click();
    await page.locator(".form-errors").waitFor();
    expect(await page.getByTestId("scenario-card-0").locator(".field-error").first().textContent()).toMatch(/≥ 0/);
    expect(page.url()).toMatch(/\/studies\/new/);
    const after = ((await (await fetch(`${base}/api/studies`)).json()) as { studies: unknown[] }).studies.length;
    expect(after).toBe(before);
  });

  it("re-ranks when the metric changes", async () => {
    await page.goto(`${base}/studies/${studyId}`);
    const byCost = await rankedNames();
    // At the demo's invented prices natural gas is the cheapest per useful MWh.
    expect(byCost[0]).toBe("Pipeline natural gas (today)");
    await page.getByRole("group", { name: "Rank by" }).getByRole("link", { name: "CO2 per useful MJ" }).click();
    await page.waitForURL(/metric=co2-per-useful-MJ/);
    await page.locator("[data-testid=rank-table] th.metric", { hasText: "CO2" }).waitFor();
    const byCo2 = await rankedNames();
    // Biomethane's carbon is biogenic: least fossil CO2 per useful MJ.
    expect(byCo2[0]).toBe("Biomethane");
    expect(byCo2).not.toEqual(byCost);
    expect(await page.getByTestId("verdict-best").textContent()).toContain("Biomethane");
  });

  it("flags the 30 % hydrogen blend as infeasible against the burner maker's 20 % limit, and keeps it in the table", async () => {
    await page.goto(`${base}/studies/${studyId}`);
    const row = page.locator("[data-testid=rank-table] tbody tr[data-scenario='Natural gas + 30 % H2']");
    expect(await row.getAttribute("data-status")).toBe("infeasible");
    await row.locator(".st-infeasible").waitFor({ state: "visible" });
    const names = await rankedNames();
    expect(names.at(-1)).toBe("Natural gas + 30 % H2");
    const cells = page.locator("[data-testid=check-matrix] td[data-check='hydrogen-share']");
    const statuses = await cells.evaluateAll((tds) => tds.map((t) => t.getAttribute("data-status")));
    expect(statuses).toContain("fail");
    const failCell = cells.locator("xpath=self::*[@data-status='fail']");
    expect(await failCell.textContent()).toMatch(/30\.0 vol %.*limit 20\.0 vol %/);
    expect(await page.getByTestId("verdict-infeasible").textContent()).toMatch(/Natural gas \+ 30 % H2.*Hydrogen share/);
  });

  it("opens the hydrogen sweep and sees the burner limit and the first-failure markers", async () => {
    await page.goto(`${base}/studies/${studyId}`);
    await page.getByRole("navigation", { name: "Study pages" }).getByRole("link", { name: "Hydrogen sweep" }).click();
    await page.waitForURL(/\/sweep/);
    await page.getByRole("heading", { name: /How much hydrogen/ }).waitFor();
    // The burner maker's limit is drawn as a line on every panel, and red dots mark first failures.
    // (A vertical line has no width, so it is checked as drawn rather than "visible".)
    await page.locator(".sweep-burner-limit line").first().waitFor({ state: "attached" });
    const lines = await page.locator(".sweep-burner-limit line").evaluateAll((ls) =>
      ls.map((l) => ({
        x1: Number(l.getAttribute("x1")),
        x2: Number(l.getAttribute("x2")),
        len: Math.abs(Number(l.getAttribute("y1")) - Number(l.getAttribute("y2"))),
      })),
    );
    expect(lines.length).toBeGreaterThanOrEqual(6);
    for (const l of lines) {
      expect(l.x1).toBe(l.x2);
      expect(l.len).toBeGreaterThan(50);
    }
    expect(await page.getByText("burner limit 20 %").count()).toBeGreaterThan(0);
    await page.locator(".sweep-marker-fail circle").first().waitFor();
    expect(await page.locator(".sweep-marker-fail").count()).toBeGreaterThan(0);
    // What each marker means is listed under its chart, clear of ticks and other labels.
    expect(await page.locator(".sweep-marker-list li", { hasText: /fails from \d+ vol % H2/ }).count()).toBeGreaterThan(0);
    // The answer card names the largest share before a limit fails (the demo burner: 20 vol %).
    expect(await page.getByTestId("sweep-limit").textContent()).toMatch(/20 vol % H2/);
    const hRow = page.locator("[data-testid=crossings] tr", { hasText: "Hydrogen share vs burner maker's limit" });
    expect(await hRow.locator("td").nth(3).textContent()).toMatch(/2[01] vol %/);
  });

  it("switches display units without changing the stored study", async () => {
    await page.goto(`${base}/studies/${studyId}`);
    const costCell = page.locator("[data-testid=rank-table] tbody tr[data-scenario='Biomethane'] td[data-col=cost]");
    const perMWh = Number((await costCell.textContent())!.replace(/,/g, ""));
    await page.getByRole("group", { name: "Energy" }).getByRole("button", { name: "GJ" }).click();
    await page.locator("[data-testid=rank-table] th", { hasText: "EUR/GJ" }).first().waitFor();
    const perGJ = Number((await costCell.textContent())!.replace(/,/g, ""));
    // 1 MWh = 3.6 GJ exactly (SI definition of the watt-hour).
    expect(perGJ).toBeCloseTo(perMWh / 3.6, 1);
    await page.getByRole("group", { name: "Energy" }).getByRole("button", { name: "MWh" }).click();
    await page.locator("[data-testid=rank-table] th", { hasText: "EUR/MWh" }).first().waitFor();
    const stored = (await (await fetch(`${base}/api/studies/${studyId}`)).json()) as { name: string; scenarios: unknown[] };
    expect(stored.name).toBe(STUDY);
    expect(stored.scenarios).toHaveLength(3);
  });

  it("print-previews the report: A4 page, controls hidden, sources and cautions present", async () => {
    await page.goto(`${base}/studies/${studyId}/report`);
    await page.getByTestId("report").waitFor();
    await page.emulateMedia({ media: "print", reducedMotion: "reduce" });
    expect(await page.locator(".study-tabs").isVisible()).toBe(false);
    expect(await page.locator(".report-toolbar").isVisible()).toBe(false);
    expect(await page.locator("header.topbar").isVisible()).toBe(false);
    expect(await page.getByTestId("report").isVisible()).toBe(true);
    const css = await page.locator("style").evaluateAll((s) => s.map((x) => x.textContent ?? "").join("\n"));
    expect(css).toMatch(/@page\s*{\s*size:\s*A4/);
    const text = (await page.getByTestId("report").textContent()) ?? "";
    for (const s of [
      "Plant",
      "Assumptions",
      "Ranked scenarios",
      "Fit checks",
      "Methods",
      "Sources",
      "Safety cautions",
      "NASA RP-1311",
      "ISO 6976",
      "invented",
    ])
      expect(text).toContain(s);
    expect(await page.locator(".report .caution h3", { hasText: "Hydrogen" }).count()).toBe(1);
    const pdf = await page.pdf({ preferCSSPageSize: true, printBackground: true });
    expect(pdf.subarray(0, 5).toString()).toBe("%PDF-");
    await page.emulateMedia({ media: "screen", reducedMotion: "reduce" });
    // US Letter on request.
    await page.goto(`${base}/studies/${studyId}/report?paper=letter`);
    const css2 = await page.locator("style").evaluateAll((s) => s.map((x) => x.textContent ?? "").join("\n"));
    expect(css2).toMatch(/@page\s*{\s*size:\s*Letter/);
  });

  it("exports the study as CSV and JSON", async () => {
    const csv = await (await fetch(`${base}/api/studies/${studyId}/export?format=csv`)).text();
    expect(csv.split("\n")[0]).toMatch(/^rank,scenario,/);
    expect(csv).toContain("Natural gas + 30 % H2");
    const json = (await (await fetch(`${base}/api/studies/${studyId}/export?format=json`)).json()) as {
      format: string;
      study: { scenarios: unknown[] };
      results: { ranking: { entries: unknown[] } };
    };
    expect(json.format).toBe("stoke-study-results");
    expect(json.study.scenarios).toHaveLength(3);
    expect(json.results.ranking.entries).toHaveLength(4);
  });

  it("rejects a plant with bad figures field by field and stores nothing", async () => {
    const before = ((await (await fetch(`${base}/api/plants`)).json()) as { plants: unknown[] }).plants.length;
    await page.goto(`${base}/plants/new`);
    await page.getByLabel("Name", { exact: true }).fill("Browser boiler");
    await page.getByLabel("Fuel burnt today (baseline)").selectOption({ label: "Pipeline natural gas (gas)" });
    await page.getByLabel("Rated heat input", { exact: true }).fill("-100");
    await page.getByLabel("Flue-gas O2, vol % dry").fill("25");
    await page.getByRole("button", { name: "Create plant" }).click();
    await page.locator(".form-errors").waitFor();
    expect(await page.locator("#err-ratedInput_kW").textContent()).toMatch(/> 0/);
    expect(await page.locator("#err-flueO2DryPercent").textContent()).toMatch(/≤ 18/);
    const after = ((await (await fetch(`${base}/api/plants`)).json()) as { plants: unknown[] }).plants.length;
    expect(after).toBe(before);
    // Corrected, it is stored and shown with its figures today.
    await page.getByLabel("Rated heat input", { exact: true }).fill("2500");
    await page.getByLabel("Flue-gas O2, vol % dry").fill("3");
    await page.getByRole("button", { name: "Create plant" }).click();
    await page.waitForURL(/\/plants\/\d+$/);
    await page.getByRole("heading", { name: /Today on Pipeline natural gas/ }).waitFor();
    expect(await page.getByText("Efficiency, net (LHV)").isVisible()).toBe(true);
  });

  it("every decision page works at a desktop and a narrow width without sideways scrolling", async () => {
    const dir = process.env.STOKE_SCREENSHOT_DIR;
    if (dir) fs.mkdirSync(dir, { recursive: true });
    const pages = [
      "/plants",
      `/plants/${plantId}`,
      `/plants/${plantId}/edit`,
      "/plants/new",
      "/studies",
      "/studies/new",
      `/studies/${studyId}`,
      `/studies/${studyId}/sweep`,
      `/studies/${studyId}/phi`,
      `/studies/${studyId}/sensitivity`,
      `/studies/${studyId}/report`,
      `/studies/${studyId}/edit`,
    ];
    const problems: string[] = [];
    page.on("pageerror", (e) => problems.push(`${page.url()}: ${e.message}`));
    for (const width of [1360, 390]) {
      await page.setViewportSize({ width, height: 900 });
      for (const p of pages) {
        const res = await page.goto(`${base}${p}`, { waitUntil: "networkidle" });
        expect(res?.status(), p).toBe(200);
        await page.locator("h1").first().waitFor();
        const over = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
        if (over > 1) problems.push(`${p} at ${width} px: page scrolls sideways by ${over} px`);
        if (dir) await page.screenshot({ path: path.join(dir, `${p.replace(/[^a-z0-9]+/gi, "_")}_${width}.png`), fullPage: true });
      }
    }
    await page.setViewportSize({ width: 1360, height: 900 });
    expect(problems).toEqual([]);
  });
});
