import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { db } from "@/lib/db/client";
import { studyBundle } from "@/lib/services/studies";
import { phiSweepInPlant, type PlantPhiSweep } from "@/lib/study/phi-sweep";
import { cautionsFor, DEFER } from "@/lib/fuels/cautions";
import { kelvinToCelsius } from "@/lib/units/constants";
import { fmt } from "../../../_ui/format";
import { PhiChart } from "../../../_charts/PhiChart";
import { displayUnits } from "../../_components/units-server";
import { makeDisplay } from "../../_components/display";
import { UnitSwitch } from "../../_components/UnitSwitch";
import { Cautions } from "../../_components/Cautions";
import { EvaluationProblem } from "../../_components/EvaluationProblem";
import { intParam, viewChoice, viewQuery, type SearchParams } from "../../_components/settings";
import { isStokeError } from "@/lib/errors";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Flame temperature against φ" };

type Props = { params: Promise<{ id: string }>; searchParams: Promise<SearchParams> };

// Sweeps are pure functions of fuel and conditions: keep the recent ones.
declare global {
  var __stokePhiSweeps: Map<string, PlantPhiSweep> | undefined;
}
function cached(key: string, compute: () => PlantPhiSweep): PlantPhiSweep {
  if (!globalThis.__stokePhiSweeps) globalThis.__stokePhiSweeps = new Map();
  const m = globalThis.__stokePhiSweeps;
  const hit = m.get(key);
  if (hit) return hit;
  const v = compute();
  m.set(key, v);
  if (m.size > 64) m.delete(m.keys().next().value as string);
  return v;
}

export default async function PhiPage({ params, searchParams }: Props) {
  const id = Number((await params).id);
  if (!Number.isInteger(id) || id <= 0) notFound();
  const sp = await searchParams;
  const view = viewChoice(sp);
  const [loaded, units] = await Promise.all([studyBundle(db(), id), displayUnits()]);
  if (!loaded.ok) {
    if (loaded.kind === "not-found") notFound();
    return <EvaluationProblem id={id} message={loaded.message} fieldErrors={loaded.fieldErrors} />;
  }
  const study = loaded.bundle.study;
  const d = makeDisplay(units, study.currency);
  const all = [study.baseline, ...study.scenarios];
  const idx = Math.min(Math.max(intParam(sp, "scenario") ?? -1, -1), study.scenarios.length - 1);
  const sc = idx === -1 ? study.baseline : study.scenarios[idx];
  let sweep: PlantPhiSweep | null = null;
  let error: string | null = null;
  try {
    sweep = cached(JSON.stringify([sc.fuel, study.plant, sc.overrides]), () => phiSweepInPlant(sc.fuel, study.plant, sc.overrides));
  } catch (e) {
    // A fuel that cannot be swept in these conditions is shown as a problem; anything else is a bug.
    if (!isStokeError(e)) throw e;
    error = e.message;
  }
  const toC = (K: number | null) => (K === null ? null : d.tempValue(kelvinToCelsius(K)));
  const cautions = cautionsFor(sc.fuel).filter((c) => c.hazard !== "burner-change");
  const eq = sweep?.peak.equilibrium ?? null;
  const co = sweep?.peak.complete ?? null;
  const failed = sweep ? sweep.points.filter((p) => p.errors.length) : [];

  return (
    <>
      <h2 style={{ marginTop: 0, border: 0 }}>Flame temperature against the equivalence ratio</h2>
      <p className="lede">
        Adiabatic flame temperature of one scenario&apos;s fuel from lean (φ &lt; 1, excess air) to rich (φ &gt; 1), solved two ways:
        chemical equilibrium, which dissociates CO2 and H2O and so peaks slightly on the rich side, and complete combustion, which peaks at
        φ = 1. The dashed grey line is the mean-cp hand estimate.
      </p>
      <div className="choice-bar">
        <span>
          <span className="choice-label">Scenario</span>
          <span className="segmented" role="group" aria-label="Scenario">
            {all.map((s, i) => {
              const k = i - 1;
              return (
                <Link
                  key={s.name}
                  href={`/studies/${id}/phi${viewQuery(view, { scenario: k === -1 ? undefined : k })}`}
                  aria-current={k === idx ? "true" : undefined}
                  scroll={false}
                >
                  {s.name}
                </Link>
              );
            })}
          </span>
        </span>
        <UnitSwitch units={units} groups={["temperature"]} />
      </div>

      {error && (
        <p className="note bad">
          The sweep could not be computed for {sc.name}: {error}
        </p>
      )}
      {sweep && (
        <>
          <section className="verdict" aria-label="Peaks">
            <div className="card" data-testid="phi-peak">
              <h3>Equilibrium peak</h3>
              <div className="big">{eq ? `${d.temp(kelvinToCelsius(eq.temperatureK))} ${d.tempUnit} at φ = ${fmt(eq.phi, 3)}` : "–"}</div>
              <p>
                {eq ? (eq.phi > 1 ? "on the rich side of stoichiometric, as dissociation predicts" : "at or below stoichiometric") : ""}
              </p>
            </div>
            <div className="card">
              <h3>Complete-combustion peak</h3>
              <div className="big">{co ? `${d.temp(kelvinToCelsius(co.temperatureK))} ${d.tempUnit} at φ = ${fmt(co.phi, 3)}` : "–"}</div>
              <p>
                {eq && co
                  ? `${d.dT(co.temperatureK - eq.temperatureK, 0, false)} ${d.dTUnit} above the equilibrium peak: the heat dissociation absorbs`
                  : ""}
              </p>
            </div>
            <div className="card">
              <h3>The plant runs at</h3>
              <div className="big">{sweep.operatingPhi ? `φ = ${fmt(sweep.operatingPhi, 3)}` : "–"}</div>
              <p>
                {fmt(sweep.conditions.flueO2DryPercent, 1)} % O2 in the dry flue gas, combustion air at{" "}
                {d.temp(sweep.conditions.combustionAirC)} {d.tempUnit}.
              </p>
            </div>
          </section>
          <section className="panel">
            <h3 className="chart-title">
              {sc.name} <span className="unit">({d.tempUnit})</span>
            </h3>
            <PhiChart
              unit={d.tempUnit}
              operatingPhi={sweep.operatingPhi}
              data={sweep.points.map((p) => ({
                phi: p.phi,
                equilibrium: toC(p.equilibriumK),
                complete: toC(p.completeK),
                meanCp: toC(p.meanCpK),
              }))}
              peaks={[
                ...(eq
                  ? [{ phi: eq.phi, value: toC(eq.temperatureK)!, which: "equilibrium" as const, label: `peak φ = ${fmt(eq.phi, 3)}` }]
                  : []),
                ...(co ? [{ phi: co.phi, value: toC(co.temperatureK)!, which: "complete" as const, label: `φ = ${fmt(co.phi, 2)}` }] : []),
              ]}
            />
            <p className="basis">
              {sweep.basis}. Methods: equilibrium — {sweep.methods.equilibrium}; complete — {sweep.methods.complete}; hand estimate —{" "}
              {sweep.methods["mean-cp"]}. Peaks located by {eq?.method ?? "the grid"}.
            </p>
          </section>
          {failed.length > 0 && (
            <p className="note warn">
              No value at {failed.map((p) => `φ = ${fmt(p.phi, 2)} (${p.errors.join("; ")})`).join(", ")}: the solver did not converge
              there, so no number is shown.
            </p>
          )}
          <details style={{ marginTop: "1rem" }}>
            <summary>Figures</summary>
            <div className="table-wrap" style={{ marginTop: "0.5rem" }}>
              <table>
                <thead>
                  <tr>
                    <th className="num">φ</th>
                    <th className="num">Equilibrium {d.tempUnit}</th>
                    <th className="num">Complete {d.tempUnit}</th>
                    <th className="num">Mean-cp {d.tempUnit}</th>
                    <th className="num">CO mol %</th>
                    <th className="num">H2 mol %</th>
                  </tr>
                </thead>
                <tbody>
                  {sweep.points
                    .filter((_, i) => i % 2 === 0)
                    .map((p) => (
                      <tr key={p.phi}>
                        <td className="num">{fmt(p.phi, 3)}</td>
                        <td className="num">{p.equilibriumK === null ? "–" : d.temp(kelvinToCelsius(p.equilibriumK))}</td>
                        <td className="num">{p.completeK === null ? "–" : d.temp(kelvinToCelsius(p.completeK))}</td>
                        <td className="num">{p.meanCpK === null ? "–" : d.temp(kelvinToCelsius(p.meanCpK))}</td>
                        <td className="num">{p.equilibriumCO === null ? "–" : fmt(p.equilibriumCO * 100, 2)}</td>
                        <td className="num">{p.equilibriumH2 === null ? "–" : fmt(p.equilibriumH2 * 100, 2)}</td>
                      </tr>
                    ))}
                </tbody>
              </table>
            </div>
          </details>
        </>
      )}
      <Cautions items={cautions} screening={`Rich flames (φ > 1) make carbon monoxide and unburnt fuel: fired plant runs lean. ${DEFER}`} />
    </>
  );
}
