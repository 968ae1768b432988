/**
 * Fuel and blend-component rows: the queries, and one mapper per direction between a row and the
 * fuel as lib/ and the API see it. A fuel row stores its definition (JSON text) without the
 * attributes that are columns; `effectiveDefinition` puts them back.
 */
import type { BlendComponent, Fuel, PriceQuote } from "./generated/client";
import type { DbOrTx, Tx } from "./client";
import type { FuelDefinition } from "../schemas/fuel";
import { FUEL_ATTRIBUTE_KEYS, type FuelKind } from "../schemas/library";
import { QUOTES_NEWEST_FIRST } from "./price-quote-rows";

export type FuelRow = Fuel;
export type BlendComponentRow = BlendComponent;
/** A fuel row with its quotes (newest first) and, for a blend, its components with theirs. */
export type FuelWithQuotesRow = Fuel & {
  priceQuotes: PriceQuote[];
  components: (BlendComponent & { component: Fuel & { priceQuotes: PriceQuote[] } })[];
};

/* ------------------------------------------------------------------ row → domain */

/** The definition as stored (JSON text → object), without the column attributes. */
export function storedDefinition(row: Pick<Fuel, "definition">): FuelDefinition {
  return JSON.parse(row.definition) as FuelDefinition;
}

export function isBlendRow(row: Pick<Fuel, "definition">): boolean {
  return "blend" in storedDefinition(row);
}

type DefinitionColumns = Pick<Fuel, "definition" | "name" | "densityKgPerM3" | "biogenicCarbonShare" | "upstreamCo2e_kg_per_GJ">;

/**
 * The definition lib/ evaluates: the stored one plus the row's name and attributes. A blend
 * carries its components' attributes inside and derives its own.
 */
export function effectiveDefinition(row: DefinitionColumns): FuelDefinition {
  const def: FuelDefinition = { ...storedDefinition(row), name: row.name };
  if ("blend" in def) return def;
  if (row.densityKgPerM3 !== null) def.densityKgPerM3 = row.densityKgPerM3;
  def.biogenicCarbonShare = row.biogenicCarbonShare;
  if (row.upstreamCo2e_kg_per_GJ !== null) def.upstreamCo2e_kg_per_GJ = row.upstreamCo2e_kg_per_GJ;
  return def;
}

/** The JSON form of a stored fuel, as the API answers it and the edit form starts from. */
export function fuelJson(row: Fuel, components: (BlendComponent & { component: Pick<Fuel, "id" | "name"> })[] = []) {
  const blend = isBlendRow(row);
  return {
    id: row.id,
    name: row.name,
    kind: row.kind,
    definition: storedDefinition(row),
    blend: blend
      ? {
          basis: components[0]?.basis ?? null,
          components: components.map((c) => ({ fuelId: c.componentFuelId, name: c.component.name, share: c.share })),
        }
      : null,
    densityKgPerM3: row.densityKgPerM3,
    biogenicCarbonShare: row.biogenicCarbonShare,
    upstreamCo2e_kg_per_GJ: row.upstreamCo2e_kg_per_GJ,
    notes: row.notes,
    source: row.source,
    isDemo: row.isDemo,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}
export type FuelJson = ReturnType<typeof fuelJson>;

/* ------------------------------------------------------------------ domain → row */

/** A validated fuel as the service decided it: the full definition and the column attributes. */
export interface FuelFields {
  name: string;
  kind: FuelKind;
  definition: FuelDefinition;
  densityKgPerM3: number | null;
  biogenicCarbonShare: number;
  upstreamCo2e_kg_per_GJ: number | null;
  notes: string;
  source: string;
  isDemo: boolean;
}

export type FuelColumns = Omit<FuelFields, "definition"> & { definition: string };

export interface BlendComponentColumns {
  componentFuelId: number;
  share: number;
  basis: string;
  position: number;
}

/** The columns of a fuel: the definition is stored without the attributes that are columns. */
export function fuelColumns(f: FuelFields): FuelColumns {
  const stored: Record<string, unknown> = { ...f.definition };
  for (const k of FUEL_ATTRIBUTE_KEYS) delete stored[k];
  return { ...f, definition: JSON.stringify(stored) };
}

/* ------------------------------------------------------------------ queries */

export function findFuel(db: DbOrTx, id: number): Promise<Fuel | null> {
  return db.fuel.findUnique({ where: { id } });
}

export function findFuels(db: DbOrTx, ids: number[]): Promise<Fuel[]> {
  return db.fuel.findMany({ where: { id: { in: ids } } });
}

/** Ids and names of every fuel (for name clashes and imports). */
export function fuelNames(db: DbOrTx): Promise<{ id: number; name: string }[]> {
  return db.fuel.findMany({ select: { id: true, name: true } });
}

/** Id, name and kind of every fuel, by kind then name or by name, for the forms' choices. */
export function fuelChoices(db: DbOrTx, order: "kind-name" | "name" = "kind-name"): Promise<{ id: number; name: string; kind: string }[]> {
  return db.fuel.findMany({
    select: { id: true, name: true, kind: true },
    orderBy: order === "name" ? { name: "asc" } : [{ kind: "asc" }, { name: "asc" }],
  });
}

export async function countFuelsAndQuotes(db: DbOrTx): Promise<{ fuels: number; quotes: number }> {
  const [fuels, quotes] = await Promise.all([db.fuel.count(), db.priceQuote.count()]);
  return { fuels, quotes };
}

/** Ids of the fuels that use `fuelId` as a component, directly or through other blends. */
export async function dependentBlendIds(db: DbOrTx, fuelId: number): Promise<number[]> {
  const out: number[] = [];
  const seen = new Set<number>([fuelId]);
  let frontier = [fuelId];
  while (frontier.length) {
    const rows = await db.blendComponent.findMany({ where: { componentFuelId: { in: frontier } }, select: { blendFuelId: true } });
    frontier = [];
    for (const r of rows) {
      if (!seen.has(r.blendFuelId)) {
        seen.add(r.blendFuelId);
        out.push(r.blendFuelId);
        frontier.push(r.blendFuelId);
      }
    }
  }
  return out;
}

/** A blend's component rows in order. */
export function blendComponentsOf(db: DbOrTx, blendFuelId: number): Promise<BlendComponent[]> {
  return db.blendComponent.findMany({ where: { blendFuelId }, orderBy: { position: "asc" } });
}

export async function insertFuel(tx: Tx, columns: FuelColumns, components: BlendComponentColumns[]): Promise<Fuel> {
  const fuel = await tx.fuel.create({ data: columns });
  for (const c of components) await tx.blendComponent.create({ data: { ...c, blendFuelId: fuel.id } });
  return fuel;
}

/** Replaces a fuel's columns and its component rows. */
export async function replaceFuel(tx: Tx, id: number, columns: FuelColumns, components: BlendComponentColumns[]): Promise<Fuel> {
  const fuel = await tx.fuel.update({ where: { id }, data: columns });
  await tx.blendComponent.deleteMany({ where: { blendFuelId: id } });
  for (const c of components) await tx.blendComponent.create({ data: { ...c, blendFuelId: id } });
  return fuel;
}

/** Rewrites a fuel's columns only (a blend re-derived after a component changed). */
export function updateFuelColumns(tx: Tx, id: number, columns: FuelColumns): Promise<Fuel> {
  return tx.fuel.update({ where: { id }, data: columns });
}

export function deleteFuelRow(tx: Tx, id: number): Promise<Fuel> {
  return tx.fuel.delete({ where: { id } });
}

/** What refers to a fuel: blends that contain it, plants that burn it, scenarios that use it. */
export async function fuelUsers(
  db: DbOrTx,
  id: number,
): Promise<{ blends: string[]; plants: string[]; scenarios: { scenario: string; study: string }[]; hydrogenOfStudies: string[] }> {
  const [blends, plants, scenarios, hydrogenOf] = await Promise.all([
    db.blendComponent.findMany({ where: { componentFuelId: id }, include: { blend: { select: { name: true } } } }),
    db.plant.findMany({ where: { baselineFuelId: id }, select: { name: true } }),
    db.scenario.findMany({ where: { fuelId: id }, include: { study: { select: { name: true } } } }),
    db.study.findMany({ where: { hydrogenFuelId: id }, select: { name: true }, orderBy: { id: "asc" } }),
  ]);
  return {
    blends: blends.map((b) => b.blend.name),
    plants: plants.map((p) => p.name),
    scenarios: scenarios.map((s) => ({ scenario: s.name, study: s.study.name })),
    hydrogenOfStudies: hydrogenOf.map((s) => s.name),
  };
}

/** Include clause: a fuel's quotes newest first and its components' quotes. */
export const WITH_QUOTES = {
  priceQuotes: { orderBy: QUOTES_NEWEST_FIRST },
  components: {
    orderBy: { position: "asc" as const },
    include: { component: { include: { priceQuotes: { orderBy: QUOTES_NEWEST_FIRST } } } },
  },
};

/** Fuels (optionally of one kind) by kind and name, with their quotes and their components' quotes. */
export function listFuelsWithQuotes(db: DbOrTx, kind?: string): Promise<FuelWithQuotesRow[]> {
  return db.fuel.findMany({ where: kind ? { kind } : undefined, orderBy: [{ kind: "asc" }, { name: "asc" }], include: WITH_QUOTES });
}

/** The given fuels with their quotes and their components' quotes. */
export function fuelsWithQuotes(db: DbOrTx, ids: number[]): Promise<FuelWithQuotesRow[]> {
  return db.fuel.findMany({ where: { id: { in: ids } }, include: WITH_QUOTES });
}

/** One fuel with its components (id, name, kind) and the blends that use it. */
export function findFuelForSheet(db: DbOrTx, id: number) {
  return db.fuel.findUnique({
    where: { id },
    include: {
      components: { orderBy: { position: "asc" }, include: { component: { select: { id: true, name: true, kind: true } } } },
      usedInBlends: { include: { blend: { select: { id: true, name: true } } } },
    },
  });
}

/** One fuel with its components' names (the edit form). */
export function findFuelWithComponents(db: DbOrTx, id: number) {
  return db.fuel.findUnique({
    where: { id },
    include: { components: { orderBy: { position: "asc" }, include: { component: { select: { id: true, name: true } } } } },
  });
}

/** Gases whose stored definition mentions H2, oldest first, with their quotes. */
export function gasesMentioningHydrogen(db: DbOrTx): Promise<(Fuel & { priceQuotes: PriceQuote[] })[]> {
  return db.fuel.findMany({
    where: { kind: "gas", definition: { contains: '"H2"' } },
    include: { priceQuotes: { orderBy: QUOTES_NEWEST_FIRST } },
    orderBy: { id: "asc" },
  });
}

/** Every fuel with its components' names and its quotes oldest first (the library export). */
export function fuelsForExport(db: DbOrTx) {
  return db.fuel.findMany({
    orderBy: { id: "asc" },
    include: {
      components: { orderBy: { position: "asc" }, include: { component: { select: { name: true } } } },
      priceQuotes: { orderBy: [{ validFrom: "asc" }, { createdAt: "asc" }, { id: "asc" }] },
    },
  });
}
