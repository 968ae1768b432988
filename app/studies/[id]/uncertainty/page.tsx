import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { db } from "@/lib/db/client";
import { studyBundle } from "@/lib/services/studies";
import { getUncertaintyRun, runForReport } from "@/lib/services/uncertainty-runs";
import { RunControl } from "./RunControl";
import { pageActions } from "@/app/_auth/page-user";
import { OPERATING_HOURS_DEFAULT_PERCENT } from "@/lib/schemas/study";
import { RANGES, uncertaintyParams } from "./params";
import { fmt, money } from "../../../_ui/format";
import { CdfChart, FirstChanceChart, IntervalChart } from "../../../_charts/UncertaintyCharts";
import { Status } from "../../_components/Checks";
import { EvaluationProblem } from "../../_components/EvaluationProblem";
import { band, byChanceFirst, metricFormat, OptionName, pct, pFirstText, pNpvText } from "../../_components/uncertainty-format";
import { intParam, METRIC_SHORT, RANKING_METRICS, viewChoice, viewQuery, type SearchParams } from "../../_components/settings";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "How sure is the ranking?" };

type Props = { params: Promise<{ id: string }>; searchParams: Promise<SearchParams> };

export default async function UncertaintyPage({ params, searchParams }: Props) {
  const id = Number((await params).id);
  if (!Number.isInteger(id) || id <= 0) notFound();
  const sp = await searchParams;
  const view = viewChoice(sp);
  const { request, ranges, shape, rho, ignored } = uncertaintyParams(sp);
  const { draws, seed } = request;
  const runAsked = intParam(sp, "run");
  const [loaded, stored, can] = await Promise.all([
    studyBundle(db(), id),
    runAsked !== null && runAsked > 0 ? getUncertaintyRun(db(), id, runAsked) : runForReport(db(), id),
    pageActions(),
  ]);
  if (!loaded.ok) {
    if (loaded.kind === "not-found") notFound();
    return <EvaluationProblem id={id} message={loaded.message} fieldErrors={loaded.fieldErrors} />;
  }
  const run = stored === null ? null : "ok" in stored ? (stored.ok ? stored.value : null) : stored;
  const sens = loaded.bundle.study.sensitivity;
  const formId = "uncertainty-form";
  const form = !can.runUncertainty ? (
    <p className="note" data-testid="runs-by-editors">
      Runs are started and stored by an editor; the latest stored run shows here.
    </p>
  ) : (
    <>
      <form
        id={formId}
        method="get"
        className="row no-print"
        style={{ alignItems: "flex-end", marginBottom: "0.75rem", flexWrap: "wrap" }}
        aria-label="Uncertainty ranges"
      >
        {view.metric && <input type="hidden" name="metric" value={view.metric} />}
        {view.includeUpstream !== undefined && <input type="hidden" name="upstream" value={view.includeUpstream ? "1" : "0"} />}
        {RANGES.map((x) => (
          <div className="field" key={x.q} style={{ flex: "0 1 140px" }}>
            <label htmlFor={`u-${x.q}`}>{x.label}</label>
            <input
              id={`u-${x.q}`}
              name={x.q}
              className="num"
              inputMode="decimal"
              defaultValue={String(ranges[x.key] ?? x.def(sens) ?? "")}
              placeholder={x.q === "sk" ? "from ± points" : undefined}
            />
          </div>
        ))}
        <div className="field" style={{ flex: "0 1 140px" }}>
          <label htmlFor="u-shape">Distribution</label>
          <select id="u-shape" name="shape" defaultValue={shape}>
            <option value="triangular">triangular (−w, 0, +w)</option>
            <option value="pert">PERT (−w, 0, +w)</option>
            <option value="normal">normal (sd = w)</option>
          </select>
        </div>
        <div className="field" style={{ flex: "0 1 140px" }}>
          <label htmlFor="u-rho">Fuel prices move together (correlation)</label>
          <input id="u-rho" name="rho" className="num" inputMode="decimal" defaultValue={rho === undefined ? "0" : String(rho)} />
        </div>
        <div className="field" style={{ flex: "0 1 110px" }}>
          <label htmlFor="u-draws">Draws</label>
          <input id="u-draws" name="draws" className="num" inputMode="numeric" defaultValue={String(draws)} />
        </div>
        <div className="field" style={{ flex: "0 1 90px" }}>
          <label htmlFor="u-seed">Seed</label>
          <input id="u-seed" name="seed" className="num" inputMode="numeric" defaultValue={String(seed)} />
        </div>
        <RunControl studyId={id} formId={formId} />
      </form>
      {ignored.length > 0 && <p className="note warn">Out of range and ignored: {ignored.map((x) => x.label).join(", ")}.</p>}
      <p className="basis">
        Ranges are changes from the study&apos;s values; without an entry they come from the study&apos;s sensitivity ranges (fuel ±{" "}
        {sens.fuelPricePercent} %, carbon ± {sens.carbonPricePercent} %, capex ± {sens.capexPercent} %, efficiency ± {sens.efficiencyPoints}{" "}
        points) and ± {OPERATING_HOURS_DEFAULT_PERCENT} % on operating hours. A scenario whose operating changes state a stack temperature
        (a retrofit) has that temperature drawn instead of its efficiency points, and each draw runs its heat-loss balance again; without an
        entry its band is the one that moves the balance by ± {sens.efficiencyPoints} points. Each scenario&apos;s capex, efficiency and
        stack vary independently; a quote used by several options (e.g. natural gas in its blends) is one price. A run is computed on the
        server in slices while the page stays usable, and stored with the study.
      </p>
    </>
  );
  const head = (
    <>
      <h2 style={{ marginTop: 0, border: 0 }}>How sure is the ranking?</h2>
      <p className="lede">
        Every uncertain input is drawn from its range at once, thousands of times; each draw ranks the options again through the plant
        model&apos;s efficiencies and the price paths. The bars say how often each option comes out first.
      </p>
    </>
  );
  if (!run) {
    return (
      <>
        {head}
        {form}
        <p className="note" data-testid="no-run">
          {runAsked !== null
            ? `This study has no stored run ${runAsked}.`
            : can.runUncertainty
              ? "No stored run yet: state the ranges and press “Run and store”."
              : "No stored run yet."}
        </p>
      </>
    );
  }
  const r = run.result;
  const study = loaded.bundle.study;
  const cur = r.currency;
  const num = (v: number) => fmt(v, Math.abs(v) >= 1000 ? 0 : 2);
  const metricNum = metricFormat(r);
  const byFirst = byChanceFirst(r.scenarios);
  const withMetric = byFirst.filter((s) => s.metric);
  const cdf = byFirst.filter((s) => s.cdf).map((s) => ({ label: s.name, values: s.cdf! }));
  const st = run.settings;
  const keep = (extra: Record<string, string | number | undefined>) =>
    viewQuery(
      { metric: st.metric, includeUpstream: st.includeUpstream },
      {
        draws: st.draws,
        seed: st.seed,
        shape: st.shape,
        ...Object.fromEntries(RANGES.map((x) => [x.q, st.ranges[x.key]])),
        rho: st.fuelPriceCorrelation ?? undefined,
        ...extra,
      },
    );

  return (
    <>
      {head}
      <p className="note warn" role="note">
        {r.caution}
      </p>
      <div className="choice-bar">
        <span>
          <span className="choice-label">Metric of the next run</span>
          <span className="segmented" role="group" aria-label="Metric">
            {RANKING_METRICS.map((m) => (
              <Link
                key={m}
                href={`/studies/${id}/uncertainty${viewQuery({ ...view, metric: m }, { draws, seed, shape, rho, ...Object.fromEntries(RANGES.map((x) => [x.q, ranges[x.key]])) })}`}
                aria-current={m === (view.metric ?? r.metric) ? "true" : undefined}
                scroll={false}
              >
                {METRIC_SHORT[m]}
              </Link>
            ))}
          </span>
        </span>
      </div>
      {form}
      <section className={`panel${run.stale ? " warn" : ""}`} data-testid="stored-run">
        <strong>
          Stored run #{run.id} of {run.createdAt.slice(0, 16).replace("T", " ")} UTC
        </strong>
        : {r.draws.toLocaleString("en-GB")} draws, seed {r.seed}, {METRIC_SHORT[r.metric].toLowerCase()}, {st.shape} ranges
        {st.fuelPriceCorrelation ? `, fuel prices correlated ${st.fuelPriceCorrelation}` : ""}; computed in {fmt(r.elapsedMs / 1000, 2)} s.{" "}
        {run.revisions.length > 0 && <>Ran on the inputs of revision {run.revisions.join(", ")}. </>}
        {run.stale ? (
          <span data-testid="stale-run">
            <strong>Stale:</strong> the study&apos;s inputs changed since this run (they are not the ones it evaluated); run it again for
            current figures.
          </span>
        ) : (
          <span>The study&apos;s inputs are still the ones it evaluated.</span>
        )}{" "}
        <Link href={`/api/studies/${id}/uncertainty/runs/${run.id}?format=csv`}>CSV</Link> ·{" "}
        <Link href={`/studies/${id}/uncertainty${keep({ run: run.id })}`}>its ranges in the form</Link>
      </section>

      <div className="grid2">
        <section className="panel">
          <h3 className="chart-title">Chance of ranking first ({METRIC_SHORT[r.metric]})</h3>
          <FirstChanceChart
            rows={byFirst
              .filter((s) => s.ranked)
              .map((s) => ({ label: s.name + (s.isBaseline ? " (baseline)" : ""), pFirst: 100 * s.pFirst, se: 100 * s.pFirstSE }))}
          />
        </section>
        <section className="panel">
          <h3 className="chart-title">
            P10 – P90 of {METRIC_SHORT[r.metric].toLowerCase()} <span className="unit">({r.metricUnit})</span>
          </h3>
          <IntervalChart
            unit={r.metricUnit}
            rows={withMetric.map((s) => ({
              label: s.name + (s.status === "infeasible" ? " ✕" : ""),
              p10: s.metric!.p10,
              p50: s.metric!.p50,
              p90: s.metric!.p90,
              deterministic: s.deterministicValue,
            }))}
          />
        </section>
      </div>
      {cdf.length > 0 && (
        <section className="panel">
          <h3 className="chart-title">
            Cumulative distribution of {METRIC_SHORT[r.metric].toLowerCase()}, options most often first{" "}
            <span className="unit">({r.metricUnit})</span>
          </h3>
          <CdfChart series={cdf} unit={r.metricUnit} />
        </section>
      )}

      <h3>Per option</h3>
      <div className="table-wrap">
        <table>
          <thead>
            <tr>
              <th>Option</th>
              <th>Status</th>
              <th className="num">P(first) % ± SE</th>
              <th className="num">Value at stated inputs</th>
              <th className="num">Metric P10 / P50 / P90</th>
              <th className="num">Cost per useful MWh, year 1, P10 / P50 / P90 ({cur}/MWh)</th>
              <th className="num">NPV P10 / P50 / P90 ({cur})</th>
              <th className="num">P(NPV &gt; 0) % ± SE</th>
              <th className="num">Abatement cost P10 / P50 / P90 ({cur}/t)</th>
            </tr>
          </thead>
          <tbody>
            {byFirst.map((s) => (
              <tr key={s.name}>
                <OptionName s={s} />
                <td>
                  <Status status={s.status} />
                </td>
                <td className="num">{pFirstText(s)}</td>
                <td className="num">{s.deterministicValue === null ? "–" : metricNum(s.deterministicValue)}</td>
                <td className="num">{band(s.metric, metricNum)}</td>
                <td className="num">{band(s.costPerUsefulMWh, num)}</td>
                <td className="num">{band(s.npv, (v) => fmt(v, 0))}</td>
                <td className="num">{pNpvText(s)}</td>
                <td className="num">
                  {band(s.abatementCost_per_t, (v) => fmt(v, 0))}
                  {s.abatementCost_per_t && s.abatementCost_per_t.defined < r.draws && (
                    <div className="unit">CO2 avoided in {pct(s.abatementCost_per_t.defined / r.draws)} % of draws</div>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="table-note">
        NPV and abatement cost in {r.terms} terms at {fmt(r.discountRatePercent, 2)} % over {study.horizonYears} years. {r.standardError}.
      </p>

      {r.topTwo && (
        <section className="panel" data-testid="drivers">
          <h3 className="chart-title">
            What decides between {r.topTwo.first} and {r.topTwo.second}
          </h3>
          <p className="basis">
            Spearman rank correlation of each input with the difference of their {METRIC_SHORT[r.metric].toLowerCase()} ({r.topTwo.first}{" "}
            minus {r.topTwo.second}), over {r.topTwo.draws.toLocaleString("en-GB")} draws; the medians show where the input sits when each
            one wins.
          </p>
          <div className="table-wrap">
            <table>
              <thead>
                <tr>
                  <th>Input</th>
                  <th className="num">Spearman ρ</th>
                  <th className="num">Median when {r.topTwo.first} is better</th>
                  <th className="num">Median when {r.topTwo.second} is better</th>
                </tr>
              </thead>
              <tbody>
                {r.topTwo.drivers.slice(0, 8).map((x) => (
                  <tr key={x.key}>
                    <td>{x.label}</td>
                    <td className="num">{fmt(x.spearman, 2)}</td>
                    <td className="num">{x.medianWhenFirstBetter === null ? "never" : `${fmt(x.medianWhenFirstBetter, 1)} ${x.unit}`}</td>
                    <td className="num">{x.medianWhenSecondBetter === null ? "never" : `${fmt(x.medianWhenSecondBetter, 1)} ${x.unit}`}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </section>
      )}

      <h3>Assumptions of this run</h3>
      <ul className="basis">
        <li>
          {r.sampling}; generator {r.generator}, seed {r.seed} (the same seed gives the same figures).
        </li>
        {r.notes.map((n) => (
          <li key={n}>{n}</li>
        ))}
        <li>
          Price paths:{" "}
          {r.paths.fuelIndex
            .map((p) => `${p.label}: year 1 × ${fmt(p.values[0], 2)}, year ${p.values.length} × ${fmt(p.values[p.values.length - 1], 2)}`)
            .join("; ")}
          ; carbon {money(r.paths.carbon_per_t[0], cur, 0)}/t in year 1,{" "}
          {money(r.paths.carbon_per_t[r.paths.carbon_per_t.length - 1], cur, 0)}/t in year {r.paths.carbon_per_t.length}.
        </li>
      </ul>
      <div className="table-wrap">
        <table>
          <thead>
            <tr>
              <th>Uncertain input</th>
              <th>Range</th>
              <th className="num">Mean</th>
              <th className="num">Standard deviation</th>
            </tr>
          </thead>
          <tbody>
            {r.inputs.map((i) => (
              <tr key={i.key}>
                <td>{i.label}</td>
                <td>{i.origin}</td>
                <td className="num">
                  {fmt(i.mean, 2)} {i.unit}
                </td>
                <td className="num">
                  {fmt(i.sd, 2)} {i.unit}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="table-note">
        <Link href={`/studies/${id}/uncertainty${keep({ seed: r.seed + 1 })}`}>The same ranges with seed {r.seed + 1}</Link>, run again,
        show the sampling scatter.
      </p>
    </>
  );
}
