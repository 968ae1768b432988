/**
 * The first admin of a team server, from the command line (`npm run -s team:admin -- --email …`):
 * the password is read from standard input (a prompt without echo on a terminal, else the first
 * line), never from the arguments. `--reset` gives an existing account a new password, makes it an
 * enabled admin and ends its sessions (the way back in when every admin is locked out).
 */
import type { Db } from "../db/client";
import { findAccountByEmail } from "../db/account-rows";
import { changeAccount, createAccount } from "./accounts";
import { actingAs } from "./actor";

export interface TeamAdminArgs {
  email: string;
  displayName: string;
  reset: boolean;
}

export const TEAM_ADMIN_USAGE =
  'usage: npm run -s team:admin -- --email ADDRESS [--name "DISPLAY NAME"] [--reset]   (the password is read from standard input)';

/** Parses the arguments; a password in them is refused (it would stay in the shell history and the process list). */
export function parseTeamAdminArgs(argv: string[]): { ok: true; args: TeamAdminArgs } | { ok: false; message: string } {
  const args: TeamAdminArgs = { email: "", displayName: "", reset: false };
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    const value = () => {
      const v = argv[++i];
      if (v === undefined || v.startsWith("--")) throw new Error(`${a} needs a value`);
      return v;
    };
    try {
      if (a === "--email") args.email = value();
      else if (a === "--name") args.displayName = value();
      else if (a === "--reset") args.reset = true;
      else if (a === "--password" || a.startsWith("--password="))
        return { ok: false, message: "Give the password on standard input, not as an argument (arguments are visible to other users)." };
      else return { ok: false, message: `unknown argument "${a}"\n${TEAM_ADMIN_USAGE}` };
    } catch (e) {
      return { ok: false, message: `${(e as Error).message}\n${TEAM_ADMIN_USAGE}` };
    }
  }
  if (!args.email) return { ok: false, message: `--email is required\n${TEAM_ADMIN_USAGE}` };
  return { ok: true, args };
}

const COMMAND_LINE = { name: "command line", accountId: null, role: "admin" as const, via: "command" as const };

/** Creates the admin (or, with --reset, resets an existing account to an enabled admin). Returns the line to print. */
export async function runTeamAdmin(db: Db, args: TeamAdminArgs, password: string): Promise<{ ok: boolean; message: string }> {
  return actingAs(COMMAND_LINE, async () => {
    const existing = await findAccountByEmail(db, args.email.trim().toLowerCase());
    if (existing && !args.reset) {
      return {
        ok: false,
        message: `An account for ${existing.email} exists already; add --reset to give it a new password and make it an admin.`,
      };
    }
    const r = existing
      ? await changeAccount(db, existing.id, {
          password,
          role: "admin",
          disabled: false,
          ...(args.displayName ? { displayName: args.displayName } : {}),
        })
      : await createAccount(db, { email: args.email, displayName: args.displayName, role: "admin", password });
    if (!r.ok) {
      const fields = Object.entries(r.fieldErrors).map(([k, v]) => `${k}: ${v}`);
      return { ok: false, message: `${r.message}${fields.length ? `\n  ${fields.join("\n  ")}` : ""}` };
    }
    return {
      ok: true,
      message: existing
        ? `Reset ${r.value.email} (id ${r.value.id}): a new password, role admin, enabled; its sessions have ended.`
        : `Created the admin account ${r.value.email} (id ${r.value.id}).`,
    };
  });
}
