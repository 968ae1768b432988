import { db } from "@/lib/db/client";
import { addExchangeRates, listExchangeRates } from "@/lib/services/exchange-rates";
import { failure, json, readJson, withErrors } from "../_http";

export const dynamic = "force-dynamic";

/** GET /api/exchange-rates: every stored rate (1 fromCurrency = rate toCurrency from validFrom on). */
export const GET = withErrors(async (): Promise<Response> => json({ rates: await listExchangeRates(db()) }));

/**
 * POST /api/exchange-rates: one rate or a list as JSON; or a file (`?format=csv|json`, or a
 * text/csv body) with the columns fromCurrency, toCurrency, rate, validFrom, source. All or nothing.
 */
export const POST = withErrors(async (req: Request): Promise<Response> => {
  const url = new URL(req.url);
  const type = req.headers.get("content-type") ?? "";
  const format = url.searchParams.get("format") ?? (type.includes("csv") ? "csv" : null);
  if (format !== null && format !== "csv" && format !== "json")
    return json({ error: "format must be json or csv", fieldErrors: { format: "must be json or csv" } }, 400);
  let r: Awaited<ReturnType<typeof addExchangeRates>>;
  if (format) r = await addExchangeRates(db(), { text: await req.text(), format });
  else {
    const body = await readJson(req);
    if (!body.ok) return body.response;
    r = await addExchangeRates(db(), { value: body.value });
  }
  if (!r.ok) return failure(r);
  return json({ added: r.value }, 201);
});
