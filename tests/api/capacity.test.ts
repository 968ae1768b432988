/**
 * No capacity cliffs: with 10,000 fuels, 1,000 plants and 1,000 studies (bulk-inserted) the lists
 * answer page by page, the exports stream the whole library, the study form loads, and an import
 * of 1,200 more fuels is stored while other requests are answered between its chunks. Before,
 * every one of these answered 500 from about 1,000 rows (the database's parameter limit).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { tempDb, type TempDb } from "../db/temp-db";
import { fillLargeLibrary } from "../support/large-library";
import { libraryToJson } from "../../lib/services/transfer";
import { jsonRequest as req } from "./seeded-api";

const FUELS = 10_000;
const PLANTS = 1_000;
const STUDIES = 1_000;

let t: TempDb;
let routes: {
  fuels: typeof import("../../app/api/fuels/route");
  exportRoute: typeof import("../../app/api/fuels/export/route");
  importRoute: typeof import("../../app/api/fuels/import/route");
  plants: typeof import("../../app/api/plants/route");
  studies: typeof import("../../app/api/studies/route");
};

beforeAll(async () => {
  t = await tempDb();
  process.env.DATABASE_URL = t.url;
  await fillLargeLibrary(t.client, t.provider, { fuels: FUELS, plants: PLANTS, studies: STUDIES });
  routes = {
    fuels: await import("../../app/api/fuels/route"),
    exportRoute: await import("../../app/api/fuels/export/route"),
    importRoute: await import("../../app/api/fuels/import/route"),
    plants: await import("../../app/api/plants/route"),
    studies: await import("../../app/api/studies/route"),
  };
}, 120_000);
afterAll(async () => {
  const { db } = await import("../../lib/db/client");
  await db().$disconnect();
  await t?.cleanup();
});

describe("10,000 fuels, 1,000 plants, 1,000 studies", () => {
  it("GET /api/fuels answers pages of at most 1,000 with the total and the next page's address", async () => {
    const first = await routes.fuels.GET(req("/api/fuels?limit=200"));
    expect(first.status).toBe(200);
    const a = await first.json();
    expect(a.page).toEqual({ offset: 0, limit: 200, total: FUELS, next: "/api/fuels?limit=200&offset=200" });
    expect(a.fuels).toHaveLength(200);
    expect(a.fuels[0].name).toBe("Bulk gas 00000");
    expect(a.fuels[0].hhv).not.toBeNull();
    const last = await (await routes.fuels.GET(req(`/api/fuels?offset=${FUELS - 50}&limit=1000`))).json();
    expect(last.fuels).toHaveLength(50);
    expect(last.fuels.at(-1).name).toBe("Bulk gas 09999");
    expect(last.page.next).toBeNull();
    const bad = await routes.fuels.GET(req("/api/fuels?limit=5000"));
    expect(bad.status).toBe(400);
    expect((await bad.json()).fieldErrors.limit).toMatch(/1 to 1000/);
  });

  it("GET /api/plants and /api/studies answer every row across their pages", async () => {
    const plants = await (await routes.plants.GET(req("/api/plants"))).json();
    expect(plants.page.total).toBe(PLANTS);
    expect(plants.plants).toHaveLength(PLANTS);
    expect(plants.plants[0].studies).toHaveLength(1);
    const studies = await (await routes.studies.GET(req("/api/studies"))).json();
    expect(studies.page.total).toBe(STUDIES);
    expect(studies.studies).toHaveLength(STUDIES);
    expect(studies.studies[0]).toMatchObject({ scenarioCount: 1, baselineName: "Baseline", baselineFuelKind: "gas" });
  });

  it("the library export streams every fuel and quote (JSON exactly as the one-piece writer formats it; CSV a record each)", async () => {
    const r = await routes.exportRoute.GET(req("/api/fuels/export?format=json"));
    expect(r.status).toBe(200);
    const text = await r.text();
    const doc = JSON.parse(text);
    expect(doc.fuels).toHaveLength(FUELS);
    expect(doc.fuels.every((f: { prices: unknown[] }) => f.prices.length === 1)).toBe(true);
    expect(text).toBe(libraryToJson(doc));
    const csv = await (await routes.exportRoute.GET(req("/api/fuels/export?format=csv"))).text();
    const records = csv.split("\r\n").filter((l) => l !== "");
    expect(records.filter((l) => l.startsWith("fuel,"))).toHaveLength(FUELS);
    expect(records.filter((l) => l.startsWith("price,"))).toHaveLength(FUELS);
  });

  it("the study form's choices hold every fuel and plant", async () => {
    const { studyFormOptions } = await import("../../lib/services/studies");
    const o = await studyFormOptions(t.client);
    expect(o.fuels).toHaveLength(FUELS);
    expect(o.plants).toHaveLength(PLANTS);
  });

  it("an import of 1,200 fuels is stored, and a write and a read made meanwhile are answered before it ends", async () => {
    const file = {
      format: "stoke-fuel-library",
      version: 1,
      fuels: Array.from({ length: 1200 }, (_, i) => ({
        name: `Imported gas ${i}`,
        kind: "gas",
        definition: { composition: { CH4: 0.95, C2H6: 0.05 } },
        prices: [{ amount: 35, currency: "EUR", unit: "MWh", energyBasis: "gross", validFrom: "2026-01-01" }],
      })),
    };
    const order: string[] = [];
    const importing = routes.importRoute.POST(req("/api/fuels/import?format=json", "POST", file)).then((r) => {
      order.push("import");
      return r;
    });
    // Asked while the import is running (after its first chunk has started). On SQLite a write waits
    // for the connection's open transaction: one import transaction would hold it to the end.
    await new Promise((resolve) => setTimeout(resolve, 50));
    const write = routes.fuels
      .POST(req("/api/fuels", "POST", { name: "Written during the import", definition: { composition: { CH4: 1 } } }))
      .then((r) => {
        order.push("write");
        return r;
      });
    const read = routes.fuels.GET(req("/api/fuels?limit=1")).then((r) => {
      order.push("read");
      return r;
    });
    const [imp, written, list] = await Promise.all([importing, write, read]);
    expect(imp.status).toBe(201);
    expect((await imp.json()).fuelsCreated).toBe(1200);
    expect(written.status).toBe(201);
    expect(list.status).toBe(200);
    expect(order.at(-1)).toBe("import");
    expect(await t.client.fuel.count()).toBe(FUELS + 1200 + 1);
  }, 120_000);
});
