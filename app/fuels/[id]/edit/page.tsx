import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { db } from "@/lib/db/client";
import { fuelJson } from "@/lib/db/json";
import { FuelForm } from "../../_components/FuelForm";
import { fuelFormOptions } from "../../_components/options";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Edit fuel" };

export default async function EditFuelPage({ params }: { params: Promise<{ id: string }> }) {
  const id = Number((await params).id);
  if (!Number.isInteger(id) || id <= 0) notFound();
  const row = await db().fuel.findUnique({
    where: { id },
    include: { components: { orderBy: { position: "asc" }, include: { component: { select: { id: true, name: true } } } } },
  });
  if (!row) notFound();
  const { components, ...fuel } = row;
  const initial = fuelJson(fuel, components);
  const options = await fuelFormOptions(db());
  return (
    <>
      <div className="crumbs">
        <Link href="/fuels">Fuel library</Link> › <Link href={`/fuels/${id}`}>{fuel.name}</Link> › Edit
      </div>
      <h1>Edit {fuel.name}</h1>
      <p className="lede">Blends that use this fuel are re-derived when you save. Price quotes are kept.</p>
      <FuelForm options={options} initial={{ ...initial, definition: initial.definition as Record<string, unknown> }} />
    </>
  );
}
