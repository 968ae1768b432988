/**
 * Zod schemas for fuel definitions: shared by the command line, the API and the forms.
 * A definition is one of four forms (gas composition, pure compound, ultimate analysis, blend)
 * plus optional fuel-level attributes.
 */
import { z } from "zod";
import { METERING_REFERENCE_TEMPERATURES_C } from "../units/metering";

/** Tolerance on "fractions sum to 1". */
export const FRACTION_SUM_TOLERANCE = 0.001;

const fraction = z.number({ error: "must be a number" }).finite().min(0, "must be ≥ 0").max(1, "must be ≤ 1");

const sumsToOne = (values: number[]) => Math.abs(values.reduce((a, b) => a + b, 0) - 1) <= FRACTION_SUM_TOLERANCE;
const sumText = (values: number[]) => values.reduce((a, b) => a + b, 0).toFixed(4);

const fuelAttributes = {
  /** Density of a liquid at 15 °C, kg/m³ (needed for per-litre figures). */
  densityKgPerM3: z.number().finite().positive("must be > 0").max(3000, "must be ≤ 3000 kg/m³").optional(),
  /** Share of the fuel's carbon that is biogenic (0 fossil … 1 fully biogenic). */
  biogenicCarbonShare: fraction.optional(),
  /** Optional upstream (well-to-tank) emissions, kg CO2e per GJ of fuel (net basis). */
  upstreamCo2e_kg_per_GJ: z.number().finite().min(0, "must be ≥ 0").max(500, "must be ≤ 500").optional(),
  name: z.string().max(120).optional(),
  /**
   * Kinematic viscosity of a liquid, mm²/s, at one or two temperatures (°C); with two, ASTM D341
   * gives it at any temperature between and near them (the liquid train's atomiser check).
   */
  kinematicViscosity: z
    .array(
      z
        .object({
          temperatureC: z.number().finite().min(-40, "must be ≥ −40 °C").max(300, "must be ≤ 300 °C"),
          mm2_per_s: z.number().finite().positive("must be > 0").max(100_000, "must be ≤ 100 000 mm²/s"),
        })
        .strict(),
    )
    .min(1, "give at least one point")
    .max(2, "give one or two points")
    .optional(),
};

export const gasCompositionSchema = z
  .record(z.string().min(1), fraction)
  .refine((c) => Object.keys(c).length > 0, { message: "needs at least one component" })
  .refine((c) => sumsToOne(Object.values(c)), {
    error: (iss) =>
      `mole fractions must sum to 1 (±${FRACTION_SUM_TOLERANCE}); they sum to ${sumText(Object.values(iss.input as Record<string, number>))}`,
  });

export const compositionFuelSchema = z.object({ composition: gasCompositionSchema, ...fuelAttributes }).strict();

export const compoundFuelSchema = z
  .object({
    compound: z.string().min(1, "name a compound"),
    phase: z.enum(["gas", "liquid"], { error: 'must be "gas" or "liquid"' }).default("gas"),
    ...fuelAttributes,
  })
  .strict();

export const ultimateAnalysisSchema = z
  .object({
    C: fraction,
    H: fraction,
    O: fraction.default(0),
    N: fraction.default(0),
    S: fraction.default(0),
    moisture: fraction.default(0),
    ash: fraction.default(0),
  })
  .strict()
  .refine((u) => sumsToOne(Object.values(u)), {
    error: (iss) =>
      `mass fractions C+H+O+N+S+moisture+ash (as received) must sum to 1 (±${FRACTION_SUM_TOLERANCE}); they sum to ${sumText(Object.values(iss.input as Record<string, number>))}`,
  });

export const HEATING_VALUE_CORRELATIONS = ["channiwala-parikh-2002"] as const;

export const ultimateFuelSchema = z
  .object({
    ultimate: ultimateAnalysisSchema,
    kind: z.enum(["liquid", "solid"]).default("solid"),
    /** Measured gross heating value as received, MJ/kg (at 25 °C). */
    hhv_MJ_per_kg: z.number().finite().positive("must be > 0").max(150, "must be ≤ 150 MJ/kg").optional(),
    /** Measured net heating value as received, MJ/kg (at 25 °C). */
    lhv_MJ_per_kg: z.number().finite().positive("must be > 0").max(150, "must be ≤ 150 MJ/kg").optional(),
    correlation: z.enum(HEATING_VALUE_CORRELATIONS).optional(),
    ...fuelAttributes,
  })
  .strict()
  .refine((u) => [u.hhv_MJ_per_kg, u.lhv_MJ_per_kg, u.correlation].filter((v) => v !== undefined).length === 1, {
    message: "give exactly one of hhv_MJ_per_kg, lhv_MJ_per_kg or correlation",
    path: ["hhv_MJ_per_kg"],
  });

export const BLEND_BASES = ["volume", "mass", "energy"] as const;
export type BlendBasis = (typeof BLEND_BASES)[number];

/**
 * A fuel definition as accepted (defaults not yet applied: compound phase defaults to gas,
 * ultimate kind to solid, absent ultimate-analysis fractions to 0). lib/ handles both forms.
 */
export type FuelDefinition =
  | z.input<typeof compositionFuelSchema>
  | z.input<typeof compoundFuelSchema>
  | z.input<typeof ultimateFuelSchema>
  | BlendFuelDefinition;

export interface BlendFuelDefinition {
  blend: { fuel: FuelDefinition; share: number }[];
  basis: BlendBasis;
  densityKgPerM3?: number;
  biogenicCarbonShare?: number;
  upstreamCo2e_kg_per_GJ?: number;
  name?: string;
  kinematicViscosity?: { temperatureC: number; mm2_per_s: number }[];
}

/**
 * Deepest nesting of blends accepted (a blend of blends … counts one level per `blend`). Real
 * blending needs two or three levels; the limit keeps a malformed definition from exhausting the stack.
 */
export const MAX_BLEND_NESTING = 16;

export const blendFuelSchema: z.ZodType<BlendFuelDefinition> = z.lazy(() =>
  z
    .object({
      blend: z.array(z.object({ fuel: fuelDefinitionSchema, share: fraction }).strict()).min(1, "a blend needs at least one component"),
      basis: z.enum(BLEND_BASES, { error: 'must be "volume", "mass" or "energy"' }),
      ...fuelAttributes,
    })
    .strict()
    .refine((b) => sumsToOne(b.blend.map((c) => c.share)), {
      error: (iss) =>
        `blend shares must sum to 1 (±${FRACTION_SUM_TOLERANCE}); they sum to ${sumText((iss.input as BlendFuelDefinition).blend.map((c) => c.share))}`,
      path: ["blend"],
    }),
) as z.ZodType<BlendFuelDefinition>;

/**
 * The path (below the fuel) of the first blend nested deeper than MAX_BLEND_NESTING, found
 * without recursion so that a malformed definition cannot exhaust the stack; undefined if none is.
 */
function tooDeepBlend(input: unknown): (string | number)[] | undefined {
  const stack: [unknown, (string | number)[], number][] = [[input, [], 1]];
  while (stack.length) {
    const [node, path, depth] = stack.pop()!;
    if (typeof node !== "object" || node === null || !("blend" in node)) continue;
    if (depth > MAX_BLEND_NESTING) return [...path, "blend"];
    const blend = (node as { blend: unknown }).blend;
    if (!Array.isArray(blend)) continue;
    blend.forEach((c, i) => {
      if (typeof c === "object" && c !== null && "fuel" in c)
        stack.push([(c as { fuel: unknown }).fuel, [...path, "blend", i, "fuel"], depth + 1]);
    });
  }
  return undefined;
}

const FORM_KEYS = ["composition", "compound", "ultimate", "blend"] as const;
const formSchemas = {
  composition: () => compositionFuelSchema,
  compound: () => compoundFuelSchema,
  ultimate: () => ultimateFuelSchema,
  blend: () => blendFuelSchema,
} as const;

/**
 * A fuel definition: dispatches on which of composition / compound / ultimate / blend is present,
 * so that an error names the field of the form the user meant.
 */
export const fuelDefinitionSchema: z.ZodType<FuelDefinition, unknown> = z.lazy(() =>
  z.unknown().transform((input, ctx) => {
    if (typeof input !== "object" || input === null || Array.isArray(input)) {
      ctx.addIssue({ code: "custom", message: "a fuel must be an object with one of: composition, compound, ultimate, blend" });
      return z.NEVER;
    }
    const present = FORM_KEYS.filter((k) => k in input);
    if (present.length !== 1) {
      ctx.addIssue({
        code: "custom",
        message:
          present.length === 0
            ? "a fuel needs one of: composition, compound, ultimate, blend"
            : `a fuel takes only one of composition, compound, ultimate, blend (found ${present.join(", ")})`,
      });
      return z.NEVER;
    }
    const deep = present[0] === "blend" ? tooDeepBlend(input) : undefined;
    if (deep) {
      ctx.addIssue({ code: "custom", message: `blends nest at most ${MAX_BLEND_NESTING} levels deep`, path: deep });
      return z.NEVER;
    }
    const parsed = formSchemas[present[0]]().safeParse(input);
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        // An unknown key is named itself (`fuel.nme`), not the object that holds it.
        if (issue.code === "unrecognized_keys")
          ctx.addIssue({ code: "custom", message: "unknown field", path: [...issue.path, issue.keys[0]] as PropertyKey[] });
        else ctx.addIssue({ code: "custom", message: issue.message, path: issue.path as PropertyKey[] });
      }
      return z.NEVER;
    }
    return parsed.data as FuelDefinition;
  }),
);

/** Oxidiser by mole fractions (O2, N2, Ar, CO2, H2O). */
export const oxidizerSchema = z
  .partialRecord(z.enum(["O2", "N2", "Ar", "CO2", "H2O"], { error: "oxidiser species must be one of O2, N2, Ar, CO2, H2O" }), fraction)
  .refine((c) => (c.O2 ?? 0) > 0, { message: "the oxidiser needs O2 > 0" })
  .refine((c) => sumsToOne(Object.values(c)), {
    error: (iss) =>
      `oxidiser mole fractions must sum to 1 (±${FRACTION_SUM_TOLERANCE}); they sum to ${sumText(Object.values(iss.input as Record<string, number>))}`,
  });
export type OxidizerComposition = z.infer<typeof oxidizerSchema>;

/** Combustion reference temperatures (°C) for heating values, as tabulated in ISO 6976:2016. */
export const COMBUSTION_REFERENCES_C = [0, 15, 15.55, 20, 25] as const;
/** Metering reference temperatures (°C) at 101.325 kPa: 0 °C, 15 °C, 15.56 °C (60 °F), 20 °C (lib/units/metering.ts). */
export const METERING_REFERENCES_C = METERING_REFERENCE_TEMPERATURES_C;

export const combustionReferenceSchema = z.number().refine((v) => (COMBUSTION_REFERENCES_C as readonly number[]).includes(v), {
  message: `must be one of ${COMBUSTION_REFERENCES_C.join(", ")} °C`,
});
export const meteringReferenceSchema = z.number().refine((v) => METERING_REFERENCES_C.includes(v), {
  message: `must be one of ${METERING_REFERENCES_C.join(", ")} °C (15.56 °C = 60 °F)`,
});

/** Formats the first zod issue as one line naming the field, e.g. `fuel.composition: ...`. */
export function firstIssueLine(error: z.ZodError, prefix: (string | number)[] = []): string {
  const issue = error.issues[0];
  const path = [...prefix, ...issue.path.map(String)];
  return `${path.length ? path.join(".") : "(input)"}: ${issue.message}`;
}

/** Field-keyed messages for forms and the API (400 bodies). */
export function fieldErrors(error: z.ZodError): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.map(String).join(".") : "_";
    if (!(key in out)) out[key] = issue.message;
  }
  return out;
}
