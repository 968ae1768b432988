/** Fit checks as pass / warn / fail with the number and the limit (display units). */
import type { FitCheck } from "@/lib/plant/fit-checks";
import type { Display } from "./display";

export const STATUS_LABEL: Record<string, string> = {
  pass: "pass",
  warn: "warn",
  fail: "fail",
  "not-checked": "no limit",
  "not-applicable": "n/a",
  feasible: "feasible",
  "feasible-with-warnings": "warnings",
  infeasible: "infeasible",
};

export function Status({ status }: { status: string }) {
  return <span className={`st st-${status}`}>{STATUS_LABEL[status] ?? status}</span>;
}

/** One scenario's checks as a table. */
export function CheckTable({ checks, d }: { checks: FitCheck[]; d: Display }) {
  return (
    <div className="table-wrap">
      <table>
        <thead>
          <tr>
            <th>Check</th>
            <th>Result</th>
            <th className="num">Value</th>
            <th className="num">Limit</th>
            <th>What it means</th>
          </tr>
        </thead>
        <tbody>
          {checks.map((c) => {
            const v = d.check(c);
            return (
              <tr key={c.id}>
                <td>{c.label}</td>
                <td>
                  <Status status={c.status} />
                </td>
                <td className="num">
                  {v.value} <span className="unit">{v.unit}</span>
                </td>
                <td className="num">
                  {c.limit === null ? (
                    <span className="na">–</span>
                  ) : (
                    <>
                      {v.limit} <span className="unit">{v.unit}</span>
                    </>
                  )}
                </td>
                <td>
                  {c.message}
                  {c.basis && (
                    <div className="basis" style={{ margin: 0 }}>
                      {c.basis}
                    </div>
                  )}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
