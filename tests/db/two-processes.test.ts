/**
 * Two app processes writing to one PostgreSQL database at once lose nothing: each adds fuels and
 * quotes through the services, both add quotes to one shared fuel, and afterwards every row either
 * said it stored is there, once. Runs when STOKE_TEST_PG_URL names a server (`.ci/run`).
 */
import { execFile } from "node:child_process";
import path from "node:path";
import { promisify } from "node:util";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createClient, type Db } from "../../lib/db/client";
import { migratePostgres } from "../../lib/db/migrate";
import { createPostgresDatabase, testPostgresServer } from "./temp-db";

const run = promisify(execFile);
const PER_PROCESS = 25;

describe.skipIf(!testPostgresServer)("two app processes on one PostgreSQL", () => {
  let url = "";
  let drop: () => Promise<void> = async () => {};
  let client: Db;
  let sharedId = 0;

  beforeAll(async () => {
    ({ url, drop } = await createPostgresDatabase(testPostgresServer!));
    await migratePostgres({ databaseUrl: url });
    client = createClient(url);
    sharedId = (
      await client.fuel.create({
        data: { name: "Shared gas", kind: "gas", definition: JSON.stringify({ composition: { CH4: 1 } }) },
      })
    ).id;
  });
  afterAll(async () => {
    await client?.$disconnect();
    await drop();
  });

  it("both write at once; every fuel and quote each reported is stored once", async () => {
    const tsx = path.resolve("node_modules/.bin/tsx");
    const writer = path.resolve("tests/support/concurrent-writer.ts");
    const env = { ...process.env, DATABASE_URL: url };
    const [a, b] = await Promise.all(
      ["Alpha", "Beta"].map((tag) => run(tsx, [writer, tag, String(PER_PROCESS), String(sharedId)], { env, timeout: 120_000 })),
    );
    const out = [a, b].map((r) => JSON.parse(r.stdout.trim().split("\n").at(-1)!) as { fuelIds: number[]; quoteIds: number[] });
    const fuelIds = out.flatMap((o) => o.fuelIds);
    const quoteIds = out.flatMap((o) => o.quoteIds);
    // The writes really overlapped: each process got ids inside the other's range.
    const [ra, rb] = out.map((o) => [Math.min(...o.fuelIds), Math.max(...o.fuelIds)]);
    expect(ra[0] < rb[1] && rb[0] < ra[1]).toBe(true);
    expect(fuelIds).toHaveLength(2 * PER_PROCESS);
    expect(new Set(fuelIds).size).toBe(2 * PER_PROCESS);
    expect(await client.fuel.count()).toBe(2 * PER_PROCESS + 1);
    expect(await client.priceQuote.count()).toBe(4 * PER_PROCESS);
    expect(await client.priceQuote.count({ where: { fuelId: sharedId } })).toBe(2 * PER_PROCESS);
    const stored = await client.priceQuote.findMany({ select: { id: true } });
    expect(new Set(stored.map((q) => q.id))).toEqual(new Set(quoteIds));
    for (const tag of ["Alpha", "Beta"]) {
      expect(await client.fuel.count({ where: { name: { startsWith: `${tag} gas ` } } })).toBe(PER_PROCESS);
    }
  }, 180_000);
});

describe.skipIf(!testPostgresServer)("app instances starting together on one empty PostgreSQL", () => {
  it("seed the demo once: one seeds, the other finds it done", async () => {
    const { url, drop } = await createPostgresDatabase(testPostgresServer!);
    const a = createClient(url);
    const b = createClient(url);
    try {
      await migratePostgres({ databaseUrl: url });
      const { seedIfEmpty } = await import("../../seed/index");
      const [ra, rb] = await Promise.all([seedIfEmpty(a), seedIfEmpty(b)]);
      expect([ra.seeded, rb.seeded].filter(Boolean)).toHaveLength(1);
      const { DEMO_FUELS } = await import("../../seed/demo");
      expect(await a.fuel.count()).toBe(DEMO_FUELS.length);
    } finally {
      await a.$disconnect();
      await b.$disconnect();
      await drop();
    }
  }, 60_000);
});
