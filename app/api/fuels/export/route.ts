import { db } from "@/lib/db/client";
import { exportLibraryPieces } from "@/lib/services/transfer";
import { json, withErrors } from "../../_http";

export const dynamic = "force-dynamic";

/** GET /api/fuels/export?format=json|csv: the whole library as a download, streamed a chunk of fuels at a time. */
export const GET = withErrors(async (req: Request): Promise<Response> => {
  const format = new URL(req.url).searchParams.get("format") ?? "json";
  if (format !== "json" && format !== "csv")
    return json({ error: "format must be json or csv", fieldErrors: { format: "must be json or csv" } }, 400);
  const pieces = exportLibraryPieces(db(), format);
  // The first piece is read before answering, so that a database error still answers with its status.
  const first = await pieces.next();
  const encoder = new TextEncoder();
  const body = new ReadableStream<Uint8Array>({
    start(controller) {
      if (!first.done) controller.enqueue(encoder.encode(first.value));
    },
    async pull(controller) {
      const next = await pieces.next();
      if (next.done) controller.close();
      else controller.enqueue(encoder.encode(next.value));
    },
    async cancel() {
      await pieces.return(undefined);
    },
  });
  const stamp = new Date().toISOString().slice(0, 10);
  return new Response(body, {
    headers: {
      "content-type": format === "csv" ? "text/csv; charset=utf-8" : "application/json; charset=utf-8",
      "content-disposition": `attachment; filename="stoke-fuel-library-${stamp}.${format}"`,
      "cache-control": "no-store",
    },
  });
});
