import { db } from "@/lib/db/client";
import { importQuotes } from "@/lib/services/quote-import";
import { failure, json, withErrors } from "../../../_http";

export const dynamic = "force-dynamic";

/**
 * POST /api/fuels/quotes/import?format=csv|json[&preview=1][&confirmImplausible=1]: quotes for
 * fuels already in the library, named in the `fuel` column. All or nothing; errors keyed
 * "row N, column" (CSV, header = row 1) or "item N, field" (JSON). `preview=1` answers what would
 * be added (200) and stores nothing; otherwise 201 with the new quotes' ids.
 */
export const POST = withErrors(async (req: Request): Promise<Response> => {
  const url = new URL(req.url);
  const type = req.headers.get("content-type") ?? "";
  const format = url.searchParams.get("format") ?? (type.includes("csv") ? "csv" : "json");
  if (format !== "json" && format !== "csv")
    return json({ error: "format must be json or csv", fieldErrors: { format: "must be json or csv" } }, 400);
  const preview = url.searchParams.get("preview") === "1";
  const r = await importQuotes(db(), await req.text(), format, {
    preview,
    confirmImplausible: url.searchParams.get("confirmImplausible") === "1",
  });
  if (!r.ok) return failure(r);
  return json(r.value, preview ? 200 : 201);
});
