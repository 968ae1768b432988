import type { Metadata } from "next";
import { trashEnabled } from "@/lib/services/mode";
import { History } from "@/app/_ui/History";
import Link from "next/link";
import { notFound } from "next/navigation";
import { db } from "@/lib/db/client";
import { getPlant, plantBaseline } from "@/lib/services/plants";
import { effectiveDefinition, findFuel } from "@/lib/services/fuels";
import { plantName } from "@/lib/services/lookups";
import { cautionsFor, DEFER } from "@/lib/fuels/cautions";
import { EQUIPMENT_TYPE_LABELS } from "@/lib/schemas/plant";
import { fmt, pct } from "../../_ui/format";
import { displayUnits } from "../../studies/_components/units-server";
import { makeDisplay } from "../../studies/_components/display";
import { UnitSwitch } from "../../studies/_components/UnitSwitch";
import { CheckTable } from "../../studies/_components/Checks";
import { Cautions } from "../../studies/_components/Cautions";
import { DeleteButton } from "@/app/_ui/DeleteButton";
import { PlantLimitsTable } from "../_components/PlantLimits";
import { pageActions } from "@/app/_auth/page-user";

export const dynamic = "force-dynamic";

type Props = { params: Promise<{ id: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const id = Number((await params).id);
  const name = Number.isInteger(id) && id > 0 ? await plantName(db(), id) : null;
  return { title: name ?? "Plant" };
}

export default async function PlantPage({ params }: Props) {
  const id = Number((await params).id);
  const rec = Number.isInteger(id) && id > 0 ? await getPlant(db(), id) : null;
  if (!rec) notFound();
  const [units, base, fuelRow, can] = await Promise.all([
    displayUnits(),
    plantBaseline(db(), id),
    rec.baselineFuelId ? findFuel(db(), rec.baselineFuelId) : null,
    pageActions(),
  ]);
  const d = makeDisplay(units, "");
  const p = rec.plant;
  const cautions = fuelRow ? cautionsFor(effectiveDefinition(fuelRow)).filter((c) => c.hazard !== "burner-change") : [];
  const b = base?.ok ? base.value : null;

  return (
    <>
      <div className="crumbs">
        <Link href="/plants">Plants</Link> / {p.name}
      </div>
      <div className="page-head">
        <div>
          <h1>
            {p.name} {rec.isDemo && <span className="badge demo">demo</span>}
          </h1>
          <p className="lede">
            {EQUIPMENT_TYPE_LABELS[p.equipmentType]}
            {p.site ? ` at ${p.site}` : ""}, burning {rec.baselineFuelName ?? "no fuel chosen"} today.
          </p>
          {p.notes && <p style={{ maxWidth: "80ch" }}>{p.notes}</p>}
        </div>
        <div className="actions">
          {can.createStudy && (
            <Link className="button" href={`/studies/new?plant=${rec.id}`}>
              New study for this plant
            </Link>
          )}
          {can.editPlant && (
            <Link className="button secondary" href={`/plants/${rec.id}/edit`}>
              Edit plant
            </Link>
          )}
          {can.deletePlant && (
            <DeleteButton
              url={`/api/plants/${rec.id}`}
              after="/plants"
              label="Delete plant"
              confirmText={
                trashEnabled() ? `Move the plant “${p.name}” to the trash?` : `Delete the plant “${p.name}”? This cannot be undone.`
              }
            />
          )}
        </div>
      </div>
      <UnitSwitch units={units} />

      <div className="grid2" style={{ marginTop: "1rem" }}>
        <section className="panel">
          <h2 style={{ marginTop: 0 }}>Duty and operating point</h2>
          <table className="kv">
            <tbody>
              <tr>
                <th>Rated heat input</th>
                <td className="num">
                  {fmt(p.ratedInput_kW, 0)} kW ({p.ratedInputBasis === "net" ? "net, LHV" : "gross, HHV"})
                </td>
              </tr>
              <tr>
                <th>Annual useful heat</th>
                <td className="num">
                  {p.annualUsefulHeat_MWh != null ? (
                    <>
                      {d.energy(p.annualUsefulHeat_MWh)} {d.energyUnit} (given)
                    </>
                  ) : b ? (
                    <>
                      {d.energy(b.duty.annualUseful_MWh)} {d.energyUnit}{" "}
                      <span className="unit">
                        ({fmt(p.operatingHours, 0)} h × {fmt(p.averageLoadFraction, 2)} load)
                      </span>
                    </>
                  ) : (
                    `${fmt(p.operatingHours, 0)} h × ${fmt(p.averageLoadFraction, 2)} load`
                  )}
                </td>
              </tr>
              <tr>
                <th>Stack temperature</th>
                <td className="num">
                  {d.temp(p.stackTemperatureC)} {d.tempUnit}
                </td>
              </tr>
              <tr>
                <th>Flue-gas O2</th>
                <td className="num">{fmt(p.flueO2DryPercent, 1)} vol % dry</td>
              </tr>
              <tr>
                <th>Combustion air</th>
                <td className="num">
                  {d.temp(p.combustionAirC)} {d.tempUnit}; ambient {d.temp(p.ambientAir.temperatureC)} {d.tempUnit},{" "}
                  {fmt(p.ambientAir.relativeHumidityPercent, 0)} % RH
                </td>
              </tr>
              <tr>
                <th>Radiation and casing loss</th>
                <td className="num">{fmt(p.radiationLossPercent, 1)} % of input</td>
              </tr>
              <tr>
                <th>Condensing</th>
                <td className="num">
                  {p.condensing ? (
                    <>
                      yes, return water {d.temp(p.returnWaterC)} {d.tempUnit}
                    </>
                  ) : (
                    "no"
                  )}
                </td>
              </tr>
            </tbody>
          </table>
        </section>

        <section className="panel">
          <h2 style={{ marginTop: 0 }}>Limits</h2>
          <PlantLimitsTable p={p} d={d} />
        </section>
      </div>

      <h2>Today on {rec.baselineFuelName ?? "its baseline fuel"}</h2>
      {!base && <p className="note">Choose the fuel the plant burns today to see its efficiency and flows.</p>}
      {base && !base.ok && <p className="note bad">The plant cannot be evaluated on its baseline fuel: {base.message}</p>}
      {b && (
        <>
          <p className="basis">
            Heat-loss method at the plant&apos;s operating point; efficiencies on the gross (HHV) and net (LHV) basis, 25 °C reference.
            Flows at rated duty. {b.baseline.efficiency.basis}.
          </p>
          <div className="kv-grid">
            <table className="kv">
              <tbody>
                <tr>
                  <th>Efficiency, net (LHV)</th>
                  <td className="num">{pct(b.baseline.efficiency.net, 1)}</td>
                </tr>
                <tr>
                  <th>Efficiency, gross (HHV)</th>
                  <td className="num">{pct(b.baseline.efficiency.gross, 1)}</td>
                </tr>
                <tr>
                  <th>Useful heat at rated input</th>
                  <td className="num">{fmt(b.duty.ratedUseful_kW, 0)} kW</td>
                </tr>
                <tr>
                  <th>Full-load hours</th>
                  <td className="num">{fmt(b.duty.fullLoadHours, 0)} h/yr</td>
                </tr>
              </tbody>
            </table>
            <table className="kv">
              <tbody>
                <tr>
                  <th>Flame temperature</th>
                  <td className="num">
                    {b.baseline.flame ? `${d.temp(b.baseline.flame.temperatureC)} ${d.tempUnit}` : "–"}{" "}
                    <span className="unit">(equilibrium)</span>
                  </td>
                </tr>
                <tr>
                  <th>Water dew point</th>
                  <td className="num">
                    {b.baseline.efficiency.dewPointC !== null ? `${d.temp(b.baseline.efficiency.dewPointC, 1)} ${d.tempUnit}` : "–"}
                  </td>
                </tr>
                <tr>
                  <th>Fuel flow</th>
                  <td className="num">
                    {b.baseline.ratedFlows.fuelVolume_per_h
                      ? `${d.vol(b.baseline.ratedFlows.fuelVolume_per_h.value, b.baseline.ratedFlows.fuelVolume_per_h.value < 10 ? 2 : 0)} ${d.volUnit}/h`
                      : `${fmt(b.baseline.ratedFlows.fuel_kg_per_h, 0)} kg/h`}
                    {b.baseline.ratedFlows.fuelVolume_per_h && <div className="unit">{b.baseline.ratedFlows.fuelVolume_per_h.basis}</div>}
                  </td>
                </tr>
                <tr>
                  <th>Flue gas</th>
                  <td className="num">
                    {d.vol(b.baseline.ratedFlows.flueGas_m3_per_h_actual)} {d.volUnit}/h actual ·{" "}
                    {d.vol(b.baseline.ratedFlows.flueGas_m3_per_h_normal)} {d.volUnit}/h at 0 °C
                  </td>
                </tr>
              </tbody>
            </table>
          </div>
          <h3>The baseline against the plant&apos;s own limits</h3>
          <CheckTable checks={b.baseline.checks} d={d} />
        </>
      )}

      <h2>Studies</h2>
      {rec.studies.length === 0 ? (
        <p>
          No study yet.{" "}
          {can.createStudy ? (
            <>
              <Link href={`/studies/new?plant=${rec.id}`}>Start one</Link> to compare candidate fuels for this plant.
            </>
          ) : (
            "An editor can start one to compare candidate fuels for this plant."
          )}
        </p>
      ) : (
        <ul>
          {rec.studies.map((s) => (
            <li key={s.id}>
              <Link href={`/studies/${s.id}`}>{s.name}</Link> <span className="muted">({Math.max(s.scenarioCount - 1, 0)} candidates)</span>
            </li>
          ))}
        </ul>
      )}
      {cautions.length > 0 && <Cautions items={cautions} screening={DEFER} />}
      <History type="plant" id={rec.id} />
    </>
  );
}
