/**
 * Cost and CO2 of useful heat for one scenario, and the comparison of a candidate with the
 * baseline: annual saving, CO2 avoided, NPV, payback, abatement cost, break-even fuel and carbon
 * prices.
 *
 * Every figure is on a stated basis: fuel energy in MWh on the net (LHV) basis unless the name
 * says gross; CO2 factors in kg per GJ of fuel on the net basis; efficiencies as fractions of
 * the fuel's net or gross heat input.
 */
import { MJ_per_GJ, MJ_per_MWh } from "../units/energy";
import { discountedPaybackYears, netPresentValue, presentValueFactor, simplePaybackYears, type CashFlowProfile } from "./finance";

const GJ_per_MWh = MJ_per_MWh / MJ_per_GJ;

/** What the economics need to know about one scenario (all numbers, no physics). */
export interface CostInputs {
  /** Annual useful heat delivered, MWh. Equal for every scenario of a study. */
  usefulHeat_MWh: number;
  /** Efficiency on the net basis (useful heat / fuel heat input at LHV), fraction. */
  efficiencyNet: number;
  /** HHV / LHV of the fuel (to state fuel energy on the gross basis). */
  grossOverNet: number;
  /** Delivered fuel price (commodity + transport + handling) per MWh of fuel on the net basis. */
  deliveredPrice_per_MWh_net: number;
  /** Fossil CO2, kg per GJ of fuel (net basis). */
  co2Fossil_kg_per_GJ_net: number;
  /** Biogenic CO2, kg per GJ of fuel (net basis); reported, not priced. */
  co2Biogenic_kg_per_GJ_net: number;
  /** Upstream (well-to-tank) CO2e, kg per GJ of fuel (net basis); 0 when not known. */
  upstreamCo2e_kg_per_GJ_net: number;
  /** Carbon price per tonne of fossil CO2. */
  carbonPrice_per_t: number;
  /** When true, upstream CO2e is priced at the carbon price and counted in CO2 avoided. */
  includeUpstream: boolean;
  /** Switching investment (0 for the baseline). */
  capex: number;
  /** Change in fixed operating cost per year versus the baseline (positive = more cost). */
  fixedOpexChange: number;
}

export interface FinanceAssumptions {
  discountRatePercent: number;
  horizonYears: number;
  /** Escalation of fuel and carbon prices, % per year. */
  priceEscalationPercent: number;
}

export interface ScenarioCosts {
  efficiencyNet: number;
  efficiencyGross: number;
  fuelInput_MWh_net: number;
  fuelInput_MWh_gross: number;
  deliveredPrice_per_MWh_net: number;
  deliveredPrice_per_MWh_gross: number;
  annualFuelCost: number;
  /** Carbon cost on fossil CO2 at the study's carbon price. */
  annualCarbonCost: number;
  /** Upstream CO2e at the carbon price (0 unless upstream emissions are included). */
  annualUpstreamCost: number;
  /** Fuel + carbon + upstream (energy-related operating cost), per year. */
  annualEnergyCost: number;
  /** Energy cost + fixed operating-cost change, per year. */
  annualTotalCost: number;
  /** Per useful MWh of heat: fuel, carbon, upstream and total (energy-related). */
  costPerUsefulMWh: { fuel: number; carbon: number; upstream: number; total: number };
  /** Same per useful GJ. */
  costPerUsefulGJ: { fuel: number; carbon: number; upstream: number; total: number };
  /** g CO2 per MJ of useful heat: fossil, biogenic, upstream CO2e. */
  co2PerUsefulMJ_g: { fossil: number; biogenic: number; upstream: number };
  annualCo2Fossil_t: number;
  annualCo2Biogenic_t: number;
  annualUpstreamCo2e_t: number;
}

export function scenarioCosts(c: CostInputs): ScenarioCosts {
  if (!(c.efficiencyNet > 0)) throw new RangeError(`efficiency must be > 0, got ${c.efficiencyNet}`);
  const inputNet = c.usefulHeat_MWh / c.efficiencyNet;
  const inputGJ = inputNet * GJ_per_MWh;
  const fuel = inputNet * c.deliveredPrice_per_MWh_net;
  const co2F = (inputGJ * c.co2Fossil_kg_per_GJ_net) / 1000;
  const co2B = (inputGJ * c.co2Biogenic_kg_per_GJ_net) / 1000;
  const up = (inputGJ * c.upstreamCo2e_kg_per_GJ_net) / 1000;
  const carbon = co2F * c.carbonPrice_per_t;
  const upstreamCost = c.includeUpstream ? up * c.carbonPrice_per_t : 0;
  const energy = fuel + carbon + upstreamCost;
  const per = (v: number) => (c.usefulHeat_MWh > 0 ? v / c.usefulHeat_MWh : 0);
  const perMWh = { fuel: per(fuel), carbon: per(carbon), upstream: per(upstreamCost), total: per(energy) };
  return {
    efficiencyNet: c.efficiencyNet,
    efficiencyGross: c.efficiencyNet / c.grossOverNet,
    fuelInput_MWh_net: inputNet,
    fuelInput_MWh_gross: inputNet * c.grossOverNet,
    deliveredPrice_per_MWh_net: c.deliveredPrice_per_MWh_net,
    deliveredPrice_per_MWh_gross: c.deliveredPrice_per_MWh_net / c.grossOverNet,
    annualFuelCost: fuel,
    annualCarbonCost: carbon,
    annualUpstreamCost: upstreamCost,
    annualEnergyCost: energy,
    annualTotalCost: energy + c.fixedOpexChange,
    costPerUsefulMWh: perMWh,
    costPerUsefulGJ: {
      fuel: perMWh.fuel / GJ_per_MWh,
      carbon: perMWh.carbon / GJ_per_MWh,
      upstream: perMWh.upstream / GJ_per_MWh,
      total: perMWh.total / GJ_per_MWh,
    },
    // kg/GJ of fuel ÷ η = kg per GJ useful = g per MJ useful.
    co2PerUsefulMJ_g: {
      fossil: c.co2Fossil_kg_per_GJ_net / c.efficiencyNet,
      biogenic: c.co2Biogenic_kg_per_GJ_net / c.efficiencyNet,
      upstream: c.upstreamCo2e_kg_per_GJ_net / c.efficiencyNet,
    },
    annualCo2Fossil_t: co2F,
    annualCo2Biogenic_t: co2B,
    annualUpstreamCo2e_t: up,
  };
}

export interface BreakEven {
  /** Delivered candidate fuel price per MWh (net) at which its energy cost per useful MWh equals the baseline's; null if none. */
  fuelPriceOperating_per_MWh_net: number | null;
  /** Delivered candidate fuel price per MWh (net) at which the switch's NPV over the horizon is zero (capex and opex included). */
  fuelPriceNpv_per_MWh_net: number | null;
  /** Carbon price per t at which the candidate's energy cost per useful MWh equals the baseline's; null if CO2 does not differ. */
  carbonPriceOperating_per_t: number | null;
  /** Carbon price per t at which the NPV is zero; null if CO2 does not differ. */
  carbonPriceNpv_per_t: number | null;
}

export interface Comparison {
  /** Baseline minus candidate energy cost (fuel + carbon + upstream), year 1. */
  annualEnergySaving: number;
  /** Energy saving minus the fixed operating-cost change, year 1. */
  annualNetSaving: number;
  /** Fossil CO2 avoided per year, t (plus upstream CO2e when upstream emissions are included). */
  annualCo2Avoided_t: number;
  /** Relative change of CO2 per useful MJ (fossil, plus upstream when included) versus baseline, %. */
  co2ChangePercent: number;
  capex: number;
  npv: number;
  simplePaybackYears: number | null;
  discountedPaybackYears: number | null;
  /**
   * Levelised abatement cost per t CO2 avoided, excluding the carbon price itself:
   * [capex + Σ PV(Δfuel cost + Δopex)] / Σ PV(t avoided). null when nothing is avoided.
   */
  abatementCost_per_t: number | null;
  breakEven: BreakEven;
}

function avoidedPerYear(base: CostInputs, cand: CostInputs, bc: ScenarioCosts, cc: ScenarioCosts): number {
  const up = cand.includeUpstream || base.includeUpstream;
  return bc.annualCo2Fossil_t - cc.annualCo2Fossil_t + (up ? bc.annualUpstreamCo2e_t - cc.annualUpstreamCo2e_t : 0);
}

function cashFlows(base: CostInputs, cand: CostInputs, fin: FinanceAssumptions): CashFlowProfile {
  const bc = scenarioCosts(base);
  const cc = scenarioCosts(cand);
  return {
    capex: cand.capex,
    escalatingAnnual: bc.annualEnergyCost - cc.annualEnergyCost,
    constantAnnual: base.fixedOpexChange - cand.fixedOpexChange,
    discountRatePercent: fin.discountRatePercent,
    years: fin.horizonYears,
    escalationPercent: fin.priceEscalationPercent,
  };
}

/** NPV of switching from the baseline to the candidate. */
export function switchingNpv(base: CostInputs, cand: CostInputs, fin: FinanceAssumptions): number {
  return netPresentValue(cashFlows(base, cand, fin));
}

/** Root of a function known to be linear in x, from two evaluations; null if flat. */
function linearRoot(f: (x: number) => number, x0: number, x1: number): number | null {
  const f0 = f(x0);
  const f1 = f(x1);
  const slope = (f1 - f0) / (x1 - x0);
  if (!Number.isFinite(slope) || Math.abs(slope) < 1e-12 * Math.max(1, Math.abs(f0))) return null;
  return x0 - f0 / slope;
}

export function breakEven(base: CostInputs, cand: CostInputs, fin: FinanceAssumptions): BreakEven {
  const costGap = (b: CostInputs, c: CostInputs) => scenarioCosts(c).costPerUsefulMWh.total - scenarioCosts(b).costPerUsefulMWh.total;
  const p0 = cand.deliveredPrice_per_MWh_net;
  const p1 = p0 + 10;
  const withPrice = (p: number): CostInputs => ({ ...cand, deliveredPrice_per_MWh_net: p });
  const c0 = base.carbonPrice_per_t;
  const c1 = c0 + 10;
  const withCarbon = (c: number): [CostInputs, CostInputs] => [
    { ...base, carbonPrice_per_t: c },
    { ...cand, carbonPrice_per_t: c },
  ];
  return {
    fuelPriceOperating_per_MWh_net: linearRoot((p) => costGap(base, withPrice(p)), p0, p1),
    fuelPriceNpv_per_MWh_net: linearRoot((p) => switchingNpv(base, withPrice(p), fin), p0, p1),
    carbonPriceOperating_per_t: linearRoot((c) => costGap(...withCarbon(c)), c0, c1),
    carbonPriceNpv_per_t: linearRoot((c) => switchingNpv(...withCarbon(c), fin), c0, c1),
  };
}

/** Levelised abatement cost (carbon price excluded); null if no CO2 is avoided. */
export function abatementCost(base: CostInputs, cand: CostInputs, fin: FinanceAssumptions): number | null {
  const noCarbon = (x: CostInputs): CostInputs => ({ ...x, carbonPrice_per_t: 0 });
  const bc = scenarioCosts(base);
  const cc = scenarioCosts(cand);
  const avoided = avoidedPerYear(base, cand, bc, cc);
  if (!(avoided > 1e-9)) return null;
  // Present cost of switching without any carbon price = −NPV at zero carbon price.
  const presentCost = -switchingNpv(noCarbon(base), noCarbon(cand), fin);
  // Avoided tonnes follow the activity, which does not escalate.
  const presentTonnes = avoided * presentValueFactor(fin.discountRatePercent, fin.horizonYears, 0);
  return presentCost / presentTonnes;
}

export function compare(base: CostInputs, cand: CostInputs, fin: FinanceAssumptions): Comparison {
  const bc = scenarioCosts(base);
  const cc = scenarioCosts(cand);
  const flows = cashFlows(base, cand, fin);
  const energySaving = bc.annualEnergyCost - cc.annualEnergyCost;
  const netSaving = energySaving + flows.constantAnnual;
  const up = cand.includeUpstream || base.includeUpstream;
  const perMJ = (c: ScenarioCosts) => c.co2PerUsefulMJ_g.fossil + (up ? c.co2PerUsefulMJ_g.upstream : 0);
  const baseCo2 = perMJ(bc);
  return {
    annualEnergySaving: energySaving,
    annualNetSaving: netSaving,
    annualCo2Avoided_t: avoidedPerYear(base, cand, bc, cc),
    co2ChangePercent: baseCo2 > 0 ? (100 * (perMJ(cc) - baseCo2)) / baseCo2 : 0,
    capex: cand.capex,
    npv: netPresentValue(flows),
    simplePaybackYears: simplePaybackYears(cand.capex, netSaving),
    discountedPaybackYears: discountedPaybackYears(flows),
    abatementCost_per_t: abatementCost(base, cand, fin),
    breakEven: breakEven(base, cand, fin),
  };
}
