/**
 * CSV export of a study result: the ranked scenario table, the fit checks, or the hydrogen
 * sweep. Column names carry the unit and basis; numbers are written with full precision
 * (rounded to 6 significant digits), empty where a figure does not exist.
 */
import type { StudyResult, ScenarioResult } from "./evaluate";
import { writeCsv } from "../formats/csv";
import { METERING_REFERENCES } from "../units/metering";

export const CSV_TABLES = ["scenarios", "checks", "sweep"] as const;
export type CsvTable = (typeof CSV_TABLES)[number];

function cell(v: unknown): string {
  if (v === null || v === undefined) return "";
  if (typeof v === "number") {
    if (!Number.isFinite(v)) return "";
    return String(Number(v.toPrecision(6)));
  }
  return String(v);
}

function table(header: string[], rows: unknown[][]): string {
  return writeCsv([header.map(cell), ...rows.map((r) => r.map(cell))]);
}

function scenarioRow(r: ScenarioResult): unknown[] {
  const c = r.costs;
  const k = r.comparison;
  return [
    r.rank,
    r.name,
    r.isBaseline ? "yes" : "no",
    r.fuel.label,
    r.status,
    r.metricValue,
    r.fuel.h2SharePercent,
    100 * r.efficiency.net,
    100 * r.efficiency.gross,
    c?.costPerUsefulMWh.fuel,
    c?.costPerUsefulMWh.carbon,
    c?.costPerUsefulMWh.upstream,
    c?.costPerUsefulMWh.total,
    r.co2PerUsefulMJ_g.fossil,
    r.co2PerUsefulMJ_g.biogenic,
    r.co2PerUsefulMJ_g.upstream,
    r.annual.fuel_MWh_net,
    r.annual.fuel_MWh_gross,
    c?.annualFuelCost,
    c?.annualCarbonCost,
    c?.annualTotalCost,
    c?.annualCo2Fossil_t,
    k?.annualNetSaving,
    k?.annualCo2Avoided_t,
    k?.capex ?? (r.isBaseline ? 0 : null),
    k?.simplePaybackYears,
    k?.npv,
    k?.abatementCost_per_t,
    k?.breakEven.fuelPriceOperating_per_MWh_net,
    k?.breakEven.carbonPriceOperating_per_t,
    r.flame?.temperatureC,
    r.flame?.shiftK,
    r.fuel.wobbe?.gross_MJ_per_m3,
    r.wobbeShiftPercent,
    r.flowChangePercent.flueGas,
    r.flowChangePercent.fuelVolume,
    r.efficiency.dewPointC,
    r.checks.map((x) => `${x.id}:${x.status}`).join(" "),
    r.burner.untuned?.lambda,
    r.burner.untuned?.flueO2DryPercent,
    r.burner.untuned?.heatInputChangePercent,
    r.burner.retuned?.lambda,
    r.burner.burningVelocity_cm_per_s,
    r.burner.burningVelocityRatio,
    r.burner.nox.estimate_mg_per_m3,
    r.burner.nox.ratioToBaseline,
    r.burner.so2.mg_per_m3_dry_at_ref_O2,
  ];
}

export function studyResultToCsv(result: StudyResult, which: CsvTable = "scenarios"): string {
  const cur = result.study.currency;
  if (which === "scenarios") {
    const rows = [result.baseline, ...result.scenarios].sort((a, b) => (a.rank ?? 1e9) - (b.rank ?? 1e9));
    return table(
      [
        "rank",
        "scenario",
        "baseline",
        "fuel",
        "status",
        `ranking metric (${result.ranking.metric}, ${result.ranking.unit})`,
        "H2 vol %",
        "efficiency net %",
        "efficiency gross %",
        `fuel ${cur}/MWh useful`,
        `carbon ${cur}/MWh useful`,
        `upstream ${cur}/MWh useful`,
        `total ${cur}/MWh useful`,
        "fossil CO2 g/MJ useful",
        "biogenic CO2 g/MJ useful",
        "upstream CO2e g/MJ useful",
        "fuel MWh/yr net",
        "fuel MWh/yr gross",
        `fuel cost ${cur}/yr`,
        `carbon cost ${cur}/yr`,
        `total cost ${cur}/yr`,
        "fossil CO2 t/yr",
        `net saving ${cur}/yr`,
        "CO2 avoided t/yr",
        `capex ${cur}`,
        "simple payback yr",
        `NPV ${cur}`,
        `abatement cost ${cur}/t`,
        `break-even fuel price ${cur}/MWh net`,
        `break-even carbon price ${cur}/t`,
        "flame temperature °C (equilibrium)",
        "flame shift K",
        `Wobbe gross MJ/m3 (combustion ${result.plant.wobbeCombustionReferenceC} °C, metering ${METERING_REFERENCES[result.plant.wobbeMeteringReference].label})`,
        "Wobbe shift %",
        "flue-gas volume change %",
        "fuel volume change %",
        "water dew point °C",
        "fit checks",
        "untuned lambda",
        "untuned flue O2 % dry",
        "untuned heat input change %",
        "retuned lambda",
        "burning velocity cm/s (screening)",
        "burning velocity / baseline",
        `NOx mg/m3 dry at ${result.baseline.burner.nox.referenceO2Percent} % O2 (screening)`,
        "NOx / baseline",
        `SO2 mg/m3 dry at ${result.baseline.burner.so2.referenceO2Percent} % O2`,
      ],
      rows.map(scenarioRow),
    );
  }
  if (which === "checks") {
    const rows: unknown[][] = [];
    for (const r of [result.baseline, ...result.scenarios]) {
      for (const c of r.checks) rows.push([r.name, c.id, c.label, c.status, c.value, c.limit, c.unit, c.usage, c.message, c.basis]);
    }
    return table(["scenario", "check", "label", "status", "value", "limit", "unit", "usage of limit", "message", "basis"], rows);
  }
  const sw = result.hydrogenSweep;
  if (!sw?.available) return table(["note"], [[sw?.reason ?? "no hydrogen sweep in this evaluation"]]);
  return table(
    [
      "H2 vol %",
      "H2 energy share % (net)",
      "Wobbe gross MJ/m3",
      "Wobbe shift %",
      "flame temperature °C",
      "flame shift K",
      "efficiency net %",
      "efficiency gross %",
      "water dew point °C",
      "CO2 g/MJ useful",
      "CO2 change %",
      "fuel m3/h",
      "flue gas m3/h",
      "air m3/h",
      `cost ${cur}/MWh useful`,
      "worst check",
      "untuned lambda",
      "untuned heat input change %",
      "burning velocity / baseline (flame shares)",
      "NOx mg/m3 (screening, flame shares)",
      "NOx / baseline",
    ],
    sw.points.map((p) => [
      p.h2Percent,
      p.h2EnergySharePercent,
      p.wobbeGross_MJ_per_m3,
      p.wobbeShiftPercent,
      p.flameTemperatureC,
      p.flameShiftK,
      100 * p.efficiencyNet,
      100 * p.efficiencyGross,
      p.dewPointC,
      p.co2PerUsefulMJ_g,
      p.co2ChangePercent,
      p.fuelVolume_m3_per_h,
      p.flueGas_m3_per_h,
      p.air_m3_per_h,
      p.costPerUsefulMWh,
      p.worst,
      p.untunedLambda,
      p.untunedHeatInputChangePercent,
      p.burningVelocityRatio,
      p.nox_mg_per_m3,
      p.noxRatio,
    ]),
  );
}
