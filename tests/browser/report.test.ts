/**
 * A study as evidence, in a real browser on the seeded demo: the study form saves a duplicated demo
 * study unchanged (the API's JSON before and after is identical) and edits the report's cover; the
 * report of an 8-scenario study lays out its cover and tables without overlapping text, fits its
 * ranking at a glance on one A4 page and prints without half-empty pages; the hydrogen sweep and
 * comparison charts draw no label over another label or a tick.
 */
import zlib from "node:zlib";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Page } from "playwright-core";
import { openBrowser } from "./browser";

const base = inject("baseURL");
let page: Page;
let close: () => Promise<void>;
let demoStudyId = 0;
let plantId = 0;
let bigStudyId = 0;
const fuelId: Record<string, number> = {};

const api = async (path: string, init?: RequestInit) => {
  const r = await fetch(`${base}${path}`, { ...init, headers: { "content-type": "application/json" } });
  return { status: r.status, body: await r.json() };
};
const stored = async (id: number) => (await api(`/api/studies/${id}`)).body as Record<string, unknown>;

beforeAll(async () => {
  ({ page, close } = await openBrowser());
  await page.emulateMedia({ reducedMotion: "reduce" });
  const studies = (await api("/api/studies")).body as { studies: { id: number; name: string; plantId: number }[] };
  const demo = studies.studies.find((s) => s.name === "Hydrogen blending and biomethane")!;
  demoStudyId = demo.id;
  plantId = demo.plantId;
  const fuels = (await api("/api/fuels")).body as { fuels: { id: number; name: string }[] };
  for (const f of fuels.fuels) fuelId[f.name] = f.id;
});
afterAll(async () => {
  await close?.();
});

/** Pairs of boxes (CSS px) that overlap by more than `tol` in both directions. */
type Box = { label: string; x: number; y: number; w: number; h: number };
function overlaps(boxes: Box[], tol = 0.5): string[] {
  const out: string[] = [];
  for (let i = 0; i < boxes.length; i++)
    for (let j = i + 1; j < boxes.length; j++) {
      const a = boxes[i];
      const b = boxes[j];
      const ox = Math.min(a.x + a.w, b.x + b.w) - Math.max(a.x, b.x);
      const oy = Math.min(a.y + a.h, b.y + b.h) - Math.max(a.y, b.y);
      if (ox > tol && oy > tol) out.push(`"${a.label}" over "${b.label}"`);
    }
  return out;
}

/** The boxes of the text inside each element matched by `selector` (one box per element, the union of its text lines). */
function textBoxes(p: Page, selector: string): Promise<Box[]> {
  return p.evaluate((sel) => {
    const boxes: { label: string; x: number; y: number; w: number; h: number }[] = [];
    for (const el of Array.from(document.querySelectorAll(sel))) {
      const range = document.createRange();
      range.selectNodeContents(el);
      const rects = Array.from(range.getClientRects()).filter((r) => r.width > 0 && r.height > 0);
      if (!rects.length) continue;
      const x = Math.min(...rects.map((r) => r.left));
      const y = Math.min(...rects.map((r) => r.top));
      const w = Math.max(...rects.map((r) => r.right)) - x;
      const h = Math.max(...rects.map((r) => r.bottom)) - y;
      boxes.push({ label: (el.textContent ?? "").trim().slice(0, 40), x, y, w, h });
    }
    return boxes;
  }, selector);
}

/** Text of cells that spills out of its own cell (into a neighbour). */
function spilledCells(p: Page, tableSelector: string): Promise<string[]> {
  return p.evaluate((sel) => {
    const out: string[] = [];
    for (const cell of Array.from(document.querySelectorAll(`${sel} th, ${sel} td`))) {
      const c = cell.getBoundingClientRect();
      const range = document.createRange();
      range.selectNodeContents(cell);
      for (const r of Array.from(range.getClientRects())) {
        if (r.width === 0) continue;
        if (r.left < c.left - 0.5 || r.right > c.right + 0.5) {
          out.push((cell.textContent ?? "").trim().slice(0, 40));
          break;
        }
      }
    }
    return out;
  }, tableSelector);
}

/**
 * Pages of a PDF as Chromium prints it, each with how far down its printable area text reaches (0 =
 * the top margin, 1 = the bottom margin). Reads the page tree and each page's Flate-compressed content
 * stream, follows the transformation matrix through q / Q / cm, and places every text line where its
 * text matrix (Tm, Td) puts it on the page; backgrounds and rules are not counted.
 */
function pdfPageFill(pdf: Buffer, marginPt: number): { pages: number; fill: number[] } {
  const text = pdf.toString("latin1");
  const objects = new Map<number, string>();
  for (const m of text.matchAll(/(\d+) 0 obj\s*([\s\S]*?)endobj/g)) objects.set(Number(m[1]), m[2]);
  const isPage = (b: string | undefined): b is string => !!b && /\/Type\s*\/Page\b(?!s)/.test(b);
  const root = [...objects.values()].find((b) => /\/Type\s*\/Pages\b/.test(b) && /\/Kids/.test(b) && !/\/Parent/.test(b)) ?? "";
  const leaves = (node: string): string[] =>
    [...(/\/Kids\s*\[([^\]]*)\]/.exec(node)?.[1] ?? "").matchAll(/(\d+) 0 R/g)].flatMap((m) => {
      const kid = objects.get(Number(m[1])) ?? "";
      return isPage(kid) ? [kid] : leaves(kid);
    });
  const pages = leaves(root);
  type M = [number, number, number, number, number, number];
  const mul = (m: M, n: M): M => [
    m[0] * n[0] + m[1] * n[2],
    m[0] * n[1] + m[1] * n[3],
    m[2] * n[0] + m[3] * n[2],
    m[2] * n[1] + m[3] * n[3],
    m[4] * n[0] + m[5] * n[2] + n[4],
    m[4] * n[1] + m[5] * n[3] + n[5],
  ];
  const fill = pages.map((page) => {
    const box = /\/MediaBox\s*\[\s*([\d.]+)\s+([\d.]+)\s+([\d.]+)\s+([\d.]+)\s*\]/.exec(page)!;
    const height = Number(box[4]) - Number(box[2]);
    let lowest = 0;
    for (const ref of (/\/Contents\s*(\[[^\]]*\]|\d+ 0 R)/.exec(page)?.[1] ?? "").matchAll(/(\d+) 0 R/g)) {
      const body = objects.get(Number(ref[1])) ?? "";
      const raw = /stream\r?\n([\s\S]*?)\r?\nendstream/.exec(body);
      if (!raw) continue;
      const data = Buffer.from(raw[1], "latin1");
      const ops = (/FlateDecode/.test(body) ? zlib.inflateSync(data) : data).toString("latin1");
      let ctm: M = [1, 0, 0, 1, 0, 0];
      const stack: M[] = [];
      let tm: M = [1, 0, 0, 1, 0, 0];
      const nums: number[] = [];
      for (const tok of ops.matchAll(/<[0-9A-Fa-f]*>|\([^)]*\)|\[[^\]]*\]|\/\S+|-?\d*\.?\d+|[A-Za-z*']+/g)) {
        const t = tok[0];
        if (/^-?\d*\.?\d+$/.test(t)) {
          nums.push(Number(t));
          continue;
        }
        const a = nums.splice(0);
        if (t === "q") stack.push(ctm);
        else if (t === "Q") ctm = stack.pop() ?? ctm;
        else if (t === "cm" && a.length === 6) ctm = mul(a as M, ctm);
        else if (t === "BT") tm = [1, 0, 0, 1, 0, 0];
        else if (t === "Tm" && a.length === 6) tm = a as M;
        else if (t === "Td" && a.length === 2) tm = mul([1, 0, 0, 1, a[0], a[1]], tm);
        else if (t === "Tj" || t === "TJ") {
          const [, , , , x, y] = mul(tm, ctm);
          void x;
          const fromTop = height - y;
          if (fromTop >= 0 && fromTop <= height) lowest = Math.max(lowest, fromTop);
        }
      }
    }
    return Math.max(0, (lowest - marginPt) / (height - 2 * marginPt));
  });
  return { pages: pages.length, fill };
}

describe("study form round trip", () => {
  it("saves a duplicated demo study unchanged through the form: the stored study is identical", async () => {
    const dup = await api(`/api/studies/${demoStudyId}/duplicate`, { method: "POST", body: "{}" });
    expect(dup.status).toBe(201);
    const id = dup.body.id as number;
    const before = await stored(id);
    await page.goto(`${base}/studies/${id}/edit`);
    const card = page.getByTestId("scenario-card-2");
    expect(await card.getByLabel("Scenario name").inputValue()).toBe("30 % hydrogen, new burner");
    // The burner maker's limit of the new burner is shown (and kept) in its own field.
    expect(await card.getByLabel("Burner maker's largest hydrogen share, vol %").inputValue()).toBe("30");
    await page.getByRole("button", { name: "Save study" }).click();
    await page.waitForURL(new RegExp(`/studies/${id}$`));
    expect(await stored(id)).toEqual(before);
  });

  it("edits the report cover and a scenario's operating point in the form; the report shows the cover", async () => {
    const dup = await api(`/api/studies/${demoStudyId}/duplicate`, {
      method: "POST",
      body: JSON.stringify({ name: "Cover through the form" }),
    });
    const id = dup.body.id as number;
    await page.goto(`${base}/studies/${id}/edit`);
    await page.getByLabel("Report title").fill("Fuel options for Boiler 1");
    await page.getByLabel("Prepared for", { exact: true }).fill("Example Dairy Ltd");
    await page.getByLabel("Prepared by", { exact: true }).fill("A. Engineer, Example Consulting");
    await page.getByLabel("Report date").fill("2026-11-30");
    await page
      .getByLabel("Consultant's notes on the cover")
      .fill("Prices are indicative.\n\nA burner trial is recommended before any order.");
    const card = page.getByTestId("scenario-card-3");
    await card.locator("summary").click();
    await card.getByLabel("CO in the dry flue gas, ppm").fill("40");
    await card.getByLabel("Wobbe index tolerance, ± % of the baseline").locator("xpath=..").getByLabel("no limit in this scenario").check();
    await page.getByRole("button", { name: "Save study" }).click();
    await page.waitForURL(new RegExp(`/studies/${id}$`));
    const s = (await stored(id)) as {
      reportTitle: string;
      preparedFor: string;
      reportDate: string;
      scenarios: { overrides: Record<string, unknown> }[];
    };
    expect(s).toMatchObject({ reportTitle: "Fuel options for Boiler 1", preparedFor: "Example Dairy Ltd", reportDate: "2026-11-30" });
    expect(s.scenarios[3].overrides).toEqual({ flueCODryPpm: 40, wobbeTolerancePercent: null });
    await page.goto(`${base}/studies/${id}/report`);
    const cover = page.getByTestId("cover");
    expect(await cover.locator("h1").textContent()).toBe("Fuel options for Boiler 1");
    expect(await cover.textContent()).toContain("Example Dairy Ltd");
    expect(await page.getByTestId("cover-revision").textContent()).toBe("live inputs, not an issued revision");
    expect(await page.getByTestId("cover-notes").locator("p").count()).toBe(2);
  });
});

describe("report layout", () => {
  beforeAll(async () => {
    const sc = (name: string, fuel: string, capex = 0, overrides = {}) => ({
      name,
      fuelId: fuelId[fuel],
      capex,
      fixedOpexChange: 0,
      overrides,
    });
    const body = {
      plantId,
      name: "Eight options for Boiler 1",
      currency: "EUR",
      carbonPrice_per_t: 80,
      discountRatePercent: 8,
      horizonYears: 15,
      priceEscalationPercent: 2,
      rankingMetric: "cost-per-useful-MWh",
      reportTitle: "Fuel-switching options for Boiler 1 at the Example Dairy site",
      preparedFor: "Example Dairy Ltd, Engineering Department",
      preparedBy: "A. Engineer, Example Consulting",
      reportDate: "2026-11-30",
      reportNotes: "Prices are indicative offers of the demo library.\n\nA burner trial is recommended before any order.",
      baseline: sc("Natural gas (today)", "Pipeline natural gas"),
      scenarios: [
        sc("10 % hydrogen", "Natural gas + 10 % H2", 60000),
        sc("20 % hydrogen", "Natural gas + 20 % H2", 180000),
        sc("30 % hydrogen, new burner", "Natural gas + 30 % H2", 420000, { maxH2SharePercent: 30 }),
        sc("Biomethane", "Biomethane"),
        sc("Biogas 60/40, new burner", "Biogas 60/40", 250000, { wobbeTolerancePercent: 45 }),
        sc("Landfill gas", "Landfill gas", 300000),
        sc("LPG (propane)", "LPG (propane)", 90000),
      ],
    };
    const r = await api("/api/studies", { method: "POST", body: JSON.stringify(body) });
    expect(r.status, JSON.stringify(r.body)).toBe(201);
    bigStudyId = r.body.id;
  });

  it("on screen, the cover's text boxes and the table cells do not overlap", async () => {
    await page.setViewportSize({ width: 1360, height: 900 });
    await page.goto(`${base}/studies/${bigStudyId}/report`);
    await page.getByTestId("cover").waitFor();
    const cover = await textBoxes(
      page,
      "[data-testid=cover] .cover-kicker, [data-testid=cover] h1, [data-testid=cover] .cover-plant, [data-testid=cover] dt, [data-testid=cover] dd, [data-testid=cover] p",
    );
    expect(cover.length).toBeGreaterThanOrEqual(15);
    expect(overlaps(cover)).toEqual([]);
    for (const t of [
      "[data-testid=compact-ranking] table",
      ".report [data-testid=rank-table-economics]",
      ".report [data-testid=rank-table-technical]",
      ".report [data-testid=check-matrix]",
    ]) {
      expect(await spilledCells(page, t), t).toEqual([]);
      const cells = await textBoxes(page, `${t} th, ${t} td`);
      expect(cells.length, t).toBeGreaterThan(8);
      expect(overlaps(cells), t).toEqual([]);
    }
  });

  it("printed on A4 portrait: cover without overlaps, the ranking at a glance on one page, no page more than half empty but the last", async () => {
    // A4 portrait less the report's margins (16 mm top and bottom, 14 mm left and right): 182 × 265 mm at 96 px per inch.
    const mm = 96 / 25.4;
    await page.setViewportSize({ width: Math.floor(182 * mm), height: Math.floor(265 * mm) });
    await page.emulateMedia({ media: "print", reducedMotion: "reduce" });
    await page.goto(`${base}/studies/${bigStudyId}/report`);
    await page.getByTestId("cover").waitFor();
    const cover = await textBoxes(
      page,
      "[data-testid=cover] .cover-kicker, [data-testid=cover] h1, [data-testid=cover] .cover-plant, [data-testid=cover] dt, [data-testid=cover] dd, [data-testid=cover] p",
    );
    expect(overlaps(cover)).toEqual([]);
    // The title wraps by phrase, not word by word: at most two lines.
    const titleLines = await page
      .getByTestId("cover")
      .locator("h1")
      .evaluate((h) => {
        const r = document.createRange();
        r.selectNodeContents(h);
        return new Set(Array.from(r.getClientRects()).map((x) => Math.round(x.top))).size;
      });
    expect(titleLines).toBeLessThanOrEqual(2);
    expect(await spilledCells(page, "[data-testid=compact-ranking] table")).toEqual([]);
    expect(overlaps(await textBoxes(page, "[data-testid=compact-ranking] th, [data-testid=compact-ranking] td"))).toEqual([]);
    const compactHeight = await page.getByTestId("compact-ranking").evaluate((e) => e.getBoundingClientRect().height);
    expect(compactHeight).toBeLessThan(265 * mm);

    const pdf = await page.pdf({ preferCSSPageSize: true, printBackground: true });
    // The report's A4 margin: 16 mm top and bottom = 45.35 pt.
    const { pages, fill } = pdfPageFill(pdf, (16 * 72) / 25.4);
    // Cover and summary, the ranking, plant, assumptions, two ranking tables, three charts, a check
    // matrix of 8 scenarios (15 checks), the burner section (two tables), the sweep, methods, sources
    // and cautions: about fifteen full pages (common practice for a screening report of this size, no
    // source), not one half-empty page per section.
    expect(pages).toBeGreaterThanOrEqual(4);
    expect(pages).toBeLessThanOrEqual(15);
    const halfEmpty = fill
      .slice(0, -1)
      .map((f, i) => ({ page: i + 1, fill: Math.round(f * 100) }))
      .filter((x) => x.fill < 50);
    expect(halfEmpty).toEqual([]);
    await page.emulateMedia({ media: "screen", reducedMotion: "reduce" });
  });

  it("offers Letter and landscape and sets the printed page size", async () => {
    await page.emulateMedia({ media: "screen", reducedMotion: "reduce" });
    await page.setViewportSize({ width: 1360, height: 900 });
    await page.goto(`${base}/studies/${bigStudyId}/report?paper=letter&orient=landscape`);
    const css = await page.evaluate(
      () =>
        Array.from(document.querySelectorAll("style"))
          .map((e) => e.textContent ?? "")
          .find((t) => t.includes("@page")) ?? "",
    );
    expect(css).toContain("size: Letter landscape");
    expect(
      await page.getByRole("group", { name: "Orientation" }).getByRole("link", { name: "Landscape" }).getAttribute("aria-current"),
    ).toBe("true");
  });

  it("names no internal field and no stored metering key anywhere a reader sees", async () => {
    await page.goto(`${base}/studies/${bigStudyId}/report`);
    const text = (await page.getByTestId("report").textContent()) ?? "";
    for (const internal of [
      "maxH2SharePercent",
      "wobbeTolerancePercent",
      "stackTemperatureC",
      "15C",
      "0C",
      "fuelPricePercent",
      "common practice, no source",
      "value from memory",
    ]) {
      expect(text.includes(internal), internal).toBe(false);
    }
    // NPV and capex in the ranking at a glance are whole thousands, never cents.
    const money = await page
      .locator("[data-testid=compact-ranking] td:nth-child(8), [data-testid=compact-ranking] td:nth-child(9)")
      .allTextContents();
    expect(money.length).toBe(16);
    expect(money.filter((c) => !/^([−-]?\d{1,3}(,\d{3})*|—|–)$/.test(c.trim()))).toEqual([]);
    // One sign convention for the Wobbe band: "±5.0 %" for the baseline and every candidate, above or below it.
    const band = await page.locator(".report [data-testid=check-matrix] td[data-check=wobbe-band] .cl").allTextContents();
    expect(band.length).toBe(8);
    expect(band.filter((t) => !/^limit ±\d+\.\d %$/.test(t.trim()))).toEqual([]);
    const appendix = (await page.getByTestId("sources").textContent()) ?? "";
    expect(appendix).toMatch(/ISO 6976:2016\. Natural gas — Calculation of calorific values/);
    expect(appendix).toMatch(/NASA Reference Publication 1311/);
  });
});

describe("chart labels", () => {
  /** Every pair of SVG text boxes in each chart, and each text box against the tick marks. */
  async function chartCollisions(): Promise<string[]> {
    return page.evaluate(() => {
      const out: string[] = [];
      const hit = (a: DOMRect, b: DOMRect, tol: number) =>
        Math.min(a.right, b.right) - Math.max(a.left, b.left) > tol && Math.min(a.bottom, b.bottom) - Math.max(a.top, b.top) > tol;
      for (const svg of Array.from(document.querySelectorAll("svg.recharts-surface"))) {
        const texts = Array.from(svg.querySelectorAll("text")).filter((t) => (t.textContent ?? "").trim() !== "");
        const boxes = texts.map((t) => ({ t: (t.textContent ?? "").trim(), r: t.getBoundingClientRect() }));
        const ticks = Array.from(svg.querySelectorAll(".recharts-cartesian-axis-tick-line")).map((l) => l.getBoundingClientRect());
        for (let i = 0; i < boxes.length; i++) {
          for (let j = i + 1; j < boxes.length; j++) if (hit(boxes[i].r, boxes[j].r, 0.5)) out.push(`"${boxes[i].t}" over "${boxes[j].t}"`);
          for (const l of ticks) {
            const grown = new DOMRect(l.left - 0.01, l.top - 0.01, l.width + 0.02, l.height + 0.02);
            if (hit(boxes[i].r, grown, 0)) out.push(`"${boxes[i].t}" over a tick `);
          }
        }
      }
      return out;
    });
  }

  it("the hydrogen sweep's labels overlap neither each other nor the ticks", async () => {
    await page.setViewportSize({ width: 1360, height: 900 });
    await page.goto(`${base}/studies/${demoStudyId}/sweep`);
    await page.waitForFunction(() => document.querySelectorAll("svg.recharts-surface text").length > 20);
    expect(await chartCollisions()).toEqual([]);
  });

  it("the comparison charts' labels overlap neither each other nor the ticks", async () => {
    await page.goto(`${base}/studies/${bigStudyId}`);
    await page.waitForFunction(() => document.querySelectorAll("svg.recharts-surface").length >= 3);
    expect(await chartCollisions()).toEqual([]);
  });
});
