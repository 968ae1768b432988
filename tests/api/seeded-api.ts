/**
 * The set-up the API tests share: a temp SQLite file migrated like production, seeded with the
 * invented demo, the app pointed at it; the demo's fuel ids by name and its gas-fired plant; and a
 * JSON request builder for the route handlers.
 */
import { tempDb, type TempDb } from "../db/temp-db";
import { seedIfEmpty } from "../../seed/index";

export interface SeededApi {
  t: TempDb;
  /** Demo fuel ids by name. */
  fuel: Record<string, number>;
  /** The demo's gas-fired plant ("Boiler 1 (gas)", seed/demo.ts). */
  plantId: number;
  /** The id of a demo study by its name. */
  studyId(name: string): Promise<number>;
}

export async function openSeededApi(): Promise<SeededApi> {
  const t = await tempDb();
  process.env.DATABASE_URL = t.url;
  await seedIfEmpty(t.client);
  const fuel: Record<string, number> = {};
  for (const f of await t.client.fuel.findMany()) fuel[f.name] = f.id;
  const plantId = (await t.client.plant.findFirstOrThrow({ where: { name: "Boiler 1 (gas)" } })).id;
  const studyId = async (name: string) => (await t.client.study.findFirstOrThrow({ where: { name } })).id;
  return { t, fuel, plantId, studyId };
}

export async function closeSeededApi(s: SeededApi | undefined): Promise<void> {
  const { db } = await import("../../lib/db/client");
  await db().$disconnect();
  await s?.t.cleanup();
}

/** A request to a route handler; a body that is not text is sent as JSON. */
export const jsonRequest = (url: string, method = "GET", body?: unknown, type = "application/json") =>
  new Request(`http://localhost${url}`, {
    method,
    body: body === undefined ? undefined : typeof body === "string" ? body : JSON.stringify(body),
    headers: { "content-type": type },
  });
