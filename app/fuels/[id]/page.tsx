import type { Metadata } from "next";
import { trashEnabled } from "@/lib/services/mode";
import { History } from "@/app/_ui/History";
import Link from "next/link";
import { notFound } from "next/navigation";
import { db } from "@/lib/db/client";
import { fuelSheet, type FuelSheet } from "@/lib/services/fuel-views";
import { fuelName } from "@/lib/services/lookups";
import { COMBUSTION_REFERENCES_C, METERING_REFERENCES_C, type FuelDefinition } from "@/lib/schemas/fuel";
import { LIQUID_COMPOUNDS } from "@/lib/fuels/compounds";
import { SPECIES } from "@/lib/thermo/species-data";
import { kelvinToCelsius } from "@/lib/units/constants";
import { fmt, fmtUpTo, pct } from "../../_ui/format";
import { DeleteButton } from "@/app/_ui/DeleteButton";
import { PriceHistory } from "../_components/PriceHistory";
import { pageActions } from "@/app/_auth/page-user";
import { QuoteComparison } from "../_components/QuoteComparison";
import { meteringLabel, meteringReferenceAtC } from "@/lib/units/metering";

export const dynamic = "force-dynamic";

type Props = { params: Promise<{ id: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> };

function pickRef(value: string | string[] | undefined, allowed: readonly number[], fallback: number): number {
  const n = typeof value === "string" ? Number(value) : NaN;
  return allowed.includes(n) ? n : fallback;
}

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const id = Number((await params).id);
  const name = Number.isInteger(id) && id > 0 ? await fuelName(db(), id) : null;
  return { title: name ?? "Fuel" };
}

function speciesName(key: string): string {
  return SPECIES[key]?.name ?? key;
}

function Definition({ sheet }: { sheet: FuelSheet }) {
  const def = sheet.definition as FuelDefinition;
  if ("composition" in def) {
    const rows = Object.entries(def.composition).sort((a, b) => b[1] - a[1]);
    return (
      <>
        <p className="basis">Gas by mole fractions.</p>
        <div className="table-wrap">
          <table>
            <thead>
              <tr>
                <th>Component</th>
                <th className="num">Mole fraction</th>
                <th className="num">mol %</th>
              </tr>
            </thead>
            <tbody>
              {rows.map(([k, v]) => (
                <tr key={k}>
                  <td>
                    {speciesName(k)} <span className="mono muted">{k}</span>
                  </td>
                  <td className="num">{fmtUpTo(v, 6)}</td>
                  <td className="num">{fmt(v * 100, 2)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </>
    );
  }
  if ("compound" in def) {
    const c = def.phase === "liquid" ? LIQUID_COMPOUNDS[def.compound] : undefined;
    return (
      <dl className="def-list">
        <dt>Compound</dt>
        <dd>
          {c ? c.name : speciesName(def.compound)} <span className="mono muted">{def.compound}</span>
        </dd>
        <dt>Phase as fired</dt>
        <dd>{def.phase}</dd>
        {c && (
          <>
            <dt>Role</dt>
            <dd>{c.role}</dd>
          </>
        )}
      </dl>
    );
  }
  if ("ultimate" in def) {
    const u = def.ultimate;
    const hv =
      def.hhv_MJ_per_kg !== undefined
        ? `measured gross (HHV) ${fmtUpTo(def.hhv_MJ_per_kg, 3)} MJ/kg as received`
        : def.lhv_MJ_per_kg !== undefined
          ? `measured net (LHV) ${fmtUpTo(def.lhv_MJ_per_kg, 3)} MJ/kg as received`
          : "Channiwala & Parikh (2002) correlation";
    return (
      <>
        <p className="basis">
          Ultimate analysis, mass fractions as received ({def.kind ?? "solid"}). Heating value: {hv}.
        </p>
        <div className="table-wrap">
          <table>
            <thead>
              <tr>
                {(["C", "H", "O", "N", "S", "moisture", "ash"] as const).map((k) => (
                  <th key={k} className="num">
                    {k}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              <tr>
                {(["C", "H", "O", "N", "S", "moisture", "ash"] as const).map((k) => (
                  <td key={k} className="num">
                    {pct(u[k] ?? 0, 2)}
                  </td>
                ))}
              </tr>
            </tbody>
          </table>
        </div>
      </>
    );
  }
  return (
    <>
      <p className="basis">
        Blend of stored fuels by {sheet.components[0]?.basis ?? "volume"} share
        {sheet.components[0]?.basis === "energy" ? " (net basis)" : ""}.
      </p>
      <div className="table-wrap">
        <table>
          <thead>
            <tr>
              <th>Component</th>
              <th className="num">Share</th>
            </tr>
          </thead>
          <tbody>
            {sheet.components.map((c) => (
              <tr key={c.id}>
                <td>
                  <Link href={`/fuels/${c.component.id}`}>{c.component.name}</Link>
                </td>
                <td className="num">{pct(c.share, 1)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </>
  );
}

function KV({ rows }: { rows: [React.ReactNode, number | null | undefined, string, number?][] }) {
  return (
    <table className="kv">
      <tbody>
        {rows
          .filter((r) => r[1] !== undefined)
          .map(([label, value, unit, digits], i) => (
            <tr key={i}>
              <th scope="row">{label}</th>
              <td className="num">
                {value === null ? <span className="na">–</span> : fmt(value, digits ?? 2)} <span className="unit">{unit}</span>
              </td>
            </tr>
          ))}
      </tbody>
    </table>
  );
}

export default async function FuelSheetPage({ params, searchParams }: Props) {
  const id = Number((await params).id);
  if (!Number.isInteger(id) || id <= 0) notFound();
  const sp = await searchParams;
  const tc = pickRef(sp.tc, COMBUSTION_REFERENCES_C, 25);
  const tm = pickRef(sp.tm, METERING_REFERENCES_C, 15);
  const [sheet, can] = await Promise.all([fuelSheet(db(), id, { combustionReferenceC: tc, meteringReferenceC: tm }), pageActions()]);
  if (!sheet) notFound();
  const { fuel, properties: p } = sheet;
  const gas = fuel.kind === "gas";
  const liquid = fuel.kind === "liquid";

  return (
    <>
      <div className="crumbs">
        <Link href="/fuels">Fuel library</Link> › {fuel.name}
      </div>
      <div className="page-head">
        <div>
          <h1>
            {fuel.name} <span className={`badge kind-${fuel.kind}`}>{fuel.kind}</span>{" "}
            {sheet.isBlend && <span className="badge blend">blend</span>} {fuel.isDemo && <span className="badge demo">demo data</span>}
          </h1>
          {fuel.notes && <p className="lede">{fuel.notes}</p>}
          {fuel.source && <p className="basis">Source: {fuel.source}</p>}
        </div>
        <div className="actions no-print">
          {can.editFuel && (
            <Link className="button secondary" href={`/fuels/${fuel.id}/edit`}>
              Edit fuel
            </Link>
          )}
          {can.deleteFuel && (
            <DeleteButton
              url={`/api/fuels/${fuel.id}`}
              after="/fuels"
              label="Delete fuel"
              confirmText={
                trashEnabled() ? `Move “${fuel.name}” to the trash?` : `Delete “${fuel.name}” and its price history? This cannot be undone.`
              }
            />
          )}
        </div>
      </div>

      {sheet.error && (
        <p className="note bad" role="alert">
          The properties of this fuel could not be computed: {sheet.error}
        </p>
      )}

      <div className="grid2">
        <section>
          <h2>Definition</h2>
          <Definition sheet={sheet} />
          <dl className="def-list" style={{ marginTop: "0.75rem" }}>
            <dt>Biogenic carbon share</dt>
            <dd>
              {pct(fuel.biogenicCarbonShare, 0)}
              {sheet.isBlend && <span className="muted"> (from the components)</span>}
            </dd>
            {fuel.densityKgPerM3 !== null && (
              <>
                <dt>{fuel.kind === "solid" ? "Bulk density" : "Density (15 °C)"}</dt>
                <dd>{fmtUpTo(fuel.densityKgPerM3, 2)} kg/m³</dd>
              </>
            )}
            <dt>Upstream CO2e</dt>
            <dd>
              {fuel.upstreamCo2e_kg_per_GJ === null ? (
                <span className="na">not stated</span>
              ) : (
                `${fmtUpTo(fuel.upstreamCo2e_kg_per_GJ, 2)} kg/GJ (net)`
              )}
            </dd>
            {sheet.usedInBlends.length > 0 && (
              <>
                <dt>Used in blends</dt>
                <dd>
                  {sheet.usedInBlends.map((b, i) => (
                    <span key={b.id}>
                      {i > 0 && ", "}
                      <Link href={`/fuels/${b.id}`}>{b.name}</Link>
                    </span>
                  ))}
                </dd>
              </>
            )}
          </dl>
        </section>

        <section>
          <h2>Safety cautions</h2>
          <p className="basis">{sheet.cautionPreamble}</p>
          <div className="cautions" style={{ gridTemplateColumns: "1fr" }}>
            {sheet.cautions.map((c) => (
              <div className="caution" key={c.hazard + c.title}>
                <h3>{c.title}</h3>
                <p>{c.text}</p>
              </div>
            ))}
          </div>
        </section>
      </div>

      {p && (
        <>
          <h2>Heating values</h2>
          <form className="row no-print" method="get" style={{ alignItems: "flex-end", margin: "0.5rem 0" }}>
            <div className="field" style={{ flex: "0 0 auto" }}>
              <label htmlFor="tc">Combustion reference</label>
              <select id="tc" name="tc" defaultValue={String(tc)}>
                {COMBUSTION_REFERENCES_C.map((t) => (
                  <option key={t} value={t}>
                    {t} °C
                  </option>
                ))}
              </select>
            </div>
            {gas && (
              <div className="field" style={{ flex: "0 0 auto" }}>
                <label htmlFor="tm">Metering reference (101.325 kPa)</label>
                <select id="tm" name="tm" defaultValue={String(tm)}>
                  {METERING_REFERENCES_C.map((t) => (
                    <option key={t} value={t}>
                      {meteringReferenceAtC(t)?.key === "60F" ? `${t} °C (60 °F)` : meteringLabel(t)}
                    </option>
                  ))}
                </select>
              </div>
            )}
            <button type="submit" className="secondary">
              Show
            </button>
          </form>
          <p className="basis">
            Combustion reference {p.reference.combustionReferenceC} °C. {gas || liquid ? `Volumes: ${p.reference.volumetricBasis}.` : ""}{" "}
            Air: {p.reference.airBasis}.
          </p>
          <div className="table-wrap">
            <table>
              <thead>
                <tr>
                  <th>Basis</th>
                  <th className="num">
                    <span className="unit">MJ/kg</span>
                  </th>
                  <th className="num">
                    <span className="unit">kWh/kg</span>
                  </th>
                  {p.hhv.kJ_per_mol !== undefined && (
                    <th className="num">
                      <span className="unit">kJ/mol</span>
                    </th>
                  )}
                  {gas && (
                    <th className="num">
                      <span className="unit">MJ/m³ at {meteringLabel(tm)}</span>
                    </th>
                  )}
                  {p.hhv.MJ_per_L !== undefined && (
                    <th className="num">
                      <span className="unit">MJ/L</span>
                    </th>
                  )}
                  <th className="num">
                    <span className="unit">MJ per kg O2</span>
                  </th>
                  <th className="num">
                    <span className="unit">kJ per mol O2</span>
                  </th>
                  <th className="num">
                    <span className="unit">MJ per m³ stoich. air</span>
                  </th>
                </tr>
              </thead>
              <tbody>
                {(["hhv", "lhv"] as const).map((k) => (
                  <tr key={k}>
                    <th scope="row">{k === "hhv" ? "Gross (HHV)" : "Net (LHV)"}</th>
                    <td className="num">{fmt(p[k].MJ_per_kg, 3)}</td>
                    <td className="num">{fmt(p[k].kWh_per_kg, 3)}</td>
                    {p.hhv.kJ_per_mol !== undefined && <td className="num">{fmt(p[k].kJ_per_mol, 2)}</td>}
                    {gas && <td className="num">{fmt(p[k].MJ_per_m3, 3)}</td>}
                    {p.hhv.MJ_per_L !== undefined && <td className="num">{fmt(p[k].MJ_per_L, 3)}</td>}
                    <td className="num">{fmt(p[k].MJ_per_kg_O2, 2)}</td>
                    <td className="num">{fmt(p[k].kJ_per_mol_O2, 1)}</td>
                    <td className="num">{fmt(p[k].MJ_per_m3_air, 3)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>

          <div className="grid2">
            <section>
              <h2>{gas ? "Interchangeability" : "Physical data"}</h2>
              {gas && (
                <p className="basis">
                  Real gas at {meteringLabel(tm)}, 101.325 kPa (ISO 6976:2016); Wobbe index at the combustion reference above.
                </p>
              )}
              <KV
                rows={[
                  ["Molar mass", p.molarMass_g_per_mol, "g/mol", 3],
                  [
                    "Density",
                    gas ? p.gasDensity_kg_per_m3 : (p.density_kg_per_m3 ?? null),
                    gas ? "kg/m³" : fuel.kind === "solid" ? "kg/m³ (bulk)" : "kg/m³ (15 °C)",
                    gas ? 4 : 1,
                  ],
                  ["Relative density (air = 1)", p.relativeDensity, "", 4],
                  ["Compression factor Z", p.compressionFactor, "", 5],
                  ["Wobbe index, gross", p.wobbe?.gross_MJ_per_m3, "MJ/m³", 2],
                  ["Wobbe index, net", p.wobbe?.net_MJ_per_m3, "MJ/m³", 2],
                  ["Hydrogen", gas ? p.h2MoleFraction * 100 : undefined, "mol %", 1],
                ]}
              />
            </section>
            <section>
              <h2>Stoichiometry</h2>
              <p className="basis">Complete combustion in dry air; air volumes at {meteringLabel(tm)}, 101.325 kPa.</p>
              <KV
                rows={[
                  ["Air, mass per kg fuel", p.stoichiometricAir.kg_per_kg, "kg/kg", 3],
                  ["Air, volume per kg fuel", p.stoichiometricAir.m3_per_kg, "m³/kg", 3],
                  ["Air, volume per m³ fuel", p.stoichiometricAir.m3_per_m3, "m³/m³", 3],
                  ["Air, moles per mole fuel", p.stoichiometricAir.mol_per_mol, "mol/mol", 3],
                  ["O2, mass per kg fuel", p.stoichiometricO2.kg_per_kg, "kg/kg", 3],
                  ["O2, moles per kg fuel", p.stoichiometricO2.mol_per_kg, "mol/kg", 2],
                ]}
              />
            </section>
            <section>
              <h2>Flue gas</h2>
              <p className="basis">{p.reference.flueGasVolumeBasis}.</p>
              <KV
                rows={[
                  ["Wet volume per MJ (net)", p.flueGas.wet_m3_per_MJ_lhv, "m³/MJ", 4],
                  ["Wet volume per MJ (gross)", p.flueGas.wet_m3_per_MJ_hhv, "m³/MJ", 4],
                  ["Dry volume per MJ (net)", p.flueGas.dry_m3_per_MJ_lhv, "m³/MJ", 4],
                  ["Dry volume per MJ (gross)", p.flueGas.dry_m3_per_MJ_hhv, "m³/MJ", 4],
                  ["Mass per MJ (net)", p.flueGas.mass_kg_per_MJ_lhv, "kg/MJ", 4],
                  ["Mass per MJ (gross)", p.flueGas.mass_kg_per_MJ_hhv, "kg/MJ", 4],
                  ["Wet volume per kg fuel", p.flueGas.wet_m3_per_kg, "m³/kg", 3],
                  ["CO2max, dry", p.flueGas.co2max_dry_percent, "vol %", 2],
                  ["Water vapour, wet", p.flueGas.water_wet_percent, "vol %", 2],
                  ["Water dew point", p.flueGas.dewPoint_C, "°C", 1],
                  ...(p.flueGas.acidDewPoint_C !== null
                    ? [
                        ["Acid dew point (2 % of SO2 as SO3; Verhoff & Banchero)", p.flueGas.acidDewPoint_C, "°C", 0] as [
                          string,
                          number,
                          string,
                          number,
                        ],
                      ]
                    : []),
                ]}
              />
            </section>
            <section>
              <h2>CO2 from the fuel&apos;s carbon</h2>
              <p className="basis">Complete oxidation of the carbon; biogenic carbon share {pct(p.biogenicCarbonShare, 0)}.</p>
              <table className="kv">
                <thead>
                  <tr>
                    <th></th>
                    <th className="num">
                      <span className="unit">kg/GJ gross (HHV)</span>
                    </th>
                    <th className="num">
                      <span className="unit">kg/GJ net (LHV)</span>
                    </th>
                  </tr>
                </thead>
                <tbody>
                  <tr>
                    <th scope="row">Total</th>
                    <td className="num">{fmt(p.co2.kg_per_GJ_hhv, 1)}</td>
                    <td className="num">{fmt(p.co2.kg_per_GJ_lhv, 1)}</td>
                  </tr>
                  <tr>
                    <th scope="row">Fossil</th>
                    <td className="num">{fmt(p.co2.fossil_kg_per_GJ_hhv, 1)}</td>
                    <td className="num">{fmt(p.co2.fossil_kg_per_GJ_lhv, 1)}</td>
                  </tr>
                  <tr>
                    <th scope="row">Biogenic</th>
                    <td className="num">{fmt(p.co2.biogenic_kg_per_GJ_hhv, 1)}</td>
                    <td className="num">{fmt(p.co2.biogenic_kg_per_GJ_lhv, 1)}</td>
                  </tr>
                  <tr>
                    <th scope="row">Upstream CO2e (stated)</th>
                    <td className="num na">–</td>
                    <td className="num">
                      {p.co2.upstreamCo2e_kg_per_GJ_lhv !== undefined ? (
                        fmt(p.co2.upstreamCo2e_kg_per_GJ_lhv, 1)
                      ) : (
                        <span className="na">–</span>
                      )}
                    </td>
                  </tr>
                  <tr>
                    <th scope="row">CO2 per kg fuel</th>
                    <td className="num" colSpan={2}>
                      {fmt(p.co2.kg_per_kg, 3)} <span className="unit">kg/kg</span>
                    </td>
                  </tr>
                </tbody>
              </table>
            </section>
          </div>

          <h2>Adiabatic flame temperature in air</h2>
          <p className="basis">
            Fuel and dry air at 25 °C, 101.325 kPa. Three methods, each labelled; they differ by design (dissociation lowers the equilibrium
            value). <Link href={`/fuels/${fuel.id}/phi`}>Flame temperature against φ (lean to rich) →</Link>
          </p>
          <div className="table-wrap">
            <table>
              <thead>
                <tr>
                  <th>Condition</th>
                  <th>Method</th>
                  <th className="num">
                    <span className="unit">°C</span>
                  </th>
                  <th className="num">
                    <span className="unit">K</span>
                  </th>
                </tr>
              </thead>
              <tbody>
                {sheet.flame.map((r, i) => (
                  <tr key={i}>
                    <td>{i % 3 === 0 ? r.condition : ""}</td>
                    <td>
                      <strong>{r.method}</strong> <small className="muted method-label">— {r.methodLabel}</small>
                    </td>
                    {r.temperatureK === null ? (
                      <td colSpan={2} className="field-error">
                        not computed: {r.error}
                      </td>
                    ) : (
                      <>
                        <td className="num">{fmt(kelvinToCelsius(r.temperatureK), 0)}</td>
                        <td className="num">{fmt(r.temperatureK, 0)}</td>
                      </>
                    )}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </>
      )}

      <h2 id="prices">Prices</h2>
      <h3>Current quotes side by side</h3>
      <QuoteComparison
        fuelId={fuel.id}
        carbon={typeof sp.carbon === "string" ? sp.carbon : undefined}
        currency={typeof sp.currency === "string" ? sp.currency : undefined}
      />
      <h3>Price history</h3>
      <PriceHistory fuelId={fuel.id} fuelKind={fuel.kind} prices={sheet.prices} canEdit={can.editQuotes} />

      <History type="fuel" id={fuel.id} />

      {sheet.resolved && (
        <>
          <h2>Method notes</h2>
          <ul className="muted" style={{ fontSize: "0.88rem" }}>
            {[...new Set([...(sheet.resolved.notes ?? []), ...(p?.notes ?? [])])].map((n, i) => (
              <li key={i}>{n}</li>
            ))}
          </ul>
        </>
      )}
    </>
  );
}
