/**
 * How a burner mixes and meters: its type and the way its air ratio is controlled, with the
 * flashback thresholds a plant sets. The vocabulary of the burner decisions; lib/plant/burner.ts
 * computes what a new gas does in such a burner.
 */
import { z } from "zod";

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
