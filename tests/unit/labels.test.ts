import { describe, expect, it } from "vitest";
import type { z } from "zod";
import { FIELD_LABELS, labelOfPath } from "../../lib/schemas/labels";
import { plantSchema, operatingOverridesSchema, ambientAirSchema } from "../../lib/schemas/plant";
import { studySchema, scenarioSchema, sensitivitySchema, hydrogenSweepSchema } from "../../lib/schemas/study";
import { fuelInputSchema, priceQuoteInputSchema } from "../../lib/schemas/library";
import { accountChangeSchema, accountInputSchema, apiTokenInputSchema, ownPasswordSchema, signInSchema } from "../../lib/schemas/accounts";

/** The field names of an object schema (unwrapping the wrappers zod puts around objects). */
function keysOf(schema: z.ZodType): string[] {
  let s = schema as unknown as { shape?: Record<string, unknown>; def?: { innerType?: unknown; in?: unknown; schema?: unknown } };
  for (let i = 0; i < 6 && !s.shape; i++) s = (s.def?.innerType ?? s.def?.in ?? s.def?.schema ?? s) as typeof s;
  return s.shape ? Object.keys(s.shape) : [];
}

describe("labels people read", () => {
  it("every field of the plant, study, library and account schemas has a label", () => {
    const schemas = {
      plantSchema,
      operatingOverridesSchema,
      ambientAirSchema,
      studySchema,
      scenarioSchema,
      sensitivitySchema,
      hydrogenSweepSchema,
      fuelInputSchema,
      priceQuoteInputSchema,
      accountInputSchema,
      accountChangeSchema,
      signInSchema,
      apiTokenInputSchema,
      ownPasswordSchema,
    };
    const missing: string[] = [];
    for (const [name, schema] of Object.entries(schemas)) {
      const keys = keysOf(schema as z.ZodType);
      expect(keys.length, `${name} has fields`).toBeGreaterThan(0);
      for (const k of keys) if (!(k in FIELD_LABELS)) missing.push(`${name}.${k}`);
    }
    expect(missing).toEqual([]);
  });

  it("turns field paths into words", () => {
    expect(labelOfPath("scenarios.2.overrides.stackTemperatureC")).toBe("scenario 3 — stack temperature, °C");
    expect(labelOfPath("sensitivity.fuelPricePercent")).toBe("sensitivity ranges — fuel prices ± %");
    expect(labelOfPath("definition.composition.CH4")).toBe("composition — CH4");
    expect(labelOfPath("blend.components.1.share")).toBe("blend — component 2 — share");
  });
});

describe("names people give things", () => {
  it("are NFC-normalised and refuse control, direction-override and invisible characters", async () => {
    const { nameSchema, lookAlikeKey } = await import("../../lib/schemas/names");
    const s = nameSchema(120, "name it");
    // "é" as e + combining acute (U+0301) and as the precomposed U+00E9 are one name after NFC (Unicode UAX #15).
    expect(s.parse("Cafe\u0301 gas ")).toBe("Caf\u00e9 gas");
    for (const bad of ["gas\u0000", "gas\u202eoil", "ga\u200bs"]) expect(s.safeParse(bad).success).toBe(false);
    expect(s.safeParse("   ").success).toBe(false);
    // Full-width letters fold to plain ones under NFKC.
    expect(lookAlikeKey("ＬＰＧ  propane")).toBe(lookAlikeKey("lpg propane"));
  });
});
