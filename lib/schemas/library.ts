/**
 * Zod schemas of the fuel library's records as the forms, the JSON API and the import files
 * send them: a fuel (definition or blend of stored fuels, plus attributes) and a price quote.
 * One set of rules for every entry point; messages name the field.
 */
import { z } from "zod";
import { currencySchema } from "./currencies";
import { BLEND_BASES, fuelDefinitionSchema, type FuelDefinition } from "./fuel";
import { METERING_REFERENCE_KEYS } from "./plant";
import { ENERGY_BASES, PRICE_UNITS } from "./price-units";
import { nameSchema } from "./names";

export const FUEL_KINDS = ["gas", "liquid", "solid"] as const;
export type FuelKind = (typeof FUEL_KINDS)[number];

const finite = (what = "must be a number") => z.number({ error: what }).finite(what);
const trimmedText = (max: number) => z.string({ error: "must be text" }).trim().max(max, `must be ≤ ${max} characters`);

/** Attributes that are columns of the Fuel table, never part of the stored definition. */
export const FUEL_ATTRIBUTE_KEYS = ["densityKgPerM3", "biogenicCarbonShare", "upstreamCo2e_kg_per_GJ", "name"] as const;

export const blendComponentInputSchema = z
  .object({
    fuelId: z.number({ error: "choose a stored fuel" }).int("choose a stored fuel").positive("choose a stored fuel"),
    share: finite().min(0, "must be ≥ 0").max(1, "must be ≤ 1"),
  })
  .strict();

export const blendInputSchema = z
  .object({
    basis: z.enum(BLEND_BASES, { error: 'must be "volume", "mass" or "energy"' }),
    components: z.array(blendComponentInputSchema).min(2, "a blend needs at least two components"),
  })
  .strict()
  .superRefine((b, ctx) => {
    const sum = b.components.reduce((s, c) => s + c.share, 0);
    if (Math.abs(sum - 1) > 0.001) {
      ctx.addIssue({
        code: "custom",
        path: ["components"],
        message: `shares must sum to 1 (±0.001); they sum to ${sum.toFixed(4)}`,
      });
    }
    const seen = new Set<number>();
    b.components.forEach((c, i) => {
      if (seen.has(c.fuelId)) {
        ctx.addIssue({ code: "custom", path: ["components", i, "fuelId"], message: "this fuel is already in the blend" });
      }
      seen.add(c.fuelId);
    });
  });
export type BlendInput = z.infer<typeof blendInputSchema>;

/**
 * A fuel as entered: either `definition` (gas composition, compound, ultimate analysis) or
 * `blend` (stored fuels with shares). `kind` may be given; it must then match the definition.
 */
export const fuelInputSchema = z
  .object({
    name: nameSchema(120, "name the fuel"),
    kind: z.enum(FUEL_KINDS, { error: 'must be "gas", "liquid" or "solid"' }).optional(),
    definition: fuelDefinitionSchema.optional(),
    blend: blendInputSchema.optional(),
    densityKgPerM3: finite().positive("must be > 0").max(3000, "must be ≤ 3000 kg/m³").nullish(),
    biogenicCarbonShare: finite().min(0, "must be ≥ 0").max(1, "must be ≤ 1 (a fraction)").nullish(),
    upstreamCo2e_kg_per_GJ: finite().min(0, "must be ≥ 0").max(500, "must be ≤ 500 kg/GJ").nullish(),
    notes: trimmedText(5000).default(""),
    source: trimmedText(1000).default(""),
    isDemo: z.boolean().default(false),
  })
  .strict()
  .superRefine((f, ctx) => {
    const hasDef = f.definition !== undefined;
    const hasBlend = f.blend !== undefined;
    if (hasDef === hasBlend) {
      ctx.addIssue({
        code: "custom",
        path: [hasDef ? "blend" : "definition"],
        message: hasDef
          ? "give either a definition or a blend, not both"
          : "give a definition (composition, compound or ultimate analysis) or a blend",
      });
      return;
    }
    if (f.definition && "blend" in f.definition) {
      ctx.addIssue({
        code: "custom",
        path: ["definition"],
        message: "build blends from stored fuels with the `blend` field (basis and components)",
      });
      return;
    }
    if (f.definition && f.kind !== undefined) {
      const k = kindOfDefinition(f.definition);
      if (k !== f.kind) {
        ctx.addIssue({ code: "custom", path: ["kind"], message: `the definition describes a ${k}, not a ${f.kind}` });
      }
    }
    if (f.kind === "gas" && f.densityKgPerM3 !== undefined && f.densityKgPerM3 !== null) {
      ctx.addIssue({
        code: "custom",
        path: ["densityKgPerM3"],
        message: "a gas's density follows from its composition; leave this empty",
      });
    }
  });
export type FuelInput = z.input<typeof fuelInputSchema>;
export type FuelInputParsed = z.output<typeof fuelInputSchema>;

/** The fuel kind a (non-blend) definition describes. */
export function kindOfDefinition(def: FuelDefinition): FuelKind {
  if ("composition" in def) return "gas";
  if ("compound" in def) return def.phase === "liquid" ? "liquid" : "gas";
  if ("ultimate" in def) return def.kind ?? "solid";
  throw new Error("kindOfDefinition: a blend's kind follows from its components");
}

/** Calendar date "YYYY-MM-DD" (also accepts a full ISO timestamp at midnight UTC). */
export const isoDateSchema = z
  .string({ error: "must be a date (YYYY-MM-DD)" })
  .trim()
  .regex(/^\d{4}-\d{2}-\d{2}(T00:00:00(\.000)?Z)?$/, "must be a date (YYYY-MM-DD)")
  .refine((s) => {
    const d = new Date(`${s.slice(0, 10)}T00:00:00Z`);
    return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === s.slice(0, 10);
  }, "is not a calendar date")
  .transform((s) => s.slice(0, 10));

/** A price quote as entered. Unit/basis/reference fit to the fuel is checked with the fuel (priceQuoteIssues). */
export const priceQuoteInputSchema = z
  .object({
    amount: finite().min(0, "must be ≥ 0"),
    currency: currencySchema,
    unit: z.enum(PRICE_UNITS, { error: `must be one of ${PRICE_UNITS.join(", ")}` }),
    energyBasis: z.enum(ENERGY_BASES, { error: 'must be "gross" or "net"' }).nullish(),
    meteringReference: z
      .enum(METERING_REFERENCE_KEYS, { error: `must be one of ${METERING_REFERENCE_KEYS.map((k) => `"${k}"`).join(", ")}` })
      .nullish(),
    transportAdder: finite().min(0, "must be ≥ 0").default(0),
    handlingAdder: finite().min(0, "must be ≥ 0").default(0),
    validFrom: isoDateSchema,
    sourceNote: trimmedText(1000).default(""),
    /** Who offers the price. */
    supplier: trimmedText(200).default(""),
    isInvented: z.boolean().default(false),
  })
  .strict();
export type PriceQuoteInput = z.input<typeof priceQuoteInputSchema>;
export type PriceQuoteInputParsed = z.output<typeof priceQuoteInputSchema>;
