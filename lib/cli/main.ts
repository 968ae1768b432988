/**
 * Stoke's command line: `stoke <command> [options]`. The commands are in `commands.ts`; how one
 * is run (single input, batch, formats) in `run.ts`; the error mapping in `io.ts`. The process
 * entry point is `entry.ts` (compiled to `dist/cli/stoke.mjs`).
 */
import { COMMANDS, findCommand } from "./commands";
import { helpFor, overview, version } from "./help";
import { failureText, describeFailure, StringSink, UsageError, EXIT_BAD_INPUT, EXIT_OK, type CliResult } from "./io";
import { runCommand, type CliIo } from "./run";

function unknownCommand(name: string): UsageError {
  return new UsageError(`unknown command "${name}" (commands: ${COMMANDS.map((c) => c.name).join(", ")}; stoke help)`);
}

/** Runs the command line with `io`; returns the exit status. */
export async function main(argv: readonly string[], io: CliIo): Promise<number> {
  const [cmd, ...rest] = argv;
  if (cmd === "--version" || cmd === "-V" || cmd === "version") {
    await io.out.write(`stoke ${await version()}\n`);
    await io.out.flush();
    return EXIT_OK;
  }
  if (!cmd || cmd === "--help" || cmd === "-h" || cmd === "help") {
    const topic = cmd === "help" ? rest[0] : undefined;
    const spec = topic ? findCommand(topic) : undefined;
    if (topic && !spec) {
      await io.err.write(failureText(describeFailure(unknownCommand(topic))));
      await io.err.flush();
      return EXIT_BAD_INPUT;
    }
    await (cmd ? io.out : io.err).write(spec ? helpFor(spec) : overview());
    await io.out.flush();
    await io.err.flush();
    return cmd ? EXIT_OK : EXIT_BAD_INPUT;
  }
  const spec = findCommand(cmd);
  if (!spec) {
    await io.err.write(failureText(describeFailure(unknownCommand(cmd))));
    await io.err.flush();
    return EXIT_BAD_INPUT;
  }
  return runCommand(spec, rest, io);
}

/** The command line in memory: `stdin` is all of standard input. For tests. */
export async function runCli(
  argv: readonly string[],
  stdin: () => string,
  opts: { errIsTTY?: boolean; debug?: boolean } = {},
): Promise<CliResult> {
  const out = new StringSink();
  const err = new StringSink();
  const io: CliIo = {
    stdinText: stdin,
    async *stdinLines() {
      yield* stdin().split("\n");
    },
    out,
    err,
    errIsTTY: opts.errIsTTY ?? false,
    debug: opts.debug ?? false,
  };
  const exitCode = await main(argv, io);
  return { stdout: out.text, stderr: err.text, exitCode };
}
