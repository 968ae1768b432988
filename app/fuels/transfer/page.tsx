import type { Metadata } from "next";
import Link from "next/link";
import { db } from "@/lib/db/client";
import { countFuelsAndQuotes } from "@/lib/services/lookups";
import { ImportForm } from "../_components/ImportForm";
import { QuoteImportForm } from "../_components/QuoteImportForm";
import { ExchangeRateForm } from "../_components/ExchangeRateForm";
import { listExchangeRates } from "@/lib/services/exchange-rates";
import { pageActions } from "../../_auth/page-user";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Import and export" };

export default async function TransferPage() {
  const [{ fuels, quotes }, rates, can] = await Promise.all([countFuelsAndQuotes(db()), listExchangeRates(db()), pageActions()]);
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

      {can.importLibrary && (
        <>
          <h2>Import</h2>
          <ImportForm />
        </>
      )}

      {can.importQuotes && (
        <>
          <h2>Price quotes in bulk</h2>
          <QuoteImportForm />
        </>
      )}
      {!can.importLibrary && <p className="note">Importing fuels, quotes and exchange rates is for editors.</p>}

      <h2 id="exchange-rates">Exchange rates</h2>
      <p>
        A quote in another currency than a study&apos;s is converted at the rate in force on the quote&apos;s date, and the study says which
        rate it used. Rates are never overwritten: a new rate from a later date takes over from then on. Files of rates go to{" "}
        <code>POST /api/exchange-rates</code> (CSV or JSON).
      </p>
      {rates.length === 0 ? (
        <p className="muted">No exchange rate stored: quotes are used only in their own currency.</p>
      ) : (
        <div className="table-wrap">
          <table className="data" data-testid="exchange-rates">
            <thead>
              <tr>
                <th>1 unit of</th>
                <th className="num">buys</th>
                <th>units of</th>
                <th>from</th>
                <th>Source</th>
              </tr>
            </thead>
            <tbody>
              {rates.map((r) => (
                <tr key={`${r.fromCurrency}-${r.toCurrency}-${r.validFrom}`}>
                  <td>{r.fromCurrency}</td>
                  <td className="num">{r.rate}</td>
                  <td>{r.toCurrency}</td>
                  <td>{r.validFrom}</td>
                  <td>{r.source || "—"}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      {can.addExchangeRate && <ExchangeRateForm />}
    </>
  );
}
