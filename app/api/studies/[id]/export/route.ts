import { db } from "@/lib/db/client";
import { evaluateStoredStudy } from "@/lib/services/studies";
import { studyResultToCsv, CSV_TABLES, type CsvTable } from "@/lib/study/csv";
import { RANKING_METRICS, type RankingMetric } from "@/lib/economics/sensitivity";
import { failure, json, notFound, parseId, withErrors } from "../../../_http";
import { upstreamParam } from "@/app/studies/_components/settings";
import { hydrogenPriceLabel, labelledPriceSource } from "@/app/studies/_components/price-labels";

export const dynamic = "force-dynamic";

const STUDY_RESULTS_FORMAT = "stoke-study-results";

function fileName(name: string, ext: string, table?: string): string {
  const base =
    name
      .replace(/[^\p{L}\p{N}]+/gu, "-")
      .replace(/^-|-$/g, "")
      .toLowerCase() || "study";
  return `${base}${table ? `-${table}` : ""}.${ext}`;
}

/**
 * GET /api/studies/{id}/export?format=csv|json[&table=scenarios|checks|sweep][&metric=…][&upstream=1|0]
 * CSV: one table of the results (column names carry unit and basis). JSON: the study as a
 * self-contained study file (runs with `stoke evaluate`) and its full evaluated results.
 */
export const GET = withErrors(async (req: Request, { params }: { params: Promise<{ id: string }> }): Promise<Response> => {
  const id = parseId((await params).id);
  if (id === null) return notFound("Study");
  const q = new URL(req.url).searchParams;
  const format = q.get("format") ?? "csv";
  if (format !== "csv" && format !== "json")
    return json({ error: 'format must be "csv" or "json"', fieldErrors: { format: "unknown format" } }, 400);
  const table = (q.get("table") ?? "scenarios") as CsvTable;
  if (!(CSV_TABLES as readonly string[]).includes(table))
    return json({ error: `table must be one of ${CSV_TABLES.join(", ")}`, fieldErrors: { table: "unknown table" } }, 400);
  const m = q.get("metric");
  if (m && !(RANKING_METRICS as readonly string[]).includes(m))
    return json({ error: `metric must be one of ${RANKING_METRICS.join(", ")}`, fieldErrors: { metric: "unknown metric" } }, 400);
  // The sweep table asks for the sweep (a study without its hydrogen answers 400 naming hydrogenFuelId); the JSON file includes it when the study names its hydrogen.
  const needSweep = format === "csv" && table === "sweep" ? true : format === "json" ? "if-chosen" : false;
  const ev = await evaluateStoredStudy(db(), id, {
    metric: (m as RankingMetric) ?? undefined,
    includeUpstream: upstreamParam(q.get("upstream")),
    sweep: needSweep,
  });
  if (!ev.ok) return failure(ev);
  const name = ev.result.study.name;
  if (format === "csv") {
    return new Response(studyResultToCsv(ev.result, table), {
      headers: {
        "content-type": "text/csv; charset=utf-8",
        "content-disposition": `attachment; filename="${fileName(name, "csv", table)}"`,
        "cache-control": "no-store",
      },
    });
  }
  const body = {
    format: STUDY_RESULTS_FORMAT,
    version: 1,
    exportedAt: new Date().toISOString(),
    note: "`study` is a self-contained study file (stoke evaluate --input); `results` is its evaluation as shown in Stoke. Prices marked isInvented are demo figures.",
    study: { format: "stoke-study", version: 1, ...ev.bundle.study },
    priceSources: {
      baseline: labelledPriceSource(ev.bundle.meta.baseline.price),
      scenarios: ev.bundle.meta.scenarios.map((s) => labelledPriceSource(s.price)),
      hydrogen: { ...labelledPriceSource(ev.bundle.meta.hydrogen.price), label: hydrogenPriceLabel(ev.bundle.meta.hydrogen) },
    },
    results: ev.result,
  };
  return new Response(JSON.stringify(body, null, 2), {
    headers: {
      "content-type": "application/json; charset=utf-8",
      "content-disposition": `attachment; filename="${fileName(name, "json")}"`,
      "cache-control": "no-store",
    },
  });
});
