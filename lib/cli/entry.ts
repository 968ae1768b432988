/** The process entry point of `stoke`: real standard streams, exit status. */
import { fstatSync, readFileSync } from "node:fs";
import { createInterface } from "node:readline";
import { FdSink } from "./io";
import { main } from "./main";

// STOKE_DEBUG=1: stacks of internal errors point into the TypeScript sources (dist/cli/stoke.mjs.map).
if (process.env.STOKE_DEBUG === "1") process.setSourceMapsEnabled(true);

void main(process.argv.slice(2), {
  stdinText: () => readFileSync(0, "utf8"),
  stdinLines: () => createInterface({ input: process.stdin, crlfDelay: Infinity }),
  // Written through the file descriptors (see FdSink): a closed pipe (e.g. `| head`) ends quietly.
  out: new FdSink(1),
  err: new FdSink(2, 0),
  // A terminal is a character device; asking node:tty would load Node's network stack (~10 ms). A
  // character device that is not a terminal (/dev/null) discards what it is sent anyway.
  errIsTTY: fstatSync(2).isCharacterDevice(),
  debug: process.env.STOKE_DEBUG === "1",
}).then((code) => {
  process.exitCode = code;
});
