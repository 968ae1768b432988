/** Evaluation caches shared by every page and API call in this process (per fuel state and operating point). */
import { createEvaluationCaches, type EvaluationCaches } from "../study/evaluate";

declare global {
  // One set of caches per process, kept across hot reloads in development.
  var __stokeStudyCaches: EvaluationCaches | undefined;
}

export function sharedCaches(): EvaluationCaches {
  let c = globalThis.__stokeStudyCaches;
  // Sweeps add about a hundred fuel states each; start afresh before the cache grows without bound.
  if (!c || c.fuels.size > 20000) c = globalThis.__stokeStudyCaches = createEvaluationCaches();
  return c;
}
