"use client";

/**
 * Bulk price quotes for fuels already in the library: choose a CSV or JSON file, see what would be
 * added (a preview stores nothing), then import all of it or nothing. Errors name the row and column.
 */
import { useRouter } from "next/navigation";
import { useState } from "react";
import { capitalised, labelOfPath } from "@/lib/schemas/labels";

interface Row {
  where: string;
  fuelName: string;
  quote: { amount: number; currency: string; unit: string; energyBasis?: string | null; validFrom?: string; supplier?: string | null };
  warnings: string[];
}

interface Answer {
  preview: boolean;
  added: Row[];
}

export function QuoteImportForm() {
  const router = useRouter();
  const [file, setFile] = useState<File | null>(null);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<{ message: string; fields: Record<string, string> } | null>(null);
  const [preview, setPreview] = useState<Answer | null>(null);
  const [done, setDone] = useState<Answer | null>(null);
  const [confirm, setConfirm] = useState(false);

  async function send(previewOnly: boolean) {
    setError(null);
    setDone(null);
    if (!file) {
      setError({ message: "Choose a .csv or .json file of quotes first.", fields: {} });
      return;
    }
    const format = file.name.toLowerCase().endsWith(".csv") || file.type.includes("csv") ? "csv" : "json";
    setBusy(true);
    const q = `format=${format}${previewOnly ? "&preview=1" : ""}${confirm ? "&confirmImplausible=1" : ""}`;
    const res = await fetch(`/api/fuels/quotes/import?${q}`, {
      method: "POST",
      headers: { "content-type": format === "csv" ? "text/csv" : "application/json" },
      body: await file.text(),
    });
    const out = await res.json().catch(() => ({}));
    setBusy(false);
    if (!res.ok) {
      setPreview(null);
      setError({ message: out.error ?? `The server answered ${res.status}.`, fields: out.fieldErrors ?? {} });
      return;
    }
    if (previewOnly) setPreview(out);
    else {
      setPreview(null);
      setDone(out);
      router.refresh();
    }
  }

  const warned = (preview?.added ?? []).some((r) => r.warnings.length > 0);
  return (
    <form
      className="stack"
      onSubmit={(e) => {
        e.preventDefault();
        void send(true);
      }}
      aria-label="Import price quotes"
    >
      <fieldset>
        <legend>Import price quotes for fuels in the library</legend>
        <div className="field">
          <label htmlFor="f-quote-file">File (.csv or .json): columns fuel, amount, currency, unit, energyBasis, validFrom, …</label>
          <input
            id="f-quote-file"
            type="file"
            accept=".json,.csv,application/json,text/csv"
            onChange={(e) => {
              setFile(e.target.files?.[0] ?? null);
              setPreview(null);
            }}
          />
        </div>
        <p className="hint muted">
          Fuels are matched by name (any letter case). A correction of an existing quote is entered on the fuel&apos;s sheet, where the old
          version stays visible. All or nothing: if any row has an error, nothing is stored and the row and column are named.
        </p>
        <div className="row">
          <button type="submit" className="secondary" disabled={busy}>
            {busy ? "Reading…" : "Preview"}
          </button>
          <button type="button" disabled={busy || !preview || (warned && !confirm)} onClick={() => void send(false)}>
            Import {preview ? `${preview.added.length} quotes` : ""}
          </button>
        </div>
      </fieldset>
      {error && (
        <div className="form-errors" role="alert">
          <strong>{error.message}</strong>
          {Object.keys(error.fields).length > 0 && (
            <ul>
              {Object.entries(error.fields).map(([k, v]) => (
                <li key={k}>
                  <b>{/^row \d+|^item \d+/.test(k) ? k : capitalised(labelOfPath(k))}:</b> {v}
                </li>
              ))}
            </ul>
          )}
        </div>
      )}
      {preview && (
        <div data-testid="quote-preview">
          <p className="note">Nothing stored yet. These quotes would be added:</p>
          <div className="table-wrap">
            <table className="data">
              <thead>
                <tr>
                  <th>Row</th>
                  <th>Fuel</th>
                  <th className="num">Amount</th>
                  <th>Unit</th>
                  <th>Valid from</th>
                  <th>Supplier</th>
                  <th>Warnings</th>
                </tr>
              </thead>
              <tbody>
                {preview.added.map((r) => (
                  <tr key={r.where}>
                    <td>{r.where}</td>
                    <td>{r.fuelName}</td>
                    <td className="num">{r.quote.amount}</td>
                    <td>
                      {r.quote.currency}/{r.quote.unit}
                      {r.quote.energyBasis ? ` ${r.quote.energyBasis}` : ""}
                    </td>
                    <td>{r.quote.validFrom ?? "today"}</td>
                    <td>{r.quote.supplier ?? "—"}</td>
                    <td>{r.warnings.join("; ") || "—"}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          {warned && (
            <label>
              <input type="checkbox" checked={confirm} onChange={(e) => setConfirm(e.target.checked)} /> The prices marked implausible are
              right: import them anyway
            </label>
          )}
        </div>
      )}
      {done && (
        <p className="form-ok" role="status">
          Imported {done.added.length} price quotes.
        </p>
      )}
    </form>
  );
}
