/**
 * The JSON API through its route handlers, on a temp SQLite file migrated like production.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { tempDb, type TempDb } from "../db/temp-db";

let t: TempDb;
let routes: {
  fuels: typeof import("../../app/api/fuels/route");
  fuel: typeof import("../../app/api/fuels/[id]/route");
  prices: typeof import("../../app/api/fuels/[id]/prices/route");
  price: typeof import("../../app/api/fuels/[id]/prices/[priceId]/route");
};

beforeAll(async () => {
  t = await tempDb();
  process.env.DATABASE_URL = t.url;
  routes = {
    fuels: await import("../../app/api/fuels/route"),
    fuel: await import("../../app/api/fuels/[id]/route"),
    prices: await import("../../app/api/fuels/[id]/prices/route"),
    price: await import("../../app/api/fuels/[id]/prices/[priceId]/route"),
  };
});
afterAll(async () => {
  const { db } = await import("../../lib/db/client");
  await db().$disconnect();
  await t.cleanup();
});

const base = "http://localhost/api/fuels";
const post = (url: string, body: unknown) =>
  new Request(url, { method: "POST", body: JSON.stringify(body), headers: { "content-type": "application/json" } });
const put = (url: string, body: unknown) =>
  new Request(url, { method: "PUT", body: JSON.stringify(body), headers: { "content-type": "application/json" } });
const ctx = (id: number | string) => ({ params: Promise.resolve({ id: String(id) }) });
const pctx = (id: number, priceId: number | string) => ({ params: Promise.resolve({ id: String(id), priceId: String(priceId) }) });

async function count(): Promise<number> {
  return t.client.fuel.count();
}

describe("POST /api/fuels and GET /api/fuels/{id}", () => {
  let methaneId = 0;

  it("creates a gas and answers its computed properties", async () => {
    const res = await routes.fuels.POST(post(base, { name: "Methane", definition: { composition: { CH4: 1 } }, source: "pure" }));
    expect(res.status).toBe(201);
    methaneId = (await res.json()).id;
    const got = await routes.fuel.GET(new Request(`${base}/${methaneId}`), ctx(methaneId));
    expect(got.status).toBe(200);
    const body = await got.json();
    expect(body.kind).toBe("gas");
    // ISO 6976:2016 (Table 3, confirmed): methane GCV 890.58 kJ/mol at
    // 25 °C, M 16.04246 g/mol → 55.514 MJ/kg.
    expect(body.properties.hhv.MJ_per_kg).toBeCloseTo(890.58 / 16.04246, 1);
    expect(body.properties.hhv.kJ_per_mol).toBeCloseTo(890.58, 0);
    expect(body.properties.wobbe.gross_MJ_per_m3).toBeGreaterThan(45);
    expect(body.flameTemperatures.map((f: { method: string }) => f.method)).toEqual(
      expect.arrayContaining(["mean-cp", "complete", "equilibrium"]),
    );
    expect(body.cautions.length).toBeGreaterThan(0);
  });

  it("400 with a field error for mole fractions summing to 1.2, and nothing stored", async () => {
    const before = await count();
    const res = await routes.fuels.POST(post(base, { name: "Too much", definition: { composition: { CH4: 0.9, N2: 0.3 } } }));
    expect(res.status).toBe(400);
    const body = await res.json();
    expect(body.fieldErrors["definition.composition"]).toMatch(/sum to 1.*1\.2000/);
    expect(await count()).toBe(before);
  });

  it("400 naming the field for unknown species, negative values and kind mismatches", async () => {
    const before = await count();
    const unknown = await (await routes.fuels.POST(post(base, { name: "X", definition: { composition: { CH4: 0.5, XY: 0.5 } } }))).json();
    expect(unknown.fieldErrors["definition.composition.XY"]).toMatch(/unknown species "XY"/);
    const neg = await routes.fuels.POST(
      post(base, { name: "Y", kind: "liquid", definition: { compound: "CH3OH", phase: "liquid" }, densityKgPerM3: -5 }),
    );
    expect(neg.status).toBe(400);
    expect((await neg.json()).fieldErrors.densityKgPerM3).toMatch(/> 0/);
    const kind = await (await routes.fuels.POST(post(base, { name: "Z", kind: "liquid", definition: { composition: { CH4: 1 } } }))).json();
    expect(kind.fieldErrors.kind).toMatch(/gas/);
    const empty = await (await routes.fuels.POST(post(base, { name: "", definition: { composition: { N2: 1 } } }))).json();
    expect(empty.fieldErrors.name).toBeDefined();
    const inert = await (await routes.fuels.POST(post(base, { name: "Nitrogen", definition: { composition: { N2: 1 } } }))).json();
    expect(inert.fieldErrors.definition).toMatch(/no heat/);
    const notJson = await routes.fuels.POST(
      new Request(base, { method: "POST", body: "{", headers: { "content-type": "application/json" } }),
    );
    expect(notJson.status).toBe(400);
    expect(await count()).toBe(before);
  });

  it("400 naming the field for a fuel with nothing to burn (pure O2, pure CO2)", async () => {
    for (const species of ["O2", "CO2"]) {
      const res = await routes.fuels.POST(post(base, { name: `Pure ${species}`, definition: { composition: { [species]: 1 } } }));
      expect(res.status).toBe(400);
      expect((await res.json()).fieldErrors.definition).toMatch(/no heat/);
    }
  });

  it("400 naming the field for a blend nested 1,000 levels deep (no stack overflow), nothing stored", async () => {
    const before = await count();
    let definition: unknown = { composition: { CH4: 1 } };
    for (let i = 0; i < 1000; i++) definition = { blend: [{ fuel: definition, share: 1 }], basis: "mass" };
    const res = await routes.fuels.POST(post(base, { name: "Deep", definition }));
    expect(res.status).toBe(400);
    expect((await res.json()).fieldErrors.definition).toMatch(/nested more than 64 levels deep/);
    expect(await count()).toBe(before);
  });

  it("409 on a duplicate name (any letter case)", async () => {
    const res = await routes.fuels.POST(post(base, { name: "METHANE", definition: { composition: { CH4: 1 } } }));
    expect(res.status).toBe(409);
    expect((await res.json()).fieldErrors.name).toMatch(/already exists/);
  });

  it("a rejected fuel names every problem at once, including a taken name and missing numbers", async () => {
    const res = await routes.fuels.POST(
      post(base, {
        name: "methane",
        kind: "liquid",
        definition: { ultimate: { C: 0.86, H: "abc" }, kind: "liquid", lhv_MJ_per_kg: null },
        densityKgPerM3: -3,
      }),
    );
    expect(res.status).toBe(400);
    const errs = (await res.json()).fieldErrors;
    expect(errs.name).toMatch(/already exists/);
    expect(errs["definition.ultimate.H"]).toBe("must be a number");
    expect(errs["definition.lhv_MJ_per_kg"]).toBe("enter a number");
    expect(errs.densityKgPerM3).toMatch(/> 0/);
  });

  it("404 for a missing or malformed id", async () => {
    expect((await routes.fuel.GET(new Request(`${base}/99999`), ctx(99999))).status).toBe(404);
    expect((await routes.fuel.GET(new Request(`${base}/abc`), ctx("abc"))).status).toBe(404);
    expect((await routes.fuel.PUT(put(`${base}/99999`, { name: "q", definition: { composition: { CH4: 1 } } }), ctx(99999))).status).toBe(
      404,
    );
    expect((await routes.fuel.DELETE(new Request(`${base}/99999`, { method: "DELETE" }), ctx(99999))).status).toBe(404);
    expect((await routes.prices.GET(new Request(`${base}/99999/prices`), ctx(99999))).status).toBe(404);
    expect((await routes.prices.POST(post(`${base}/99999/prices`, {}), ctx(99999))).status).toBe(404);
  });

  it("PUT updates; a rejected PUT changes nothing", async () => {
    const ok = await routes.fuel.PUT(
      put(`${base}/${methaneId}`, { name: "Methane", definition: { composition: { CH4: 1 } }, notes: "pure methane" }),
      ctx(methaneId),
    );
    expect(ok.status).toBe(200);
    const bad = await routes.fuel.PUT(
      put(`${base}/${methaneId}`, { name: "Methane", definition: { composition: { CH4: 0.5 } }, notes: "changed" }),
      ctx(methaneId),
    );
    expect(bad.status).toBe(400);
    const row = await t.client.fuel.findUniqueOrThrow({ where: { id: methaneId } });
    expect(row.notes).toBe("pure methane");
  });
});

describe("blends", () => {
  it("builds a blend of stored fuels; refuses bad shares; protects components", async () => {
    const ng = await (await routes.fuels.POST(post(base, { name: "NG", definition: { composition: { CH4: 0.95, C2H6: 0.05 } } }))).json();
    const h2 = await (await routes.fuels.POST(post(base, { name: "H2", definition: { composition: { H2: 1 } } }))).json();
    const badShares = await routes.fuels.POST(
      post(base, {
        name: "Bad blend",
        blend: {
          basis: "volume",
          components: [
            { fuelId: ng.id, share: 0.8 },
            { fuelId: h2.id, share: 0.1 },
          ],
        },
      }),
    );
    expect(badShares.status).toBe(400);
    expect((await badShares.json()).fieldErrors["blend.components"]).toMatch(/sum to 1/);
    const missing = await routes.fuels.POST(
      post(base, {
        name: "Bad blend",
        blend: {
          basis: "volume",
          components: [
            { fuelId: ng.id, share: 0.8 },
            { fuelId: 4242, share: 0.2 },
          ],
        },
      }),
    );
    expect((await missing.json()).fieldErrors["blend.components.1.fuelId"]).toMatch(/no stored fuel/);

    const res = await routes.fuels.POST(
      post(base, {
        name: "NG + 20 % H2",
        blend: {
          basis: "volume",
          components: [
            { fuelId: ng.id, share: 0.8 },
            { fuelId: h2.id, share: 0.2 },
          ],
        },
      }),
    );
    expect(res.status).toBe(201);
    const blendId = (await res.json()).id;
    const sheet = await (await routes.fuel.GET(new Request(`${base}/${blendId}`), ctx(blendId))).json();
    expect(sheet.blend.components.map((c: { name: string }) => c.name)).toEqual(["NG", "H2"]);
    // Volume blend of gases: molar HHV is the mole-fraction average (ISO 6976:2016 GCV at 25 °C:
    // CH4 890.58, C2H6 1560.69, H2 285.83 kJ/mol; Table 3, confirmed).
    const expected = 0.8 * (0.95 * 890.58 + 0.05 * 1560.69) + 0.2 * 285.83;
    expect(sheet.properties.hhv.kJ_per_mol).toBeCloseTo(expected, 0);

    // Editing a component re-derives the blend.
    await routes.fuel.PUT(put(`${base}/${ng.id}`, { name: "NG", definition: { composition: { CH4: 1 } } }), ctx(ng.id));
    const after = await (await routes.fuel.GET(new Request(`${base}/${blendId}`), ctx(blendId))).json();
    expect(after.properties.hhv.kJ_per_mol).toBeCloseTo(0.8 * 890.58 + 0.2 * 285.83, 0);

    // A component in use cannot be deleted; the blend can.
    const del = await routes.fuel.DELETE(new Request(`${base}/${h2.id}`, { method: "DELETE" }), ctx(h2.id));
    expect(del.status).toBe(409);
    expect((await del.json()).error).toMatch(/NG \+ 20 % H2/);
    expect((await routes.fuel.DELETE(new Request(`${base}/${blendId}`, { method: "DELETE" }), ctx(blendId))).status).toBe(200);
    expect((await routes.fuel.DELETE(new Request(`${base}/${h2.id}`, { method: "DELETE" }), ctx(h2.id))).status).toBe(200);
  });
});

describe("prices", () => {
  it("adds quotes, keeps history, normalises, and rejects unit/basis mismatches", async () => {
    const gas = await (await routes.fuels.POST(post(base, { name: "Gas for prices", definition: { composition: { CH4: 1 } } }))).json();
    const url = `${base}/${gas.id}/prices`;
    const noBasis = await routes.prices.POST(post(url, { amount: 40, currency: "EUR", unit: "MWh", validFrom: "2025-01-01" }), ctx(gas.id));
    expect(noBasis.status).toBe(400);
    expect((await noBasis.json()).fieldErrors.energyBasis).toMatch(/gross \(HHV\) or net \(LHV\)/);
    const litre = await routes.prices.POST(post(url, { amount: 1, currency: "EUR", unit: "L", validFrom: "2025-01-01" }), ctx(gas.id));
    expect((await litre.json()).fieldErrors.unit).toMatch(/not priced per L/);
    const negative = await routes.prices.POST(post(url, { amount: -1, currency: "EUR", unit: "t", validFrom: "2025-01-01" }), ctx(gas.id));
    expect((await negative.json()).fieldErrors.amount).toMatch(/≥ 0/);
    const both = await (
      await routes.prices.POST(post(url, { amount: -1, currency: "EUR", unit: "MWh", validFrom: "2025-01-01" }), ctx(gas.id))
    ).json();
    expect(both.fieldErrors.amount).toMatch(/≥ 0/);
    expect(both.fieldErrors.energyBasis).toMatch(/needs a basis/);
    const badDate = await routes.prices.POST(post(url, { amount: 1, currency: "EUR", unit: "t", validFrom: "2025-02-30" }), ctx(gas.id));
    expect((await badDate.json()).fieldErrors.validFrom).toBeDefined();
    expect(await t.client.priceQuote.count({ where: { fuelId: gas.id } })).toBe(0);

    const a = await routes.prices.POST(
      post(url, { amount: 40, currency: "eur", unit: "MWh", energyBasis: "gross", transportAdder: 5, validFrom: "2024-01-01" }),
      ctx(gas.id),
    );
    expect(a.status).toBe(201);
    const b = await routes.prices.POST(
      post(url, { amount: 0.45, currency: "EUR", unit: "m3", meteringReference: "15C", validFrom: "2025-01-01", isInvented: true }),
      ctx(gas.id),
    );
    expect(b.status).toBe(201);
    const list = await (await routes.prices.GET(new Request(url), ctx(gas.id))).json();
    expect(list.prices).toHaveLength(2);
    expect(list.prices[0].validFrom).toBe("2025-01-01");
    expect(list.prices[0].inForce).toBe(true);
    expect(list.prices[1].inForce).toBe(false);
    expect(list.prices[1].currency).toBe("EUR");
    expect(list.prices[1].delivered.perMWh_gross).toBeCloseTo(45, 10);
    expect(list.prices[0].unitLabel).toBe("m³ at 15 °C");

    const priceId = list.prices[1].id;
    const fix = await routes.price.PUT(
      put(`${url}/${priceId}`, { amount: 41, currency: "EUR", unit: "MWh", energyBasis: "net", validFrom: "2024-01-01" }),
      pctx(gas.id, priceId),
    );
    // A correction is a new version; the corrected quote stays as it was.
    expect(fix.status).toBe(201);
    const fixId = (await fix.json()).id;
    expect((await t.client.priceQuote.findUniqueOrThrow({ where: { id: fixId } })).energyBasis).toBe("net");
    expect((await t.client.priceQuote.findUniqueOrThrow({ where: { id: priceId } })).energyBasis).toBe("gross");
    const badFix = await routes.price.PUT(
      put(`${url}/${fixId}`, { amount: 41, currency: "EUR", unit: "MWh", validFrom: "2024-01-01" }),
      pctx(gas.id, fixId),
    );
    expect(badFix.status).toBe(400);
    // Part of a correction history: withdrawn, not deleted.
    expect((await routes.price.DELETE(new Request(`${url}/${fixId}`, { method: "DELETE" }), pctx(gas.id, fixId))).status).toBe(409);
    const bId = list.prices[0].id;
    expect((await routes.price.DELETE(new Request(`${url}/${bId}`, { method: "DELETE" }), pctx(gas.id, bId))).status).toBe(200);
    expect((await routes.price.DELETE(new Request(`${url}/${bId}`, { method: "DELETE" }), pctx(gas.id, bId))).status).toBe(404);
  });

  it("a liquid priced per litre needs a density", async () => {
    const oil = await (
      await routes.fuels.POST(
        post(base, { name: "Oil by analysis", definition: { ultimate: { C: 0.86, H: 0.14 }, kind: "liquid", lhv_MJ_per_kg: 43 } }),
      )
    ).json();
    const res = await routes.prices.POST(
      post(`${base}/${oil.id}/prices`, { amount: 0.9, currency: "EUR", unit: "L", validFrom: "2025-01-01" }),
      ctx(oil.id),
    );
    expect(res.status).toBe(400);
    expect((await res.json()).fieldErrors.unit).toMatch(/density/);
  });
});

describe("GET /api/fuels", () => {
  it("lists with kind filter and states its basis", async () => {
    const all = await (await routes.fuels.GET(new Request(base))).json();
    expect(all.fuels.length).toBeGreaterThan(2);
    expect(all.basis.heatingValues).toMatch(/25 °C/);
    const gases = await (await routes.fuels.GET(new Request(`${base}?kind=gas`))).json();
    expect(gases.fuels.every((f: { kind: string }) => f.kind === "gas")).toBe(true);
    expect((await routes.fuels.GET(new Request(`${base}?kind=plasma`))).status).toBe(400);
  });
});

describe("writes from elsewhere are refused", () => {
  const body = JSON.stringify({ name: "Sneaky", definition: { composition: { CH4: 1 } } });
  it("415 for a body not sent as JSON (a plain text post from another page)", async () => {
    const res = await routes.fuels.POST(new Request(base, { method: "POST", body, headers: { "content-type": "text/plain" } }));
    expect(res.status).toBe(415);
    expect((await res.json()).fieldErrors["content-type"]).toMatch(/application\/json/);
  });
  it("403 for a write whose Origin is another site, 2xx/4xx as usual from this server's own origin", async () => {
    const host = new URL(base).host;
    const evil = await routes.fuels.POST(
      new Request(base, { method: "POST", body, headers: { "content-type": "application/json", origin: "http://evil.example", host } }),
    );
    expect(evil.status).toBe(403);
    const own = await routes.fuels.POST(
      new Request(base, { method: "POST", body, headers: { "content-type": "application/json", origin: `http://${host}`, host } }),
    );
    expect(own.status).toBe(201);
  });
  it("413 for a body past the 1 MiB limit, without storing anything", async () => {
    const huge = JSON.stringify({ name: "x".repeat(2 * 1024 * 1024), definition: { composition: { CH4: 1 } } });
    const res = await routes.fuels.POST(new Request(base, { method: "POST", body: huge, headers: { "content-type": "application/json" } }));
    expect(res.status).toBe(413);
  });
});
