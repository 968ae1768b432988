import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { db } from "@/lib/db/client";
import { getPlant } from "@/lib/services/plants";
import { PlantForm } from "../../_components/PlantForm";
import { plantFormOptions } from "../../_components/options";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Edit plant" };

export default async function EditPlantPage({ params }: { params: Promise<{ id: string }> }) {
  const id = Number((await params).id);
  const p = Number.isInteger(id) && id > 0 ? await getPlant(db(), id) : null;
  if (!p) notFound();
  const options = await plantFormOptions();
  return (
    <>
      <div className="crumbs">
        <Link href="/plants">Plants</Link> / <Link href={`/plants/${p.id}`}>{p.plant.name}</Link> / edit
      </div>
      <h1>Edit {p.plant.name}</h1>
      {p.studies.length > 0 && (
        <p className="note">Studies of this plant ({p.studies.map((s) => s.name).join(", ")}) will show the new figures.</p>
      )}
      <PlantForm options={options} initial={{ ...p.plant, id: p.id, baselineFuelId: p.baselineFuelId }} />
    </>
  );
}
