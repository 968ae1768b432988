/**
 * Stoke's command line: `stoke <command> --input FILE|-`, one JSON object on stdout.
 * Bad input: exit status 2 and one line on stderr naming the field.
 */
import { readFileSync } from "node:fs";
import { runFlame, runProperties } from "./combustion";
import { UsageError, usageFailure, type CliResult } from "./io";
import { FuelDefinitionError } from "../fuels/resolve";
import { EquilibriumNotConvergedError } from "../combustion/equilibrium";

const HELP = `usage: stoke <command> --input FILE   (FILE = - reads standard input)
commands:
  properties   heating values, Wobbe index, air demand, flue gas and CO2 factors of a fuel
  flame        adiabatic flame temperature (method: mean-cp | complete | equilibrium)
  evaluate     a whole study: plant, baseline and candidates, ranked (--format json|csv)
`;

type Command = (argv: readonly string[], stdin: () => string) => CliResult | Promise<CliResult>;

async function loadEvaluate(): Promise<Command> {
  const mod = await import("./evaluate");
  return mod.runEvaluate as Command;
}

export async function runCli(argv: readonly string[], stdin: () => string): Promise<CliResult> {
  const [cmd, ...rest] = argv;
  if (!cmd || cmd === "--help" || cmd === "help" || cmd === "-h") return { stdout: HELP, stderr: "", exitCode: cmd ? 0 : 2 };
  const commands: Record<string, () => Promise<Command>> = {
    properties: async () => runProperties,
    flame: async () => runFlame,
    evaluate: loadEvaluate,
  };
  const load = commands[cmd];
  if (!load) return usageFailure(`unknown command "${cmd}" (commands: ${Object.keys(commands).join(", ")})`);
  try {
    return await (await load())(rest, stdin);
  } catch (e) {
    if (e instanceof UsageError || e instanceof FuelDefinitionError || e instanceof RangeError) return usageFailure(e.message);
    if (e instanceof EquilibriumNotConvergedError) return { stdout: "", stderr: `stoke: equilibrium did not converge: ${e.message}\n`, exitCode: 1 };
    throw e;
  }
}

const isMain = process.argv[1] && /cli[\\/]main\.ts$/.test(process.argv[1]);
if (isMain) {
  // A closed pipe (e.g. `| head`) ends the output quietly.
  process.stdout.on("error", (e: NodeJS.ErrnoException) => {
    if (e.code === "EPIPE") process.exit(0);
    throw e;
  });
  const r = await runCli(process.argv.slice(2), () => readFileSync(0, "utf8"));
  if (r.stdout) process.stdout.write(r.stdout);
  if (r.stderr) process.stderr.write(r.stderr);
  process.exitCode = r.exitCode;
}
