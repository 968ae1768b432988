/**
 * The fuel's current quotes side by side, one per supplier, normalised to delivered cost per MWh
 * of fuel (gross and net) with and without the carbon cost at a carbon price the user sets here.
 */
import { db } from "@/lib/db/client";
import { quoteComparison } from "@/lib/services/fuel-views";
import { isCurrencyCode } from "@/lib/schemas/currencies";
import { fmtUpTo, money } from "../../_ui/format";

export async function QuoteComparison({
  fuelId,
  carbon,
  currency,
}: {
  fuelId: number;
  carbon: string | undefined;
  currency: string | undefined;
}) {
  const carbonPrice = carbon !== undefined && /^\d+(\.\d+)?$/.test(carbon) ? Number(carbon) : undefined;
  const cur = currency && isCurrencyCode(currency.toUpperCase()) ? currency.toUpperCase() : undefined;
  const c = await quoteComparison(db(), fuelId, { carbonPrice_per_t: carbonPrice, currency: cur });
  if (!c || c.rows.length === 0) return <p className="muted">No current quote to compare.</p>;
  return (
    <section aria-label="Current quotes side by side" data-testid="quote-comparison">
      <form method="get" className="row no-print" style={{ alignItems: "end", gap: "0.75rem" }}>
        <label>
          Carbon price per t CO2
          <input name="carbon" inputMode="decimal" className="num" defaultValue={c.carbonPrice_per_t} style={{ width: "7rem" }} />
        </label>
        <label>
          Compare in
          <input name="currency" defaultValue={c.currency} maxLength={3} style={{ width: "4rem", textTransform: "uppercase" }} />
        </label>
        <button type="submit" className="secondary">
          Compare
        </button>
      </form>
      <p className="basis">
        Latest live quote valid today of each supplier, in {c.currency} (other currencies converted at the rate in force on the quote&apos;s
        date). Carbon cost on the fossil CO2
        {c.fossilCo2_kg_per_GJ
          ? ` (${fmtUpTo(c.fossilCo2_kg_per_GJ.gross, 2)} kg/GJ gross, ${fmtUpTo(c.fossilCo2_kg_per_GJ.net, 2)} kg/GJ net)`
          : ""}{" "}
        at {c.carbonPrice_per_t} {c.currency}/t — {c.carbonPriceSource}.
      </p>
      <div className="table-wrap">
        <table>
          <thead>
            <tr>
              <th>Supplier</th>
              <th>Quote</th>
              <th className="num">per MWh gross</th>
              <th className="num">per MWh net</th>
              <th className="num">with carbon, gross</th>
              <th className="num">with carbon, net</th>
            </tr>
          </thead>
          <tbody>
            {c.rows.map((r) => (
              <tr key={r.quoteId}>
                <td>{r.supplier}</td>
                <td>
                  #{r.quoteId}, {r.stated}, from {r.validFrom}
                  {r.conversion && (
                    <small className="muted" style={{ display: "block" }}>
                      {r.conversion}
                    </small>
                  )}
                </td>
                {r.problem ? (
                  <td colSpan={4} className="field-error">
                    {r.problem}
                  </td>
                ) : (
                  <>
                    <td className="num">{money(r.perMWh_gross, c.currency)}</td>
                    <td className="num">{money(r.perMWh_net, c.currency)}</td>
                    <td className="num">{r.withCarbon_gross === null ? "unknown" : money(r.withCarbon_gross, c.currency)}</td>
                    <td className="num">{r.withCarbon_net === null ? "unknown" : money(r.withCarbon_net, c.currency)}</td>
                  </>
                )}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
