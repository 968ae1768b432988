/** The burner section: description, untuned and retuned figures, flashback margin, NOx and SO2 against the permit, cautions. */
import type { StudyResult, ScenarioResult } from "@/lib/study/evaluate";
import { fmt } from "@/app/_ui/format";
import { signed, type Display } from "./display";
import { Status } from "./Checks";

const flameText = (r: ScenarioResult) =>
  r.burner.flame.status === "solved" ? null : r.burner.flame.status === "pending" ? "pending" : (r.burner.flame.reason ?? "unknown");

export function BurnerSection({ result, d }: { result: StudyResult; d: Display }) {
  const all = [result.baseline, ...result.scenarios];
  const s = result.baseline.burner.setting;
  const p = result.plant;
  const check = (r: ScenarioResult, id: string) => r.checks.find((c) => c.id === id);
  return (
    <section aria-label="Burner" data-testid="burner-section">
      <h2>The burner</h2>
      <p>
        <b>{s.described ? s.typeLabel : "Burner not described"}</b>; {s.airControlLabel}; {s.regulatedSupply ? "regulated" : "unregulated"}{" "}
        gas supply. Set up on the baseline at flue O2 {fmt(p.flueO2DryPercent, 1)} % (λ {fmt(result.baseline.burner.setupLambda, 3)}).
        Flashback judged {s.type === "premixed" || s.type === "partially-premixed" ? "" : "not (shown only)"} from{" "}
        {fmt(s.flashbackWarnRatio, 2)} × (warn) and {fmt(s.flashbackFailRatio, 2)} × (fail) the baseline&apos;s burning velocity
        {p.burner ? " (the plant's thresholds)" : " (rules of thumb, common practice, no source)"}. Permit: NOx{" "}
        {p.noxLimit_mg_per_m3 != null ? `${fmt(p.noxLimit_mg_per_m3, 0)} mg/m³` : "no limit entered"}, SO2{" "}
        {p.so2Limit_mg_per_m3 != null ? `${fmt(p.so2Limit_mg_per_m3, 0)} mg/m³` : "no limit entered"} at{" "}
        {fmt(result.baseline.burner.nox.referenceO2Percent, 0)} % O2 (dry, 0 °C, 101.325 kPa).
      </p>
      <h3>On the day the fuel changes (untuned) and retuned</h3>
      <div className="table-wrap">
        <table data-testid="burner-untuned">
          <thead>
            <tr>
              <th>Scenario</th>
              <th className="num">Untuned λ</th>
              <th className="num">Untuned flue O2 %</th>
              <th className="num">Untuned heat input</th>
              <th className="num">Untuned flame {d.tempUnit}</th>
              <th className="num">Retuned λ</th>
              <th className="num">Retuned flame {d.tempUnit}</th>
              <th>What it means</th>
            </tr>
          </thead>
          <tbody>
            {all.map((r) => {
              const u = r.burner.untuned;
              const t = r.burner.retuned;
              return (
                <tr key={r.index}>
                  <td>
                    {r.name}
                    {r.isBaseline && <div className="unit">baseline</div>}
                  </td>
                  <td className="num">{fmt(u?.lambda, 3)}</td>
                  <td className="num">{fmt(u?.flueO2DryPercent, 2)}</td>
                  <td className="num">{u ? `${signed(u.heatInputChangePercent, 1)} %` : "–"}</td>
                  <td className="num">{u?.adiabaticFlameTemperatureK == null ? "–" : d.temp(u.adiabaticFlameTemperatureK - 273.15)}</td>
                  <td className="num">{fmt(t?.lambda, 3)}</td>
                  <td className="num">{t?.adiabaticFlameTemperatureK == null ? "–" : d.temp(t.adiabaticFlameTemperatureK - 273.15)}</td>
                  <td>
                    {u ? (r.burner.risks.length ? r.burner.risks.map((x) => x.text).join("; ") : "no risk flagged") : r.burner.notes[0]}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      <p className="basis">
        {result.baseline.burner.notes.join("; ")}. Retuned: heat input restored and flue O2 held at the set value. Flame temperatures:
        chemical equilibrium, adiabatic.
      </p>
      <h3>Flashback margin, NOx and SO2 (screening estimates)</h3>
      <div className="table-wrap">
        <table data-testid="burner-emissions">
          <thead>
            <tr>
              <th>Scenario</th>
              <th className="num">Burning velocity cm/s</th>
              <th className="num">× baseline</th>
              <th>Flashback</th>
              <th className="num">NOx mg/m³</th>
              <th className="num">NOx × baseline</th>
              <th>NOx vs permit</th>
              <th className="num">SO2 mg/m³</th>
              <th>SO2 vs permit</th>
            </tr>
          </thead>
          <tbody>
            {all.map((r) => {
              const fb = check(r, "flashback");
              const nx = check(r, "nox-permit");
              const so = check(r, "so2-permit");
              const why = flameText(r);
              return (
                <tr key={r.index} data-scenario={r.name}>
                  <td>{r.name}</td>
                  <td className="num">
                    {why ? (
                      <span className="na" title={why}>
                        {why === "pending" ? "pending" : "–"}
                      </span>
                    ) : (
                      fmt(r.burner.burningVelocity_cm_per_s, 1)
                    )}
                  </td>
                  <td className="num">{fmt(r.burner.burningVelocityRatio, 2)}</td>
                  <td>
                    {fb && <Status status={fb.status} />}{" "}
                    {fb && fb.limit !== null && <span className="unit">limit {fmt(fb.limit, 2)} ×</span>}
                  </td>
                  <td className="num">{fmt(r.burner.nox.estimate_mg_per_m3, 0)}</td>
                  <td className="num">{fmt(r.burner.nox.ratioToBaseline, 2)}</td>
                  <td>
                    {nx && <Status status={nx.status} />}{" "}
                    {nx && nx.limit !== null && <span className="unit">limit {fmt(nx.limit, 0)} mg/m³</span>}
                    {r.burner.fuelBoundNitrogen && <div className="unit">fuel-bound nitrogen: fuel NOx not included</div>}
                  </td>
                  <td className="num">{fmt(r.burner.so2.mg_per_m3_dry_at_ref_O2, 0)}</td>
                  <td>
                    {so && <Status status={so.status} />}{" "}
                    {so && so.limit !== null && <span className="unit">limit {fmt(so.limit, 0)} mg/m³</span>}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      <p className="basis">
        Burning velocity: {check(result.baseline, "flashback")?.basis}. NOx: {result.baseline.burner.nox.estimateBasis}. SO2: all fuel
        sulfur as SO2.
      </p>
      <div className="cautions" data-testid="burner-cautions">
        <p>
          <b>{result.burner.screening}</b>
        </p>
        <ul>
          {result.burner.cautions.map((c) => (
            <li key={c}>{c}</li>
          ))}
        </ul>
      </div>
    </section>
  );
}
