import { db } from "@/lib/db/client";
import { importLibrary, parseLibrary } from "@/lib/services/transfer";
import { IMPORT_BODY_LIMIT_BYTES, failure, json, readBodyText, withErrors } from "../../_http";

export const dynamic = "force-dynamic";

/**
 * POST /api/fuels/import?format=json|csv[&onExisting=reject|skip]: the body is the file's text.
 * All or nothing: any error stores nothing.
 */
export const POST = withErrors(async (req: Request): Promise<Response> => {
  const url = new URL(req.url);
  const type = req.headers.get("content-type") ?? "";
  const format = url.searchParams.get("format") ?? (type.includes("csv") ? "csv" : "json");
  if (format !== "json" && format !== "csv")
    return json({ error: "format must be json or csv", fieldErrors: { format: "must be json or csv" } }, 400);
  const onExisting = url.searchParams.get("onExisting") ?? "reject";
  if (onExisting !== "reject" && onExisting !== "skip") {
    return json({ error: "onExisting must be reject or skip", fieldErrors: { onExisting: "must be reject or skip" } }, 400);
  }
  const body = await readBodyText(req, IMPORT_BODY_LIMIT_BYTES);
  if (!body.ok) return body.response;
  const doc = parseLibrary(body.text, format);
  if (!doc.ok) return failure(doc);
  const r = await importLibrary(db(), doc.value, { onExisting });
  if (!r.ok) return failure(r);
  return json(r.value, 201);
});
