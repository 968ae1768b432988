import { RANKING_METRICS, RANKING_METRIC_INFO } from "@/lib/economics/sensitivity";

/** Ranking metrics for the study form. */
export const METRIC_OPTIONS = RANKING_METRICS.map((m) => ({ value: m, label: RANKING_METRIC_INFO[m].label }));
