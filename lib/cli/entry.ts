/** The process entry point of `stoke`: real standard streams, exit status. */
import { readFileSync } from "node:fs";
import { createInterface } from "node:readline";
import { StreamSink } from "./io";
import { main } from "./main";

// STOKE_DEBUG=1: stacks of internal errors point into the TypeScript sources (dist/cli/stoke.mjs.map).
if (process.env.STOKE_DEBUG === "1") process.setSourceMapsEnabled(true);

// A closed pipe (e.g. `| head`) ends the output quietly.
process.stdout.on("error", (e: NodeJS.ErrnoException) => {
  if (e.code === "EPIPE") process.exit(0);
  throw e;
});

void main(process.argv.slice(2), {
  stdinText: () => readFileSync(0, "utf8"),
  stdinLines: () => createInterface({ input: process.stdin, crlfDelay: Infinity }),
  out: new StreamSink(process.stdout),
  err: new StreamSink(process.stderr, 0),
  errIsTTY: process.stderr.isTTY === true,
  debug: process.env.STOKE_DEBUG === "1",
}).then((code) => {
  process.exitCode = code;
});
