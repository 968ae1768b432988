/** Evaluation caches shared by every page and API call in this process (per fuel state and operating point). */
import { createEvaluationCaches, type EvaluationCaches } from "../study/evaluate";

const globalCaches = globalThis as unknown as { __stokeStudyCaches?: EvaluationCaches };

export function sharedCaches(): EvaluationCaches {
  let c = globalCaches.__stokeStudyCaches;
  // Sweeps add about a hundred fuel states each; start afresh before the cache grows without bound.
  if (!c || c.fuels.size > 20000) c = globalCaches.__stokeStudyCaches = createEvaluationCaches();
  return c;
}
