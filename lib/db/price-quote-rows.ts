/** Price-quote rows: the queries, and one mapper per direction between a row and a quote. */
import type { Fuel, PriceQuote } from "./generated/client";
import type { DbOrTx, Tx } from "./client";
import type { PriceQuoteInputParsed } from "../schemas/library";
import { inChunks } from "./chunks";

export type PriceQuoteRow = PriceQuote;

/** Newest valid-from first, then newest entered. */
export const QUOTES_NEWEST_FIRST = [{ validFrom: "desc" as const }, { createdAt: "desc" as const }, { id: "desc" as const }];

/* ------------------------------------------------------------------ row → domain */

/** The API/JSON form of a quote. */
export function quoteJson(q: PriceQuote) {
  return {
    id: q.id,
    fuelId: q.fuelId,
    amount: q.amount,
    currency: q.currency,
    unit: q.unit,
    energyBasis: q.energyBasis,
    meteringReference: q.meteringReference,
    transportAdder: q.transportAdder,
    handlingAdder: q.handlingAdder,
    validFrom: q.validFrom.toISOString().slice(0, 10),
    sourceNote: q.sourceNote,
    supplier: q.supplier,
    isInvented: q.isInvented,
    createdAt: q.createdAt.toISOString(),
    supersedesId: q.supersedesId,
    withdrawnAt: q.withdrawnAt ? q.withdrawnAt.toISOString() : null,
  };
}
export type QuoteJson = ReturnType<typeof quoteJson>;

/* ------------------------------------------------------------------ domain → row */

export function quoteColumns(q: PriceQuoteInputParsed) {
  return {
    amount: q.amount,
    currency: q.currency,
    unit: q.unit,
    energyBasis: q.energyBasis ?? null,
    meteringReference: q.meteringReference ?? null,
    transportAdder: q.transportAdder,
    handlingAdder: q.handlingAdder,
    validFrom: new Date(`${q.validFrom}T00:00:00Z`),
    sourceNote: q.sourceNote,
    supplier: q.supplier,
    isInvented: q.isInvented,
  };
}

/* ------------------------------------------------------------------ queries */

/** Quotes of a fuel, newest valid-from first (then newest entered). */
export function listQuotes(db: DbOrTx, fuelId: number): Promise<PriceQuote[]> {
  return db.priceQuote.findMany({ where: { fuelId }, orderBy: QUOTES_NEWEST_FIRST });
}

export function findQuote(db: DbOrTx, id: number): Promise<PriceQuote | null> {
  return db.priceQuote.findUnique({ where: { id } });
}

export function findQuoteWithFuel(db: DbOrTx, id: number): Promise<(PriceQuote & { fuel: Fuel }) | null> {
  return db.priceQuote.findUnique({ where: { id }, include: { fuel: true } });
}

export function findQuotes(db: DbOrTx, ids: number[]): Promise<PriceQuote[]> {
  return inChunks(ids, (chunk) => db.priceQuote.findMany({ where: { id: { in: chunk } } }));
}

export function insertQuote(tx: DbOrTx, fuelId: number, q: PriceQuoteInputParsed): Promise<PriceQuote> {
  return tx.priceQuote.create({ data: { ...quoteColumns(q), fuelId } });
}

export function updateQuoteRow(db: DbOrTx, id: number, q: PriceQuoteInputParsed): Promise<PriceQuote> {
  return db.priceQuote.update({ where: { id }, data: quoteColumns(q) });
}

export function deleteQuoteRow(db: DbOrTx | Tx, id: number): Promise<PriceQuote> {
  return db.priceQuote.delete({ where: { id } });
}

/** Marks a quote withdrawn (it stays on record). */
export function withdrawQuoteRow(db: DbOrTx, id: number, at: Date): Promise<PriceQuote> {
  return db.priceQuote.update({ where: { id }, data: { withdrawnAt: at } });
}

/** Adds a correction: a new version that supersedes `supersedesId`. */
export function insertQuoteVersion(tx: DbOrTx, fuelId: number, supersedesId: number, q: PriceQuoteInputParsed): Promise<PriceQuote> {
  return tx.priceQuote.create({ data: { ...quoteColumns(q), fuelId, supersedesId } });
}

/** The versions that supersede a quote (normally at most one). */
export function quoteSuccessors(db: DbOrTx, id: number): Promise<PriceQuote[]> {
  return db.priceQuote.findMany({ where: { supersedesId: id }, orderBy: { id: "asc" } });
}

/** The issued revisions that used a quote: revision number, study id and name. */
export function revisionsUsingQuote(db: DbOrTx, quoteId: number) {
  return db.revisionQuote.findMany({
    where: { quoteId },
    select: { revision: { select: { number: true, studyId: true, study: { select: { name: true } } } } },
  });
}

/** The revisions that used any quote of a fuel. */
export function revisionsUsingFuelQuotes(db: DbOrTx, fuelId: number) {
  return db.revisionQuote.findMany({
    where: { quote: { fuelId } },
    select: { quoteId: true, revision: { select: { number: true, study: { select: { name: true } } } } },
  });
}

/** The live studies whose scenarios chose a quote: study id and name, scenario name. */
export function scenariosChoosingQuote(db: DbOrTx, quoteId: number) {
  return db.scenario.findMany({ where: { priceQuoteId: quoteId }, select: { name: true, study: { select: { id: true, name: true } } } });
}
