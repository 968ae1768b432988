/**
 * Runs once when the server starts (Node.js runtime only): brings the database (SQLite or
 * PostgreSQL, as DATABASE_URL says) up to date with the committed migrations and fills an empty database with the invented demo
 * (set STOKE_SEED=off to start with an empty library).
 */
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { migrate } = await import("./lib/db/migrate");
  const r = await migrate();
  if (r.applied.length) console.log(`Stoke: migrated ${r.file} (${r.applied.join(", ")})`);
  if ((process.env.STOKE_SEED ?? "").toLowerCase() !== "off") {
    const { db } = await import("./lib/db/client");
    const { seedIfEmpty } = await import("./seed/index");
    const s = await seedIfEmpty(db());
    if (s.seeded) console.log(`Stoke: empty database; seeded the invented demo (${s.fuels} fuels, ${s.plants} plants).`);
  }
}
