import type { Metadata } from "next";
import Link from "next/link";
import { db } from "@/lib/db/client";
import { countPlants, listPlants } from "@/lib/services/plants";
import { uiPage, UI_PAGE_SIZE } from "@/lib/services/paging";
import { Pager } from "../_ui/Pager";
import { pageActions } from "../_auth/page-user";
import { EQUIPMENT_TYPE_LABELS } from "@/lib/schemas/plant";
import { fmt } from "../_ui/format";
import { displayUnits } from "../studies/_components/units-server";
import { makeDisplay } from "../studies/_components/display";
import { UnitSwitch } from "../studies/_components/UnitSwitch";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Plants" };

export default async function PlantsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const page = uiPage((await searchParams).page);
  const [plants, total, units, can] = await Promise.all([listPlants(db(), page), countPlants(db()), displayUnits(), pageActions()]);
  const d = makeDisplay(units, "");
  return (
    <>
      <div className="page-head">
        <div>
          <h1>Plants</h1>
          <p className="lede">
            The fired units a fuel must suit: their duty, operating point and the limits every candidate fuel is checked against — Wobbe
            band, flame-temperature rise, fan and supply capacities, the burner maker&apos;s hydrogen limit.
          </p>
        </div>
        <div className="actions">
          {can.createPlant && (
            <Link className="button" href="/plants/new">
              New plant
            </Link>
          )}
        </div>
      </div>
      <UnitSwitch units={units} groups={["temperature"]} />
      {plants.length === 0 ? (
        <p className="note">
          No plants yet.{" "}
          {can.createPlant ? <Link href="/plants/new">Describe your first plant</Link> : "An editor can describe the first plant"}.
        </p>
      ) : (
        <div className="table-wrap" style={{ marginTop: "0.75rem" }}>
          <table>
            <thead>
              <tr>
                <th>Plant</th>
                <th>Equipment</th>
                <th>Fuel today</th>
                <th className="num">
                  Rated input <span className="unit">kW</span>
                </th>
                <th className="num">
                  Stack <span className="unit">{d.tempUnit}</span>
                </th>
                <th className="num">
                  Max H2 <span className="unit">vol %</span>
                </th>
                <th>Studies</th>
              </tr>
            </thead>
            <tbody>
              {plants.map((p) => (
                <tr key={p.id}>
                  <td>
                    <Link href={`/plants/${p.id}`}>{p.plant.name}</Link> {p.isDemo && <span className="badge demo">demo</span>}
                    {p.plant.site && (
                      <div className="muted" style={{ fontSize: "0.85rem" }}>
                        {p.plant.site}
                      </div>
                    )}
                  </td>
                  <td>{EQUIPMENT_TYPE_LABELS[p.plant.equipmentType]}</td>
                  <td>{p.baselineFuelName ?? <span className="na">–</span>}</td>
                  <td className="num">
                    {fmt(p.plant.ratedInput_kW, 0)} <span className="unit">({p.plant.ratedInputBasis})</span>
                  </td>
                  <td className="num">{d.temp(p.plant.stackTemperatureC)}</td>
                  <td className="num">
                    {p.plant.maxH2SharePercent != null ? fmt(p.plant.maxH2SharePercent, 0) : <span className="na">not set</span>}
                  </td>
                  <td>
                    {p.studies.length === 0 ? (
                      can.createStudy ? (
                        <Link href={`/studies/new?plant=${p.id}`}>start a study</Link>
                      ) : (
                        <span className="muted">none yet</span>
                      )
                    ) : (
                      p.studies.map((s, i) => (
                        <span key={s.id}>
                          {i > 0 && ", "}
                          <Link href={`/studies/${s.id}`}>{s.name}</Link>
                        </span>
                      ))
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      <Pager path="/plants" page={page.number} pageSize={UI_PAGE_SIZE} total={total} />
    </>
  );
}
