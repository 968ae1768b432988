import Link from "next/link";
import { db } from "@/lib/db/client";
import { countFuelsAndQuotes, plantsOverview } from "@/lib/services/lookups";
import { countPlants } from "@/lib/services/plants";

/** Plants the home page lists; the rest are on /plants. */
const HOME_PLANTS = 20;
import { EQUIPMENT_TYPE_LABELS, type EquipmentType } from "@/lib/schemas/plant";
import { fmt } from "./_ui/format";
import { pageActions } from "./_auth/page-user";

export const dynamic = "force-dynamic";

export default async function HomePage() {
  const [{ fuels: fuelCount, quotes: quoteCount }, plants, plantCount, can] = await Promise.all([
    countFuelsAndQuotes(db()),
    plantsOverview(db(), HOME_PLANTS),
    countPlants(db()),
    pageActions(),
  ]);
  return (
    <>
      <h1>Stoke</h1>
      <p className="lede" style={{ fontSize: "1.05rem", color: "var(--ink)" }}>
        Stoke helps plant managers, energy engineers, buyers and consultants decide whether a fired unit — a steam or hot-water boiler,
        thermal-oil heater, furnace, kiln or dryer — should switch fuel: which fuel or blend, at what share, is feasible for the equipment
        and cheapest per unit of useful heat, and what it does to CO2.
      </p>

      <div className="grid2" style={{ marginTop: "1.25rem" }}>
        <section className="panel">
          <h2 style={{ marginTop: 0 }}>Fuel library</h2>
          <p>
            {fuelCount} fuels and blends with {quoteCount} price quotes. Heating values on every basis, Wobbe index, flue gas, flame
            temperature, CO2 and delivered cost per MWh from quotes in any unit.
          </p>
          <p className="row">
            <Link className="button" href="/fuels">
              Open the fuel library
            </Link>
            {can.createFuel && (
              <Link className="button secondary" href="/fuels/new">
                Add a fuel
              </Link>
            )}
          </p>
        </section>
        <section className="panel">
          <h2 style={{ marginTop: 0 }}>Plants in this database</h2>
          {plants.length === 0 ? (
            <p className="muted">No plant profiles yet.</p>
          ) : (
            <table className="kv">
              <tbody>
                {plants.map((p) => (
                  <tr key={p.id}>
                    <th scope="row">
                      {p.name}
                      {p.isDemo && (
                        <>
                          {" "}
                          <span className="badge demo">demo</span>
                        </>
                      )}
                    </th>
                    <td>
                      {EQUIPMENT_TYPE_LABELS[p.equipmentType as EquipmentType] ?? p.equipmentType}, {fmt(p.ratedInput_kW / 1000, 1)} MW
                      input
                      {p.baselineFuel && (
                        <>
                          , on <Link href={`/fuels/${p.baselineFuel.id}`}>{p.baselineFuel.name}</Link>
                        </>
                      )}
                      {p.studies.length > 0 && <div className="muted">Studies: {p.studies.map((s) => s.name).join("; ")}</div>}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
          {plantCount > plants.length && (
            <p className="muted">
              The first {plants.length} of {plantCount}: <Link href="/plants">all plants</Link>.
            </p>
          )}
          {plants.some((p) => p.isDemo) && (
            <p className="basis">The demo site{plants[0]?.site ? ` — ${plants[0].site}` : ""} — and all its prices are invented.</p>
          )}
        </section>
      </div>
    </>
  );
}
