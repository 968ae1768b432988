"use client";

/** One panel of the hydrogen-share sweep: a quantity against H2 vol %, the plant's limits and the first crossings. */
import { CartesianGrid, Line, LineChart, ReferenceArea, ReferenceDot, ReferenceLine, Tooltip, XAxis, YAxis } from "recharts";
import { AXIS_TICK_MARGIN, CHART_COLOURS, axisTick, useChartAnimation } from "./animation";
import { niceAxisFor } from "./ticks";

export interface SweepMarker {
  x: number;
  y: number | null;
  kind: "warn" | "fail";
  label: string;
}

export interface SweepChartProps {
  title: string;
  yUnit: string;
  data: { x: number; y: number | null }[];
  /** Horizontal limit lines (fan capacity, supply capacity, maximum flame temperature …). */
  /** Horizontal limit lines; a label sits at the lower right unless `labelAt` puts it at the upper left (two close lines). */
  limits?: { y: number; label: string; labelAt?: "insideTopLeft" }[];
  /** A band the value must stay inside (Wobbe tolerance). */
  band?: { min: number; max: number; label: string };
  /** First shares at which a limit warns / fails. */
  markers?: SweepMarker[];
  /** Vertical lines (the burner maker's H2 limit). */
  vLines?: { x: number; label: string }[];
  decimals?: number;
  isStatic?: boolean;
}

export function SweepChart({ title, yUnit, data, limits = [], band, markers = [], vLines = [], decimals = 1, isStatic }: SweepChartProps) {
  const animate = useChartAnimation(isStatic);
  const fmt = (v: unknown) => (typeof v === "number" ? v.toFixed(decimals) : String(v ?? ""));
  const yAxis = niceAxisFor(
    data.map((d) => d.y),
    [...limits.map((l) => l.y), ...(band ? [band.min, band.max] : [])],
  );
  const shownMarkers = markers.filter((m) => m.y !== null);
  return (
    <figure className="chart sweep-chart" aria-label={`${title} against hydrogen share`}>
      <figcaption className="chart-title">
        {title} <span className="unit">({yUnit})</span>
      </figcaption>
      <LineChart data={data} responsive style={{ width: "100%", height: 250 }} margin={{ top: 22, right: 16, bottom: 26, left: 4 }}>
        <CartesianGrid stroke={CHART_COLOURS.grid} />
        <XAxis
          tickMargin={AXIS_TICK_MARGIN}
          type="number"
          dataKey="x"
          domain={[0, 100]}
          ticks={[0, 20, 40, 60, 80, 100]}
          tick={axisTick}
          label={{ value: "H2 vol %", position: "insideBottom", offset: -16, fontSize: 12 }}
        />
        <YAxis
          type="number"
          domain={yAxis.domain}
          ticks={yAxis.ticks}
          tick={axisTick}
          tickFormatter={yAxis.format}
          width={58}
          allowDataOverflow={false}
        />
        {band && (
          <ReferenceArea
            y1={band.min}
            y2={band.max}
            ifOverflow="extendDomain"
            fill={CHART_COLOURS.pass}
            fillOpacity={0.08}
            stroke="none"
            label={{ value: band.label, position: "insideTopRight", fontSize: 11, fill: CHART_COLOURS.pass }}
          />
        )}
        {band && <ReferenceLine y={band.min} ifOverflow="extendDomain" stroke={CHART_COLOURS.limit} strokeDasharray="6 3" />}
        {band && <ReferenceLine y={band.max} ifOverflow="extendDomain" stroke={CHART_COLOURS.limit} strokeDasharray="6 3" />}
        {limits.map((l) => (
          <ReferenceLine
            key={l.label}
            y={l.y}
            ifOverflow="extendDomain"
            stroke={CHART_COLOURS.limit}
            strokeDasharray="6 3"
            label={{ value: l.label, position: l.labelAt ?? "insideBottomRight", fontSize: 11, fill: CHART_COLOURS.limit }}
          />
        ))}
        {vLines.map((v) => (
          <ReferenceLine
            key={v.label}
            x={v.x}
            stroke="#1f2428"
            strokeDasharray="2 3"
            className="sweep-burner-limit"
            label={{ value: v.label, position: "top", fontSize: 11, fill: "#1f2428" }}
          />
        ))}
        <Tooltip formatter={fmt} labelFormatter={(x) => `${x} vol % H2`} isAnimationActive={false} />
        <Line
          type="monotone"
          dataKey="y"
          name={title}
          stroke={CHART_COLOURS.line}
          strokeWidth={2}
          dot={false}
          isAnimationActive={animate}
          connectNulls={false}
        />
        {shownMarkers.map((m) => (
          <ReferenceDot
            key={`${m.kind}-${m.x}-${m.label}`}
            x={m.x}
            y={m.y as number}
            r={5.5}
            fill={m.kind === "fail" ? CHART_COLOURS.fail : CHART_COLOURS.warn}
            stroke="#fff"
            className={`sweep-marker sweep-marker-${m.kind}`}
          />
        ))}
      </LineChart>
      {shownMarkers.length > 0 && (
        <ul className="sweep-marker-list">
          {shownMarkers.map((m) => (
            <li key={`${m.kind}-${m.x}-${m.label}`} className={`sweep-marker-note-${m.kind}`}>
              <span
                className="dot"
                aria-hidden="true"
                style={{ background: m.kind === "fail" ? CHART_COLOURS.fail : CHART_COLOURS.warn }}
              />
              {m.label} {m.kind === "fail" ? "fails" : "warns"} from {m.x} vol % H2
            </li>
          ))}
        </ul>
      )}
    </figure>
  );
}
