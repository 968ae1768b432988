/**
 * One of the two app processes of tests/db/two-processes.test.ts: through the services, on the
 * database DATABASE_URL names, adds COUNT gases named "<TAG> gas <i>", a quote to each, and a
 * quote to the shared fuel SHARED_FUEL_ID per gas; prints the ids it stored as JSON.
 * Usage: tsx tests/support/concurrent-writer.ts TAG COUNT SHARED_FUEL_ID
 */
import { db } from "../../lib/db/client";
import { addPriceQuote, createFuel } from "../../lib/services/fuels";

const [tag, countText, sharedText] = process.argv.slice(2);
const count = Number(countText);
const shared = Number(sharedText);
const quote = (amount: number) => ({ amount, currency: "EUR", unit: "MWh", energyBasis: "gross", validFrom: "2026-01-01", supplier: tag });

const fuelIds: number[] = [];
const quoteIds: number[] = [];
for (let i = 0; i < count; i++) {
  const f = await createFuel(db(), { name: `${tag} gas ${i}`, definition: { composition: { CH4: 0.9, C2H6: 0.1 } } });
  if (!f.ok) throw new Error(`${tag} gas ${i}: ${f.message} ${JSON.stringify(f.fieldErrors)}`);
  fuelIds.push(f.value.id);
  const q = await addPriceQuote(db(), f.value.id, quote(30 + i));
  if (!q.ok) throw new Error(`${tag} quote ${i}: ${q.message}`);
  quoteIds.push(q.value.id);
  const s = await addPriceQuote(db(), shared, quote(40 + i));
  if (!s.ok) throw new Error(`${tag} shared quote ${i}: ${s.message}`);
  quoteIds.push(s.value.id);
}
await db().$disconnect();
console.log(JSON.stringify({ fuelIds, quoteIds }));
