import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { db } from "@/lib/db/client";
import { studyFormOptions, studyRecord } from "@/lib/services/studies";
import { StudyForm } from "../../_components/StudyForm";
import { METRIC_OPTIONS } from "../../_components/form-options";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Edit study" };

export default async function EditStudyPage({ params }: { params: Promise<{ id: string }> }) {
  const id = Number((await params).id);
  const rec = Number.isInteger(id) && id > 0 ? await studyRecord(db(), id) : null;
  if (!rec) notFound();
  const options = await studyFormOptions(db());
  return (
    <>
      <h2 style={{ marginTop: 0 }}>Edit the study</h2>
      {Object.keys(rec.storedProblems).length > 0 && (
        <p className="note bad">
          Stored values that could not be read are shown with their defaults; check them and save:{" "}
          {Object.entries(rec.storedProblems)
            .map(([field, detail]) => `${field}: ${detail}`)
            .join("; ")}
          .
        </p>
      )}
      <StudyForm options={options} metrics={METRIC_OPTIONS} initial={rec} />
    </>
  );
}
