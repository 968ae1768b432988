import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { db } from "@/lib/db/client";
import { evaluateStoredStudy } from "@/lib/services/studies";
import { sweepVerdict, type SweepPoint, type SweepCrossing } from "@/lib/study/hydrogen-sweep";
import type { FitCheckId } from "@/lib/plant/fit-checks";
import { fmt } from "../../../_ui/format";
import { SweepChart, type SweepMarker } from "../../../_charts/SweepChart";
import { displayUnits } from "../../_components/units-server";
import { makeDisplay, signed, type Display } from "../../_components/display";
import { UnitSwitch } from "../../_components/UnitSwitch";
import { Cautions } from "../../_components/Cautions";
import { Status } from "../../_components/Checks";
import { CrossingTable, shareText } from "../../_components/Crossings";
import { EvaluationProblem } from "../../_components/EvaluationProblem";
import { viewChoice, type SearchParams } from "../../_components/settings";
import { METERING_REFERENCES, meteringLabelWithPressure } from "@/lib/units/metering";
import { sweepAgreement } from "@/lib/study/sweep-agreement";
import { hydrogenPriceLabel } from "../../_components/price-labels";
import { FlameProgress } from "../../_components/FlameProgress";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Hydrogen-share sweep" };

type Props = { params: Promise<{ id: string }>; searchParams: Promise<SearchParams> };

function markersFor(
  points: SweepPoint[],
  crossings: SweepCrossing[],
  ids: FitCheckId[],
  y: (p: SweepPoint) => number | null,
): SweepMarker[] {
  const out: SweepMarker[] = [];
  for (const c of crossings) {
    if (!ids.includes(c.checkId)) continue;
    const at = (x: number | null) => (x === null ? undefined : points.find((p) => p.h2Percent === x));
    const w = at(c.firstWarnPercent);
    const f = at(c.firstFailPercent);
    if (w && c.firstWarnPercent !== c.firstFailPercent && c.statusAtZero !== "warn" && c.statusAtZero !== "fail")
      out.push({ x: w.h2Percent, y: y(w), kind: "warn", label: c.label });
    if (f && c.statusAtZero !== "fail") out.push({ x: f.h2Percent, y: y(f), kind: "fail", label: c.label });
  }
  return out;
}

export default async function SweepPage({ params, searchParams }: Props) {
  const id = Number((await params).id);
  if (!Number.isInteger(id) || id <= 0) notFound();
  const view = viewChoice(await searchParams);
  const [ev, units] = await Promise.all([
    evaluateStoredStudy(db(), id, {
      metric: view.metric,
      includeUpstream: view.includeUpstream,
      sweep: true,
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
  const d: Display = makeDisplay(units, result.study.currency);
  const sw = result.hydrogenSweep;
  if (!sw?.available) {
    return (
      <>
        <h2 style={{ marginTop: 0 }}>Hydrogen-share sweep</h2>
        <p className="note">
          No hydrogen sweep for this study: {sw?.reason ?? "the sweep is not available"}. The sweep blends hydrogen into the baseline gas of
          a gas-fired plant; compare liquid or solid candidates on the <Link href={`/studies/${id}`}>comparison</Link>.
        </p>
      </>
    );
  }
  const pts = sw.points;
  const lim = sw.limitLines!;
  const plant = result.plant;
  const vLines =
    lim.maxH2SharePercent !== null ? [{ x: lim.maxH2SharePercent, label: `burner limit ${fmt(lim.maxH2SharePercent, 0)} %` }] : [];

  // First failure at a share above 0 % (checks already failing on the baseline gas are listed apart).
  const verdict = sweepVerdict(pts, sw.crossings);
  const agreement = sweepAgreement(result);
  const fails = verdict.firstFailures;
  const warns = verdict.firstWarnings;
  const atZero = verdict.failingOrWarningAtZero;
  const firstFail = fails[0] ?? null;
  const lastOk = verdict.largestPassingPoint;
  const p0 = pts[0];

  const series = (f: (p: SweepPoint) => number | null) => pts.map((p) => ({ x: p.h2Percent, y: f(p) }));
  const flameSeries = (f: (p: SweepPoint) => number | null) => pts.filter((p) => p.flamePoint).map((p) => ({ x: p.h2Percent, y: f(p) }));
  const wobbeBand = lim.wobbeBand_MJ_per_m3 ?? lim.wobbeRange_MJ_per_m3;

  return (
    <>
      <div className="page-head" style={{ marginBottom: 0 }}>
        <div>
          <h2 style={{ marginTop: 0, border: 0 }}>How much hydrogen can {plant.name} take?</h2>
          <p className="lede">
            {sw.baseGasLabel} blended with {sw.hydrogenLabel} from 0 to 100 vol % in {fmt(sw.stepPercent, sw.stepPercent % 1 ? 1 : 0)} %
            steps, each share evaluated in this plant at its operating point. Red markers: the first share at which a limit fails; amber:
            the first warning.
          </p>
        </div>
        <div className="actions">
          <a className="button secondary" href={`/api/studies/${id}/export?format=csv&table=sweep`} download>
            Sweep as CSV
          </a>
        </div>
      </div>
      <UnitSwitch units={units} />
      <FlameProgress id={id} initial={{ ...result.flameSolves, needed: result.flameSolves.needed.length }} />

      <section className="verdict" aria-label="Answer" style={{ marginTop: "0.75rem" }}>
        <div className={`card ${firstFail ? "bad" : "ok"}`} data-testid="sweep-limit">
          <h3>Largest share before a limit fails</h3>
          <div className="big">{firstFail ? (lastOk ? `${fmt(lastOk.h2Percent, 0)} vol % H2` : "none") : "100 vol % H2"}</div>
          <p>
            {firstFail ? (
              <>
                First failure at {shareText(firstFail.firstFailPercent)}: <b>{firstFail.label}</b>.
                {fails.length > 1 && (
                  <>
                    {" "}
                    Then{" "}
                    {fails
                      .slice(1, 3)
                      .map((c) => `${c.label} at ${shareText(c.firstFailPercent)}`)
                      .join("; ")}
                    .
                  </>
                )}
              </>
            ) : (
              "No limit entered for this plant fails anywhere between 0 and 100 vol %."
            )}
          </p>
        </div>
        {lastOk && (
          <div className="card">
            <h3>At {fmt(lastOk.h2Percent, 0)} vol % H2</h3>
            <div className="big">{signed(lastOk.co2ChangePercent, 1)} % CO2</div>
            <p>
              Hydrogen supplies {fmt(lastOk.h2EnergySharePercent, 1)} % of the energy (net basis): CO2 per useful MJ falls much less than
              the volume share.
              {lastOk.costPerUsefulMWh !== null && p0.costPerUsefulMWh !== null && (
                <>
                  {" "}
                  Cost {d.costPerEnergy(lastOk.costPerUsefulMWh)} {d.costPerEnergyUnit} useful (
                  {signed((100 * (lastOk.costPerUsefulMWh - p0.costPerUsefulMWh)) / p0.costPerUsefulMWh, 1)} %).
                </>
              )}
            </p>
          </div>
        )}
        <div className={`card ${warns.length ? "" : "ok"}`}>
          <h3>First warning</h3>
          <div className="big">{warns.length ? shareText(warns[0].firstWarnPercent) : "none"}</div>
          <p>{warns.length ? warns[0].label : "No limit comes within the warning margin."}</p>
          {atZero.length > 0 && (
            <p className="muted">Already at 0 % H2: {atZero.map((c) => `${c.label} (${c.statusAtZero})`).join("; ")}.</p>
          )}
        </div>
      </section>

      {bundle.meta.hydrogen.price.kind === "none" && <p className="note">No cost line: {hydrogenPriceLabel(bundle.meta.hydrogen)}.</p>}
      {sw.notes.map((n) => (
        <p className="note" key={n}>
          {n}
        </p>
      ))}

      {agreement.length > 0 && (
        <section className="panel" data-testid="sweep-agreement">
          <h3 className="chart-title">This study&apos;s hydrogen blends on the sweep</h3>
          <ul className="plain">
            {agreement.map((a) => (
              <li key={a.scenario}>
                <b>{a.scenario}</b> ({fmt(a.h2Percent, 0)} vol % H2): {d.costPerEnergy(a.comparisonCost)} {d.costPerEnergyUnit} useful on
                the comparison, {d.costPerEnergy(a.sweepCost)} on the sweep{a.exactPoint ? "" : " (interpolated)"} —{" "}
                {a.agrees ? "the same figure." : `they differ because ${a.reasons.join("; ")}.`}
              </li>
            ))}
          </ul>
        </section>
      )}

      <div className="sweep-grid">
        <section className="panel">
          <SweepChart
            title="Wobbe index, gross"
            yUnit={d.wobbeUnit}
            decimals={2}
            data={series((p) => (p.wobbeGross_MJ_per_m3 === null ? null : d.wobbeValue(p.wobbeGross_MJ_per_m3)))}
            band={
              wobbeBand
                ? {
                    min: d.wobbeValue(wobbeBand.min),
                    max: d.wobbeValue(wobbeBand.max),
                    label: lim.wobbeBand_MJ_per_m3 ? `± ${fmt(plant.wobbeTolerancePercent, 0)} % band` : "allowed range",
                  }
                : undefined
            }
            markers={markersFor(pts, sw.crossings, ["wobbe-band", "wobbe-range"], (p) =>
              p.wobbeGross_MJ_per_m3 === null ? null : d.wobbeValue(p.wobbeGross_MJ_per_m3),
            )}
            vLines={vLines}
          />
          <p className="basis">{sw.basis.wobbe}</p>
        </section>
        <section className="panel">
          <SweepChart
            title="Adiabatic flame temperature"
            yUnit={d.tempUnit}
            decimals={0}
            data={series((p) => (p.flameTemperatureC === null ? null : d.tempValue(p.flameTemperatureC)))}
            limits={
              lim.maxFlameTemperatureC !== null
                ? [
                    {
                      y: d.tempValue(lim.maxFlameTemperatureC),
                      label: `baseline + ${d.dT(plant.maxFlameTempRiseK ?? 0, 0, false)} ${d.dTUnit}`,
                    },
                  ]
                : []
            }
            markers={markersFor(pts, sw.crossings, ["flame-temperature-rise"], (p) =>
              p.flameTemperatureC === null ? null : d.tempValue(p.flameTemperatureC),
            )}
            vLines={vLines}
          />
          <p className="basis">{sw.basis.flame}</p>
        </section>
        <section className="panel">
          <SweepChart title="CO2 per useful MJ" yUnit="g/MJ" decimals={1} data={series((p) => p.co2PerUsefulMJ_g)} vLines={vLines} />
          <p className="basis">
            Fossil CO2{result.study.includeUpstream ? " plus upstream CO2e" : ""} per MJ of useful heat, net-basis efficiency at each share.
          </p>
        </section>
        <section className="panel">
          <SweepChart
            title="Fuel gas volume flow"
            yUnit={`${d.volUnit}/h`}
            decimals={0}
            data={series((p) => (p.fuelVolume_m3_per_h === null ? null : d.volValue(p.fuelVolume_m3_per_h)))}
            limits={
              lim.fuelSupplyCapacity_m3_per_h !== null ? [{ y: d.volValue(lim.fuelSupplyCapacity_m3_per_h), label: "supply capacity" }] : []
            }
            markers={markersFor(pts, sw.crossings, ["fuel-supply"], (p) =>
              p.fuelVolume_m3_per_h === null ? null : d.volValue(p.fuelVolume_m3_per_h),
            )}
            vLines={vLines}
          />
          <p className="basis">
            At rated useful duty; gas at the supply metering reference (
            {meteringLabelWithPressure(METERING_REFERENCES[plant.fuelSupplyMeteringReference].temperatureC)}), real gas.
          </p>
        </section>
        <section className="panel">
          <SweepChart
            title="Flue-gas volume flow"
            yUnit={`${d.volUnit}/h`}
            decimals={0}
            data={series((p) => d.volValue(p.flueGas_m3_per_h))}
            limits={lim.flueGasCapacity_m3_per_h !== null ? [{ y: d.volValue(lim.flueGasCapacity_m3_per_h), label: "fan capacity" }] : []}
            markers={markersFor(pts, sw.crossings, ["flue-gas-fan"], (p) => d.volValue(p.flueGas_m3_per_h))}
            vLines={vLines}
          />
          <p className="basis">
            Wet flue gas at rated useful duty,{" "}
            {plant.flueGasCapacityBasis === "actual" ? "actual volume at the stack temperature" : "normal m³ (0 °C)"}.
          </p>
        </section>
        <section className="panel">
          <SweepChart
            title="Combustion air"
            yUnit={`${d.volUnit}/h`}
            decimals={0}
            data={series((p) => d.volValue(p.air_m3_per_h))}
            limits={lim.airCapacity_m3_per_h !== null ? [{ y: d.volValue(lim.airCapacity_m3_per_h), label: "fan capacity" }] : []}
            markers={markersFor(pts, sw.crossings, ["combustion-air-fan"], (p) => d.volValue(p.air_m3_per_h))}
            vLines={vLines}
          />
          <p className="basis">
            Humid air at rated useful duty,{" "}
            {plant.airCapacityBasis === "actual" ? "actual volume at the air temperature" : "normal m³ (0 °C)"}.
          </p>
        </section>
        <section className="panel" data-testid="chart-burning-velocity">
          <SweepChart
            title="Burning velocity ÷ baseline gas (flashback)"
            yUnit="×"
            decimals={2}
            data={flameSeries((p) => p.burningVelocityRatio)}
            limits={[
              ...(lim.flashbackWarnRatio !== null
                ? [{ y: lim.flashbackWarnRatio, label: `warn ${fmt(lim.flashbackWarnRatio, 2)} ×`, labelAt: "insideTopLeft" as const }]
                : []),
              ...(lim.flashbackFailRatio !== null
                ? [{ y: lim.flashbackFailRatio, label: `fail ${fmt(lim.flashbackFailRatio, 2)} ×` }]
                : []),
            ]}
            vLines={vLines}
          />
          <p className="basis">
            {sw.basis.burner}.{" "}
            {lim.flashbackFailRatio === null
              ? "The burner is not premixed or partially premixed (or not described): the ratio is shown, not judged."
              : ""}
          </p>
        </section>
        <section className="panel" data-testid="chart-nox">
          <SweepChart
            title="NOx, screening estimate"
            yUnit="mg/m³"
            decimals={0}
            data={flameSeries((p) => p.nox_mg_per_m3)}
            limits={
              lim.noxLimit_mg_per_m3 !== null
                ? [{ y: lim.noxLimit_mg_per_m3, label: `permit ${fmt(lim.noxLimit_mg_per_m3, 0)} mg/m³` }]
                : []
            }
            vLines={vLines}
          />
          <p className="basis">
            NOx as NO2, dry, 0 °C, 101.325 kPa, at the permit&apos;s reference O2;{" "}
            {plant.noxMeasuredBaseline_mg_per_m3 != null
              ? `scaled from the ${fmt(plant.noxMeasuredBaseline_mg_per_m3, 0)} mg/m³ measured on the baseline gas by the flame indicator's ratio`
              : "the adiabatic post-flame indicator (an upper bound; enter a measured baseline NOx on the plant to scale from it)"}
            . A screening estimate: a measurement decides.
          </p>
        </section>
        <section className="panel" data-testid="chart-untuned-heat-input">
          <SweepChart
            title="Untuned burner: heat input change"
            yUnit="%"
            decimals={1}
            data={series((p) => p.untunedHeatInputChangePercent)}
            vLines={vLines}
          />
          <p className="basis">Before retuning, at a fixed gas orifice and regulated supply pressure: follows the net Wobbe index.</p>
        </section>
        <section className="panel" data-testid="chart-untuned-lambda">
          <SweepChart title="Untuned burner: air factor λ" yUnit="λ" decimals={3} data={series((p) => p.untunedLambda)} vLines={vLines} />
          <p className="basis">
            Before retuning, with the plant&apos;s air-ratio control; retuned, the flue O2 is held at {fmt(plant.flueO2DryPercent, 1)} %.
          </p>
        </section>
        {pts.some((p) => p.costPerUsefulMWh !== null) && (
          <section className="panel">
            <SweepChart
              title="Cost per useful energy"
              yUnit={`${d.costPerEnergyUnit} useful`}
              decimals={2}
              data={series((p) => (p.costPerUsefulMWh === null ? null : d.costPerEnergyValue(p.costPerUsefulMWh)))}
              vLines={vLines}
            />
            <p className="basis">
              {sw.basis.cost}; blend priced as the mass-weighted mix of the delivered prices per kg (
              {hydrogenPriceLabel(bundle.meta.hydrogen)}).
            </p>
          </section>
        )}
      </div>

      <h2>Where each limit is crossed</h2>
      <CrossingTable crossings={sw.crossings} testId="crossings" />

      <details style={{ marginTop: "1rem" }}>
        <summary>Figures every 10 vol %</summary>
        <div className="table-wrap" style={{ marginTop: "0.5rem" }}>
          <table>
            <thead>
              <tr>
                <th className="num">H2 vol %</th>
                <th className="num">H2 energy %</th>
                <th className="num">Wobbe {d.wobbeUnit}</th>
                <th className="num">Flame {d.tempUnit}</th>
                <th className="num">Efficiency % net</th>
                <th className="num">Dew point {d.tempUnit}</th>
                <th className="num">CO2 g/MJ</th>
                <th className="num">Fuel {d.volUnit}/h</th>
                <th className="num">Flue gas {d.volUnit}/h</th>
                <th className="num">Cost {d.costPerEnergyUnit}</th>
                <th className="num">Burning velocity ×</th>
                <th className="num">NOx mg/m³</th>
                <th className="num">Untuned λ</th>
                <th className="num">Untuned heat input %</th>
                <th>Worst check</th>
              </tr>
            </thead>
            <tbody>
              {pts
                .filter((p) => Math.abs(p.h2Percent / 10 - Math.round(p.h2Percent / 10)) < 1e-9)
                .map((p) => (
                  <tr key={p.h2Percent}>
                    <td className="num">{fmt(p.h2Percent, 0)}</td>
                    <td className="num">{fmt(p.h2EnergySharePercent, 1)}</td>
                    <td className="num">{d.wobbe(p.wobbeGross_MJ_per_m3)}</td>
                    <td className="num">{d.temp(p.flameTemperatureC)}</td>
                    <td className="num">{fmt(p.efficiencyNet * 100, 1)}</td>
                    <td className="num">{d.temp(p.dewPointC, 1)}</td>
                    <td className="num">{fmt(p.co2PerUsefulMJ_g, 1)}</td>
                    <td className="num">{d.vol(p.fuelVolume_m3_per_h)}</td>
                    <td className="num">{d.vol(p.flueGas_m3_per_h)}</td>
                    <td className="num">{d.costPerEnergy(p.costPerUsefulMWh)}</td>
                    <td className="num">{fmt(p.burningVelocityRatio, 2)}</td>
                    <td className="num">{fmt(p.nox_mg_per_m3, 0)}</td>
                    <td className="num">{fmt(p.untunedLambda, 3)}</td>
                    <td className="num">{signed(p.untunedHeatInputChangePercent, 1)}</td>
                    <td>
                      <Status status={p.worst} />
                    </td>
                  </tr>
                ))}
            </tbody>
          </table>
        </div>
      </details>

      <p className="basis" style={{ marginTop: "1rem" }}>
        {sw.basis.volumes}. Compare with the candidates on the <Link href={`/studies/${id}`}>comparison</Link>.
      </p>
      <Cautions items={result.cautions.items} screening={result.cautions.screening} />
    </>
  );
}
