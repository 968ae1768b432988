/**
 * The data revision (migration 20261202121000_data_revision): every table has its triggers, every
 * kind of committed change raises the counter, a rolled-back change does not. The response cache
 * relies on it: a response is never served after a change it could have shown.
 */
import { afterEach, beforeEach, describe, expect, it } from "vitest";
import { readDataRevision } from "../../lib/db/data-revision-rows";
import { tempDb, type TempDb } from "./temp-db";

let t: TempDb;
beforeEach(async () => {
  t = await tempDb();
});
afterEach(async () => {
  await t.cleanup();
});

/** The tables of the database and those with a revision trigger. */
async function tablesAndTriggered(t: TempDb): Promise<{ tables: string[]; triggered: Map<string, string[]> }> {
  const triggered = new Map<string, string[]>();
  if (t.provider === "sqlite") {
    const tables = await t.client.$queryRawUnsafe<{ name: string }[]>(
      `SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' AND name NOT LIKE '\\_%' ESCAPE '\\'`,
    );
    const triggers = await t.client.$queryRawUnsafe<{ tbl_name: string; sql: string }[]>(
      `SELECT tbl_name, sql FROM sqlite_master WHERE type = 'trigger'`,
    );
    for (const tr of triggers) {
      if (!/UPDATE "DataRevision" SET "n" = "n" \+ 1/.test(tr.sql)) continue;
      const op = /AFTER (INSERT|UPDATE|DELETE)/.exec(tr.sql)?.[1] ?? "?";
      triggered.set(tr.tbl_name, [...(triggered.get(tr.tbl_name) ?? []), op].sort());
    }
    return { tables: tables.map((r) => r.name), triggered };
  }
  const tables = await t.client.$queryRawUnsafe<{ name: string }[]>(
    `SELECT table_name AS name FROM information_schema.tables WHERE table_schema = 'public' AND table_type = 'BASE TABLE' AND table_name NOT LIKE '\\_%'`,
  );
  const triggers = await t.client.$queryRawUnsafe<{ tbl: string; op: string }[]>(
    `SELECT event_object_table AS tbl, event_manipulation AS op FROM information_schema.triggers WHERE action_statement LIKE '%stoke_raise_data_revision%'`,
  );
  for (const tr of triggers) triggered.set(tr.tbl, [...(triggered.get(tr.tbl) ?? []), tr.op].sort());
  return { tables: tables.map((r) => r.name), triggered };
}

describe("data revision", () => {
  it("every table but the counter's own has a trigger for insert, update and delete", async () => {
    const { tables, triggered } = await tablesAndTriggered(t);
    expect(tables).toContain("Fuel");
    expect(tables).toContain("DataRevision");
    for (const table of tables.filter((n) => n !== "DataRevision")) {
      expect({ table, ops: triggered.get(table) ?? [] }).toEqual({ table, ops: ["DELETE", "INSERT", "UPDATE"] });
    }
    expect(triggered.has("DataRevision")).toBe(false);
  });

  it("insert, update and delete each raise it; reading does not", async () => {
    const r0 = await readDataRevision(t.client);
    const fuel = await t.client.fuel.create({
      data: { name: "Test gas", kind: "gas", definition: JSON.stringify({ composition: { CH4: 1 } }) },
    });
    const r1 = await readDataRevision(t.client);
    expect(r1).toBeGreaterThan(r0);
    await t.client.fuel.findMany();
    expect(await readDataRevision(t.client)).toBe(r1);
    await t.client.fuel.update({ where: { id: fuel.id }, data: { notes: "edited" } });
    const r2 = await readDataRevision(t.client);
    expect(r2).toBeGreaterThan(r1);
    await t.client.fuel.delete({ where: { id: fuel.id } });
    expect(await readDataRevision(t.client)).toBeGreaterThan(r2);
  });

  it("a change rolled back leaves it where it was", async () => {
    const r0 = await readDataRevision(t.client);
    await expect(
      t.client.$transaction(async (tx) => {
        await tx.fuel.create({ data: { name: "Never kept", kind: "gas", definition: "{}" } });
        throw new Error("roll back");
      }),
    ).rejects.toThrow("roll back");
    expect(await readDataRevision(t.client)).toBe(r0);
    expect(await t.client.fuel.count()).toBe(0);
  });

  it("a change in one transaction is seen with its counter, never the counter before the data", async () => {
    const r0 = await readDataRevision(t.client);
    await t.client.$transaction(async (tx) => {
      await tx.fuel.create({ data: { name: "A", kind: "gas", definition: "{}" } });
      await tx.fuel.create({ data: { name: "B", kind: "gas", definition: "{}" } });
    });
    const r1 = await readDataRevision(t.client);
    expect(r1).toBeGreaterThan(r0);
    expect(await t.client.fuel.count()).toBe(2);
  });
});
