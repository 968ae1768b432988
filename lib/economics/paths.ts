/**
 * Prices over the horizon, year by year: fuel-price and carbon-price paths (flat with
 * escalation, a table, linear or stepped between points), real or nominal money, and the switching
 * figures (NPV, simple and discounted payback, abatement cost) from them.
 *
 * Conventions (those of finance.ts): the investment at t = 0, yearly cash flows at the end of
 * years 1 … N, discounted by (1 + d)^t. A path value of year t is stated in the path's terms;
 * converting between real (today's money) and nominal (money of the day) uses the general
 * inflation i: nominal_t = real_t · (1 + i)^t. The discount rate goes with the terms: the Fisher
 * relation (1 + d_nominal) = (1 + d_real)(1 + i). Consistently converted, the NPV is the same in
 * either terms; the abatement cost is not (tonnes are discounted at the rate of the terms chosen).
 *
 * Everything that does not change between Monte Carlo draws is gathered once in `PathFactors`:
 * the present value of each price path per unit of its year-1 level, of a constant yearly amount
 * and of a tonne a year. A scenario's present energy cost is then linear in its fuel demand and
 * the price levels, which is what lets the uncertainty ranking evaluate thousands of draws.
 */
import { InputError } from "../errors";
import { MJ_per_GJ, MJ_per_MWh } from "../units/energy";
import type { MoneyTerms, PricePath } from "../schemas/study";

export type { MoneyTerms, PricePath } from "../schemas/study";

/** Discount rate in the wanted terms from one stated in other terms (Fisher relation), % per year. */
export function discountRateInTerms(
  ratePercent: number,
  statedTerms: MoneyTerms,
  wantedTerms: MoneyTerms,
  inflationPercent: number,
): number {
  if (statedTerms === wantedTerms) return ratePercent;
  const i = inflationPercent / 100;
  const r = ratePercent / 100;
  return 100 * (statedTerms === "real" ? (1 + r) * (1 + i) - 1 : (1 + r) / (1 + i) - 1);
}

/** Values of a path for years 1 … N (index 0 = year 1), relative to `level` for escalation. */
export function pathValues(path: PricePath, level: number, years: number, field: string): Float64Array {
  const v = new Float64Array(years);
  if (path.kind === "escalation") {
    const g = 1 + path.percentPerYear / 100;
    for (let t = 0; t < years; t++) v[t] = level * g ** t;
    return v;
  }
  const pts = [...path.points].sort((a, b) => a.year - b.year);
  for (let k = 1; k < pts.length; k++) {
    if (pts[k].year === pts[k - 1].year) throw new InputError(`${field}.points`, `year ${pts[k].year} is stated twice`);
  }
  if (path.kind === "table") {
    if (pts[0].year !== 1) throw new InputError(`${field}.points`, "a table starts at year 1");
    for (let k = 1; k < pts.length; k++) {
      if (pts[k].year !== pts[k - 1].year + 1)
        throw new InputError(`${field}.points`, `a table has one value per year: year ${pts[k - 1].year + 1} is missing`);
    }
  }
  for (let t = 0; t < years; t++) {
    const year = t + 1;
    if (year <= pts[0].year) v[t] = pts[0].value;
    else if (year >= pts[pts.length - 1].year) v[t] = pts[pts.length - 1].value;
    else {
      let k = 0;
      while (pts[k + 1].year < year) k++;
      const a = pts[k],
        b = pts[k + 1];
      if (year === b.year) v[t] = b.value;
      else if (path.kind === "linear") v[t] = a.value + ((b.value - a.value) * (year - a.year)) / (b.year - a.year);
      else v[t] = a.value;
    }
  }
  return v;
}

export interface PathFinance {
  /** Terms of the paths and of the results. */
  terms: MoneyTerms;
  /** Discount rate in those terms, % per year. */
  discountRatePercent: number;
  horizonYears: number;
}

/** Discount factors 1/(1+d)^t for t = 1 … N. */
export function discountFactors(fin: PathFinance): Float64Array {
  const d = 1 + fin.discountRatePercent / 100;
  if (!(d > 0)) throw new RangeError(`discount rate must be > −100 %, got ${fin.discountRatePercent} %`);
  const f = new Float64Array(fin.horizonYears);
  let x = 1;
  for (let t = 0; t < fin.horizonYears; t++) {
    x /= d;
    f[t] = x;
  }
  return f;
}

/** Σ_t values_t · discount_t. */
export function presentValue(values: ArrayLike<number>, discount: Float64Array): number {
  let s = 0;
  for (let t = 0; t < discount.length; t++) s += values[t] * discount[t];
  return s;
}

/**
 * What one scenario's year-by-year economics need, apart from its efficiency: the parts of its
 * delivered price, each following a price path (index on the year-1 level), and its emission factors.
 */
export interface PathScenario {
  /** Year-1 delivered price parts per MWh of fuel (net), one per price source; sum = delivered price. */
  priceParts: { source: number; perMWh_net: number }[];
  co2Fossil_kg_per_GJ_net: number;
  upstreamCo2e_kg_per_GJ_net: number;
  includeUpstream: boolean;
  capex: number;
  fixedOpexChange: number;
}

/** Present values per unit, computed once per study and terms. */
export interface PathFactors {
  finance: PathFinance;
  discount: Float64Array;
  /** Per price source: index path (year 1 = 1 at the quote), and its present value Σ index_t·discount_t. */
  sourceIndex: Float64Array[];
  sourcePv: Float64Array;
  /** Carbon price per t, year by year, and its present value (per t a year). */
  carbon: Float64Array;
  carbonPv: number;
  /** Present value of 1 a year (constant amounts: fixed-opex change, tonnes avoided). */
  annuity: number;
}

export function pathFactors(fin: PathFinance, sourceIndex: Float64Array[], carbon: Float64Array): PathFactors {
  const discount = discountFactors(fin);
  let annuity = 0;
  for (let t = 0; t < discount.length; t++) annuity += discount[t];
  return {
    finance: fin,
    discount,
    sourceIndex,
    sourcePv: Float64Array.from(sourceIndex.map((s) => presentValue(s, discount))),
    carbon,
    carbonPv: presentValue(carbon, discount),
    annuity,
  };
}

const GJ_per_MWh = MJ_per_MWh / MJ_per_GJ;

/** A scenario at one efficiency and activity, reduced to the sums the switching figures need. */
export interface PathScenarioState {
  fuelMWh_net: number;
  /** Fuel cost of year 1 and present fuel cost over the horizon. */
  fuelCostYear1: number;
  fuelCostPv: number;
  /** Priced tonnes a year (fossil CO2, plus upstream when counted) and the tonnes counted as avoided. */
  pricedT: number;
  countedT: number;
  capex: number;
  fixedOpexChange: number;
}

/**
 * The state of a scenario delivering `usefulMWh` a year at `efficiencyNet`, with price levels
 * `levels[source]` (1 = as quoted) and capex scaled by `capexFactor`.
 */
export function pathScenarioState(
  s: PathScenario,
  f: PathFactors,
  usefulMWh: number,
  efficiencyNet: number,
  levels: ArrayLike<number> | null,
  capexFactor = 1,
  out?: PathScenarioState,
): PathScenarioState {
  const fuel = usefulMWh / efficiencyNet;
  let y1 = 0,
    pv = 0;
  const parts = s.priceParts;
  for (let k = 0; k < parts.length; k++) {
    const p = parts[k];
    const l = levels ? levels[p.source] : 1;
    y1 += p.perMWh_net * l * f.sourceIndex[p.source][0];
    pv += p.perMWh_net * l * f.sourcePv[p.source];
  }
  const GJ = fuel * GJ_per_MWh;
  const fossil = (GJ * s.co2Fossil_kg_per_GJ_net) / 1000;
  const up = (GJ * s.upstreamCo2e_kg_per_GJ_net) / 1000;
  const counted = fossil + (s.includeUpstream ? up : 0);
  const o = out ?? { fuelMWh_net: 0, fuelCostYear1: 0, fuelCostPv: 0, pricedT: 0, countedT: 0, capex: 0, fixedOpexChange: 0 };
  o.fuelMWh_net = fuel;
  o.fuelCostYear1 = fuel * y1;
  o.fuelCostPv = fuel * pv;
  o.pricedT = counted;
  o.countedT = counted;
  o.capex = s.capex * capexFactor;
  o.fixedOpexChange = s.fixedOpexChange;
  return o;
}

/** Year-1 energy cost (fuel + carbon on the priced tonnes) per useful MWh. */
export function costPerUsefulMWhYear1(s: PathScenarioState, f: PathFactors, usefulMWh: number, carbonLevel = 1): number {
  return (s.fuelCostYear1 + s.pricedT * f.carbon[0] * carbonLevel) / usefulMWh;
}

/** NPV of switching from `base` to `cand`, in the terms of the factors. */
export function switchingNpvFromPaths(base: PathScenarioState, cand: PathScenarioState, f: PathFactors, carbonLevel = 1): number {
  const energyPv = base.fuelCostPv - cand.fuelCostPv + (base.pricedT - cand.pricedT) * f.carbonPv * carbonLevel;
  return -cand.capex + energyPv + (base.fixedOpexChange - cand.fixedOpexChange) * f.annuity;
}

/**
 * Levelised abatement cost, carbon price excluded: [capex − PV(Δfuel cost saving) − PV(Δopex saving)] / PV(t avoided);
 * null when nothing is avoided.
 */
export function abatementCostFromPaths(base: PathScenarioState, cand: PathScenarioState, f: PathFactors): number | null {
  const avoided = base.countedT - cand.countedT;
  if (!(avoided > 1e-9)) return null;
  const presentCost = cand.capex - (base.fuelCostPv - cand.fuelCostPv) - (base.fixedOpexChange - cand.fixedOpexChange) * f.annuity;
  return presentCost / (avoided * f.annuity);
}

/** Yearly cash flows of switching (years 1 … N), for payback and the report. */
export function switchingCashFlows(
  base: PathScenario,
  cand: PathScenario,
  f: PathFactors,
  baseFuelMWh: number,
  candFuelMWh: number,
): Float64Array {
  const n = f.discount.length;
  const flows = new Float64Array(n);
  const tonnes = (s: PathScenario, fuel: number) =>
    (fuel * GJ_per_MWh * (s.co2Fossil_kg_per_GJ_net + (s.includeUpstream ? s.upstreamCo2e_kg_per_GJ_net : 0))) / 1000;
  const tb = tonnes(base, baseFuelMWh),
    tc = tonnes(cand, candFuelMWh);
  for (let t = 0; t < n; t++) {
    let cost = 0;
    for (const p of base.priceParts) cost += baseFuelMWh * p.perMWh_net * f.sourceIndex[p.source][t];
    for (const p of cand.priceParts) cost -= candFuelMWh * p.perMWh_net * f.sourceIndex[p.source][t];
    flows[t] = cost + (tb - tc) * f.carbon[t] + base.fixedOpexChange - cand.fixedOpexChange;
  }
  return flows;
}

/** Discounted payback from yearly flows (linear within the year); null if not within the horizon. */
export function discountedPaybackFromFlows(capex: number, flows: Float64Array, discount: Float64Array): number | null {
  if (capex <= 0) return flows.length && flows[0] >= 0 ? 0 : null;
  let cumulative = -capex;
  for (let t = 0; t < flows.length; t++) {
    const pv = flows[t] * discount[t];
    if (cumulative + pv >= 0 && pv > 0) return t + -cumulative / pv;
    cumulative += pv;
  }
  return null;
}
