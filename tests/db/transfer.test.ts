/** Import/export of the fuel library: exact round trips in JSON and CSV; all-or-nothing imports. */
import { afterAll, describe, expect, it } from "vitest";
import { tempDb, type TempDb } from "./temp-db";
import { seedIfEmpty } from "../../seed/index";
import { exportLibraryText, importLibrary, parseLibrary, libraryFromCsv, libraryToCsv, exportLibrary } from "../../lib/db/transfer";
import { parseCsv, toCsv } from "../../lib/db/csv";

const dbs: TempDb[] = [];
function fresh(): TempDb {
  const t = tempDb();
  dbs.push(t);
  return t;
}
afterAll(async () => {
  for (const t of dbs) await t.cleanup();
});

describe("CSV reader and writer", () => {
  it("round-trips awkward cells", () => {
    const rows = [["a", "b,c", 'say "hi"', "line\nbreak", "", " padded "], ["1", "2", "3", "4", "5", "6"]];
    expect(parseCsv(toCsv(rows))).toEqual(rows);
    expect(parseCsv("\ufeffx,y\na,b\n")).toEqual([["x", "y"], ["a", "b"]]);
    expect(() => parseCsv('a,"b\n')).toThrow(/not closed/);
  });
});

describe("library export and import", () => {
  it("JSON: export → import into an empty library → export gives the same text", async () => {
    const a = fresh();
    await seedIfEmpty(a.client);
    // An extra fuel with awkward text and numbers that need all their digits.
    const { createFuel, addPriceQuote } = await import("../../lib/db/fuels");
    const extra = await createFuel(a.client, {
      name: 'Odd, "quoted" gas',
      definition: { composition: { CH4: 0.1 + 0.2, N2: 0.7 } },
      notes: "line one\nline two, with comma",
    });
    expect(extra.ok).toBe(true);
    if (extra.ok) await addPriceQuote(a.client, extra.value.id, { amount: 1 / 3, currency: "USD", unit: "MMBtu", energyBasis: "net", validFrom: "2023-12-31" });
    const first = await exportLibraryText(a.client, "json");

    const b = fresh();
    const parsed = parseLibrary(first, "json");
    expect(parsed.ok).toBe(true);
    if (!parsed.ok) return;
    const r = await importLibrary(b.client, parsed.value);
    expect(r.ok).toBe(true);
    const second = await exportLibraryText(b.client, "json");
    expect(second).toBe(first);
    const doc = JSON.parse(first);
    expect(doc.fuels.find((f: { name: string }) => f.name === 'Odd, "quoted" gas').definition.composition.CH4).toBe(0.1 + 0.2);
  });

  it("CSV: export → import into an empty library → export gives the same text", async () => {
    const a = fresh();
    await seedIfEmpty(a.client);
    const first = await exportLibraryText(a.client, "csv");
    const b = fresh();
    const parsed = parseLibrary(first, "csv");
    expect(parsed.ok).toBe(true);
    if (!parsed.ok) return;
    const r = await importLibrary(b.client, parsed.value);
    expect(r.ok && r.value.fuelsCreated).toBeGreaterThanOrEqual(15);
    expect(await exportLibraryText(b.client, "csv")).toBe(first);
    // CSV and JSON carry the same library.
    expect(libraryFromCsv(first)).toEqual(await exportLibrary(a.client));
    expect(libraryToCsv(libraryFromCsv(first))).toBe(first);
  });

  it("an error anywhere stores nothing and names the record and field", async () => {
    const a = fresh();
    await seedIfEmpty(a.client);
    const doc = await exportLibrary(a.client);
    const b = fresh();
    const broken = structuredClone(doc);
    const i = broken.fuels.findIndex((f) => f.name === "Biomethane");
    broken.fuels[i].definition = { composition: { CH4: 0.97, CO2: 0.25 } };
    const r = await importLibrary(b.client, broken);
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.status).toBe(400);
      expect(r.fieldErrors[`fuels.${i}.definition.composition`]).toMatch(/sum to 1/);
      expect(r.message).toMatch(/nothing was stored/);
    }
    expect(await b.client.fuel.count()).toBe(0);
    expect(await b.client.priceQuote.count()).toBe(0);

    const badPrice = structuredClone(doc);
    const j = badPrice.fuels.findIndex((f) => f.prices.length > 0);
    badPrice.fuels[j].prices[0].unit = "bushel";
    const r2 = await importLibrary(b.client, badPrice);
    expect(r2.ok).toBe(false);
    if (!r2.ok) expect(Object.keys(r2.fieldErrors)[0]).toBe(`fuels.${j}.prices.0.unit`);
    expect(await b.client.fuel.count()).toBe(0);
  });

  it("existing names: refused by default, skipped on request", async () => {
    const a = fresh();
    await seedIfEmpty(a.client);
    const doc = await exportLibrary(a.client);
    const again = await importLibrary(a.client, doc);
    expect(again.ok).toBe(false);
    if (!again.ok) expect(again.status).toBe(409);
    const skip = await importLibrary(a.client, doc, { onExisting: "skip" });
    expect(skip.ok && skip.value.fuelsCreated).toBe(0);
    expect(skip.ok && skip.value.skipped.length).toBe(doc.fuels.length);
  });

  it("malformed files give a located message", () => {
    const notJson = parseLibrary("{", "json");
    expect(notJson.ok).toBe(false);
    const wrong = parseLibrary('{"format":"other"}', "json");
    expect(!wrong.ok && wrong.fieldErrors.format).toMatch(/stoke-fuel-library/);
    const csv = parseLibrary("record,fuel\nfuel,x\n", "csv");
    expect(!csv.ok && csv.fieldErrors.header).toMatch(/missing column/);
  });
});
