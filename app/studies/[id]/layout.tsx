import { trashEnabled } from "@/lib/services/mode";
import Link from "next/link";
import { notFound } from "next/navigation";
import { db } from "@/lib/db/client";
import { studyHeader } from "@/lib/services/lookups";
import { StudyTabs } from "../_components/StudyTabs";
import { DuplicateButton } from "../_components/DuplicateButton";
import { DeleteButton } from "@/app/_ui/DeleteButton";
import { pageActions } from "@/app/_auth/page-user";

export const dynamic = "force-dynamic";

export default async function StudyLayout({ children, params }: { children: React.ReactNode; params: Promise<{ id: string }> }) {
  const id = Number((await params).id);
  const [study, can] = await Promise.all([Number.isInteger(id) && id > 0 ? studyHeader(db(), id) : null, pageActions()]);
  if (!study) notFound();
  return (
    <>
      <div className="crumbs no-print">
        <Link href="/studies">Studies</Link> / <Link href={`/plants/${study.plant.id}`}>{study.plant.name}</Link> / {study.name}
      </div>
      <div className="page-head no-print">
        <div>
          <h1>
            {study.name} {study.isDemo && <span className="badge demo">demo</span>}
          </h1>
          <p className="lede" style={{ margin: 0 }}>
            Plant <Link href={`/plants/${study.plant.id}`}>{study.plant.name}</Link> · baseline and{" "}
            {Math.max(0, study._count.scenarios - 1)} candidate
            {study._count.scenarios - 1 === 1 ? "" : "s"} · prices in {study.currency}
          </p>
        </div>
        <div className="actions">
          <a className="button secondary" href={`/api/studies/${study.id}/export?format=csv`} download>
            CSV
          </a>
          <a className="button secondary" href={`/api/studies/${study.id}/export?format=json`} download>
            JSON
          </a>
          {can.duplicateStudy && <DuplicateButton id={study.id} />}
          {can.deleteStudy && (
            <DeleteButton
              url={`/api/studies/${study.id}`}
              after="/studies"
              label="Delete"
              confirmText={
                trashEnabled()
                  ? `Move the study “${study.name}” to the trash?`
                  : `Delete the study “${study.name}” and its scenarios? This cannot be undone.`
              }
            />
          )}
        </div>
      </div>
      <StudyTabs id={study.id} canEdit={can.editStudy} />
      {children}
    </>
  );
}
