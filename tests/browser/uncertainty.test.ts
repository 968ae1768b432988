/**
 * The uncertainty ranking in a real browser: a run goes off the request path with a progress bar
 * while the page stays usable, ends stored, is shown again without recomputing, turns stale when the
 * study changes, and is printed in the report of the revision issued on its inputs.
 */
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Page } from "playwright-core";
import { openBrowser } from "./browser";

const base = inject("baseURL");
let page: Page;
let close: () => Promise<void>;
let studyId = 0;
let record: Record<string, unknown> = {};

const api = async (path: string, init?: RequestInit) => {
  const r = await fetch(`${base}${path}`, { ...init, headers: { "content-type": "application/json" } });
  return { status: r.status, body: await r.json() };
};

beforeAll(async () => {
  ({ page, close } = await openBrowser());
  const fuels = (await api("/api/fuels")).body as { fuels: { id: number; name: string }[] };
  const fuel = (name: string) => fuels.fuels.find((f) => f.name === name)!.id;
  const plants = (await api("/api/plants")).body as { plants: { id: number; name: string }[] };
  const plantId = plants.plants.find((p) => p.name === "Boiler 1 (gas)")!.id; // invented demo plant (seed/demo.ts)
  record = {
    plantId,
    name: "Browser uncertainty study",
    currency: "EUR",
    carbonPrice_per_t: 80,
    discountRatePercent: 8,
    horizonYears: 15,
    baseline: { name: "Gas today", fuelId: fuel("Pipeline natural gas") },
    scenarios: [
      { name: "Biomethane", fuelId: fuel("Biomethane") },
      { name: "Economiser", fuelId: fuel("Pipeline natural gas"), capex: 90000, overrides: { stackTemperatureC: 120 } },
    ],
  };
  const made = await api("/api/studies", { method: "POST", body: JSON.stringify(record) });
  expect(made.status).toBe(201);
  studyId = made.body.id;
});
afterAll(async () => {
  await close?.();
});

describe("uncertainty runs in the browser", () => {
  it("shows progress while a run goes on, stores it, and shows the stored run again (stale after a change)", async () => {
    await page.goto(`${base}/studies/${studyId}/uncertainty`);
    await page.getByTestId("no-run").waitFor();
    await page.fill("#u-draws", "50000");
    await page.fill("#u-seed", "11");
    await page.getByRole("button", { name: "Run and store" }).click();
    // The progress bar moves while the page stays usable (a field can be edited meanwhile).
    const progress = page.getByTestId("run-progress");
    await progress.waitFor();
    await page.waitForFunction(() => {
      const p = document.querySelector("[data-testid=run-progress] progress") as HTMLProgressElement | null;
      return p !== null && p.value > 0 && p.value < p.max;
    });
    await page.fill("#u-rho", "0.5");
    expect(await page.inputValue("#u-rho")).toBe("0.5");
    await page.waitForURL(/run=\d+/, { timeout: 120_000 });
    const stored = page.getByTestId("stored-run");
    await stored.waitFor();
    const text = (await stored.textContent()) ?? "";
    expect(text).toContain("50,000 draws, seed 11");
    expect(text).toContain("still the ones it evaluated");
    const runId = Number(/run=(\d+)/.exec(page.url())![1]);
    const list = await api(`/api/studies/${studyId}/uncertainty/runs`);
    expect(list.body.runs.map((r: { id: number }) => r.id)).toContain(runId);

    // A change of the study's inputs makes the stored run stale; it is shown, labelled, not recomputed.
    const changed = await api(`/api/studies/${studyId}`, {
      method: "PUT",
      body: JSON.stringify({ ...record, discountRatePercent: 6 }),
    });
    expect(changed.status).toBe(200);
    await page.goto(`${base}/studies/${studyId}/uncertainty?run=${runId}`);
    await page.getByTestId("stale-run").waitFor();
    expect((await page.getByTestId("stored-run").textContent()) ?? "").toContain("50,000 draws, seed 11");
  });

  it("the report of a revision prints the run made on its inputs, with the paths", async () => {
    const started = await fetch(`${base}/api/studies/${studyId}/uncertainty/runs?draws=2000&seed=5`, { method: "POST" });
    expect(started.status).toBe(202);
    const job = (await started.json()).job as { id: string };
    let runId: number | null = null;
    for (let i = 0; i < 600 && runId === null; i++) {
      const j = (await api(`/api/studies/${studyId}/uncertainty/jobs/${job.id}`)).body.job;
      if (j.state === "done") runId = j.runId;
      else if (j.state !== "running") throw new Error(JSON.stringify(j));
      else await new Promise((r) => setTimeout(r, 100));
    }
    const rev = await api(`/api/studies/${studyId}/revisions`, { method: "POST" });
    expect(rev.status).toBe(201);
    await page.goto(`${base}/studies/${studyId}/report?revision=${rev.body.revision}`);
    const section = page.getByTestId("report-uncertainty");
    await section.waitFor();
    const text = (await section.textContent()) ?? "";
    expect(text).toContain(`Stored run #${runId}`);
    expect(text).toContain("2,000 draws, seed 5");
    expect(text).toContain(`revision ${rev.body.revision}`);
    expect(text).toContain("P(first)");
    expect((await page.getByTestId("report-paths").textContent()) ?? "").toContain("carbon price");
  });
});
