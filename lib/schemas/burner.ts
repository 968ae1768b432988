/**
 * How a burner mixes and meters: its type and the way its air ratio is controlled, with the
 * flashback thresholds a plant sets. The vocabulary of the burner decisions; lib/plant/burner.ts
 * computes what a new gas does in such a burner.
 */
import { z } from "zod";
import { fuelDefinitionSchema } from "./fuel";

export const BURNER_TYPES = ["premixed", "partially-premixed", "nozzle-mix"] as const;
export type BurnerType = (typeof BURNER_TYPES)[number];
export const BURNER_TYPE_LABELS: Record<BurnerType, string> = {
  premixed: "premixed (surface or perforated)",
  "partially-premixed": "partially premixed",
  "nozzle-mix": "nozzle-mix / diffusion",
};

export const AIR_CONTROLS = ["fixed-linkage", "pneumatic-ratio", "o2-trim"] as const;
export type AirControl = (typeof AIR_CONTROLS)[number];
export const AIR_CONTROL_LABELS: Record<AirControl, string> = {
  "fixed-linkage": "fixed mechanical linkage (air and gas set volumetrically)",
  "pneumatic-ratio": "pneumatic gas/air ratio control",
  "o2-trim": "electronic control with O2 trim",
};

/**
 * Default flashback thresholds: the candidate's laminar burning velocity as a ratio to the baseline
 * gas's at the burner's operating point (rules of thumb: common practice, no source).
 */
export const FLASHBACK_DEFAULTS = Object.freeze({ warnRatio: 1.2, failRatio: 1.5 });

const ratio = (what: string) =>
  z.number({ error: "must be a number" }).finite("must be a number").min(1, `${what} must be ≥ 1`).max(20, `${what} must be ≤ 20`);

export const burnerSchema = z
  .object({
    type: z.enum(BURNER_TYPES, { error: `must be one of ${BURNER_TYPES.join(", ")}` }),
    airControl: z.enum(AIR_CONTROLS, { error: `must be one of ${AIR_CONTROLS.join(", ")}` }),
    flashbackWarnRatio: ratio("the warning ratio").default(FLASHBACK_DEFAULTS.warnRatio),
    flashbackFailRatio: ratio("the failing ratio").default(FLASHBACK_DEFAULTS.failRatio),
    /** Gas supply pressure held by a regulator (the untuned burner's heat input then follows the Wobbe index). */
    regulatedSupply: z.boolean({ error: "must be true or false" }).default(true),
  })
  .strict()
  .refine((b) => b.flashbackFailRatio >= b.flashbackWarnRatio, {
    path: ["flashbackFailRatio"],
    message: "must be at least the warning ratio",
  });
export type Burner = z.output<typeof burnerSchema>;

const pressure = (what: string) =>
  z.number({ error: "must be a number" }).finite("must be a number").positive(`${what} must be > 0`).max(100_000, "must be ≤ 100 000 kPa");

/**
 * The gas train's pressures (gauge, kPa): what the burner needs at rated input on the baseline gas,
 * and the most the supply can deliver ahead of the burner. A gas of lower Wobbe index needs
 * (W_baseline/W_candidate)² of the burner pressure to fire the same heat through the same orifice.
 */
export const gasTrainShape = {
  gasBurnerPressure_kPa: pressure("the burner pressure").nullish(),
  gasSupplyPressure_kPa: pressure("the supply pressure").nullish(),
};

export const LIQUID_FLOW_UNITS = ["L/h", "kg/h"] as const;
export type LiquidFlowUnit = (typeof LIQUID_FLOW_UNITS)[number];

/**
 * The liquid train of a dual-fuel plant: pump/meter capacity, the viscosity range its atomiser takes
 * at the firing temperature, the flue O2 it is set to, and the liquid fuel it was set up on (its
 * reference flame).
 */
export const liquidTrainSchema = z
  .object({
    flowCapacity: z.number({ error: "must be a number" }).finite("must be a number").positive("must be > 0").max(1e8, "must be ≤ 10^8"),
    flowUnit: z.enum(LIQUID_FLOW_UNITS, { error: 'must be "L/h" or "kg/h"' }),
    viscosityMin_mm2_per_s: z
      .number({ error: "must be a number" })
      .finite("must be a number")
      .positive("must be > 0")
      .max(10_000, "must be ≤ 10 000 mm²/s")
      .nullish(),
    viscosityMax_mm2_per_s: z
      .number({ error: "must be a number" })
      .finite("must be a number")
      .positive("must be > 0")
      .max(10_000, "must be ≤ 10 000 mm²/s")
      .nullish(),
    /** Temperature of the liquid at the atomiser, °C. */
    firingTemperatureC: z
      .number({ error: "must be a number" })
      .finite("must be a number")
      .min(-40, "must be ≥ −40 °C")
      .max(250, "must be ≤ 250 °C")
      .default(20),
    /** Flue O2 (dry, vol %) the liquid train is set to; absent = the plant's. */
    flueO2DryPercent: z
      .number({ error: "must be a number" })
      .finite("must be a number")
      .min(0, "must be ≥ 0 %")
      .max(18, "must be ≤ 18 %")
      .nullish(),
    /** The liquid fuel the train is set up on (its flame is the liquid candidates' reference). */
    referenceFuel: z.lazy(() => fuelDefinitionSchema),
  })
  .strict()
  .superRefine((t, ctx) => {
    const lo = t.viscosityMin_mm2_per_s ?? null;
    const hi = t.viscosityMax_mm2_per_s ?? null;
    if (lo !== null && hi !== null && !(hi > lo))
      ctx.addIssue({ code: "custom", path: ["viscosityMax_mm2_per_s"], message: "must be greater than the lowest viscosity" });
  });
export type LiquidTrain = z.output<typeof liquidTrainSchema>;
