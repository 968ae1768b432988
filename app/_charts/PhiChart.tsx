"use client";

/** Flame temperature against the equivalence ratio, equilibrium and complete combustion, with the peaks marked. */
import { CartesianGrid, Legend, Line, LineChart, ReferenceDot, ReferenceLine, Tooltip, XAxis, YAxis } from "recharts";
import { AXIS_TICK_MARGIN, CHART_COLOURS, axisTick, useChartAnimation } from "./animation";
import { niceAxisFor } from "./ticks";

export interface PhiChartProps {
  data: { phi: number; equilibrium: number | null; complete: number | null; meanCp: number | null }[];
  unit: string;
  peaks: { phi: number; value: number; label: string; which: "equilibrium" | "complete" }[];
  /** The plant's operating φ (from its flue O2), if known. */
  operatingPhi?: number | null;
  isStatic?: boolean;
}

export function PhiChart({ data, unit, peaks, operatingPhi, isStatic }: PhiChartProps) {
  const animate = useChartAnimation(isStatic);
  const fmt = (v: unknown) => (typeof v === "number" ? v.toFixed(0) : String(v ?? ""));
  const xAxis = niceAxisFor(
    data.map((d) => d.phi),
    [],
    10,
  );
  const yAxis = niceAxisFor(data.flatMap((d) => [d.equilibrium, d.complete, d.meanCp]));
  return (
    <figure className="chart" aria-label="Flame temperature against equivalence ratio">
      <LineChart data={data} responsive style={{ width: "100%", height: 380 }} margin={{ top: 24, right: 20, bottom: 30, left: 6 }}>
        <CartesianGrid stroke={CHART_COLOURS.grid} />
        <XAxis
          tickMargin={AXIS_TICK_MARGIN}
          type="number"
          dataKey="phi"
          domain={xAxis.domain}
          ticks={xAxis.ticks}
          tickFormatter={xAxis.format}
          tick={axisTick}
          label={{ value: "equivalence ratio φ (lean < 1 < rich)", position: "insideBottom", offset: -18, fontSize: 12 }}
        />
        <YAxis
          type="number"
          domain={yAxis.domain}
          ticks={yAxis.ticks}
          tickFormatter={yAxis.format}
          tick={axisTick}
          width={58}
          label={{ value: unit, angle: -90, position: "insideLeft", fontSize: 12 }}
        />
        <ReferenceLine
          x={1}
          stroke="#8a8f94"
          strokeDasharray="4 4"
          label={{ value: "φ = 1", position: "insideBottomRight", fontSize: 11 }}
        />
        {operatingPhi ? (
          <ReferenceLine
            x={operatingPhi}
            stroke={CHART_COLOURS.second}
            strokeDasharray="2 3"
            label={{ value: "plant's operating point", position: "insideBottomRight", fontSize: 11, fill: CHART_COLOURS.second }}
          />
        ) : null}
        <Tooltip formatter={fmt} labelFormatter={(x) => `φ = ${Number(x).toFixed(3)}`} isAnimationActive={false} />
        <Legend verticalAlign="top" height={26} wrapperStyle={{ fontSize: 12 }} itemSorter={null} />
        <Line
          type="monotone"
          dataKey="equilibrium"
          name="chemical equilibrium"
          stroke={CHART_COLOURS.line}
          strokeWidth={2.2}
          dot={false}
          isAnimationActive={animate}
        />
        <Line
          type="monotone"
          dataKey="complete"
          name="complete combustion"
          stroke={CHART_COLOURS.second}
          strokeWidth={1.8}
          dot={false}
          isAnimationActive={animate}
        />
        <Line
          type="monotone"
          dataKey="meanCp"
          name="mean-cp hand estimate"
          stroke={CHART_COLOURS.third}
          strokeWidth={1.2}
          strokeDasharray="5 4"
          dot={false}
          isAnimationActive={animate}
        />
        {peaks.map((p) => (
          <ReferenceDot
            key={p.which}
            x={p.phi}
            y={p.value}
            r={5}
            fill={p.which === "equilibrium" ? CHART_COLOURS.line : CHART_COLOURS.second}
            stroke="#fff"
            className={`phi-peak phi-peak-${p.which}`}
            label={{ value: p.label, position: p.which === "equilibrium" ? "bottom" : "right", fontSize: 11 }}
          />
        ))}
      </LineChart>
    </figure>
  );
}
