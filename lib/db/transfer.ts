/**
 * Import and export of the fuel library (fuels, blends, price quotes) as JSON and CSV.
 * Exporting, importing into an empty library and exporting again gives the same text.
 * An import is all or nothing: every record is validated as the forms validate it, in one
 * transaction; the first error names the record and the field.
 */
import type { PrismaClient } from "./generated/client";
import { addPriceQuoteIn, createFuelIn, fail, inTransaction, isBlendRow, quoteJson, storedDefinition, type Result, type Tx } from "./fuels";
import { parseCsv, toCsv, CsvSyntaxError } from "./csv";

export const LIBRARY_FORMAT = "stoke-fuel-library";
export const LIBRARY_FORMAT_VERSION = 1;

export interface LibraryPrice {
  amount: number;
  currency: string;
  unit: string;
  energyBasis: string | null;
  meteringReference: string | null;
  transportAdder: number;
  handlingAdder: number;
  validFrom: string;
  sourceNote: string;
  isInvented: boolean;
}

export interface LibraryFuel {
  name: string;
  kind: string;
  /** Null for a blend (its definition follows from its components). */
  definition: unknown | null;
  /** Components by fuel name. Null for a fuel that is not a blend. */
  blend: { basis: string; components: { fuel: string; share: number }[] } | null;
  densityKgPerM3: number | null;
  biogenicCarbonShare: number | null;
  upstreamCo2e_kg_per_GJ: number | null;
  notes: string;
  source: string;
  isDemo: boolean;
  prices: LibraryPrice[];
}

export interface LibraryDocument {
  format: typeof LIBRARY_FORMAT;
  version: number;
  fuels: LibraryFuel[];
}

/* ------------------------------------------------------------------ export */

export async function exportLibrary(db: PrismaClient | Tx): Promise<LibraryDocument> {
  const rows = await db.fuel.findMany({
    orderBy: { id: "asc" },
    include: {
      components: { orderBy: { position: "asc" }, include: { component: { select: { name: true } } } },
      priceQuotes: { orderBy: [{ validFrom: "asc" }, { createdAt: "asc" }, { id: "asc" }] },
    },
  });
  // Components first: a blend is listed after every fuel it uses.
  const byId = new Map(rows.map((r) => [r.id, r]));
  const done = new Set<number>();
  const ordered: typeof rows = [];
  const visit = (r: (typeof rows)[number]) => {
    if (done.has(r.id)) return;
    done.add(r.id);
    for (const c of r.components) visit(byId.get(c.componentFuelId)!);
    ordered.push(r);
  };
  rows.forEach(visit);
  return {
    format: LIBRARY_FORMAT,
    version: LIBRARY_FORMAT_VERSION,
    fuels: ordered.map((r) => {
      const blend = isBlendRow(r);
      return {
        name: r.name,
        kind: r.kind,
        definition: blend ? null : storedDefinition(r),
        blend: blend
          ? { basis: r.components[0]?.basis ?? "volume", components: r.components.map((c) => ({ fuel: c.component.name, share: c.share })) }
          : null,
        densityKgPerM3: blend ? null : r.densityKgPerM3,
        biogenicCarbonShare: blend ? null : r.biogenicCarbonShare,
        upstreamCo2e_kg_per_GJ: blend ? null : r.upstreamCo2e_kg_per_GJ,
        notes: r.notes,
        source: r.source,
        isDemo: r.isDemo,
        prices: r.priceQuotes.map((q) => {
          // The quote as the API shows it, without the database's own ids and timestamps.
          const { id: _id, fuelId: _fuelId, createdAt: _createdAt, ...portable } = quoteJson(q);
          return portable;
        }),
      };
    }),
  };
}

export function libraryToJson(doc: LibraryDocument): string {
  return JSON.stringify(doc, null, 2) + "\n";
}

export const CSV_COLUMNS = [
  "record",
  "fuel",
  "kind",
  "definition",
  "blendBasis",
  "blendComponents",
  "densityKgPerM3",
  "biogenicCarbonShare",
  "upstreamCo2e_kg_per_GJ",
  "notes",
  "source",
  "isDemo",
  "amount",
  "currency",
  "unit",
  "energyBasis",
  "meteringReference",
  "transportAdder",
  "handlingAdder",
  "validFrom",
  "sourceNote",
  "isInvented",
] as const;
type CsvColumn = (typeof CSV_COLUMNS)[number];

const num = (v: number | null) => (v === null ? "" : String(v));

/**
 * CSV: one "fuel" record per fuel followed by one "price" record per quote. Definitions and
 * blend components are JSON text in their cells (exact); numbers are written in the shortest
 * form that reads back to the same value.
 */
export function libraryToCsv(doc: LibraryDocument): string {
  const rows: string[][] = [[...CSV_COLUMNS]];
  const row = (cells: Partial<Record<CsvColumn, string>>) => CSV_COLUMNS.map((c) => cells[c] ?? "");
  for (const f of doc.fuels) {
    rows.push(
      row({
        record: "fuel",
        fuel: f.name,
        kind: f.kind,
        definition: f.definition === null ? "" : JSON.stringify(f.definition),
        blendBasis: f.blend?.basis ?? "",
        blendComponents: f.blend ? JSON.stringify(f.blend.components) : "",
        densityKgPerM3: num(f.densityKgPerM3),
        biogenicCarbonShare: num(f.biogenicCarbonShare),
        upstreamCo2e_kg_per_GJ: num(f.upstreamCo2e_kg_per_GJ),
        notes: f.notes,
        source: f.source,
        isDemo: String(f.isDemo),
      }),
    );
    for (const p of f.prices) {
      rows.push(
        row({
          record: "price",
          fuel: f.name,
          amount: String(p.amount),
          currency: p.currency,
          unit: p.unit,
          energyBasis: p.energyBasis ?? "",
          meteringReference: p.meteringReference ?? "",
          transportAdder: String(p.transportAdder),
          handlingAdder: String(p.handlingAdder),
          validFrom: p.validFrom,
          sourceNote: p.sourceNote,
          isInvented: String(p.isInvented),
        }),
      );
    }
  }
  return toCsv(rows);
}

/* ------------------------------------------------------------------ import */

export type ImportFormat = "json" | "csv";

export interface ImportOptions {
  /** "reject" (default): a name already in the library stops the import. "skip": such fuels are left as they are. */
  onExisting?: "reject" | "skip";
}

export interface ImportSummary {
  fuelsCreated: number;
  pricesCreated: number;
  skipped: string[];
}

class ImportProblem extends Error {
  constructor(
    public readonly where: string,
    message: string,
  ) {
    super(`${where}: ${message}`);
  }
}

function csvNumber(where: string, column: string, cell: string): number | null {
  if (cell.trim() === "") return null;
  const n = Number(cell);
  if (!Number.isFinite(n)) throw new ImportProblem(where, `${column}: "${cell}" is not a number`);
  return n;
}
function csvBool(where: string, column: string, cell: string): boolean {
  const v = cell.trim().toLowerCase();
  if (v === "true") return true;
  if (v === "false" || v === "") return false;
  throw new ImportProblem(where, `${column}: "${cell}" must be true or false`);
}
function csvJson(where: string, column: string, cell: string): unknown {
  try {
    return JSON.parse(cell);
  } catch {
    throw new ImportProblem(where, `${column}: not valid JSON`);
  }
}

/** Reads CSV text into a library document (structure only; values are validated on import). */
export function libraryFromCsv(text: string): LibraryDocument {
  let rows: string[][];
  try {
    rows = parseCsv(text);
  } catch (e) {
    if (e instanceof CsvSyntaxError) throw new ImportProblem(`line ${e.line}`, e.message.replace(/^CSV line \d+: /, ""));
    throw e;
  }
  if (rows.length === 0) throw new ImportProblem("file", "empty");
  const header = rows[0].map((h) => h.trim());
  const missing = CSV_COLUMNS.filter((c) => !header.includes(c));
  if (missing.length) throw new ImportProblem("header", `missing column(s) ${missing.join(", ")}`);
  const col = (r: string[], c: CsvColumn) => r[header.indexOf(c)] ?? "";
  const fuels: LibraryFuel[] = [];
  const byName = new Map<string, LibraryFuel>();
  rows.slice(1).forEach((r, idx) => {
    const where = `row ${idx + 2}`;
    const record = col(r, "record").trim();
    const name = col(r, "fuel");
    if (record === "fuel") {
      const blendBasis = col(r, "blendBasis").trim();
      const f: LibraryFuel = {
        name,
        kind: col(r, "kind").trim(),
        definition: col(r, "definition").trim() === "" ? null : csvJson(where, "definition", col(r, "definition")),
        blend:
          blendBasis === "" && col(r, "blendComponents").trim() === ""
            ? null
            : { basis: blendBasis, components: csvJson(where, "blendComponents", col(r, "blendComponents")) as { fuel: string; share: number }[] },
        densityKgPerM3: csvNumber(where, "densityKgPerM3", col(r, "densityKgPerM3")),
        biogenicCarbonShare: csvNumber(where, "biogenicCarbonShare", col(r, "biogenicCarbonShare")),
        upstreamCo2e_kg_per_GJ: csvNumber(where, "upstreamCo2e_kg_per_GJ", col(r, "upstreamCo2e_kg_per_GJ")),
        notes: col(r, "notes"),
        source: col(r, "source"),
        isDemo: csvBool(where, "isDemo", col(r, "isDemo")),
        prices: [],
      };
      if (byName.has(name)) throw new ImportProblem(where, `fuel "${name}" appears twice`);
      byName.set(name, f);
      fuels.push(f);
    } else if (record === "price") {
      const f = byName.get(name);
      if (!f) throw new ImportProblem(where, `price for "${name}" comes before (or without) its fuel record`);
      const amount = csvNumber(where, "amount", col(r, "amount"));
      f.prices.push({
        amount: amount as number,
        currency: col(r, "currency"),
        unit: col(r, "unit").trim(),
        energyBasis: col(r, "energyBasis").trim() || null,
        meteringReference: col(r, "meteringReference").trim() || null,
        transportAdder: csvNumber(where, "transportAdder", col(r, "transportAdder")) ?? 0,
        handlingAdder: csvNumber(where, "handlingAdder", col(r, "handlingAdder")) ?? 0,
        validFrom: col(r, "validFrom").trim(),
        sourceNote: col(r, "sourceNote"),
        isInvented: csvBool(where, "isInvented", col(r, "isInvented")),
      });
    } else {
      throw new ImportProblem(where, `record must be "fuel" or "price", not "${record}"`);
    }
  });
  return { format: LIBRARY_FORMAT, version: LIBRARY_FORMAT_VERSION, fuels };
}

function asDocument(value: unknown): LibraryDocument {
  if (typeof value !== "object" || value === null || Array.isArray(value)) throw new ImportProblem("file", "must be a JSON object");
  const v = value as Record<string, unknown>;
  if (v.format !== LIBRARY_FORMAT) throw new ImportProblem("format", `must be "${LIBRARY_FORMAT}"`);
  if (v.version !== LIBRARY_FORMAT_VERSION) throw new ImportProblem("version", `must be ${LIBRARY_FORMAT_VERSION}`);
  if (!Array.isArray(v.fuels)) throw new ImportProblem("fuels", "must be a list");
  return v as unknown as LibraryDocument;
}

/** Parses an import file's text. Throws with a located message when the text is malformed. */
export function parseLibrary(text: string, format: ImportFormat): Result<LibraryDocument> {
  try {
    if (format === "csv") return { ok: true, value: libraryFromCsv(text) };
    let value: unknown;
    try {
      value = JSON.parse(text);
    } catch (e) {
      throw new ImportProblem("file", `not valid JSON (${(e as Error).message})`);
    }
    return { ok: true, value: asDocument(value) };
  } catch (e) {
    if (e instanceof ImportProblem) return fail(400, `Import refused, nothing was stored. ${e.message}`, { [e.where]: e.message.replace(/^[^:]*: /, "") });
    throw e;
  }
}

function prefixErrors(prefix: string, errs: Record<string, string>): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [k, v] of Object.entries(errs)) out[k === "_" ? prefix : `${prefix}.${k}`] = v;
  return out;
}

/** Imports a parsed library document in one transaction. */
export async function importLibrary(db: PrismaClient, doc: LibraryDocument, opts: ImportOptions = {}): Promise<Result<ImportSummary>> {
  return inTransaction(db, async (tx) => {
    const existing = new Map((await tx.fuel.findMany({ select: { id: true, name: true } })).map((f) => [f.name.toLowerCase(), f.id]));
    const idByName = new Map<string, number>(); // lower-case name → id (existing or created here)
    for (const [k, id] of existing) idByName.set(k, id);
    const summary: ImportSummary = { fuelsCreated: 0, pricesCreated: 0, skipped: [] };
    const seen = new Set<string>();
    const pending = doc.fuels.map((f, i) => ({ f, i }));
    // Process in dependency order: a blend waits until its components exist.
    while (pending.length) {
      const idx = pending.findIndex(({ f }) => !f || !f.blend || !Array.isArray(f.blend.components) || f.blend.components.every((c) => idByName.has(String(c?.fuel ?? "").toLowerCase())));
      if (idx < 0) {
        const { f, i } = pending[0];
        const missing = f.blend!.components.map((c) => String(c?.fuel)).filter((n) => !idByName.has(n.toLowerCase()));
        return fail(400, `Import refused, nothing was stored. fuels[${i}] "${f.name}": blend component(s) ${missing.map((m) => `"${m}"`).join(", ")} not found`, {
          [`fuels.${i}.blend.components`]: `not found: ${missing.join(", ")}`,
        });
      }
      const { f, i } = pending.splice(idx, 1)[0];
      const where = `fuels.${i}`;
      if (typeof f !== "object" || f === null) return fail(400, `Import refused, nothing was stored. ${where}: must be an object`, { [where]: "must be an object" });
      const key = String(f.name ?? "").trim().toLowerCase();
      if (seen.has(key)) return fail(400, `Import refused, nothing was stored. ${where}: "${f.name}" appears twice in the file`, { [`${where}.name`]: "appears twice in the file" });
      seen.add(key);
      if (existing.has(key)) {
        if (opts.onExisting === "skip") {
          summary.skipped.push(f.name);
          continue;
        }
        return fail(409, `Import refused, nothing was stored. A fuel named "${f.name}" already exists (choose "skip existing" to leave it as it is).`, {
          [`${where}.name`]: `a fuel named "${f.name}" already exists`,
        });
      }
      const input: Record<string, unknown> = {
        name: f.name,
        notes: f.notes ?? "",
        source: f.source ?? "",
        isDemo: f.isDemo ?? false,
      };
      if (f.kind !== undefined && f.kind !== null && f.kind !== "") input.kind = f.kind;
      if (f.blend) {
        input.blend = {
          basis: f.blend.basis,
          components: f.blend.components.map((c) => ({ fuelId: idByName.get(String(c.fuel).toLowerCase()), share: c.share })),
        };
      } else {
        input.definition = f.definition ?? undefined;
        input.densityKgPerM3 = f.densityKgPerM3 ?? null;
        input.biogenicCarbonShare = f.biogenicCarbonShare ?? null;
        input.upstreamCo2e_kg_per_GJ = f.upstreamCo2e_kg_per_GJ ?? null;
      }
      const created = await createFuelIn(tx, input);
      if (!created.ok) {
        return fail(created.status, `Import refused, nothing was stored. ${where} "${f.name}": ${Object.entries(created.fieldErrors).map(([k, v]) => `${k}: ${v}`).join("; ") || created.message}`, prefixErrors(where, created.fieldErrors));
      }
      idByName.set(key, created.value.id);
      summary.fuelsCreated++;
      for (const [j, p] of (Array.isArray(f.prices) ? f.prices : []).entries()) {
        const q = await addPriceQuoteIn(tx, created.value.id, p);
        if (!q.ok) {
          const pw = `${where}.prices.${j}`;
          return fail(400, `Import refused, nothing was stored. ${pw} (price of "${f.name}"): ${Object.entries(q.fieldErrors).map(([k, v]) => `${k}: ${v}`).join("; ")}`, prefixErrors(pw, q.fieldErrors));
        }
        summary.pricesCreated++;
      }
    }
    return { ok: true, value: summary };
  });
}

export async function exportLibraryText(db: PrismaClient, format: ImportFormat): Promise<string> {
  const doc = await exportLibrary(db);
  return format === "csv" ? libraryToCsv(doc) : libraryToJson(doc);
}

