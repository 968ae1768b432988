/** Where each plant limit is first crossed along the hydrogen sweep (sweep page and report). */
import type { SweepCrossing } from "@/lib/study/hydrogen-sweep";
import { fmt } from "../../_ui/format";
import { Status } from "./Checks";

/** A hydrogen share as text; null = the limit is not crossed within 0–100 %. */
export function shareText(v: number | null): string {
  return v === null ? "not within 0–100 %" : `${fmt(v, v % 1 ? 1 : 0)} vol %`;
}

/** Checks that pass at 0 % H2 but fail somewhere along the sweep, earliest failure first. */
export function CrossingTable({ crossings, testId }: { crossings: readonly SweepCrossing[]; testId?: string }) {
  return (
    <div className="table-wrap">
      <table data-testid={testId}>
        <thead>
          <tr>
            <th>Check</th>
            <th>At 0 % H2</th>
            <th className="num">First warning</th>
            <th className="num">First failure</th>
          </tr>
        </thead>
        <tbody>
          {/* Checks that do not apply to a hydrogen blend anywhere (the liquid train's) are left out. */}
          {crossings
            .filter((c) => !(c.statusAtZero === "not-applicable" && c.firstWarnPercent === null && c.firstFailPercent === null))
            .map((c) => (
              <tr key={c.checkId}>
                <td>
                  {c.label}
                  {c.interpolated && <div className="unit">interpolated between the flame solves</div>}
                </td>
                <td>
                  <Status status={c.statusAtZero} />
                </td>
                <td className="num">
                  {c.statusAtZero === "not-checked" ? (
                    <span className="na">
                      {c.checkId === "flashback" || c.checkId === "nox-permit" ? "not judged" : "no limit entered"}
                    </span>
                  ) : (
                    shareText(c.firstWarnPercent)
                  )}
                </td>
                <td className="num">{c.statusAtZero === "not-checked" ? <span className="na">–</span> : shareText(c.firstFailPercent)}</td>
              </tr>
            ))}
        </tbody>
      </table>
    </div>
  );
}
