/** `npm run db:migrate`: applies pending migrations to the database named by DATABASE_URL. */
import { databaseTarget } from "./paths";
import { migrateSqlite } from "./migrate";

const target = databaseTarget();
if (target.provider === "postgresql") {
  console.error("DATABASE_URL points at PostgreSQL: apply its migrations with `npx prisma migrate deploy` (see README.md).");
  process.exit(0);
}
try {
  const r = migrateSqlite();
  if (r.applied.length) console.log(`Migrated ${r.file}: applied ${r.applied.join(", ")}`);
  else console.log(`Database ${r.file} is up to date (${r.alreadyApplied.length} migrations).`);
} catch (e) {
  console.error((e as Error).message);
  process.exit(1);
}
