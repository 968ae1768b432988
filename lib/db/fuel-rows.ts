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
import { groupBy, inChunks } from "./chunks";

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

/** Rows not in the trash: every query but the trash's own and the name-clash look-ups sees only these. */
export const LIVE = { deletedAt: null };

export function findFuel(db: DbOrTx, id: number): Promise<Fuel | null> {
  return db.fuel.findUnique({ where: { id, ...LIVE } });
}

export function findFuels(db: DbOrTx, ids: number[]): Promise<Fuel[]> {
  return inChunks(ids, (chunk) => db.fuel.findMany({ where: { id: { in: chunk }, ...LIVE } }));
}

/** Ids and names of the fuels (for imports); with `includeTrash`, also those in the trash (names stay taken there). */
export function fuelNames(db: DbOrTx, includeTrash = false): Promise<{ id: number; name: string; deletedAt: Date | null }[]> {
  return db.fuel.findMany({ where: includeTrash ? undefined : LIVE, select: { id: true, name: true, deletedAt: true } });
}

/** A fuel in the trash. */
export function findTrashedFuel(db: DbOrTx, id: number): Promise<Fuel | null> {
  return db.fuel.findFirst({ where: { id, deletedAt: { not: null } } });
}

/** Fuels in the trash, latest first. */
export function trashedFuels(db: DbOrTx): Promise<Fuel[]> {
  return db.fuel.findMany({ where: { deletedAt: { not: null } }, orderBy: [{ deletedAt: "desc" }, { id: "desc" }] });
}

/** Moves a fuel to the trash (`at` set) or back (`at` null). */
export function setFuelTrashed(tx: Tx, id: number, at: Date | null, by: string | null): Promise<Fuel> {
  return tx.fuel.update({ where: { id }, data: { deletedAt: at, deletedBy: by } });
}

/** Id, name and kind of every fuel, by kind then name or by name, for the forms' choices. */
export function fuelChoices(db: DbOrTx, order: "kind-name" | "name" = "kind-name"): Promise<{ id: number; name: string; kind: string }[]> {
  return db.fuel.findMany({
    where: LIVE,
    select: { id: true, name: true, kind: true },
    orderBy: order === "name" ? { name: "asc" } : [{ kind: "asc" }, { name: "asc" }],
  });
}

export async function countFuelsAndQuotes(db: DbOrTx): Promise<{ fuels: number; quotes: number }> {
  const [fuels, quotes] = await Promise.all([db.fuel.count({ where: LIVE }), db.priceQuote.count({ where: { fuel: LIVE } })]);
  return { fuels, quotes };
}

/** Ids of the fuels that use `fuelId` as a component, directly or through other blends. */
export async function dependentBlendIds(db: DbOrTx, fuelId: number): Promise<number[]> {
  const out: number[] = [];
  const seen = new Set<number>([fuelId]);
  let frontier = [fuelId];
  while (frontier.length) {
    const rows = await inChunks(frontier, (chunk) =>
      db.blendComponent.findMany({ where: { componentFuelId: { in: chunk } }, select: { blendFuelId: true } }),
    );
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

/** What refers to a fuel: blends that contain it, plants that burn it, scenarios that use it (those in the trash too, marked). */
export async function fuelUsers(
  db: DbOrTx,
  id: number,
): Promise<{ blends: string[]; plants: string[]; scenarios: { scenario: string; study: string }[]; hydrogenOfStudies: string[] }> {
  const [blends, plants, scenarios, hydrogenOf] = await Promise.all([
    db.blendComponent.findMany({ where: { componentFuelId: id }, include: { blend: { select: { name: true, deletedAt: true } } } }),
    db.plant.findMany({ where: { baselineFuelId: id }, select: { name: true, deletedAt: true } }),
    db.scenario.findMany({ where: { fuelId: id }, include: { study: { select: { name: true, deletedAt: true } } } }),
    db.study.findMany({ where: { hydrogenFuelId: id }, select: { name: true, deletedAt: true }, orderBy: { id: "asc" } }),
  ]);
  const trash = (r: { name: string; deletedAt: Date | null }) => (r.deletedAt ? `${r.name} (in the trash)` : r.name);
  return {
    blends: blends.map((b) => trash(b.blend)),
    plants: plants.map((p) => trash(p)),
    scenarios: scenarios.map((s) => ({ scenario: s.name, study: trash(s.study) })),
    hydrogenOfStudies: hydrogenOf.map((s) => trash(s)),
  };
}

/**
 * Adds to fuel rows their quotes (newest first) and, for blends, their components in order with the
 * component rows and their quotes — in chunked queries, whatever the number of fuels.
 */
export async function withQuotes(db: DbOrTx, fuels: Fuel[]): Promise<FuelWithQuotesRow[]> {
  const components = groupBy(
    await inChunks(
      fuels.map((f) => f.id),
      (chunk) =>
        db.blendComponent.findMany({ where: { blendFuelId: { in: chunk } }, orderBy: [{ blendFuelId: "asc" }, { position: "asc" }] }),
    ),
    (c) => c.blendFuelId,
  );
  const known = new Map(fuels.map((f) => [f.id, f]));
  const missing = [...components.values()]
    .flat()
    .map((c) => c.componentFuelId)
    .filter((id) => !known.has(id));
  for (const f of await findFuels(db, missing)) known.set(f.id, f);
  const quotes = groupBy(
    await inChunks([...known.keys()], (chunk) =>
      db.priceQuote.findMany({ where: { fuelId: { in: chunk } }, orderBy: QUOTES_NEWEST_FIRST }),
    ),
    (q) => q.fuelId,
  );
  const quotesOf = (id: number) => quotes.get(id) ?? [];
  return fuels.map((f) => ({
    ...f,
    priceQuotes: quotesOf(f.id),
    components: (components.get(f.id) ?? []).map((c) => {
      const component = known.get(c.componentFuelId)!;
      return { ...c, component: { ...component, priceQuotes: quotesOf(component.id) } };
    }),
  }));
}

/**
 * Include clause: a fuel's quotes newest first and its components' quotes. Only for a bounded
 * number of fuels (one study's scenarios); lists go through `withQuotes`.
 */
export const WITH_QUOTES = {
  priceQuotes: { orderBy: QUOTES_NEWEST_FIRST },
  components: {
    orderBy: { position: "asc" as const },
    include: { component: { include: { priceQuotes: { orderBy: QUOTES_NEWEST_FIRST } } } },
  },
};

/** The fuel order of lists: by kind, then name. */
const LIST_ORDER = [{ kind: "asc" as const }, { name: "asc" as const }, { id: "asc" as const }];

/** Fuels (optionally of one kind) by kind and name, with their quotes and their components' quotes; a page of them when `page` is given. */
export async function listFuelsWithQuotes(
  db: DbOrTx,
  kind?: string,
  page?: { offset: number; limit: number },
): Promise<FuelWithQuotesRow[]> {
  const rows = await db.fuel.findMany({
    where: kind ? { kind, ...LIVE } : LIVE,
    orderBy: LIST_ORDER,
    ...(page ? { skip: page.offset, take: page.limit } : {}),
  });
  return withQuotes(db, rows);
}

/** How many fuels (optionally of one kind) there are. */
export function countFuels(db: DbOrTx, kind?: string): Promise<number> {
  return db.fuel.count({ where: kind ? { kind, ...LIVE } : LIVE });
}

/** The given fuels with their quotes and their components' quotes. */
export async function fuelsWithQuotes(db: DbOrTx, ids: number[]): Promise<FuelWithQuotesRow[]> {
  return withQuotes(db, await findFuels(db, ids));
}

/** One fuel with its components (id, name, kind) and the blends that use it. */
export function findFuelForSheet(db: DbOrTx, id: number) {
  return db.fuel.findUnique({
    where: { id, ...LIVE },
    include: {
      components: { orderBy: { position: "asc" }, include: { component: { select: { id: true, name: true, kind: true } } } },
      usedInBlends: { where: { blend: LIVE }, include: { blend: { select: { id: true, name: true } } } },
    },
  });
}

/** One fuel with its components' names (the edit form). */
export function findFuelWithComponents(db: DbOrTx, id: number) {
  return db.fuel.findUnique({
    where: { id, ...LIVE },
    include: { components: { orderBy: { position: "asc" }, include: { component: { select: { id: true, name: true } } } } },
  });
}

/** Gases whose stored definition mentions H2, oldest first, with their quotes. */
export async function gasesMentioningHydrogen(db: DbOrTx): Promise<(Fuel & { priceQuotes: PriceQuote[] })[]> {
  const rows = await db.fuel.findMany({ where: { kind: "gas", definition: { contains: '"H2"' }, ...LIVE }, orderBy: { id: "asc" } });
  return withQuotes(db, rows);
}

/** Every fuel's id and the ids of its components (the export's order: a blend after what it uses). */
export async function fuelComponentLinks(db: DbOrTx): Promise<{ ids: number[]; components: Map<number, number[]> }> {
  const [fuels, links] = await Promise.all([
    db.fuel.findMany({ where: LIVE, select: { id: true }, orderBy: { id: "asc" } }),
    db.blendComponent.findMany({
      select: { blendFuelId: true, componentFuelId: true },
      orderBy: [{ blendFuelId: "asc" }, { position: "asc" }],
    }),
  ]);
  const components = new Map<number, number[]>();
  for (const [id, rows] of groupBy(links, (l) => l.blendFuelId))
    components.set(
      id,
      rows.map((r) => r.componentFuelId),
    );
  return { ids: fuels.map((f) => f.id), components };
}

export type ExportFuelRow = Fuel & {
  components: (BlendComponent & { component: { name: string } })[];
  priceQuotes: PriceQuote[];
};

/** The given fuels (in the given order) with their components' names and their quotes oldest first (the library export). */
export async function fuelsForExport(db: DbOrTx, ids: number[]): Promise<ExportFuelRow[]> {
  const fuels = new Map((await findFuels(db, ids)).map((f) => [f.id, f]));
  const links = await inChunks(ids, (chunk) =>
    db.blendComponent.findMany({ where: { blendFuelId: { in: chunk } }, orderBy: [{ blendFuelId: "asc" }, { position: "asc" }] }),
  );
  const names = new Map([...fuels.values()].map((f) => [f.id, f.name]));
  const unnamed = links.map((l) => l.componentFuelId).filter((id) => !names.has(id));
  for (const f of await inChunks(unnamed, (chunk) =>
    db.fuel.findMany({ where: { id: { in: chunk } }, select: { id: true, name: true } }),
  )) {
    names.set(f.id, f.name);
  }
  const components = groupBy(
    links.map((l) => ({ ...l, component: { name: names.get(l.componentFuelId) ?? "" } })),
    (c) => c.blendFuelId,
  );
  const quotes = groupBy(
    await inChunks(ids, (chunk) =>
      db.priceQuote.findMany({ where: { fuelId: { in: chunk } }, orderBy: [{ validFrom: "asc" }, { createdAt: "asc" }, { id: "asc" }] }),
    ),
    (q) => q.fuelId,
  );
  return ids.flatMap((id) => {
    const f = fuels.get(id);
    return f ? [{ ...f, components: components.get(id) ?? [], priceQuotes: quotes.get(id) ?? [] }] : [];
  });
}
