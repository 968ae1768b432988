/**
 * The precomputed flame solves of tests/fixtures/flames (how they were made is written there), as a
 * look-up for lib/ and as FlameSolve rows for a test database, so no test solves a flame it can read.
 */
import { readFileSync } from "node:fs";
import { join } from "node:path";
import type { Db } from "../../lib/db/client";
import type { FlameOutcome } from "../../lib/plant/burner-flame";
import { storeFlameOutcome } from "../../lib/services/flames";
import { projectRoot } from "./next-server";

export function exampleStudyFlames(): Map<string, FlameOutcome> {
  const doc = JSON.parse(readFileSync(join(projectRoot, "tests", "fixtures", "flames", "example-study.flames.json"), "utf8"));
  return new Map(Object.entries(doc.solves as Record<string, FlameOutcome>));
}

/** Writes the fixture's solves into a database (the demo study's flames are then all known). */
export async function seedFlameFixture(client: Db): Promise<number> {
  const flames = exampleStudyFlames();
  for (const [key, outcome] of flames) await storeFlameOutcome(client, key, outcome);
  return flames.size;
}
