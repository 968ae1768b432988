/**
 * Runs the flame solves a study needs (`StudyResult.flameSolves.needed`), in order, each from the
 * previous solution when there is one (warm start: neighbouring sweep shares converge in a few
 * Newton steps), and hands every outcome to the caller as soon as it is known. Synchronous and
 * CPU-bound: the command line runs it in its own process, the app in a worker thread
 * (lib/services/flame-worker.ts), never on a request.
 */
import { InputError, NotConvergedError, InfeasibleChargeError } from "../errors";
import { computeFlameSpeed, type FlameSpeedState } from "../flame/flame-speed";
import { flameFiguresOf, type FlameOutcome } from "../plant/burner-flame";
import type { FlameSolveNeed } from "./evaluate";

export interface FlameSolveOptions {
  /** Keys already known (skipped). */
  known?: (key: string) => boolean;
  /** Called after each solve with its outcome, its place and the total. */
  onSolved?: (key: string, outcome: FlameOutcome, done: number, total: number) => void;
}

/** One solve; a refusal or non-convergence becomes a failure outcome with its reason (the figures are then unknown). */
export function solveFlame(
  need: Pick<FlameSolveNeed, "request">,
  warm?: FlameSpeedState,
): { outcome: FlameOutcome; state?: FlameSpeedState } {
  try {
    const r = computeFlameSpeed(need.request, warm ? { warmStart: warm } : {});
    return { outcome: flameFiguresOf(r), state: r.solution };
  } catch (e) {
    if (e instanceof NotConvergedError) return { outcome: { error: `the flame solve did not converge: ${e.detail}` } };
    if (e instanceof InputError || e instanceof InfeasibleChargeError) return { outcome: { error: `${e.field}: ${e.detail}` } };
    throw e;
  }
}

/** Solves every need not yet known, in order, warm-starting each from the last converged one. */
export function solveFlames(needs: readonly FlameSolveNeed[], options: FlameSolveOptions = {}): Map<string, FlameOutcome> {
  const out = new Map<string, FlameOutcome>();
  const todo = needs.filter((n) => !options.known?.(n.key));
  let warm: FlameSpeedState | undefined;
  todo.forEach((n, i) => {
    const { outcome, state } = solveFlame(n, warm);
    if (state) warm = state;
    out.set(n.key, outcome);
    options.onSolved?.(n.key, outcome, i + 1, todo.length);
  });
  return out;
}
