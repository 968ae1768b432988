/**
 * Benchmark of a study with its flame solves (lib/study/evaluate + lib/study/flame-solves).
 *
 * - study_with_flames_cold_s: the demo study (seed/example-study.json: baseline, four candidates and
 *   the hydrogen sweep) with every flame solved from an empty cache — 12 solves, the sweep's
 *   warm-started from their neighbours — and evaluated with them; wall-clock seconds, one sample
 *   (a cold run is about a minute on the shared 2-core machine).
 * - study_with_flames_warm_ms: the same study evaluated with all its solves cached (fresh evaluation
 *   caches each sample: what a page costs once the flames are known).
 */
import { readFileSync } from "node:fs";
import { studySchema } from "../../lib/schemas/study";
import { evaluateStudy, createEvaluationCaches } from "../../lib/study/evaluate";
import { solveFlames } from "../../lib/study/flame-solves";
import type { FlameOutcome } from "../../lib/plant/burner-flame";
import type { BenchResult } from "./bench-types";

export async function benchStudyFlames(): Promise<BenchResult[]> {
  const study = studySchema.parse(JSON.parse(readFileSync(new URL("../../seed/example-study.json", import.meta.url), "utf8")));
  const flames = new Map<string, FlameOutcome>();
  const t0 = performance.now();
  const first = evaluateStudy(study, { flames, caches: createEvaluationCaches() });
  for (const [k, v] of solveFlames(first.flameSolves.needed)) flames.set(k, v);
  const done = evaluateStudy(study, { flames, caches: createEvaluationCaches() });
  const cold = (performance.now() - t0) / 1000;
  if (done.flameSolves.pending !== 0) throw new Error("flame solves left pending");
  const warm: number[] = [];
  for (let i = 0; i < 10; i++) {
    const t = performance.now();
    evaluateStudy(study, { flames, caches: createEvaluationCaches() });
    warm.push(performance.now() - t);
  }
  return [
    { name: "study_with_flames_cold_s", unit: "s", samples: [cold] },
    { name: "study_with_flames_warm_ms", unit: "ms", samples: warm },
  ];
}
