/** A study names the hydrogen its sweep blends (Study.hydrogenFuelId): choice, checks, the sweep's answer without one, deletion. */
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import Database from "better-sqlite3";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { tempDb } from "./temp-db";
import { seedIfEmpty } from "../../seed/index";
import { migrateSqlite } from "../../lib/db/migrate";
import { createFuel, deleteFuel } from "../../lib/services/fuels";
import { createStudy, evaluateStoredStudy, studyFormOptions, studyRecord, updateStudy } from "../../lib/services/studies";

const t = await tempDb();
const fuel: Record<string, number> = {};
let plantId = 0;
beforeAll(async () => {
  await seedIfEmpty(t.client);
  for (const f of await t.client.fuel.findMany()) fuel[f.name] = f.id;
  plantId = (await t.client.plant.findFirstOrThrow({ where: { name: "Boiler 1 (gas)" } })).id;
});
afterAll(() => t.cleanup());

const record = (name: string, hydrogenFuelId: number | null) => ({
  plantId,
  name,
  currency: "EUR",
  discountRatePercent: 8,
  horizonYears: 15,
  rankingMetric: "cost-per-useful-MWh",
  hydrogenFuelId,
  baseline: { name: "Today", fuelId: fuel["Pipeline natural gas"] },
  scenarios: [{ name: "H2 10", fuelId: fuel["Natural gas + 10 % H2"], capex: 50000 }],
});

describe("the study's hydrogen", () => {
  it("the form offers the library's pure hydrogen by default and only gases that are mostly hydrogen", async () => {
    const o = await studyFormOptions(t.client);
    expect(o.defaultHydrogenFuelId).toBe(fuel.Hydrogen);
    const names = o.hydrogenFuels.map((f) => f.name);
    expect(names).toContain("Hydrogen");
    expect(names).not.toContain("Natural gas + 10 % H2");
    expect(names).not.toContain("Pipeline natural gas");
  });

  it("the sweep blends the chosen fuel and the study file carries it by name", async () => {
    const made = await createStudy(t.client, record("Chosen hydrogen", fuel.Hydrogen));
    expect(made.ok, JSON.stringify(made)).toBe(true);
    if (!made.ok) return;
    expect((await studyRecord(t.client, made.value.id))?.hydrogenFuelId).toBe(fuel.Hydrogen);
    const ev = await evaluateStoredStudy(t.client, made.value.id, { sweep: true });
    if (!ev.ok) throw new Error(ev.message);
    expect(ev.bundle.meta.hydrogen.fuelName).toBe("Hydrogen");
    expect(ev.bundle.study.hydrogenSweep.hydrogen.name).toBe("Hydrogen");
    expect(ev.result.hydrogenSweep?.available).toBe(true);
  });

  it("without a chosen hydrogen, asking for the sweep names the field; other views run without it", async () => {
    const made = await createStudy(t.client, record("No hydrogen", null));
    if (!made.ok) throw new Error(made.message);
    const asked = await evaluateStoredStudy(t.client, made.value.id, { sweep: true });
    expect(asked.ok).toBe(false);
    if (asked.ok) return;
    expect(asked.kind).toBe("invalid");
    expect(Object.keys(asked.fieldErrors)).toEqual(["hydrogenFuelId"]);
    const optional = await evaluateStoredStudy(t.client, made.value.id, { sweep: "if-chosen" });
    if (!optional.ok) throw new Error(optional.message);
    expect(optional.result.hydrogenSweep).toBeNull();
    expect(optional.bundle.study.hydrogenSweep.enabled).toBe(false);
  });

  it("refuses a fuel that is not a gas or not mostly hydrogen, naming the field", async () => {
    for (const [id, words] of [
      [fuel["Gas oil"], "not a gas"],
      [fuel["Natural gas + 10 % H2"], "not mostly hydrogen"],
      [999_999, "no stored fuel"],
    ] as const) {
      const r = await createStudy(t.client, record(`Bad hydrogen ${id}`, id));
      expect(r.ok).toBe(false);
      if (r.ok) continue;
      expect(r.fieldErrors.hydrogenFuelId).toContain(words);
    }
  });

  it("a fuel chosen as a study's hydrogen cannot be deleted until the study lets it go", async () => {
    const h = await createFuel(t.client, { name: "Electrolytic H2 99.9", definition: { composition: { H2: 0.999, N2: 0.001 } } });
    if (!h.ok) throw new Error(h.message);
    const s = await createStudy(t.client, record("Own hydrogen", h.value.id));
    if (!s.ok) throw new Error(s.message);
    const refused = await deleteFuel(t.client, h.value.id);
    expect(refused.ok).toBe(false);
    if (!refused.ok) {
      expect(refused.kind).toBe("conflict");
      expect(refused.message).toContain('hydrogen of the sweep of study "Own hydrogen"');
    }
    // The database refuses it as well (delete rule Restrict).
    await expect(t.client.fuel.delete({ where: { id: h.value.id } })).rejects.toThrow();
    const freed = await updateStudy(t.client, s.value.id, record("Own hydrogen", null));
    expect(freed.ok).toBe(true);
    expect((await deleteFuel(t.client, h.value.id)).ok).toBe(true);
  });
});

describe("migration 20261202093000_study_hydrogen_fuel", () => {
  it("gives existing studies the library's first pure hydrogen, as the sweep used before", () => {
    const root = path.join(process.cwd(), "prisma", "migrations");
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), "stoke-h2-mig-"));
    try {
      const all = fs.readdirSync(root).filter((n) => /^\d{14}_/.test(n));
      const copy = (names: string[]) => {
        for (const n of names) fs.cpSync(path.join(root, n), path.join(dir, "m", n), { recursive: true });
      };
      copy(all.filter((n) => n < "20261202093000"));
      const file = path.join(dir, "x.db");
      migrateSqlite({ databaseUrl: `file:${file}`, migrationsDir: path.join(dir, "m") });
      const d = new Database(file);
      const now = new Date().toISOString();
      d.prepare(
        `INSERT INTO "Fuel" (name, kind, definition, updatedAt) VALUES ('NG', 'gas', '{"composition":{"CH4":0.9,"H2":0.1}}', ?)`,
      ).run(now);
      d.prepare(`INSERT INTO "Fuel" (name, kind, definition, updatedAt) VALUES ('H2 pure', 'gas', '{"composition":{"H2":1}}', ?)`).run(now);
      d.prepare(
        `INSERT INTO "Plant" (name, equipmentType, ratedInput_kW, operatingHours, averageLoadFraction, stackTemperatureC, flueO2DryPercent, combustionAirC, radiationLossPercent, updatedAt) VALUES ('P', 'steam-boiler', 1000, 4000, 0.6, 150, 3, 25, 1, ?)`,
      ).run(now);
      d.prepare(
        `INSERT INTO "Study" (plantId, name, currency, discountRatePercent, horizonYears, rankingMetric, updatedAt) VALUES (1, 'S', 'EUR', 8, 15, 'npv', ?)`,
      ).run(now);
      d.close();
      copy(all.filter((n) => n >= "20261202093000"));
      migrateSqlite({ databaseUrl: `file:${file}`, migrationsDir: path.join(dir, "m") });
      const after = new Database(file);
      const row = after
        .prepare(`SELECT s."hydrogenFuelId" AS h, f.name AS name FROM "Study" s JOIN "Fuel" f ON f.id = s."hydrogenFuelId"`)
        .get() as {
        name: string;
      };
      after.close();
      expect(row.name).toBe("H2 pure");
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });
});
