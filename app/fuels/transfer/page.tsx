import type { Metadata } from "next";
import Link from "next/link";
import { db } from "@/lib/db/client";
import { countFuelsAndQuotes } from "@/lib/services/lookups";
import { ImportForm } from "../_components/ImportForm";
import { QuoteImportForm } from "../_components/QuoteImportForm";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Import and export" };

export default async function TransferPage() {
  const { fuels, quotes } = await countFuelsAndQuotes(db());
  return (
    <>
      <div className="crumbs">
        <Link href="/fuels">Fuel library</Link> › Import and export
      </div>
      <h1>Import and export</h1>
      <p className="lede">
        Move the fuel library between Stoke installations or into a spreadsheet. A file holds every fuel (with its definition), every blend
        (by component names) and the full price history. Exporting, importing into an empty library and exporting again gives the same file.
      </p>

      <h2>Export</h2>
      <p>
        The library holds {fuels} fuels and {quotes} price quotes.
      </p>
      <p className="row">
        <a className="button" href="/api/fuels/export?format=json" download>
          Download JSON
        </a>
        <a className="button secondary" href="/api/fuels/export?format=csv" download>
          Download CSV
        </a>
      </p>
      <p className="basis">
        CSV: one <code>fuel</code> row per fuel followed by one <code>price</code> row per quote. The definition and the blend components
        are JSON text inside their cells, so that nothing is lost.
      </p>

      <h2>Import</h2>
      <ImportForm />

      <h2>Price quotes in bulk</h2>
      <QuoteImportForm />
    </>
  );
}
