/**
 * Fills an empty database with the invented demo (seed/demo.ts). Fuels and prices go through
 * the same validation as the forms and the API; plants through the plant schema. Nothing is
 * written when the database already holds fuels, plants or studies.
 */
import { inExclusiveTransaction, LOCK_KEYS, type Db, type DbOrTx } from "../lib/db/client";
import { addPriceQuoteIn, createFuelIn } from "../lib/services/fuels";
import type { Result } from "../lib/services/result";
import { plantSchema } from "../lib/schemas/plant";
import { plantColumns } from "../lib/db/plant-rows";
import { effectiveDefinition } from "../lib/db/fuel-rows";
import { DEMO_FUELS, DEMO_PLANTS, DEMO_STUDIES, INVENTED_PRICE_NOTE } from "./demo";

export interface SeedOutcome {
  seeded: boolean;
  fuels: number;
  prices: number;
  plants: number;
  studies: number;
}

export async function isDatabaseEmpty(db: DbOrTx): Promise<boolean> {
  const [fuels, plants, studies] = await Promise.all([db.fuel.count(), db.plant.count(), db.study.count()]);
  return fuels + plants + studies === 0;
}

/** Seeds the demo when the database is empty. Throws when the demo data itself is invalid. */
export async function seedIfEmpty(db: Db): Promise<SeedOutcome> {
  const none: SeedOutcome = { seeded: false, fuels: 0, prices: 0, plants: 0, studies: 0 };
  if (!(await isDatabaseEmpty(db))) return none;
  // Several app instances starting together on one empty PostgreSQL: one seeds, the others find it done.
  const result = await inExclusiveTransaction(db, LOCK_KEYS.seed, async (tx): Promise<Result<SeedOutcome>> => {
    if (!(await isDatabaseEmpty(tx))) return { ok: true, value: none };
    const out: SeedOutcome = { seeded: true, fuels: 0, prices: 0, plants: 0, studies: 0 };
    const ids = new Map<string, number>();
    for (const f of DEMO_FUELS) {
      const input: Record<string, unknown> = { name: f.name, notes: f.notes, source: f.source ?? "", isDemo: true };
      if (f.blend) {
        input.blend = { basis: f.blend.basis, components: f.blend.components.map((c) => ({ fuelId: ids.get(c.fuel), share: c.share })) };
      } else {
        input.definition = f.definition;
        input.densityKgPerM3 = f.densityKgPerM3 ?? null;
        input.biogenicCarbonShare = f.biogenicCarbonShare ?? 0;
        input.upstreamCo2e_kg_per_GJ = f.upstreamCo2e_kg_per_GJ ?? null;
      }
      const created = await createFuelIn(tx, input);
      if (!created.ok) throw new Error(`demo fuel "${f.name}": ${JSON.stringify(created.fieldErrors)} ${created.message}`);
      ids.set(f.name, created.value.id);
      out.fuels++;
      for (const p of f.prices) {
        const q = await addPriceQuoteIn(tx, created.value.id, {
          ...p,
          energyBasis: p.energyBasis ?? null,
          meteringReference: p.meteringReference ?? null,
          sourceNote: p.sourceNote ?? INVENTED_PRICE_NOTE,
          isInvented: true,
        });
        if (!q.ok) throw new Error(`demo price of "${f.name}": ${JSON.stringify(q.fieldErrors)}`);
        out.prices++;
      }
    }
    const plantIds = new Map<string, number>();
    for (const p of DEMO_PLANTS) {
      // A liquid train's reference liquid is stored as the library has it (what the plant form stores too).
      const train = p.fields.liquidTrain as { referenceFuel: { name: string } } | undefined;
      const fields = train
        ? {
            ...p.fields,
            liquidTrain: {
              ...train,
              referenceFuel: effectiveDefinition(await tx.fuel.findUniqueOrThrow({ where: { name: train.referenceFuel.name } })),
            },
          }
        : p.fields;
      const parsed = plantSchema.parse({ name: p.name, ...fields });
      const plant = await tx.plant.create({
        data: {
          ...plantColumns(parsed),
          baselineFuelId: ids.get(p.baselineFuel)!,
          isDemo: true,
        },
      });
      plantIds.set(p.name, plant.id);
      out.plants++;
    }
    for (const s of DEMO_STUDIES) {
      const study = await tx.study.create({
        data: {
          plantId: plantIds.get(s.plant)!,
          name: s.name,
          ...(s.fields as { currency: string; discountRatePercent: number; horizonYears: number; rankingMetric: string }),
          hydrogenFuelId: s.hydrogenFuel ? ids.get(s.hydrogenFuel)! : null,
          isDemo: true,
        },
      });
      for (const [position, sc] of s.scenarios.entries()) {
        const fuelId = ids.get(sc.fuel)!;
        const quotes = await tx.priceQuote.findMany({ where: { fuelId }, orderBy: [{ validFrom: "desc" }, { id: "desc" }], take: 1 });
        await tx.scenario.create({
          data: {
            studyId: study.id,
            name: sc.name,
            fuelId,
            priceQuoteId: quotes[0]?.id ?? null,
            capex: sc.capex ?? 0,
            fixedOpexChange: sc.fixedOpexChange ?? 0,
            overrides: JSON.stringify(sc.overrides ?? {}),
            isBaseline: sc.isBaseline ?? false,
            position,
          },
        });
      }
      out.studies++;
    }
    return { ok: true, value: out };
  });
  if (!result.ok) throw new Error(result.message);
  return result.value;
}
