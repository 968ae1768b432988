"use client";

/** Create or edit a plant: duty, operating point and the limits candidate fuels are checked against. */
import Link from "next/link";
import { saveAndOpen } from "@/app/_ui/save";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { ErrorSummary, Field, FieldError, invalid, toNumber, type Errors } from "../../fuels/_components/fields";
import { CAPACITY_UNITS_KW, capacityToKW, type CapacityUnit } from "@/lib/units/number-entry";
import { DEFAULT_CONDENSING_APPROACH_K } from "@/lib/schemas/plant";
import {
  AIR_CONTROL_LABELS,
  AIR_CONTROLS,
  BURNER_TYPE_LABELS,
  BURNER_TYPES,
  FLASHBACK_DEFAULTS,
  LIQUID_FLOW_UNITS,
} from "@/lib/schemas/burner";

export interface PlantFormOptions {
  fuels: { id: number; name: string; kind: string }[];
  equipmentTypes: { value: string; label: string }[];
  meteringReferences: { value: string; label: string }[];
  wobbeCombustionReferences: number[];
}

/** Plant values as the API returns them (GET /api/plants/{id}). */
export type PlantFormInitial = Record<string, unknown> & { id: number; baselineFuelId: number | null };

const NUMBER_FIELDS = [
  "ratedInput_kW",
  "annualUsefulHeat_MWh",
  "operatingHours",
  "averageLoadFraction",
  "stackTemperatureC",
  "flueO2DryPercent",
  "combustionAirC",
  "radiationLossPercent",
  "returnWaterC",
  "condensingApproachK",
  "flueCODryPpm",
  "unburntCarbonInAshPercent",
  "ambientAir.temperatureC",
  "ambientAir.relativeHumidityPercent",
  "wobbeTolerancePercent",
  "wobbeMin_MJ_per_m3",
  "wobbeMax_MJ_per_m3",
  "maxFlameTempRiseK",
  "flueGasCapacity_m3_per_h",
  "airCapacity_m3_per_h",
  "fuelSupplyCapacity_m3_per_h",
  "maxH2SharePercent",
  "warnAtFractionOfLimit",
  "dewPointMarginK",
  "burner.flashbackWarnRatio",
  "burner.flashbackFailRatio",
  "noxLimit_mg_per_m3",
  "noxReferenceO2Percent",
  "noxMeasuredBaseline_mg_per_m3",
  "so2Limit_mg_per_m3",
  "gasBurnerPressure_kPa",
  "gasSupplyPressure_kPa",
  "liquidTrain.flowCapacity",
  "liquidTrain.viscosityMin_mm2_per_s",
  "liquidTrain.viscosityMax_mm2_per_s",
  "liquidTrain.firingTemperatureC",
  "liquidTrain.flueO2DryPercent",
] as const;
type NumField = (typeof NUMBER_FIELDS)[number];

/** Defaults for a new plant: a typical gas-fired steam boiler (common practice, to be overwritten). */
const NEW_DEFAULTS: Record<NumField, string> = {
  ratedInput_kW: "",
  annualUsefulHeat_MWh: "",
  operatingHours: "6000",
  averageLoadFraction: "0.6",
  stackTemperatureC: "150",
  flueO2DryPercent: "3",
  combustionAirC: "25",
  radiationLossPercent: "1",
  returnWaterC: "",
  condensingApproachK: String(DEFAULT_CONDENSING_APPROACH_K),
  flueCODryPpm: "0",
  unburntCarbonInAshPercent: "0",
  "ambientAir.temperatureC": "15",
  "ambientAir.relativeHumidityPercent": "60",
  wobbeTolerancePercent: "5",
  wobbeMin_MJ_per_m3: "",
  wobbeMax_MJ_per_m3: "",
  maxFlameTempRiseK: "",
  flueGasCapacity_m3_per_h: "",
  airCapacity_m3_per_h: "",
  fuelSupplyCapacity_m3_per_h: "",
  maxH2SharePercent: "",
  warnAtFractionOfLimit: "0.9",
  dewPointMarginK: "10",
  "burner.flashbackWarnRatio": String(FLASHBACK_DEFAULTS.warnRatio),
  "burner.flashbackFailRatio": String(FLASHBACK_DEFAULTS.failRatio),
  noxLimit_mg_per_m3: "",
  noxReferenceO2Percent: "",
  noxMeasuredBaseline_mg_per_m3: "",
  so2Limit_mg_per_m3: "",
  gasBurnerPressure_kPa: "",
  gasSupplyPressure_kPa: "",
  "liquidTrain.flowCapacity": "",
  "liquidTrain.viscosityMin_mm2_per_s": "",
  "liquidTrain.viscosityMax_mm2_per_s": "",
  "liquidTrain.firingTemperatureC": "20",
  "liquidTrain.flueO2DryPercent": "",
};

function get(o: Record<string, unknown>, path: string): unknown {
  return path.split(".").reduce<unknown>((v, k) => (v && typeof v === "object" ? (v as Record<string, unknown>)[k] : undefined), o);
}
const str = (v: unknown) => (v === null || v === undefined ? "" : String(v));

export function PlantForm({ options, initial }: { options: PlantFormOptions; initial?: PlantFormInitial }) {
  const router = useRouter();
  const [nums, setNums] = useState<Record<NumField, string>>(() => {
    if (!initial) return { ...NEW_DEFAULTS };
    const o = {} as Record<NumField, string>;
    for (const k of NUMBER_FIELDS) o[k] = str(get(initial, k));
    if (!initial.burner) {
      o["burner.flashbackWarnRatio"] = NEW_DEFAULTS["burner.flashbackWarnRatio"];
      o["burner.flashbackFailRatio"] = NEW_DEFAULTS["burner.flashbackFailRatio"];
    }
    if (!initial.liquidTrain) o["liquidTrain.firingTemperatureC"] = NEW_DEFAULTS["liquidTrain.firingTemperatureC"];
    return o;
  });
  const [text, setText] = useState({
    name: str(initial?.name),
    site: str(initial?.site),
    notes: str(initial?.notes),
    equipmentType: str(initial?.equipmentType ?? "steam-boiler"),
    ratedInputBasis: str(initial?.ratedInputBasis ?? "net"),
    baselineFuelId: str(initial?.baselineFuelId ?? ""),
    wobbeMeteringReference: str(initial?.wobbeMeteringReference ?? "15C"),
    wobbeCombustionReferenceC: str(initial?.wobbeCombustionReferenceC ?? 15),
    flueGasCapacityBasis: str(initial?.flueGasCapacityBasis ?? "actual"),
    airCapacityBasis: str(initial?.airCapacityBasis ?? "actual"),
    fuelSupplyMeteringReference: str(initial?.fuelSupplyMeteringReference ?? "0C"),
    burnerType: str(get(initial ?? {}, "burner.type") ?? ""),
    burnerAirControl: str(get(initial ?? {}, "burner.airControl") ?? "fixed-linkage"),
    liquidFlowUnit: str(get(initial ?? {}, "liquidTrain.flowUnit") ?? "L/h"),
    liquidReferenceFuelId: str(
      options.fuels.find((f) => f.name === get(initial ?? {}, "liquidTrain.referenceFuel.name") && f.kind === "liquid")?.id ?? "",
    ),
  });
  const [regulatedSupply, setRegulatedSupply] = useState(get(initial ?? {}, "burner.regulatedSupply") !== false);
  const [hasLiquidTrain, setHasLiquidTrain] = useState(Boolean(initial?.liquidTrain));
  const [condensing, setCondensing] = useState(Boolean(initial?.condensing));
  const [dutyMode, setDutyMode] = useState<"annual" | "hours">(initial && initial.annualUsefulHeat_MWh != null ? "annual" : "hours");
  const [wobbeMode, setWobbeMode] = useState<"band" | "range" | "none">(
    initial ? (initial.wobbeMin_MJ_per_m3 != null ? "range" : initial.wobbeTolerancePercent != null ? "band" : "none") : "band",
  );
  const [errors, setErrors] = useState<Errors>({});
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [capacityUnit, setCapacityUnit] = useState<CapacityUnit>("kW");

  const setNum = (k: NumField) => (e: React.ChangeEvent<HTMLInputElement>) => setNums((s) => ({ ...s, [k]: e.target.value }));
  const setTxt = (k: keyof typeof text) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement | HTMLTextAreaElement>) =>
    setText((s) => ({ ...s, [k]: e.target.value }));

  const numInput = (k: NumField, label: React.ReactNode, hint?: React.ReactNode, step = "any") => (
    <Field label={label} name={k} errors={errors} hint={hint}>
      <input
        id={`f-${k}`}
        name={k}
        inputMode="decimal"
        type="text"
        className="num"
        value={nums[k]}
        onChange={setNum(k)}
        data-step={step}
        {...invalid(errors, k)}
      />
    </Field>
  );
  const select = (k: keyof typeof text, label: React.ReactNode, opts: { value: string; label: string }[]) => (
    <Field label={label} name={k} errors={errors}>
      <select id={`f-${k}`} name={k} value={text[k]} onChange={setTxt(k)} {...invalid(errors, k)}>
        {opts.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </Field>
  );

  const placed = (key: string) =>
    [
      ...NUMBER_FIELDS,
      ...Object.keys(text),
      "condensing",
      "ambientAir",
      "burner.type",
      "burner.airControl",
      "liquidTrain.referenceFuel",
    ].includes(key) || key.startsWith("ambientAir.");

  /** The rated input in kW, converted from the unit the user chose; unparseable text goes to the server as is. */
  function ratedInputKW(): number | string | null {
    const v = toNumber(nums.ratedInput_kW);
    return typeof v === "number" ? capacityToKW(v, capacityUnit) : v;
  }

  function body(): Record<string, unknown> {
    const n = (k: NumField) => toNumber(nums[k]);
    const b: Record<string, unknown> = {
      name: text.name,
      site: text.site,
      equipmentType: text.equipmentType,
      ratedInput_kW: ratedInputKW(),
      ratedInputBasis: text.ratedInputBasis,
      annualUsefulHeat_MWh: dutyMode === "annual" ? n("annualUsefulHeat_MWh") : null,
      operatingHours: n("operatingHours"),
      averageLoadFraction: n("averageLoadFraction"),
      stackTemperatureC: n("stackTemperatureC"),
      flueO2DryPercent: n("flueO2DryPercent"),
      combustionAirC: n("combustionAirC"),
      radiationLossPercent: n("radiationLossPercent"),
      condensing,
      returnWaterC: condensing ? n("returnWaterC") : null,
      ...(condensing ? { condensingApproachK: n("condensingApproachK") } : {}),
      flueCODryPpm: n("flueCODryPpm"),
      unburntCarbonInAshPercent: n("unburntCarbonInAshPercent"),
      ambientAir: { temperatureC: n("ambientAir.temperatureC"), relativeHumidityPercent: n("ambientAir.relativeHumidityPercent") },
      wobbeTolerancePercent: wobbeMode === "band" ? n("wobbeTolerancePercent") : null,
      wobbeMin_MJ_per_m3: wobbeMode === "range" ? n("wobbeMin_MJ_per_m3") : null,
      wobbeMax_MJ_per_m3: wobbeMode === "range" ? n("wobbeMax_MJ_per_m3") : null,
      wobbeMeteringReference: text.wobbeMeteringReference,
      wobbeCombustionReferenceC: Number(text.wobbeCombustionReferenceC),
      maxFlameTempRiseK: n("maxFlameTempRiseK"),
      flueGasCapacity_m3_per_h: n("flueGasCapacity_m3_per_h"),
      flueGasCapacityBasis: text.flueGasCapacityBasis,
      airCapacity_m3_per_h: n("airCapacity_m3_per_h"),
      airCapacityBasis: text.airCapacityBasis,
      fuelSupplyCapacity_m3_per_h: n("fuelSupplyCapacity_m3_per_h"),
      fuelSupplyMeteringReference: text.fuelSupplyMeteringReference,
      maxH2SharePercent: n("maxH2SharePercent"),
      warnAtFractionOfLimit: n("warnAtFractionOfLimit"),
      dewPointMarginK: n("dewPointMarginK"),
      burner:
        text.burnerType === ""
          ? null
          : {
              type: text.burnerType,
              airControl: text.burnerAirControl,
              flashbackWarnRatio: n("burner.flashbackWarnRatio"),
              flashbackFailRatio: n("burner.flashbackFailRatio"),
              regulatedSupply,
            },
      noxLimit_mg_per_m3: n("noxLimit_mg_per_m3"),
      noxReferenceO2Percent: n("noxReferenceO2Percent"),
      noxMeasuredBaseline_mg_per_m3: n("noxMeasuredBaseline_mg_per_m3"),
      so2Limit_mg_per_m3: n("so2Limit_mg_per_m3"),
      gasBurnerPressure_kPa: n("gasBurnerPressure_kPa"),
      gasSupplyPressure_kPa: n("gasSupplyPressure_kPa"),
      liquidTrain: hasLiquidTrain
        ? {
            flowCapacity: n("liquidTrain.flowCapacity"),
            flowUnit: text.liquidFlowUnit,
            viscosityMin_mm2_per_s: n("liquidTrain.viscosityMin_mm2_per_s"),
            viscosityMax_mm2_per_s: n("liquidTrain.viscosityMax_mm2_per_s"),
            firingTemperatureC: n("liquidTrain.firingTemperatureC"),
            flueO2DryPercent: n("liquidTrain.flueO2DryPercent"),
            referenceFuelId: text.liquidReferenceFuelId === "" ? null : Number(text.liquidReferenceFuelId),
          }
        : null,
      notes: text.notes,
      baselineFuelId: text.baselineFuelId === "" ? null : Number(text.baselineFuelId),
    };
    // The annual demand then follows from hours × load; both are still required by the schema.
    if (dutyMode === "annual") {
      if (b.operatingHours === null) b.operatingHours = 0;
      if (b.averageLoadFraction === null) b.averageLoadFraction = 0;
    }
    return b;
  }

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setBusy(true);
    setMessage(null);
    await saveAndOpen("/api/plants", initial?.id, body(), (id) => `/plants/${id}`, { setBusy, setErrors, setMessage, router });
  }

  const refOpts = options.meteringReferences;
  const fanBasis = [
    { value: "actual", label: "actual m³/h" },
    { value: "normal", label: "normal m³/h (0 °C)" },
  ];

  return (
    <form className="stack decision-form" onSubmit={submit} noValidate aria-label={initial ? "Edit plant" : "New plant"}>
      <ErrorSummary message={message} errors={errors} placed={placed} />

      <fieldset>
        <legend>Plant</legend>
        <div className="row">
          <Field label="Name" name="name" errors={errors}>
            <input id="f-name" name="name" value={text.name} onChange={setTxt("name")} maxLength={120} {...invalid(errors, "name")} />
          </Field>
          <Field label="Site" name="site" errors={errors}>
            <input id="f-site" name="site" value={text.site} onChange={setTxt("site")} maxLength={200} />
          </Field>
        </div>
        <div className="row">
          {select("equipmentType", "Equipment", options.equipmentTypes)}
          <Field label="Fuel burnt today (baseline)" name="baselineFuelId" errors={errors}>
            <select
              id="f-baselineFuelId"
              name="baselineFuelId"
              value={text.baselineFuelId}
              onChange={setTxt("baselineFuelId")}
              {...invalid(errors, "baselineFuelId")}
            >
              <option value="">— choose a fuel —</option>
              {options.fuels.map((f) => (
                <option key={f.id} value={f.id}>
                  {f.name} ({f.kind})
                </option>
              ))}
            </select>
          </Field>
        </div>
      </fieldset>

      <fieldset>
        <legend>Duty</legend>
        <div className="row">
          <Field label="Rated heat input" name="ratedInput_kW" errors={errors} hint={capacityUnit === "kW" ? undefined : "stored in kW"}>
            <span className="input-with-unit">
              <input
                id="f-ratedInput_kW"
                name="ratedInput_kW"
                inputMode="decimal"
                type="text"
                className="num"
                value={nums.ratedInput_kW}
                onChange={setNum("ratedInput_kW")}
                {...invalid(errors, "ratedInput_kW")}
              />
              <select
                aria-label="Unit of the rated heat input"
                value={capacityUnit}
                onChange={(e) => setCapacityUnit(e.target.value as CapacityUnit)}
              >
                {(Object.keys(CAPACITY_UNITS_KW) as CapacityUnit[]).map((u) => (
                  <option key={u} value={u}>
                    {u}
                  </option>
                ))}
              </select>
            </span>
          </Field>
          {select("ratedInputBasis", "Basis of the rated input", [
            { value: "net", label: "net (LHV)" },
            { value: "gross", label: "gross (HHV)" },
          ])}
        </div>
        <div className="radio-row" role="radiogroup" aria-label="Annual useful heat">
          <label>
            <input type="radio" name="dutyMode" checked={dutyMode === "hours"} onChange={() => setDutyMode("hours")} /> from operating hours
            × average load
          </label>
          <label>
            <input type="radio" name="dutyMode" checked={dutyMode === "annual"} onChange={() => setDutyMode("annual")} /> annual useful heat
            known
          </label>
        </div>
        <div className="row">
          {dutyMode === "annual" ? (
            numInput("annualUsefulHeat_MWh", "Annual useful heat, MWh", "heat delivered to the process or network per year")
          ) : (
            <>
              {numInput("operatingHours", "Operating hours per year, h")}
              {numInput("averageLoadFraction", "Average load, fraction of rated input", "e.g. 0.6")}
            </>
          )}
        </div>
        {dutyMode === "hours" && <FieldError errors={errors} name="annualUsefulHeat_MWh" />}
      </fieldset>

      <fieldset>
        <legend>Operating point</legend>
        <div className="row">
          {numInput("stackTemperatureC", "Stack temperature, °C", "flue gas leaving the unit")}
          {numInput("flueO2DryPercent", "Flue-gas O2, vol % dry")}
          {numInput("combustionAirC", "Combustion-air temperature, °C", "at the burner, after any preheater")}
          {numInput(
            "radiationLossPercent",
            "Radiation and casing loss, % of input at rated load",
            "a constant heat flow: its share grows at part load",
          )}
        </div>
        <div className="row">
          {numInput("flueCODryPpm", "CO in the flue gas, ppm dry", "charged as an unburnt loss; 0 if not measured")}
          {numInput("unburntCarbonInAshPercent", "Unburnt carbon in the ash, % of the residue", "solid fuels; 0 if not measured")}
        </div>
        <div className="row">
          <div className="field">
            <span className="label">Condensing</span>
            <label style={{ fontWeight: 400 }}>
              <input type="checkbox" name="condensing" checked={condensing} onChange={(e) => setCondensing(e.target.checked)} /> condensing
              heat exchanger fitted
            </label>
          </div>
          {condensing && numInput("returnWaterC", "Return-water temperature, °C")}
          {condensing &&
            numInput("condensingApproachK", "Approach to the return water, K", "the stack cannot be colder than return water + approach")}
          {numInput("ambientAir.temperatureC", "Ambient air, °C")}
          {numInput("ambientAir.relativeHumidityPercent", "Ambient relative humidity, %")}
        </div>
      </fieldset>

      <fieldset>
        <legend>Limits a new fuel must respect</legend>
        <p className="basis">Leave a limit empty when it is not known: the check then shows the number without pass or fail.</p>
        <div className="radio-row" role="radiogroup" aria-label="Wobbe limit">
          <label>
            <input type="radio" name="wobbeMode" checked={wobbeMode === "band"} onChange={() => setWobbeMode("band")} /> Wobbe band ± % of
            the baseline gas
          </label>
          <label>
            <input type="radio" name="wobbeMode" checked={wobbeMode === "range"} onChange={() => setWobbeMode("range")} /> absolute Wobbe
            range
          </label>
          <label>
            <input type="radio" name="wobbeMode" checked={wobbeMode === "none"} onChange={() => setWobbeMode("none")} /> none
          </label>
        </div>
        <div className="row">
          {wobbeMode === "band" && numInput("wobbeTolerancePercent", "Wobbe tolerance, ± %")}
          {wobbeMode === "range" && (
            <>
              {numInput("wobbeMin_MJ_per_m3", "Wobbe minimum, MJ/m³ (gross)")}
              {numInput("wobbeMax_MJ_per_m3", "Wobbe maximum, MJ/m³ (gross)")}
            </>
          )}
          {wobbeMode !== "none" && select("wobbeMeteringReference", "Wobbe metering reference", refOpts)}
          {wobbeMode !== "none" &&
            select(
              "wobbeCombustionReferenceC",
              "Wobbe combustion reference",
              options.wobbeCombustionReferences.map((c) => ({ value: String(c), label: `${c} °C` })),
            )}
        </div>
        <div className="row">
          {numInput("maxFlameTempRiseK", "Maximum flame-temperature rise, K", "over the baseline fuel (equilibrium method)")}
          {numInput("maxH2SharePercent", "Burner maker's maximum H2, vol %")}
        </div>
        <div className="row">
          {numInput("flueGasCapacity_m3_per_h", "Flue-gas fan capacity, m³/h")}
          {select("flueGasCapacityBasis", "Flue-gas fan basis", fanBasis)}
          {numInput("airCapacity_m3_per_h", "Combustion-air fan capacity, m³/h")}
          {select("airCapacityBasis", "Air fan basis", fanBasis)}
        </div>
        <div className="row">
          {numInput(
            "fuelSupplyCapacity_m3_per_h",
            "Fuel supply / meter capacity, m³/h",
            "gases at the reference below; liquids m³/h of liquid",
          )}
          {select("fuelSupplyMeteringReference", "Supply metering reference", refOpts)}
        </div>
        <div className="row">
          {numInput("warnAtFractionOfLimit", "Warn at this fraction of a limit", "0.9 = warn within 10 % of the limit")}
          {numInput("dewPointMarginK", "Dew-point margin, K", "a stack closer than this above the water dew point warns")}
        </div>
      </fieldset>

      <fieldset>
        <legend>Burner and emission permit</legend>
        <p className="basis">
          What a new gas does to the burner before anyone retunes it, whether its flame may flash back, and NOx and SO2 against the permit.
          Flashback and NOx figures are screening estimates; the burner maker and a measurement decide.
        </p>
        <div className="row">
          <Field label="Burner type" name="burner.type" errors={errors}>
            <select
              id="f-burnerType"
              name="burnerType"
              value={text.burnerType}
              onChange={setTxt("burnerType")}
              {...invalid(errors, "burner.type")}
            >
              <option value="">— not described —</option>
              {BURNER_TYPES.map((t) => (
                <option key={t} value={t}>
                  {BURNER_TYPE_LABELS[t]}
                </option>
              ))}
            </select>
          </Field>
          {text.burnerType !== "" && (
            <Field label="Air-ratio control" name="burner.airControl" errors={errors}>
              <select id="f-burnerAirControl" name="burnerAirControl" value={text.burnerAirControl} onChange={setTxt("burnerAirControl")}>
                {AIR_CONTROLS.map((t) => (
                  <option key={t} value={t}>
                    {AIR_CONTROL_LABELS[t]}
                  </option>
                ))}
              </select>
            </Field>
          )}
          {text.burnerType !== "" && (
            <div className="field">
              <span className="label">Gas supply</span>
              <label style={{ fontWeight: 400 }}>
                <input
                  type="checkbox"
                  name="regulatedSupply"
                  checked={regulatedSupply}
                  onChange={(e) => setRegulatedSupply(e.target.checked)}
                />{" "}
                pressure held by a regulator
              </label>
            </div>
          )}
        </div>
        {text.burnerType !== "" && (
          <div className="row">
            {numInput(
              "burner.flashbackWarnRatio",
              "Flashback: warn from burning velocity × baseline",
              `rule of thumb ${FLASHBACK_DEFAULTS.warnRatio} (common practice, no source); premixed and partially premixed burners`,
            )}
            {numInput(
              "burner.flashbackFailRatio",
              "Flashback: fail from burning velocity × baseline",
              `rule of thumb ${FLASHBACK_DEFAULTS.failRatio}`,
            )}
          </div>
        )}
        <div className="row">
          {numInput("gasBurnerPressure_kPa", "Gas pressure at the burner on the baseline, kPa", "at rated input")}
          {numInput("gasSupplyPressure_kPa", "Gas supply pressure available, kPa", "most the supply delivers ahead of the burner")}
        </div>
        <div className="row">
          {numInput("noxLimit_mg_per_m3", "NOx permit limit, mg/m³", "as NO2, dry, 0 °C, 101.325 kPa")}
          {numInput("so2Limit_mg_per_m3", "SO2 permit limit, mg/m³")}
          {numInput("noxReferenceO2Percent", "Reference O2 of the permit, % dry", "empty: 3 % gases and liquids, 6 % solids")}
          {numInput(
            "noxMeasuredBaseline_mg_per_m3",
            "NOx measured on the baseline fuel, mg/m³",
            "at the reference O2; scales the estimates",
          )}
        </div>
      </fieldset>

      <fieldset>
        <legend>Liquid fuel train (dual-fuel plants)</legend>
        <label style={{ fontWeight: 400 }}>
          <input type="checkbox" name="hasLiquidTrain" checked={hasLiquidTrain} onChange={(e) => setHasLiquidTrain(e.target.checked)} /> the
          plant also fires a liquid on its own train (liquid candidates are judged against it)
        </label>
        {hasLiquidTrain && (
          <>
            <div className="row">
              {numInput("liquidTrain.flowCapacity", "Liquid-train capacity")}
              {select(
                "liquidFlowUnit",
                "Unit of the capacity",
                LIQUID_FLOW_UNITS.map((u) => ({ value: u, label: u })),
              )}
              <Field label="Liquid the train is set up on" name="liquidTrain.referenceFuel" errors={errors}>
                <select
                  id="f-liquidReferenceFuelId"
                  name="liquidReferenceFuelId"
                  value={text.liquidReferenceFuelId}
                  onChange={setTxt("liquidReferenceFuelId")}
                  {...invalid(errors, "liquidTrain.referenceFuel")}
                >
                  <option value="">— choose a liquid —</option>
                  {options.fuels
                    .filter((f) => f.kind === "liquid")
                    .map((f) => (
                      <option key={f.id} value={f.id}>
                        {f.name}
                      </option>
                    ))}
                </select>
              </Field>
            </div>
            <div className="row">
              {numInput("liquidTrain.viscosityMin_mm2_per_s", "Atomiser: lowest viscosity, mm²/s")}
              {numInput("liquidTrain.viscosityMax_mm2_per_s", "Atomiser: highest viscosity, mm²/s")}
              {numInput("liquidTrain.firingTemperatureC", "Liquid temperature at the atomiser, °C")}
              {numInput("liquidTrain.flueO2DryPercent", "Flue O2 on the liquid, % dry", "empty: the plant's")}
            </div>
          </>
        )}
      </fieldset>

      <fieldset>
        <legend>Notes</legend>
        <Field label="Notes" name="notes" errors={errors}>
          <textarea id="f-notes" name="notes" value={text.notes} onChange={setTxt("notes")} maxLength={5000} />
        </Field>
      </fieldset>

      <div className="form-actions">
        <button type="submit" disabled={busy}>
          {busy ? "Saving…" : initial ? "Save plant" : "Create plant"}
        </button>
        <Link className="button secondary" href={initial ? `/plants/${initial.id}` : "/plants"}>
          Cancel
        </Link>
      </div>
    </form>
  );
}
