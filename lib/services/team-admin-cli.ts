/** `npm run -s team:admin -- --email …`: creates the first admin (see team-admin.ts). Exit 0 done, 1 refused, 2 usage. */
import { db } from "../db/client";
import { migrateSqlite } from "../db/migrate";
import { databaseTarget } from "../db/paths";
import { parseTeamAdminArgs, runTeamAdmin } from "./team-admin";

/** Reads the password: a prompt without echo on a terminal, else the first line of standard input. */
async function readPassword(): Promise<string> {
  const stdin = process.stdin;
  if (!stdin.isTTY) {
    const chunks: Buffer[] = [];
    for await (const c of stdin) chunks.push(c as Buffer);
    return Buffer.concat(chunks).toString("utf8").split(/\r?\n/)[0];
  }
  const ask = (prompt: string) =>
    new Promise<string>((resolve) => {
      process.stderr.write(prompt);
      stdin.setRawMode(true);
      stdin.resume();
      let typed = "";
      const onData = (d: Buffer) => {
        for (const ch of d.toString("utf8")) {
          if (ch === "\r" || ch === "\n") {
            stdin.setRawMode(false);
            stdin.pause();
            stdin.off("data", onData);
            process.stderr.write("\n");
            resolve(typed);
            return;
          }
          if (ch === "\u0003") process.exit(130);
          if (ch === "\u007f") typed = typed.slice(0, -1);
          else typed += ch;
        }
      };
      stdin.on("data", onData);
    });
  const first = await ask("Password: ");
  const again = await ask("Password again: ");
  if (first !== again) {
    console.error("The two passwords differ; nothing was changed.");
    process.exit(1);
  }
  return first;
}

const parsed = parseTeamAdminArgs(process.argv.slice(2));
if (!parsed.ok) {
  console.error(parsed.message);
  process.exit(2);
}
if (databaseTarget().provider === "sqlite") migrateSqlite();
const password = await readPassword();
const r = await runTeamAdmin(db(), parsed.args, password);
await db().$disconnect();
(r.ok ? console.log : console.error)(r.message);
process.exit(r.ok ? 0 : 1);
