/**
 * cli_start_ms: one `stoke properties` call of the installed command (the package.json bin, plain
 * Node, compiled ahead of time), whole process from spawn to exit, milliseconds.
 * cli_batch_1000_ms: 1,000 natural-gas compositions through one `stoke properties --ndjson` run,
 * whole process, milliseconds.
 * node_start_ms: plain `node -e 0` on the same machine at the same time, for comparison (the
 * floor under cli_start_ms).
 */
import { spawnSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import type { BenchResult } from "./bench-types";

const ROOT = join(import.meta.dirname, "../..");
const BIN = join(ROOT, JSON.parse(readFileSync(join(ROOT, "package.json"), "utf8")).bin.stoke as string);

function timeRun(args: string[], input: string): number {
  const t0 = performance.now();
  const r = spawnSync(process.execPath, [BIN, ...args], { input, encoding: "utf8", maxBuffer: 1 << 28 });
  const ms = performance.now() - t0;
  if (r.status !== 0) throw new Error(`stoke ${args.join(" ")} exited ${r.status}: ${r.stderr}`);
  return ms;
}

/** 1,000 distinct natural gases: methane with ethane, propane, butane, nitrogen and CO2 varied (fixed seed). */
export function gasBatch(n = 1000): string {
  let seed = 12345;
  const rnd = () => {
    seed = (seed * 1103515245 + 12345) % 2 ** 31;
    return seed / 2 ** 31;
  };
  const lines: string[] = [];
  for (let i = 0; i < n; i++) {
    const c2 = 0.01 + 0.08 * rnd();
    const c3 = 0.02 * rnd();
    const c4 = 0.005 * rnd();
    const n2 = 0.05 * rnd();
    const co2 = 0.03 * rnd();
    const r6 = (x: number) => Math.round(x * 1e6) / 1e6;
    const composition = { C2H6: r6(c2), C3H8: r6(c3), nC4H10: r6(c4), N2: r6(n2), CO2: r6(co2) };
    const rest = 1 - Object.values(composition).reduce((a, b) => a + b, 0);
    lines.push(JSON.stringify({ fuel: { composition: { CH4: r6(rest), ...composition } } }));
  }
  return `${lines.join("\n")}\n`;
}

export async function benchCli(): Promise<BenchResult[]> {
  const one = JSON.stringify({ fuel: { composition: { CH4: 0.92, C2H6: 0.04, C3H8: 0.01, N2: 0.02, CO2: 0.01 } } });
  timeRun(["properties", "--input", "-"], one); // builds dist/cli if it is stale
  const start: number[] = [];
  for (let i = 0; i < 2; i++) timeRun(["properties", "--input", "-"], one);
  for (let i = 0; i < 15; i++) start.push(timeRun(["properties", "--input", "-"], one));
  const nodeStart: number[] = [];
  for (let i = 0; i < 15; i++) {
    const t0 = performance.now();
    spawnSync(process.execPath, ["-e", "0"]);
    nodeStart.push(performance.now() - t0);
  }
  const batchInput = gasBatch();
  const batch: number[] = [];
  timeRun(["properties", "--ndjson"], batchInput);
  for (let i = 0; i < 7; i++) batch.push(timeRun(["properties", "--ndjson"], batchInput));
  return [
    { name: "node_start_ms", unit: "ms", samples: nodeStart },
    { name: "cli_start_ms", unit: "ms", samples: start },
    { name: "cli_batch_1000_ms", unit: "ms", samples: batch },
  ];
}
