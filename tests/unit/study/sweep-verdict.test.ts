import { describe, expect, it } from "vitest";
import { sweepVerdict, type SweepCrossing, type SweepPoint } from "../../../lib/study/hydrogen-sweep";

// Only h2Percent matters to the verdict; the other fields are placeholders of the point shape.
const point = (h2Percent: number) => ({ h2Percent }) as SweepPoint;
const points = [0, 10, 20, 30, 40].map(point);
const crossing = (
  checkId: string,
  statusAtZero: SweepCrossing["statusAtZero"],
  firstWarnPercent: number | null,
  firstFailPercent: number | null,
) => ({ checkId, label: checkId, statusAtZero, firstWarnPercent, firstFailPercent }) as SweepCrossing;

describe("hydrogen-sweep verdict", () => {
  it("orders failures by the share at which they first fail and stops just below the first", () => {
    const v = sweepVerdict(points, [
      crossing("wobbe", "pass", 10, 30),
      crossing("burner", "pass", 20, 20),
      crossing("stack", "pass", null, null),
    ]);
    expect(v.firstFailures.map((c) => c.checkId)).toEqual(["burner", "wobbe"]);
    expect(v.largestPassingPoint?.h2Percent).toBe(10);
  });

  it("keeps checks already failing or warning at 0 % apart from the crossings", () => {
    const v = sweepVerdict(points, [crossing("fan", "fail", 0, 0), crossing("dew", "warn", 0, 40), crossing("wobbe", "pass", 30, null)]);
    expect(v.failingOrWarningAtZero.map((c) => c.checkId)).toEqual(["fan", "dew"]);
    expect(v.firstFailures.map((c) => c.checkId)).toEqual(["dew"]);
    expect(v.firstWarnings.map((c) => c.checkId)).toEqual(["wobbe"]);
    expect(v.largestPassingPoint?.h2Percent).toBe(30);
  });

  it("passes the whole range when nothing fails, and none when the first point already fails", () => {
    expect(sweepVerdict(points, [crossing("wobbe", "pass", 20, null)]).largestPassingPoint?.h2Percent).toBe(40);
    expect(sweepVerdict(points, [crossing("wobbe", "pass", 0, 0)]).largestPassingPoint).toBeNull();
  });
});
