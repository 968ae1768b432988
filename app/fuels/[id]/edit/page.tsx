import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { db } from "@/lib/db/client";
import { fuelForEdit } from "@/lib/services/lookups";
import { FuelForm } from "../../_components/FuelForm";
import { fuelFormOptions } from "../../_components/options";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Edit fuel" };

export default async function EditFuelPage({ params }: { params: Promise<{ id: string }> }) {
  const id = Number((await params).id);
  if (!Number.isInteger(id) || id <= 0) notFound();
  const initial = await fuelForEdit(db(), id);
  if (!initial) notFound();
  const options = await fuelFormOptions(db());
  return (
    <>
      <div className="crumbs">
        <Link href="/fuels">Fuel library</Link> › <Link href={`/fuels/${id}`}>{initial.name}</Link> › Edit
      </div>
      <h1>Edit {initial.name}</h1>
      <p className="lede">Blends that use this fuel are re-derived when you save. Price quotes are kept.</p>
      <FuelForm options={options} initial={{ ...initial, definition: initial.definition as Record<string, unknown> }} />
    </>
  );
}
