/** One study from the command line, synchronously, in memory (the study tests use it). */
import { findCommand } from "./commands";
import { evaluateCommand } from "./evaluate";
import type { CliResult } from "./io";
import { runSingleSync } from "./run";

export function runEvaluate(argv: readonly string[], stdin: () => string): CliResult {
  const spec = findCommand("evaluate");
  if (!spec) throw new Error("the evaluate command is not registered");
  return runSingleSync(spec, evaluateCommand, argv, stdin);
}
