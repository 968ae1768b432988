/**
 * `npm run bench`: Stoke's speed figures, one line each: `NAME: MEDIAN UNIT (min MIN, max MAX)` (a
 * benchmark may print another figure than the median, e.g. a 95th percentile, and says so).
 * Benchmarks are measurements, never assertions; targets are in DEVELOPERS.md.
 * Pass names to run a subset, e.g. `npm run bench -- equilibrium`.
 */
import { existsSync } from "node:fs";
import type { BenchResult } from "./bench-types";

type Bench = { name: string; file: string; fn: string };
const BENCHES: Bench[] = [
  { name: "equilibrium", file: "./equilibrium.bench.ts", fn: "benchEquilibrium" },
  { name: "kinetics", file: "./kinetics.bench.ts", fn: "benchKinetics" },
  { name: "transport", file: "./transport.bench.ts", fn: "benchTransport" },
  { name: "properties", file: "./properties.bench.ts", fn: "benchProperties" },
  { name: "study", file: "./study.bench.ts", fn: "benchStudy" },
  { name: "uncertainty", file: "./uncertainty.bench.ts", fn: "benchUncertainty" },
  { name: "pages", file: "./pages.bench.ts", fn: "benchPages" },
  { name: "load", file: "./load.bench.ts", fn: "benchLoad" },
  { name: "cli", file: "./cli.bench.ts", fn: "benchCli" },
  { name: "flame", file: "./flame.bench.ts", fn: "benchFlame" },
  { name: "study-flames", file: "./study-flames.bench.ts", fn: "benchStudyFlames" },
];

function median(v: number[]): number {
  const s = [...v].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}
function fmt(x: number): string {
  return x >= 100 ? x.toFixed(0) : x >= 10 ? x.toFixed(1) : x.toFixed(2);
}

const wanted = process.argv.slice(2);
const here = new URL(".", import.meta.url);
for (const b of BENCHES) {
  if (wanted.length && !wanted.includes(b.name)) continue;
  const url = new URL(b.file, here);
  if (!existsSync(url)) continue;
  const mod = (await import(url.href)) as Record<string, () => Promise<BenchResult[]>>;
  for (const r of await mod[b.fn]()) {
    console.log(
      `${r.name}: ${fmt(r.value ?? median(r.samples))} ${r.unit} (min ${fmt(Math.min(...r.samples))}, max ${fmt(Math.max(...r.samples))})`,
    );
  }
}
