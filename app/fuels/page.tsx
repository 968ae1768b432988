import type { Metadata } from "next";
import Link from "next/link";
import { db } from "@/lib/db/client";
import { countFuels, fuelList, type FuelListItem } from "@/lib/services/fuel-views";
import { uiPage, UI_PAGE_SIZE } from "@/lib/services/paging";
import { Pager } from "../_ui/Pager";
import { pageActions } from "../_auth/page-user";
import { FUEL_KINDS } from "@/lib/schemas/library";
import { fmt, fmtUpTo, money } from "../_ui/format";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Fuel library" };

const FILTERS: { kind: string | null; label: string }[] = [
  { kind: null, label: "All fuels" },
  { kind: "gas", label: "Gases" },
  { kind: "liquid", label: "Liquids" },
  { kind: "solid", label: "Solids" },
];

const KIND_GROUPS = [
  { kind: "gas", label: "Gases" },
  { kind: "liquid", label: "Liquids" },
  { kind: "solid", label: "Solids" },
];

function perVolume(f: FuelListItem, which: "hhv" | "lhv"): React.ReactNode {
  const p = f.properties;
  if (!p) return <span className="na">–</span>;
  if (p[which].MJ_per_m3 !== undefined)
    return (
      <>
        {fmt(p[which].MJ_per_m3, 2)} <span className="unit">/m³</span>
      </>
    );
  if (p[which].MJ_per_L !== undefined)
    return (
      <>
        {fmt(p[which].MJ_per_L, 2)} <span className="unit">/L&nbsp;</span>
      </>
    );
  return <span className="na">–</span>;
}

export default async function FuelListPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const sp = await searchParams;
  const kindParam = typeof sp.kind === "string" && (FUEL_KINDS as readonly string[]).includes(sp.kind) ? sp.kind : null;
  const page = uiPage(sp.page);
  const [fuels, total, can] = await Promise.all([
    fuelList(db(), { kind: kindParam ?? undefined, page }),
    countFuels(db(), kindParam ?? undefined),
    pageActions(),
  ]);
  const pager = (
    <Pager path="/fuels" query={kindParam ? { kind: kindParam } : {}} page={page.number} pageSize={UI_PAGE_SIZE} total={total} />
  );
  const anyInvented = fuels.some((f) => f.price?.quote.isInvented);

  return (
    <>
      <div className="page-head">
        <div>
          <h1>Fuel library</h1>
          <p className="lede">
            Every fuel and blend the plant might burn, with the figures a buyer compares: heating values, Wobbe index, CO2 and the delivered
            price in force today, normalised to cost per MWh.
          </p>
        </div>
        <div className="actions">
          {can.createFuel && (
            <Link className="button" href="/fuels/new">
              New fuel or blend
            </Link>
          )}
          <Link className="button secondary" href="/fuels/transfer">
            {can.importLibrary ? "Import / export" : "Export"}
          </Link>
        </div>
      </div>

      <nav className="filters" aria-label="Filter by kind">
        {FILTERS.map((f) => (
          <Link key={f.label} href={f.kind ? `/fuels?kind=${f.kind}` : "/fuels"} aria-current={kindParam === f.kind ? "true" : undefined}>
            {f.label}
          </Link>
        ))}
      </nav>

      <p className="basis">
        Heating values at a 25 °C combustion reference. Gas volumes: real gas at 15 °C and 101.325 kPa (ISO 6976); liquids per litre at 15
        °C. CO2: fossil CO2 per GJ of fuel on the net (LHV) basis. Price: the latest quote in force, delivered (commodity + transport +
        handling), in the quote&apos;s currency.
      </p>
      {anyInvented && (
        <p className="note warn">
          Prices marked <span className="badge invented">invented</span> are demo figures, not market quotes.
        </p>
      )}

      {fuels.length === 0 ? (
        <p className="note">
          No fuels {kindParam ? `of kind “${kindParam}” ` : ""}yet.{" "}
          {can.createFuel && can.importLibrary ? (
            <>
              <Link href="/fuels/new">Add one</Link> or <Link href="/fuels/transfer">import a library file</Link>.
            </>
          ) : (
            "An editor can add fuels or import a library file."
          )}
        </p>
      ) : (
        <div className="table-wrap">
          <table className="library">
            <thead>
              <tr>
                <th rowSpan={2}>Fuel</th>
                <th colSpan={2} className="group">
                  MJ/kg
                </th>
                <th colSpan={2} className="group">
                  MJ per m³ (gas) or per L (liquid)
                </th>
                <th rowSpan={2} className="num">
                  Wobbe index
                  <span className="unit block">gross, MJ/m³</span>
                </th>
                <th rowSpan={2} className="num">
                  Fossil CO2
                  <span className="unit block">kg/GJ net</span>
                </th>
                <th colSpan={2} className="group">
                  Delivered cost per MWh
                </th>
                <th rowSpan={2}>Quote in force</th>
              </tr>
              <tr>
                <th className="num">LHV</th>
                <th className="num">HHV</th>
                <th className="num">LHV</th>
                <th className="num">HHV</th>
                <th className="num">gross (HHV)</th>
                <th className="num">net (LHV)</th>
              </tr>
            </thead>
            {KIND_GROUPS.filter((g) => fuels.some((f) => f.kind === g.kind)).map((g) => (
              <tbody key={g.kind}>
                {!kindParam && (
                  <tr className="group-row">
                    <th colSpan={10}>{g.label}</th>
                  </tr>
                )}
                {fuels
                  .filter((f) => f.kind === g.kind)
                  .map((f) => {
                    const p = f.properties;
                    const n = f.price?.normalised ?? f.estimatedPrice?.normalised;
                    const cur = f.price?.quote.currency ?? f.estimatedPrice?.currency ?? "";
                    return (
                      <tr key={f.id}>
                        <td className="fuel-name">
                          <Link href={`/fuels/${f.id}`}>{f.name}</Link> {f.isBlend && <span className="badge blend">blend</span>}
                          {f.error && <div className="field-error">{f.error}</div>}
                        </td>
                        <td className="num">{fmt(p?.lhv.MJ_per_kg, 2)}</td>
                        <td className="num">{fmt(p?.hhv.MJ_per_kg, 2)}</td>
                        <td className="num">{perVolume(f, "lhv")}</td>
                        <td className="num">{perVolume(f, "hhv")}</td>
                        <td className="num">{p?.wobbe ? fmt(p.wobbe.gross_MJ_per_m3, 2) : <span className="na">–</span>}</td>
                        <td className="num">{fmt(p?.co2.fossil_kg_per_GJ_lhv, 1)}</td>
                        <td className="num">{n ? money(n.perMWh_gross, cur) : <span className="na">–</span>}</td>
                        <td className="num">{n ? money(n.perMWh_net, cur) : <span className="na">–</span>}</td>
                        <td className="quote">
                          {f.price ? (
                            <small>
                              {fmtUpTo(f.price.quote.amount, 4)} {cur}/{f.price.unitLabel}
                              {f.price.quote.transportAdder + f.price.quote.handlingAdder > 0 && " + adders"} · {f.price.quote.validFrom}{" "}
                              {f.price.quote.isInvented && <span className="badge invented">invented</span>}
                              {f.price.error && <span className="field-error"> {f.price.error}</span>}
                            </small>
                          ) : f.estimatedPrice ? (
                            <small>
                              estimated from the components&apos; quotes (mass-weighted){" "}
                              {f.estimatedPrice.isInvented && <span className="badge invented">invented</span>}
                            </small>
                          ) : (
                            <small className="na">no quote</small>
                          )}
                        </td>
                      </tr>
                    );
                  })}
              </tbody>
            ))}
          </table>
        </div>
      )}
      {pager}
    </>
  );
}
