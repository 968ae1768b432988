"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";

interface Summary {
  fuelsCreated: number;
  pricesCreated: number;
  skipped: string[];
}

export function ImportForm() {
  const router = useRouter();
  const [file, setFile] = useState<File | null>(null);
  const [onExisting, setOnExisting] = useState<"reject" | "skip">("reject");
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<{ message: string; fields: Record<string, string> } | null>(null);
  const [done, setDone] = useState<Summary | null>(null);

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setError(null);
    setDone(null);
    if (!file) {
      setError({ message: "Choose a .json or .csv file first.", fields: {} });
      return;
    }
    const format = file.name.toLowerCase().endsWith(".csv") || file.type.includes("csv") ? "csv" : "json";
    setBusy(true);
    const text = await file.text();
    const res = await fetch(`/api/fuels/import?format=${format}&onExisting=${onExisting}`, {
      method: "POST",
      headers: { "content-type": format === "csv" ? "text/csv" : "application/json" },
      body: text,
    });
    const out = await res.json().catch(() => ({}));
    setBusy(false);
    if (!res.ok) {
      setError({ message: out.error ?? `The server answered ${res.status}.`, fields: out.fieldErrors ?? {} });
      return;
    }
    setDone(out);
    router.refresh();
  }

  return (
    <form className="stack" onSubmit={submit} aria-label="Import a library file">
      <fieldset>
        <legend>Import a library file</legend>
        <div className="field">
          <label htmlFor="f-file">File (.json or .csv, as exported by Stoke)</label>
          <input
            id="f-file"
            type="file"
            accept=".json,.csv,application/json,text/csv"
            onChange={(e) => setFile(e.target.files?.[0] ?? null)}
          />
        </div>
        <div className="field" style={{ marginTop: "0.75rem" }}>
          <span className="label">Fuels whose name is already in the library</span>
          <div className="radio-row">
            <label>
              <input type="radio" name="onExisting" checked={onExisting === "reject"} onChange={() => setOnExisting("reject")} /> stop the
              import
            </label>
            <label>
              <input type="radio" name="onExisting" checked={onExisting === "skip"} onChange={() => setOnExisting("skip")} /> skip them
              (keep the library&apos;s version)
            </label>
          </div>
        </div>
        <p className="hint muted">All or nothing: if any record has an error, nothing is stored and the record and field are named.</p>
        <div className="row">
          <button type="submit" disabled={busy}>
            {busy ? "Importing…" : "Import"}
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
                  <code>{k}</code>: {v}
                </li>
              ))}
            </ul>
          )}
        </div>
      )}
      {done && (
        <p className="form-ok" role="status">
          Imported {done.fuelsCreated} fuels and {done.pricesCreated} price quotes.
          {done.skipped.length > 0 && ` Skipped ${done.skipped.length} already in the library: ${done.skipped.join(", ")}.`}
        </p>
      )}
    </form>
  );
}
