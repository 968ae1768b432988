/** The limits a plant sets for every candidate fuel, as one table (plant page and study report). */
import type { Plant } from "@/lib/schemas/plant";
import { fmt, pct } from "@/app/_ui/format";
import type { Display } from "@/app/studies/_components/display";
import { METERING_REFERENCES, meteringLabelWithPressure } from "@/lib/units/metering";
import { AIR_CONTROL_LABELS, BURNER_TYPE_LABELS } from "@/lib/schemas/burner";

const na = <span className="na">not set</span>;
const fanBasis = (k: "actual" | "normal") => (k === "actual" ? "actual" : "normal, 0 °C");

export function PlantLimitsTable({ p, d }: { p: Plant; d: Display }) {
  return (
    <table className="kv">
      <tbody>
        <tr>
          <th>Wobbe index</th>
          <td className="num">
            {p.wobbeTolerancePercent != null
              ? `±${fmt(p.wobbeTolerancePercent, 1)} % of the baseline`
              : p.wobbeMin_MJ_per_m3 != null
                ? `${d.wobbe(p.wobbeMin_MJ_per_m3)}–${d.wobbe(p.wobbeMax_MJ_per_m3)} ${d.wobbeUnit} gross`
                : na}
            {(p.wobbeTolerancePercent != null || p.wobbeMin_MJ_per_m3 != null) && (
              <div className="unit">
                combustion {p.wobbeCombustionReferenceC} °C, metering{" "}
                {meteringLabelWithPressure(METERING_REFERENCES[p.wobbeMeteringReference].temperatureC)}
              </div>
            )}
          </td>
        </tr>
        <tr>
          <th>Flame-temperature rise</th>
          <td className="num">{p.maxFlameTempRiseK != null ? `≤ ${d.dT(p.maxFlameTempRiseK, 0, false)} ${d.dTUnit}` : na}</td>
        </tr>
        <tr>
          <th>Flue-gas fan</th>
          <td className="num">
            {p.flueGasCapacity_m3_per_h != null
              ? `${d.vol(p.flueGasCapacity_m3_per_h)} ${d.volUnit}/h (${fanBasis(p.flueGasCapacityBasis)})`
              : na}
          </td>
        </tr>
        <tr>
          <th>Combustion-air fan</th>
          <td className="num">
            {p.airCapacity_m3_per_h != null ? `${d.vol(p.airCapacity_m3_per_h)} ${d.volUnit}/h (${fanBasis(p.airCapacityBasis)})` : na}
          </td>
        </tr>
        <tr>
          <th>Fuel supply / meter</th>
          <td className="num">
            {p.fuelSupplyCapacity_m3_per_h != null
              ? `${d.vol(p.fuelSupplyCapacity_m3_per_h, p.fuelSupplyCapacity_m3_per_h < 10 ? 2 : 0)} ${d.volUnit}/h (gas at ${meteringLabelWithPressure(METERING_REFERENCES[p.fuelSupplyMeteringReference].temperatureC)}; liquid as liquid)`
              : na}
          </td>
        </tr>
        <tr>
          <th>Burner maker&apos;s H2 limit</th>
          <td className="num">{p.maxH2SharePercent != null ? `${fmt(p.maxH2SharePercent, 0)} vol %` : na}</td>
        </tr>
        <tr>
          <th>Burner</th>
          <td className="num" data-testid="plant-burner">
            {p.burner
              ? `${BURNER_TYPE_LABELS[p.burner.type]}; ${AIR_CONTROL_LABELS[p.burner.airControl]}; ${p.burner.regulatedSupply ? "regulated" : "unregulated"} gas supply; flashback warn from ${fmt(p.burner.flashbackWarnRatio, 2)} ×, fail from ${fmt(p.burner.flashbackFailRatio, 2)} × the baseline's burning velocity`
              : na}
          </td>
        </tr>
        <tr>
          <th>Gas pressure</th>
          <td className="num">
            {p.gasBurnerPressure_kPa != null ? `${fmt(p.gasBurnerPressure_kPa, 2)} kPa at the burner on the baseline` : na}
            {p.gasSupplyPressure_kPa != null && `; supply ${fmt(p.gasSupplyPressure_kPa, 2)} kPa`}
          </td>
        </tr>
        <tr>
          <th>Permit</th>
          <td className="num">
            NOx {p.noxLimit_mg_per_m3 != null ? `${fmt(p.noxLimit_mg_per_m3, 0)} mg/m³` : na}, SO2{" "}
            {p.so2Limit_mg_per_m3 != null ? `${fmt(p.so2Limit_mg_per_m3, 0)} mg/m³` : na} at{" "}
            {p.noxReferenceO2Percent != null ? `${fmt(p.noxReferenceO2Percent, 0)} % O2` : "the fuel type's reference O2"} (dry, 0 °C,
            101.325 kPa)
            {p.noxMeasuredBaseline_mg_per_m3 != null && `; NOx measured on the baseline ${fmt(p.noxMeasuredBaseline_mg_per_m3, 0)} mg/m³`}
          </td>
        </tr>
        <tr>
          <th>Liquid train</th>
          <td className="num" data-testid="plant-liquid-train">
            {p.liquidTrain
              ? `${fmt(p.liquidTrain.flowCapacity, 0)} ${p.liquidTrain.flowUnit}; atomiser ${p.liquidTrain.viscosityMin_mm2_per_s ?? "–"}–${p.liquidTrain.viscosityMax_mm2_per_s ?? "–"} mm²/s at ${p.liquidTrain.firingTemperatureC} °C; set up on ${p.liquidTrain.referenceFuel.name ?? "its reference liquid"}${p.liquidTrain.flueO2DryPercent != null ? ` at ${fmt(p.liquidTrain.flueO2DryPercent, 1)} % O2` : ""}`
              : na}
          </td>
        </tr>
        <tr>
          <th>Warnings</th>
          <td className="num">
            at {pct(p.warnAtFractionOfLimit, 0)} of a limit; stack within {d.dT(p.dewPointMarginK, 0, false)} {d.dTUnit} of the dew point
          </td>
        </tr>
      </tbody>
    </table>
  );
}
