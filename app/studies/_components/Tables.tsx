/** The ranked scenario table and the fit-check matrix (comparison page and report). */
import Link from "next/link";
import type { StudyResult } from "@/lib/study/evaluate";
import type { RankingMetric } from "@/lib/economics/sensitivity";
import { fmt, money } from "../../_ui/format";
import { savingText, signed, type Display } from "./display";
import { Status } from "./Checks";
import { co2Ranked, type Ranked } from "./results";
import { priceSourceLabel } from "./price-labels";

const metricCol: Record<RankingMetric, string> = {
  "cost-per-useful-MWh": "cost",
  "co2-per-useful-MJ": "co2",
  "abatement-cost": "abatement",
  npv: "npv",
};

function payback(v: number | null | undefined, hasComparison: boolean): string {
  if (!hasComparison) return "–";
  if (v === null || v === undefined) return "never";
  if (v === 0) return "immediate";
  return fmt(v, 1);
}

type Part = "all" | "economics" | "technical";

export function RankTable({
  list,
  result,
  d,
  metric,
  links = true,
  part = "all",
}: {
  list: Ranked[];
  result: StudyResult;
  d: Display;
  metric: RankingMetric;
  links?: boolean;
  part?: Part;
}) {
  const cur = d.currency;
  const hi = (col: string) => (metricCol[metric] === col ? "num metric" : "num");
  const mark = (col: string) => (metricCol[metric] === col ? " ▲" : "");
  const up = result.study.includeUpstream;
  const eco = part !== "technical";
  const tech = part !== "economics";
  return (
    <div className="table-wrap">
      <table className={`rank-table rank-${part}`} data-testid={part === "all" ? "rank-table" : `rank-table-${part}`}>
        <thead>
          <tr>
            <th className="sticky">Scenario, ranked · fit</th>
            {eco && (
              <>
                <th className={hi("cost")}>
                  Cost{mark("cost")} <span className="unit">{d.costPerEnergyUnit} useful</span>
                </th>
                <th className={hi("co2")}>
                  CO2{mark("co2")} <span className="unit">g/MJ useful{up ? " + upstream" : ""}</span>
                </th>
                <th className="num">
                  Annual cost <span className="unit">{cur}/yr</span>
                </th>
                <th className="num">
                  CO2 <span className="unit">t/yr fossil</span>
                </th>
                <th className="num">
                  Saving <span className="unit">{cur}/yr</span>
                </th>
                <th className="num">
                  Payback <span className="unit">yr</span>
                </th>
                <th className={hi("npv")}>
                  NPV{mark("npv")} <span className="unit">{cur}</span>
                </th>
                <th className={hi("abatement")}>
                  Abatement{mark("abatement")} <span className="unit">{cur}/t CO2</span>
                </th>
              </>
            )}
            {tech && (
              <>
                <th className="num">
                  Flame <span className="unit">Δ{d.dTUnit}</span>
                </th>
                <th className="num">
                  Wobbe <span className="unit">Δ %</span>
                </th>
                <th className="num">
                  Flue gas <span className="unit">Δ %</span>
                </th>
                <th className="num">
                  Fuel flow <span className="unit">Δ % vol</span>
                </th>
                <th className="num">
                  Efficiency <span className="unit">% net</span>
                </th>
                {part === "technical" && (
                  <th className="num">
                    Dew point <span className="unit">{d.tempUnit}</span>
                  </th>
                )}
              </>
            )}
          </tr>
        </thead>
        <tbody>
          {list.map(({ r, meta }) => {
            const k = r.comparison;
            const c = r.costs;
            return (
              <tr
                key={r.index}
                className={`${r.status === "infeasible" ? "infeasible" : ""}${r.isBaseline ? " baseline-row" : ""}`}
                data-scenario={r.name}
                data-status={r.status}
              >
                <td className="sticky scen-name">
                  <span className="rank-no">{r.rank}.</span> {r.name} {r.isBaseline && <span className="badge demo">baseline</span>}
                  <div className="scen-status">
                    <Status status={r.status} />
                  </div>
                  {part !== "technical" && (
                    <div className="scen-fuel">
                      {links ? <Link href={`/fuels/${meta.fuelId}`}>{meta.fuelName}</Link> : meta.fuelName}
                      {meta.price.invented && (
                        <>
                          {" "}
                          <span className="badge invented" title={priceSourceLabel(meta.price)}>
                            invented price
                          </span>
                        </>
                      )}
                    </div>
                  )}
                </td>
                {eco && (
                  <>
                    <td className={hi("cost")} data-col="cost">
                      {c ? (
                        d.costPerEnergy(c.costPerUsefulMWh.total)
                      ) : meta.price.kind === "none" ? (
                        <small className="muted" title={priceSourceLabel(meta.price)}>
                          no price: {meta.price.notes[0] ?? `no quote in ${meta.price.currency}`}
                        </small>
                      ) : (
                        "–"
                      )}
                    </td>
                    <td className={hi("co2")} data-col="co2">
                      {fmt(co2Ranked(r), 1)}
                    </td>
                    <td className="num">{c ? fmt(c.annualTotalCost, 0) : "–"}</td>
                    <td className="num">{fmt(r.annualCo2_t.fossil, 0)}</td>
                    <td className="num">{k ? signed(k.annualNetSaving, 0) : r.isBaseline ? "—" : "–"}</td>
                    <td className="num">{r.isBaseline ? "—" : payback(k?.simplePaybackYears, k !== null)}</td>
                    <td className={hi("npv")}>{k ? signed(k.npv, 0) : r.isBaseline ? "—" : "–"}</td>
                    <td className={hi("abatement")}>
                      {k ? (k.abatementCost_per_t === null ? "no CO2 avoided" : fmt(k.abatementCost_per_t, 0)) : r.isBaseline ? "—" : "–"}
                    </td>
                  </>
                )}
                {tech && (
                  <>
                    <td className="num">{r.isBaseline ? "—" : r.flame ? d.dT(r.flame.shiftK, 0) : "–"}</td>
                    <td className="num">{r.isBaseline ? "—" : r.wobbeShiftPercent !== null ? signed(r.wobbeShiftPercent, 1) : "n/a"}</td>
                    <td className="num">{r.isBaseline ? "—" : signed(r.flowChangePercent.flueGas, 1)}</td>
                    <td className="num">
                      {r.isBaseline ? "—" : r.flowChangePercent.fuelVolume !== null ? signed(r.flowChangePercent.fuelVolume, 1) : "n/a"}
                    </td>
                    <td className="num">{fmt(r.efficiency.net * 100, 1)}</td>
                    {part === "technical" && <td className="num">{d.temp(r.efficiency.dewPointC, 1)}</td>}
                  </>
                )}
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}

export function RankTableNotes({ result, d }: { result: StudyResult; d: Display }) {
  return (
    <p className="table-note">
      Ranked by {result.ranking.label}; {result.ranking.better} is better; infeasible scenarios (a fit check fails) rank after the feasible
      ones and stay in the table. Cost = fuel + carbon{result.study.includeUpstream ? " + upstream CO2e" : ""} per {d.energyUnit} of useful
      heat, delivered prices, carbon at {money(result.study.carbonPrice_per_t, d.currency, 0)}/t on fossil CO2. Annual cost includes any
      fixed operating-cost change. Saving, payback, NPV ({result.study.horizonYears} years at {fmt(result.study.discountRatePercent, 1)} %,
      prices escalating {fmt(result.study.priceEscalationPercent, 1)} %/yr) and abatement cost (carbon price excluded) are against the
      baseline. Flame: equilibrium adiabatic flame temperature at the plant&apos;s O2 and air temperature; Wobbe: gross, at the plant&apos;s
      Wobbe references; flue gas: wet, normal m³ at rated duty; fuel flow: volume at rated duty (gas at the supply metering reference,
      liquids as liquid). Efficiency by the heat-loss method on the net (LHV) basis.
    </p>
  );
}

/** Checks as rows, scenarios as columns (in rank order). */
export function CheckMatrix({ list, d }: { list: Ranked[]; d: Display }) {
  if (!list.length) return null;
  const ids = list[0].r.checks.map((c) => ({ id: c.id, label: c.label }));
  return (
    <div className="table-wrap">
      <table className="check-matrix" data-testid="check-matrix">
        <thead>
          <tr>
            <th className="sticky">Check</th>
            {list.map(({ r }) => (
              <th key={r.index}>
                {r.name}
                {r.isBaseline && <div className="unit">baseline</div>}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {ids.map(({ id, label }) => (
            <tr key={id}>
              <th className="sticky" style={{ fontWeight: 500 }}>
                {label}
              </th>
              {list.map(({ r }) => {
                const c = r.checks.find((x) => x.id === id);
                if (!c) return <td key={r.index}>–</td>;
                const v = d.check(c);
                return (
                  <td key={r.index} title={c.message} data-check={id} data-status={c.status}>
                    <Status status={c.status} />
                    {c.value !== null && (
                      <span className="cv">
                        {v.value} {v.unit}
                      </span>
                    )}
                    {c.limit !== null && (
                      <span className="cl">
                        limit {v.limit} {v.unit}
                      </span>
                    )}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/** The ranking as cards for narrow windows (the full table follows, scrolling sideways). */
export function RankCards({ list, d, metric }: { list: Ranked[]; d: Display; metric: RankingMetric }) {
  return (
    <ol className="rank-cards only-narrow" aria-label="Ranking">
      {list.map(({ r }) => {
        const k = r.comparison;
        return (
          <li key={r.index} className={r.status === "infeasible" ? "infeasible" : ""} data-scenario={r.name}>
            <div className="rc-head">
              <span className="rank-no">{r.rank}.</span> <b>{r.name}</b> <Status status={r.status} />
            </div>
            <div className="rc-figs">
              <span>
                {r.costs ? `${d.costPerEnergy(r.costs.costPerUsefulMWh.total)} ${d.costPerEnergyUnit}` : "no price"}
                {metric === "cost-per-useful-MWh" && " ▲"}
              </span>
              <span>
                {fmt(co2Ranked(r), 1)} g CO2/MJ{metric === "co2-per-useful-MJ" && " ▲"}
              </span>
              {k && <span>{savingText(k.annualNetSaving, d.currency)}</span>}
              {k && metric === "npv" && <span>NPV {signed(k.npv, 0)} ▲</span>}
              {k && metric === "abatement-cost" && (
                <span>{k.abatementCost_per_t === null ? "no CO2 avoided" : `${fmt(k.abatementCost_per_t, 0)} ${d.currency}/t`} ▲</span>
              )}
            </div>
          </li>
        );
      })}
    </ol>
  );
}
