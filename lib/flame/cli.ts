/**
 * `stoke flame-speed --input FILE|-`: the laminar burning velocity as one JSON object.
 * Bad input: exit 2 with one line naming the field; a flame that does not converge: exit 1 with the
 * solver's diagnostics (never a number).
 */
import { parseFlags, readJsonInput, validate, ok, usageFailure, UsageError, type CliResult } from "../cli/io";
import { InputError, NotConvergedError } from "../errors";
import { flameSpeedRequestSchema } from "../schemas/flame-speed";
import { computeFlameSpeed } from "./flame-speed";

export function runFlameSpeed(argv: readonly string[], stdin: () => string): CliResult {
  try {
    const flags = parseFlags(argv, ["input"]);
    const req = validate(flameSpeedRequestSchema, readJsonInput(flags.input, stdin));
    const { solution: _solution, diagnostics, ...result } = computeFlameSpeed(req);
    void _solution;
    return ok({ ...result, diagnostics });
  } catch (e) {
    if (e instanceof UsageError || e instanceof InputError) return usageFailure(e.message);
    if (e instanceof NotConvergedError) {
      return { stdout: "", stderr: `stoke: the flame did not converge: ${e.detail} ${JSON.stringify(e.diagnostics)}\n`, exitCode: 1 };
    }
    throw e;
  }
}
