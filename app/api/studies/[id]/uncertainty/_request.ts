/** The uncertainty routes' request: the page's address parameters, refused (400, naming the field) when out of range. */
import { RANKING_METRICS } from "@/lib/economics/sensitivity";
import type { UncertaintyRequest } from "@/lib/services/uncertainty";
import { uncertaintyParams } from "@/app/studies/[id]/uncertainty/params";
import { json } from "../../../_http";

export function uncertaintyRequest(q: URLSearchParams): { ok: true; request: UncertaintyRequest } | { ok: false; response: Response } {
  const m = q.get("metric");
  if (m && !(RANKING_METRICS as readonly string[]).includes(m)) {
    return {
      ok: false,
      response: json({ error: `metric must be one of ${RANKING_METRICS.join(", ")}`, fieldErrors: { metric: "unknown metric" } }, 400),
    };
  }
  const p = uncertaintyParams(Object.fromEntries(q.entries()));
  if (p.ignored.length) {
    return {
      ok: false,
      response: json(
        {
          error: `out of range: ${p.ignored.map((x) => x.label).join(", ")}`,
          fieldErrors: Object.fromEntries(p.ignored.map((x) => [x.field, `out of range: ${x.label}`])),
        },
        400,
      ),
    };
  }
  return { ok: true, request: p.request };
}
