/** The report's price and carbon paths and its stored uncertainty run (printed with the revision whose inputs it evaluated). */
import type { PathAssumptions } from "@/lib/study/price-paths";
import type { StoredRun } from "@/lib/services/uncertainty-runs";
import { fmt, money } from "../../../_ui/format";
import { METRIC_SHORT } from "../../_components/settings";
import { band, byChanceFirst, metricFormat, OptionName, pFirstText, pNpvText } from "../../_components/uncertainty-format";

/** Years a report prints of a path: 1, 5, 10, … and the last. */
function shownYears(n: number): number[] {
  const ys = [1, 5, 10, 15, 20, 30, 40, 50, 60].filter((y) => y < n);
  return [...ys, n];
}

export function PathsSection({ paths, currency }: { paths: PathAssumptions; currency: string }) {
  const years = shownYears(paths.carbon.values.length);
  return (
    <section className="keep" data-testid="report-paths">
      <h2>Price and carbon paths</h2>
      <p>
        Fuel prices as an index on their quote (1 = the quote), the carbon price in {currency}/t; {paths.terms} terms, discounted at{" "}
        {fmt(paths.discountRatePercent, 3)} %. NPV, payback and abatement cost use them year by year (cash flows at the end of each year).
      </p>
      <div className="table-wrap">
        <table>
          <thead>
            <tr>
              <th>Path</th>
              <th>Kind</th>
              {years.map((y) => (
                <th key={y} className="num">
                  Year {y}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {paths.fuel.map((p) => (
              <tr key={p.key}>
                <td>{p.label}</td>
                <td>{p.kind}</td>
                {years.map((y) => (
                  <td key={y} className="num">
                    × {fmt(p.values[y - 1], 3)}
                  </td>
                ))}
              </tr>
            ))}
            <tr>
              <td>{paths.carbon.label}</td>
              <td>{paths.carbon.kind}</td>
              {years.map((y) => (
                <td key={y} className="num">
                  {money(paths.carbon.values[y - 1], currency, 0)}
                </td>
              ))}
            </tr>
          </tbody>
        </table>
      </div>
      {paths.notes.length > 0 && (
        <ul className="basis">
          {paths.notes.map((n) => (
            <li key={n}>{n}</li>
          ))}
        </ul>
      )}
    </section>
  );
}

export function UncertaintySection({ run, revision }: { run: StoredRun | null; revision: number | null }) {
  if (!run) {
    return (
      <section className="keep" data-testid="report-uncertainty">
        <h2>How sure is the ranking?</h2>
        <p className="note">
          {revision !== null
            ? `No uncertainty run was stored on the inputs of revision ${revision}.`
            : "No uncertainty run is stored for this study."}
        </p>
      </section>
    );
  }
  const r = run.result;
  const metricNum = metricFormat(r);
  const rows = byChanceFirst(r.scenarios);
  const st = run.settings;
  return (
    <section className="keep" data-testid="report-uncertainty">
      <h2>How sure is the ranking?</h2>
      <p>
        Stored run #{run.id} of {run.createdAt.slice(0, 10)}: {r.draws.toLocaleString("en-GB")} draws, seed {r.seed}, ranked by{" "}
        {METRIC_SHORT[r.metric].toLowerCase()}, {st.shape} ranges
        {st.fuelPriceCorrelation ? `, fuel prices correlated ${st.fuelPriceCorrelation}` : ""}.{" "}
        {run.revisions.length > 0
          ? `It evaluated the inputs of revision ${run.revisions.join(", ")}.`
          : "It evaluated live inputs that no revision was issued on."}{" "}
        {run.stale && (
          <strong data-testid="report-stale-run">
            Stale: the study&apos;s inputs changed after this run; its figures belong to the earlier inputs.
          </strong>
        )}
      </p>
      <div className="table-wrap">
        <table>
          <thead>
            <tr>
              <th>Option</th>
              <th className="num">P(first) % ± SE</th>
              <th className="num">
                {METRIC_SHORT[r.metric]} P10 / P50 / P90 ({r.metricUnit})
              </th>
              <th className="num">P(NPV &gt; 0) % ± SE</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((s) => (
              <tr key={s.name}>
                <OptionName s={s} />
                <td className="num">{pFirstText(s)}</td>
                <td className="num">{band(s.metric, metricNum)}</td>
                <td className="num">{pNpvText(s)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {r.topTwo && r.topTwo.drivers.length > 0 && (
        <p>
          What decides between {r.topTwo.first} and {r.topTwo.second} (Spearman rank correlation with the difference of their{" "}
          {METRIC_SHORT[r.metric].toLowerCase()}):{" "}
          {r.topTwo.drivers
            .slice(0, 5)
            .map((x) => `${x.label} ${fmt(x.spearman, 2)}`)
            .join("; ")}
          .
        </p>
      )}
      <p className="table-note">
        {r.sampling}; generator {r.generator}, seed {r.seed}. {r.standardError}. Inputs:{" "}
        {r.inputs
          .filter((i) => i.sd > 0)
          .map((i) => `${i.label} (${i.origin})`)
          .join("; ")}
        . {r.caution}
      </p>
    </section>
  );
}
