/**
 * Zod schema of the laminar burning velocity request (`stoke flame-speed`, the flame engine's
 * public entry). Fuel, oxidiser and the oxidiser supply (φ, excess air or flue-gas O2) are the same
 * fields, with the same checks, as the flame-temperature request.
 */
import { z } from "zod";
import { ONE_SUPPLY_ISSUE, atMostOneSupply, flameRequestSchema } from "./combustion";

const flameFields = flameRequestSchema.shape;

/**
 * The flame's grid criteria by default (the reference settings of the speed target: ratio 3, slope
 * 0.06, curve 0.12). `maxPoints` only guards against a refinement that runs away: most flames need 150–250
 * points, the fastest hydrogen flames (hydrogen/air at 900 K, hydrogen with 30 % O2 air) 650–1 250.
 */
export const DEFAULT_FLAME_GRID = Object.freeze({ ratio: 3, slope: 0.06, curve: 0.12, maxPoints: 1500 });

export const flameSpeedGridSchema = z
  .object({
    ratio: z.number().finite().min(2, "must be ≥ 2").max(20, "must be ≤ 20").default(DEFAULT_FLAME_GRID.ratio),
    slope: z.number().finite().min(0.01, "must be ≥ 0.01").max(0.5, "must be ≤ 0.5").default(DEFAULT_FLAME_GRID.slope),
    curve: z.number().finite().min(0.02, "must be ≥ 0.02").max(0.9, "must be ≤ 0.9").default(DEFAULT_FLAME_GRID.curve),
    maxPoints: z
      .number()
      .int("must be a whole number")
      .min(30, "must be ≥ 30")
      .max(2000, "must be ≤ 2000")
      .default(DEFAULT_FLAME_GRID.maxPoints),
  })
  .strict();

export const flameSpeedRequestSchema = z
  .object({
    fuel: flameFields.fuel,
    oxidizer: flameFields.oxidizer,
    phi: flameFields.phi,
    excessAirPercent: flameFields.excessAirPercent,
    flueO2DryPercent: flameFields.flueO2DryPercent,
    unburntTemperatureK: z.number().finite().min(250, "must be ≥ 250 K").max(900, "must be ≤ 900 K").default(298.15),
    pressurePa: z
      .number()
      .finite()
      .min(50_000, "must be ≥ 50 000 Pa (0.5 bar)")
      .max(3e6, "must be ≤ 3 000 000 Pa (30 bar)")
      .default(101325),
    /** Residence time of the post-flame plug flow for the NO figure, ms. */
    postFlameResidenceMs: z.number().finite().min(0, "must be ≥ 0").max(2000, "must be ≤ 2000 ms").optional(),
    /** Reference O2 of the mg/m³ figure, % dry. */
    referenceO2Percent: z.number().finite().min(0, "must be ≥ 0").max(20, "must be ≤ 20").optional(),
    /** Thermal diffusion (Soret effect) of H and H2. */
    thermalDiffusion: z.boolean({ error: "must be true or false" }).default(false),
    grid: flameSpeedGridSchema.optional(),
  })
  .strict()
  .refine(atMostOneSupply, ONE_SUPPLY_ISSUE);

export type FlameSpeedRequest = z.infer<typeof flameSpeedRequestSchema>;
export type FlameSpeedInput = z.input<typeof flameSpeedRequestSchema>;
