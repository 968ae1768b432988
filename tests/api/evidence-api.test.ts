/**
 * Evidence through the JSON API (route handlers on a temp SQLite file seeded with the invented
 * demo): issued revisions that survive library changes, quote versions, withdrawal, currencies and
 * exchange rates, implausible prices, bulk quote import.
 */
import { createHash } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeSeededApi, jsonRequest, openSeededApi, type SeededApi } from "./seeded-api";
import { runEvaluate } from "../../lib/cli/evaluate-sync";

let api: SeededApi;
let routes: {
  studies: typeof import("../../app/api/studies/route");
  study: typeof import("../../app/api/studies/[id]/route");
  results: typeof import("../../app/api/studies/[id]/results/route");
  revisions: typeof import("../../app/api/studies/[id]/revisions/route");
  revision: typeof import("../../app/api/studies/[id]/revisions/[number]/route");
  fuel: typeof import("../../app/api/fuels/[id]/route");
  prices: typeof import("../../app/api/fuels/[id]/prices/route");
  price: typeof import("../../app/api/fuels/[id]/prices/[priceId]/route");
  withdraw: typeof import("../../app/api/fuels/[id]/prices/[priceId]/withdraw/route");
  rates: typeof import("../../app/api/exchange-rates/route");
  quoteImport: typeof import("../../app/api/fuels/quotes/import/route");
};
const fuel: Record<string, number> = {};
let plantId = 0;

beforeAll(async () => {
  api = await openSeededApi();
  Object.assign(fuel, api.fuel);
  plantId = api.plantId;
  routes = {
    studies: await import("../../app/api/studies/route"),
    study: await import("../../app/api/studies/[id]/route"),
    results: await import("../../app/api/studies/[id]/results/route"),
    revisions: await import("../../app/api/studies/[id]/revisions/route"),
    revision: await import("../../app/api/studies/[id]/revisions/[number]/route"),
    fuel: await import("../../app/api/fuels/[id]/route"),
    prices: await import("../../app/api/fuels/[id]/prices/route"),
    price: await import("../../app/api/fuels/[id]/prices/[priceId]/route"),
    withdraw: await import("../../app/api/fuels/[id]/prices/[priceId]/withdraw/route"),
    rates: await import("../../app/api/exchange-rates/route"),
    quoteImport: await import("../../app/api/fuels/quotes/import/route"),
  };
});
afterAll(async () => {
  await closeSeededApi(api);
});

const req = jsonRequest;
const ctx = (id: number | string) => ({ params: Promise.resolve({ id: String(id) }) });
const qctx = (id: number, priceId: number) => ({ params: Promise.resolve({ id: String(id), priceId: String(priceId) }) });
const rctx = (id: number, n: number | string) => ({ params: Promise.resolve({ id: String(id), number: String(n) }) });

async function quoteId(fuelName: string, amount: number): Promise<number> {
  return (await api.t.client.priceQuote.findFirstOrThrow({ where: { fuelId: fuel[fuelName], amount } })).id;
}
async function createStudy(body: unknown): Promise<number> {
  const res = await routes.studies.POST(req("/api/studies", "POST", body));
  const b = await res.json();
  expect(res.status, JSON.stringify(b)).toBe(201);
  return b.id;
}
async function results(id: number) {
  const res = await routes.results.GET(req(`/api/studies/${id}/results`), ctx(id));
  expect(res.status).toBe(200);
  return res.json();
}
const study = (name: string, currency: string, scenarios: unknown[], baseline: Record<string, unknown> = {}) => ({
  plantId,
  name,
  currency,
  carbonPrice_per_t: 80,
  discountRatePercent: 7,
  horizonYears: 10,
  baseline: { name: "Gas today", fuelId: fuel["Pipeline natural gas"], ...baseline },
  scenarios,
});

/** Canonical JSON written out here (sorted keys, no spaces), independently of the code under test. */
function canonical(v: unknown): string {
  if (Array.isArray(v)) return `[${v.map(canonical).join(",")}]`;
  if (v && typeof v === "object")
    return `{${Object.keys(v)
      .sort()
      .filter((k) => (v as Record<string, unknown>)[k] !== undefined)
      .map((k) => `${JSON.stringify(k)}:${canonical((v as Record<string, unknown>)[k])}`)
      .join(",")}}`;
  return JSON.stringify(v);
}

describe("a study whose currency has no quote or rate", () => {
  it("shows no cost, says why, and still shows CO2 t/yr (GBP study, only EUR quotes, no rates)", async () => {
    const gbp = await createStudy(study("GBP study", "GBP", [{ name: "Biomethane", fuelId: fuel.Biomethane }]));
    const eur = await createStudy(study("EUR twin", "EUR", [{ name: "Biomethane", fuelId: fuel.Biomethane }]));
    const g = await results(gbp);
    const e = await results(eur);
    const gb = g.result.baseline;
    const eb = e.result.baseline;
    expect(gb.costs).toBeNull();
    expect(g.priceSources.baseline.label).toMatch(/no usable quote in GBP/);
    expect(g.priceSources.baseline.label).toMatch(/no exchange rate from EUR to GBP/);
    // CO2 t/yr needs no price: equal to what the cost model of the priced twin computes for the same plant.
    expect(gb.annualCo2_t.fossil).toBeGreaterThan(0);
    expect(gb.annualCo2_t.fossil).toBeCloseTo(eb.costs.annualCo2Fossil_t, 6);
  });
});

describe("currencies", () => {
  it('refuses the currency "DOL" naming the field (quote, study, exchange rate)', async () => {
    const q = await routes.prices.POST(
      req("/x", "POST", { amount: 30, currency: "DOL", unit: "MWh", energyBasis: "gross", validFrom: "2025-01-01" }),
      ctx(fuel["Pipeline natural gas"]),
    );
    expect(q.status).toBe(400);
    expect((await q.json()).fieldErrors.currency).toMatch(/"DOL" is not an ISO 4217 currency code/);
    const s = await routes.studies.POST(req("/api/studies", "POST", study("DOL study", "DOL", [])));
    expect(s.status).toBe(400);
    expect((await s.json()).fieldErrors.currency).toMatch(/ISO 4217/);
    const r = await routes.rates.POST(
      req("/api/exchange-rates", "POST", { fromCurrency: "DOL", toCurrency: "EUR", rate: 0.9, validFrom: "2025-01-01" }),
    );
    expect(r.status).toBe(400);
    expect((await r.json()).fieldErrors.fromCurrency).toMatch(/ISO 4217/);
  });

  it("converts a quote at the rate in force on the quote's date and states the rate (direct and inverted)", async () => {
    const add = await routes.rates.POST(
      req(
        "/api/exchange-rates?format=csv",
        "POST",
        "fromCurrency,toCurrency,rate,validFrom,source\r\nGBP,EUR,1.17,2025-01-01,test rate A\r\nGBP,EUR,1.25,2025-09-01,test rate B\r\nEUR,USD,1.08,2025-01-01,test rate C\r\n",
        "text/csv",
      ),
    );
    expect(add.status).toBe(201);
    expect((await (await routes.rates.GET()).json()).rates).toHaveLength(3);
    const gbpQ = await routes.prices.POST(
      req("/x", "POST", {
        amount: 60,
        transportAdder: 5,
        currency: "GBP",
        unit: "MWh",
        energyBasis: "gross",
        validFrom: "2025-03-01",
        supplier: "UK supplier",
      }),
      ctx(fuel.Biomethane),
    );
    expect(gbpQ.status).toBe(201);
    const gbpId = (await gbpQ.json()).id;
    const usdQ = await routes.prices.POST(
      req("/x", "POST", { amount: 54, currency: "USD", unit: "MWh", energyBasis: "gross", validFrom: "2025-03-01" }),
      ctx(fuel["Landfill gas"]),
    );
    expect(usdQ.status).toBe(201);
    const usdId = (await usdQ.json()).id;
    const id = await createStudy(
      study("Converted quotes", "EUR", [
        { name: "Biomethane (GBP quote)", fuelId: fuel.Biomethane, priceQuoteId: gbpId },
        { name: "Landfill gas (USD quote)", fuelId: fuel["Landfill gas"], priceQuoteId: usdId },
      ]),
    );
    const r = await results(id);
    const [bio, lfg] = r.result.scenarios.filter((s: { isBaseline: boolean }) => !s.isBaseline);
    // Hand computation: 60 GBP × 1.17 EUR/GBP = 70.2 EUR; adder 5 × 1.17 = 5.85 EUR (the 1.25 rate starts after the quote's date).
    expect(bio.price.quote.amount).toBeCloseTo(70.2, 9);
    expect(bio.price.quote.transportAdder).toBeCloseTo(5.85, 9);
    expect(bio.price.quote.currency).toBe("EUR");
    expect(r.priceSources.scenarios[0].label).toMatch(/1 GBP = 1\.17 EUR from 2025-01-01 \(test rate A\)/);
    // Inverted: 54 USD / 1.08 USD per EUR = 50 EUR.
    expect(lfg.price.quote.amount).toBeCloseTo(50, 9);
    expect(r.priceSources.scenarios[1].label).toMatch(/1 EUR = 1\.08 USD from 2025-01-01 \(test rate C\), inverted/);
  });
});

describe("implausible prices", () => {
  it("warns about 1e9 EUR/MWh and stores it only when confirmed", async () => {
    const before = await api.t.client.priceQuote.count();
    const body = { amount: 1e9, currency: "EUR", unit: "MWh", energyBasis: "gross", validFrom: "2025-05-01" };
    const res = await routes.prices.POST(req("/x", "POST", body), ctx(fuel["Pipeline natural gas"]));
    expect(res.status).toBe(422);
    const b = await res.json();
    expect(b.warnings[0]).toMatch(/above the plausible range 0\.5–2000 EUR\/MWh/);
    expect(b.fieldErrors.amount).toMatch(/plausible range/);
    expect(await api.t.client.priceQuote.count()).toBe(before);
    const ok = await routes.prices.POST(req("/x", "POST", { ...body, confirmImplausible: true }), ctx(fuel["Pipeline natural gas"]));
    expect(ok.status).toBe(201);
    const o = await ok.json();
    expect(o.warnings).toHaveLength(1);
    // Withdraw it again so that it prices nothing in the tests below.
    expect((await routes.withdraw.POST(req("/x", "POST"), qctx(fuel["Pipeline natural gas"], o.id))).status).toBe(200);
  });
});

describe("issued revisions", () => {
  let id = 0;
  let ngQuote = 0;
  let bioQuote = 0;
  let issued: { revision: number; hash: string };
  it("issues revision 1 with a SHA-256 of the canonical inputs; lists and answers it", async () => {
    ngQuote = await quoteId("Pipeline natural gas", 38.5);
    bioQuote = await quoteId("Biomethane", 0.085);
    id = await createStudy(study("Evidence study", "EUR", [{ name: "Biomethane", fuelId: fuel.Biomethane }], { priceQuoteId: ngQuote }));
    const res = await routes.revisions.POST(req("/x", "POST"), ctx(id));
    expect(res.status).toBe(201);
    issued = await res.json();
    expect(issued.revision).toBe(1);
    expect(issued.hash).toMatch(/^[0-9a-f]{64}$/);
    const list = await (await routes.revisions.GET(req("/x"), ctx(id))).json();
    expect(list.revisions.map((r: { number: number }) => r.number)).toEqual([1]);
    const one = await (await routes.revision.GET(req("/x"), rctx(id, 1))).json();
    expect(one.hash).toBe(issued.hash);
    expect(createHash("sha256").update(canonical(one.inputs), "utf8").digest("hex")).toBe(issued.hash);
    expect(one.inputs.format).toBe("stoke-study");
    expect(one.inputs.baseline.price.amount).toBe(38.5); // the demo quote (seed/demo.ts)
    expect(one.results.scenarios.length).toBe(1);
  });

  it("keeps its figures byte for byte after the fuel changes and the quote is corrected; the live study moves", async () => {
    const { studyReportData, revisionStatus } = await import("../../lib/services/revisions");
    const { db } = await import("../../lib/db/client");
    const stored = await (await routes.revision.GET(req("/x"), rctx(id, 1))).json();
    const liveBefore = await results(id);
    // Change the fuel of the candidate …
    const put = await routes.fuel.PUT(
      req("/x", "PUT", {
        name: "Biomethane",
        definition: { composition: { CH4: 0.9, CO2: 0.08, N2: 0.02 } },
        biogenicCarbonShare: 1,
        upstreamCo2e_kg_per_GJ: 12,
      }),
      ctx(fuel.Biomethane),
    );
    expect(put.status).toBe(200);
    // … correct the baseline's quote (a new version) …
    const fix = await routes.price.PUT(
      req("/x", "PUT", { amount: 41, currency: "EUR", unit: "MWh", energyBasis: "gross", transportAdder: 6.2, validFrom: "2025-01-01" }),
      qctx(fuel["Pipeline natural gas"], ngQuote),
    );
    expect(fix.status).toBe(201);
    const fixed = await fix.json();
    expect(fixed.supersedes).toBe(ngQuote);
    // … and try to delete the quotes the revision used.
    const del = await routes.price.DELETE(req("/x", "DELETE"), qctx(fuel["Pipeline natural gas"], ngQuote));
    expect(del.status).toBe(409);
    expect((await del.json()).error).toMatch(/revision 1 of study "Evidence study"/);
    const del2 = await routes.price.DELETE(req("/x", "DELETE"), qctx(fuel.Biomethane, bioQuote));
    expect(del2.status).toBe(409);
    expect((await del2.json()).error).toMatch(/revision 1/);

    const report = await studyReportData(db(), id, { revision: 1 });
    if (!report.ok) throw new Error(report.message);
    const { jsonDifferences } = await import("../../lib/formats/canonical-json");
    expect(jsonDifferences(JSON.parse(JSON.stringify(report.result)), stored.results, 5)).toEqual([]);
    expect(JSON.stringify(JSON.parse(JSON.stringify(report.result)))).toBe(JSON.stringify(stored.results));
    expect(report.bundle.meta.revision).toMatchObject({ number: 1, hash: issued.hash });
    const again = await (await routes.revision.GET(req("/x"), rctx(id, 1))).json();
    expect(JSON.stringify(again)).toBe(JSON.stringify(stored));

    // The live study uses the corrected quote and the changed fuel, and says what differs.
    const liveAfter = await results(id);
    const base = (r: { result: { baseline: { price: { quote: { amount: number } } } } }) => r.result.baseline;
    expect(base(liveBefore).price.quote.amount).toBe(38.5);
    expect(base(liveAfter).price.quote.amount).toBe(41);
    expect(liveAfter.priceSources.baseline.label).toMatch(
      new RegExp(`quote #${ngQuote} was corrected: its newest version #${fixed.id} applies`),
    );
    const status = await revisionStatus(db(), id);
    expect(status.latest?.number).toBe(1);
    const paths = status.differences.map((d) => d.path);
    expect(paths).toContain("baseline.price.amount");
    expect(paths).toContain("scenarios.0.fuel.composition.CH4");
    expect(status.differences.find((d) => d.path === "baseline.price.amount")).toMatchObject({
      before: 38.5,
      after: 41,
      label: "baseline — price — amount",
    });
  });

  it("evaluates its exported inputs with the command line to the same figures", async () => {
    const rev = await (await routes.revision.GET(req("/x"), rctx(id, 1))).json();
    const out = runEvaluate(["--input", "-", "--no-flame-speed"], () => JSON.stringify(rev.inputs));
    expect(out.exitCode).toBe(0);
    const a = JSON.parse(out.stdout);
    const { jsonDifferences } = await import("../../lib/formats/canonical-json");
    expect(jsonDifferences(a, rev.results, 5)).toEqual([]);
    expect(JSON.stringify(a)).toBe(JSON.stringify(rev.results));
  });

  it("cannot be changed or deleted (405), nor can its study be deleted (409); the next issue is revision 2", async () => {
    for (const m of ["PUT", "PATCH", "DELETE"] as const) {
      const res = await routes.revision[m]();
      expect(res.status).toBe(405);
      expect((await res.json()).error).toMatch(/cannot be changed or deleted/);
    }
    const del = await routes.study.DELETE(req("/x", "DELETE"), ctx(id));
    expect(del.status).toBe(409);
    expect((await del.json()).error).toMatch(/issued revision/);
    const r2 = await (await routes.revisions.POST(req("/x", "POST"), ctx(id))).json();
    expect(r2.revision).toBe(2);
    expect(r2.hash).not.toBe(issued.hash);
    expect((await routes.revision.GET(req("/x"), rctx(id, 9))).status).toBe(404);
  });
});

describe("quote versions and withdrawal", () => {
  it("keeps the corrected quote on record, marked superseded", async () => {
    const list = await (await routes.prices.GET(req("/x"), ctx(fuel["Pipeline natural gas"]))).json();
    const old = list.prices.find((p: { amount: number }) => p.amount === 38.5);
    const neu = list.prices.find((p: { amount: number }) => p.amount === 41);
    expect(old.supersededBy).toBe(neu.id);
    expect(old.inForce).toBe(false);
    expect(neu.supersedesId).toBe(old.id);
    expect(neu.inForce).toBe(true);
    // A superseded quote cannot be corrected again.
    const again = await routes.price.PUT(
      req("/x", "PUT", { amount: 40, currency: "EUR", unit: "MWh", energyBasis: "gross", validFrom: "2025-01-01" }),
      qctx(fuel["Pipeline natural gas"], old.id),
    );
    expect(again.status).toBe(409);
  });

  it("withdraws a quote chosen only by a live study; the study then says which quote it uses", async () => {
    const add = await routes.prices.POST(
      req("/x", "POST", { amount: 0.09, currency: "EUR", unit: "kWh", energyBasis: "gross", validFrom: "2025-06-01" }),
      ctx(fuel.Biomethane),
    );
    const q = (await add.json()).id;
    const id = await createStudy(study("Withdrawal study", "EUR", [{ name: "Biomethane", fuelId: fuel.Biomethane, priceQuoteId: q }]));
    const del = await routes.price.DELETE(req("/x", "DELETE"), qctx(fuel.Biomethane, q));
    expect(del.status).toBe(409);
    expect((await del.json()).error).toMatch(/Withdrawal study.*Withdraw it instead/);
    const w = await routes.withdraw.POST(req("/x", "POST"), qctx(fuel.Biomethane, q));
    expect(w.status).toBe(200);
    expect((await w.json()).affectedStudies).toEqual([{ id, name: "Withdrawal study", scenario: "Biomethane" }]);
    const r = await results(id);
    const label: string = r.priceSources.scenarios[0].label;
    expect(label).toMatch(new RegExp(`the chosen quote #${q} was withdrawn`));
    expect(label).toMatch(/rule: latest quote in EUR valid on the day of evaluation/);
    expect(r.priceSources.scenarios[0].quoteId).not.toBe(q);
  });

  it("deletes a quote nothing relies on", async () => {
    const add = await routes.prices.POST(
      req("/x", "POST", { amount: 5.5, currency: "EUR", unit: "GJ", energyBasis: "net", validFrom: "2020-01-01" }),
      ctx(fuel["Landfill gas"]),
    );
    const q = (await add.json()).id;
    expect((await routes.price.DELETE(req("/x", "DELETE"), qctx(fuel["Landfill gas"], q))).status).toBe(200);
  });
});

describe("bulk quote import", () => {
  const header = "Fuel,Amount,Currency,Unit,energyBasis,validFrom,Supplier\r\n";
  it("refuses the whole file with errors by row and column as written in the file", async () => {
    const before = await api.t.client.priceQuote.count();
    const csv = `${header}pipeline NATURAL gas,40.1,EUR,MWh,gross,2025-10-01,Supplier A\r\nBiomethane,abc,EUR,MWh,gross,2025-10-01,Supplier B\r\nNo such fuel,3,EUR,MWh,gross,2025-10-01,\r\n`;
    const res = await routes.quoteImport.POST(req("/api/fuels/quotes/import?format=csv", "POST", csv, "text/csv"));
    const b = await res.json();
    expect(res.status).toBe(400);
    expect(b.fieldErrors["row 3, Amount"]).toMatch(/number/);
    expect(b.fieldErrors["row 4, Fuel"]).toMatch(/no fuel named "No such fuel"/);
    expect(Object.keys(b.fieldErrors).some((k) => k.startsWith("row 2"))).toBe(false);
    expect(await api.t.client.priceQuote.count()).toBe(before);
  });

  it("previews what it will add, then adds it (fuel names case-insensitive); JSON as well", async () => {
    const before = await api.t.client.priceQuote.count();
    const csv = `${header}pipeline NATURAL gas,40.1,EUR,MWh,gross,2025-10-01,Supplier A\r\nBIOMETHANE,0.08,EUR,kWh,gross,2025-10-01,Supplier B\r\n`;
    const pre = await routes.quoteImport.POST(req("/api/fuels/quotes/import?format=csv&preview=1", "POST", csv, "text/csv"));
    const p = await pre.json();
    expect(pre.status).toBe(200);
    expect(p.preview).toBe(true);
    expect(p.added.map((a: { where: string; fuelName: string }) => `${a.where}: ${a.fuelName}`)).toEqual([
      "row 2: Pipeline natural gas",
      "row 3: Biomethane",
    ]);
    expect(await api.t.client.priceQuote.count()).toBe(before);
    const real = await routes.quoteImport.POST(req("/api/fuels/quotes/import?format=csv", "POST", csv, "text/csv"));
    expect(real.status).toBe(201);
    expect(await api.t.client.priceQuote.count()).toBe(before + 2);
    const json = await routes.quoteImport.POST(
      req("/api/fuels/quotes/import?format=json", "POST", [
        { fuel: "Methanol", amount: 430, currency: "EUR", unit: "t", validFrom: "2025-10-01" },
        { fuel: "Methanol", amount: -1, currency: "EUR", unit: "t", validFrom: "2025-10-01" },
      ]),
    );
    expect(json.status).toBe(400);
    expect((await json.json()).fieldErrors["item 2, amount"]).toMatch(/≥ 0/);
    expect(await api.t.client.priceQuote.count()).toBe(before + 2);
  });
});

describe("the quote rule of a scenario", () => {
  it('prices by "latest quote in the study\'s currency valid on D" and says so', async () => {
    const id = await createStudy(study("Rule on a date", "EUR", [], { priceValidOn: "2024-12-31" }));
    const rec = await (await routes.study.GET(req("/x"), ctx(id))).json();
    expect(rec.baseline.priceValidOn).toBe("2024-12-31");
    const r = await results(id);
    // On 2024-12-31 only the demo quote of 2024-07-01 (13.2 EUR/MMBtu gross, seed/demo.ts) was valid.
    expect(r.result.baseline.price.quote).toMatchObject({ amount: 13.2, unit: "MMBtu", validFrom: "2024-07-01" });
    expect(r.priceSources.baseline.label).toMatch(/rule: latest quote in EUR valid on 2024-12-31/);
  });

  it("does not overwrite a stored exchange rate (409)", async () => {
    const res = await routes.rates.POST(
      req("/api/exchange-rates", "POST", { fromCurrency: "GBP", toCurrency: "EUR", rate: 2, validFrom: "2025-01-01" }),
    );
    expect(res.status).toBe(409);
    expect((await res.json()).fieldErrors.validFrom).toMatch(/already stored/);
  });
});

describe("the fuel sheet's quotes side by side", () => {
  it("normalises per MWh with and without the carbon cost at the chosen carbon price", async () => {
    const { quoteComparison } = await import("../../lib/services/fuel-views");
    const { db } = await import("../../lib/db/client");
    const c = await quoteComparison(db(), fuel["Pipeline natural gas"], { carbonPrice_per_t: 100 });
    expect(c).not.toBeNull();
    const a = c!.rows.find((r) => r.supplier === "Supplier A")!;
    expect(a.perMWh_gross).toBeCloseTo(40.1, 9);
    // Natural gas emits about 56.1 kg CO2/GJ net (IPCC 2006 Guidelines, Vol. 2, Table 1.4, default
    // 56 100 kg/TJ): at 100 EUR/t that is 56.1 × 3.6 × 0.1 ≈ 20.2 EUR per MWh net (±3 %, the demo gas differs).
    expect((a.withCarbon_net! - a.perMWh_net!) / 20.2).toBeGreaterThan(0.97);
    expect((a.withCarbon_net! - a.perMWh_net!) / 20.2).toBeLessThan(1.03);
    // Without a carbon price on the page: the latest study that uses the fuel supplies it (and says so).
    const d = await quoteComparison(db(), fuel["Pipeline natural gas"], {});
    expect(d!.carbonPrice_per_t).toBe(80);
    expect(d!.carbonPriceSource).toMatch(/^from study "/);
  });
});
