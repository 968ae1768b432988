export interface BenchResult {
  name: string;
  unit: string;
  samples: number[];
}
