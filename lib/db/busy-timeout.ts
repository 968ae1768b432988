/**
 * How long a write waits for a lock another connection holds before it gives up, in ms: SQLite's
 * busy timeout (better-sqlite3's `timeout`) and PostgreSQL's `lock_timeout`. `STOKE_DB_BUSY_TIMEOUT_MS`
 * overrides the default of 5,000 ms; a request that still finds the database locked answers
 * 503 "busy, try again" (app/api/_http.ts).
 */
export const DB_BUSY_TIMEOUT_MS = busyTimeoutFromEnv(process.env.STOKE_DB_BUSY_TIMEOUT_MS);

function busyTimeoutFromEnv(text: string | undefined): number {
  if (text === undefined || text.trim() === "") return 5000;
  const n = Number(text);
  if (!Number.isInteger(n) || n < 1 || n > 600_000) {
    throw new Error(`STOKE_DB_BUSY_TIMEOUT_MS must be a whole number of milliseconds from 1 to 600000, not "${text}"`);
  }
  return n;
}
