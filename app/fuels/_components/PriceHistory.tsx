"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import type { PriceView } from "@/lib/services/fuel-views";
import { fmtUpTo, money } from "../../_ui/format";
import { ErrorSummary, Field, NumberField, invalid, toNumber, type Errors } from "./fields";
import { METERING_REFERENCE_KEYS, METERING_REFERENCES } from "@/lib/units/metering";

const ENERGY_UNITS = ["MWh", "GJ", "kWh", "MMBtu", "therm"];
const UNIT_OPTIONS: { group: string; units: { value: string; label: string }[] }[] = [
  {
    group: "Energy",
    units: [
      { value: "MWh", label: "MWh" },
      { value: "GJ", label: "GJ" },
      { value: "kWh", label: "kWh" },
      { value: "MMBtu", label: "MMBtu" },
      { value: "therm", label: "therm" },
    ],
  },
  {
    group: "Mass",
    units: [
      { value: "t", label: "tonne (t)" },
      { value: "kg", label: "kg" },
    ],
  },
  {
    group: "Volume",
    units: [
      { value: "m3", label: "m³" },
      { value: "L", label: "litre (L)" },
      { value: "USgal", label: "US gallon" },
    ],
  },
];
const METERING = METERING_REFERENCE_KEYS.map((k) => ({ value: k, label: METERING_REFERENCES[k].label }));

interface Draft {
  amount: string;
  currency: string;
  unit: string;
  energyBasis: string;
  meteringReference: string;
  transportAdder: string;
  handlingAdder: string;
  validFrom: string;
  sourceNote: string;
  supplier: string;
  isInvented: boolean;
}

function today(): string {
  return new Date().toISOString().slice(0, 10);
}

function emptyDraft(currency: string, kind: string): Draft {
  return {
    amount: "",
    currency,
    unit: kind === "gas" ? "MWh" : kind === "liquid" ? "L" : "t",
    energyBasis: kind === "gas" ? "gross" : "",
    meteringReference: "",
    transportAdder: "0",
    handlingAdder: "0",
    validFrom: today(),
    sourceNote: "",
    supplier: "",
    isInvented: false,
  };
}

const PLACED = new Set([
  "amount",
  "currency",
  "unit",
  "energyBasis",
  "meteringReference",
  "transportAdder",
  "handlingAdder",
  "validFrom",
  "sourceNote",
  "supplier",
  "isInvented",
]);

/** `canEdit`: whether the account may add, correct, withdraw and delete quotes (else the history is shown only). */
export function PriceHistory({
  fuelId,
  fuelKind,
  prices,
  canEdit,
}: {
  fuelId: number;
  fuelKind: string;
  prices: PriceView[];
  canEdit: boolean;
}) {
  const router = useRouter();
  const lastCurrency = prices[0]?.quote.currency ?? "EUR";
  const [draft, setDraft] = useState<Draft>(() => emptyDraft(lastCurrency, fuelKind));
  const [editing, setEditing] = useState<number | null>(null);
  const [errors, setErrors] = useState<Errors>({});
  const [message, setMessage] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [formOpen, setFormOpen] = useState(prices.length === 0);
  /** Plausibility warnings the server raised; storing then needs a confirmation. */
  const [warnings, setWarnings] = useState<string[] | null>(null);

  const isEnergy = ENERGY_UNITS.includes(draft.unit);
  const showMetering = fuelKind === "gas" && draft.unit === "m3";
  const set = (k: keyof Draft) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) => {
    const value = e.target.type === "checkbox" ? (e.target as HTMLInputElement).checked : e.target.value;
    setDraft((d) => ({ ...d, [k]: value }));
  };

  function startEdit(p: PriceView) {
    const q = p.quote;
    setEditing(q.id);
    setFormOpen(true);
    setErrors({});
    setMessage(null);
    setSaved(null);
    setDraft({
      amount: String(q.amount),
      currency: q.currency,
      unit: q.unit,
      energyBasis: q.energyBasis ?? "",
      meteringReference: q.meteringReference ?? "",
      transportAdder: String(q.transportAdder),
      handlingAdder: String(q.handlingAdder),
      validFrom: q.validFrom,
      sourceNote: q.sourceNote,
      supplier: q.supplier,
      isInvented: q.isInvented,
    });
  }

  function cancel() {
    setEditing(null);
    setErrors({});
    setMessage(null);
    setDraft(emptyDraft(lastCurrency, fuelKind));
    setFormOpen(prices.length === 0);
  }

  async function submit(e: React.FormEvent | null, confirmImplausible = false) {
    e?.preventDefault();
    setBusy(true);
    setSaved(null);
    const body = {
      amount: toNumber(draft.amount),
      currency: draft.currency,
      unit: draft.unit,
      energyBasis: isEnergy ? draft.energyBasis || null : null,
      meteringReference: showMetering ? draft.meteringReference || null : null,
      transportAdder: toNumber(draft.transportAdder) ?? 0,
      handlingAdder: toNumber(draft.handlingAdder) ?? 0,
      validFrom: draft.validFrom,
      sourceNote: draft.sourceNote,
      supplier: draft.supplier,
      isInvented: draft.isInvented,
      ...(confirmImplausible ? { confirmImplausible: true } : {}),
    };
    const url = editing === null ? `/api/fuels/${fuelId}/prices` : `/api/fuels/${fuelId}/prices/${editing}`;
    const res = await fetch(url, {
      method: editing === null ? "POST" : "PUT",
      headers: { "content-type": "application/json" },
      body: JSON.stringify(body),
    });
    const out = await res.json().catch(() => ({}));
    setBusy(false);
    if (!res.ok) {
      setErrors(out.fieldErrors ?? {});
      setMessage(out.error ?? `The server answered ${res.status}.`);
      setWarnings(Array.isArray(out.warnings) ? out.warnings : null);
      return;
    }
    setErrors({});
    setMessage(null);
    setWarnings(null);
    const noted = Array.isArray(out.warnings) && out.warnings.length ? ` Note: ${out.warnings.join("; ")}.` : "";
    setSaved(
      `${editing === null ? "Quote added." : `Correction stored as quote #${out.id}; quote #${editing} stays on record, marked superseded.`}${noted}`,
    );
    setEditing(null);
    setDraft(emptyDraft(draft.currency, fuelKind));
    setFormOpen(false);
    router.refresh();
  }

  async function withdraw(p: PriceView) {
    if (
      !window.confirm(
        `Withdraw the quote of ${p.quote.validFrom}? It stays on record but prices nothing; studies that chose it fall back to their rule.`,
      )
    )
      return;
    const res = await fetch(`/api/fuels/${fuelId}/prices/${p.quote.id}/withdraw`, { method: "POST" });
    const out = await res.json().catch(() => ({}));
    if (res.ok) {
      const affected: { name: string; scenario: string }[] = out.affectedStudies ?? [];
      setSaved(
        `Quote #${p.quote.id} withdrawn.${affected.length ? ` Now priced by their rule: ${affected.map((a) => `${a.name} (${a.scenario})`).join(", ")}.` : ""}`,
      );
      router.refresh();
    } else setMessage(out.error ?? `Could not withdraw (HTTP ${res.status}).`);
  }

  async function remove(p: PriceView) {
    if (!window.confirm(`Delete the quote of ${p.quote.validFrom} (${fmtUpTo(p.quote.amount, 4)} ${p.quote.currency}/${p.unitLabel})?`))
      return;
    const res = await fetch(`/api/fuels/${fuelId}/prices/${p.quote.id}`, { method: "DELETE" });
    if (res.ok) {
      setSaved("Quote deleted.");
      router.refresh();
    } else {
      const out = await res.json().catch(() => ({}));
      setMessage(out.error ?? `Could not delete (HTTP ${res.status}).`);
    }
  }

  const anyInvented = prices.some((p) => p.quote.isInvented);
  return (
    <>
      <p className="basis">
        Delivered cost = commodity + transport + handling, converted with this fuel&apos;s own heating values (25 °C combustion reference)
        and density. Newest first; the quote in force today is marked. Currency as quoted. A correction adds a new version and keeps the old
        one (marked superseded); a withdrawn quote stays on record but prices nothing; a quote an issued study revision used cannot be
        deleted. A price outside the plausible range for its unit asks for a confirmation.
      </p>
      {anyInvented && (
        <p className="note warn">
          <span className="badge invented">invented</span> quotes are demo figures, not market prices.
        </p>
      )}
      {saved && (
        <p className="form-ok" role="status">
          {saved}
        </p>
      )}
      {prices.length > 0 ? (
        <div className="table-wrap">
          <table>
            <thead>
              <tr>
                <th>Valid from</th>
                <th>Quoted</th>
                <th className="num">
                  Delivered
                  <span className="unit block">per MWh gross (HHV)</span>
                </th>
                <th className="num">
                  Delivered
                  <span className="unit block">per MWh net (LHV)</span>
                </th>
                <th className="num">
                  Delivered
                  <span className="unit block">per kg</span>
                </th>
                <th>Source</th>
                {canEdit && (
                  <th className="no-print">
                    <span className="sr-only">Actions</span>
                  </th>
                )}
              </tr>
            </thead>
            <tbody>
              {prices.map((p) => {
                const q = p.quote;
                const n = p.normalised;
                return (
                  <tr key={q.id}>
                    <td style={{ whiteSpace: "nowrap" }}>
                      {q.validFrom}
                      {p.current && (
                        <>
                          <br />
                          <span className="badge current">in force</span>
                        </>
                      )}
                      {p.supersededBy !== null && (
                        <>
                          <br />
                          <span className="badge">superseded by #{p.supersededBy}</span>
                        </>
                      )}
                      {p.withdrawn && (
                        <>
                          <br />
                          <span className="badge">withdrawn {q.withdrawnAt?.slice(0, 10)}</span>
                        </>
                      )}
                      <br />
                      <small className="muted">
                        #{q.id}
                        {q.supersedesId !== null ? `, corrects #${q.supersedesId}` : ""}
                      </small>
                    </td>
                    <td>
                      <span style={{ whiteSpace: "nowrap" }}>
                        {fmtUpTo(q.amount, 4)} {q.currency} <span className="unit">per {p.unitLabel}</span>
                      </span>
                      {q.transportAdder + q.handlingAdder > 0 && (
                        <small className="muted" style={{ display: "block" }}>
                          + transport {fmtUpTo(q.transportAdder, 4)} + handling {fmtUpTo(q.handlingAdder, 4)}
                        </small>
                      )}
                    </td>
                    {n ? (
                      <>
                        <td className="num">{money(n.perMWh_gross, q.currency)}</td>
                        <td className="num">{money(n.perMWh_net, q.currency)}</td>
                        <td className="num">{money(n.perKg, q.currency, 4)}</td>
                      </>
                    ) : (
                      <td colSpan={3} className="field-error">
                        cannot normalise: {p.error}
                      </td>
                    )}
                    <td style={{ minWidth: "12rem" }}>
                      <small>
                        {q.supplier && <b>{q.supplier}. </b>}
                        {q.isInvented && <span className="badge invented">invented</span>} {q.sourceNote}
                      </small>
                    </td>
                    {canEdit && (
                      <td className="no-print" style={{ whiteSpace: "nowrap" }}>
                        {p.supersededBy === null && !p.withdrawn && (
                          <>
                            <button type="button" className="secondary small" onClick={() => startEdit(p)}>
                              Correct
                            </button>{" "}
                            <button type="button" className="secondary small" onClick={() => withdraw(p)}>
                              Withdraw
                            </button>{" "}
                          </>
                        )}
                        <button type="button" className="danger small" onClick={() => remove(p)}>
                          Delete
                        </button>
                      </td>
                    )}
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      ) : (
        <p className="muted">No price quotes yet.</p>
      )}
      {prices.length > 0 && prices.every((p) => !p.current) && (
        <p className="note">No quote is in force today (all are dated in the future).</p>
      )}

      {!canEdit ? null : !formOpen ? (
        <p className="no-print" style={{ marginTop: "0.75rem" }}>
          <button type="button" onClick={() => setFormOpen(true)}>
            Add a price quote
          </button>
        </p>
      ) : (
        <form className="stack no-print" onSubmit={(e) => submit(e)} noValidate style={{ marginTop: "1rem" }} aria-label="Price quote">
          <fieldset>
            <legend>{editing === null ? "Add a price quote" : "Correct a price quote"}</legend>
            <ErrorSummary message={message} errors={errors} placed={(k) => PLACED.has(k)} />
            {warnings && warnings.length > 0 && (
              <div className="note warn" role="alert" data-testid="implausible-warning">
                {warnings.map((w) => (
                  <p key={w}>{w}</p>
                ))}
                <button type="button" className="secondary" disabled={busy} onClick={() => submit(null, true)}>
                  The figure is right: store it
                </button>
              </div>
            )}
            <div className="row" style={{ marginTop: "0.5rem" }}>
              <NumberField
                label="Price"
                name="amount"
                errors={errors}
                hint="commodity price per unit"
                value={draft.amount}
                onChange={set("amount")}
              />
              <Field
                label="Currency"
                name="currency"
                errors={errors}
                hint="ISO 4217 code, e.g. EUR; converted into a study's currency with the exchange-rate table"
              >
                <input
                  id="f-currency"
                  name="currency"
                  value={draft.currency}
                  onChange={set("currency")}
                  maxLength={3}
                  style={{ textTransform: "uppercase" }}
                  {...invalid(errors, "currency")}
                />
              </Field>
              <Field label="Per unit" name="unit" errors={errors}>
                <select id="f-unit" name="unit" value={draft.unit} onChange={set("unit")} {...invalid(errors, "unit")}>
                  {UNIT_OPTIONS.map((g) => (
                    <optgroup key={g.group} label={g.group}>
                      {g.units.map((u) => (
                        <option key={u.value} value={u.value}>
                          {u.label}
                        </option>
                      ))}
                    </optgroup>
                  ))}
                </select>
              </Field>
              {isEnergy && (
                <Field label="Energy basis" name="energyBasis" errors={errors}>
                  <select
                    id="f-energyBasis"
                    name="energyBasis"
                    value={draft.energyBasis}
                    onChange={set("energyBasis")}
                    {...invalid(errors, "energyBasis")}
                  >
                    <option value="">— choose —</option>
                    <option value="gross">gross (HHV)</option>
                    <option value="net">net (LHV)</option>
                  </select>
                </Field>
              )}
              {showMetering && (
                <Field label="Metering reference" name="meteringReference" errors={errors} hint="at 101.325 kPa">
                  <select
                    id="f-meteringReference"
                    name="meteringReference"
                    value={draft.meteringReference}
                    onChange={set("meteringReference")}
                    {...invalid(errors, "meteringReference")}
                  >
                    <option value="">— choose —</option>
                    {METERING.map((m) => (
                      <option key={m.value} value={m.value}>
                        {m.label}
                      </option>
                    ))}
                  </select>
                </Field>
              )}
            </div>
            <div className="row">
              <NumberField
                label="Transport / network adder"
                name="transportAdder"
                errors={errors}
                hint="same currency and unit as the price"
                value={draft.transportAdder}
                onChange={set("transportAdder")}
              />
              <NumberField
                label="Handling / storage adder"
                name="handlingAdder"
                errors={errors}
                hint="same currency and unit as the price"
                value={draft.handlingAdder}
                onChange={set("handlingAdder")}
              />
              <Field label="Valid from" name="validFrom" errors={errors}>
                <input
                  id="f-validFrom"
                  name="validFrom"
                  type="date"
                  value={draft.validFrom}
                  onChange={set("validFrom")}
                  {...invalid(errors, "validFrom")}
                />
              </Field>
            </div>
            <Field label="Supplier" name="supplier" errors={errors} hint="who offers the price (quotes are compared per supplier)">
              <input id="f-supplier" name="supplier" value={draft.supplier} onChange={set("supplier")} {...invalid(errors, "supplier")} />
            </Field>
            <Field label="Source" name="sourceNote" errors={errors} hint="offer reference, index …">
              <input
                id="f-sourceNote"
                name="sourceNote"
                value={draft.sourceNote}
                onChange={set("sourceNote")}
                {...invalid(errors, "sourceNote")}
              />
            </Field>
            <label style={{ display: "inline-flex", gap: "0.4rem", marginTop: "0.5rem", fontWeight: 400 }}>
              <input type="checkbox" name="isInvented" checked={draft.isInvented} onChange={set("isInvented")} /> Example figure, not a real
              quote (shown as “invented”)
            </label>
            <div className="row" style={{ marginTop: "0.75rem" }}>
              <button type="submit" disabled={busy}>
                {busy ? "Saving…" : editing === null ? "Add quote" : "Save correction"}
              </button>
              <button type="button" className="secondary" onClick={cancel}>
                Cancel
              </button>
            </div>
          </fieldset>
        </form>
      )}
    </>
  );
}
