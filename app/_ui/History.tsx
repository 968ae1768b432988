/**
 * The "History" section of a fuel, plant, study or account page: the newest changes from the change
 * log — when, who, what — each with the fields that changed (before → after), or the whole record
 * for a creation or a deletion.
 */
import { db } from "@/lib/db/client";
import { historyOf, historyOfType, type History as HistoryData, type HistoryEntry, type SubjectType } from "@/lib/services/change-log";

const ACTION_WORDS: Record<string, string> = {
  create: "created",
  update: "changed",
  trash: "moved to the trash",
  restore: "restored from the trash",
  purge: "deleted for good",
  delete: "deleted",
  withdraw: "withdrawn",
  correct: "corrected",
  duplicate: "created as a copy",
  issue: "issued",
};

const show = (v: unknown): string => {
  if (v === null || v === undefined) return "—";
  const s = typeof v === "string" ? v : JSON.stringify(v);
  return s.length > 120 ? `${s.slice(0, 120)}…` : s;
};

function What({ e }: { e: HistoryEntry }) {
  const thing =
    e.entity === "quote"
      ? `price quote #${e.entityId}`
      : e.entity === "token"
        ? "API token"
        : e.entity === "account"
          ? `account ${((e.after ?? e.before) as { email?: string } | null)?.email ?? `#${e.entityId}`}`
          : e.entity;
  return (
    <>
      {thing} {ACTION_WORDS[e.action] ?? e.action}
      {e.summary && <span className="muted"> — {e.summary}</span>}
    </>
  );
}

function Details({ e }: { e: HistoryEntry }) {
  if (e.differences.length) {
    return (
      <ul className="history-diff">
        {e.differences.map((d) => (
          <li key={d.path}>
            <code>{d.path || "(value)"}</code>: <del>{show(d.before)}</del> → <ins>{show(d.after)}</ins>
          </li>
        ))}
      </ul>
    );
  }
  const record = e.after ?? e.before;
  if (record === null || typeof record !== "object") return null;
  return (
    <details>
      <summary className="muted">{e.after ? "as created" : "as it was"}</summary>
      <ul className="history-diff">
        {Object.entries(record as Record<string, unknown>).map(([k, v]) => (
          <li key={k}>
            <code>{k}</code>: {show(v)}
          </li>
        ))}
      </ul>
    </details>
  );
}

/** The history of one object (`id`), or of every object of the kind (`id` left out: the accounts page). */
export async function History({
  type,
  id,
  limit = 20,
  title = "History",
}: {
  type: SubjectType;
  id?: number;
  limit?: number;
  title?: string;
}) {
  const h: HistoryData = id === undefined ? await historyOfType(db(), type, limit) : await historyOf(db(), type, id, limit);
  const all = id === undefined ? `GET /api/history/${type}/{id}` : `GET /api/history/${type}/${id}?limit=200`;
  return (
    <section aria-labelledby="history" className="history">
      <h2 id="history">{title}</h2>
      {h.entries.length === 0 ? (
        <p className="muted">
          No recorded changes (changes are recorded from the first one made after this version of Stoke was installed).
        </p>
      ) : (
        <div className="table-wrap">
          <table>
            <thead>
              <tr>
                <th scope="col">When (UTC)</th>
                <th scope="col">Who</th>
                <th scope="col">What</th>
                <th scope="col">Before → after</th>
              </tr>
            </thead>
            <tbody>
              {h.entries.map((e) => (
                <tr key={e.id}>
                  <td style={{ whiteSpace: "nowrap" }}>{e.at.slice(0, 16).replace("T", " ")}</td>
                  <td>{e.actor}</td>
                  <td>
                    <What e={e} />
                  </td>
                  <td>
                    <Details e={e} />
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      {h.total > h.entries.length && (
        <p className="muted">
          The newest {h.entries.length} of {h.total} changes; all of them: <code>{all}</code>.
        </p>
      )}
    </section>
  );
}
