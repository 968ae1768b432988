import type { Metadata } from "next";
import { History } from "@/app/_ui/History";
import Link from "next/link";
import { notFound } from "next/navigation";
import { db } from "@/lib/db/client";
import { evaluateStoredStudy } from "@/lib/services/studies";
import { studyName } from "@/lib/services/lookups";
import { fmt, money } from "../../_ui/format";
import { CostStackChart, Co2Chart, CostCo2Scatter } from "../../_charts/ScenarioCharts";
import { displayUnits } from "../_components/units-server";
import { makeDisplay, savingText, signed } from "../_components/display";
import { UnitSwitch } from "../_components/UnitSwitch";
import { Cautions } from "../_components/Cautions";
import { CheckMatrix, RankCards, RankTable, RankTableNotes } from "../_components/Tables";
import { BurnerSection } from "../_components/Burner";
import { FlameProgress } from "../_components/FlameProgress";
import { co2Rows, costRows, failingChecks, headline, metricText, ranked, scatterPoints } from "../_components/results";
import { METRIC_SHORT, RANKING_METRICS, viewChoice, viewQuery, type SearchParams } from "../_components/settings";
import { EvaluationProblem } from "../_components/EvaluationProblem";
import { priceSourceLabel } from "../_components/price-labels";
import { Revisions } from "../_components/Revisions";
import { pageActions } from "@/app/_auth/page-user";

export const dynamic = "force-dynamic";

type Props = { params: Promise<{ id: string }>; searchParams: Promise<SearchParams> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const id = Number((await params).id);
  const name = Number.isInteger(id) && id > 0 ? await studyName(db(), id) : null;
  return { title: name ? `${name} — comparison` : "Study" };
}

export default async function ComparisonPage({ params, searchParams }: Props) {
  const id = Number((await params).id);
  if (!Number.isInteger(id) || id <= 0) notFound();
  const view = viewChoice(await searchParams);
  const [ev, units, can] = await Promise.all([
    evaluateStoredStudy(db(), id, { metric: view.metric, includeUpstream: view.includeUpstream, solveFlames: true }),
    displayUnits(),
    pageActions(),
  ]);
  if (!ev.ok) {
    if (ev.kind === "not-found") notFound();
    return <EvaluationProblem id={id} message={ev.message} fieldErrors={ev.fieldErrors} />;
  }
  const { result, bundle } = ev;
  const d = makeDisplay(units, result.study.currency);
  const metric = result.ranking.metric;
  const list = ranked(result, bundle);
  const h = headline(list);
  const base = result.baseline;
  const candidates = list.filter((x) => !x.r.isBaseline);

  return (
    <>
      <div className="choice-bar">
        <span>
          <span className="choice-label">Rank by</span>
          <span className="segmented" role="group" aria-label="Rank by">
            {RANKING_METRICS.map((m) => (
              <Link
                key={m}
                href={`/studies/${id}${viewQuery({ ...view, metric: m })}`}
                aria-current={m === metric ? "true" : undefined}
                scroll={false}
              >
                {METRIC_SHORT[m]}
              </Link>
            ))}
          </span>
        </span>
        <span>
          <span className="choice-label">Upstream CO2e</span>
          <span className="segmented" role="group" aria-label="Upstream CO2e">
            <Link
              href={`/studies/${id}${viewQuery({ ...view, includeUpstream: false })}`}
              aria-current={!result.study.includeUpstream ? "true" : undefined}
              scroll={false}
            >
              not counted
            </Link>
            <Link
              href={`/studies/${id}${viewQuery({ ...view, includeUpstream: true })}`}
              aria-current={result.study.includeUpstream ? "true" : undefined}
              scroll={false}
            >
              counted and priced
            </Link>
          </span>
        </span>
        <UnitSwitch units={units} />
      </div>

      <section className="assumptions" aria-label="Study assumptions">
        <span>
          Useful heat{" "}
          <b>
            {d.energy(result.duty.annualUseful_MWh)} {d.energyUnit}/yr
          </b>
        </span>
        <span>
          Carbon price <b>{money(result.study.carbonPrice_per_t, d.currency, 0)}/t</b>
        </span>
        <span>
          Discount rate <b>{fmt(result.study.discountRatePercent, 1)} %</b>
        </span>
        <span>
          Horizon <b>{result.study.horizonYears} yr</b>
        </span>
        <span>
          Escalation <b>{fmt(result.study.priceEscalationPercent, 1)} %/yr</b>
        </span>
        <span>
          Baseline <b>{base.name}</b>
        </span>
      </section>

      {bundle.meta.anyInventedPrice && (
        <p className="note warn">
          Some prices are <span className="badge invented">invented</span> demo figures, not market quotes: the costs show how Stoke works,
          not what fuels cost.
        </p>
      )}
      {result.audit.notes.map((n) => (
        <p className="note warn" key={n}>
          {n}
        </p>
      ))}

      <section className="verdict" aria-label="Answer">
        {h.best && (
          <div className={`card${h.bestIsBaseline ? "" : " ok"}`} data-testid="verdict-best">
            <h3>Best by {METRIC_SHORT[metric].toLowerCase()}</h3>
            <div className="big">{h.best.r.name}</div>
            <p>{metricText(metric, h.best.r.metricValue, d)}</p>
            {h.bestIsBaseline ? (
              <p>
                Staying on {base.name} ranks first.
                {h.bestCandidate && (
                  <>
                    {" "}
                    Best feasible candidate: <b>{h.bestCandidate.r.name}</b> ({metricText(metric, h.bestCandidate.r.metricValue, d)}).
                  </>
                )}
              </p>
            ) : (
              h.best.r.comparison && (
                <p>
                  Against {base.name} it {savingText(h.best.r.comparison.annualNetSaving, d.currency)}, avoids{" "}
                  {fmt(h.best.r.comparison.annualCo2Avoided_t, 0)} t CO2/yr; payback{" "}
                  {h.best.r.comparison.simplePaybackYears === null
                    ? "never (no saving)"
                    : `${fmt(h.best.r.comparison.simplePaybackYears, 1)} yr`}
                  .
                </p>
              )
            )}
          </div>
        )}
        {h.lowestCo2 && (
          <div className="card" data-testid="verdict-co2">
            <h3>Lowest CO2, feasible</h3>
            <div className="big">{h.lowestCo2.r.name}</div>
            <p>
              {fmt(h.lowestCo2.r.co2PerUsefulMJ_g.ranked, 1)} g CO2/MJ useful
              {h.lowestCo2.r.comparison && (
                <>
                  {" "}
                  ({signed(h.lowestCo2.r.comparison.co2ChangePercent, 0)} %), abatement cost{" "}
                  {h.lowestCo2.r.comparison.abatementCost_per_t === null
                    ? "–"
                    : `${money(h.lowestCo2.r.comparison.abatementCost_per_t, d.currency, 0)}/t`}
                </>
              )}
            </p>
          </div>
        )}
        <div className={`card${h.infeasible.length ? " bad" : " ok"}`} data-testid="verdict-infeasible">
          <h3>Infeasible in this plant</h3>
          {h.infeasible.length === 0 ? (
            <div className="big">none</div>
          ) : (
            <>
              <div className="big">
                {h.infeasible.length} of {list.length}
              </div>
              {h.infeasible.map((x) => (
                <p key={x.r.index}>
                  <b>{x.r.name}</b>: fails {failingChecks(x.r).join("; ")}
                </p>
              ))}
            </>
          )}
        </div>
      </section>

      <h2>Scenarios ranked</h2>
      <RankCards list={list} d={d} metric={metric} />
      <p className="scroll-hint">All figures: scroll the table sideways.</p>
      <RankTable list={list} result={result} d={d} metric={metric} />
      <RankTableNotes result={result} d={d} />
      <details style={{ marginTop: "0.5rem" }}>
        <summary>Prices used</summary>
        <div className="table-wrap" style={{ marginTop: "0.5rem" }}>
          <table>
            <thead>
              <tr>
                <th>Scenario</th>
                <th>Fuel</th>
                <th>Price from</th>
                <th className="num">
                  Delivered <span className="unit">{d.costPerEnergyUnit} net</span>
                </th>
                <th className="num">
                  Delivered <span className="unit">{d.costPerEnergyUnit} gross</span>
                </th>
                <th className="num">
                  Delivered <span className="unit">{d.currency}/kg</span>
                </th>
              </tr>
            </thead>
            <tbody>
              {list.map(({ r, meta }) => (
                <tr key={r.index}>
                  <td>{r.name}</td>
                  <td>
                    <Link href={`/fuels/${meta.fuelId}`}>{meta.fuelName}</Link>
                  </td>
                  <td>
                    {priceSourceLabel(meta.price)} {meta.price.invented && <span className="badge invented">invented</span>}
                  </td>
                  <td className="num">{r.price ? d.costPerEnergy(r.price.perMWh_net) : "–"}</td>
                  <td className="num">{r.price ? d.costPerEnergy(r.price.perMWh_gross) : "–"}</td>
                  <td className="num">{r.price ? fmt(r.price.perKg, 4) : "–"}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <p className="table-note">
          Delivered = commodity + transport + handling, converted with each fuel&apos;s own heating values and density. Quotes are managed
          in the fuel library.
        </p>
      </details>

      <h2>Charts</h2>
      <div className="charts-grid">
        <section className="panel">
          <h3 className="chart-title">
            Cost per useful {d.energyUnit}{" "}
            <span className="unit">
              ({d.costPerEnergyUnit}, fuel + carbon{result.study.includeUpstream ? " + upstream" : ""})
            </span>
          </h3>
          <CostStackChart rows={costRows(list, d)} unit={`${d.costPerEnergyUnit} useful`} includeUpstream={result.study.includeUpstream} />
          <p className="basis">
            Delivered fuel price ÷ efficiency (net basis); carbon on fossil CO2. Faded bars and ✕: infeasible in this plant.
          </p>
        </section>
        <section className="panel">
          <h3 className="chart-title">
            CO2 per useful MJ <span className="unit">(g/MJ)</span>
          </h3>
          <Co2Chart rows={co2Rows(list)} includeUpstream={result.study.includeUpstream} />
          <p className="basis">
            Per MJ of useful heat: fuel CO2 per MJ (net basis) ÷ efficiency. Biogenic CO2 is shown, not counted or priced.
          </p>
        </section>
      </div>
      <section className="panel" style={{ marginTop: "1rem" }}>
        <h3 className="chart-title">Cost against CO2</h3>
        <CostCo2Scatter points={scatterPoints(list, d)} costUnit={`${d.costPerEnergyUnit} useful`} />
      </section>

      <h2>Fit checks</h2>
      <p className="basis">
        Each candidate at the plant&apos;s operating point (and any scenario overrides) against the plant&apos;s limits; warn at{" "}
        {fmt(result.plant.warnAtFractionOfLimit * 100, 0)} % of a limit. Hover a cell for the explanation; the report lists them in full.
      </p>
      <CheckMatrix list={list} d={d} />

      <FlameProgress id={id} sweep={false} initial={{ ...result.flameSolves, needed: result.flameSolves.needed.length }} />
      <BurnerSection result={result} d={d} />

      {candidates.length === 0 && (
        <p className="note">
          This study has only its baseline.{" "}
          {can.editStudy ? (
            <>
              <Link href={`/studies/${id}/edit`}>Add candidate scenarios</Link> to compare.
            </>
          ) : (
            "An editor can add candidate scenarios to compare."
          )}
        </p>
      )}

      <p className="no-print" style={{ marginTop: "1.25rem" }}>
        Next:{" "}
        {bundle.meta.baseline.fuelKind === "gas" && (
          <>
            <Link href={`/studies/${id}/sweep${viewQuery(view)}`}>how much hydrogen can the plant take?</Link> ·{" "}
          </>
        )}
        <Link href={`/studies/${id}/sensitivity${viewQuery(view)}`}>how robust is the ranking?</Link> ·{" "}
        <Link href={`/studies/${id}/report${viewQuery(view)}`}>print the report</Link>
      </p>

      <Revisions id={id} />

      <Cautions items={result.cautions.items} screening={result.cautions.screening} />

      <History type="study" id={id} />
    </>
  );
}
