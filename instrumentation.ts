/**
 * Runs once when the server starts (Node.js runtime only): brings the database (SQLite or
 * PostgreSQL, as DATABASE_URL says) up to date with the committed migrations and fills an empty database with the invented demo
 * (set STOKE_SEED=off to start with an empty library).
 */
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { stokeMode, teamModeProblem, allowedHosts, refuseTeamStart } = await import("./lib/services/mode");
  const team = stokeMode() === "team";
  if (team) {
    const problem = teamModeProblem();
    if (problem) refuseTeamStart(problem);
    console.log(`Stoke: team mode (sign-in required); answering for hosts ${allowedHosts().join(", ")}.`);
  }
  const { migrate } = await import("./lib/db/migrate");
  const r = await migrate();
  if (r.applied.length) console.log(`Stoke: migrated ${r.file} (${r.applied.join(", ")})`);
  if ((process.env.STOKE_SEED ?? "").toLowerCase() !== "off") {
    const { db } = await import("./lib/db/client");
    const { seedIfEmpty } = await import("./seed/index");
    const { actingAs } = await import("./lib/services/actor");
    const s = await actingAs({ name: "demo seed", accountId: null, role: "admin", via: "command" }, () => seedIfEmpty(db()));
    if (s.seeded) console.log(`Stoke: empty database; seeded the invented demo (${s.fuels} fuels, ${s.plants} plants).`);
  }
  if (team) {
    const { db } = await import("./lib/db/client");
    const { enabledAdmins } = await import("./lib/services/accounts");
    if ((await enabledAdmins(db())) === 0)
      console.log("Stoke: no admin account yet; create the first one with: npm run -s team:admin -- --email you@example.org");
  }
}
