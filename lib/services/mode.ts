/**
 * Personal or team mode, one code base.
 *
 * - Personal mode (the default on SQLite): no sign-in, the server listens on 127.0.0.1 only, every
 *   change is made by "local user".
 * - Team mode (the default when DATABASE_URL names PostgreSQL, or STOKE_MODE=team): every page and
 *   API route needs a signed-in account or an API token; roles viewer, editor, admin.
 *
 * Both modes accept requests only for a Host on the allowed list (STOKE_ALLOWED_HOSTS).
 */
import { databaseTarget } from "../db/paths";

export type Mode = "personal" | "team";

type Env = Record<string, string | undefined>;

/** The mode the server runs in: STOKE_MODE when set, else team on PostgreSQL and personal on SQLite. */
export function stokeMode(env: Env = process.env): Mode {
  const m = (env.STOKE_MODE ?? "").trim().toLowerCase();
  if (m === "team" || m === "personal") return m;
  if (m !== "") throw new Error(`STOKE_MODE must be "personal" or "team", not "${env.STOKE_MODE}".`);
  return databaseTarget(env.DATABASE_URL).provider === "postgresql" ? "team" : "personal";
}

/**
 * Whether deleting a fuel, plant or study moves it to the trash: in team mode, or with
 * STOKE_TRASH=on; personal mode otherwise deletes at once, as it always did (STOKE_TRASH=off turns
 * the trash off in team mode too).
 */
export function trashEnabled(env: Env = process.env): boolean {
  const t = (env.STOKE_TRASH ?? "").trim().toLowerCase();
  if (t === "on") return true;
  if (t === "off") return false;
  return stokeMode(env) === "team";
}

export const MIN_SESSION_SECRET_CHARS = 32;

/** What stops team mode from starting (the session secret), or null. */
export function teamModeProblem(env: Env = process.env): string | null {
  const secret = env.STOKE_SESSION_SECRET ?? "";
  if (secret.length >= MIN_SESSION_SECRET_CHARS) return null;
  return (
    `Team mode needs STOKE_SESSION_SECRET of at least ${MIN_SESSION_SECRET_CHARS} characters ` +
    `(${secret.length ? `it has ${secret.length}` : "it is not set"}); it seals the sign-in cookies. ` +
    "Make one with: node -e \"console.log(require('crypto').randomBytes(32).toString('base64url'))\""
  );
}

/** The session secret of team mode; throws the clear message when it is missing or short. */
export function sessionSecret(env: Env = process.env): string {
  const p = teamModeProblem(env);
  if (p) throw new Error(p);
  return env.STOKE_SESSION_SECRET as string;
}

const LOOPBACK = ["localhost", "127.0.0.1", "[::1]"];

/**
 * The hosts requests may name (lower case): STOKE_ALLOWED_HOSTS (comma-separated `host`,
 * `host:port` or `host:*`) when set, else localhost, 127.0.0.1 and [::1] with the server's PORT
 * (on any port when PORT is not set). A bare `host` is that host on the default port (no port in
 * the Host header); `host:*` is that host on any port.
 */
export function allowedHosts(env: Env = process.env): string[] {
  const list = (env.STOKE_ALLOWED_HOSTS ?? "")
    .split(",")
    .map((h) => h.trim().toLowerCase())
    .filter(Boolean);
  if (list.length) return list;
  const port = (env.PORT ?? "").trim();
  return /^\d{1,5}$/.test(port) ? LOOPBACK.flatMap((h) => [`${h}:${port}`, h]) : LOOPBACK.map((h) => `${h}:*`);
}

/** Whether a request's Host header is on the list. */
export function hostAllowed(hostHeader: string | null, allowed: string[] = allowedHosts()): boolean {
  if (!hostHeader) return false;
  const h = hostHeader.trim().toLowerCase();
  const m = /^(\[[0-9a-f:.]+\]|[a-z0-9.-]+)(?::(\d{1,5}))?$/.exec(h);
  if (!m) return false;
  return allowed.includes(h) || allowed.includes(`${m[1]}:*`);
}

/**
 * Ends a server start that cannot go on in team mode (no usable session secret), saying why. Kept
 * here, in a module only the Node.js runtime loads, so that the start-up hook itself stays free of
 * Node-only calls.
 */
export function refuseTeamStart(problem: string): never {
  console.error(`Stoke: cannot start in team mode. ${problem}`);
  process.exit(1);
}
