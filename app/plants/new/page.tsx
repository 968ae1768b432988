import type { Metadata } from "next";
import Link from "next/link";
import { PlantForm } from "../_components/PlantForm";
import { plantFormOptions } from "../_components/options";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "New plant" };

export default async function NewPlantPage() {
  const options = await plantFormOptions();
  return (
    <>
      <div className="crumbs">
        <Link href="/plants">Plants</Link> / new
      </div>
      <h1>New plant</h1>
      <p className="lede">Figures in SI units. Everything can be changed later; studies re-evaluate with the new figures.</p>
      {options.fuels.length === 0 ? (
        <p className="note warn">
          The fuel library is empty. <Link href="/fuels/new">Add the fuel the plant burns today</Link> first.
        </p>
      ) : (
        <PlantForm options={options} />
      )}
    </>
  );
}
