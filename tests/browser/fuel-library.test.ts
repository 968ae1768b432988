/**
 * The fuel library in a real browser: list, sheet, creating a gas and seeing its properties,
 * and a field error for a composition that sums to 1.2 with nothing stored.
 */
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Page } from "playwright-core";
import { openBrowser } from "./browser";

const base = inject("baseURL");
let page: Page;
let close: () => Promise<void>;

beforeAll(async () => {
  ({ page, close } = await openBrowser());
});
afterAll(async () => {
  await close?.();
});

async function fuelNames(): Promise<string[]> {
  const res = await fetch(`${base}/api/fuels`);
  const body = (await res.json()) as { fuels: { name: string }[] };
  return body.fuels.map((f) => f.name);
}

describe("fuel library in the browser", () => {
  it("answers with security headers and the pages run under them", async () => {
    const res = await fetch(`${base}/fuels`);
    expect(res.headers.get("content-security-policy")).toMatch(/frame-ancestors 'none'/);
    expect(res.headers.get("x-content-type-options")).toBe("nosniff");
    expect(res.headers.get("referrer-policy")).toBe("same-origin");
    const violations: string[] = [];
    page.on("console", (m) => {
      if (/Content Security Policy/i.test(m.text())) violations.push(m.text());
    });
    await page.goto(`${base}/studies`);
    await page.goto(`${base}/fuels`);
    await page.getByRole("heading", { level: 1 }).first().waitFor();
    expect(violations).toEqual([]);
  });

  it("lists the seeded fuels with their basis, invented prices marked, and filters by kind", async () => {
    await page.goto(`${base}/fuels`);
    await expect(page.getByRole("heading", { level: 1, name: "Fuel library" }).isVisible()).resolves.toBe(true);
    const table = page.locator("table.library");
    await table.getByRole("link", { name: "Pipeline natural gas" }).waitFor();
    expect(await table.getByRole("link").count()).toBeGreaterThanOrEqual(15);
    expect(await page.getByText("per MWh", { exact: false }).first().isVisible()).toBe(true);
    expect(await page.locator(".badge.invented").count()).toBeGreaterThan(5);
    await page.getByRole("link", { name: "Liquids" }).click();
    await page.waitForURL(/kind=liquid/);
    await table.getByRole("link", { name: "Gas oil" }).waitFor();
    expect(await table.getByRole("link", { name: "Hydrogen" }).count()).toBe(0);
  });

  it("opens a fuel sheet with properties, three flame-temperature methods, prices and cautions", async () => {
    await page.goto(`${base}/fuels`);
    await page.locator("table.library").getByRole("link", { name: "Natural gas + 20 % H2" }).click();
    await page.getByRole("heading", { level: 1, name: /Natural gas \+ 20 % H2/ }).waitFor();
    await page.getByRole("heading", { name: "Heating values" }).waitFor();
    expect(await page.getByText("Wobbe index, gross").isVisible()).toBe(true);
    const flame = page.locator("h2:has-text('Adiabatic flame temperature') + p + .table-wrap");
    for (const m of ["mean-cp", "complete", "equilibrium"]) {
      expect(await flame.getByText(m, { exact: true }).count()).toBe(2);
    }
    expect(await page.getByRole("heading", { name: "Hydrogen", level: 3 }).isVisible()).toBe(true);
    expect(await page.locator("#prices ~ .table-wrap .badge.invented").count()).toBeGreaterThan(0);
  });

  it("opens the fuel's φ sweep from its sheet and sees the equilibrium peak on the rich side", async () => {
    await page.goto(`${base}/fuels`);
    await page.locator("table.library").getByRole("link", { name: "Pipeline natural gas" }).click();
    await page.getByRole("link", { name: /Flame temperature against φ/ }).click();
    await page.waitForURL(/\/phi$/);
    const peaks = await page.getByTestId("fuel-phi-peaks").textContent();
    // Equilibrium peak of natural gas in air lies slightly rich, φ ≈ 1.03–1.05 (Turns, ch. 2; common practice).
    const phi = Number(/Equilibrium peak: .*? at φ = ([0-9.]+)/.exec(peaks ?? "")?.[1]);
    expect(phi).toBeGreaterThan(1.0);
    expect(phi).toBeLessThan(1.1);
    expect(await page.locator("figure.chart svg").count()).toBeGreaterThan(0);
  });

  it("creates a gas fuel and shows its computed properties", async () => {
    await page.goto(`${base}/fuels/new`);
    await page.getByLabel("Name").fill("Browser test gas 85/15");
    await page.getByLabel("Component 1").selectOption("CH4");
    await page.getByLabel("Mole fraction 1").fill("0.85");
    await page.getByLabel("Component 2").selectOption("N2");
    await page.getByLabel("Mole fraction 2").fill("0.15");
    await page.getByRole("button", { name: "Save fuel" }).click();
    await page.waitForURL(/\/fuels\/\d+$/);
    await page.getByRole("heading", { level: 1, name: /Browser test gas 85\/15/ }).waitFor();
    const hhvRow = page.locator("tr", { has: page.getByRole("rowheader", { name: "Gross (HHV)" }) });
    const hhvPerKg = Number(((await hhvRow.locator("td").first().textContent()) ?? "").replace(/,/g, ""));
    // ISO 6976:2016 (Table 3, confirmed), 25 °C: methane GCV 890.58
    // kJ/mol, M(CH4) 16.04246, M(N2) 28.0134 g/mol → 0.85·890.58 / (0.85·16.04246 + 0.15·28.0134) = 42.44 MJ/kg.
    expect(hhvPerKg).toBeCloseTo((0.85 * 890.58) / (0.85 * 16.04246 + 0.15 * 28.0134), 1);
    expect(await page.getByText("Wobbe index, gross").isVisible()).toBe(true);

    // A price quote in MWh needs a basis: field error first, then stored and normalised.
    // A fuel without quotes shows the quote form straight away.
    expect(await page.getByRole("button", { name: "Add a price quote" }).count()).toBe(0);
    await page.getByLabel("Price", { exact: true }).fill("40");
    await page.getByLabel("Energy basis").selectOption("");
    await page.getByRole("button", { name: "Add quote" }).click();
    await page.locator("#err-energyBasis").waitFor();
    expect(await page.locator("#err-energyBasis").textContent()).toMatch(/gross \(HHV\) or net \(LHV\)/);
    await page.getByLabel("Energy basis").selectOption("gross");
    await page.getByRole("button", { name: "Add quote" }).click();
    await page.getByText("Quote added.").waitFor();
    await page.locator("#prices ~ .table-wrap").getByText("40.00 EUR", { exact: true }).waitFor();
  });

  it("shows a field error for mole fractions summing to 1.2 and stores nothing", async () => {
    const before = await fuelNames();
    await page.goto(`${base}/fuels/new`);
    await page.getByLabel("Name").fill("Browser bad gas");
    await page.getByLabel("Component 1").selectOption("CH4");
    await page.getByLabel("Mole fraction 1").fill("0.9");
    await page.getByLabel("Component 2").selectOption("N2");
    await page.getByLabel("Mole fraction 2").fill("0.3");
    expect(await page.getByText("Sum of mole fractions: 1.2000 — must be 1").isVisible()).toBe(true);
    await page.getByRole("button", { name: "Save fuel" }).click();
    const err = page.locator('[id="err-definition.composition"]');
    await err.waitFor();
    expect(await err.textContent()).toMatch(/must sum to 1.*1\.2000/);
    expect(await page.getByRole("alert").first().textContent()).toMatch(/nothing was saved/i);
    expect(page.url()).toBe(`${base}/fuels/new`);
    const after = await fuelNames();
    expect(after).toEqual(before);
    expect(after).not.toContain("Browser bad gas");
  });

  it("imports a file of price quotes for library fuels after a preview, all or nothing", async () => {
    const quotes = async () => ((await (await fetch(`${base}/api/fuels`)).json()) as { fuels: unknown[] }).fuels.length;
    const priceCount = async (name: string) => {
      const fuels = (await (await fetch(`${base}/api/fuels`)).json()) as { fuels: { id: number; name: string }[] };
      const id = fuels.fuels.find((f) => f.name === name)!.id;
      return ((await (await fetch(`${base}/api/fuels/${id}/prices`)).json()) as { prices: unknown[] }).prices.length;
    };
    const before = await priceCount("Biomethane");
    const fuelsBefore = await quotes();
    await page.goto(`${base}/fuels/transfer`);
    // Invented demo prices.
    const good = "fuel,amount,currency,unit,energyBasis,validFrom,supplier\r\nbiomethane,92,EUR,MWh,gross,2026-06-01,Invented Gas Co\r\n";
    await page.setInputFiles("#f-quote-file", { name: "quotes.csv", mimeType: "text/csv", buffer: Buffer.from(good) });
    await page.getByRole("button", { name: "Preview" }).click();
    await page.getByTestId("quote-preview").waitFor();
    expect(await page.getByTestId("quote-preview").textContent()).toMatch(/Biomethane/);
    expect(await priceCount("Biomethane")).toBe(before); // a preview stores nothing
    await page.getByRole("button", { name: /^Import 1 quotes/ }).click();
    await page.getByRole("status").filter({ hasText: "Imported 1 price quotes" }).waitFor();
    expect(await priceCount("Biomethane")).toBe(before + 1);

    const bad = "fuel,amount,currency,unit,energyBasis\r\nBiomethane,90,EUR,MWh,gross\r\nNo such fuel,1,EUR,MWh,gross\r\n";
    await page.setInputFiles("#f-quote-file", { name: "bad.csv", mimeType: "text/csv", buffer: Buffer.from(bad) });
    await page.getByRole("button", { name: "Preview" }).click();
    const alert = page.locator(".form-errors");
    await alert.waitFor();
    expect(await alert.textContent()).toMatch(/row 3/);
    expect(await priceCount("Biomethane")).toBe(before + 1);
    expect(await quotes()).toBe(fuelsBefore);
  });

  it("adds a dated exchange rate through the form, and names the field of a currency that is not ISO 4217", async () => {
    await page.goto(`${base}/fuels/transfer`);
    await page.locator("#f-fromCurrency").fill("DOL");
    await page.locator("#f-rate").fill("0,92");
    await page.locator("#f-toCurrency").fill("EUR");
    await page.locator("#f-validFrom").fill("2026-01-01");
    await page.getByRole("button", { name: "Add rate" }).click();
    await page.locator("#err-fromCurrency").waitFor();
    expect(await page.locator("#err-fromCurrency").textContent()).toMatch(/ISO 4217|currency/i);
    await page.locator("#f-fromCurrency").fill("USD");
    await page.getByRole("button", { name: "Add rate" }).click();
    // Invented demo rate; "0,92" is read with the comma as the decimal separator.
    await page.getByTestId("exchange-rates").getByRole("cell", { name: "0.92", exact: true }).waitFor();
  });
});
