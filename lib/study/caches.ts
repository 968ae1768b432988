/** Caches an evaluation reuses: fuel figures per fuel state, performance per (fuel state, operating point). */
import { FuelContextCache } from "../plant/fuel-context";
import { PerformanceCache } from "../plant/performance";

export interface EvaluationCaches {
  fuels: FuelContextCache;
  performance: PerformanceCache;
}

export function createEvaluationCaches(): EvaluationCaches {
  return { fuels: new FuelContextCache(), performance: new PerformanceCache() };
}
