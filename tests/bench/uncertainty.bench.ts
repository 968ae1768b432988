/**
 * Benchmark of the Monte Carlo ranking (lib/study/uncertainty).
 *
 * - uncertainty_10k_ms: 10,000 Latin-hypercube draws of the 20-scenario benchmark study
 *   (study.bench.ts), ranked by its metric, from fresh caches each time (the one deterministic
 *   evaluation of the study included); target ≤ 1,000 ms.
 * - uncertainty_10k_cpu_ms: the process CPU time (user + system) of the same runs, which a loaded
 *   machine does not inflate the way it inflates wall time.
 */
import { studySchema } from "../../lib/schemas/study";
import { uncertaintyRanking } from "../../lib/study/uncertainty";
import type { BenchResult } from "./bench-types";
import { twentyScenarioStudy } from "./study.bench";

export async function benchUncertainty(): Promise<BenchResult[]> {
  const study = studySchema.parse(twentyScenarioStudy());
  if (study.scenarios.length !== 20) throw new Error(`benchmark study has ${study.scenarios.length} scenarios, expected 20`);
  let sink = 0;
  for (let i = 0; i < 2; i++) sink += uncertaintyRanking(study, { draws: 10_000, seed: i + 1 }).scenarios.length; // warm-up (JIT)
  const wall: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < 7; i++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    const r = uncertaintyRanking(study, { draws: 10_000, seed: 100 + i });
    wall.push(performance.now() - t0);
    const c = process.cpuUsage(c0);
    cpu.push((c.user + c.system) / 1000);
    sink += r.scenarios[0].pFirst;
  }
  if (!Number.isFinite(sink)) throw new Error("unreachable");
  return [
    { name: "uncertainty_10k_ms", unit: "ms", samples: wall },
    { name: "uncertainty_10k_cpu_ms", unit: "ms", samples: cpu },
  ];
}
