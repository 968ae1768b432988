/**
 * What every field is called where a person reads it: forms, error messages, the report and the
 * exports' notes. One map, keyed by the field's name as the schemas spell it; `labelOfPath` turns a
 * dotted path (`scenarios.2.overrides.stackTemperatureC`) into words ("scenario 3 — stack
 * temperature, °C"). A test checks every field of the plant, study and library schemas has a label.
 */

export const FIELD_LABELS: Readonly<Record<string, string>> = Object.freeze({
  // plant
  name: "name",
  site: "site",
  equipmentType: "equipment",
  ratedInput_kW: "rated heat input, kW",
  ratedInputBasis: "basis of the rated input",
  annualUsefulHeat_MWh: "annual useful heat, MWh",
  operatingHours: "operating hours per year",
  averageLoadFraction: "average load, fraction of rated input",
  ambientAir: "ambient air",
  temperatureC: "temperature, °C",
  relativeHumidityPercent: "relative humidity, %",
  notes: "notes",
  baselineFuelId: "fuel burnt today (baseline)",
  // operating point (plant and scenario overrides)
  stackTemperatureC: "stack temperature, °C",
  flueO2DryPercent: "flue-gas O2, vol % dry",
  combustionAirC: "combustion air temperature, °C",
  radiationLossPercent: "radiation and casing loss at rated load, % of input",
  condensing: "condensing unit",
  returnWaterC: "return-water (heat sink) temperature, °C",
  condensingApproachK: "approach of the stack to the heat sink, K",
  flueCODryPpm: "CO in the dry flue gas, ppm",
  unburntCarbonInAshPercent: "unburnt carbon in the ash, % of residue",
  // limits
  wobbeTolerancePercent: "Wobbe index tolerance, ± % of the baseline",
  wobbeMin_MJ_per_m3: "lowest Wobbe index, MJ/m³",
  wobbeMax_MJ_per_m3: "highest Wobbe index, MJ/m³",
  wobbeMeteringReference: "metering reference of the Wobbe range",
  wobbeCombustionReferenceC: "combustion reference of the Wobbe range, °C",
  maxFlameTempRiseK: "largest flame-temperature rise, K",
  flueGasCapacity_m3_per_h: "flue-gas fan capacity, m³/h",
  flueGasCapacityBasis: "flue-gas fan capacity basis",
  airCapacity_m3_per_h: "combustion-air fan capacity, m³/h",
  airCapacityBasis: "combustion-air fan capacity basis",
  fuelSupplyCapacity_m3_per_h: "fuel supply and meter capacity, m³/h",
  fuelSupplyMeteringReference: "metering reference of the fuel supply capacity",
  maxH2SharePercent: "burner maker's largest hydrogen share, vol %",
  warnAtFractionOfLimit: "warn from this fraction of a limit",
  dewPointMarginK: "margin above the water dew point, K",
  // burner, permit and fuel trains
  burner: "burner",
  type: "burner type",
  airControl: "air-ratio control",
  flashbackWarnRatio: "flashback: warn from burning-velocity ratio",
  flashbackFailRatio: "flashback: fail from burning-velocity ratio",
  regulatedSupply: "gas supply pressure regulated",
  noxLimit_mg_per_m3: "NOx permit limit, mg/m³",
  noxReferenceO2Percent: "reference O2 of the permit, % dry",
  noxMeasuredBaseline_mg_per_m3: "NOx measured on the baseline fuel, mg/m³",
  so2Limit_mg_per_m3: "SO2 permit limit, mg/m³",
  gasBurnerPressure_kPa: "gas pressure at the burner on the baseline, kPa",
  gasSupplyPressure_kPa: "gas supply pressure available, kPa",
  liquidTrain: "liquid fuel train",
  flowCapacity: "liquid-train capacity",
  flowUnit: "unit of the liquid-train capacity",
  viscosityMin_mm2_per_s: "lowest viscosity at the atomiser, mm²/s",
  viscosityMax_mm2_per_s: "highest viscosity at the atomiser, mm²/s",
  firingTemperatureC: "liquid temperature at the atomiser, °C",
  referenceFuel: "reference liquid of the train",
  kinematicViscosity: "kinematic viscosity",
  mm2_per_s: "viscosity, mm²/s",
  flameStepPercent: "flame-solve step, vol % H2",
  // study
  format: "file format",
  version: "file format version",
  currency: "currency",
  carbonPrice_per_t: "carbon price per t CO2",
  discountRatePercent: "discount rate, %",
  horizonYears: "horizon, years",
  priceEscalationPercent: "fuel price escalation, % per year",
  rankingMetric: "ranking metric",
  includeUpstream: "count upstream (well-to-tank) CO2e",
  sensitivity: "sensitivity ranges",
  fuelPricePercent: "fuel prices ± %",
  carbonPricePercent: "carbon price ± %",
  efficiencyPoints: "efficiency ± points",
  capexPercent: "capex ± %",
  reportTitle: "report title",
  preparedFor: "prepared for",
  preparedBy: "prepared by",
  reportDate: "report date",
  reportNotes: "consultant's notes on the cover",
  hydrogenSweep: "hydrogen sweep",
  enabled: "enabled",
  stepPercent: "step, vol % H2",
  hydrogen: "hydrogen fuel",
  hydrogenPrice: "hydrogen price",
  hydrogenFuelId: "hydrogen for the sweep",
  plant: "plant",
  plantId: "plant",
  baseline: "baseline",
  scenarios: "scenarios",
  fuel: "fuel",
  fuelId: "fuel",
  price: "price",
  priceQuoteId: "price quote",
  priceValidOn: "quote rule: latest quote valid on",
  fromCurrency: "currency converted from",
  toCurrency: "currency converted to",
  rate: "exchange rate",
  confirmImplausible: "confirm an implausible price",
  componentPrices: "component prices",
  capex: "switching capex",
  fixedOpexChange: "fixed opex change per year",
  overrides: "changes to the operating point and limits",
  paths: "price and carbon paths over the horizon",
  uncertainty: "uncertainty ranges",
  // accounts and the trash (team mode)
  email: "e-mail (sign-in name)",
  displayName: "display name",
  role: "role",
  password: "password",
  currentPassword: "current password",
  newPassword: "new password",
  disabled: "disabled",
  accountId: "account",
  tokenName: "token name",
  lifetimeDays: "token lifetime (days)",
  deletedAt: "moved to the trash on",
  deletedBy: "moved to the trash by",
  stackTemperatureK: "stack temperature after the change, ± K",
  stackTemperatureByScenario: "stack temperature per scenario, ± K",
  // library
  kind: "kind",
  definition: "definition",
  blend: "blend",
  basis: "basis",
  components: "components",
  share: "share",
  composition: "composition",
  compound: "compound",
  phase: "phase",
  ultimate: "ultimate analysis",
  densityKgPerM3: "density, kg/m³",
  biogenicCarbonShare: "biogenic share of the carbon",
  upstreamCo2e_kg_per_GJ: "upstream CO2e, kg/GJ",
  source: "source",
  isDemo: "demo record",
  amount: "amount",
  unit: "unit",
  energyBasis: "energy basis",
  meteringReference: "metering reference",
  transportAdder: "transport adder",
  handlingAdder: "handling adder",
  validFrom: "valid from",
  supplier: "supplier",
  sourceNote: "where the price comes from",
  isInvented: "invented (demo) price",
});

/** The words for one field name; an unknown name is returned as it is (a test keeps the map complete). */
export function fieldLabel(name: string): string {
  return FIELD_LABELS[name] ?? name;
}

/** Capitalises the first letter of a label for a heading or a form label. */
export function capitalised(label: string): string {
  return label.charAt(0).toUpperCase() + label.slice(1);
}

const LIST_ITEM: Readonly<Record<string, string>> = {
  scenarios: "scenario",
  components: "component",
  blend: "component",
  componentPrices: "component price",
};

/**
 * A dotted field path in words: `scenarios.2.overrides.stackTemperatureC` → "scenario 3 — stack
 * temperature, °C"; `definition.composition.CH4` → "composition — CH4". Chemical formulas stay as they are.
 */
export function labelOfPath(path: string): string {
  const parts = path.split(".").filter((p) => p !== "");
  const words: string[] = [];
  for (let i = 0; i < parts.length; i++) {
    const p = parts[i];
    const next = parts[i + 1];
    if (LIST_ITEM[p] && next !== undefined && /^\d+$/.test(next)) {
      words.push(`${LIST_ITEM[p]} ${Number(next) + 1}`);
      i++;
    } else if (p === "definition" || p === "overrides" || (p === "plant" && parts.length > i + 1)) {
      // containers whose own name adds nothing in front of the field
    } else if (/^\d+$/.test(p)) {
      words.push(`item ${Number(p) + 1}`);
    } else {
      words.push(FIELD_LABELS[p] ?? p);
    }
  }
  return words.join(" — ") || "the input";
}

/** A field and its value in words, e.g. "stack temperature, °C: 65", "condensing unit: yes". */
export function fieldValueText(name: string, value: unknown): string {
  const v =
    typeof value === "boolean"
      ? value
        ? "yes"
        : "no"
      : typeof value === "number"
        ? String(Number(value.toPrecision(6)))
        : value === null || value === undefined
          ? "not set"
          : String(value);
  return `${fieldLabel(name)}: ${v}`;
}
