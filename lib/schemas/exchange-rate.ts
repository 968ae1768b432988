/** Zod schema of a dated exchange rate as the API and the import files send it. */
import { z } from "zod";
import { currencySchema } from "./currencies";
import { isoDateSchema } from "./library";

export const exchangeRateInputSchema = z
  .object({
    /** One unit of this currency … */
    fromCurrency: currencySchema,
    /** … buys `rate` units of this one … */
    toCurrency: currencySchema,
    rate: z.number({ error: "must be a number" }).finite("must be a number").positive("must be > 0"),
    /** … from this date on. */
    validFrom: isoDateSchema,
    source: z.string({ error: "must be text" }).trim().max(1000, "must be ≤ 1000 characters").default(""),
  })
  .strict()
  .superRefine((r, ctx) => {
    if (r.fromCurrency === r.toCurrency)
      ctx.addIssue({ code: "custom", path: ["toCurrency"], message: "must differ from the currency converted from" });
  });
export type ExchangeRateInput = z.input<typeof exchangeRateInputSchema>;
