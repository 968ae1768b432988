"use client";

/** Charts of the comparison page: cost per useful energy (stacked), CO2 per useful MJ, cost against CO2. */
import {
  Bar,
  BarChart,
  CartesianGrid,
  Cell,
  Legend,
  ReferenceLine,
  Scatter,
  ScatterChart,
  Tooltip,
  XAxis,
  YAxis,
  ZAxis,
  LabelList,
  usePlotArea,
  useXAxisScale,
  useYAxisScale,
} from "recharts";
import { placeLabels } from "./label-placement";
import { AXIS_TICK_MARGIN, CHART_COLOURS, axisTick, shortNumber, useChartAnimation } from "./animation";
import { niceAxisFor } from "./ticks";

export type ScenarioStatus = "feasible" | "feasible-with-warnings" | "infeasible";

export interface CostRow {
  name: string;
  status: ScenarioStatus;
  isBaseline: boolean;
  fuel: number | null;
  carbon: number | null;
  upstream: number | null;
  total: number | null;
}

export interface Co2Row {
  name: string;
  status: ScenarioStatus;
  isBaseline: boolean;
  fossil: number;
  /** null where the fuel states no upstream factor (unknown). */
  upstream: number | null;
  biogenic: number;
}

const label = (r: { name: string; status: ScenarioStatus; isBaseline: boolean }) =>
  `${r.name}${r.isBaseline ? " (baseline)" : ""}${r.status === "infeasible" ? " ✕" : ""}`;

const height = (n: number) => Math.max(160, 46 * n + 70);

function tooltipNumber(v: unknown): string {
  return typeof v === "number" ? shortNumber(v) : String(v ?? "");
}

export function CostStackChart({
  rows,
  unit,
  includeUpstream,
  isStatic,
}: {
  rows: CostRow[];
  unit: string;
  includeUpstream: boolean;
  isStatic?: boolean;
}) {
  const animate = useChartAnimation(isStatic);
  const rowsWithCost = rows.filter((r) => r.total !== null);
  const maxTotal = Math.max(...rowsWithCost.map((r) => Math.abs(r.total as number)), 1);
  // A hair-thin end segment carries the total's label, whatever the last non-zero segment is.
  const data = rowsWithCost.map((r) => ({ ...r, label: label(r), end: maxTotal * 1e-3 }));
  if (!data.length) return <p className="muted">No scenario has a price: nothing to chart.</p>;
  const xAxis = niceAxisFor(
    rowsWithCost.map((r) => r.total),
    [0, maxTotal * 1.002],
  );
  return (
    <figure className="chart" aria-label={`Cost per useful energy, ${unit}`}>
      <BarChart
        layout="vertical"
        data={data}
        responsive
        style={{ width: "100%", height: height(data.length) }}
        margin={{ top: 4, right: 56, bottom: 22, left: 8 }}
      >
        <CartesianGrid stroke={CHART_COLOURS.grid} horizontal={false} />
        <XAxis
          tickMargin={AXIS_TICK_MARGIN}
          type="number"
          domain={xAxis.domain}
          ticks={xAxis.ticks}
          tick={axisTick}
          tickFormatter={xAxis.format}
          label={{ value: unit, position: "insideBottomRight", offset: -14, fontSize: 12 }}
        />
        <YAxis type="category" dataKey="label" width={170} tick={axisTick} interval={0} />
        <Tooltip formatter={tooltipNumber} isAnimationActive={false} />
        <Legend verticalAlign="top" height={26} wrapperStyle={{ fontSize: 12 }} itemSorter={null} />
        <Bar dataKey="fuel" name="fuel" stackId="c" fill={CHART_COLOURS.fuel} isAnimationActive={animate}>
          {data.map((r) => (
            <Cell key={r.name} fillOpacity={r.status === "infeasible" ? 0.4 : 1} />
          ))}
        </Bar>
        <Bar dataKey="carbon" name="carbon (fossil CO2)" stackId="c" fill={CHART_COLOURS.carbon} isAnimationActive={animate}>
          {data.map((r) => (
            <Cell key={r.name} fillOpacity={r.status === "infeasible" ? 0.4 : 1} />
          ))}
        </Bar>
        {includeUpstream && (
          <Bar dataKey="upstream" name="upstream CO2e" stackId="c" fill={CHART_COLOURS.upstream} isAnimationActive={animate} />
        )}
        <Bar dataKey="end" stackId="c" fill="transparent" legendType="none" isAnimationActive={false} tooltipType="none">
          <LabelList dataKey="total" position="right" formatter={tooltipNumber} style={{ fontSize: 11, fill: "#1f2428" }} />
        </Bar>
      </BarChart>
    </figure>
  );
}

export function Co2Chart({ rows, includeUpstream, isStatic }: { rows: Co2Row[]; includeUpstream: boolean; isStatic?: boolean }) {
  const animate = useChartAnimation(isStatic);
  // A scenario whose counted upstream CO2e is unknown has no ranked figure: it is left out of the chart (the table says "unknown").
  const known = includeUpstream ? rows.filter((r) => r.upstream !== null) : rows;
  const maxRanked = Math.max(...known.map((r) => r.fossil + (includeUpstream ? (r.upstream as number) : 0)), 1);
  const data = known.map((r) => ({
    ...r,
    label: label(r),
    ranked: r.fossil + (includeUpstream ? (r.upstream as number) : 0),
    end: maxRanked * 1e-3,
  }));
  const xAxis = niceAxisFor([...data.map((r) => r.ranked), ...known.map((r) => r.biogenic)], [0, maxRanked * 1.002]);
  return (
    <figure className="chart" aria-label="CO2 per useful MJ">
      <BarChart
        layout="vertical"
        data={data}
        responsive
        style={{ width: "100%", height: height(data.length) }}
        margin={{ top: 4, right: 56, bottom: 22, left: 8 }}
      >
        <CartesianGrid stroke={CHART_COLOURS.grid} horizontal={false} />
        <XAxis
          tickMargin={AXIS_TICK_MARGIN}
          type="number"
          domain={xAxis.domain}
          ticks={xAxis.ticks}
          tick={axisTick}
          tickFormatter={xAxis.format}
          label={{ value: "g CO2 per MJ useful", position: "insideBottomRight", offset: -14, fontSize: 12 }}
        />
        <YAxis type="category" dataKey="label" width={170} tick={axisTick} interval={0} />
        <Tooltip formatter={tooltipNumber} isAnimationActive={false} />
        <Legend verticalAlign="top" height={26} wrapperStyle={{ fontSize: 12 }} itemSorter={null} />
        <Bar dataKey="fossil" name="fossil CO2" stackId="f" fill={CHART_COLOURS.fossil} isAnimationActive={animate} />
        {includeUpstream && (
          <Bar dataKey="upstream" name="upstream CO2e" stackId="f" fill={CHART_COLOURS.upstream} isAnimationActive={animate} />
        )}
        <Bar dataKey="end" stackId="f" fill="transparent" legendType="none" isAnimationActive={false} tooltipType="none">
          <LabelList dataKey="ranked" position="right" formatter={tooltipNumber} style={{ fontSize: 11, fill: "#1f2428" }} />
        </Bar>
        <Bar
          dataKey="biogenic"
          name="biogenic CO2 (reported, not counted)"
          fill={CHART_COLOURS.biogenic}
          fillOpacity={0.55}
          isAnimationActive={animate}
        />
      </BarChart>
    </figure>
  );
}

export interface ScatterPoint {
  name: string;
  status: ScenarioStatus;
  isBaseline: boolean;
  cost: number;
  co2: number;
}

function Marker(props: { cx?: number; cy?: number; payload?: ScatterPoint }) {
  const { cx = 0, cy = 0, payload } = props;
  if (!payload) return null;
  const colour =
    payload.status === "infeasible"
      ? CHART_COLOURS.fail
      : payload.status === "feasible-with-warnings"
        ? CHART_COLOURS.warn
        : CHART_COLOURS.pass;
  return (
    <g>
      {payload.status === "infeasible" ? (
        <path d={`M${cx - 6},${cy - 6}L${cx + 6},${cy + 6}M${cx - 6},${cy + 6}L${cx + 6},${cy - 6}`} stroke={colour} strokeWidth={2.5} />
      ) : payload.isBaseline ? (
        <rect x={cx - 6} y={cy - 6} width={12} height={12} fill="#fff" stroke="#1f2428" strokeWidth={2} />
      ) : (
        <circle cx={cx} cy={cy} r={6.5} fill={colour} stroke="#fff" strokeWidth={1.5} />
      )}
    </g>
  );
}

/** Point names placed where they overlap no other name, no marker and no axis (see label-placement.ts). */
function ScatterLabels({ points }: { points: ScatterPoint[] }) {
  const xs = useXAxisScale();
  const ys = useYAxisScale();
  const area = usePlotArea();
  if (!xs || !ys || !area) return null;
  const located = points.map((p) => ({ x: Number(xs(p.co2)), y: Number(ys(p.cost)), text: p.name }));
  // The plot area, widened into the right margin kept for names (110 px less a gap).
  const placed = placeLabels(located, { x: area.x, y: area.y, width: area.width + 100, height: area.height });
  return (
    <g className="scatter-labels">
      {placed.map((l, i) =>
        l ? (
          <g key={points[i].name}>
            {l.leader && <line x1={located[i].x} y1={located[i].y} x2={l.anchor.x} y2={l.anchor.y} stroke="#8a8f94" strokeWidth={0.8} />}
            <text x={l.x} y={l.y} fontSize={11} fill="#1f2428">
              {l.text}
            </text>
          </g>
        ) : null,
      )}
    </g>
  );
}

export function CostCo2Scatter({ points, costUnit, isStatic }: { points: ScatterPoint[]; costUnit: string; isStatic?: boolean }) {
  const animate = useChartAnimation(isStatic);
  if (!points.length) return <p className="muted">No scenario has a price: nothing to chart.</p>;
  const base = points.find((p) => p.isBaseline);
  const xAxis = niceAxisFor(
    points.map((p) => p.co2),
    [0],
  );
  const yAxis = niceAxisFor(points.map((p) => p.cost));
  return (
    <figure className="chart" aria-label="Cost against CO2">
      <ScatterChart responsive style={{ width: "100%", height: 320 }} margin={{ top: 24, right: 110, bottom: 32, left: 18 }}>
        <CartesianGrid stroke={CHART_COLOURS.grid} />
        <XAxis
          tickMargin={AXIS_TICK_MARGIN}
          type="number"
          dataKey="co2"
          name="CO2"
          tick={axisTick}
          domain={xAxis.domain}
          ticks={xAxis.ticks}
          tickFormatter={xAxis.format}
          label={{ value: "g fossil CO2 per MJ useful", position: "insideBottom", offset: -20, fontSize: 12 }}
        />
        <YAxis
          type="number"
          dataKey="cost"
          name="cost"
          tick={axisTick}
          domain={yAxis.domain}
          ticks={yAxis.ticks}
          tickFormatter={yAxis.format}
          width={52}
          label={{ value: costUnit, angle: -90, position: "left", fontSize: 12, offset: 6, style: { textAnchor: "middle" } }}
        />
        <ZAxis range={[80, 80]} />
        {base && <ReferenceLine y={base.cost} stroke="#8a8f94" strokeDasharray="4 4" />}
        {base && <ReferenceLine x={base.co2} stroke="#8a8f94" strokeDasharray="4 4" />}
        <Tooltip formatter={tooltipNumber} isAnimationActive={false} cursor={{ strokeDasharray: "3 3" }} />
        <Scatter data={points} shape={<Marker />} isAnimationActive={animate} />
        <ScatterLabels points={points} />
      </ScatterChart>
      <figcaption className="basis">
        Lower left is better. Dashed lines: the baseline. ● feasible (green) or with warnings (amber), ✕ infeasible, □ baseline.
      </figcaption>
    </figure>
  );
}
