import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { db } from "@/lib/db/client";
import { effectiveDefinition, findFuel, resolveRow } from "@/lib/services/fuels";
import { phiSweep, type PhiSweepResult } from "@/lib/study/phi-sweep";
import { cautionsFor, DEFER } from "@/lib/fuels/cautions";
import { kelvinToCelsius } from "@/lib/units/constants";
import { fmt } from "@/app/_ui/format";
import { PhiChart } from "@/app/_charts/PhiChart";
import { isStokeError } from "@/lib/errors";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Flame temperature against φ" };

type Props = { params: Promise<{ id: string }> };

/** φ sweep of one stored fuel in dry air at 25 °C and 101.325 kPa (the fuel sheet's conditions). */
export default async function FuelPhiPage({ params }: Props) {
  const id = Number((await params).id);
  if (!Number.isInteger(id) || id <= 0) notFound();
  const row = await findFuel(db(), id);
  if (!row) notFound();
  let sweep: PhiSweepResult | null = null;
  let error: string | null = null;
  try {
    sweep = phiSweep({ fuel: resolveRow(row) });
  } catch (e) {
    // A stored fuel that cannot be swept is shown as a problem; anything else is a bug.
    if (!isStokeError(e)) throw e;
    error = e.message;
  }
  const eq = sweep?.peak.equilibrium ?? null;
  const co = sweep?.peak.complete ?? null;
  const toC = (K: number | null) => (K === null ? null : kelvinToCelsius(K));
  const failed = sweep ? sweep.points.filter((p) => p.errors.length) : [];
  const cautions = cautionsFor(effectiveDefinition(row)).filter((c) => c.hazard !== "burner-change");

  return (
    <>
      <p className="crumbs">
        <Link href="/fuels">Fuel library</Link> › <Link href={`/fuels/${id}`}>{row.name}</Link> › φ sweep
      </p>
      <h1>{row.name}: flame temperature against φ</h1>
      <p className="lede">
        Adiabatic flame temperature from lean (φ &lt; 1) to rich (φ &gt; 1) in dry air, fuel and air at 25 °C, 101.325 kPa: chemical
        equilibrium (dissociation; it peaks slightly on the rich side), complete combustion (peaks at φ = 1) and the mean-cp hand estimate
        (dashed). For the conditions of a particular plant, open the φ sweep of a study scenario.
      </p>
      {error && <p className="note bad">The sweep could not be computed: {error}</p>}
      {sweep && (
        <>
          <section className="panel" data-testid="fuel-phi-peaks">
            <p>
              Equilibrium peak:{" "}
              <strong>
                {eq ? `${fmt(kelvinToCelsius(eq.temperatureK), 0)} °C (${fmt(eq.temperatureK, 0)} K) at φ = ${fmt(eq.phi, 3)}` : "–"}
              </strong>
              {" · "}Complete-combustion peak:{" "}
              <strong>{co ? `${fmt(kelvinToCelsius(co.temperatureK), 0)} °C at φ = ${fmt(co.phi, 3)}` : "–"}</strong>
            </p>
            <PhiChart
              unit="°C"
              operatingPhi={null}
              data={sweep.points.map((p) => ({
                phi: p.phi,
                equilibrium: toC(p.equilibriumK),
                complete: toC(p.completeK),
                meanCp: toC(p.meanCpK),
              }))}
              peaks={[
                ...(eq
                  ? [
                      {
                        phi: eq.phi,
                        value: kelvinToCelsius(eq.temperatureK),
                        which: "equilibrium" as const,
                        label: `peak φ = ${fmt(eq.phi, 3)}`,
                      },
                    ]
                  : []),
                ...(co
                  ? [{ phi: co.phi, value: kelvinToCelsius(co.temperatureK), which: "complete" as const, label: `φ = ${fmt(co.phi, 2)}` }]
                  : []),
              ]}
            />
            <p className="basis">
              {sweep.basis}. Methods: equilibrium — {sweep.methods.equilibrium}; complete — {sweep.methods.complete}; hand estimate —{" "}
              {sweep.methods["mean-cp"]}.
            </p>
          </section>
          {failed.length > 0 && (
            <p className="note warn">
              No value at {failed.map((p) => `φ = ${fmt(p.phi, 2)} (${p.errors.join("; ")})`).join(", ")}: no number is shown where a method
              has none.
            </p>
          )}
        </>
      )}
      <section className="panel" aria-label="Cautions">
        <p>Rich flames (φ &gt; 1) make carbon monoxide and unburnt fuel: fired plant runs lean. {DEFER}</p>
        {cautions.map((c) => (
          <p key={c.hazard}>
            <strong>{c.title}.</strong> {c.text}
          </p>
        ))}
      </section>
    </>
  );
}
