/**
 * How long a SQLite connection waits for another connection's write lock before it gives up
 * (better-sqlite3's `timeout`, SQLite's busy timeout), in ms. `STOKE_SQLITE_BUSY_TIMEOUT_MS`
 * overrides the default of 5,000 ms; a request that still finds the database locked answers
 * 503 "busy, try again" (app/api/_http.ts).
 */
export const SQLITE_BUSY_TIMEOUT_MS = busyTimeoutFromEnv(process.env.STOKE_SQLITE_BUSY_TIMEOUT_MS);

function busyTimeoutFromEnv(text: string | undefined): number {
  if (text === undefined || text.trim() === "") return 5000;
  const n = Number(text);
  if (!Number.isInteger(n) || n < 0 || n > 600_000) {
    throw new Error(`STOKE_SQLITE_BUSY_TIMEOUT_MS must be a whole number of milliseconds from 0 to 600000, not "${text}"`);
  }
  return n;
}
