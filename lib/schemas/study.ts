/**
 * Zod schema of a feasibility study: one plant, its baseline and N candidate scenarios, with
 * the economic assumptions. Self-contained: fuels are embedded as definitions and prices as
 * quotes, so a study file needs no database. The app builds the same object from its tables
 * (Study, Plant, Scenario, Fuel, PriceQuote).
 */
import { z } from "zod";
import { currencySchema } from "./currencies";
import { fuelDefinitionSchema, type FuelDefinition } from "./fuel";
import { operatingOverridesSchema, plantSchema } from "./plant";
import { isoDateSchema, priceQuoteInputSchema } from "./library";

/** What a study ranks its scenarios by. */
export const RANKING_METRICS = ["cost-per-useful-MWh", "co2-per-useful-MJ", "abatement-cost", "npv"] as const;
export type RankingMetric = (typeof RANKING_METRICS)[number];

export const STUDY_FORMAT = "stoke-study" as const;
export const STUDY_FORMAT_VERSION = 1;

const num = (what = "must be a number") => z.number({ error: what }).finite(what);
const text = (max: number) => z.string({ error: "must be text" }).trim().max(max, `must be ≤ ${max} characters`);

/** A price quote inside a study: like a stored quote, the validity date optional. */
export const studyPriceSchema = priceQuoteInputSchema.extend({ validFrom: isoDateSchema.optional() }).strict();
export type StudyPriceInput = z.input<typeof studyPriceSchema>;
export type StudyPrice = z.output<typeof studyPriceSchema>;

export const scenarioSchema = z
  .object({
    name: text(120).min(1, "name the scenario"),
    /** The fuel or blend, as a full definition (a stored blend becomes a blend of definitions). */
    fuel: fuelDefinitionSchema,
    /** Delivered-price quote; without one (and without componentPrices) the scenario gets no cost figures. */
    price: studyPriceSchema.nullish(),
    /**
     * A blend without its own quote: one quote per blend component, in the blend's order; the
     * blend's delivered price is the mass-weighted mix of the components' delivered prices per kg.
     */
    componentPrices: z.array(studyPriceSchema).nullish(),
    /** Switching investment (burner, fuel train, controls …). */
    capex: num().min(0, "must be ≥ 0").max(1e12, "must be ≤ 10^12").default(0),
    /** Change in fixed operating cost per year versus the baseline (positive = more cost). */
    fixedOpexChange: num().min(-1e11, "must be ≥ −10^11").max(1e11, "must be ≤ 10^11").default(0),
    overrides: operatingOverridesSchema.default({}),
    notes: text(5000).default(""),
  }, { error: (iss) => (iss.input === undefined ? "required: a scenario (an object)" : "must be an object describing a scenario") })
  .strict();
export type ScenarioInput = z.input<typeof scenarioSchema>;
export type Scenario = z.output<typeof scenarioSchema>;

type ScenarioSetCore = { name: string; capex: number; fixedOpexChange: number };

/**
 * Rules every scenario set obeys (study files and stored studies alike): the baseline carries no
 * capex or opex change, and scenario names are unique (case-insensitive).
 */
export function checkScenarioSet(s: { baseline: ScenarioSetCore; scenarios: readonly ScenarioSetCore[] }, ctx: z.RefinementCtx): void {
  if (s.baseline.capex !== 0) ctx.addIssue({ code: "custom", path: ["baseline", "capex"], message: "the baseline has no switching capex (must be 0)" });
  if (s.baseline.fixedOpexChange !== 0) {
    ctx.addIssue({ code: "custom", path: ["baseline", "fixedOpexChange"], message: "the baseline is the reference for opex changes (must be 0)" });
  }
  const seen = new Map<string, string>([[s.baseline.name.toLowerCase(), "the baseline"]]);
  s.scenarios.forEach((sc, i) => {
    const k = sc.name.toLowerCase();
    if (seen.has(k)) ctx.addIssue({ code: "custom", path: ["scenarios", i, "name"], message: `"${sc.name}" is already used by ${seen.get(k)}` });
    else seen.set(k, `scenario ${i + 1}`);
  });
}

/**
 * Default ranges of the one-at-a-time sensitivity (tornado): ± % on fuel prices, ± % on the carbon
 * price, ± points on efficiency, ± % on capex (common practice for screening studies, no source).
 */
export const SENSITIVITY_DEFAULTS = Object.freeze({ fuelPricePercent: 20, carbonPricePercent: 50, efficiencyPoints: 2, capexPercent: 30 });

export const sensitivitySchema = z
  .object({
    /** ± percent on the delivered fuel prices (candidate and baseline separately). */
    fuelPricePercent: num().min(0, "must be ≥ 0 %").max(200, "must be ≤ 200 %").default(SENSITIVITY_DEFAULTS.fuelPricePercent),
    /** ± percent on the carbon price. */
    carbonPricePercent: num().min(0, "must be ≥ 0 %").max(200, "must be ≤ 200 %").default(SENSITIVITY_DEFAULTS.carbonPricePercent),
    /** ± percentage points on the net-basis efficiency (candidate and baseline separately). */
    efficiencyPoints: num().min(0, "must be ≥ 0 points").max(20, "must be ≤ 20 points").default(SENSITIVITY_DEFAULTS.efficiencyPoints),
    /** ± percent on the switching capex. */
    capexPercent: num().min(0, "must be ≥ 0 %").max(200, "must be ≤ 200 %").default(SENSITIVITY_DEFAULTS.capexPercent),
  })
  .strict();
export type SensitivityRanges = z.infer<typeof sensitivitySchema>;

export const hydrogenSweepSchema = z
  .object({
    enabled: z.boolean({ error: "must be true or false" }).default(true),
    /** Step of the hydrogen share, vol %. */
    stepPercent: num().min(0.5, "must be ≥ 0.5 %").max(25, "must be ≤ 25 %").default(1),
    /** The hydrogen to blend in (pure H2 by default). */
    hydrogen: fuelDefinitionSchema.default({ compound: "H2", phase: "gas" } as FuelDefinition),
    /** Delivered hydrogen price; without one the sweep has no cost line (unless a scenario burns pure hydrogen with a price). */
    hydrogenPrice: studyPriceSchema.nullish(),
  })
  .strict();

export const studySchema = z
  .object({
    format: z.literal(STUDY_FORMAT, { error: `must be "${STUDY_FORMAT}"` }).optional(),
    version: z.literal(STUDY_FORMAT_VERSION, { error: `must be ${STUDY_FORMAT_VERSION}` }).optional(),
    name: text(200).min(1, "name the study"),
    currency: currencySchema,
    carbonPrice_per_t: num().min(0, "must be ≥ 0").max(10000, "must be ≤ 10000 per t").default(0),
    discountRatePercent: num().min(-5, "must be ≥ −5 %").max(50, "must be ≤ 50 %"),
    horizonYears: z.number({ error: "must be a number" }).int("must be a whole number of years").min(1, "must be ≥ 1 year").max(60, "must be ≤ 60 years"),
    priceEscalationPercent: num().min(-20, "must be ≥ −20 %").max(50, "must be ≤ 50 %").default(0),
    rankingMetric: z.enum(RANKING_METRICS, { error: `must be one of ${RANKING_METRICS.join(", ")}` }).default("cost-per-useful-MWh"),
    /** Count upstream (well-to-tank) CO2e in CO2 avoided and price it at the carbon price. */
    includeUpstream: z.boolean({ error: "must be true or false" }).default(false),
    sensitivity: sensitivitySchema.default({ ...SENSITIVITY_DEFAULTS }),
    hydrogenSweep: hydrogenSweepSchema.default({ enabled: true, stepPercent: 1, hydrogen: { compound: "H2", phase: "gas" } as FuelDefinition }),
    plant: plantSchema,
    baseline: scenarioSchema,
    scenarios: z.array(scenarioSchema, { error: (iss) => (iss.input === undefined ? "required: a list of candidate scenarios (may be empty)" : "must be a list of scenarios") }).max(200, "at most 200 scenarios"),
    notes: text(10000).default(""),
  }, { error: "a study must be a JSON object" })
  .strict()
  .superRefine((s, ctx) => {
    checkScenarioSet(s, ctx);
    const checkComponents = (sc: z.output<typeof scenarioSchema>, path: (string | number)[]) => {
      if (!sc.componentPrices) return;
      if (!("blend" in sc.fuel)) {
        ctx.addIssue({ code: "custom", path: [...path, "componentPrices"], message: "component prices apply only to a blend" });
      } else if (sc.componentPrices.length !== sc.fuel.blend.length) {
        ctx.addIssue({ code: "custom", path: [...path, "componentPrices"], message: `give one price per blend component (${sc.fuel.blend.length}), got ${sc.componentPrices.length}` });
      } else if (sc.price) {
        ctx.addIssue({ code: "custom", path: [...path, "componentPrices"], message: "give either a price for the blend or component prices, not both" });
      }
    };
    checkComponents(s.baseline, ["baseline"]);
    s.scenarios.forEach((sc, i) => checkComponents(sc, ["scenarios", i]));
    const checkCurrency = (price: { currency: string } | null | undefined, path: (string | number)[]) => {
      if (price && price.currency !== s.currency) {
        ctx.addIssue({ code: "custom", path: [...path, "currency"], message: `must be ${s.currency}, the study's currency (a study file carries its prices already converted)` });
      }
    };
    checkCurrency(s.baseline.price, ["baseline", "price"]);
    s.baseline.componentPrices?.forEach((p, j) => checkCurrency(p, ["baseline", "componentPrices", j]));
    s.scenarios.forEach((sc, i) => {
      checkCurrency(sc.price, ["scenarios", i, "price"]);
      sc.componentPrices?.forEach((p, j) => checkCurrency(p, ["scenarios", i, "componentPrices", j]));
    });
    checkCurrency(s.hydrogenSweep.hydrogenPrice, ["hydrogenSweep", "hydrogenPrice"]);
  });

export type StudyInput = z.input<typeof studySchema>;
export type Study = z.output<typeof studySchema>;
