"use client";

/**
 * Create or edit a study: the plant, the economic assumptions, the baseline and the candidate
 * scenarios (a stored fuel or blend, the price quote, capex, fixed opex change and operating-point
 * overrides and limits, every field the study stores) and the report cover. The server validates
 * everything and names the field of each problem; a number whose text is untouched is sent back exactly as stored.
 */
import Link from "next/link";
import { saveAndOpen } from "@/app/_ui/save";
import { useRouter } from "next/navigation";
import { useMemo, useRef, useState } from "react";
import { ErrorSummary, Field, NumberField, invalid, toNumber, type Errors } from "../../fuels/_components/fields";
import type { QuoteChoice, StudyFormOptions } from "@/lib/services/studies";
import { quoteChoiceLabel } from "./price-labels";
import { SENSITIVITY_DEFAULTS, type SensitivityRanges } from "@/lib/schemas/study";
import { scenarioRecordSchema, studyRecordSchema, type ScenarioRecordInput, type StudyRecordInput } from "@/lib/schemas/study-record";
import { operatingOverridesSchema, type OperatingOverrides } from "@/lib/schemas/plant";
import { capitalised, fieldLabel } from "@/lib/schemas/labels";
import { AIR_CONTROL_LABELS, AIR_CONTROLS, BURNER_TYPE_LABELS, BURNER_TYPES } from "@/lib/schemas/burner";

/** What the form starts from: a stored study as the API returns it (the record schema's input), with its id. */
export type StudyFormInitial = StudyRecordInput & { id?: number };
type ScenarioInitial = ScenarioRecordInput;

type SensitivityKey = keyof SensitivityRanges;
const SENSITIVITY_KEYS = Object.keys(SENSITIVITY_DEFAULTS) as SensitivityKey[];
const label = (k: string) => capitalised(fieldLabel(k));

type OverrideKey = keyof OperatingOverrides;
/** Every per-scenario field the schema knows, in its order; the limits a new burner changes first. */
const ALL_OVERRIDE_KEYS = Object.keys(operatingOverridesSchema.shape) as OverrideKey[];
/** Limits a scenario may set, or remove (null: no limit in this scenario). */
const LIMIT_KEYS = [
  "maxH2SharePercent",
  "wobbeTolerancePercent",
  "maxFlameTempRiseK",
  "noxLimit_mg_per_m3",
  "so2Limit_mg_per_m3",
] as const satisfies readonly OverrideKey[];
type NumberOverrideKey = Exclude<OverrideKey, "condensing" | "burner">;
const NUMBER_OVERRIDE_KEYS = ALL_OVERRIDE_KEYS.filter((k): k is NumberOverrideKey => k !== "condensing" && k !== "burner");
const OPERATING_KEYS = NUMBER_OVERRIDE_KEYS.filter((k) => !(LIMIT_KEYS as readonly string[]).includes(k));
const isLimit = (k: OverrideKey) => (LIMIT_KEYS as readonly string[]).includes(k);

/** One number as typed, with the stored value it started from (sent back as it was when the text is untouched). */
interface NumText {
  text: string;
  initial: number | null | undefined;
  /** Stored null (a limit removed in this scenario) and not changed since. */
  isNull: boolean;
}

/**
 * The rule's date: a scenario without a chosen quote takes the latest quote valid on this date (the
 * field exists where the record schema has it; empty = the day the study is evaluated).
 */
const RULE_DATE_KEY = "priceValidOn";
const HAS_RULE_DATE = RULE_DATE_KEY in scenarioRecordSchema.shape;
const SCENARIO_FORM_KEYS = new Set(["name", "fuelId", "priceQuoteId", "capex", "fixedOpexChange", "overrides", RULE_DATE_KEY]);
const STUDY_RECORD_KEYS = Object.keys(studyRecordSchema.shape);

/** Stored fields of the record schema this form has no input for: sent back as they came, never dropped. */
function untouched(init: object | undefined, known: (k: string) => boolean, keys: readonly string[]): Record<string, unknown> {
  if (!init) return {};
  return Object.fromEntries(Object.entries(init).filter(([k]) => keys.includes(k) && !known(k)));
}

interface ScenarioState {
  key: number;
  rest: Record<string, unknown>;
  priceValidOn: string;
  name: string;
  fuelId: string;
  priceQuoteId: string;
  capex: NumText;
  fixedOpexChange: NumText;
  overrides: Record<NumberOverrideKey, NumText>;
  condensing: "" | "yes" | "no";
  /** Burner override: "" = the plant's burner; else a burner type (a new burner), with its air control. */
  burnerType: string;
  burnerAirControl: string;
  /** The stored burner override, sent back as it was while the two selects are untouched. */
  burnerStored: unknown;
}

const s = (v: unknown) => (v === null || v === undefined ? "" : String(v));
const numText = (v: number | null | undefined): NumText => ({ text: s(v), initial: v, isNull: v === null });
/** The number to send: the stored value when the text is as it was shown, else the text read in the browser's locale. */
function numberOf(n: NumText): number | string | null {
  if (typeof n.initial === "number" && n.text === String(n.initial)) return n.initial;
  return toNumber(n.text);
}

function scenarioState(key: number, init?: ScenarioInitial): ScenarioState {
  const o: Partial<Record<OverrideKey, unknown>> = init?.overrides ?? {};
  const overrides = {} as Record<NumberOverrideKey, NumText>;
  for (const k of NUMBER_OVERRIDE_KEYS) {
    const v = o[k];
    overrides[k] = k in o ? numText(typeof v === "number" ? v : null) : numText(undefined);
  }
  const record: Record<string, unknown> = init ?? {};
  return {
    key,
    rest: untouched(init, (k) => SCENARIO_FORM_KEYS.has(k), Object.keys(scenarioRecordSchema.shape)),
    priceValidOn: s(record[RULE_DATE_KEY]),
    name: init?.name ?? "",
    fuelId: init ? s(init.fuelId || "") : "",
    priceQuoteId: s(init?.priceQuoteId ?? ""),
    capex: numText(init?.capex ?? 0),
    fixedOpexChange: numText(init?.fixedOpexChange ?? 0),
    overrides,
    condensing: o.condensing === true ? "yes" : o.condensing === false ? "no" : "",
    burnerType: s((o.burner as { type?: string } | null | undefined)?.type ?? ""),
    burnerAirControl: s((o.burner as { airControl?: string } | null | undefined)?.airControl ?? "fixed-linkage"),
    burnerStored: o.burner,
  };
}

const today = () => new Date().toISOString().slice(0, 10);

/** The quote the rule "latest in the study's currency valid on date D" picks today (quotes come newest first). */
function quoteInForce(quotes: QuoteChoice[], currency: string, onDate: string): QuoteChoice | undefined {
  return quotes.find((q) => q.currency === currency && q.validFrom <= onDate);
}

const dash = (name: string) => `f-${name.replace(/\./g, "-")}`;

export function StudyForm({
  options,
  metrics,
  initial,
  defaultPlantId,
}: {
  options: StudyFormOptions;
  metrics: { value: string; label: string }[];
  initial?: StudyFormInitial;
  defaultPlantId?: number;
}) {
  const router = useRouter();
  const nextKey = useRef(1000);
  const firstPlant = options.plants.find((p) => p.id === (initial?.plantId ?? defaultPlantId)) ?? options.plants[0];
  // The numbers of the study as stored: sent back unchanged while their text is untouched.
  const headInitial = useRef<Record<string, number | null | undefined>>({
    carbonPrice_per_t: initial?.carbonPrice_per_t ?? 80,
    discountRatePercent: initial?.discountRatePercent ?? 8,
    horizonYears: initial?.horizonYears ?? 15,
    priceEscalationPercent: initial?.priceEscalationPercent ?? 0,
    ...Object.fromEntries(SENSITIVITY_KEYS.map((k) => [k, initial?.sensitivity?.[k] ?? SENSITIVITY_DEFAULTS[k]])),
  });
  const hi = headInitial.current;
  const [head, setHead] = useState({
    plantId: s(initial?.plantId ?? firstPlant?.id ?? ""),
    name: initial?.name ?? "",
    currency: initial?.currency ?? "EUR",
    carbonPrice_per_t: s(hi.carbonPrice_per_t),
    discountRatePercent: s(hi.discountRatePercent),
    horizonYears: s(hi.horizonYears),
    priceEscalationPercent: s(hi.priceEscalationPercent),
    rankingMetric: initial?.rankingMetric ?? "cost-per-useful-MWh",
    includeUpstream: initial?.includeUpstream ? "yes" : "no",
    fuelPricePercent: s(hi.fuelPricePercent),
    carbonPricePercent: s(hi.carbonPricePercent),
    efficiencyPoints: s(hi.efficiencyPoints),
    capexPercent: s(hi.capexPercent),
    notes: initial?.notes ?? "",
    reportTitle: initial?.reportTitle ?? "",
    preparedFor: initial?.preparedFor ?? "",
    preparedBy: initial?.preparedBy ?? "",
    reportDate: initial?.reportDate ?? "",
    reportNotes: initial?.reportNotes ?? "",
    // A new study is offered the library's pure hydrogen; a stored one keeps its choice (none included).
    hydrogenFuelId: s(initial ? (initial.hydrogenFuelId ?? "") : (options.defaultHydrogenFuelId ?? "")),
  });
  const headNumber = (k: keyof typeof head) => numberOf({ text: head[k], initial: hi[k], isNull: false });
  const baselineFuelName = (id: number | null | undefined) => options.fuels.find((f) => f.id === id)?.name ?? "";
  const [baseline, setBaseline] = useState<ScenarioState>(() =>
    initial
      ? scenarioState(0, initial.baseline)
      : scenarioState(
          0,
          firstPlant?.baselineFuelId
            ? { name: `${baselineFuelName(firstPlant.baselineFuelId)} (today)`, fuelId: firstPlant.baselineFuelId }
            : undefined,
        ),
  );
  const [scenarios, setScenarios] = useState<ScenarioState[]>(() =>
    initial ? initial.scenarios.map((x, i) => scenarioState(i + 1, x)) : [scenarioState(1)],
  );
  const [errors, setErrors] = useState<Errors>({});
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [asOf] = useState(today);

  const fuelsByKind = useMemo(() => {
    const m = new Map<string, StudyFormOptions["fuels"]>();
    for (const f of options.fuels) m.set(f.kind, [...(m.get(f.kind) ?? []), f]);
    return [...m.entries()];
  }, [options.fuels]);

  const setH = (k: keyof typeof head) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement | HTMLTextAreaElement>) =>
    setHead((h) => ({ ...h, [k]: e.target.value }));

  function changePlant(e: React.ChangeEvent<HTMLSelectElement>) {
    const id = e.target.value;
    setHead((h) => ({ ...h, plantId: id }));
    const p = options.plants.find((x) => String(x.id) === id);
    if (!initial && p?.baselineFuelId && baseline.fuelId === "") {
      setBaseline((b) => ({ ...b, fuelId: String(p.baselineFuelId), name: b.name || `${baselineFuelName(p.baselineFuelId)} (today)` }));
    }
  }

  function update(which: "baseline" | number, patch: Partial<ScenarioState>) {
    const apply = (x: ScenarioState): ScenarioState => {
      const next = { ...x, ...patch };
      if (patch.fuelId !== undefined && patch.fuelId !== x.fuelId) {
        next.priceQuoteId = "";
        const oldName = options.fuels.find((f) => String(f.id) === x.fuelId)?.name ?? "";
        if (x.name.trim() === "" || x.name === oldName) next.name = options.fuels.find((f) => String(f.id) === patch.fuelId)?.name ?? "";
      }
      return next;
    };
    if (which === "baseline") setBaseline(apply);
    else setScenarios((list) => list.map((x, i) => (i === which ? apply(x) : x)));
  }

  function setOverride(which: "baseline" | number, x: ScenarioState, k: NumberOverrideKey, patch: Partial<NumText>) {
    update(which, { overrides: { ...x.overrides, [k]: { ...x.overrides[k], ...patch } } });
  }

  function move(i: number, by: -1 | 1) {
    setScenarios((list) => {
      const j = i + by;
      if (j < 0 || j >= list.length) return list;
      const copy = [...list];
      [copy[i], copy[j]] = [copy[j], copy[i]];
      return copy;
    });
    setErrors({});
  }

  function scenarioBody(x: ScenarioState, isBaseline: boolean) {
    const overrides: Record<string, unknown> = {};
    for (const k of ALL_OVERRIDE_KEYS) {
      if (k === "condensing") {
        if (x.condensing) overrides.condensing = x.condensing === "yes";
        continue;
      }
      if (k === "burner") {
        const stored = x.burnerStored as { type?: string; airControl?: string } | null | undefined;
        if (stored && stored.type === x.burnerType && stored.airControl === x.burnerAirControl) overrides.burner = stored;
        else if (x.burnerType !== "") overrides.burner = { type: x.burnerType, airControl: x.burnerAirControl };
        continue;
      }
      const n = x.overrides[k];
      if (n.isNull && n.text.trim() === "") overrides[k] = null;
      else {
        const v = numberOf(n);
        if (v !== null) overrides[k] = v;
      }
    }
    const b: Record<string, unknown> = {
      ...x.rest,
      ...(HAS_RULE_DATE ? { [RULE_DATE_KEY]: x.priceQuoteId === "" && x.priceValidOn.trim() !== "" ? x.priceValidOn.trim() : null } : {}),
      name: x.name,
      fuelId: x.fuelId === "" ? null : Number(x.fuelId),
      priceQuoteId: x.priceQuoteId === "" ? null : Number(x.priceQuoteId),
      // The baseline has no capex or opex change of its own (the schema refuses any but 0).
      capex: isBaseline ? 0 : (numberOf(x.capex) ?? 0),
      fixedOpexChange: isBaseline ? 0 : (numberOf(x.fixedOpexChange) ?? 0),
      overrides,
    };
    return b;
  }

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setBusy(true);
    setMessage(null);
    const body = {
      ...untouched(initial, (k) => k in head || k === "sensitivity" || k === "baseline" || k === "scenarios", STUDY_RECORD_KEYS),
      plantId: head.plantId === "" ? null : Number(head.plantId),
      name: head.name,
      currency: head.currency,
      carbonPrice_per_t: headNumber("carbonPrice_per_t") ?? 0,
      discountRatePercent: headNumber("discountRatePercent"),
      horizonYears: headNumber("horizonYears"),
      priceEscalationPercent: headNumber("priceEscalationPercent") ?? 0,
      rankingMetric: head.rankingMetric,
      includeUpstream: head.includeUpstream === "yes",
      sensitivity: Object.fromEntries(SENSITIVITY_KEYS.map((k) => [k, headNumber(k)])),
      notes: head.notes,
      reportTitle: head.reportTitle,
      preparedFor: head.preparedFor,
      preparedBy: head.preparedBy,
      reportDate: head.reportDate.trim() === "" ? null : head.reportDate.trim(),
      reportNotes: head.reportNotes,
      hydrogenFuelId: head.hydrogenFuelId === "" ? null : Number(head.hydrogenFuelId),
      baseline: scenarioBody(baseline, true),
      scenarios: scenarios.map((x) => scenarioBody(x, false)),
    };
    await saveAndOpen("/api/studies", initial?.id, body, (id) => `/studies/${id}`, { setBusy, setErrors, setMessage, router });
  }

  const placed = (key: string) =>
    Object.keys(head).includes(key) ||
    key.startsWith("sensitivity.") ||
    /^(baseline|scenarios\.\d+)\.(name|fuelId|priceQuoteId|priceValidOn|capex|fixedOpexChange|overrides(\.\w+)?)$/.test(key);

  /** The quote choice in words: a fixed quote, or the rule and the quote it picks today. */
  function quoteRule(x: ScenarioState, fuel: StudyFormOptions["fuels"][number] | undefined): string | undefined {
    if (!fuel) return undefined;
    const cur = head.currency.trim().toUpperCase() || "the study's currency";
    if (x.priceQuoteId !== "") return "This quote, fixed: newer quotes do not replace it.";
    const onDate = x.priceValidOn.trim() || asOf;
    const q = quoteInForce(fuel.quotes, cur, onDate);
    const rule = x.priceValidOn.trim()
      ? `Rule: the latest ${cur} quote valid on ${onDate}`
      : `Rule: the latest ${cur} quote valid on the day the study is evaluated (today ${asOf})`;
    if (q) return `${rule} — now ${quoteChoiceLabel(q)}.`;
    if (fuel.isBlend) return `${rule} — none of its own: priced from its components' quotes by the same rule.`;
    return `${rule} — there is none: no cost figures for this scenario.`;
  }

  function numberField(which: "baseline" | number, p: string, x: ScenarioState, k: NumberOverrideKey) {
    const n = x.overrides[k];
    const name = `${p}.overrides.${k}`;
    const limit = isLimit(k);
    return (
      <Field key={k} label={label(k)} name={name} errors={errors} htmlFor={dash(name)}>
        <input
          id={dash(name)}
          className="num"
          inputMode="decimal"
          placeholder={n.isNull && limit ? "no limit" : limit ? "plant's limit" : "plant's value"}
          value={n.text}
          disabled={limit && n.isNull}
          onChange={(e) => setOverride(which, x, k, { text: e.target.value })}
          {...invalid(errors, name)}
        />
        {limit && (
          <label className="inline-check">
            <input
              type="checkbox"
              checked={n.isNull}
              onChange={(e) => setOverride(which, x, k, { isNull: e.target.checked, text: e.target.checked ? "" : n.text })}
            />{" "}
            no limit in this scenario
          </label>
        )}
      </Field>
    );
  }

  function card(x: ScenarioState, which: "baseline" | number) {
    const p = which === "baseline" ? "baseline" : `scenarios.${which}`;
    const fuel = options.fuels.find((f) => String(f.id) === x.fuelId);
    const quotes = fuel?.quotes ?? [];
    const setCount =
      NUMBER_OVERRIDE_KEYS.filter((k) => x.overrides[k].text.trim() !== "" || x.overrides[k].isNull).length + (x.condensing ? 1 : 0);
    const hasOverrideError = Object.keys(errors).some((k) => k.startsWith(`${p}.overrides`));
    return (
      <div
        className={`scenario-card${which === "baseline" ? " baseline" : ""}`}
        key={x.key}
        data-testid={which === "baseline" ? "baseline-card" : `scenario-card-${which}`}
      >
        <header>
          <span className="who">{which === "baseline" ? "Baseline — what the plant does today" : `Candidate ${which + 1}`}</span>
          {which !== "baseline" && (
            <span className="form-actions">
              <button
                type="button"
                className="secondary small"
                onClick={() => move(which, -1)}
                disabled={which === 0}
                aria-label={`Move candidate ${which + 1} up`}
              >
                ↑
              </button>
              <button
                type="button"
                className="secondary small"
                onClick={() => move(which, 1)}
                disabled={which === scenarios.length - 1}
                aria-label={`Move candidate ${which + 1} down`}
              >
                ↓
              </button>
              <button
                type="button"
                className="danger small"
                onClick={() => {
                  setScenarios((list) => list.filter((_, i) => i !== which));
                  setErrors({});
                }}
              >
                Remove
              </button>
            </span>
          )}
        </header>
        <div className="row">
          <Field label="Fuel or blend" name={`${p}.fuelId`} errors={errors} htmlFor={dash(`${p}.fuelId`)}>
            <select
              id={dash(`${p}.fuelId`)}
              value={x.fuelId}
              onChange={(e) => update(which, { fuelId: e.target.value })}
              {...invalid(errors, `${p}.fuelId`)}
            >
              <option value="">— choose from the library —</option>
              {fuelsByKind.map(([kind, list]) => (
                <optgroup key={kind} label={kind === "gas" ? "Gases" : kind === "liquid" ? "Liquids" : "Solids"}>
                  {list.map((f) => (
                    <option key={f.id} value={f.id}>
                      {f.name}
                      {f.isBlend ? " (blend)" : ""}
                    </option>
                  ))}
                </optgroup>
              ))}
            </select>
          </Field>
          <Field label="Scenario name" name={`${p}.name`} errors={errors} htmlFor={dash(`${p}.name`)}>
            <input
              id={dash(`${p}.name`)}
              value={x.name}
              onChange={(e) => update(which, { name: e.target.value })}
              maxLength={120}
              {...invalid(errors, `${p}.name`)}
            />
          </Field>
        </div>
        <div className="row">
          <Field
            label="Price"
            name={`${p}.priceQuoteId`}
            errors={errors}
            htmlFor={dash(`${p}.priceQuoteId`)}
            hint={<span data-testid="quote-rule">{quoteRule(x, fuel)}</span>}
          >
            <select
              id={dash(`${p}.priceQuoteId`)}
              value={x.priceQuoteId}
              onChange={(e) => update(which, { priceQuoteId: e.target.value })}
              {...invalid(errors, `${p}.priceQuoteId`)}
            >
              <option value="">latest {head.currency || "study currency"} quote valid on the day evaluated</option>
              {quotes.map((q) => (
                <option key={q.id} value={q.id}>
                  {quoteChoiceLabel(q)}
                  {q.isInvented ? " — invented" : ""}
                </option>
              ))}
            </select>
          </Field>
          {HAS_RULE_DATE && x.priceQuoteId === "" && (
            <Field
              label={label(RULE_DATE_KEY)}
              name={`${p}.${RULE_DATE_KEY}`}
              errors={errors}
              htmlFor={dash(`${p}.${RULE_DATE_KEY}`)}
              hint="empty: the day the study is evaluated"
            >
              <input
                id={dash(`${p}.${RULE_DATE_KEY}`)}
                type="date"
                value={x.priceValidOn}
                onChange={(e) => update(which, { priceValidOn: e.target.value })}
                style={{ maxWidth: "11rem" }}
                {...invalid(errors, `${p}.${RULE_DATE_KEY}`)}
              />
            </Field>
          )}
          {which !== "baseline" && (
            <>
              <Field label={`Switching capex, ${head.currency}`} name={`${p}.capex`} errors={errors} htmlFor={dash(`${p}.capex`)}>
                <input
                  id={dash(`${p}.capex`)}
                  className="num"
                  inputMode="decimal"
                  value={x.capex.text}
                  onChange={(e) => update(which, { capex: { ...x.capex, text: e.target.value } })}
                  {...invalid(errors, `${p}.capex`)}
                />
              </Field>
              <Field
                label={`Fixed opex change, ${head.currency}/yr`}
                name={`${p}.fixedOpexChange`}
                errors={errors}
                htmlFor={dash(`${p}.fixedOpexChange`)}
                hint="+ = more cost than the baseline"
              >
                <input
                  id={dash(`${p}.fixedOpexChange`)}
                  className="num"
                  inputMode="decimal"
                  value={x.fixedOpexChange.text}
                  onChange={(e) => update(which, { fixedOpexChange: { ...x.fixedOpexChange, text: e.target.value } })}
                  {...invalid(errors, `${p}.fixedOpexChange`)}
                />
              </Field>
            </>
          )}
        </div>
        <details className="overrides" open={hasOverrideError || setCount > 0 || undefined}>
          <summary>Limits and operating point of this scenario{setCount ? ` (${setCount} set)` : " (none: the plant's values)"}</summary>
          <p className="hint small-note">Empty fields take the plant&apos;s value. A new burner or fan changes a limit here.</p>
          <div className="row">{LIMIT_KEYS.map((k) => numberField(which, p, x, k))}</div>
          <div className="row">
            {OPERATING_KEYS.map((k) => numberField(which, p, x, k))}
            <Field
              label={label("condensing")}
              name={`${p}.overrides.condensing`}
              errors={errors}
              htmlFor={dash(`${p}.overrides.condensing`)}
            >
              <select
                id={dash(`${p}.overrides.condensing`)}
                value={x.condensing}
                onChange={(e) => update(which, { condensing: e.target.value as ScenarioState["condensing"] })}
              >
                <option value="">plant&apos;s value</option>
                <option value="yes">condensing</option>
                <option value="no">not condensing</option>
              </select>
            </Field>
          </div>
          <div className="row">
            <Field
              label="Burner in this scenario"
              name={`${p}.overrides.burner`}
              errors={errors}
              htmlFor={dash(`${p}.overrides.burner.type`)}
            >
              <select
                id={dash(`${p}.overrides.burner.type`)}
                value={x.burnerType}
                onChange={(e) => update(which, { burnerType: e.target.value })}
              >
                <option value="">the plant&apos;s burner</option>
                {BURNER_TYPES.map((t) => (
                  <option key={t} value={t}>
                    new: {BURNER_TYPE_LABELS[t]}
                  </option>
                ))}
              </select>
            </Field>
            {x.burnerType !== "" && (
              <Field
                label="Its air-ratio control"
                name={`${p}.overrides.burner.airControl`}
                errors={errors}
                htmlFor={dash(`${p}.overrides.burner.airControl`)}
              >
                <select
                  id={dash(`${p}.overrides.burner.airControl`)}
                  value={x.burnerAirControl}
                  onChange={(e) => update(which, { burnerAirControl: e.target.value })}
                >
                  {AIR_CONTROLS.map((t) => (
                    <option key={t} value={t}>
                      {AIR_CONTROL_LABELS[t]}
                    </option>
                  ))}
                </select>
              </Field>
            )}
          </div>
          {errors[`${p}.overrides`] && <span className="field-error">{errors[`${p}.overrides`]}</span>}
        </details>
      </div>
    );
  }

  if (options.plants.length === 0) {
    return (
      <p className="note warn">
        There is no plant yet. <Link href="/plants/new">Describe the plant</Link> first; a study compares fuels for one plant.
      </p>
    );
  }

  return (
    <form
      className="stack decision-form"
      onSubmit={submit}
      noValidate
      aria-label={initial?.id ? "Edit study" : "New study"}
      style={{ maxWidth: 1000 }}
    >
      <ErrorSummary message={message} errors={errors} placed={placed} />

      <fieldset>
        <legend>Study</legend>
        <div className="row">
          <Field label="Plant" name="plantId" errors={errors}>
            <select id="f-plantId" value={head.plantId} onChange={changePlant} {...invalid(errors, "plantId")}>
              {options.plants.map((p) => (
                <option key={p.id} value={p.id}>
                  {p.name}
                </option>
              ))}
            </select>
          </Field>
          <Field label="Study name" name="name" errors={errors}>
            <input id="f-name" value={head.name} onChange={setH("name")} maxLength={200} {...invalid(errors, "name")} />
          </Field>
        </div>
        <div className="row">
          <Field label="Currency" name="currency" errors={errors} hint="three letters; quotes must be in this currency">
            <input
              id="f-currency"
              value={head.currency}
              onChange={setH("currency")}
              maxLength={3}
              style={{ maxWidth: "6rem" }}
              {...invalid(errors, "currency")}
            />
          </Field>
          <NumberField
            label="Carbon price, per t CO2"
            name="carbonPrice_per_t"
            errors={errors}
            value={head.carbonPrice_per_t}
            onChange={setH("carbonPrice_per_t")}
          />
          <NumberField
            label="Discount rate, %"
            name="discountRatePercent"
            errors={errors}
            value={head.discountRatePercent}
            onChange={setH("discountRatePercent")}
          />
          <NumberField
            label="Horizon, years"
            name="horizonYears"
            errors={errors}
            value={head.horizonYears}
            onChange={setH("horizonYears")}
            integer
          />
          <NumberField
            label="Price escalation, %/yr"
            name="priceEscalationPercent"
            errors={errors}
            value={head.priceEscalationPercent}
            onChange={setH("priceEscalationPercent")}
          />
        </div>
        <div className="row">
          <Field label="Rank scenarios by" name="rankingMetric" errors={errors} hint="the comparison page can switch it at any time">
            <select id="f-rankingMetric" value={head.rankingMetric} onChange={setH("rankingMetric")}>
              {metrics.map((m) => (
                <option key={m.value} value={m.value}>
                  {m.label}
                </option>
              ))}
            </select>
          </Field>
          <Field
            label="Upstream CO2e"
            name="includeUpstream"
            errors={errors}
            hint="well-to-tank emissions of each fuel, where the library states them"
          >
            <select id="f-includeUpstream" value={head.includeUpstream} onChange={setH("includeUpstream")}>
              <option value="no">reported, not counted</option>
              <option value="yes">counted and priced</option>
            </select>
          </Field>
          <Field
            label={label("hydrogenFuelId")}
            name="hydrogenFuelId"
            errors={errors}
            hint="the stored gas the hydrogen sweep blends into the baseline gas (priced by its latest quote in the study's currency)"
          >
            <select id="f-hydrogenFuelId" value={head.hydrogenFuelId} onChange={setH("hydrogenFuelId")}>
              <option value="">none: no hydrogen sweep</option>
              {options.hydrogenFuels.map((f) => (
                <option key={f.id} value={String(f.id)}>
                  {f.name}
                </option>
              ))}
            </select>
          </Field>
        </div>
        <div className="row">
          {SENSITIVITY_KEYS.map((k) => (
            <Field
              key={k}
              label={label(k)}
              name={`sensitivity.${k}`}
              htmlFor={`f-sensitivity-${k}`}
              errors={errors}
              hint={k === "fuelPricePercent" ? "ranges of the sensitivity (tornado) page" : undefined}
            >
              <input
                id={`f-sensitivity-${k}`}
                className="num"
                inputMode="decimal"
                value={head[k]}
                onChange={setH(k)}
                {...invalid(errors, `sensitivity.${k}`)}
              />
            </Field>
          ))}
        </div>
        <Field label="Notes" name="notes" errors={errors}>
          <textarea id="f-notes" value={head.notes} onChange={setH("notes")} maxLength={10000} />
        </Field>
      </fieldset>

      <fieldset>
        <legend>Report cover</legend>
        <p className="hint small-note">
          What the first page of the report shows. An empty title is the study&apos;s name; an empty date is the day the report is opened.
        </p>
        <div className="row">
          <Field label={label("reportTitle")} name="reportTitle" errors={errors}>
            <input
              id="f-reportTitle"
              value={head.reportTitle}
              onChange={setH("reportTitle")}
              maxLength={200}
              placeholder={head.name}
              {...invalid(errors, "reportTitle")}
            />
          </Field>
          <Field label={label("reportDate")} name="reportDate" errors={errors}>
            <input
              id="f-reportDate"
              type="date"
              value={head.reportDate}
              onChange={setH("reportDate")}
              style={{ maxWidth: "11rem" }}
              {...invalid(errors, "reportDate")}
            />
          </Field>
        </div>
        <div className="row">
          <Field label={label("preparedFor")} name="preparedFor" errors={errors}>
            <input
              id="f-preparedFor"
              value={head.preparedFor}
              onChange={setH("preparedFor")}
              maxLength={300}
              {...invalid(errors, "preparedFor")}
            />
          </Field>
          <Field label={label("preparedBy")} name="preparedBy" errors={errors}>
            <input
              id="f-preparedBy"
              value={head.preparedBy}
              onChange={setH("preparedBy")}
              maxLength={300}
              {...invalid(errors, "preparedBy")}
            />
          </Field>
        </div>
        <Field label={label("reportNotes")} name="reportNotes" errors={errors}>
          <textarea id="f-reportNotes" value={head.reportNotes} onChange={setH("reportNotes")} maxLength={10000} />
        </Field>
      </fieldset>

      <fieldset>
        <legend>Scenarios</legend>
        <div className="scenario-list">
          {card(baseline, "baseline")}
          {scenarios.map((x, i) => card(x, i))}
        </div>
        <div className="form-actions" style={{ marginTop: "0.75rem" }}>
          <button
            type="button"
            className="secondary"
            onClick={() => {
              setScenarios((list) => [...list, scenarioState(nextKey.current++)]);
            }}
          >
            + Add candidate
          </button>
          <span className="muted small-note">
            {scenarios.length} candidate{scenarios.length === 1 ? "" : "s"}
          </span>
        </div>
        {errors.scenarios && <span className="field-error">{errors.scenarios}</span>}
      </fieldset>

      <div className="form-actions sticky-actions">
        <button type="submit" disabled={busy}>
          {busy ? "Evaluating and saving…" : initial?.id ? "Save study" : "Create study"}
        </button>
        <Link className="button secondary" href={initial?.id ? `/studies/${initial.id}` : "/studies"}>
          Cancel
        </Link>
      </div>
    </form>
  );
}
