/** Help texts, written from the command registry. */
import { readFileSync } from "node:fs";
import { COMMANDS } from "./commands";
import { commonOptions, type CommandSpec } from "./command";

/** The version, set by the build (`dist/cli`); read from package.json when run from source. */
declare const __STOKE_VERSION__: string | undefined;

export async function version(): Promise<string> {
  if (typeof __STOKE_VERSION__ === "string") return __STOKE_VERSION__;
  return (JSON.parse(readFileSync(new URL("../../package.json", import.meta.url), "utf8")) as { version: string }).version;
}

const EXIT_TEXT = `exit status: 0 success; 1 a solver did not converge; 2 bad input (the message names the field);
70 internal error (a bug; STOKE_DEBUG=1 prints the stack). A batch exits with the most serious
status of its inputs (70, then 2, then 1) and still answers every input.`;

export function overview(): string {
  const w = Math.max(...COMMANDS.map((c) => c.name.length));
  return `usage: stoke <command> --input FILE|-   one JSON input, JSON out
       stoke <command> --ndjson < in.ndjson   one input per line, one record per line out
       stoke help <command>   options and examples of a command
       stoke --version

commands:
${COMMANDS.map((c) => `  ${c.name.padEnd(w)}  ${c.summary}`).join("\n")}

${EXIT_TEXT}
`;
}

function wrap(text: string, indent: string, width = 96): string {
  const out: string[] = [];
  let line = "";
  for (const word of text.split(/\s+/)) {
    if (line && line.length + 1 + word.length > width - indent.length) {
      out.push(indent + line);
      line = word;
    } else line = line ? `${line} ${word}` : word;
  }
  if (line) out.push(indent + line);
  return out.join("\n");
}

export function helpFor(spec: CommandSpec): string {
  const options = [...commonOptions(spec), ...spec.options];
  const flag = (o: (typeof options)[number]) => `--${o.name}${o.value ? ` ${o.value}` : ""}`;
  const w = Math.max(...options.map((o) => flag(o).length));
  return `usage: stoke ${spec.name} [options]

${spec.summary}

input (one JSON object; in batch mode one per line):
${wrap(spec.input, "  ")}

output:
${wrap(spec.output, "  ")}

batch records, one line per input, in order:
  {"line": N, "ok": true, "result": ...}
  {"line": N, "ok": false, "error": {"kind": ..., "field": ..., "message": ...}}${spec.folder ? '\n  ("file": NAME instead of "line" for a folder)' : ""}

options:
${options.map((o) => `  ${flag(o).padEnd(w)}  ${wrap(o.help, " ".repeat(w + 4)).trimStart()}`).join("\n")}

examples:
${spec.examples.map((e) => `  ${e}`).join("\n")}

${EXIT_TEXT}
`;
}
