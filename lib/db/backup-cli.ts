/**
 * `npm run -s db:backup -- FILE` — an online backup of the database DATABASE_URL names (SQLite:
 * SQLite's backup API while the server runs; PostgreSQL: pg_dump, custom format).
 * `npm run -s db:restore -- FILE` — replaces that database with the backup (stop the server first),
 * then applies newer migrations.
 */
import { backupDatabase, restoreDatabase } from "./backup";

const [command, file] = process.argv.slice(2);
if ((command !== "backup" && command !== "restore") || !file) {
  console.error("usage: npm run -s db:backup -- FILE | npm run -s db:restore -- FILE");
  process.exit(2);
}
try {
  if (command === "backup") {
    const r = await backupDatabase(file);
    console.log(`Backed up the ${r.provider === "sqlite" ? "SQLite" : "PostgreSQL"} database to ${r.file} (${r.bytes} bytes).`);
  } else {
    const r = await restoreDatabase(file);
    console.log(`Restored ${r.file} from ${file}${r.migrationsApplied.length ? `; then applied ${r.migrationsApplied.join(", ")}` : ""}.`);
  }
} catch (e) {
  console.error((e as Error).message);
  process.exit(1);
}
