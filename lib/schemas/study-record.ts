/**
 * Zod schema of a stored study as the study form and the API send it: the plant, the economic
 * assumptions, the baseline and the candidate scenarios, each naming a stored fuel (or blend) and
 * optionally a stored price quote. The constraints are the study schema's own (lib/schemas/study.ts);
 * this only swaps embedded fuel definitions and quotes for references to the library.
 */
import { z } from "zod";
import { checkScenarioSet, scenarioSchema, studySchema } from "./study";
import { isoDateSchema } from "./library";

const id = (what: string) =>
  z
    .number({ error: `choose ${what}` })
    .int(`must be the id of ${what}`)
    .positive(`must be the id of ${what}`);

const s = studySchema.shape;
const sc = scenarioSchema.shape;

export const scenarioRecordSchema = z
  .object(
    {
      name: sc.name,
      fuelId: id("a stored fuel"),
      /** A stored quote of that fuel; null = the quote in force in the study's currency (for a blend without one: its components' quotes). */
      priceQuoteId: id("a price quote").nullish(),
      /**
       * Without a chosen quote, the rule that picks one: "the latest quote in the study's currency
       * valid on this date" (YYYY-MM-DD); null = on the day the study is evaluated.
       */
      priceValidOn: isoDateSchema.nullish(),
      capex: sc.capex,
      fixedOpexChange: sc.fixedOpexChange,
      overrides: sc.overrides,
    },
    {
      error: (iss) =>
        iss.input === undefined ? "required: a scenario (an object naming a fuelId)" : "must be an object describing a scenario",
    },
  )
  .strict();
export type ScenarioRecordInput = z.input<typeof scenarioRecordSchema>;
export type ScenarioRecord = z.output<typeof scenarioRecordSchema>;

export const studyRecordSchema = z
  .object({
    plantId: id("a plant"),
    name: s.name,
    currency: s.currency,
    carbonPrice_per_t: s.carbonPrice_per_t,
    discountRatePercent: s.discountRatePercent,
    horizonYears: s.horizonYears,
    priceEscalationPercent: s.priceEscalationPercent,
    rankingMetric: s.rankingMetric,
    includeUpstream: s.includeUpstream,
    sensitivity: s.sensitivity,
    notes: s.notes,
    reportTitle: s.reportTitle,
    preparedFor: s.preparedFor,
    preparedBy: s.preparedBy,
    reportDate: s.reportDate,
    reportNotes: s.reportNotes,
    /** The stored gas the hydrogen sweep blends into the baseline gas; null = none chosen (the sweep asks for one). */
    hydrogenFuelId: id("a hydrogen fuel").nullish(),
    baseline: scenarioRecordSchema,
    scenarios: z
      .array(scenarioRecordSchema, { error: "required: a list of candidate scenarios (may be empty)" })
      .max(200, "at most 200 scenarios"),
  })
  .strict()
  .superRefine(checkScenarioSet);
export type StudyRecordInput = z.input<typeof studyRecordSchema>;
export type StudyRecord = z.output<typeof studyRecordSchema>;
