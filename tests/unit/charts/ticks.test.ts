import { describe, expect, it } from "vitest";
import { axisTitle, niceAxis, niceNumber } from "../../../app/_charts/ticks";

describe("nice-number axis ticks", () => {
  // Heckbert, "Nice numbers for graph labels", Graphics Gems (1990): nice numbers are 1, 2, 5 × 10^k.
  it("rounds to 1, 2, 5 × 10^k", () => {
    expect(niceNumber(0.13, true)).toBeCloseTo(0.1, 12);
    expect(niceNumber(2.4, true)).toBe(2);
    expect(niceNumber(4.1, true)).toBe(5);
    expect(niceNumber(8200, true)).toBe(10000);
    expect(niceNumber(2.4, false)).toBe(5);
  });

  it("gives distinct, evenly spaced ticks that cover the data", () => {
    const a = niceAxis(8100, 17300);
    expect(new Set(a.ticks).size).toBe(a.ticks.length);
    expect(a.domain[0]).toBeLessThanOrEqual(8100);
    expect(a.domain[1]).toBeGreaterThanOrEqual(17300);
    const steps = a.ticks.slice(1).map((t, i) => t - a.ticks[i]);
    for (const s of steps) expect(s).toBeCloseTo(steps[0], 9);
  });

  it("formats every tick of an axis the same way (one scale, one number of decimals)", () => {
    const a = niceAxis(8100, 17300);
    const labels = a.ticks.map(a.format);
    expect(new Set(labels).size).toBe(labels.length);
    expect(labels.every((l) => l.endsWith("k"))).toBe(true);
    const b = niceAxis(0.52, 0.61);
    const decimals = b.ticks.map(b.format).map((l) => l.split(".")[1]?.length ?? 0);
    expect(new Set(decimals).size).toBe(1);
  });

  it("widens a flat series and survives empty input", () => {
    const a = niceAxis(50, 50);
    expect(a.domain[0]).toBeLessThan(50);
    expect(a.domain[1]).toBeGreaterThan(50);
    expect(niceAxis(Number.NaN, 3).ticks.length).toBeGreaterThan(1);
  });

  it("titles an axis with its unit and, when the labels are in thousands or millions, that scale", () => {
    expect(axisTitle("EUR", niceAxis(0, 80))).toBe("EUR");
    expect(axisTitle("EUR", niceAxis(0, 80_000))).toBe("EUR (k)");
    expect(axisTitle("EUR", niceAxis(0, 8_000_000))).toBe("EUR (M)");
  });
});
