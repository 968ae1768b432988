/** `npm run db:migrate`: applies pending migrations to the database named by DATABASE_URL (SQLite or PostgreSQL). */
import { migrate } from "./migrate";

try {
  const r = await migrate();
  if (r.applied.length) console.log(`Migrated ${r.file}: applied ${r.applied.join(", ")}`);
  else console.log(`Database ${r.file} is up to date (${r.alreadyApplied.length} migrations).`);
} catch (e) {
  console.error((e as Error).message);
  process.exit(1);
}
