import type { Metadata } from "next";
import Link from "next/link";
import { db } from "@/lib/db/client";
import { studyFormOptions } from "@/lib/services/studies";
import { StudyForm } from "../_components/StudyForm";
import { METRIC_OPTIONS } from "../_components/form-options";
import { intParam, type SearchParams } from "../_components/settings";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "New study" };

export default async function NewStudyPage({ searchParams }: { searchParams: Promise<SearchParams> }) {
  const plant = intParam(await searchParams, "plant");
  const options = await studyFormOptions(db());
  return (
    <>
      <div className="crumbs">
        <Link href="/studies">Studies</Link> / new
      </div>
      <h1>New study</h1>
      <p className="lede">
        Pick the plant, the fuel it burns today (the baseline) and the candidates to compare. Each candidate is a fuel or blend from the{" "}
        <Link href="/fuels">library</Link> at one of its price quotes. Stoke evaluates the study before saving it.
      </p>
      <StudyForm options={options} metrics={METRIC_OPTIONS} defaultPlantId={plant ?? undefined} />
    </>
  );
}
