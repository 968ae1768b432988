/**
 * Where the database lives. SQLite is the embedded default: `data/stoke.db` under the
 * project directory. `DATABASE_URL` overrides it ("file:..." for another SQLite file,
 * "postgresql://..." for a team server, see README.md).
 */
import path from "node:path";

export const DEFAULT_DATABASE_URL = "file:./data/stoke.db";

export type DatabaseTarget = { provider: "sqlite"; url: string; file: string } | { provider: "postgresql"; url: string };

/** Reads DATABASE_URL (or the given URL) and says which database it names. */
export function databaseTarget(url: string | undefined = process.env.DATABASE_URL): DatabaseTarget {
  const u = (url ?? "").trim() || DEFAULT_DATABASE_URL;
  if (/^postgres(ql)?:\/\//i.test(u)) return { provider: "postgresql", url: u };
  let file: string;
  if (u.startsWith("file:")) file = u.slice("file:".length);
  else if (/^[a-z][a-z0-9+.-]*:\/\//i.test(u)) {
    throw new Error(`DATABASE_URL "${u}" is neither a SQLite file ("file:...") nor a PostgreSQL URL.`);
  } else file = u;
  // "file:./x.db?mode=..." — strip query parameters.
  const q = file.indexOf("?");
  if (q >= 0) file = file.slice(0, q);
  if (file === "") throw new Error("DATABASE_URL names no file.");
  const abs = file === ":memory:" ? file : path.resolve(/*turbopackIgnore: true*/ process.cwd(), file);
  return { provider: "sqlite", url: `file:${abs}`, file: abs };
}
