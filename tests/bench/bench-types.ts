export interface BenchResult {
  name: string;
  unit: string;
  samples: number[];
  /** The figure to print instead of the median (e.g. a 95th percentile); min and max stay those of the samples. */
  value?: number;
}
