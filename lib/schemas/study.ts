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
import { nameSchema } from "./names";

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
  .object(
    {
      name: nameSchema(120, "name the scenario"),
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
    },
    { error: (iss) => (iss.input === undefined ? "required: a scenario (an object)" : "must be an object describing a scenario") },
  )
  .strict();
export type ScenarioInput = z.input<typeof scenarioSchema>;
export type Scenario = z.output<typeof scenarioSchema>;

type ScenarioSetCore = { name: string; capex: number; fixedOpexChange: number };

/**
 * Rules every scenario set obeys (study files and stored studies alike): the baseline carries no
 * capex or opex change, and scenario names are unique (case-insensitive).
 */
export function checkScenarioSet(s: { baseline: ScenarioSetCore; scenarios: readonly ScenarioSetCore[] }, ctx: z.RefinementCtx): void {
  if (s.baseline.capex !== 0)
    ctx.addIssue({ code: "custom", path: ["baseline", "capex"], message: "the baseline has no switching capex (must be 0)" });
  if (s.baseline.fixedOpexChange !== 0) {
    ctx.addIssue({
      code: "custom",
      path: ["baseline", "fixedOpexChange"],
      message: "the baseline is the reference for opex changes (must be 0)",
    });
  }
  const seen = new Map<string, string>([[s.baseline.name.toLowerCase(), "the baseline"]]);
  s.scenarios.forEach((sc, i) => {
    const k = sc.name.toLowerCase();
    if (seen.has(k))
      ctx.addIssue({ code: "custom", path: ["scenarios", i, "name"], message: `"${sc.name}" is already used by ${seen.get(k)}` });
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

/**
 * The report's cover: what a consultant puts on the first page (all optional; an empty title is
 * the study's name, an empty date is the day the report is printed).
 */
export const coverShape = {
  reportTitle: text(200).default(""),
  preparedFor: text(300).default(""),
  preparedBy: text(300).default(""),
  /** Date printed on the cover (YYYY-MM-DD); null = the day the report is opened. */
  reportDate: isoDateSchema.nullish(),
  /** The consultant's own text on the cover (scope, caveats, recommendations). */
  reportNotes: text(10000).default(""),
};

export const hydrogenSweepSchema = z
  .object({
    enabled: z.boolean({ error: "must be true or false" }).default(true),
    /** Step of the hydrogen share, vol %. */
    stepPercent: num().min(0.5, "must be ≥ 0.5 %").max(25, "must be ≤ 25 %").default(1),
    /** Step of the flame solves (burning velocity, NOx) along the sweep, vol %; between them the first crossings are interpolated. */
    flameStepPercent: num().min(5, "must be ≥ 5 %").max(50, "must be ≤ 50 %").default(10),
    /** The hydrogen to blend in (pure H2 by default). */
    hydrogen: fuelDefinitionSchema.default({ compound: "H2", phase: "gas" } as FuelDefinition),
    /** Delivered hydrogen price; without one the sweep has no cost line (unless a scenario burns pure hydrogen with a price). */
    hydrogenPrice: studyPriceSchema.nullish(),
  })
  .strict();

/**
 * A yearly path of a price over the horizon (year 1 = the first year of operation, whose cash
 * flow arrives at its end). Fuel-price paths are an index on the quoted delivered price (1 = the
 * quote); the carbon path is in currency per t. Kinds:
 * - "escalation": value × (1 + g)^(year − 1), today's behaviour;
 * - "table": one value per year from year 1 on, no gaps (e.g. imported from a CSV of year,value);
 * - "linear": straight lines between stated points;
 * - "stepped": each stated value holds until the next point.
 * Before the first point a path holds the first value, after the last the last value.
 */
const pathPointSchema = z
  .object({
    year: z.number({ error: "must be a number" }).int("must be a whole year").min(1, "must be ≥ year 1").max(100, "must be ≤ year 100"),
    value: num().min(0, "must be ≥ 0").max(1e6, "must be ≤ 10^6"),
  })
  .strict();
const pathPoints = z
  .array(pathPointSchema, { error: "must be a list of {year, value}" })
  .min(1, "state at least one point")
  .max(100, "at most 100 points");
export const pricePathSchema = z.discriminatedUnion(
  "kind",
  [
    z.object({ kind: z.literal("escalation"), percentPerYear: num().min(-20, "must be ≥ −20 %").max(50, "must be ≤ 50 %") }).strict(),
    z.object({ kind: z.literal("table"), points: pathPoints }).strict(),
    z.object({ kind: z.literal("linear"), points: pathPoints }).strict(),
    z.object({ kind: z.literal("stepped"), points: pathPoints }).strict(),
  ],
  { error: 'must be a path: kind "escalation", "table", "linear" or "stepped"' },
);
export type PricePath = z.infer<typeof pricePathSchema>;

/** Whether money is stated in today's money (real) or in money of the day (nominal). */
export const MONEY_TERMS = ["real", "nominal"] as const;
export type MoneyTerms = (typeof MONEY_TERMS)[number];

export const pathsSchema = z
  .object({
    /** Terms of the path values and of the analysis (NPV, payback, abatement cost). */
    terms: z.enum(MONEY_TERMS, { error: 'must be "real" or "nominal"' }).default("nominal"),
    /** Terms in which the study's discount rate is stated; when they differ, the Fisher relation converts it. */
    discountRateTerms: z.enum(MONEY_TERMS, { error: 'must be "real" or "nominal"' }).default("nominal"),
    /** General inflation, % per year (for the Fisher relation (1 + nominal) = (1 + real)(1 + inflation)). */
    inflationPercent: num().min(-10, "must be ≥ −10 %").max(100, "must be ≤ 100 %").default(0),
    /** Carbon price path, currency per t; without one the study's carbon price escalates at its escalation rate. */
    carbon: pricePathSchema.nullish(),
    /**
     * Fuel-price paths as an index on the quote (1 = the quote), keyed by the quote's place in the
     * study: "baseline.price", "scenarios.3.price", "scenarios.0.componentPrices.1" (a quote used
     * in several places is one price, keyed by its first place). Quotes without a path escalate at
     * the study's escalation rate.
     */
    fuelPrices: z.record(z.string(), pricePathSchema).default({}),
  })
  .strict();
export type PricePaths = z.infer<typeof pathsSchema>;

/**
 * An uncertain input as a change from the study's value: percent for prices, capex and operating
 * hours, percentage points for efficiency. Triangular or PERT from low / most likely / high, or
 * normal from mean and standard deviation.
 */
export const uncertaintyRangeSchema = z
  .discriminatedUnion(
    "distribution",
    [
      z.object({ distribution: z.literal("triangular"), low: num(), mode: num(), high: num() }).strict(),
      z.object({ distribution: z.literal("pert"), low: num(), mode: num(), high: num() }).strict(),
      z.object({ distribution: z.literal("normal"), mean: num().default(0), sd: num().min(0, "must be ≥ 0") }).strict(),
    ],
    { error: 'must be a range: distribution "triangular", "pert" (low, mode, high) or "normal" (mean, sd)' },
  )
  .superRefine((r, ctx) => {
    if (r.distribution !== "normal") {
      if (r.low > r.mode) ctx.addIssue({ code: "custom", path: ["low"], message: "must be ≤ the most likely value" });
      if (r.mode > r.high) ctx.addIssue({ code: "custom", path: ["high"], message: "must be ≥ the most likely value" });
    }
  });
export type UncertaintyRange = z.infer<typeof uncertaintyRangeSchema>;

/** Default change of operating hours, ± % (common practice for screening studies, no source). */
export const OPERATING_HOURS_DEFAULT_PERCENT = 10;

export const uncertaintySchema = z
  .object({
    /** Default for every fuel price without its own range (% change); default ± the sensitivity's fuel-price range, triangular. */
    fuelPriceDefault: uncertaintyRangeSchema.nullish(),
    /** Per quote (keys as in paths.fuelPrices), % change of the delivered price. */
    fuelPrices: z.record(z.string(), uncertaintyRangeSchema).default({}),
    /** % change of the carbon price (the whole path); default ± the sensitivity's carbon range. */
    carbonPrice: uncertaintyRangeSchema.nullish(),
    /** % change of each scenario's capex (independent per scenario); default ± the sensitivity's capex range. */
    capex: uncertaintyRangeSchema.nullish(),
    /** Points change of each scenario's efficiency before radiation (independent per scenario); default ± the sensitivity's points. */
    efficiencyPoints: uncertaintyRangeSchema.nullish(),
    /** Per scenario by name (the baseline's name included), overriding efficiencyPoints. */
    efficiencyByScenario: z.record(z.string(), uncertaintyRangeSchema).default({}),
    /** % change of the operating hours; default ± 10 %. */
    operatingHours: uncertaintyRangeSchema.nullish(),
    /**
     * K change of the stack temperature of every scenario whose operating changes state one (e.g. the
     * stack an economiser retrofit will really reach); each draw runs the heat-loss balance again at
     * the drawn temperature. Default: the band that moves that balance by the sensitivity's ± points.
     */
    stackTemperatureK: uncertaintyRangeSchema.nullish(),
    /** Per scenario by name (the baseline's name included), K change of its stack temperature, overriding stackTemperatureK. */
    stackTemperatureByScenario: z.record(z.string(), uncertaintyRangeSchema).default({}),
    /**
     * One correlation between every pair of varying fuel prices (a shared market factor, e.g. natural
     * gas and the blends and offers that follow it); pairs stated in `correlations` take precedence.
     */
    fuelPriceCorrelation: num().min(-0.999, "must be > −1").max(0.999, "must be < 1").nullish(),
    /**
     * Correlations between inputs (of their normal scores): keys "price:<quote key>", "carbon",
     * "hours", "capex:<scenario name>", "efficiency:<scenario name>".
     */
    correlations: z
      .array(
        z
          .object({
            a: z.string().min(1, "name an input"),
            b: z.string().min(1, "name an input"),
            rho: num().min(-0.999, "must be > −1").max(0.999, "must be < 1"),
          })
          .strict(),
      )
      .max(500, "at most 500 correlations")
      .default([]),
  })
  .strict();
export type UncertaintySettings = z.infer<typeof uncertaintySchema>;

export const studySchema = z
  .object(
    {
      format: z.literal(STUDY_FORMAT, { error: `must be "${STUDY_FORMAT}"` }).optional(),
      version: z.literal(STUDY_FORMAT_VERSION, { error: `must be ${STUDY_FORMAT_VERSION}` }).optional(),
      name: nameSchema(200, "name the study"),
      currency: currencySchema,
      carbonPrice_per_t: num().min(0, "must be ≥ 0").max(10000, "must be ≤ 10000 per t").default(0),
      discountRatePercent: num().min(-5, "must be ≥ −5 %").max(50, "must be ≤ 50 %"),
      horizonYears: z
        .number({ error: "must be a number" })
        .int("must be a whole number of years")
        .min(1, "must be ≥ 1 year")
        .max(60, "must be ≤ 60 years"),
      priceEscalationPercent: num().min(-20, "must be ≥ −20 %").max(50, "must be ≤ 50 %").default(0),
      rankingMetric: z.enum(RANKING_METRICS, { error: `must be one of ${RANKING_METRICS.join(", ")}` }).default("cost-per-useful-MWh"),
      /** Count upstream (well-to-tank) CO2e in CO2 avoided and price it at the carbon price. */
      includeUpstream: z.boolean({ error: "must be true or false" }).default(false),
      sensitivity: sensitivitySchema.default({ ...SENSITIVITY_DEFAULTS }),
      hydrogenSweep: hydrogenSweepSchema.default({
        enabled: true,
        stepPercent: 1,
        flameStepPercent: 10,
        hydrogen: { compound: "H2", phase: "gas" } as FuelDefinition,
      }),
      plant: plantSchema,
      baseline: scenarioSchema,
      scenarios: z
        .array(scenarioSchema, {
          error: (iss) =>
            iss.input === undefined ? "required: a list of candidate scenarios (may be empty)" : "must be a list of scenarios",
        })
        .max(200, "at most 200 scenarios"),
      notes: text(10000).default(""),
      ...coverShape,
      /** Price and carbon paths over the horizon; absent = flat prices escalating at priceEscalationPercent. */
      paths: pathsSchema.nullish(),
      /** Ranges of the uncertain inputs for the Monte Carlo ranking; absent = defaults from `sensitivity`. */
      uncertainty: uncertaintySchema.nullish(),
    },
    { error: "a study must be a JSON object" },
  )
  .strict()
  .superRefine((s, ctx) => {
    checkScenarioSet(s, ctx);
    const checkComponents = (sc: z.output<typeof scenarioSchema>, path: (string | number)[]) => {
      if (!sc.componentPrices) return;
      if (!("blend" in sc.fuel)) {
        ctx.addIssue({ code: "custom", path: [...path, "componentPrices"], message: "component prices apply only to a blend" });
      } else if (sc.componentPrices.length !== sc.fuel.blend.length) {
        ctx.addIssue({
          code: "custom",
          path: [...path, "componentPrices"],
          message: `give one price per blend component (${sc.fuel.blend.length}), got ${sc.componentPrices.length}`,
        });
      } else if (sc.price) {
        ctx.addIssue({
          code: "custom",
          path: [...path, "componentPrices"],
          message: "give either a price for the blend or component prices, not both",
        });
      }
    };
    checkComponents(s.baseline, ["baseline"]);
    s.scenarios.forEach((sc, i) => {
      checkComponents(sc, ["scenarios", i]);
    });
    const checkCurrency = (price: { currency: string } | null | undefined, path: (string | number)[]) => {
      if (price && price.currency !== s.currency) {
        ctx.addIssue({
          code: "custom",
          path: [...path, "currency"],
          message: `must be ${s.currency}, the study's currency (a study file carries its prices already converted)`,
        });
      }
    };
    checkCurrency(s.baseline.price, ["baseline", "price"]);
    s.baseline.componentPrices?.forEach((p, j) => {
      checkCurrency(p, ["baseline", "componentPrices", j]);
    });
    s.scenarios.forEach((sc, i) => {
      checkCurrency(sc.price, ["scenarios", i, "price"]);
      sc.componentPrices?.forEach((p, j) => {
        checkCurrency(p, ["scenarios", i, "componentPrices", j]);
      });
    });
    checkCurrency(s.hydrogenSweep.hydrogenPrice, ["hydrogenSweep", "hydrogenPrice"]);
  });

export type StudyInput = z.input<typeof studySchema>;
export type Study = z.output<typeof studySchema>;
