/**
 * Zod schema of a plant (one fired unit): duty, operating point and the limits a candidate fuel
 * must respect. Field names follow the Plant table of the database, so the app can build the
 * same object from a stored row and the command line from a study file.
 */
import { z } from "zod";
import { METERING_REFERENCE_KEYS, METERING_REFERENCES, type MeteringReferenceKey } from "../units/metering";
import { nameSchema } from "./names";
import { burnerSchema, gasTrainShape, liquidTrainSchema } from "./burner";

export const EQUIPMENT_TYPES = ["steam-boiler", "hot-water-boiler", "thermal-oil-heater", "process-furnace", "kiln", "dryer"] as const;
export type EquipmentType = (typeof EQUIPMENT_TYPES)[number];

export const EQUIPMENT_TYPE_LABELS: Record<EquipmentType, string> = {
  "steam-boiler": "steam boiler",
  "hot-water-boiler": "hot-water boiler",
  "thermal-oil-heater": "thermal-oil heater",
  "process-furnace": "process furnace",
  kiln: "kiln",
  dryer: "dryer",
};

export { METERING_REFERENCE_KEYS, type MeteringReferenceKey } from "../units/metering";
/** Metering reference temperature in °C for each key (lib/units/metering.ts holds the records). */
export const METERING_REFERENCE_C: Record<MeteringReferenceKey, number> = Object.fromEntries(
  METERING_REFERENCE_KEYS.map((k) => [k, METERING_REFERENCES[k].temperatureC]),
) as Record<MeteringReferenceKey, number>;
const METERING_KEY_MESSAGE = `must be one of ${METERING_REFERENCE_KEYS.map((k) => `"${k}"`).join(", ")}`;

/** Combustion reference temperatures accepted for an absolute Wobbe range (ISO 6976:2016 tables). */
export const WOBBE_COMBUSTION_REFERENCES_C = [0, 15, 15.55, 20, 25] as const;

/** How a fan capacity is stated: actual m³/h at the gas temperature, or normal m³/h (0 °C, 101.325 kPa). */
export const FAN_CAPACITY_BASES = ["actual", "normal"] as const;
export type FanCapacityBasis = (typeof FAN_CAPACITY_BASES)[number];

const num = (what = "must be a number") => z.number({ error: what }).finite(what);
const optionalPositive = (max: number, unit: string) => num().positive("must be > 0").max(max, `must be ≤ ${max} ${unit}`).nullish();

/** The operating point; each field can also be overridden per scenario. */
export const operatingPointShape = {
  /** Flue-gas temperature leaving the unit (after any economiser/condenser), °C. */
  stackTemperatureC: num().min(20, "must be ≥ 20 °C").max(1200, "must be ≤ 1200 °C"),
  /** Oxygen in the dry flue gas, vol %. */
  flueO2DryPercent: num().min(0, "must be ≥ 0 %").max(18, "must be ≤ 18 % (leaves too little to burn)"),
  /** Combustion-air temperature at the burner (after any preheater), °C. */
  combustionAirC: num().min(-40, "must be ≥ −40 °C").max(900, "must be ≤ 900 °C"),
  /** Radiation and casing loss, % of heat input on the net basis at rated load. */
  radiationLossPercent: num().min(0, "must be ≥ 0 %").max(15, "must be ≤ 15 %"),
  /** Condensing heat exchanger fitted. */
  condensing: z.boolean({ error: "must be true or false" }),
  /** Return-water (or coldest heat-sink) temperature for a condensing unit, °C. */
  returnWaterC: num().min(5, "must be ≥ 5 °C").max(200, "must be ≤ 200 °C").nullish(),
  /** Condensing units: how far the flue gas leaving stays above the return water at best, K. */
  condensingApproachK: num().min(0, "must be ≥ 0 K").max(50, "must be ≤ 50 K"),
  /** CO in the dry flue gas, ppm by volume (charged as an unburnt loss). */
  flueCODryPpm: num().min(0, "must be ≥ 0 ppm").max(50_000, "must be ≤ 50 000 ppm"),
  /** Unburnt carbon in the ash (residue) of a solid fuel, % by mass of the residue. */
  unburntCarbonInAshPercent: num().min(0, "must be ≥ 0 %").max(90, "must be ≤ 90 % of the residue"),
};

/**
 * Default approach of the flue gas leaving a condensing unit to its return water, K
 * (common practice, no source).
 */
export const DEFAULT_CONDENSING_APPROACH_K = 5;

/** Lowest stack temperature a condensing unit can reach: return water + approach, °C. */
export function condensingStackFloorC(returnWaterC: number, condensingApproachK: number): number {
  return returnWaterC + condensingApproachK;
}

export const ambientAirSchema = z
  .object({
    /** Ambient temperature at which the relative humidity is stated, °C. */
    temperatureC: num().min(-40, "must be ≥ −40 °C").max(60, "must be ≤ 60 °C").default(15),
    /** Relative humidity of the ambient air, %. The absolute humidity is kept when the air is preheated. */
    relativeHumidityPercent: num().min(0, "must be ≥ 0 %").max(100, "must be ≤ 100 %").default(60),
  })
  .strict();

export const plantLimitsShape = {
  /** Wobbe band as ± percent of the baseline fuel's Wobbe index (gross basis). */
  wobbeTolerancePercent: num().positive("must be > 0").max(50, "must be ≤ 50 %").nullish(),
  /** Absolute Wobbe range, MJ/m³ on the gross basis at the two references below. */
  wobbeMin_MJ_per_m3: num().positive("must be > 0").max(100, "must be ≤ 100 MJ/m³").nullish(),
  wobbeMax_MJ_per_m3: num().positive("must be > 0").max(100, "must be ≤ 100 MJ/m³").nullish(),
  wobbeMeteringReference: z.enum(METERING_REFERENCE_KEYS, { error: METERING_KEY_MESSAGE }).default("15C"),
  wobbeCombustionReferenceC: num()
    .refine((v) => (WOBBE_COMBUSTION_REFERENCES_C as readonly number[]).includes(v), {
      message: `must be one of ${WOBBE_COMBUSTION_REFERENCES_C.join(", ")} °C`,
    })
    .default(15),
  /** Largest acceptable rise of the adiabatic flame temperature over the baseline fuel's, K. */
  maxFlameTempRiseK: num().min(0, "must be ≥ 0 K").max(1000, "must be ≤ 1000 K").nullish(),
  /** Induced-draught / flue-gas fan capacity, m³/h (wet) on the basis below. */
  flueGasCapacity_m3_per_h: optionalPositive(1e8, "m³/h"),
  flueGasCapacityBasis: z.enum(FAN_CAPACITY_BASES, { error: 'must be "actual" or "normal"' }).default("actual"),
  /** Combustion-air fan capacity, m³/h on the basis below. */
  airCapacity_m3_per_h: optionalPositive(1e8, "m³/h"),
  airCapacityBasis: z.enum(FAN_CAPACITY_BASES, { error: 'must be "actual" or "normal"' }).default("actual"),
  /** Fuel supply / meter capacity: gases m³/h at the metering reference below; liquids m³/h of liquid at 15 °C. */
  fuelSupplyCapacity_m3_per_h: optionalPositive(1e8, "m³/h"),
  fuelSupplyMeteringReference: z.enum(METERING_REFERENCE_KEYS, { error: METERING_KEY_MESSAGE }).default("0C"),
  /** Burner maker's stated maximum hydrogen share, vol % of the fuel gas. */
  maxH2SharePercent: num().min(0, "must be ≥ 0 %").max(100, "must be ≤ 100 %").nullish(),
  /** A check warns when a value uses at least this fraction of its allowance (0.9 = within 10 % of the limit). */
  warnAtFractionOfLimit: num().min(0.5, "must be ≥ 0.5").max(1, "must be ≤ 1").default(0.9),
  /** A stack less than this far above the water dew point warns (non-condensing units), K. */
  dewPointMarginK: num().min(0, "must be ≥ 0 K").max(100, "must be ≤ 100 K").default(10),
  /** Permit limit of NOx (as NO2), mg/m³ dry at 0 °C, 101.325 kPa and the reference O2 below. */
  noxLimit_mg_per_m3: num().positive("must be > 0").max(10_000, "must be ≤ 10 000 mg/m³").nullish(),
  /** Reference O2 of the permit limits, % dry; absent = the reference for the fuel type (3 % gases and liquids, 6 % solids). */
  noxReferenceO2Percent: num().min(0, "must be ≥ 0 %").max(20, "must be ≤ 20 %").nullish(),
  /** NOx measured on the baseline fuel, mg/m³ dry at the reference O2: the candidates' figures are scaled from it. */
  noxMeasuredBaseline_mg_per_m3: num().positive("must be > 0").max(10_000, "must be ≤ 10 000 mg/m³").nullish(),
  /** Permit limit of SO2, mg/m³ dry at the same reference O2. */
  so2Limit_mg_per_m3: num().positive("must be > 0").max(50_000, "must be ≤ 50 000 mg/m³").nullish(),
  /** The burner: type, air-ratio control, flashback thresholds, supply regulation (absent = not described). */
  burner: burnerSchema.nullish(),
  ...gasTrainShape,
};

export const plantSchema = z
  .object(
    {
      name: nameSchema(120, "name the plant"),
      site: z.string().max(200, "must be ≤ 200 characters").default(""),
      equipmentType: z.enum(EQUIPMENT_TYPES, { error: `must be one of ${EQUIPMENT_TYPES.join(", ")}` }),
      /** Rated heat input (firing rate), kW on the basis below. */
      ratedInput_kW: num().positive("must be > 0").max(5e6, "must be ≤ 5 000 000 kW"),
      /** Basis of the rated input: net (European convention) or gross (North American convention). */
      ratedInputBasis: z.enum(["net", "gross"], { error: 'must be "net" or "gross"' }).default("net"),
      /** Annual useful heat; when absent it follows from hours × load × rated input × baseline efficiency. */
      annualUsefulHeat_MWh: num().positive("must be > 0").max(1e8, "must be ≤ 100 000 000 MWh").nullish(),
      operatingHours: num().min(0, "must be ≥ 0 h").max(8784, "must be ≤ 8784 h"),
      averageLoadFraction: num().min(0, "must be ≥ 0").max(1, "must be ≤ 1 (a fraction of rated input)"),
      ...operatingPointShape,
      condensingApproachK: operatingPointShape.condensingApproachK.default(DEFAULT_CONDENSING_APPROACH_K),
      flueCODryPpm: operatingPointShape.flueCODryPpm.default(0),
      unburntCarbonInAshPercent: operatingPointShape.unburntCarbonInAshPercent.default(0),
      ambientAir: ambientAirSchema.default({ temperatureC: 15, relativeHumidityPercent: 60 }),
      ...plantLimitsShape,
      /** A second, liquid fuel train (dual-fuel plants): its own limits and reference fuel. */
      liquidTrain: liquidTrainSchema.nullish(),
      notes: z.string().max(5000).default(""),
    },
    { error: (iss) => (iss.input === undefined ? "required: the plant (an object)" : "must be an object describing the plant") },
  )
  .strict()
  .superRefine((p, ctx) => {
    if (p.condensing && (p.returnWaterC === undefined || p.returnWaterC === null)) {
      ctx.addIssue({ code: "custom", path: ["returnWaterC"], message: "a condensing unit needs its return-water temperature" });
    } else if (
      p.condensing &&
      p.returnWaterC != null &&
      p.stackTemperatureC < condensingStackFloorC(p.returnWaterC, p.condensingApproachK)
    ) {
      ctx.addIssue({ code: "custom", path: ["stackTemperatureC"], message: stackBelowFloorMessage(p.returnWaterC, p.condensingApproachK) });
    }
    if ((p.annualUsefulHeat_MWh ?? null) === null && p.operatingHours * p.averageLoadFraction <= 0) {
      ctx.addIssue({
        code: "custom",
        path: ["annualUsefulHeat_MWh"],
        message: "give the annual useful heat, or operating hours and an average load above zero",
      });
    }
    const lo = p.wobbeMin_MJ_per_m3 ?? null;
    const hi = p.wobbeMax_MJ_per_m3 ?? null;
    if ((lo === null) !== (hi === null)) {
      ctx.addIssue({
        code: "custom",
        path: [lo === null ? "wobbeMin_MJ_per_m3" : "wobbeMax_MJ_per_m3"],
        message: "an absolute Wobbe range needs both minimum and maximum",
      });
    } else if (lo !== null && hi !== null && !(hi > lo)) {
      ctx.addIssue({ code: "custom", path: ["wobbeMax_MJ_per_m3"], message: "must be greater than wobbeMin_MJ_per_m3" });
    }
  });

/** Why a condensing unit's stack temperature is refused (one wording for the schema and lib/plant). */
export function stackBelowFloorMessage(returnWaterC: number, condensingApproachK: number): string {
  return `a condensing unit's flue gas cannot leave colder than the return water (${returnWaterC} °C) plus the approach (${condensingApproachK} K): must be ≥ ${condensingStackFloorC(returnWaterC, condensingApproachK)} °C`;
}

export type PlantInput = z.input<typeof plantSchema>;
export type Plant = z.output<typeof plantSchema>;

/**
 * Per-scenario overrides (any subset): the operating point, and the burner-related limits a
 * scenario changes (e.g. a new burner rated for more hydrogen).
 */
export const operatingOverridesSchema = z
  .object({
    maxH2SharePercent: plantLimitsShape.maxH2SharePercent,
    maxFlameTempRiseK: plantLimitsShape.maxFlameTempRiseK,
    wobbeTolerancePercent: plantLimitsShape.wobbeTolerancePercent,
    burner: plantLimitsShape.burner,
    noxLimit_mg_per_m3: plantLimitsShape.noxLimit_mg_per_m3,
    noxReferenceO2Percent: plantLimitsShape.noxReferenceO2Percent,
    noxMeasuredBaseline_mg_per_m3: plantLimitsShape.noxMeasuredBaseline_mg_per_m3,
    so2Limit_mg_per_m3: plantLimitsShape.so2Limit_mg_per_m3,
    stackTemperatureC: operatingPointShape.stackTemperatureC.optional(),
    flueO2DryPercent: operatingPointShape.flueO2DryPercent.optional(),
    combustionAirC: operatingPointShape.combustionAirC.optional(),
    radiationLossPercent: operatingPointShape.radiationLossPercent.optional(),
    condensing: operatingPointShape.condensing.optional(),
    returnWaterC: operatingPointShape.returnWaterC,
    condensingApproachK: operatingPointShape.condensingApproachK.optional(),
    flueCODryPpm: operatingPointShape.flueCODryPpm.optional(),
    unburntCarbonInAshPercent: operatingPointShape.unburntCarbonInAshPercent.optional(),
  })
  .strict();
export type OperatingOverrides = z.output<typeof operatingOverridesSchema>;

/** The operating point a scenario runs at: the plant's, with the scenario's overrides applied. */
export interface OperatingPoint {
  stackTemperatureC: number;
  flueO2DryPercent: number;
  combustionAirC: number;
  radiationLossPercent: number;
  condensing: boolean;
  returnWaterC: number | null;
  condensingApproachK: number;
  flueCODryPpm: number;
  unburntCarbonInAshPercent: number;
  ambientAir: { temperatureC: number; relativeHumidityPercent: number };
}

/** The plant's limits as a scenario sees them: the plant's, with the scenario's limit overrides applied. */
export function plantWithOverrides(plant: Plant, overrides: OperatingOverrides = {}): Plant {
  const out: Plant = { ...plant };
  if (overrides.maxH2SharePercent !== undefined) out.maxH2SharePercent = overrides.maxH2SharePercent;
  if (overrides.maxFlameTempRiseK !== undefined) out.maxFlameTempRiseK = overrides.maxFlameTempRiseK;
  if (overrides.wobbeTolerancePercent !== undefined) out.wobbeTolerancePercent = overrides.wobbeTolerancePercent;
  if (overrides.burner !== undefined) out.burner = overrides.burner;
  if (overrides.noxLimit_mg_per_m3 !== undefined) out.noxLimit_mg_per_m3 = overrides.noxLimit_mg_per_m3;
  if (overrides.noxReferenceO2Percent !== undefined) out.noxReferenceO2Percent = overrides.noxReferenceO2Percent;
  if (overrides.noxMeasuredBaseline_mg_per_m3 !== undefined) out.noxMeasuredBaseline_mg_per_m3 = overrides.noxMeasuredBaseline_mg_per_m3;
  if (overrides.so2Limit_mg_per_m3 !== undefined) out.so2Limit_mg_per_m3 = overrides.so2Limit_mg_per_m3;
  return out;
}

export function operatingPointOf(plant: Plant, overrides: OperatingOverrides = {}): OperatingPoint {
  const condensing = overrides.condensing ?? plant.condensing;
  return {
    stackTemperatureC: overrides.stackTemperatureC ?? plant.stackTemperatureC,
    flueO2DryPercent: overrides.flueO2DryPercent ?? plant.flueO2DryPercent,
    combustionAirC: overrides.combustionAirC ?? plant.combustionAirC,
    radiationLossPercent: overrides.radiationLossPercent ?? plant.radiationLossPercent,
    condensing,
    returnWaterC: overrides.returnWaterC ?? plant.returnWaterC ?? null,
    condensingApproachK: overrides.condensingApproachK ?? plant.condensingApproachK,
    flueCODryPpm: overrides.flueCODryPpm ?? plant.flueCODryPpm,
    unburntCarbonInAshPercent: overrides.unburntCarbonInAshPercent ?? plant.unburntCarbonInAshPercent,
    ambientAir: plant.ambientAir,
  };
}
