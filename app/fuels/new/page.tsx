import type { Metadata } from "next";
import Link from "next/link";
import { db } from "@/lib/db/client";
import { FuelForm } from "../_components/FuelForm";
import { fuelFormOptions } from "../_components/options";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "New fuel" };

export default async function NewFuelPage() {
  const options = await fuelFormOptions(db());
  return (
    <>
      <div className="crumbs">
        <Link href="/fuels">Fuel library</Link> › New fuel
      </div>
      <h1>New fuel or blend</h1>
      <p className="lede">
        Describe a gas by its composition, a liquid as a pure compound or by ultimate analysis, a solid by ultimate analysis, or build a
        blend from fuels already in the library. Stoke computes the properties when you save; nothing is stored while a field is in error.
      </p>
      <FuelForm options={options} />
    </>
  );
}
