"use client";

import Link from "next/link";
import { saveAndOpen } from "@/app/_ui/save";
import { useRouter } from "next/navigation";
import { useMemo, useState } from "react";
import { ErrorSummary, Field, NumberField, FieldError, invalid, toNumber, type Errors } from "./fields";
import {
  COMPOSITION_SCALES,
  NORMALISE_TOLERANCE_PERCENT,
  checkSum,
  normaliseComposition,
  scaleFactor,
  type CompositionScale,
} from "@/lib/schemas/composition-entry";

export interface FuelFormOptions {
  species: { key: string; name: string }[];
  compounds: { key: string; name: string; role: string }[];
  storedFuels: { id: number; name: string; kind: string }[];
}

/** The fuel as the API returns it (GET /api/fuels/{id}), for editing. */
export interface FuelFormInitial {
  id: number;
  name: string;
  kind: string;
  definition: Record<string, unknown>;
  blend: { basis: string | null; components: { fuelId: number; share: number }[] } | null;
  densityKgPerM3: number | null;
  biogenicCarbonShare: number;
  upstreamCo2e_kg_per_GJ: number | null;
  notes: string;
  source: string;
  isDemo: boolean;
}

type Kind = "gas" | "liquid" | "solid";
type Form = "composition" | "compound" | "ultimate" | "blend";
const FORMS_FOR: Record<Kind, { form: Form; label: string }[]> = {
  gas: [
    { form: "composition", label: "Composition (mole fractions)" },
    { form: "blend", label: "Blend of stored gases" },
  ],
  liquid: [
    { form: "compound", label: "Pure compound" },
    { form: "ultimate", label: "Ultimate analysis" },
    { form: "blend", label: "Blend of stored liquids" },
  ],
  solid: [
    { form: "ultimate", label: "Ultimate analysis" },
    { form: "blend", label: "Blend of stored solids" },
  ],
};
const ULTIMATE_KEYS = ["C", "H", "O", "N", "S", "moisture", "ash"] as const;
type UltKey = (typeof ULTIMATE_KEYS)[number];

interface Row {
  key: string;
  value: string;
}

function str(v: unknown): string {
  return v === null || v === undefined ? "" : String(v);
}

function sumOf(values: string[]): number | null {
  let s = 0;
  for (const v of values) {
    if (v.trim() === "") continue;
    const n = toNumber(v);
    if (typeof n !== "number") return null;
    s += n;
  }
  return s;
}

/** The total of a composition on its scale, with the offer to normalise or to switch scale. */
function CompositionSum({
  values,
  scale,
  onNormalise,
  onSwitchScale,
}: {
  values: string[];
  scale: CompositionScale;
  onNormalise: () => void;
  onSwitchScale: (s: CompositionScale) => void;
}) {
  const s = sumOf(values);
  const unit = scale === "percent" ? "mol %" : "mole fractions";
  if (values.every((v) => v.trim() === "")) return <span className="sum muted">Sum of {unit}: –</span>;
  if (s === null) return <span className="sum off">Sum: not all entries are numbers</span>;
  const nums = values.map((v) => toNumber(v)).filter((v): v is number => typeof v === "number");
  const c = checkSum(nums, scale);
  const target = scale === "percent" ? "100" : "1";
  return (
    <span className={`sum${c.exact ? "" : " off"}`} aria-live="polite">
      Sum of {unit}: {scale === "percent" ? s.toFixed(3) : s.toFixed(4)} {c.exact ? "✓" : `— must be ${target}`}
      {c.normalisable && (
        <button type="button" className="secondary small" onClick={onNormalise}>
          Normalise to {target} (residual {(100 - c.totalPercent).toFixed(3)} mol %)
        </button>
      )}
      {c.looksLike && !c.exact && (
        <button type="button" className="secondary small" onClick={() => onSwitchScale(c.looksLike as CompositionScale)}>
          These look like {c.looksLike === "percent" ? "mol %" : "fractions"}: read them so
        </button>
      )}
    </span>
  );
}

function Sum({ values, what }: { values: string[]; what: string }) {
  const s = sumOf(values);
  if (values.every((v) => v.trim() === "")) return <span className="sum muted">Sum of {what}: –</span>;
  if (s === null) return <span className="sum off">Sum: not all entries are numbers</span>;
  const off = Math.abs(s - 1) > 0.001;
  return (
    <span className={`sum${off ? " off" : ""}`} aria-live="polite">
      Sum of {what}: {s.toFixed(4)} {off ? "— must be 1" : "✓"}
    </span>
  );
}

export function FuelForm({ options, initial }: { options: FuelFormOptions; initial?: FuelFormInitial }) {
  const router = useRouter();
  const def = initial?.definition ?? {};
  const initialForm: Form = initial
    ? initial.blend
      ? "blend"
      : "composition" in def
        ? "composition"
        : "compound" in def
          ? "compound"
          : "ultimate"
    : "composition";

  const [name, setName] = useState(initial?.name ?? "");
  const [kind, setKind] = useState<Kind>((initial?.kind as Kind) ?? "gas");
  const [form, setForm] = useState<Form>(initialForm);
  const [rows, setRows] = useState<Row[]>(() =>
    "composition" in def
      ? Object.entries(def.composition as Record<string, number>).map(([key, v]) => ({ key, value: String(v) }))
      : [
          { key: "CH4", value: "" },
          { key: "", value: "" },
        ],
  );
  const [compound, setCompound] = useState<string>("compound" in def ? String(def.compound) : (options.compounds[0]?.key ?? ""));
  const ult = ("ultimate" in def ? def.ultimate : {}) as Partial<Record<UltKey, number>>;
  const [ultimate, setUltimate] = useState<Record<UltKey, string>>(() => {
    const o = {} as Record<UltKey, string>;
    for (const k of ULTIMATE_KEYS) o[k] = str(ult[k]);
    return o;
  });
  const [hvMode, setHvMode] = useState<"hhv" | "lhv" | "correlation">(
    "hhv_MJ_per_kg" in def ? "hhv" : "correlation" in def ? "correlation" : "lhv",
  );
  const [hvValue, setHvValue] = useState(str(def.hhv_MJ_per_kg ?? def.lhv_MJ_per_kg));
  const [basis, setBasis] = useState<string>(initial?.blend?.basis ?? "volume");
  const [blendRows, setBlendRows] = useState<{ fuelId: string; share: string }[]>(() =>
    initial?.blend
      ? initial.blend.components.map((c) => ({ fuelId: String(c.fuelId), share: String(c.share) }))
      : [
          { fuelId: "", share: "" },
          { fuelId: "", share: "" },
        ],
  );
  const [density, setDensity] = useState(str(initial?.densityKgPerM3));
  const [biogenic, setBiogenic] = useState(initial ? String(initial.biogenicCarbonShare) : "0");
  const [upstream, setUpstream] = useState(str(initial?.upstreamCo2e_kg_per_GJ));
  const [notes, setNotes] = useState(initial?.notes ?? "");
  const [scale, setScale] = useState<CompositionScale>("fraction");
  const [source, setSource] = useState(initial?.source ?? "");
  const [errors, setErrors] = useState<Errors>({});
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const candidates = useMemo(
    () => options.storedFuels.filter((f) => f.kind === kind && f.id !== initial?.id),
    [options.storedFuels, kind, initial?.id],
  );
  const isBlend = form === "blend";

  function changeKind(k: Kind) {
    setKind(k);
    if (!FORMS_FOR[k].some((f) => f.form === form)) setForm(FORMS_FOR[k][0].form);
  }

  function placed(key: string): boolean {
    if (["name", "kind", "densityKgPerM3", "biogenicCarbonShare", "upstreamCo2e_kg_per_GJ", "notes", "source", "definition"].includes(key))
      return true;
    if (key === "definition.composition" || key.startsWith("definition.composition.")) return form === "composition";
    if (key === "definition.compound") return form === "compound";
    if (
      key === "definition.ultimate" ||
      key.startsWith("definition.ultimate.") ||
      /^definition\.(hhv|lhv)_MJ_per_kg$|^definition\.correlation$/.test(key)
    )
      return form === "ultimate";
    if (key === "blend" || key.startsWith("blend.")) return isBlend;
    return false;
  }

  function buildBody(): { body: Record<string, unknown> } | { local: Errors } {
    const body: Record<string, unknown> = { name, kind, notes, source };
    if (initial) body.isDemo = initial.isDemo;
    if (isBlend) {
      body.blend = {
        basis,
        components: blendRows
          .filter((r) => r.fuelId !== "" || r.share.trim() !== "")
          .map((r) => ({ fuelId: r.fuelId === "" ? null : Number(r.fuelId), share: toNumber(r.share) })),
      };
      return { body };
    }
    if (form === "composition") {
      const local: Errors = {};
      const comp: Record<string, unknown> = {};
      rows.forEach((r) => {
        if (r.key === "" && r.value.trim() === "") return;
        if (r.key === "") {
          local["definition.composition"] = "choose a component for every row with a value";
          return;
        }
        if (r.key in comp) local[`definition.composition.${r.key}`] = "listed twice; give each component once";
        const v = toNumber(r.value);
        comp[r.key] = typeof v === "number" ? v / scaleFactor(scale) : v;
      });
      if (Object.keys(local).length) return { local };
      body.definition = { composition: comp };
    } else if (form === "compound") {
      body.definition = { compound, phase: "liquid" };
    } else {
      const u: Record<string, unknown> = {};
      for (const k of ULTIMATE_KEYS) {
        const v = toNumber(ultimate[k]);
        if (v !== null) u[k] = v;
        else if (k === "C" || k === "H") u[k] = null;
      }
      const d: Record<string, unknown> = { ultimate: u, kind };
      if (hvMode === "correlation") d.correlation = "channiwala-parikh-2002";
      else d[hvMode === "hhv" ? "hhv_MJ_per_kg" : "lhv_MJ_per_kg"] = toNumber(hvValue);
      body.definition = d;
    }
    if (kind !== "gas") body.densityKgPerM3 = toNumber(density);
    body.biogenicCarbonShare = toNumber(biogenic) ?? 0;
    body.upstreamCo2e_kg_per_GJ = toNumber(upstream);
    return { body };
  }

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    const built = buildBody();
    if ("local" in built) {
      setErrors(built.local);
      setMessage("Nothing was saved.");
      return;
    }
    await saveAndOpen("/api/fuels", initial?.id, built.body, (id) => `/fuels/${id}`, { setBusy, setErrors, setMessage, router });
  }

  const compSumValues = rows.map((r) => r.value);

  /** Rescales the composition rows to sum to 1 (100 %) and records the residual in the notes. */
  function normaliseRows() {
    const entry: Record<string, number> = {};
    rows.forEach((r, i) => {
      const v = toNumber(r.value);
      if (typeof v === "number") entry[String(i)] = v;
    });
    const n = normaliseComposition(entry, scale, new Date().toISOString().slice(0, 10));
    if (!n) return;
    setRows(rows.map((r, i) => (String(i) in n.values ? { ...r, value: String(Number(n.values[String(i)].toPrecision(8))) } : r)));
    setNotes((old) => (old.trim() ? `${old.trim()}\n${n.note}` : n.note));
  }
  const ultSumValues = ULTIMATE_KEYS.map((k) => ultimate[k]);

  return (
    <form className="stack" onSubmit={submit} noValidate aria-label={initial ? "Edit fuel" : "New fuel"}>
      <ErrorSummary message={message} errors={errors} placed={placed} />

      <fieldset>
        <legend>Fuel</legend>
        <div className="row">
          <Field label="Name" name="name" errors={errors}>
            <input
              id="f-name"
              name="name"
              value={name}
              onChange={(e) => setName(e.target.value)}
              maxLength={120}
              {...invalid(errors, "name")}
            />
          </Field>
          <div className="field">
            <span className="label">Kind</span>
            <div className="radio-row" role="radiogroup" aria-label="Kind">
              {(["gas", "liquid", "solid"] as const).map((k) => (
                <label key={k}>
                  <input type="radio" name="kind" value={k} checked={kind === k} onChange={() => changeKind(k)} /> {k}
                </label>
              ))}
            </div>
            <FieldError errors={errors} name="kind" />
          </div>
        </div>
        <div className="field" style={{ marginTop: "0.75rem" }}>
          <span className="label">Defined by</span>
          <div className="radio-row" role="radiogroup" aria-label="Defined by">
            {FORMS_FOR[kind].map((f) => (
              <label key={f.form}>
                <input type="radio" name="form" value={f.form} checked={form === f.form} onChange={() => setForm(f.form)} /> {f.label}
              </label>
            ))}
          </div>
        </div>
      </fieldset>

      {form === "composition" && (
        <fieldset>
          <legend>Composition</legend>
          <div className="row" style={{ alignItems: "center", marginTop: 0 }}>
            <p className="hint muted" style={{ margin: 0 }}>
              Mole (= volume, ideal gas) shares, as fractions summing to 1 or in mol % summing to 100 (within 0.1 %); a certificate a little
              off (up to ±{NORMALISE_TOLERANCE_PERCENT} mol %) can be normalised, and the residual is recorded in the notes.
            </p>
            <span className="segmented" role="group" aria-label="Composition entered as">
              {COMPOSITION_SCALES.map((sc) => (
                <button
                  key={sc}
                  type="button"
                  aria-pressed={scale === sc}
                  className={`seg${scale === sc ? " on" : ""}`}
                  onClick={() => setScale(sc)}
                >
                  {sc === "percent" ? "mol %" : "fraction"}
                </button>
              ))}
            </span>
          </div>
          <table className="entry">
            <thead>
              <tr>
                <th style={{ width: "60%" }}>Component</th>
                <th>{scale === "percent" ? "mol %" : "Mole fraction"}</th>
                <th></th>
              </tr>
            </thead>
            <tbody>
              {rows.map((r, i) => {
                const errKey = `definition.composition.${r.key}`;
                return (
                  <tr key={i}>
                    <td>
                      <select
                        aria-label={`Component ${i + 1}`}
                        value={r.key}
                        onChange={(e) => setRows(rows.map((x, j) => (j === i ? { ...x, key: e.target.value } : x)))}
                        {...(r.key ? invalid(errors, errKey) : {})}
                      >
                        <option value="">— choose —</option>
                        {options.species.map((s) => (
                          <option key={s.key} value={s.key}>
                            {s.name} ({s.key})
                          </option>
                        ))}
                      </select>
                      {r.key && <FieldError errors={errors} name={errKey} />}
                    </td>
                    <td>
                      <input
                        aria-label={`${scale === "percent" ? "Mol %" : "Mole fraction"} ${i + 1}`}
                        name={`fraction-${i}`}
                        inputMode="decimal"
                        className="num"
                        value={r.value}
                        onChange={(e) => setRows(rows.map((x, j) => (j === i ? { ...x, value: e.target.value } : x)))}
                        {...(r.key ? invalid(errors, errKey) : {})}
                      />
                    </td>
                    <td>
                      <button
                        type="button"
                        className="secondary small"
                        aria-label={`Remove row ${i + 1}`}
                        onClick={() => setRows(rows.filter((_, j) => j !== i))}
                      >
                        ✕
                      </button>
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
          <div className="row" style={{ alignItems: "center", marginTop: "0.4rem" }}>
            <button type="button" className="secondary small" onClick={() => setRows([...rows, { key: "", value: "" }])}>
              Add component
            </button>
            <CompositionSum values={compSumValues} scale={scale} onNormalise={normaliseRows} onSwitchScale={setScale} />
          </div>
          <FieldError errors={errors} name="definition.composition" />
        </fieldset>
      )}

      {form === "compound" && (
        <fieldset>
          <legend>Compound</legend>
          <Field label="Liquid compound" name="definition.compound" errors={errors} htmlFor="f-compound">
            <select
              id="f-compound"
              value={compound}
              onChange={(e) => setCompound(e.target.value)}
              {...invalid(errors, "definition.compound")}
            >
              {options.compounds.map((c) => (
                <option key={c.key} value={c.key}>
                  {c.name} ({c.key}) — {c.role}
                </option>
              ))}
            </select>
          </Field>
        </fieldset>
      )}

      {form === "ultimate" && (
        <fieldset>
          <legend>Ultimate analysis</legend>
          <p className="hint muted" style={{ marginTop: 0 }}>
            Mass fractions as received (H and O exclude the moisture); C + H + O + N + S + moisture + ash must sum to 1 within 0.001.
          </p>
          <div className="row">
            {ULTIMATE_KEYS.map((k) => (
              <Field key={k} label={k} name={`definition.ultimate.${k}`} errors={errors} htmlFor={`f-ult-${k}`}>
                <input
                  id={`f-ult-${k}`}
                  inputMode="decimal"
                  className="num"
                  value={ultimate[k]}
                  onChange={(e) => setUltimate({ ...ultimate, [k]: e.target.value })}
                  style={{ width: "7rem" }}
                  {...invalid(errors, `definition.ultimate.${k}`)}
                />
              </Field>
            ))}
          </div>
          <Sum values={ultSumValues} what="mass fractions" />
          <FieldError errors={errors} name="definition.ultimate" />
          <div className="field" style={{ marginTop: "0.75rem" }}>
            <span className="label">Heating value</span>
            <div className="radio-row">
              <label>
                <input type="radio" name="hv" checked={hvMode === "lhv"} onChange={() => setHvMode("lhv")} /> measured net (LHV)
              </label>
              <label>
                <input type="radio" name="hv" checked={hvMode === "hhv"} onChange={() => setHvMode("hhv")} /> measured gross (HHV)
              </label>
              <label>
                <input type="radio" name="hv" checked={hvMode === "correlation"} onChange={() => setHvMode("correlation")} /> estimate
                (Channiwala &amp; Parikh 2002)
              </label>
            </div>
          </div>
          {hvMode !== "correlation" && (
            <Field
              label={`${hvMode === "hhv" ? "Gross" : "Net"} heating value, MJ/kg as received (25 °C)`}
              name={hvMode === "hhv" ? "definition.hhv_MJ_per_kg" : "definition.lhv_MJ_per_kg"}
              errors={errors}
              htmlFor="f-hv"
            >
              <input
                id="f-hv"
                inputMode="decimal"
                className="num"
                value={hvValue}
                onChange={(e) => setHvValue(e.target.value)}
                style={{ maxWidth: "10rem" }}
                {...invalid(errors, hvMode === "hhv" ? "definition.hhv_MJ_per_kg" : "definition.lhv_MJ_per_kg")}
              />
            </Field>
          )}
          <FieldError errors={errors} name="definition.correlation" />
        </fieldset>
      )}

      {isBlend && (
        <fieldset>
          <legend>Blend</legend>
          {candidates.length < 2 ? (
            <p className="note warn">
              A blend is built from stored {kind === "gas" ? "gases" : `${kind}s`}; there are fewer than two.{" "}
              <Link href="/fuels/new">Add the components first</Link>.
            </p>
          ) : null}
          <Field label="Shares by" name="blend.basis" errors={errors} htmlFor="f-basis">
            <select
              id="f-basis"
              value={basis}
              onChange={(e) => setBasis(e.target.value)}
              style={{ maxWidth: "16rem" }}
              {...invalid(errors, "blend.basis")}
            >
              {kind !== "solid" && <option value="volume">volume{kind === "gas" ? " (= mole)" : ""}</option>}
              <option value="mass">mass</option>
              <option value="energy">energy (net basis)</option>
            </select>
          </Field>
          <table className="entry" style={{ marginTop: "0.5rem" }}>
            <thead>
              <tr>
                <th style={{ width: "60%" }}>Stored fuel</th>
                <th>Share (fraction)</th>
                <th></th>
              </tr>
            </thead>
            <tbody>
              {blendRows.map((r, i) => (
                <tr key={i}>
                  <td>
                    <select
                      aria-label={`Blend component ${i + 1}`}
                      value={r.fuelId}
                      onChange={(e) => setBlendRows(blendRows.map((x, j) => (j === i ? { ...x, fuelId: e.target.value } : x)))}
                      {...invalid(errors, `blend.components.${i}.fuelId`)}
                    >
                      <option value="">— choose —</option>
                      {candidates.map((f) => (
                        <option key={f.id} value={f.id}>
                          {f.name}
                        </option>
                      ))}
                    </select>
                    <FieldError errors={errors} name={`blend.components.${i}.fuelId`} />
                  </td>
                  <td>
                    <input
                      aria-label={`Share ${i + 1}`}
                      inputMode="decimal"
                      className="num"
                      value={r.share}
                      onChange={(e) => setBlendRows(blendRows.map((x, j) => (j === i ? { ...x, share: e.target.value } : x)))}
                      {...invalid(errors, `blend.components.${i}.share`)}
                    />
                    <FieldError errors={errors} name={`blend.components.${i}.share`} />
                  </td>
                  <td>
                    <button
                      type="button"
                      className="secondary small"
                      aria-label={`Remove component ${i + 1}`}
                      onClick={() => setBlendRows(blendRows.filter((_, j) => j !== i))}
                    >
                      ✕
                    </button>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          <div className="row" style={{ alignItems: "center", marginTop: "0.4rem" }}>
            <button type="button" className="secondary small" onClick={() => setBlendRows([...blendRows, { fuelId: "", share: "" }])}>
              Add component
            </button>
            <Sum values={blendRows.map((r) => r.share)} what="shares" />
          </div>
          <FieldError errors={errors} name="blend.components" />
          <FieldError errors={errors} name="blend" />
          <p className="hint muted">Density, biogenic share and upstream CO2e of a blend follow from its components.</p>
        </fieldset>
      )}
      <FieldError errors={errors} name="definition" />

      {!isBlend && (
        <fieldset>
          <legend>Attributes</legend>
          <div className="row">
            {kind !== "gas" && (
              <Field
                label={kind === "solid" ? "Bulk density, kg/m³" : "Density at 15 °C, kg/m³"}
                name="densityKgPerM3"
                errors={errors}
                hint={kind === "liquid" ? "needed for prices per litre; a pure compound has its own" : "needed for prices per m³"}
              >
                <input
                  id="f-densityKgPerM3"
                  inputMode="decimal"
                  className="num"
                  value={density}
                  onChange={(e) => setDensity(e.target.value)}
                  {...invalid(errors, "densityKgPerM3")}
                />
              </Field>
            )}
            <NumberField
              label="Biogenic carbon share (0–1)"
              name="biogenicCarbonShare"
              errors={errors}
              hint="1 = all carbon from biomass"
              value={biogenic}
              onChange={(e) => setBiogenic(e.target.value)}
            />
            <NumberField
              label="Upstream CO2e, kg/GJ (net)"
              name="upstreamCo2e_kg_per_GJ"
              errors={errors}
              hint="optional well-to-tank factor"
              value={upstream}
              onChange={(e) => setUpstream(e.target.value)}
            />
          </div>
        </fieldset>
      )}

      <fieldset>
        <legend>Notes</legend>
        <Field label="Notes" name="notes" errors={errors}>
          <textarea id="f-notes" value={notes} onChange={(e) => setNotes(e.target.value)} {...invalid(errors, "notes")} />
        </Field>
        <Field label="Source of the data" name="source" errors={errors} hint="analysis certificate, specification, supplier sheet …">
          <input id="f-source" value={source} onChange={(e) => setSource(e.target.value)} {...invalid(errors, "source")} />
        </Field>
      </fieldset>

      <div className="row">
        <button type="submit" disabled={busy}>
          {busy ? "Saving…" : initial ? "Save changes" : "Save fuel"}
        </button>
        <Link className="button secondary" href={initial ? `/fuels/${initial.id}` : "/fuels"}>
          Cancel
        </Link>
      </div>
    </form>
  );
}
