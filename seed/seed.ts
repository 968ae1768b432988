/** `npm run db:seed`: fills an empty database with the invented demo. */
import { migrate } from "../lib/db/migrate";
import { db } from "../lib/db/client";
import { seedIfEmpty } from "./index";

try {
  await migrate();
  const r = await seedIfEmpty(db());
  console.log(
    r.seeded
      ? `Seeded the demo: ${r.fuels} fuels, ${r.prices} price quotes, ${r.plants} plants, ${r.studies} studies (all invented).`
      : "Database already holds data; demo not seeded.",
  );
  await db().$disconnect();
} catch (e) {
  console.error((e as Error).message);
  process.exit(1);
}
