"use client";

/**
 * Create or edit a study: the plant, the economic assumptions, the baseline and the candidate
 * scenarios (a stored fuel or blend, the price quote, capex, fixed opex change and operating-point
 * overrides). The server validates everything and names the field of each problem.
 */
import Link from "next/link";
import { saveAndOpen } from "@/app/_ui/save";
import { useRouter } from "next/navigation";
import { useMemo, useRef, useState } from "react";
import { ErrorSummary, Field, invalid, toNumber, type Errors } from "../../fuels/_components/fields";
import type { StudyFormOptions } from "@/lib/services/studies";
import { quoteChoiceLabel } from "./price-labels";
import { SENSITIVITY_DEFAULTS, type SensitivityRanges } from "@/lib/schemas/study";
import { capitalised, fieldLabel } from "@/lib/schemas/labels";

export interface StudyFormInitial {
  id?: number;
  plantId: number;
  name: string;
  currency: string;
  carbonPrice_per_t: number;
  discountRatePercent: number;
  horizonYears: number;
  priceEscalationPercent: number;
  rankingMetric: string;
  includeUpstream?: boolean;
  sensitivity?: Partial<Record<SensitivityKey, number>>;
  notes: string;
  baseline: ScenarioInitial;
  scenarios: ScenarioInitial[];
}

interface ScenarioInitial {
  name: string;
  fuelId: number;
  priceQuoteId?: number | null;
  capex?: number;
  fixedOpexChange?: number;
  overrides?: Record<string, unknown>;
}

type SensitivityKey = keyof SensitivityRanges;
const SENSITIVITY_KEYS = Object.keys(SENSITIVITY_DEFAULTS) as SensitivityKey[];
const SENSITIVITY_LABELS = Object.fromEntries(SENSITIVITY_KEYS.map((k) => [k, capitalised(fieldLabel(k))])) as Record<SensitivityKey, string>;

const OVERRIDE_KEYS = ["stackTemperatureC", "flueO2DryPercent", "combustionAirC", "radiationLossPercent", "returnWaterC"] as const;
type OverrideKey = (typeof OVERRIDE_KEYS)[number];
const OVERRIDE_LABELS = Object.fromEntries(OVERRIDE_KEYS.map((k) => [k, capitalised(fieldLabel(k))])) as Record<OverrideKey, string>;

interface ScenarioState {
  key: number;
  name: string;
  fuelId: string;
  priceQuoteId: string;
  capex: string;
  fixedOpexChange: string;
  overrides: Record<OverrideKey, string>;
  condensing: "" | "yes" | "no";
}

const s = (v: unknown) => (v === null || v === undefined ? "" : String(v));

function scenarioState(key: number, init?: ScenarioInitial): ScenarioState {
  const o = (init?.overrides ?? {}) as Record<string, unknown>;
  const overrides = {} as Record<OverrideKey, string>;
  for (const k of OVERRIDE_KEYS) overrides[k] = s(o[k]);
  return {
    key,
    name: init?.name ?? "",
    fuelId: init ? s(init.fuelId || "") : "",
    priceQuoteId: s(init?.priceQuoteId ?? ""),
    capex: init?.capex ? String(init.capex) : "0",
    fixedOpexChange: init?.fixedOpexChange ? String(init.fixedOpexChange) : "0",
    overrides,
    condensing: o.condensing === true ? "yes" : o.condensing === false ? "no" : "",
  };
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
  const [head, setHead] = useState({
    plantId: s(initial?.plantId ?? firstPlant?.id ?? ""),
    name: initial?.name ?? "",
    currency: initial?.currency ?? "EUR",
    carbonPrice_per_t: s(initial?.carbonPrice_per_t ?? 80),
    discountRatePercent: s(initial?.discountRatePercent ?? 8),
    horizonYears: s(initial?.horizonYears ?? 15),
    priceEscalationPercent: s(initial?.priceEscalationPercent ?? 0),
    rankingMetric: initial?.rankingMetric ?? "cost-per-useful-MWh",
    includeUpstream: initial?.includeUpstream ? "yes" : "no",
    fuelPricePercent: s(initial?.sensitivity?.fuelPricePercent ?? SENSITIVITY_DEFAULTS.fuelPricePercent),
    carbonPricePercent: s(initial?.sensitivity?.carbonPricePercent ?? SENSITIVITY_DEFAULTS.carbonPricePercent),
    efficiencyPoints: s(initial?.sensitivity?.efficiencyPoints ?? SENSITIVITY_DEFAULTS.efficiencyPoints),
    capexPercent: s(initial?.sensitivity?.capexPercent ?? SENSITIVITY_DEFAULTS.capexPercent),
    notes: initial?.notes ?? "",
  });
  const baselineFuelName = (id: number | null | undefined) => options.fuels.find((f) => f.id === id)?.name ?? "";
  const [baseline, setBaseline] = useState<ScenarioState>(() =>
    initial
      ? scenarioState(0, initial.baseline)
      : scenarioState(0, firstPlant?.baselineFuelId ? { name: `${baselineFuelName(firstPlant.baselineFuelId)} (today)`, fuelId: firstPlant.baselineFuelId } : undefined),
  );
  const [scenarios, setScenarios] = useState<ScenarioState[]>(() => (initial ? initial.scenarios.map((x, i) => scenarioState(i + 1, x)) : [scenarioState(1)]));
  const [errors, setErrors] = useState<Errors>({});
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const fuelsByKind = useMemo(() => {
    const m = new Map<string, StudyFormOptions["fuels"]>();
    for (const f of options.fuels) m.set(f.kind, [...(m.get(f.kind) ?? []), f]);
    return [...m.entries()];
  }, [options.fuels]);

  const setH = (k: keyof typeof head) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement | HTMLTextAreaElement>) => setHead((h) => ({ ...h, [k]: e.target.value }));

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
    for (const k of OVERRIDE_KEYS) {
      const v = toNumber(x.overrides[k]);
      if (v !== null) overrides[k] = v;
    }
    if (x.condensing) overrides.condensing = x.condensing === "yes";
    const b: Record<string, unknown> = {
      name: x.name,
      fuelId: x.fuelId === "" ? null : Number(x.fuelId),
      priceQuoteId: x.priceQuoteId === "" ? null : Number(x.priceQuoteId),
      overrides,
    };
    if (!isBaseline) {
      b.capex = toNumber(x.capex) ?? 0;
      b.fixedOpexChange = toNumber(x.fixedOpexChange) ?? 0;
    }
    return b;
  }

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setBusy(true);
    setMessage(null);
    const body = {
      plantId: head.plantId === "" ? null : Number(head.plantId),
      name: head.name,
      currency: head.currency,
      carbonPrice_per_t: toNumber(head.carbonPrice_per_t) ?? 0,
      discountRatePercent: toNumber(head.discountRatePercent),
      horizonYears: toNumber(head.horizonYears),
      priceEscalationPercent: toNumber(head.priceEscalationPercent) ?? 0,
      rankingMetric: head.rankingMetric,
      includeUpstream: head.includeUpstream === "yes",
      sensitivity: Object.fromEntries(SENSITIVITY_KEYS.map((k) => [k, toNumber(head[k])])),
      notes: head.notes,
      baseline: scenarioBody(baseline, true),
      scenarios: scenarios.map((x) => scenarioBody(x, false)),
    };
    await saveAndOpen("/api/studies", initial?.id, body, (id) => `/studies/${id}`, { setBusy, setErrors, setMessage, router });
  }

  const placed = (key: string) =>
    Object.keys(head).includes(key) || /^(baseline|scenarios\.\d+)\.(name|fuelId|priceQuoteId|capex|fixedOpexChange|overrides(\.\w+)?)$/.test(key);

  function card(x: ScenarioState, which: "baseline" | number) {
    const p = which === "baseline" ? "baseline" : `scenarios.${which}`;
    const fuel = options.fuels.find((f) => String(f.id) === x.fuelId);
    const quotes = fuel?.quotes ?? [];
    const inForce = quotes.filter((q) => q.currency === head.currency.trim().toUpperCase());
    const overrideCount = OVERRIDE_KEYS.filter((k) => x.overrides[k] !== "").length + (x.condensing ? 1 : 0);
    const hasOverrideError = Object.keys(errors).some((k) => k.startsWith(`${p}.overrides`));
    return (
      <div className={`scenario-card${which === "baseline" ? " baseline" : ""}`} key={x.key} data-testid={which === "baseline" ? "baseline-card" : `scenario-card-${which}`}>
        <header>
          <span className="who">{which === "baseline" ? "Baseline — what the plant does today" : `Candidate ${which + 1}`}</span>
          {which !== "baseline" && (
            <span className="form-actions">
              <button type="button" className="secondary small" onClick={() => move(which, -1)} disabled={which === 0} aria-label={`Move candidate ${which + 1} up`}>
                ↑
              </button>
              <button type="button" className="secondary small" onClick={() => move(which, 1)} disabled={which === scenarios.length - 1} aria-label={`Move candidate ${which + 1} down`}>
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
            <select id={dash(`${p}.fuelId`)} value={x.fuelId} onChange={(e) => update(which, { fuelId: e.target.value })} {...invalid(errors, `${p}.fuelId`)}>
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
            <input id={dash(`${p}.name`)} value={x.name} onChange={(e) => update(which, { name: e.target.value })} maxLength={120} {...invalid(errors, `${p}.name`)} />
          </Field>
        </div>
        <div className="row">
          <Field
            label="Price"
            name={`${p}.priceQuoteId`}
            errors={errors}
            htmlFor={dash(`${p}.priceQuoteId`)}
            hint={
              x.priceQuoteId === ""
                ? inForce.length
                  ? `uses the latest ${head.currency} quote in force`
                  : fuel?.isBlend
                    ? "no quote of its own: priced from its components' quotes"
                    : fuel
                      ? `no ${head.currency} quote: no cost figures`
                      : undefined
                : undefined
            }
          >
            <select id={dash(`${p}.priceQuoteId`)} value={x.priceQuoteId} onChange={(e) => update(which, { priceQuoteId: e.target.value })} {...invalid(errors, `${p}.priceQuoteId`)}>
              <option value="">quote in force (latest, {head.currency || "study currency"})</option>
              {quotes.map((q) => (
                <option key={q.id} value={q.id}>
                  {quoteChoiceLabel(q)}
                  {q.isInvented ? " — invented" : ""}
                </option>
              ))}
            </select>
          </Field>
          {which !== "baseline" && (
            <>
              <Field label={`Switching capex, ${head.currency}`} name={`${p}.capex`} errors={errors} htmlFor={dash(`${p}.capex`)}>
                <input id={dash(`${p}.capex`)} className="num" inputMode="decimal" value={x.capex} onChange={(e) => update(which, { capex: e.target.value })} {...invalid(errors, `${p}.capex`)} />
              </Field>
              <Field label={`Fixed opex change, ${head.currency}/yr`} name={`${p}.fixedOpexChange`} errors={errors} htmlFor={dash(`${p}.fixedOpexChange`)} hint="+ = more cost than the baseline">
                <input
                  id={dash(`${p}.fixedOpexChange`)}
                  className="num"
                  inputMode="decimal"
                  value={x.fixedOpexChange}
                  onChange={(e) => update(which, { fixedOpexChange: e.target.value })}
                  {...invalid(errors, `${p}.fixedOpexChange`)}
                />
              </Field>
            </>
          )}
        </div>
        <details className="overrides" open={hasOverrideError || undefined}>
          <summary>Operating-point overrides{overrideCount ? ` (${overrideCount} set)` : " (none: the plant's values)"}</summary>
          <div className="row">
            {OVERRIDE_KEYS.map((k) => (
              <Field key={k} label={OVERRIDE_LABELS[k]} name={`${p}.overrides.${k}`} errors={errors} htmlFor={dash(`${p}.overrides.${k}`)}>
                <input
                  id={dash(`${p}.overrides.${k}`)}
                  className="num"
                  inputMode="decimal"
                  placeholder="plant's value"
                  value={x.overrides[k]}
                  onChange={(e) => update(which, { overrides: { ...x.overrides, [k]: e.target.value } })}
                  {...invalid(errors, `${p}.overrides.${k}`)}
                />
              </Field>
            ))}
            <Field label="Condensing" name={`${p}.overrides.condensing`} errors={errors} htmlFor={dash(`${p}.overrides.condensing`)}>
              <select id={dash(`${p}.overrides.condensing`)} value={x.condensing} onChange={(e) => update(which, { condensing: e.target.value as ScenarioState["condensing"] })}>
                <option value="">plant&apos;s value</option>
                <option value="yes">condensing</option>
                <option value="no">not condensing</option>
              </select>
            </Field>
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
    <form className="stack decision-form" onSubmit={submit} noValidate aria-label={initial?.id ? "Edit study" : "New study"} style={{ maxWidth: 1000 }}>
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
            <input id="f-currency" value={head.currency} onChange={setH("currency")} maxLength={3} style={{ maxWidth: "6rem" }} {...invalid(errors, "currency")} />
          </Field>
          <Field label="Carbon price, per t CO2" name="carbonPrice_per_t" errors={errors}>
            <input id="f-carbonPrice_per_t" className="num" inputMode="decimal" value={head.carbonPrice_per_t} onChange={setH("carbonPrice_per_t")} {...invalid(errors, "carbonPrice_per_t")} />
          </Field>
          <Field label="Discount rate, %" name="discountRatePercent" errors={errors}>
            <input id="f-discountRatePercent" className="num" inputMode="decimal" value={head.discountRatePercent} onChange={setH("discountRatePercent")} {...invalid(errors, "discountRatePercent")} />
          </Field>
          <Field label="Horizon, years" name="horizonYears" errors={errors}>
            <input id="f-horizonYears" className="num" inputMode="numeric" value={head.horizonYears} onChange={setH("horizonYears")} {...invalid(errors, "horizonYears")} />
          </Field>
          <Field label="Price escalation, %/yr" name="priceEscalationPercent" errors={errors}>
            <input
              id="f-priceEscalationPercent"
              className="num"
              inputMode="decimal"
              value={head.priceEscalationPercent}
              onChange={setH("priceEscalationPercent")}
              {...invalid(errors, "priceEscalationPercent")}
            />
          </Field>
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
          <Field label="Upstream CO2e" name="includeUpstream" errors={errors} hint="well-to-tank emissions of each fuel, where the library states them">
            <select id="f-includeUpstream" value={head.includeUpstream} onChange={setH("includeUpstream")}>
              <option value="no">reported, not counted</option>
              <option value="yes">counted and priced</option>
            </select>
          </Field>
        </div>
        <div className="row">
          {SENSITIVITY_KEYS.map((k) => (
            <Field key={k} label={SENSITIVITY_LABELS[k]} name={`sensitivity.${k}`} errors={errors} hint={k === "fuelPricePercent" ? "ranges of the sensitivity (tornado) page" : undefined}>
              <input id={`f-sensitivity.${k}`} className="num" inputMode="decimal" value={head[k]} onChange={setH(k)} {...invalid(errors, `sensitivity.${k}`)} />
            </Field>
          ))}
        </div>
        <Field label="Notes" name="notes" errors={errors}>
          <textarea id="f-notes" value={head.notes} onChange={setH("notes")} maxLength={10000} />
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
          <span className="muted small-note">{scenarios.length} candidate{scenarios.length === 1 ? "" : "s"}</span>
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
