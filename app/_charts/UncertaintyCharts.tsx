"use client";

/**
 * Charts of the uncertainty page: the chance of ranking first (bars; standard errors in the tooltip),
 * the P10–P90 interval of the metric per option, and the cumulative distribution of the metric
 * for the options most often first.
 */
import { Bar, BarChart, CartesianGrid, Legend, Line, LineChart, Tooltip, XAxis, YAxis } from "recharts";
import { CHART_COLOURS, axisTick, shortNumber, useChartAnimation } from "./animation";
import { axisTitle, niceAxisFor } from "./ticks";

export interface FirstRow {
  label: string;
  /** Chance of ranking first, %, and its standard error, %. */
  pFirst: number;
  se: number;
}

const height = (n: number) => Math.max(160, 34 * n + 70);

export function FirstChanceChart({ rows, isStatic }: { rows: FirstRow[]; isStatic?: boolean }) {
  const animate = useChartAnimation(isStatic);
  const data = rows;
  const axis = niceAxisFor(
    rows.map((r) => r.pFirst),
    [0],
  );
  return (
    <figure className="chart" aria-label="Chance of ranking first">
      <BarChart
        layout="vertical"
        data={data}
        responsive
        style={{ width: "100%", height: height(rows.length) }}
        margin={{ top: 10, right: 30, bottom: 22, left: 8 }}
      >
        <CartesianGrid stroke={CHART_COLOURS.grid} horizontal={false} />
        <XAxis
          type="number"
          domain={axis.domain}
          ticks={axis.ticks}
          tickFormatter={axis.format}
          tick={axisTick}
          label={{ value: "chance of ranking first, %", position: "insideBottom", offset: -14, fontSize: 12 }}
        />
        <YAxis type="category" dataKey="label" width={210} tick={axisTick} interval={0} />
        <Tooltip
          formatter={
            ((v: number, _n: unknown, item: { payload?: (typeof data)[number] }) =>
              item?.payload?.se === undefined
                ? `${shortNumber(v)} %`
                : `${shortNumber(v)} % ± ${shortNumber(item.payload.se)} % (1 SE)`) as never
          }
          isAnimationActive={false}
        />
        <Bar dataKey="pFirst" name="P(first)" fill={CHART_COLOURS.second} isAnimationActive={animate} />
      </BarChart>
      <figcaption className="legend-row">
        Bars: share of draws in which the option ranks first (the table gives each with its standard error).
      </figcaption>
    </figure>
  );
}

export interface IntervalRow {
  label: string;
  p10: number;
  p50: number;
  p90: number;
  deterministic: number | null;
}

export function IntervalChart({ rows, unit, isStatic }: { rows: IntervalRow[]; unit: string; isStatic?: boolean }) {
  const animate = useChartAnimation(isStatic);
  // A floating bar from P10 to P90: an invisible base of P10, then the width P90 − P10.
  const data = rows.map((r) => ({ ...r, base: r.p10, width: r.p90 - r.p10 }));
  const axis = niceAxisFor(rows.flatMap((r) => [r.p10, r.p90, r.deterministic]));
  return (
    <figure className="chart" aria-label="P10 to P90 intervals">
      <BarChart
        layout="vertical"
        data={data}
        responsive
        style={{ width: "100%", height: height(rows.length) }}
        margin={{ top: 10, right: 30, bottom: 22, left: 8 }}
      >
        <CartesianGrid stroke={CHART_COLOURS.grid} horizontal={false} />
        <XAxis
          type="number"
          domain={axis.domain}
          ticks={axis.ticks}
          tickFormatter={axis.format}
          tick={axisTick}
          allowDataOverflow
          label={{
            value: axisTitle(unit, axis),
            position: "insideBottom",
            offset: -14,
            fontSize: 12,
          }}
        />
        <YAxis type="category" dataKey="label" width={210} tick={axisTick} interval={0} />
        <Tooltip
          formatter={
            ((_v: number, _n: unknown, item: { payload?: (typeof data)[number] }) => {
              const p = item?.payload;
              return p ? `P10 ${shortNumber(p.p10)} · P50 ${shortNumber(p.p50)} · P90 ${shortNumber(p.p90)} ${unit}` : "";
            }) as never
          }
          isAnimationActive={false}
        />
        <Bar dataKey="base" stackId="i" fill="transparent" isAnimationActive={false} legendType="none" />
        <Bar dataKey="width" name="P10 – P90" stackId="i" fill={CHART_COLOURS.third} isAnimationActive={animate} />
      </BarChart>
      <figcaption className="legend-row">
        Bars run from P10 to P90 (eight draws in ten fall inside); the table gives P50 and the value at the stated inputs.
      </figcaption>
    </figure>
  );
}

export interface CdfSeries {
  label: string;
  /** Metric values at evenly spaced probabilities 0 … 1. */
  values: number[];
}

const SERIES_COLOURS = [CHART_COLOURS.second, CHART_COLOURS.fuel, CHART_COLOURS.biogenic, CHART_COLOURS.upstream, CHART_COLOURS.carbon];

export function CdfChart({ series, unit, isStatic }: { series: CdfSeries[]; unit: string; isStatic?: boolean }) {
  const animate = useChartAnimation(isStatic);
  const axis = niceAxisFor(series.flatMap((s) => s.values));
  const prob = niceAxisFor([0, 100]);
  return (
    <figure className="chart" aria-label="Cumulative distribution of the metric">
      <LineChart responsive style={{ width: "100%", height: 320 }} margin={{ top: 10, right: 30, bottom: 28, left: 8 }}>
        <CartesianGrid stroke={CHART_COLOURS.grid} />
        <XAxis
          type="number"
          dataKey="x"
          domain={axis.domain}
          ticks={axis.ticks}
          tickFormatter={axis.format}
          tick={axisTick}
          allowDataOverflow
          label={{
            value: axisTitle(unit, axis),
            position: "insideBottom",
            offset: -16,
            fontSize: 12,
          }}
        />
        <YAxis
          type="number"
          dataKey="p"
          domain={prob.domain}
          ticks={prob.ticks}
          tickFormatter={prob.format}
          tick={axisTick}
          label={{ value: "cumulative %", angle: -90, position: "insideLeft", fontSize: 12 }}
        />
        <Tooltip
          formatter={((v: number) => `${shortNumber(v)} %`) as never}
          labelFormatter={(x) => `${shortNumber(Number(x))} ${unit}`}
          isAnimationActive={false}
        />
        <Legend verticalAlign="top" />
        {series.map((s, k) => (
          <Line
            key={s.label}
            name={s.label}
            data={s.values.map((x, i) => ({ x, p: (100 * i) / (s.values.length - 1) }))}
            dataKey="p"
            type="stepAfter"
            dot={false}
            stroke={SERIES_COLOURS[k % SERIES_COLOURS.length]}
            strokeWidth={2}
            isAnimationActive={animate}
          />
        ))}
      </LineChart>
    </figure>
  );
}
