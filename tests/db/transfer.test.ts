/** Import/export of the fuel library: exact round trips in JSON and CSV; all-or-nothing imports. */
import { afterAll, describe, expect, it } from "vitest";
import { tempDb, type TempDb } from "./temp-db";
import { seedIfEmpty } from "../../seed/index";
import { exportLibraryText, importLibrary, parseLibrary, libraryFromCsv, libraryToCsv, exportLibrary } from "../../lib/services/transfer";
import { readCsv, writeCsv } from "../../lib/formats/csv";
import { InputError } from "../../lib/errors";

const dbs: TempDb[] = [];
async function fresh(): Promise<TempDb> {
  const t = await tempDb();
  dbs.push(t);
  return t;
}
afterAll(async () => {
  for (const t of dbs) await t.cleanup();
});

describe("CSV reader and writer", () => {
  it("writes RFC 4180 records: CRLF after each, quotes around a comma, quote or line break, quotes doubled", () => {
    // RFC 4180 (2005), section 2, rules 1, 6 and 7.
    expect(
      writeCsv([
        ["a", "b,c"],
        ['say "hi"', "two\nlines"],
      ]),
    ).toBe('a,"b,c"\r\n"say ""hi""","two\nlines"\r\n');
  });

  it("reads back what it writes, and reads LF line ends, a byte-order mark and blank lines", () => {
    const rows = [
      ["a", "b,c", 'say "hi"', "line\nbreak", "", " padded "],
      ["1", "2", "3", "4", "5", "6"],
    ];
    expect(readCsv(writeCsv(rows))).toEqual(rows);
    expect(readCsv("\ufeffx,y\n\na,b\n")).toEqual([
      ["x", "y"],
      ["a", "b"],
    ]);
  });

  it("puts an apostrophe before cells a spreadsheet would run as formulas, not before plain numbers, and reads them back unchanged", () => {
    // OWASP, "CSV Injection": cells starting with =, +, -, @, tab or carriage return are read as formulas.
    const cells = ['=HYPERLINK("http://x")', "+1+2", "-2+3", "@SUM(A1)", "\tx", "-5", "+1.5e3", "'=already quoted", "plain"];
    expect(writeCsv([cells])).toBe(`"'=HYPERLINK(""http://x"")",'+1+2,'-2+3,'@SUM(A1),'\tx,-5,+1.5e3,''=already quoted,plain\r\n`);
    expect(readCsv(writeCsv([cells]))).toEqual([cells]);
  });

  it("names the line of malformed text", () => {
    let err: unknown;
    try {
      readCsv('a,b\nc,"d\n');
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(InputError);
    expect((err as InputError).field).toBe("line 2");
    expect((err as InputError).detail).toMatch(/quote not closed/i);
  });
});

describe("library export and import", () => {
  it("JSON: export → import into an empty library → export gives the same text", async () => {
    const a = await fresh();
    await seedIfEmpty(a.client);
    // An extra fuel with awkward text and numbers that need all their digits.
    const { createFuel, addPriceQuote } = await import("../../lib/services/fuels");
    const extra = await createFuel(a.client, {
      name: 'Odd, "quoted" gas',
      definition: { composition: { CH4: 0.1 + 0.2, N2: 0.7 } },
      notes: "line one\nline two, with comma",
    });
    expect(extra.ok).toBe(true);
    if (extra.ok)
      await addPriceQuote(a.client, extra.value.id, {
        amount: 1 / 3,
        currency: "USD",
        unit: "MMBtu",
        energyBasis: "net",
        validFrom: "2023-12-31",
      });
    const first = await exportLibraryText(a.client, "json");

    const b = await fresh();
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
    const a = await fresh();
    await seedIfEmpty(a.client);
    const first = await exportLibraryText(a.client, "csv");
    const b = await fresh();
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

  it("CSV: a fuel name a spreadsheet would run as a formula is exported with an apostrophe and imported as it was", async () => {
    const a = await fresh();
    const { createFuel } = await import("../../lib/services/fuels");
    const made = await createFuel(a.client, { name: "=1+1 gas", definition: { composition: { CH4: 1 } }, notes: "-test" });
    expect(made.ok).toBe(true);
    const text = await exportLibraryText(a.client, "csv");
    expect(text.split("\r\n")[1]).toMatch(/^fuel,'=1\+1 gas,gas,/);
    const b = await fresh();
    const parsed = parseLibrary(text, "csv");
    expect(parsed.ok && parsed.value.fuels[0].name).toBe("=1+1 gas");
    expect(parsed.ok && parsed.value.fuels[0].notes).toBe("-test");
    if (parsed.ok) expect((await importLibrary(b.client, parsed.value)).ok).toBe(true);
    expect(await exportLibraryText(b.client, "csv")).toBe(text);
  });

  it("an error anywhere stores nothing and names the record and field", async () => {
    const a = await fresh();
    await seedIfEmpty(a.client);
    const doc = await exportLibrary(a.client);
    const b = await fresh();
    const broken = structuredClone(doc);
    const i = broken.fuels.findIndex((f) => f.name === "Biomethane");
    broken.fuels[i].definition = { composition: { CH4: 0.97, CO2: 0.25 } };
    const r = await importLibrary(b.client, broken);
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.kind).toBe("invalid");
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
    const a = await fresh();
    await seedIfEmpty(a.client);
    const doc = await exportLibrary(a.client);
    const again = await importLibrary(a.client, doc);
    expect(again.ok).toBe(false);
    if (!again.ok) expect(again.kind).toBe("conflict");
    const skip = await importLibrary(a.client, doc, { onExisting: "skip" });
    expect(skip.ok && skip.value.fuelsCreated).toBe(0);
    expect(skip.ok && skip.value.skipped.length).toBe(doc.fuels.length);
  });

  it("a definition nested 1,000 levels deep is refused naming the place, from a file or a direct call", async () => {
    let definition: unknown = { composition: { CH4: 1 } };
    for (let i = 0; i < 1000; i++) definition = { blend: [{ fuel: definition, share: 1 }], basis: "mass" };
    const doc = { format: "stoke-fuel-library", version: 1, fuels: [{ name: "Deep", kind: "gas", definition }] };
    const parsed = parseLibrary(JSON.stringify(doc), "json");
    expect(parsed.ok).toBe(false);
    if (!parsed.ok) expect(parsed.fieldErrors["fuels.0.definition"]).toMatch(/nested more than 64 levels deep/);
    const a = await fresh();
    const { createFuel } = await import("../../lib/services/fuels");
    const direct = await createFuel(a.client, { name: "Deep", definition });
    expect(!direct.ok && direct.kind).toBe("invalid");
    expect(!direct.ok && direct.fieldErrors.definition).toMatch(/nested more than 64 levels deep/);
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
