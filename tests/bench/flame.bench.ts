/**
 * Benchmarks of the flame engine (lib/flame), CPU time (the machine is shared; wall time is noisy):
 *
 * - flame_speed_cold_s: one laminar burning velocity, CH4/air φ = 1, 298.15 K, 101.325 kPa, from the
 *   equilibrium-based starting estimate to the converged solution on the refined grid (ratio 3,
 *   slope 0.06, curve 0.12), post-flame NO included. Mechanism and transport fits are loaded
 *   before timing (a warm-up solve on a coarse grid, and a warm-started one from it, so that neither
 *   figure includes the first compilation of the code it runs).
 * - flame_speed_h2_sweep_s: 0, 10, …, 100 vol % H2 in CH4 at φ = 0.8 (11 solves, same settings),
 *   each warm-started from the previous one, the first from the starting estimate; three sweeps, so
 *   that the median of each figure is compared (the machine's noise moves single runs by ±15 %).
 * - flame_speed_peak_rss_MB: the process's peak resident memory after those solves.
 */
import { computeFlameSpeed, type FlameSpeedResult } from "../../lib/flame/flame-speed";
import type { BenchResult } from "./bench-types";

function cpuSeconds<T>(f: () => T): [T, number] {
  const t = process.cpuUsage();
  const r = f();
  const c = process.cpuUsage(t);
  return [r, (c.user + c.system) / 1e6];
}

export async function benchFlame(): Promise<BenchResult[]> {
  const coarse = { slope: 0.3, curve: 0.6 };
  const warmUp = computeFlameSpeed({ fuel: { composition: { CH4: 1 } }, phi: 1, grid: coarse });
  computeFlameSpeed({ fuel: { composition: { CH4: 0.9, H2: 0.1 } }, phi: 1, grid: coarse }, { warmStart: warmUp.solution });
  const cold: number[] = [];
  for (let i = 0; i < 3; i++) cold.push(cpuSeconds(() => computeFlameSpeed({ fuel: { composition: { CH4: 1 } }, phi: 1 }))[1]);
  const sweep: number[] = [];
  for (let s = 0; s < 3; s++)
    sweep.push(
      cpuSeconds(() => {
        let prev: FlameSpeedResult | undefined;
        for (let i = 0; i <= 10; i++) {
          const h2 = i / 10;
          const composition: Record<string, number> = h2 === 0 ? { CH4: 1 } : h2 === 1 ? { H2: 1 } : { CH4: 1 - h2, H2: h2 };
          prev = computeFlameSpeed({ fuel: { composition }, phi: 0.8 }, { warmStart: prev?.solution });
        }
      })[1],
    );
  const peak = process.resourceUsage().maxRSS / 1024;
  return [
    { name: "flame_speed_cold_s", unit: "s", samples: cold },
    { name: "flame_speed_h2_sweep_s", unit: "s", samples: sweep },
    { name: "flame_speed_peak_rss_MB", unit: "MB", samples: [peak] },
  ];
}
