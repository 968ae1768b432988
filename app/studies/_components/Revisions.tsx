/**
 * The study's issued revisions and whether the live inputs still match the latest one (what differs,
 * field by field in words).
 */
import Link from "next/link";
import { db } from "@/lib/db/client";
import { listRevisions, revisionStatus } from "@/lib/services/revisions";
import { capitalised } from "@/lib/schemas/labels";
import { IssueRevisionButton } from "./IssueRevisionButton";
import { pageActions } from "@/app/_auth/page-user";

const shown = (v: unknown): string => {
  if (v === null || v === undefined) return "—";
  const s = typeof v === "string" ? v : JSON.stringify(v);
  return s.length > 60 ? `${s.slice(0, 60)}…` : s;
};

export async function Revisions({ id }: { id: number }) {
  const [list, status, can] = await Promise.all([listRevisions(db(), id), revisionStatus(db(), id), pageActions()]);
  const revisions = list.ok ? list.value : [];
  const latest = status.latest;
  return (
    <section className="revisions" aria-label="Revisions">
      <h2>Revisions</h2>
      {can.issueRevision && (
        <p>
          <IssueRevisionButton id={id} />
        </p>
      )}
      {latest && status.differences.length > 0 && (
        <div className="banner warn" role="status" data-testid="revision-differs">
          <b>
            Live inputs differ from revision {latest.number}
            {status.differences.length >= 40 ? " (first 40 differences)" : ""}:
          </b>
          <ul>
            {status.differences.map((d) => (
              <li key={d.path}>
                {capitalised(d.label)}: {shown(d.before)} → {shown(d.after)}
              </li>
            ))}
          </ul>
        </div>
      )}
      {latest && status.differences.length === 0 && !status.problem && (
        <p className="note">The live inputs match revision {latest.number}.</p>
      )}
      {status.problem && <p className="note">The live inputs cannot be compared with the revisions: {status.problem}</p>}
      {revisions.length === 0 ? (
        <p className="note">
          No revision issued yet. Issuing stores a numbered, unchangeable copy of the inputs (plant, fuels, the quotes used, settings) and
          results.
        </p>
      ) : (
        <table className="data">
          <thead>
            <tr>
              <th>Revision</th>
              <th>Issued (UTC)</th>
              <th>SHA-256 of the inputs</th>
              <th>Quotes used</th>
              <th />
            </tr>
          </thead>
          <tbody>
            {revisions.map((r) => (
              <tr key={r.number}>
                <td className="num">{r.number}</td>
                <td>{r.issuedAt.slice(0, 16).replace("T", " ")}</td>
                <td>
                  <code title={r.hash}>{r.hash.slice(0, 16)}…</code>
                </td>
                <td className="num">{r.quotesUsed}</td>
                <td>
                  <Link href={`/studies/${id}/report?revision=${r.number}`}>Report</Link> ·{" "}
                  <a href={`/api/studies/${id}/revisions/${r.number}`} download={`study-${id}-revision-${r.number}.json`}>
                    JSON
                  </a>{" "}
                  ·{" "}
                  <a
                    href={`/api/studies/${id}/revisions/${r.number}?part=inputs`}
                    download={`study-${id}-revision-${r.number}-inputs.json`}
                  >
                    Study file
                  </a>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </section>
  );
}
