/**
 * The first admin from the command line (npm run team:admin): the password comes from standard
 * input, never from the arguments; the account is an admin whose password verifies (argon2id);
 * --reset brings an existing account back. And what team mode needs to start (the session secret).
 */
import { spawnSync } from "node:child_process";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { tempDb } from "./temp-db";
import { parseTeamAdminArgs, runTeamAdmin } from "../../lib/services/team-admin";
import { passwordMatches } from "../../lib/services/accounts";
import { allowedHosts, hostAllowed, sessionSecret, stokeMode, teamModeProblem } from "../../lib/services/mode";

const t = await tempDb();
afterAll(() => t.cleanup());
const root = path.resolve(import.meta.dirname, "../..");

describe("npm run team:admin", () => {
  it("creates an admin from the password on standard input (the npm script, a real process)", () => {
    const run = spawnSync("npm", ["run", "-s", "team:admin", "--", "--email", "First.Admin@Example.org", "--name", "First admin"], {
      cwd: root,
      input: "a long enough passphrase\n",
      env: { ...process.env, DATABASE_URL: t.url },
      encoding: "utf8",
    });
    expect(run.stderr).toBe("");
    expect(run.status).toBe(0);
    expect(run.stdout).toMatch(/Created the admin account first\.admin@example\.org/);
  });

  it("stored an enabled admin whose argon2id hash verifies the password and no other", async () => {
    const a = await t.client.account.findUniqueOrThrow({ where: { email: "first.admin@example.org" } });
    expect(a).toMatchObject({ role: "admin", displayName: "First admin", disabledAt: null });
    expect(a.passwordHash).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/);
    expect(await passwordMatches(a.passwordHash, "a long enough passphrase")).toBe(true);
    expect(await passwordMatches(a.passwordHash, "a long enough passphrasE")).toBe(false);
    const log = await t.client.changeLog.findFirstOrThrow({ where: { subjectType: "account", subjectId: a.id } });
    expect(log).toMatchObject({ actor: "command line", action: "create" });
    expect(log.after).not.toContain("argon2");
  });

  it("refuses a password in the arguments, a short password and an existing e-mail; --reset gives a new password", async () => {
    expect(parseTeamAdminArgs(["--email", "x@y.z", "--password", "secret"])).toMatchObject({
      ok: false,
      message: expect.stringMatching(/standard input/),
    });
    expect(parseTeamAdminArgs(["--email"])).toMatchObject({ ok: false });
    expect(parseTeamAdminArgs([])).toMatchObject({ ok: false, message: expect.stringMatching(/--email is required/) });
    const args = { email: "first.admin@example.org", displayName: "", reset: false };
    expect(await runTeamAdmin(t.client, { ...args, email: "new@example.org" }, "short")).toMatchObject({
      ok: false,
      message: expect.stringMatching(/at least 12/),
    });
    expect(await runTeamAdmin(t.client, args, "another long passphrase")).toMatchObject({
      ok: false,
      message: expect.stringMatching(/--reset/),
    });
    expect(await runTeamAdmin(t.client, { ...args, reset: true }, "another long passphrase")).toMatchObject({ ok: true });
    const a = await t.client.account.findUniqueOrThrow({ where: { email: "first.admin@example.org" } });
    expect(await passwordMatches(a.passwordHash, "another long passphrase")).toBe(true);
    expect(a.version).toBe(2);
  });
});

describe("mode settings", () => {
  it("team mode on PostgreSQL or STOKE_MODE=team, personal on SQLite; a bad STOKE_MODE is named", () => {
    expect(stokeMode({ DATABASE_URL: "file:./x.db" })).toBe("personal");
    expect(stokeMode({ DATABASE_URL: "postgresql://u@h/db" })).toBe("team");
    expect(stokeMode({ DATABASE_URL: "postgresql://u@h/db", STOKE_MODE: "personal" })).toBe("personal");
    expect(stokeMode({ STOKE_MODE: "team" })).toBe("team");
    expect(() => stokeMode({ STOKE_MODE: "shared" })).toThrow(/STOKE_MODE must be "personal" or "team"/);
  });

  it("team mode refuses a session secret under 32 characters with a message saying how to make one", () => {
    expect(teamModeProblem({})).toMatch(/STOKE_SESSION_SECRET of at least 32 characters \(it is not set\)/);
    expect(teamModeProblem({ STOKE_SESSION_SECRET: "x".repeat(31) })).toMatch(/it has 31/);
    expect(teamModeProblem({ STOKE_SESSION_SECRET: "x".repeat(32) })).toBeNull();
    expect(() => sessionSecret({ STOKE_SESSION_SECRET: "short" })).toThrow(/randomBytes/);
  });

  it("allowed hosts: loopback names with PORT by default, the configured list otherwise", () => {
    expect(allowedHosts({ PORT: "3000" })).toEqual(["localhost:3000", "localhost", "127.0.0.1:3000", "127.0.0.1", "[::1]:3000", "[::1]"]);
    const list = allowedHosts({ PORT: "3000" });
    expect(hostAllowed("LOCALHOST:3000", list)).toBe(true);
    expect(hostAllowed("localhost:3001", list)).toBe(false);
    expect(hostAllowed("127.0.0.1.nip.example:3000", list)).toBe(false);
    expect(hostAllowed(null, list)).toBe(false);
    const any = allowedHosts({});
    expect(hostAllowed("127.0.0.1:45123", any)).toBe(true);
    expect(hostAllowed("[::1]:45123", any)).toBe(true);
    const team = allowedHosts({ STOKE_ALLOWED_HOSTS: "stoke.plant.example, stoke-2.plant.example:8443" });
    expect(hostAllowed("stoke.plant.example", team)).toBe(true);
    expect(hostAllowed("stoke.plant.example:444", team)).toBe(false);
    expect(hostAllowed("stoke-2.plant.example:8443", team)).toBe(true);
  });
});
