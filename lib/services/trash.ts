/**
 * The trash: deleting a fuel, plant or study moves it here (lib/services/fuels.ts, plants.ts,
 * studies.ts); an editor restores it, an admin deletes it for good (purge). Nothing in the trash is
 * used by anything live — a fuel or plant in use cannot be trashed, those in the trash count as
 * users too — so a restore always finds what the item refers to, and names in the trash stay taken
 * so that a restore never clashes.
 */
import { inTransaction, type Db, type Tx } from "../db/client";
import { findTrashedFuel, setFuelTrashed, trashedFuels } from "../db/fuel-rows";
import { findTrashedPlant, setPlantTrashed, trashedPlants } from "../db/plant-rows";
import { findTrashedStudy, setStudyTrashed, trashedStudies } from "../db/study-rows";
import { recordChange } from "./change-log";
import { purgeFuelIn } from "./fuels";
import { purgePlantIn } from "./plants";
import { ok, problem, type Result } from "./result";
import { purgeStudyIn } from "./studies";

export const TRASH_KINDS = ["fuel", "plant", "study"] as const;
export type TrashKind = (typeof TRASH_KINDS)[number];

export function isTrashKind(s: string): s is TrashKind {
  return (TRASH_KINDS as readonly string[]).includes(s);
}

export interface TrashItem {
  kind: TrashKind;
  id: number;
  name: string;
  /** For a study: its plant. */
  detail: string;
  deletedAt: string;
  deletedBy: string;
}

/** Everything in the trash, latest first. */
export async function listTrash(db: Db): Promise<TrashItem[]> {
  const [fuels, plants, studies] = await Promise.all([trashedFuels(db), trashedPlants(db), trashedStudies(db)]);
  const when = (d: Date | null) => (d ?? new Date(0)).toISOString();
  const items: TrashItem[] = [
    ...fuels.map((f) => ({
      kind: "fuel" as const,
      id: f.id,
      name: f.name,
      detail: f.kind,
      deletedAt: when(f.deletedAt),
      deletedBy: f.deletedBy ?? "",
    })),
    ...plants.map((p) => ({
      kind: "plant" as const,
      id: p.id,
      name: p.name,
      detail: p.site,
      deletedAt: when(p.deletedAt),
      deletedBy: p.deletedBy ?? "",
    })),
    ...studies.map((s) => ({
      kind: "study" as const,
      id: s.id,
      name: s.name,
      detail: `plant ${s.plant.name}`,
      deletedAt: when(s.deletedAt),
      deletedBy: s.deletedBy ?? "",
    })),
  ];
  return items.sort((a, b) => b.deletedAt.localeCompare(a.deletedAt) || b.id - a.id);
}

const NAMES: Record<TrashKind, string> = { fuel: "fuel", plant: "plant", study: "study" };
const notInTrash = (kind: TrashKind, id: number) => problem("not-found", `No ${NAMES[kind]} with id ${id} in the trash.`);

/** Takes an item out of the trash (editor). */
export function restoreFromTrash(db: Db, kind: TrashKind, id: number): Promise<Result<{ kind: TrashKind; id: number; name: string }>> {
  return inTransaction(db, async (tx: Tx) => {
    let name: string;
    if (kind === "fuel") {
      const f = await findTrashedFuel(tx, id);
      if (!f) return notInTrash(kind, id);
      name = (await setFuelTrashed(tx, id, null, null)).name;
    } else if (kind === "plant") {
      const p = await findTrashedPlant(tx, id);
      if (!p) return notInTrash(kind, id);
      name = (await setPlantTrashed(tx, id, null, null)).name;
    } else {
      const s = await findTrashedStudy(tx, id);
      if (!s) return notInTrash(kind, id);
      name = (await setStudyTrashed(tx, id, null, null)).name;
    }
    await recordChange(tx, {
      subject: { type: kind, id },
      entity: kind,
      entityId: id,
      action: "restore",
      summary: "restored from the trash",
    });
    return ok({ kind, id, name });
  });
}

/** Deletes an item in the trash for good (admin). */
export function purgeFromTrash(db: Db, kind: TrashKind, id: number): Promise<Result<{ kind: TrashKind; id: number; name: string }>> {
  return inTransaction(db, async (tx: Tx) => {
    if (kind === "fuel") {
      const f = await findTrashedFuel(tx, id);
      if (!f) return notInTrash(kind, id);
      const r = await purgeFuelIn(tx, f);
      return r.ok ? ok({ kind, id, name: f.name }) : r;
    }
    if (kind === "plant") {
      const r = await purgePlantIn(tx, id);
      return r.ok ? ok({ kind, id, name: r.value.name }) : r;
    }
    const s = await findTrashedStudy(tx, id);
    if (!s) return notInTrash(kind, id);
    const r = await purgeStudyIn(tx, s);
    return r.ok ? ok({ kind, id, name: s.name }) : r;
  });
}
