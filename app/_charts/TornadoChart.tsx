"use client";

/** Tornado chart: how far the ranking metric moves when one input goes to its low and high value. */
import { Bar, BarChart, CartesianGrid, Cell, ReferenceLine, Tooltip, XAxis, YAxis } from "recharts";
import { AXIS_TICK_MARGIN, CHART_COLOURS, axisTick, shortNumber, useChartAnimation } from "./animation";
import { niceAxisFor } from "./ticks";

export interface TornadoBar {
  label: string;
  /** Metric at the input's low and high value (display units), null where undefined. */
  atLow: number | null;
  atHigh: number | null;
}

const LOW = CHART_COLOURS.second;
const HIGH = CHART_COLOURS.fuel;

/**
 * Bars are offsets from the base value (base at the axis 0). Usually the low and high input move
 * the metric to opposite sides; when both move it the same way, the nearer one is drawn first and
 * the farther one continues it, so each colour still ends where its value lies.
 */
function segments(r: TornadoBar, base: number) {
  const a = r.atLow === null ? 0 : r.atLow - base;
  const b = r.atHigh === null ? 0 : r.atHigh - base;
  if (a * b <= 0) return { inner: a, outer: b, innerColour: LOW, outerColour: HIGH };
  const lowFirst = Math.abs(a) <= Math.abs(b);
  const near = lowFirst ? a : b;
  const far = lowFirst ? b : a;
  return { inner: near, outer: far - near, innerColour: lowFirst ? LOW : HIGH, outerColour: lowFirst ? HIGH : LOW };
}

export function TornadoChart({ rows, base, unit, isStatic }: { rows: TornadoBar[]; base: number; unit: string; isStatic?: boolean }) {
  const animate = useChartAnimation(isStatic);
  const data = rows.map((r) => ({ label: r.label, atLow: r.atLow, atHigh: r.atHigh, ...segments(r, base) }));
  // Ticks in metric values around the base; the bars are drawn as offsets from it.
  const valueAxis = niceAxisFor(
    rows.flatMap((r) => [r.atLow, r.atHigh]),
    [base],
  );
  const offsetTicks = valueAxis.ticks.map((t) => t - base);
  const tip = (_v: unknown, _n: unknown, item: { payload?: (typeof data)[number] }) => {
    const p = item?.payload;
    if (!p) return "";
    const f = (x: number | null) => (x === null ? "undefined" : `${shortNumber(x)} ${unit}`);
    return `low input → ${f(p.atLow)}; high input → ${f(p.atHigh)}`;
  };
  return (
    <figure className="chart" aria-label="Tornado chart">
      <BarChart
        layout="vertical"
        data={data}
        stackOffset="sign"
        responsive
        style={{ width: "100%", height: Math.max(180, 44 * data.length + 60) }}
        margin={{ top: 18, right: 30, bottom: 26, left: 8 }}
      >
        <CartesianGrid stroke={CHART_COLOURS.grid} horizontal={false} />
        <XAxis
          tickMargin={AXIS_TICK_MARGIN}
          type="number"
          domain={[offsetTicks[0], offsetTicks[offsetTicks.length - 1]]}
          ticks={offsetTicks}
          tick={axisTick}
          tickFormatter={(v: number) => valueAxis.format(v + base)}
          label={{ value: unit, position: "insideBottom", offset: -18, fontSize: 12 }}
        />
        <YAxis type="category" dataKey="label" width={190} tick={axisTick} interval={0} />
        <ReferenceLine x={0} stroke="#1f2428" label={{ value: `base ${shortNumber(base)}`, position: "top", fontSize: 11 }} />
        <Tooltip formatter={tip as never} isAnimationActive={false} />
        <Bar dataKey="inner" name="first" stackId="t" isAnimationActive={animate}>
          {data.map((d) => (
            <Cell key={d.label} fill={d.innerColour} />
          ))}
        </Bar>
        <Bar dataKey="outer" name="second" stackId="t" isAnimationActive={animate}>
          {data.map((d) => (
            <Cell key={d.label} fill={d.outerColour} />
          ))}
        </Bar>
      </BarChart>
      <figcaption className="legend-row">
        <span className="swatch" style={{ background: LOW }} /> input at its low value{" "}
        <span className="swatch" style={{ background: HIGH }} /> input at its high value
      </figcaption>
    </figure>
  );
}
