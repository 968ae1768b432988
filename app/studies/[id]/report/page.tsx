import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { db } from "@/lib/db/client";
import { studyReportData } from "@/lib/services/revisions";
import { reportUncertainty } from "@/lib/services/uncertainty-runs";
import { PathsSection, UncertaintySection } from "./UncertaintySection";
import { studyName } from "@/lib/services/lookups";
import { fmt, fmtUpTo, money } from "../../../_ui/format";
import { CostStackChart, Co2Chart, CostCo2Scatter } from "../../../_charts/ScenarioCharts";
import { displayUnits } from "../../_components/units-server";
import { makeDisplay, savingText, signed } from "../../_components/display";
import { Cautions } from "../../_components/Cautions";
import { Status } from "../../_components/Checks";
import { CrossingTable } from "../../_components/Crossings";
import { BurnerSection } from "../../_components/Burner";
import { sweepVerdict } from "@/lib/study/hydrogen-sweep";
import { CheckMatrix, RankTable, RankTableNotes } from "../../_components/Tables";
import { EvaluationProblem } from "../../_components/EvaluationProblem";
import { PrintButton } from "../../_components/PrintButton";
import { co2Rows, costRows, failingChecks, headline, metricText, ranked, scatterPoints } from "../../_components/results";
import { METRIC_SHORT, viewChoice, viewQuery, type SearchParams } from "../../_components/settings";
import { PlantLimitsTable } from "../../../plants/_components/PlantLimits";
import { fieldValueText } from "@/lib/schemas/labels";
import { SIEGERT_COMPARISON_DEFINITION } from "@/lib/plant/siegert";
import { hydrogenPriceLabel, priceSourceLabel } from "../../_components/price-labels";
import { co2Ranked, type Ranked } from "../../_components/results";
import type { Display } from "../../_components/display";
import type { StudyResult } from "@/lib/study/evaluate";
import { COMMON_PRACTICE_NOTE, FROM_MEMORY_NOTE, citationNumbers, citationsIn, plainSource } from "./sources";

export const dynamic = "force-dynamic";

type Props = { params: Promise<{ id: string }>; searchParams: Promise<SearchParams> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const id = Number((await params).id);
  const name = Number.isInteger(id) && id > 0 ? await studyName(db(), id) : null;
  return { title: name ? `${name} — report` : "Report" };
}

const PAPER = { a4: "A4", letter: "Letter" } as const;
const ORIENTATION = { portrait: "Portrait", landscape: "Landscape" } as const;
/** Page margins per paper: 16 × 14 mm on A4, 0.6 × 0.55 in on Letter. */
const MARGIN = { a4: "16mm 14mm", letter: "0.6in 0.55in" } as const;
/** The compact ranking holds this many scenarios (baseline included) on one page. */
const COMPACT_MAX = 12;

/** Money in thousands of the currency, whole (capex, NPV): "−1,235". */
const thousands = (v: number | null | undefined) => (v === null || v === undefined || !Number.isFinite(v) ? "–" : signedOrPlain(v / 1000));
const signedOrPlain = (v: number) => (Math.round(v) === 0 ? "0" : v < 0 ? `−${fmt(-v, 0)}` : fmt(v, 0));

/** Ranking at a glance: one line per scenario, up to twelve on one page. */
function CompactRanking({ list, result, d }: { list: Ranked[]; result: StudyResult; d: Display }) {
  const metric = result.ranking.metric;
  const shown = list.slice(0, COMPACT_MAX);
  return (
    <section className="keep compact-ranking" data-testid="compact-ranking">
      <h2>Ranking at a glance</h2>
      <div className="table-wrap">
        <table className="compact">
          <thead>
            <tr>
              <th className="num">#</th>
              <th>Scenario</th>
              <th>Fit</th>
              <th className="num">
                {METRIC_SHORT[metric]} <span className="unit">ranked by</span>
              </th>
              <th className="num">
                Cost <span className="unit">{d.costPerEnergyUnit} useful</span>
              </th>
              <th className="num">
                CO2 <span className="unit">g/MJ useful</span>
              </th>
              <th className="num">
                CO2 avoided <span className="unit">t/yr</span>
              </th>
              <th className="num">
                Capex <span className="unit">thousand {d.currency}</span>
              </th>
              <th className="num">
                NPV <span className="unit">thousand {d.currency}</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {shown.map(({ r }) => (
              <tr key={r.index} className={r.status === "infeasible" ? "infeasible" : undefined}>
                <td className="num">{r.rank}</td>
                <td>
                  {r.name}
                  {r.isBaseline && <span className="muted"> (baseline)</span>}
                </td>
                <td>
                  <Status status={r.status} />
                </td>
                <td className="num">{metricText(metric, r.metricValue, d)}</td>
                <td className="num">{r.costs ? d.costPerEnergy(r.costs.costPerUsefulMWh.total) : "–"}</td>
                <td className="num">{fmt(co2Ranked(r), 1)}</td>
                <td className="num">{r.isBaseline ? "—" : fmt(r.comparison?.annualCo2Avoided_t, 0)}</td>
                <td className="num">{r.isBaseline ? "—" : thousands(r.audit.inputs.capex)}</td>
                <td className="num">{r.isBaseline ? "—" : thousands(r.comparison?.npv)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="table-note">
        {list.length > COMPACT_MAX ? `The first ${COMPACT_MAX} of ${list.length} scenarios; the full tables follow. ` : ""}
        Infeasible scenarios (a fit check fails) rank after the feasible ones. NPV over {result.study.horizonYears} years at{" "}
        {fmt(result.study.discountRatePercent, 1)} % against the baseline.
      </p>
    </section>
  );
}

export default async function ReportPage({ params, searchParams }: Props) {
  const id = Number((await params).id);
  if (!Number.isInteger(id) || id <= 0) notFound();
  const sp = await searchParams;
  const view = viewChoice(sp);
  const paper = sp.paper === "letter" ? "letter" : "a4";
  const orientation = sp.orient === "landscape" ? "landscape" : "portrait";
  const revision = typeof sp.revision === "string" && /^[1-9]\d{0,8}$/.test(sp.revision) ? Number(sp.revision) : undefined;
  const [ev, units] = await Promise.all([
    studyReportData(db(), id, {
      revision,
      metric: view.metric,
      includeUpstream: view.includeUpstream,
      sweep: "if-chosen",
      tornado: false,
      solveFlames: true,
    }),
    displayUnits(),
  ]);
  if (!ev.ok) {
    if (ev.kind === "not-found") notFound();
    return <EvaluationProblem id={id} message={ev.message} fieldErrors={ev.fieldErrors} />;
  }
  const { result, bundle } = ev;
  const extras = await reportUncertainty(db(), id, { study: bundle.study, result, revisionHash: bundle.meta.revision?.hash ?? null });
  const d = makeDisplay(units, result.study.currency);
  const metric = result.ranking.metric;
  const list = ranked(result, bundle);
  const h = headline(list);
  const p = result.plant;
  const sw = result.hydrogenSweep?.available ? result.hydrogenSweep : null;
  const swFails = sw ? sweepVerdict(sw.points, sw.crossings).firstFailures : [];
  const today = new Date().toISOString().slice(0, 10);
  const cover = bundle.study;
  // An issued revision names itself on the cover; the live study is not issued.
  const rev = bundle.meta.revision;
  const revisionText = rev
    ? `Revision ${rev.number} of ${rev.issuedAt.slice(0, 10)}, SHA-256 ${rev.hash.slice(0, 16)}…`
    : "live inputs, not an issued revision";
  const layout = { paper: paper === "a4" ? undefined : paper, orient: orientation === "portrait" ? undefined : orientation };
  const sourceTexts = [
    ...result.audit.methods.map((m) => m.source),
    ...result.audit.assumptions,
    ...result.audit.notes,
    ...list.flatMap(({ r }) => [...r.audit.notes, ...r.checks.map((c) => c.basis)]),
    ...(sw ? [sw.basis.wobbe, ...sw.notes] : []),
  ];
  const citations = citationsIn(sourceTexts);
  const plainMethods = result.audit.methods.map((m) => ({ ...m, plain: plainSource(m.source) }));
  const anyFromMemory = sourceTexts.some((t) => plainSource(t).fromMemory);
  const anyCommonPractice = sourceTexts.some((t) => plainSource(t).commonPractice);
  const plain = (t: string) => plainSource(t).text;
  const warned = list.flatMap(({ r }) => r.checks.filter((c) => c.status === "warn" || c.status === "fail").map((c) => ({ r, c })));

  return (
    <>
      {/* Paper for printing: A4 (210 × 297 mm) or US Letter (8.5 × 11 in), portrait or landscape. */}
      <style>{`@page { size: ${PAPER[paper]} ${orientation}; margin: ${MARGIN[paper]}; }`}</style>
      <div className="report-toolbar no-print">
        <PrintButton />
        <span className="segmented" role="group" aria-label="Paper">
          {(["a4", "letter"] as const).map((k) => (
            <Link
              key={k}
              href={`/studies/${id}/report${viewQuery(view, { ...layout, paper: k === "a4" ? undefined : k })}`}
              aria-current={paper === k ? "true" : undefined}
              scroll={false}
            >
              {PAPER[k]}
            </Link>
          ))}
        </span>
        <span className="segmented" role="group" aria-label="Orientation">
          {(["portrait", "landscape"] as const).map((k) => (
            <Link
              key={k}
              href={`/studies/${id}/report${viewQuery(view, { ...layout, orient: k === "portrait" ? undefined : k })}`}
              aria-current={orientation === k ? "true" : undefined}
              scroll={false}
            >
              {ORIENTATION[k]}
            </Link>
          ))}
        </span>
        <a
          className="button secondary"
          href={`/api/studies/${id}/export?format=csv&table=scenarios${view.metric ? `&metric=${view.metric}` : ""}${view.includeUpstream !== undefined ? `&upstream=${view.includeUpstream ? 1 : 0}` : ""}`}
          download
        >
          Scenarios CSV
        </a>
        <a className="button secondary" href={`/api/studies/${id}/export?format=csv&table=checks`} download>
          Fit checks CSV
        </a>
        <a className="button secondary" href={`/api/studies/${id}/export?format=csv&table=sweep`} download>
          Sweep CSV
        </a>
        <a
          className="button secondary"
          href={`/api/studies/${id}/export?format=json${view.metric ? `&metric=${view.metric}` : ""}${view.includeUpstream !== undefined ? `&upstream=${view.includeUpstream ? 1 : 0}` : ""}`}
          download
        >
          Everything as JSON
        </a>
        <span className="muted small-note">
          Units follow the unit switch; the cover&apos;s title, client, author, date and notes are edited with the study. The print
          stylesheet drops the controls.
        </span>
      </div>

      <article className={`report paper-${paper} ${orientation}`} data-testid="report">
        <header className="cover" data-testid="cover">
          <div className="cover-kicker">Fuel-switching feasibility study — screening, not a design</div>
          <h1 className="cover-title">{cover.reportTitle || cover.name}</h1>
          <div className="cover-plant">
            {p.name}
            {p.site ? `, ${p.site}` : ""} — {p.equipmentLabel}
          </div>
          <dl className="cover-meta">
            <div>
              <dt>Prepared for</dt>
              <dd>{cover.preparedFor || "—"}</dd>
            </div>
            <div>
              <dt>Prepared by</dt>
              <dd>{cover.preparedBy || "—"}</dd>
            </div>
            <div>
              <dt>Date</dt>
              <dd>{cover.reportDate ? cover.reportDate.slice(0, 10) : today}</dd>
            </div>
            <div>
              <dt>Revision</dt>
              <dd data-testid="cover-revision">{revisionText}</dd>
            </div>
            <div>
              <dt>Ranked by</dt>
              <dd>{METRIC_SHORT[metric].toLowerCase()}</dd>
            </div>
            <div>
              <dt>Study</dt>
              <dd>
                {cover.name}, {list.length} scenarios, {d.currency}
              </dd>
            </div>
          </dl>
          {cover.reportNotes.trim() !== "" && (
            <div className="cover-notes" data-testid="cover-notes">
              <h2>Notes from the author</h2>
              {cover.reportNotes
                .split(/\n{2,}/)
                .map((para) => para.trim())
                .filter((para) => para !== "")
                .map((para, i) => (
                  <p key={`${i}-${para.slice(0, 24)}`}>{para}</p>
                ))}
            </div>
          )}
        </header>

        {bundle.meta.anyInventedPrice && (
          <p className="note warn">
            This report uses invented demo prices (marked “invented”): the costs illustrate the method, not the market.
          </p>
        )}

        <section className="keep">
          <h2>Summary</h2>
          <ul>
            {h.best && (
              <li>
                <b>Best by {METRIC_SHORT[metric].toLowerCase()}:</b> {h.best.r.name} — {metricText(metric, h.best.r.metricValue, d)}
                {h.best.r.comparison && (
                  <>
                    ; against {result.baseline.name} it {savingText(h.best.r.comparison.annualNetSaving, d.currency)} and avoids{" "}
                    {fmt(h.best.r.comparison.annualCo2Avoided_t, 0)} t CO2/yr
                  </>
                )}
                {h.bestIsBaseline && h.bestCandidate && (
                  <>
                    ; best feasible candidate {h.bestCandidate.r.name} ({metricText(metric, h.bestCandidate.r.metricValue, d)})
                  </>
                )}
                .
              </li>
            )}
            {h.lowestCo2 && (
              <li>
                <b>Lowest CO2 among feasible options:</b> {h.lowestCo2.r.name}, {fmt(h.lowestCo2.r.co2PerUsefulMJ_g.ranked, 1)} g/MJ useful
                {h.lowestCo2.r.comparison?.abatementCost_per_t != null && (
                  <> at {money(h.lowestCo2.r.comparison.abatementCost_per_t, d.currency, 0)}/t abated</>
                )}
                .
              </li>
            )}
            <li>
              <b>Infeasible in this plant:</b>{" "}
              {h.infeasible.length === 0
                ? "none."
                : `${h.infeasible.map((x) => `${x.r.name} (fails ${failingChecks(x.r).join("; ")})`).join("; ")}.`}
            </li>
            {sw && (
              <li>
                <b>Hydrogen blending:</b>{" "}
                {swFails.length
                  ? `the first limit to fail is “${swFails[0].label}” at ${fmt(swFails[0].firstFailPercent, 0)} vol % H2.`
                  : "no entered limit fails between 0 and 100 vol % H2."}
              </li>
            )}
          </ul>
        </section>

        <CompactRanking list={list} result={result} d={d} />

        <section className="keep">
          <h2>Plant</h2>
          <div className="kv-grid">
            <table className="kv">
              <tbody>
                <tr>
                  <th>Equipment</th>
                  <td>{p.equipmentLabel}</td>
                </tr>
                <tr>
                  <th>Rated heat input</th>
                  <td className="num">
                    {fmt(p.ratedInput_kW, 0)} kW ({p.ratedInputBasis})
                  </td>
                </tr>
                <tr>
                  <th>Annual useful heat</th>
                  <td className="num">
                    {d.energy(result.duty.annualUseful_MWh)} {d.energyUnit} ({result.duty.annualUsefulOrigin})
                  </td>
                </tr>
                <tr>
                  <th>Stack / flue O2</th>
                  <td className="num">
                    {d.temp(p.stackTemperatureC)} {d.tempUnit} / {fmt(p.flueO2DryPercent, 1)} % dry
                  </td>
                </tr>
                <tr>
                  <th>Combustion air</th>
                  <td className="num">
                    {d.temp(p.combustionAirC)} {d.tempUnit}; ambient {d.temp(p.ambientAir.temperatureC)} {d.tempUnit},{" "}
                    {fmt(p.ambientAir.relativeHumidityPercent, 0)} % RH
                  </td>
                </tr>
                <tr>
                  <th>Radiation loss / condensing</th>
                  <td className="num">
                    {fmt(p.radiationLossPercent, 1)} % / {p.condensing ? `yes, return water ${d.temp(p.returnWaterC)} ${d.tempUnit}` : "no"}
                  </td>
                </tr>
              </tbody>
            </table>
            <PlantLimitsTable p={p} d={d} />
          </div>
        </section>

        <section>
          <h2>Assumptions</h2>
          <p>
            Currency {d.currency}; carbon price {money(result.study.carbonPrice_per_t, d.currency, 0)}/t fossil CO2; discount rate{" "}
            {fmt(result.study.discountRatePercent, 1)} %; horizon {result.study.horizonYears} years; fuel and carbon prices escalating{" "}
            {fmt(result.study.priceEscalationPercent, 1)} %/yr; upstream CO2e{" "}
            {result.study.includeUpstream ? "counted and priced" : "reported, not counted"}.
          </p>
          <ul>
            {result.audit.assumptions.map((a) => (
              <li key={a}>{plain(a)}</li>
            ))}
          </ul>
          <h3>Scenarios as entered</h3>
          <div className="table-wrap">
            <table>
              <thead>
                <tr>
                  <th>Scenario</th>
                  <th>Fuel</th>
                  <th>Price quote</th>
                  <th className="num">Delivered, {d.costPerEnergyUnit}</th>
                  <th className="num">Capex {d.currency}</th>
                  <th className="num">Opex change {d.currency}/yr</th>
                  <th>Overrides</th>
                </tr>
              </thead>
              <tbody>
                {list.map(({ r, meta }) => {
                  const q = r.audit.inputs.price;
                  const ov = Object.entries(r.audit.inputs.overrides ?? {});
                  return (
                    <tr key={r.index}>
                      <td>
                        {r.name}
                        {r.isBaseline && " (baseline)"}
                      </td>
                      <td>{meta.fuelName}</td>
                      <td>
                        {q ? (
                          <>
                            {fmtUpTo(q.amount, 4)} + {fmtUpTo(q.transportAdder, 4)} + {fmtUpTo(q.handlingAdder, 4)} {q.currency}/
                            {r.price?.unitLabel ?? q.unit}
                            {q.isInvented && (
                              <>
                                {" "}
                                <span className="badge invented">invented</span>
                              </>
                            )}
                          </>
                        ) : (
                          priceSourceLabel(meta.price)
                        )}
                        <div className="unit">
                          {meta.priceQuoteId !== null ? "chosen quote, fixed" : `rule: the latest ${d.currency} quote valid on ${today}`}
                        </div>
                      </td>
                      <td className="num">
                        {r.price ? `${d.costPerEnergy(r.price.perMWh_net)} net / ${d.costPerEnergy(r.price.perMWh_gross)} gross` : "–"}
                      </td>
                      <td className="num">{r.isBaseline ? "—" : fmt(r.audit.inputs.capex, 0)}</td>
                      <td className="num">{r.isBaseline ? "—" : fmt(r.audit.inputs.fixedOpexChange, 0)}</td>
                      <td>{ov.length ? ov.map(([k, v]) => fieldValueText(k, v)).join("; ") : "none"}</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
        </section>

        <section>
          <h2>Ranked scenarios</h2>
          <h3>Cost and CO2</h3>
          <RankTable list={list} result={result} d={d} metric={metric} links={false} part="economics" />
          <h3>What changes in the plant</h3>
          <RankTable list={list} result={result} d={d} metric={metric} links={false} part="technical" />
          <RankTableNotes result={result} d={d} />
        </section>

        <PathsSection paths={extras.paths} currency={d.currency} />
        <UncertaintySection run={extras.run} revision={bundle.meta.revision?.number ?? null} />

        <section>
          <h2>Charts</h2>
          <div className="charts-grid">
            <div className="chart-box">
              <h3 className="chart-title">
                Cost per useful {d.energyUnit} <span className="unit">({d.costPerEnergyUnit})</span>
              </h3>
              <CostStackChart
                rows={costRows(list, d)}
                unit={`${d.costPerEnergyUnit} useful`}
                includeUpstream={result.study.includeUpstream}
                isStatic
              />
            </div>
            <div className="chart-box">
              <h3 className="chart-title">
                CO2 per useful MJ <span className="unit">(g/MJ)</span>
              </h3>
              <Co2Chart rows={co2Rows(list)} includeUpstream={result.study.includeUpstream} isStatic />
            </div>
          </div>
          <div className="chart-box keep">
            <h3 className="chart-title">Cost against CO2</h3>
            <CostCo2Scatter points={scatterPoints(list, d)} costUnit={`${d.costPerEnergyUnit} useful`} isStatic />
          </div>
        </section>

        <section>
          <h2>Fit checks</h2>
          <CheckMatrix list={list} d={d} />
          <h3>Warnings and failures explained</h3>
          <ul>
            {warned.map(({ r, c }) => (
              <li key={`${r.index}-${c.id}`}>
                <Status status={c.status} /> <b>{r.name}</b> — {c.label}: {plain(c.message)}
              </li>
            ))}
          </ul>
          {warned.length > 0 && (
            <p className="table-note">
              Bases:{" "}
              {[...new Map(warned.map(({ c }) => [c.label, c.basis])).entries()]
                .filter(([, basis]) => basis !== "")
                .map(([label, basis]) => `${label} — ${plain(basis)}`)
                .join("; ")}
              .
            </p>
          )}
        </section>

        <BurnerSection result={result} d={d} />
        {result.flameSolves.pending > 0 && (
          <p className="note" data-testid="report-flames-pending">
            {result.flameSolves.pending} of {result.flameSolves.needed.length} flame solves are still running: their burning velocity,
            flashback and NOx figures read “pending”. Open the report again when they are done.
          </p>
        )}

        <section className="keep">
          <h2>Efficiency and flue gas</h2>
          <div className="table-wrap">
            <table>
              <thead>
                <tr>
                  <th>Scenario</th>
                  <th className="num">Efficiency % net</th>
                  <th className="num">Efficiency % gross</th>
                  <th className="num">Dry flue-gas loss % net</th>
                  <th className="num">Excess air %</th>
                  <th className="num">Dew point {d.tempUnit}</th>
                  <th className="num">Flame {d.tempUnit}</th>
                  <th className="num">Siegert % / flue-gas loss by its definition %</th>
                </tr>
              </thead>
              <tbody>
                {list.map(({ r }) => (
                  <tr key={r.index}>
                    <td>{r.name}</td>
                    <td className="num">{fmt(r.efficiency.net * 100, 1)}</td>
                    <td className="num">{fmt(r.efficiency.gross * 100, 1)}</td>
                    <td className="num">{fmt(r.efficiency.lossesNetPercent.dryFlueGas, 2)}</td>
                    <td className="num">{fmt(r.efficiency.excessAirPercent, 0)}</td>
                    <td className="num">{d.temp(r.efficiency.dewPointC, 1)}</td>
                    <td className="num">{r.flame ? d.temp(r.flame.temperatureC) : "–"}</td>
                    <td className="num">
                      {r.efficiency.siegert
                        ? `${fmt(r.efficiency.siegert.siegertPercent, 2)} / ${fmt(r.efficiency.siegert.heatLossMethodPercent, 2)}`
                        : "n/a"}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <p className="table-note">
            {result.baseline.efficiency.basis}. Siegert: rule-of-thumb flue loss (German 1. BImSchV), where its constants apply, beside the{" "}
            {SIEGERT_COMPARISON_DEFINITION}.
          </p>
        </section>

        {sw && (
          <section className="keep">
            <h2>Hydrogen blending: where each limit is crossed</h2>
            <p className="basis">
              {sw.baseGasLabel} with {sw.hydrogenLabel}, 0–100 vol % in {fmt(sw.stepPercent, 0)} % steps, at the plant&apos;s operating
              point. {sw.basis.wobbe}.
            </p>
            <CrossingTable crossings={sw.crossings} />
            <div className="table-wrap" style={{ marginTop: "0.6rem" }}>
              <table>
                <thead>
                  <tr>
                    <th className="num">H2 vol %</th>
                    <th className="num">H2 energy % (net)</th>
                    <th className="num">Wobbe {d.wobbeUnit}</th>
                    <th className="num">Flame {d.tempUnit}</th>
                    <th className="num">CO2 g/MJ useful</th>
                    <th className="num">CO2 change %</th>
                    <th className="num">Fuel {d.volUnit}/h</th>
                    <th className="num">Cost {d.costPerEnergyUnit}</th>
                  </tr>
                </thead>
                <tbody>
                  {sw.points
                    .filter((x) => Math.abs(x.h2Percent / 10 - Math.round(x.h2Percent / 10)) < 1e-9)
                    .map((x) => (
                      <tr key={x.h2Percent}>
                        <td className="num">{fmt(x.h2Percent, 0)}</td>
                        <td className="num">{fmt(x.h2EnergySharePercent, 1)}</td>
                        <td className="num">{d.wobbe(x.wobbeGross_MJ_per_m3)}</td>
                        <td className="num">{d.temp(x.flameTemperatureC)}</td>
                        <td className="num">{fmt(x.co2PerUsefulMJ_g, 1)}</td>
                        <td className="num">{signed(x.co2ChangePercent, 1)}</td>
                        <td className="num">{d.vol(x.fuelVolume_m3_per_h)}</td>
                        <td className="num">{d.costPerEnergy(x.costPerUsefulMWh)}</td>
                      </tr>
                    ))}
                </tbody>
              </table>
            </div>
          </section>
        )}

        <section>
          <h2>Methods</h2>
          <ol className="sources">
            {plainMethods.map((m) => {
              const refs = citationNumbers(m.source, citations);
              return (
                <li key={m.quantity}>
                  <b>{m.quantity}</b> — {m.method}. <i>Source:</i> {m.plain.text}
                  {refs.length > 0 && <> [{refs.join(", ")}]</>}.
                </li>
              );
            })}
          </ol>
          <h3>Notes on the inputs</h3>
          <ul>
            {result.audit.notes.map((n) => (
              <li key={n}>{plain(n)}</li>
            ))}
            {list.map(({ r }) => (
              <li key={r.index}>
                <b>{r.name}:</b> {r.audit.notes.map(plain).join("; ")}
              </li>
            ))}
            {sw && (
              <li>
                Hydrogen sweep: {hydrogenPriceLabel(bundle.meta.hydrogen)}
                {sw.notes.length ? `; ${sw.notes.map(plain).join("; ")}` : ""}.
              </li>
            )}
          </ul>
        </section>

        <section className="sources-appendix" data-testid="sources">
          <h2>Sources</h2>
          <p className="table-note">
            The standards, papers and tables the computations of this report rest on, numbered as cited under Methods.
          </p>
          <ol className="citations">
            {citations.map((c) => (
              <li key={c.key} data-citation={c.key}>
                {c.text}
              </li>
            ))}
          </ol>
          {(anyFromMemory || anyCommonPractice) && (
            <>
              <h3>Where a value has no printed source</h3>
              <ul>
                {anyFromMemory && <li>{FROM_MEMORY_NOTE}</li>}
                {anyCommonPractice && <li>{COMMON_PRACTICE_NOTE}</li>}
              </ul>
            </>
          )}
        </section>

        <Cautions items={result.cautions.items} screening={result.cautions.screening} />
      </article>
    </>
  );
}
