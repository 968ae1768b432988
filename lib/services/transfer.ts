/**
 * Import and export of the fuel library (fuels, blends, price quotes) as JSON and CSV.
 * Exporting, importing into an empty library and exporting again gives the same text.
 * An import is all or nothing: every record is validated as the forms validate it, in one
 * transaction; the first error names the record and the field.
 */
import { z } from "zod";
import { inTransaction, type Db, type DbOrTx } from "../db/client";
import {
  deleteFuelRow,
  type ExportFuelRow,
  findFuel,
  fuelComponentLinks,
  fuelNames,
  fuelsForExport,
  fuelUsers,
  isBlendRow,
  storedDefinition,
} from "../db/fuel-rows";
import { quoteJson } from "../db/price-quote-rows";
import { fieldErrors } from "../schemas/fuel";
import { InputError } from "../errors";
import { readCsv, writeCsv } from "../formats/csv";
import { MAX_JSON_DEPTH, tooDeepAt } from "../formats/json-depth";
import { addPriceQuoteIn, createFuelIn, fuelNameKeys, type NameKeys } from "./fuels";
import { ok, problem, type Problem, type Result } from "./result";

export const LIBRARY_FORMAT = "stoke-fuel-library";
export const LIBRARY_FORMAT_VERSION = 1;

const text = z.string({ error: "must be text" });
const numberOrNull = z
  .number({ error: "must be a number" })
  .nullish()
  .transform((v) => v ?? null);

const libraryPriceSchema = z.object({
  amount: z.number({ error: "must be a number" }),
  currency: text,
  unit: text,
  energyBasis: text.nullish().transform((v) => v ?? null),
  meteringReference: text.nullish().transform((v) => v ?? null),
  transportAdder: z.number({ error: "must be a number" }).default(0),
  handlingAdder: z.number({ error: "must be a number" }).default(0),
  validFrom: text,
  sourceNote: text.default(""),
  supplier: text.default(""),
  isInvented: z.boolean({ error: "must be true or false" }).default(false),
});

const libraryFuelSchema = z.object(
  {
    name: text,
    kind: text.nullish().transform((v) => v ?? ""),
    /** Null for a blend (its definition follows from its components); checked as the fuel form checks it. */
    definition: z.unknown().transform((v) => v ?? null),
    /** Components by fuel name. Null for a fuel that is not a blend. */
    blend: z
      .object({
        basis: text,
        components: z.array(z.object({ fuel: text, share: z.number({ error: "must be a number" }) }), { error: "must be a list" }),
      })
      .nullish()
      .transform((v) => v ?? null),
    densityKgPerM3: numberOrNull,
    biogenicCarbonShare: numberOrNull,
    upstreamCo2e_kg_per_GJ: numberOrNull,
    notes: text.default(""),
    source: text.default(""),
    isDemo: z.boolean({ error: "must be true or false" }).default(false),
    prices: z.array(libraryPriceSchema, { error: "must be a list" }).default([]),
  },
  { error: "must be an object describing a fuel" },
);

/** A library file: the fuels (components before the blends that use them) with their quotes. */
export const libraryDocumentSchema = z.object(
  {
    format: z.literal(LIBRARY_FORMAT, { error: `must be "${LIBRARY_FORMAT}"` }),
    version: z.literal(LIBRARY_FORMAT_VERSION, { error: `must be ${LIBRARY_FORMAT_VERSION}` }),
    fuels: z.array(libraryFuelSchema, { error: "must be a list" }),
  },
  { error: "must be a JSON object" },
);

export type LibraryPrice = z.output<typeof libraryPriceSchema>;
export type LibraryFuel = z.output<typeof libraryFuelSchema>;
export type LibraryDocument = z.output<typeof libraryDocumentSchema>;

/* ------------------------------------------------------------------ export */

/** Fuels per chunk of the export: what one read of the database brings at a time. */
const EXPORT_CHUNK = 500;

/** The export's fuel order: by id, each blend after every fuel it uses. Ids and links only. */
async function exportOrder(db: DbOrTx): Promise<number[]> {
  const { ids, components } = await fuelComponentLinks(db);
  const done = new Set<number>();
  const known = new Set(ids);
  const ordered: number[] = [];
  const visit = (id: number) => {
    if (done.has(id) || !known.has(id)) return;
    done.add(id);
    for (const c of components.get(id) ?? []) visit(c);
    ordered.push(id);
  };
  ids.forEach(visit);
  return ordered;
}

function libraryFuelOf(r: ExportFuelRow): LibraryDocument["fuels"][number] {
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
      // Version links and withdrawal are this database's history, not part of the portable quote.
      const { id: _id, fuelId: _fuelId, createdAt: _createdAt, supersedesId: _s, withdrawnAt: _w, ...portable } = quoteJson(q);
      return portable;
    }),
  } as LibraryDocument["fuels"][number];
}

/** The library's fuels in export order, EXPORT_CHUNK at a time (each chunk a few bounded queries). */
export async function* exportLibraryFuels(db: DbOrTx): AsyncGenerator<LibraryDocument["fuels"][number][]> {
  const order = await exportOrder(db);
  for (let i = 0; i < order.length; i += EXPORT_CHUNK) {
    yield (await fuelsForExport(db, order.slice(i, i + EXPORT_CHUNK))).map(libraryFuelOf);
  }
}

export async function exportLibrary(db: DbOrTx): Promise<LibraryDocument> {
  const fuels: LibraryDocument["fuels"] = [];
  for await (const chunk of exportLibraryFuels(db)) fuels.push(...chunk);
  return { format: LIBRARY_FORMAT, version: LIBRARY_FORMAT_VERSION, fuels };
}

export function libraryToJson(doc: LibraryDocument): string {
  return `${JSON.stringify(doc, null, 2)}\n`;
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
  "supplier",
] as const;
/** Columns older files may lack (read as empty). */
const OPTIONAL_COLUMNS: readonly string[] = ["supplier"];
type CsvColumn = (typeof CSV_COLUMNS)[number];

const num = (v: number | null) => (v === null ? "" : String(v));

/**
 * CSV: one "fuel" record per fuel followed by one "price" record per quote. Definitions and
 * blend components are JSON text in their cells (exact); numbers are written in the shortest
 * form that reads back to the same value.
 */
export function libraryToCsv(doc: LibraryDocument): string {
  return writeCsv([[...CSV_COLUMNS], ...csvRecordsOf(doc.fuels)]);
}

/** The CSV records (without the header) of some fuels. */
function csvRecordsOf(fuels: LibraryDocument["fuels"]): string[][] {
  const rows: string[][] = [];
  const row = (cells: Partial<Record<CsvColumn, string>>) => CSV_COLUMNS.map((c) => cells[c] ?? "");
  for (const f of fuels) {
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
          supplier: p.supplier,
        }),
      );
    }
  }
  return rows;
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

function csvNumber(where: string, column: string, cell: string): number | null {
  if (cell.trim() === "") return null;
  const n = Number(cell);
  if (!Number.isFinite(n)) throw new InputError(where, `${column}: "${cell}" is not a number`);
  return n;
}
function csvBool(where: string, column: string, cell: string): boolean {
  const v = cell.trim().toLowerCase();
  if (v === "true") return true;
  if (v === "false" || v === "") return false;
  throw new InputError(where, `${column}: "${cell}" must be true or false`);
}
function csvJson(where: string, column: string, cell: string): unknown {
  let value: unknown;
  try {
    value = JSON.parse(cell);
  } catch (e) {
    if (!(e instanceof SyntaxError)) throw e;
    throw new InputError(where, `${column}: not valid JSON`);
  }
  if (tooDeepAt(value) !== null) throw new InputError(where, `${column}: nested more than ${MAX_JSON_DEPTH} levels deep`);
  return value;
}

/** Reads CSV text into a library document (structure only; values are validated on import). */
export function libraryFromCsv(text: string): LibraryDocument {
  const rows = readCsv(text);
  if (rows.length === 0) throw new InputError("file", "empty");
  const header = rows[0].map((h) => h.trim());
  const missing = CSV_COLUMNS.filter((c) => !header.includes(c) && !OPTIONAL_COLUMNS.includes(c));
  if (missing.length) throw new InputError("header", `missing column(s) ${missing.join(", ")}`);
  const col = (r: string[], c: CsvColumn) => (header.includes(c) ? (r[header.indexOf(c)] ?? "") : "");
  const fuels: Record<string, unknown>[] = [];
  const pricesOf = new Map<string, Record<string, unknown>[]>();
  rows.slice(1).forEach((r, idx) => {
    const where = `row ${idx + 2}`;
    const record = col(r, "record").trim();
    const name = col(r, "fuel");
    if (record === "fuel") {
      const blendBasis = col(r, "blendBasis").trim();
      const prices: Record<string, unknown>[] = [];
      const f = {
        name,
        kind: col(r, "kind").trim(),
        definition: col(r, "definition").trim() === "" ? null : csvJson(where, "definition", col(r, "definition")),
        blend:
          blendBasis === "" && col(r, "blendComponents").trim() === ""
            ? null
            : { basis: blendBasis, components: csvJson(where, "blendComponents", col(r, "blendComponents")) },
        densityKgPerM3: csvNumber(where, "densityKgPerM3", col(r, "densityKgPerM3")),
        biogenicCarbonShare: csvNumber(where, "biogenicCarbonShare", col(r, "biogenicCarbonShare")),
        upstreamCo2e_kg_per_GJ: csvNumber(where, "upstreamCo2e_kg_per_GJ", col(r, "upstreamCo2e_kg_per_GJ")),
        notes: col(r, "notes"),
        source: col(r, "source"),
        isDemo: csvBool(where, "isDemo", col(r, "isDemo")),
        prices,
      };
      if (pricesOf.has(name)) throw new InputError(where, `fuel "${name}" appears twice`);
      pricesOf.set(name, prices);
      fuels.push(f);
    } else if (record === "price") {
      const prices = pricesOf.get(name);
      if (!prices) throw new InputError(where, `price for "${name}" comes before (or without) its fuel record`);
      const amount = csvNumber(where, "amount", col(r, "amount"));
      if (amount === null) throw new InputError(where, "amount: required");
      prices.push({
        amount,
        currency: col(r, "currency"),
        unit: col(r, "unit").trim(),
        energyBasis: col(r, "energyBasis").trim() || null,
        meteringReference: col(r, "meteringReference").trim() || null,
        transportAdder: csvNumber(where, "transportAdder", col(r, "transportAdder")) ?? 0,
        handlingAdder: csvNumber(where, "handlingAdder", col(r, "handlingAdder")) ?? 0,
        validFrom: col(r, "validFrom").trim(),
        sourceNote: col(r, "sourceNote"),
        supplier: col(r, "supplier"),
        isInvented: csvBool(where, "isInvented", col(r, "isInvented")),
      });
    } else {
      throw new InputError(where, `record must be "fuel" or "price", not "${record}"`);
    }
  });
  const doc = libraryDocumentSchema.safeParse({ format: LIBRARY_FORMAT, version: LIBRARY_FORMAT_VERSION, fuels });
  if (!doc.success) {
    const [k, v] = Object.entries(fieldErrors(doc.error))[0];
    throw new InputError(k, v);
  }
  return doc.data;
}

const refused = (where: string, detail: string) =>
  problem("invalid", `Import refused, nothing was stored. ${where}: ${detail}`, { [where]: detail });

/** Parses an import file's text into a library document; a malformed file gives a located problem. */
export function parseLibrary(text: string, format: ImportFormat): Result<LibraryDocument> {
  if (format === "csv") {
    try {
      return ok(libraryFromCsv(text));
    } catch (e) {
      if (e instanceof InputError) return refused(e.field || "file", e.detail);
      throw e;
    }
  }
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (e) {
    if (e instanceof SyntaxError) return refused("file", `not valid JSON (${e.message})`);
    throw e;
  }
  const deep = tooDeepAt(value);
  if (deep !== null) return refused(deep.split(".").slice(0, 3).join("."), `nested more than ${MAX_JSON_DEPTH} levels deep`);
  const doc = libraryDocumentSchema.safeParse(value);
  if (!doc.success) {
    const errs = fieldErrors(doc.error);
    const [k, v] = Object.entries(errs)[0];
    return problem("invalid", `Import refused, nothing was stored. ${k}: ${v}`, errs);
  }
  return ok(doc.data);
}

function prefixErrors(prefix: string, errs: Record<string, string>): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [k, v] of Object.entries(errs)) out[k === "_" ? prefix : `${prefix}.${k}`] = v;
  return out;
}

/** Fuels written per transaction by an import; between chunks other requests get the database. */
export const IMPORT_CHUNK = 50;

/** Lets queued requests (I/O callbacks) run before the next chunk. */
const yieldToOthers = () => new Promise<void>((resolve) => setImmediate(resolve));

/**
 * Imports a parsed library document, all or nothing, in transactions of IMPORT_CHUNK fuels with a
 * pause between them so that other requests are answered while a large file is stored. When a
 * later chunk is refused, the fuels stored by the earlier ones are deleted again (newest first,
 * their quotes with them), so nothing of the file stays.
 */
export async function importLibrary(db: Db, doc: LibraryDocument, opts: ImportOptions = {}): Promise<Result<ImportSummary>> {
  const existing = new Map((await fuelNames(db)).map((f) => [f.name.toLowerCase(), f.id]));
  const idByName = new Map<string, number>(); // lower-case name → id (existing or created here)
  for (const [k, id] of existing) idByName.set(k, id);
  const summary: ImportSummary = { fuelsCreated: 0, pricesCreated: 0, skipped: [] };
  const seen = new Set<string>();
  const pending = doc.fuels.map((f, i) => ({ f, i }));
  const storedIds: number[] = [];
  const nameKeys = await fuelNameKeys(db);
  const undo = async (refusal: Problem): Promise<Problem> => {
    const left = await removeImported(db, storedIds);
    return left.length === 0
      ? refusal
      : {
          ...refusal,
          message: `${refusal.message} (${left.length} fuel(s) stored by this import are now in use and were kept: ${left.join(", ")})`,
        };
  };
  while (pending.length) {
    const chunkIds: number[] = [];
    // Names of this chunk join `nameKeys` only when it is stored.
    const chunkKeys: NameKeys = new Map(nameKeys);
    const chunk = await inTransaction(db, async (tx): Promise<Result<null>> => {
      for (let n = 0; n < IMPORT_CHUNK && pending.length; n++) {
        const idx = pending.findIndex(({ f }) => !f.blend || f.blend.components.every((c) => idByName.has(c.fuel.toLowerCase())));
        if (idx < 0) {
          const { f, i } = pending[0];
          const missing = (f.blend?.components ?? []).map((c) => c.fuel).filter((n) => !idByName.has(n.toLowerCase()));
          return problem(
            "invalid",
            `Import refused, nothing was stored. fuels[${i}] "${f.name}": blend component(s) ${missing.map((m) => `"${m}"`).join(", ")} not found`,
            {
              [`fuels.${i}.blend.components`]: `not found: ${missing.join(", ")}`,
            },
          );
        }
        const { f, i } = pending.splice(idx, 1)[0];
        const where = `fuels.${i}`;
        const key = f.name.trim().toLowerCase();
        if (seen.has(key))
          return problem("invalid", `Import refused, nothing was stored. ${where}: "${f.name}" appears twice in the file`, {
            [`${where}.name`]: "appears twice in the file",
          });
        seen.add(key);
        if (existing.has(key)) {
          if (opts.onExisting === "skip") {
            summary.skipped.push(f.name);
            continue;
          }
          return problem(
            "conflict",
            `Import refused, nothing was stored. A fuel named "${f.name}" already exists (choose "skip existing" to leave it as it is).`,
            {
              [`${where}.name`]: `a fuel named "${f.name}" already exists`,
            },
          );
        }
        const input: Record<string, unknown> = {
          name: f.name,
          notes: f.notes,
          source: f.source,
          isDemo: f.isDemo,
        };
        if (f.kind !== "") input.kind = f.kind;
        if (f.blend) {
          input.blend = {
            basis: f.blend.basis,
            components: f.blend.components.map((c) => ({ fuelId: idByName.get(c.fuel.toLowerCase()), share: c.share })),
          };
        } else {
          input.definition = f.definition ?? undefined;
          input.densityKgPerM3 = f.densityKgPerM3;
          input.biogenicCarbonShare = f.biogenicCarbonShare;
          input.upstreamCo2e_kg_per_GJ = f.upstreamCo2e_kg_per_GJ;
        }
        const created = await createFuelIn(tx, input, chunkKeys);
        if (!created.ok) {
          return problem(
            created.kind,
            `Import refused, nothing was stored. ${where} "${f.name}": ${
              Object.entries(created.fieldErrors)
                .map(([k, v]) => `${k}: ${v}`)
                .join("; ") || created.message
            }`,
            prefixErrors(where, created.fieldErrors),
          );
        }
        idByName.set(key, created.value.id);
        summary.fuelsCreated++;
        chunkIds.push(created.value.id);
        for (const [j, p] of f.prices.entries()) {
          const q = await addPriceQuoteIn(tx, created.value.id, p);
          if (!q.ok) {
            const pw = `${where}.prices.${j}`;
            return problem(
              "invalid",
              `Import refused, nothing was stored. ${pw} (price of "${f.name}"): ${Object.entries(q.fieldErrors)
                .map(([k, v]) => `${k}: ${v}`)
                .join("; ")}`,
              prefixErrors(pw, q.fieldErrors),
            );
          }
          summary.pricesCreated++;
        }
      }
      return ok(null);
    });
    if (!chunk.ok) return undo(chunk);
    storedIds.push(...chunkIds);
    for (const [k, v] of chunkKeys) nameKeys.set(k, v);
    await yieldToOthers();
  }
  return ok(summary);
}

/** Deletes the fuels an import stored (newest first: blends before their components); answers the names it had to keep. */
async function removeImported(db: Db, ids: number[]): Promise<string[]> {
  const kept: string[] = [];
  for (const id of [...ids].reverse()) {
    const r = await inTransaction(db, async (tx): Promise<Result<null>> => {
      const users = await fuelUsers(tx, id);
      if (users.blends.length || users.plants.length || users.scenarios.length) {
        const row = await findFuel(tx, id);
        kept.push(row?.name ?? String(id));
        return ok(null);
      }
      await deleteFuelRow(tx, id);
      return ok(null);
    });
    if (!r.ok) kept.push(String(id));
  }
  return kept;
}

export async function exportLibraryText(db: DbOrTx, format: ImportFormat): Promise<string> {
  let text = "";
  for await (const piece of exportLibraryPieces(db, format)) text += piece;
  return text;
}

/**
 * The export as consecutive pieces of text, one per chunk of fuels, so that a large library
 * streams instead of being held whole; joined they are exactly `libraryToJson` / `libraryToCsv`
 * of `exportLibrary`.
 */
export async function* exportLibraryPieces(db: DbOrTx, format: ImportFormat): AsyncGenerator<string> {
  if (format === "csv") {
    yield writeCsv([[...CSV_COLUMNS]]);
    for await (const fuels of exportLibraryFuels(db)) yield writeCsv(csvRecordsOf(fuels));
    return;
  }
  const head = JSON.stringify({ format: LIBRARY_FORMAT, version: LIBRARY_FORMAT_VERSION }, null, 2).slice(0, -2);
  let first = true;
  for await (const fuels of exportLibraryFuels(db)) {
    if (fuels.length === 0) continue;
    const body = fuels.map((f) => `    ${JSON.stringify(f, null, 2).replaceAll("\n", "\n    ")}`).join(",\n");
    yield first ? `${head},\n  "fuels": [\n${body}` : `,\n${body}`;
    first = false;
  }
  yield first ? `${head},\n  "fuels": []\n}\n` : "\n  ]\n}\n";
}
