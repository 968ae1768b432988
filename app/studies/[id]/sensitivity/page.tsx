import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { db } from "@/lib/db/client";
import { evaluateStoredStudy } from "@/lib/services/studies";
import type { TornadoRow } from "@/lib/economics/sensitivity";
import { fmt, money } from "../../../_ui/format";
import { TornadoChart } from "../../../_charts/TornadoChart";
import { displayUnits } from "../../_components/units-server";
import { makeDisplay, signed, type Display } from "../../_components/display";
import { UnitSwitch } from "../../_components/UnitSwitch";
import { Status } from "../../_components/Checks";
import { EvaluationProblem } from "../../_components/EvaluationProblem";
import { pageActions } from "@/app/_auth/page-user";
import { metricText } from "../../_components/results";
import { intParam, METRIC_SHORT, numParam, RANKING_METRICS, viewChoice, viewQuery, type SearchParams } from "../../_components/settings";
import type { RankingMetric } from "@/lib/economics/sensitivity";
import { SENSITIVITY_DEFAULTS } from "@/lib/schemas/study";
import { capitalised, fieldLabel } from "@/lib/schemas/labels";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Sensitivity and break-even" };

type Props = { params: Promise<{ id: string }>; searchParams: Promise<SearchParams> };

const RANGE_KEYS = [
  { q: "fp", key: "fuelPricePercent" as const, label: capitalised(fieldLabel("fuelPricePercent")) },
  { q: "cp", key: "carbonPricePercent" as const, label: capitalised(fieldLabel("carbonPricePercent")) },
  { q: "ep", key: "efficiencyPoints" as const, label: capitalised(fieldLabel("efficiencyPoints")) },
  { q: "xp", key: "capexPercent" as const, label: capitalised(fieldLabel("capexPercent")) },
] as const;

/** A metric value in display units (cost per energy follows the energy switch). */
function metricValue(metric: RankingMetric, v: number, d: Display): number {
  return metric === "cost-per-useful-MWh" ? d.costPerEnergyValue(v) : v;
}
function metricUnit(metric: RankingMetric, d: Display): string {
  switch (metric) {
    case "cost-per-useful-MWh":
      return `${d.costPerEnergyUnit} useful`;
    case "co2-per-useful-MJ":
      return "g CO2/MJ useful";
    case "abatement-cost":
      return `${d.currency}/t CO2`;
    case "npv":
      return d.currency;
  }
}

function inputText(row: TornadoRow, v: number, d: Display): string {
  if (row.unit.startsWith("currency/MWh")) return `${d.costPerEnergy(v)} ${d.costPerEnergyUnit} (net)`;
  if (row.unit === "fraction") return `${fmt(v * 100, 1)} %`;
  if (row.unit === "currency/t CO2") return `${money(v, d.currency, 0)}/t`;
  if (row.unit === "currency") return money(v, d.currency, 0);
  return `${fmt(v, 2)} ${row.unit}`;
}

export default async function SensitivityPage({ params, searchParams }: Props) {
  const id = Number((await params).id);
  if (!Number.isInteger(id) || id <= 0) notFound();
  const sp = await searchParams;
  const view = viewChoice(sp);
  const ranges: Record<string, number> = {};
  for (const r of RANGE_KEYS) {
    const v = numParam(sp, r.q);
    if (v !== undefined) ranges[r.key] = v;
  }
  const badRange = RANGE_KEYS.filter(
    (r) => ranges[r.key] !== undefined && !(ranges[r.key] >= 0 && ranges[r.key] <= (r.key === "efficiencyPoints" ? 20 : 200)),
  );
  for (const r of badRange) delete ranges[r.key];
  const [ev, units] = await Promise.all([
    evaluateStoredStudy(db(), id, { metric: view.metric, includeUpstream: view.includeUpstream, sensitivity: ranges }),
    displayUnits(),
  ]);
  if (!ev.ok) {
    if (ev.kind === "not-found") notFound();
    return <EvaluationProblem id={id} message={ev.message} fieldErrors={ev.fieldErrors} />;
  }
  const { result } = ev;
  const d = makeDisplay(units, result.study.currency);
  const metric = result.ranking.metric;
  const cands = result.scenarios;
  if (!cands.length) {
    return (
      <p className="note">
        Sensitivity compares a candidate with the baseline:{" "}
        {(await pageActions()).editStudy ? <Link href={`/studies/${id}/edit`}>add a candidate</Link> : "an editor can add a candidate"}{" "}
        first.
      </p>
    );
  }
  const bestIdx = result.ranking.entries.find((e) => !e.isBaseline && e.status !== "infeasible")?.index ?? 0;
  const chosen = intParam(sp, "scenario");
  const idx = chosen !== null && chosen >= 0 && chosen < cands.length ? chosen : bestIdx;
  const sc = cands[idx];
  const tor = sc.tornado;
  const k = sc.comparison;
  const extra = (o: Record<string, number | undefined>) => {
    const q: Record<string, number | undefined> = {};
    for (const r of RANGE_KEYS) q[r.q] = ranges[r.key];
    return viewQuery(view, { ...q, ...o });
  };

  return (
    <>
      <h2 style={{ marginTop: 0, border: 0 }}>How robust is the answer?</h2>
      <p className="lede">
        One input at a time moves to its low and high value while everything else stays; the bars show where the ranking metric lands.
        Break-even prices say how far a price must move before the candidate costs the same as the baseline.
      </p>
      <div className="choice-bar">
        <span>
          <span className="choice-label">Candidate</span>
          <span className="segmented" role="group" aria-label="Candidate">
            {cands.map((c, i) => (
              <Link
                key={c.name}
                href={`/studies/${id}/sensitivity${extra({ scenario: i })}`}
                aria-current={i === idx ? "true" : undefined}
                scroll={false}
              >
                {c.name}
              </Link>
            ))}
          </span>
        </span>
        <span>
          <span className="choice-label">Metric</span>
          <span className="segmented" role="group" aria-label="Metric">
            {RANKING_METRICS.map((m) => (
              <Link
                key={m}
                href={`/studies/${id}/sensitivity${viewQuery({ ...view, metric: m }, { scenario: idx, ...Object.fromEntries(RANGE_KEYS.map((r) => [r.q, ranges[r.key]])) })}`}
                aria-current={m === metric ? "true" : undefined}
                scroll={false}
              >
                {METRIC_SHORT[m]}
              </Link>
            ))}
          </span>
        </span>
        <UnitSwitch units={units} groups={["energy"]} />
      </div>
      <form
        method="get"
        className="row no-print"
        style={{ alignItems: "flex-end", marginBottom: "0.75rem" }}
        aria-label="Sensitivity ranges"
      >
        {view.metric && <input type="hidden" name="metric" value={view.metric} />}
        {view.includeUpstream !== undefined && <input type="hidden" name="upstream" value={view.includeUpstream ? "1" : "0"} />}
        <input type="hidden" name="scenario" value={idx} />
        {RANGE_KEYS.map((r) => (
          <div className="field" key={r.q} style={{ flex: "0 1 150px" }}>
            <label htmlFor={`r-${r.q}`}>{r.label}</label>
            <input
              id={`r-${r.q}`}
              name={r.q}
              className="num"
              inputMode="decimal"
              defaultValue={String(ranges[r.key] ?? result.study.sensitivity[r.key] ?? SENSITIVITY_DEFAULTS[r.key])}
            />
          </div>
        ))}
        <button type="submit" className="secondary">
          Apply ranges
        </button>
      </form>
      {badRange.length > 0 && (
        <p className="note warn">Out of range and ignored: {badRange.map((r) => r.label).join(", ")} (0–200 %, efficiency 0–20 points).</p>
      )}

      <p>
        <b>{sc.name}</b> <Status status={sc.status} /> — {metricText(metric, sc.metricValue, d)} ({result.ranking.label}).
      </p>
      {!tor || tor.baseValue === null ? (
        <p className="note">
          {sc.price
            ? `The ${METRIC_SHORT[metric].toLowerCase()} is not defined for this candidate (e.g. it avoids no CO2).`
            : "This candidate has no price: no sensitivity of cost figures."}
        </p>
      ) : (
        <div className="grid2">
          <section className="panel">
            <h3 className="chart-title">
              Tornado: {METRIC_SHORT[metric]} <span className="unit">({metricUnit(metric, d)})</span>
            </h3>
            <TornadoChart
              base={metricValue(metric, tor.baseValue, d)}
              unit={metricUnit(metric, d)}
              rows={tor.rows.map((r) => ({
                label: r.label,
                atLow: r.metricAtLow === null ? null : metricValue(metric, r.metricAtLow, d),
                atHigh: r.metricAtHigh === null ? null : metricValue(metric, r.metricAtHigh, d),
              }))}
            />
            {tor.notes.map((n) => (
              <p className="basis" key={n}>
                {n}
              </p>
            ))}
          </section>
          <section className="panel" data-testid="break-even">
            <h3 className="chart-title">Break-even against {result.baseline.name}</h3>
            {!k ? (
              <p className="muted">The baseline has no price, so there is no break-even.</p>
            ) : (
              <table className="kv">
                <tbody>
                  <tr>
                    <th>Candidate fuel price today</th>
                    <td className="num">{sc.price ? `${d.costPerEnergy(sc.price.perMWh_net)} ${d.costPerEnergyUnit} (net)` : "–"}</td>
                  </tr>
                  <tr>
                    <th>Break-even fuel price, same cost per useful {d.energyUnit}</th>
                    <td className="num">
                      {k.breakEven.fuelPriceOperating_per_MWh_net === null
                        ? "none"
                        : `${d.costPerEnergy(k.breakEven.fuelPriceOperating_per_MWh_net)} ${d.costPerEnergyUnit} (net)`}
                      {k.breakEven.fuelPriceOperating_per_MWh_net !== null && sc.price && (
                        <div className="unit">
                          {signed((100 * (k.breakEven.fuelPriceOperating_per_MWh_net - sc.price.perMWh_net)) / sc.price.perMWh_net, 0)} %
                          from today
                        </div>
                      )}
                    </td>
                  </tr>
                  <tr>
                    <th>Break-even fuel price, NPV = 0 over {result.study.horizonYears} yr</th>
                    <td className="num">
                      {k.breakEven.fuelPriceNpv_per_MWh_net === null
                        ? "none"
                        : `${d.costPerEnergy(k.breakEven.fuelPriceNpv_per_MWh_net)} ${d.costPerEnergyUnit} (net)`}
                    </td>
                  </tr>
                  <tr>
                    <th>Carbon price today</th>
                    <td className="num">{money(result.study.carbonPrice_per_t, d.currency, 0)}/t</td>
                  </tr>
                  <tr>
                    <th>Break-even carbon price, same cost per useful {d.energyUnit}</th>
                    <td className="num">
                      {k.breakEven.carbonPriceOperating_per_t === null
                        ? "none (CO2 does not differ)"
                        : `${money(k.breakEven.carbonPriceOperating_per_t, d.currency, 0)}/t`}
                    </td>
                  </tr>
                  <tr>
                    <th>Break-even carbon price, NPV = 0</th>
                    <td className="num">
                      {k.breakEven.carbonPriceNpv_per_t === null
                        ? "none (CO2 does not differ)"
                        : `${money(k.breakEven.carbonPriceNpv_per_t, d.currency, 0)}/t`}
                    </td>
                  </tr>
                  <tr>
                    <th>Abatement cost (carbon price excluded)</th>
                    <td className="num">
                      {k.abatementCost_per_t === null ? "no CO2 avoided" : `${money(k.abatementCost_per_t, d.currency, 0)}/t`}
                    </td>
                  </tr>
                </tbody>
              </table>
            )}
            <p className="basis">
              Prices are delivered (commodity + transport + handling) per MWh of fuel on the net (LHV) basis, shown per {d.energyUnit}. A
              negative break-even carbon price means the candidate is already cheaper at no carbon price.
            </p>
          </section>
        </div>
      )}

      {tor && tor.baseValue !== null && (
        <>
          <h3>Inputs and results</h3>
          <div className="table-wrap">
            <table>
              <thead>
                <tr>
                  <th>Input</th>
                  <th className="num">Base</th>
                  <th className="num">Low</th>
                  <th className="num">High</th>
                  <th className="num">Metric at low</th>
                  <th className="num">Metric at high</th>
                  <th className="num">Swing</th>
                </tr>
              </thead>
              <tbody>
                {tor.rows.map((r) => (
                  <tr key={r.parameter}>
                    <td>{r.label}</td>
                    <td className="num">{inputText(r, r.baseInput, d)}</td>
                    <td className="num">{inputText(r, r.lowInput, d)}</td>
                    <td className="num">{inputText(r, r.highInput, d)}</td>
                    <td className="num">{r.metricAtLow === null ? "undefined" : fmt(metricValue(metric, r.metricAtLow, d), 2)}</td>
                    <td className="num">{r.metricAtHigh === null ? "undefined" : fmt(metricValue(metric, r.metricAtHigh, d), 2)}</td>
                    <td className="num">{fmt(metricValue(metric, r.swing, d), 2)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <p className="table-note">Metric in {metricUnit(metric, d)}; rows sorted by swing, largest first.</p>
        </>
      )}
    </>
  );
}
