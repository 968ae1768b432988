import { db } from "@/lib/db/client";
import { exportLibraryText } from "@/lib/services/transfer";
import { json, withErrors } from "../../_http";

export const dynamic = "force-dynamic";

/** GET /api/fuels/export?format=json|csv: the whole library as a download. */
export const GET = withErrors(async (req: Request): Promise<Response> => {
  const format = new URL(req.url).searchParams.get("format") ?? "json";
  if (format !== "json" && format !== "csv")
    return json({ error: "format must be json or csv", fieldErrors: { format: "must be json or csv" } }, 400);
  const text = await exportLibraryText(db(), format);
  const stamp = new Date().toISOString().slice(0, 10);
  return new Response(text, {
    headers: {
      "content-type": format === "csv" ? "text/csv; charset=utf-8" : "application/json; charset=utf-8",
      "content-disposition": `attachment; filename="stoke-fuel-library-${stamp}.${format}"`,
      "cache-control": "no-store",
    },
  });
});
