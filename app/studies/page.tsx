import type { Metadata } from "next";
import Link from "next/link";
import { db } from "@/lib/db/client";
import { countStudies, listStudies } from "@/lib/services/studies";
import { uiPage, UI_PAGE_SIZE } from "@/lib/services/paging";
import { Pager } from "../_ui/Pager";
import { pageActions } from "../_auth/page-user";
import { METRIC_SHORT } from "./_components/settings";
import type { RankingMetric } from "@/lib/economics/sensitivity";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Studies" };

export default async function StudiesPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const page = uiPage((await searchParams).page);
  const [studies, total, can] = await Promise.all([listStudies(db(), {}, page), countStudies(db()), pageActions()]);
  return (
    <>
      <div className="page-head">
        <div>
          <h1>Studies</h1>
          <p className="lede">
            A study compares candidate fuels and blends for one plant against what it burns today: cost per unit of useful heat, CO2,
            payback, and whether the burners, fans and fuel train can take each one.
          </p>
        </div>
        <div className="actions">
          {can.createStudy && (
            <Link className="button" href="/studies/new">
              New study
            </Link>
          )}
        </div>
      </div>
      {studies.length === 0 ? (
        <p className="note">
          No studies yet. {can.createStudy ? <Link href="/studies/new">Start one</Link> : "An editor can start one"} — it needs a{" "}
          <Link href="/plants">plant</Link> and the fuels in the <Link href="/fuels">library</Link>.
        </p>
      ) : (
        <div className="table-wrap">
          <table>
            <thead>
              <tr>
                <th>Study</th>
                <th>Plant</th>
                <th>Baseline</th>
                <th className="num">Candidates</th>
                <th>Ranked by</th>
                <th>Pages</th>
              </tr>
            </thead>
            <tbody>
              {studies.map((s) => (
                <tr key={s.id}>
                  <td>
                    <Link href={`/studies/${s.id}`}>{s.name}</Link> {s.isDemo && <span className="badge demo">demo</span>}
                  </td>
                  <td>
                    <Link href={`/plants/${s.plantId}`}>{s.plantName}</Link>
                  </td>
                  <td>{s.baselineName ?? <span className="na">none</span>}</td>
                  <td className="num">{s.scenarioCount}</td>
                  <td>{METRIC_SHORT[s.rankingMetric as RankingMetric] ?? s.rankingMetric}</td>
                  <td>
                    {s.baselineFuelKind === "gas" && (
                      <>
                        <Link href={`/studies/${s.id}/sweep`}>H2 sweep</Link> ·{" "}
                      </>
                    )}
                    <Link href={`/studies/${s.id}/report`}>report</Link>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      <Pager path="/studies" page={page.number} pageSize={UI_PAGE_SIZE} total={total} />
    </>
  );
}
