/**
 * Fills a database with a large library by bulk insert — one INSERT … SELECT over a JSON array per
 * table (SQLite `json_each`, PostgreSQL `jsonb_to_recordset`), a single parameter each: `fuels`
 * gases (natural-gas-like, each with one quote), `plants` plants burning the first gas, and
 * `studies` studies (one per plant, round robin) with a baseline and one candidate each. The rows
 * are what the services would store, written fast, for the capacity tests.
 */
import type { Db } from "../../lib/db/client";

type ColumnType = "text" | "integer" | "double precision" | "boolean" | "timestamp(3)";

async function bulkInsert(
  db: Db,
  provider: "sqlite" | "postgresql",
  table: string,
  columns: Record<string, ColumnType>,
  rows: Record<string, unknown>[],
): Promise<void> {
  const names = Object.keys(columns);
  const list = names.map((c) => `"${c}"`).join(", ");
  if (provider === "postgresql") {
    const types = names.map((c) => `"${c}" ${columns[c]}`).join(", ");
    await db.$executeRawUnsafe(
      `INSERT INTO "${table}" (${list}) SELECT ${list} FROM jsonb_to_recordset($1::jsonb) AS x(${types})`,
      JSON.stringify(rows),
    );
    return;
  }
  // SQLite: booleans are 0/1, timestamps the ISO text Prisma's SQLite adapter writes.
  const values = names.map((c) => `json_extract(value, '$.${c}')`).join(", ");
  const sqliteRows = rows.map((r) => {
    const o: Record<string, unknown> = {};
    for (const c of names) {
      const v = r[c];
      o[c] = typeof v === "boolean" ? Number(v) : v instanceof Date ? v.toISOString().replace("Z", "+00:00") : v;
    }
    return o;
  });
  await db.$executeRawUnsafe(`INSERT INTO "${table}" (${list}) SELECT ${values} FROM json_each(?)`, JSON.stringify(sqliteRows));
}

export async function fillLargeLibrary(
  db: Db,
  provider: "sqlite" | "postgresql",
  n: { fuels: number; plants: number; studies: number },
): Promise<void> {
  const now = new Date();
  await bulkInsert(
    db,
    provider,
    "Fuel",
    { name: "text", kind: "text", definition: "text", updatedAt: "timestamp(3)" },
    Array.from({ length: n.fuels }, (_, i) => {
      const ethane = 0.02 + (i % 50) / 1000;
      return {
        name: `Bulk gas ${String(i).padStart(5, "0")}`,
        kind: "gas",
        definition: JSON.stringify({ composition: { CH4: Number((0.97 - ethane).toFixed(3)), C2H6: ethane, N2: 0.01 } }),
        updatedAt: now,
      };
    }),
  );
  const fuelIds = (
    await db.fuel.findMany({ where: { name: { startsWith: "Bulk gas " } }, select: { id: true }, orderBy: { id: "asc" } })
  ).map((f) => f.id);
  await bulkInsert(
    db,
    provider,
    "PriceQuote",
    {
      fuelId: "integer",
      amount: "double precision",
      currency: "text",
      unit: "text",
      energyBasis: "text",
      validFrom: "timestamp(3)",
      supplier: "text",
    },
    fuelIds.map((fuelId, i) => ({
      fuelId,
      amount: 30 + (i % 20),
      currency: "EUR",
      unit: "MWh",
      energyBasis: "gross",
      validFrom: new Date("2026-01-01T00:00:00Z"),
      supplier: "Bulk",
    })),
  );
  await bulkInsert(
    db,
    provider,
    "Plant",
    {
      name: "text",
      equipmentType: "text",
      ratedInput_kW: "double precision",
      operatingHours: "double precision",
      averageLoadFraction: "double precision",
      stackTemperatureC: "double precision",
      flueO2DryPercent: "double precision",
      combustionAirC: "double precision",
      radiationLossPercent: "double precision",
      baselineFuelId: "integer",
      updatedAt: "timestamp(3)",
    },
    Array.from({ length: n.plants }, (_, i) => ({
      name: `Bulk plant ${String(i).padStart(4, "0")}`,
      equipmentType: "steam-boiler",
      ratedInput_kW: 5000,
      operatingHours: 6000,
      averageLoadFraction: 0.7,
      stackTemperatureC: 180,
      flueO2DryPercent: 3,
      combustionAirC: 20,
      radiationLossPercent: 1,
      baselineFuelId: fuelIds[0],
      updatedAt: now,
    })),
  );
  const plantIds = (
    await db.plant.findMany({ where: { name: { startsWith: "Bulk plant " } }, select: { id: true }, orderBy: { id: "asc" } })
  ).map((p) => p.id);
  await bulkInsert(
    db,
    provider,
    "Study",
    {
      plantId: "integer",
      name: "text",
      currency: "text",
      discountRatePercent: "double precision",
      horizonYears: "integer",
      rankingMetric: "text",
      updatedAt: "timestamp(3)",
    },
    Array.from({ length: n.studies }, (_, i) => ({
      plantId: plantIds[i % plantIds.length],
      name: `Bulk study ${String(i).padStart(4, "0")}`,
      currency: "EUR",
      discountRatePercent: 8,
      horizonYears: 15,
      rankingMetric: "npv",
      updatedAt: now,
    })),
  );
  const studyIds = (
    await db.study.findMany({ where: { name: { startsWith: "Bulk study " } }, select: { id: true }, orderBy: { id: "asc" } })
  ).map((s) => s.id);
  await bulkInsert(
    db,
    provider,
    "Scenario",
    { studyId: "integer", name: "text", fuelId: "integer", isBaseline: "boolean", position: "integer", updatedAt: "timestamp(3)" },
    studyIds.flatMap((studyId, i) => [
      { studyId, name: "Baseline", fuelId: fuelIds[0], isBaseline: true, position: 0, updatedAt: now },
      { studyId, name: "Candidate", fuelId: fuelIds[(i + 1) % fuelIds.length], isBaseline: false, position: 1, updatedAt: now },
    ]),
  );
}
