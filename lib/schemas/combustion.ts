/**
 * Zod schemas of the combustion requests (property sheet, flame temperature), shared by the
 * command line and the web app.
 */
import { z } from "zod";
import { combustionReferenceSchema, fuelDefinitionSchema, meteringReferenceSchema, oxidizerSchema } from "./fuel";

export const propertiesRequestSchema = z
  .object({
    fuel: fuelDefinitionSchema,
    combustionReferenceC: combustionReferenceSchema.default(25),
    meteringReferenceC: meteringReferenceSchema.default(15),
  })
  .strict();
export type PropertiesRequest = z.infer<typeof propertiesRequestSchema>;

/** The oxidiser supply is stated by at most one of φ, excess air, flue-gas O2 (requests that take them). */
export const atMostOneSupply = (r: { phi?: number; excessAirPercent?: number; flueO2DryPercent?: number }) =>
  [r.phi, r.excessAirPercent, r.flueO2DryPercent].filter((v) => v !== undefined).length <= 1;
export const ONE_SUPPLY_ISSUE = { message: "give only one of phi, excessAirPercent, flueO2DryPercent", path: ["phi"] };

const temperatureK = z.number().finite().min(200, "must be ≥ 200 K").max(2000, "must be ≤ 2000 K");

export const flameRequestSchema = z
  .object({
    fuel: fuelDefinitionSchema,
    oxidizer: oxidizerSchema.optional(),
    phi: z.number().finite().gt(0, "must be > 0").max(10, "must be ≤ 10").optional(),
    excessAirPercent: z.number().finite().gt(-90, "must be > −90 %").max(1000, "must be ≤ 1000 %").optional(),
    flueO2DryPercent: z.number().finite().min(0, "must be ≥ 0").max(99, "must be < the oxidiser's O2").optional(),
    fuelTemperatureK: temperatureK.default(298.15),
    oxidizerTemperatureK: temperatureK.default(298.15),
    pressurePa: z.number().finite().min(1000, "must be ≥ 1000 Pa").max(2e7, "must be ≤ 200 bar").default(101325),
    method: z
      .enum(["mean-cp", "complete", "equilibrium"], { error: 'must be "mean-cp", "complete" or "equilibrium"' })
      .default("equilibrium"),
  })
  .strict()
  .refine(atMostOneSupply, ONE_SUPPLY_ISSUE);
export type FlameRequest = z.infer<typeof flameRequestSchema>;
