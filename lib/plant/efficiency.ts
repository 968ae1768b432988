/**
 * Efficiency of a fired unit by the heat-loss (indirect) method, on the gross and on the net
 * basis, per kg of fuel as fired.
 *
 * Concepts of EN 12952-15 and ASME PTC 4: reference temperature 25 °C (the heating values'
 * combustion reference); losses are the sensible heat of the dry flue gas and of the water
 * vapour leaving at the stack temperature, the latent heat of the water formed from the fuel's
 * hydrogen and its moisture (gross basis only), the chemical heat left in CO and in unburnt
 * carbon, and radiation/casing; credits are the sensible heat the combustion air brings above
 * 25 °C and the latent heat recovered from condensate. Species enthalpies are the NASA
 * polynomials of the actual flue species.
 *
 * Condensation: the flue gas leaves at the stack temperature, saturated when the stack is below
 * its dew point — the water condensed is what saturation at the stack temperature (IAPWS-IF97)
 * leaves behind, and the condensate drains at the stack temperature. The same temperature
 * carries the sensible loss, so a flue gas cannot be charged at one temperature and condensed at
 * another.
 *
 * Unburnt losses: CO in the dry flue gas is charged at its heat of combustion (CO + ½O2 → CO2 at
 * 25 °C, from the same polynomials; 12.6 MJ per m³ of CO at 0 °C); its small effect on the flue
 * gas amount is neglected. Unburnt carbon is stated as % of the residue (ash + unburnt carbon),
 * as ASME PTC 4 and EN 12952-15 measure it; it is charged at 14 500 Btu/lbm (33.7 MJ/kg), the
 * heating value of carbon in residue that ASME PTC 4 uses, and the flue gas and air are those of
 * the carbon actually burnt.
 */
import type { ResolvedFuel } from "../fuels/resolve";
import { stoichiometricO2_mol_per_kg } from "../combustion/stoichiometry";
import type { HeatingValues } from "../combustion/heating-values";
import {
  flueGasPerKgFuel,
  waterDewPointC,
  FLUE_SPECIES,
  NORMAL_MOLAR_VOLUME_m3_per_mol,
  type FlueGas,
  type FlueSpecies,
} from "../combustion/flue-gas";
import { OXIDIZER_SPECIES, type Oxidizer } from "../combustion/stoichiometry";
import { h_J_per_mol, type Nasa7Species } from "../thermo/nasa7";
import { SPECIES } from "../thermo/species-data";
import { saturationPressurePa } from "../thermo/water";
import { atmospherePa, celsiusToKelvin, T0CK, T298K } from "../units/constants";
import { J_per_Btu, kg_per_lb } from "../units/energy";
import { ATOMIC_WEIGHT_g_per_mol } from "../thermo/elements";
import { InputError } from "../errors";

/** Combustion reference temperature of the heat balance, °C (the heating values' reference). */
export const HEAT_BALANCE_REFERENCE_C = 25;

/**
 * Heating value of unburnt carbon in the residue, J/kg: 14 500 Btu/lbm, the value ASME PTC 4
 * (Fired Steam Generators) uses for carbon in residue when it is not measured (value from
 * memory); 1 Btu/lbm = 2.326 kJ/kg exactly.
 */
export const UNBURNT_CARBON_HEATING_VALUE_J_per_kg = (14_500 * J_per_Btu) / kg_per_lb;

export interface EfficiencyConditions {
  /** Air factor λ ≥ 1 of the fuel actually burnt (see burntFuel). */
  lambda: number;
  /** Oxidiser composition (humid air). */
  oxidizer: Oxidizer;
  combustionAirC: number;
  /** Temperature of the flue gas (and of any condensate) leaving the unit, °C. */
  stackTemperatureC: number;
  /** Radiation and casing loss at this operating point, % of the net heat input. */
  radiationLossPercent: number;
  /** CO in the dry flue gas, ppm by volume (0 when not given). */
  coDryPpm?: number;
  /** Unburnt carbon in the residue, % by mass of the residue (ash + carbon); fuels with ash only (0 when not given). */
  unburntCarbonInAshPercent?: number;
  /** Flue-gas pressure, Pa (atmospheric by default). */
  pressurePa?: number;
}

export interface LossTerms {
  /** Sensible heat of CO2, SO2, N2, O2, Ar from 25 °C to the stack temperature. */
  dryFlueGas: number;
  /** Sensible heat of all water (as vapour, before condensation) from 25 °C to the stack temperature. */
  moistureSensible: number;
  /** Latent heat at 25 °C of the water from the fuel's hydrogen and moisture (HHV − LHV); gross basis only. */
  latent: number;
  /** Heat of combustion left in the CO of the flue gas. */
  unburntCO: number;
  /** Heat of combustion left in the unburnt carbon of the residue. */
  unburntCarbon: number;
  /** Radiation and casing loss. */
  radiation: number;
  /** Credit: latent heat recovered from the water condensed at the stack temperature. */
  condensateRecovery: number;
  /** Credit: sensible heat of the combustion air (and its humidity) above 25 °C (negative when colder). */
  airSensibleCredit: number;
}

export interface BasisBalance {
  basis: "gross" | "net";
  /** Fuel heat input on this basis, kJ per kg fuel. */
  input_kJ_per_kg: number;
  useful_kJ_per_kg: number;
  /** useful / input, fraction. */
  efficiency: number;
  /** Each term in % of the input on this basis (credits positive, they raise the efficiency). */
  percent: LossTerms;
  /** Σ losses − Σ credits, % of input. */
  totalLossPercent: number;
}

export interface WaterSplit {
  fromHydrogen_mol_per_kg: number;
  fromFuelMoisture_mol_per_kg: number;
  fromAirHumidity_mol_per_kg: number;
}

export interface EfficiencyResult {
  method: string;
  referenceC: number;
  lambda: number;
  /** Flue gas of the fuel actually burnt (complete combustion), before condensation. */
  flue: FlueGas;
  water: WaterSplit;
  /** Water dew point of the flue gas as formed, °C (null if below 0 °C). */
  dewPointC: number | null;
  /** Temperature at which water condenses (the stack temperature), °C, or null if no water condenses. */
  condensingTemperatureC: number | null;
  condensed_mol_per_kg: number;
  /** Fraction of all flue water condensed. */
  condensedFraction: number;
  condensate_kg_per_kg: number;
  /** Wet flue gas leaving after condensation, mol per kg fuel. */
  wetLeaving_mol_per_kg: number;
  /** Combustion air (humid), mol per kg fuel as fired. */
  oxidizer_mol_per_kg: number;
  /** Unburnt carbon leaving in the residue, kg per kg fuel as fired. */
  unburntCarbon_kg_per_kg: number;
  /** Loss and credit terms, kJ per kg fuel. */
  terms_kJ_per_kg: LossTerms;
  gross: BasisBalance;
  net: BasisBalance;
  /**
   * Flue-gas loss as the German 1. BImSchV (Annex III) defines the quantity its Siegert formula
   * estimates, % of the net heat input: the sensible heat of the whole flue gas (dry gas and all
   * water as vapour) between the combustion-air and the flue-gas temperature; no latent heat, no
   * condensate credit, no unburnt or radiation loss. For the cross-check beside Siegert only.
   */
  siegertDefinitionLossPercent: number;
  /** Direct energy balance (absolute enthalpies in and out) minus the loss-method useful heat, kJ/kg. */
  balanceResidual_kJ_per_kg: number;
}

const hOf = (sp: Nasa7Species, T: number) => h_J_per_mol(sp, T);
const sensible = (sp: Nasa7Species, T: number, Tref: number) => hOf(sp, T) - hOf(sp, Tref);
/** h(25 °C) of each flue species, evaluated once: the reference of every sensible term below. */
const H_REF_J_per_mol = Object.fromEntries(FLUE_SPECIES.map((k) => [k, hOf(SPECIES[k], T298K)])) as Record<FlueSpecies, number>;
/** Sensible heat of a flue species from 25 °C to T (the same difference as `sensible(sp, T, T298K)`). */
const flueSensible = (k: FlueSpecies, T: number) => hOf(SPECIES[k], T) - H_REF_J_per_mol[k];
const WATER_kg_per_mol = (2 * ATOMIC_WEIGHT_g_per_mol.H + ATOMIC_WEIGHT_g_per_mol.O) / 1000;
const CARBON_kg_per_mol = ATOMIC_WEIGHT_g_per_mol.C / 1000;

/** Moles of water vapour that a dry gas can carry at saturation at T (total pressure p). */
export function saturatedVapour_mol(dry_mol: number, temperatureC: number, pressurePa = atmospherePa): number {
  const T = celsiusToKelvin(temperatureC);
  if (T < T0CK) return 0;
  const x = Math.min(saturationPressurePa(T) / pressurePa, 0.999);
  return (dry_mol * x) / (1 - x);
}

/** Heat of combustion of CO at 25 °C (CO + ½O2 → CO2), J/mol, from the NASA polynomials. */
export function coHeatOfCombustion_J_per_mol(): number {
  return hOf(SPECIES.CO, T298K) + 0.5 * hOf(SPECIES.O2, T298K) - hOf(SPECIES.CO2, T298K);
}

/** Heat of combustion of CO per normal m³ (0 °C, 101.325 kPa, ideal gas), MJ/m³. */
export function coHeatOfCombustion_MJ_per_m3(): number {
  return coHeatOfCombustion_J_per_mol() / NORMAL_MOLAR_VOLUME_m3_per_mol / 1e6;
}

/**
 * Unburnt carbon per kg of fuel as fired, kg/kg, from the carbon share of the residue: the residue
 * is the ash plus the unburnt carbon, so m_C = ash · c / (1 − c). `field` names the input in errors.
 */
export function unburntCarbon_kg_per_kg(fuel: ResolvedFuel, carbonInResiduePercent: number, field = "unburntCarbonInAshPercent"): number {
  if (!(carbonInResiduePercent >= 0 && carbonInResiduePercent < 100))
    throw new InputError(field, "must be ≥ 0 % and < 100 % of the residue");
  if (carbonInResiduePercent === 0 || fuel.ash_kg_per_kg <= 0) return 0;
  const c = carbonInResiduePercent / 100;
  const m = (fuel.ash_kg_per_kg * c) / (1 - c);
  const available = fuel.elements_mol_per_kg.C * CARBON_kg_per_mol;
  if (m >= available) {
    throw new InputError(
      field,
      `${carbonInResiduePercent} % carbon in the residue means ${(1000 * m).toFixed(1)} g unburnt carbon per kg fuel, but the fuel holds only ${(1000 * available).toFixed(1)} g carbon per kg`,
    );
  }
  return m;
}

/** The part of a fuel that burns: the fuel less its unburnt carbon (kg per kg fuel as fired). */
export function burntFuel(fuel: ResolvedFuel, unburntC_kg_per_kg: number): ResolvedFuel {
  if (unburntC_kg_per_kg <= 0) return fuel;
  return {
    ...fuel,
    elements_mol_per_kg: { ...fuel.elements_mol_per_kg, C: fuel.elements_mol_per_kg.C - unburntC_kg_per_kg / CARBON_kg_per_mol },
  };
}

/**
 * What the loss account needs that does not depend on the stack temperature: the flue gas of the
 * fuel actually burnt, where its water comes from, the unburnt losses, radiation and the air's
 * credit. `stackAccount` adds the terms of a stack temperature; a caller that varies only the
 * stack (a Monte Carlo draw) prepares this once (`prepareLossAccount`).
 */
export interface LossAccountBase {
  fuel: ResolvedFuel;
  hv: HeatingValues;
  c: EfficiencyConditions;
  p: number;
  Ta: number;
  unburntC: number;
  burnt: ResolvedFuel;
  flue: FlueGas;
  water: WaterSplit;
  dewPointC: number | null;
  latent: number;
  lhv: number;
  hhv: number;
  radiation: number;
  coLoss: number;
  carbonLoss: number;
  nOx: number;
  air: number;
}

/** The stack-independent part of the loss account (checks every condition but the stack temperature). */
export function prepareLossAccount(fuel: ResolvedFuel, hv: HeatingValues, c: EfficiencyConditions): LossAccountBase {
  if (hv.combustionReferenceC !== HEAT_BALANCE_REFERENCE_C) {
    throw new InputError(
      "combustionReferenceC",
      `the heat balance needs heating values at ${HEAT_BALANCE_REFERENCE_C} °C (got ${hv.combustionReferenceC} °C)`,
    );
  }
  if (!(c.radiationLossPercent >= 0 && c.radiationLossPercent < 100))
    throw new InputError("radiationLossPercent", "must be ≥ 0 % and < 100 % of the heat input");
  const coPpm = c.coDryPpm ?? 0;
  if (!(coPpm >= 0 && coPpm < 1e5)) throw new InputError("flueCODryPpm", "must be ≥ 0 and below 100 000 ppm");
  const p = c.pressurePa ?? atmospherePa;
  const T0 = T298K;
  const Ta = celsiusToKelvin(c.combustionAirC);
  const unburntC = unburntCarbon_kg_per_kg(fuel, c.unburntCarbonInAshPercent ?? 0);
  const burnt = burntFuel(fuel, unburntC);
  const flue = flueGasPerKgFuel(burnt, { lambda: c.lambda, oxidizer: c.oxidizer });
  const m = flue.mol_per_kg;

  // Where the water comes from.
  const moist = fuel.moisture_kg_per_kg / WATER_kg_per_mol;
  const fuelWater = fuel.elements_mol_per_kg.H / 2; // hydrogen incl. moisture, as HHV − LHV counts it
  const water: WaterSplit = {
    fromHydrogen_mol_per_kg: fuelWater - moist,
    fromFuelMoisture_mol_per_kg: moist,
    fromAirHumidity_mol_per_kg: m.H2O - fuelWater,
  };
  const dewPointC = waterDewPointC(flue.wetMoleFractions.H2O, p);
  const latent = (hv.hhv_MJ_per_kg - hv.lhv_MJ_per_kg) * 1e6;
  const lhv = hv.lhv_MJ_per_kg * 1e6;
  const hhv = hv.hhv_MJ_per_kg * 1e6;
  const radiation = (c.radiationLossPercent / 100) * lhv;
  const coMol = coPpm * 1e-6 * flue.dry_mol_per_kg;
  const coLoss = coMol * coHeatOfCombustion_J_per_mol();
  const carbonLoss = unburntC * UNBURNT_CARBON_HEATING_VALUE_J_per_kg;
  const nO2 = stoichiometricO2_mol_per_kg(burnt.elements_mol_per_kg);
  const nOx = (c.lambda * nO2) / (c.oxidizer.O2 ?? 0);
  let air = 0;
  for (const k of OXIDIZER_SPECIES) {
    const n = nOx * (c.oxidizer[k] ?? 0);
    if (n > 0) air += n * sensible(SPECIES[k], Ta, T0);
  }
  return { fuel, hv, c, p, Ta, unburntC, burnt, flue, water, dewPointC, latent, lhv, hhv, radiation, coLoss, carbonLoss, nOx, air };
}

/** The stack-temperature terms of a prepared account, J/kg, and the useful heat on both bases. */
function stackAccount(b: LossAccountBase, stackTemperatureC: number, siegert: boolean) {
  if (!(stackTemperatureC > -40)) throw new InputError("stackTemperatureC", "must be above −40 °C");
  const Ts = celsiusToKelvin(stackTemperatureC);
  const m = b.flue.mol_per_kg;
  // Condensation: the flue gas leaves saturated at the stack temperature when that is below its dew point.
  let condensed = 0;
  if (b.dewPointC !== null && stackTemperatureC < b.dewPointC) {
    condensed = Math.max(0, m.H2O - saturatedVapour_mol(b.flue.dry_mol_per_kg, stackTemperatureC, b.p));
  }
  let dry = 0;
  let dryVsAir = 0;
  for (const k of FLUE_SPECIES) {
    if (k === "H2O" || m[k] <= 0) continue;
    dry += m[k] * flueSensible(k, Ts);
    if (siegert) dryVsAir += m[k] * sensible(SPECIES[k], Ts, b.Ta);
  }
  const moistSens = m.H2O * flueSensible("H2O", Ts);
  const condensate = condensed > 0 ? condensed * (hOf(SPECIES.H2O, Ts) - hOf(SPECIES["H2O(L)"], Ts)) : 0;
  const usefulNet = b.lhv - dry - moistSens - b.coLoss - b.carbonLoss - b.radiation + condensate + b.air;
  return { Ts, condensed, dry, dryVsAir, moistSens, condensate, usefulNet };
}

/** Net efficiency of a prepared account at a stack temperature: the `net.efficiency` of heatLossEfficiency, terms only. */
export function netEfficiencyOfAccount(b: LossAccountBase, stackTemperatureC: number): number {
  return stackAccount(b, stackTemperatureC, false).usefulNet / b.lhv;
}

/** Heat-loss (indirect) efficiency of a fuel at one operating condition. */
export function heatLossEfficiency(fuel: ResolvedFuel, hv: HeatingValues, c: EfficiencyConditions): EfficiencyResult {
  const b = prepareLossAccount(fuel, hv, c);
  const { Ta, unburntC, flue, water, dewPointC, latent, lhv, hhv, radiation, coLoss, carbonLoss, nOx, air } = b;
  const T0 = T298K;
  const m = flue.mol_per_kg;
  const { Ts, condensed, dry, dryVsAir, moistSens, condensate, usefulNet } = stackAccount(b, c.stackTemperatureC, true);

  // Loss and credit terms, J/kg.
  const terms: LossTerms = {
    dryFlueGas: dry / 1e3,
    moistureSensible: moistSens / 1e3,
    latent: latent / 1e3,
    unburntCO: coLoss / 1e3,
    unburntCarbon: carbonLoss / 1e3,
    radiation: radiation / 1e3,
    condensateRecovery: condensate / 1e3,
    airSensibleCredit: air / 1e3,
  };
  const usefulGross = hhv - latent - dry - moistSens - coLoss - carbonLoss - radiation + condensate + air; // equal to usefulNet

  const balance = (basis: "gross" | "net", input: number, useful: number): BasisBalance => {
    const pc = (v: number) => (100 * v) / input;
    const percent: LossTerms = {
      dryFlueGas: pc(dry),
      moistureSensible: pc(moistSens),
      latent: basis === "gross" ? pc(latent) : 0,
      unburntCO: pc(coLoss),
      unburntCarbon: pc(carbonLoss),
      radiation: pc(radiation),
      condensateRecovery: pc(condensate),
      airSensibleCredit: pc(air),
    };
    return {
      basis,
      input_kJ_per_kg: input / 1e3,
      useful_kJ_per_kg: useful / 1e3,
      efficiency: useful / input,
      percent,
      totalLossPercent: 100 - (100 * useful) / input,
    };
  };

  // Independent check: absolute enthalpies (formation included) of everything in and out. The CO
  // leaves as CO2 in the flue-gas amounts above, so the heat its oxidation would release is added;
  // the carbon in the residue is carried at the heating value charged for it.
  let hIn = fuel.formationEnthalpy_J_per_kg + fuel.sensibleEnthalpy_J_per_kg(T0);
  for (const k of OXIDIZER_SPECIES) {
    const n = nOx * (c.oxidizer[k] ?? 0);
    if (n > 0) hIn += n * hOf(SPECIES[k], Ta);
  }
  let hOut = 0;
  for (const k of FLUE_SPECIES) {
    const n = k === "H2O" ? m.H2O - condensed : m[k];
    if (n > 0) hOut += n * hOf(SPECIES[k as FlueSpecies], Ts);
  }
  if (condensed > 0) hOut += condensed * hOf(SPECIES["H2O(L)"], Ts);
  hOut += coLoss;
  if (unburntC > 0) hOut += (unburntC / CARBON_kg_per_mol) * (hOf(SPECIES.CO2, T0) - hOf(SPECIES.O2, T0)) + carbonLoss;
  const usefulDirect = hIn - hOut - radiation;

  return {
    method:
      "heat-loss (indirect) method, concepts of EN 12952-15 / ASME PTC 4; NASA polynomial enthalpies; flue gas leaving saturated at the stack temperature (IAPWS-IF97)",
    referenceC: HEAT_BALANCE_REFERENCE_C,
    lambda: c.lambda,
    flue,
    water,
    dewPointC,
    condensingTemperatureC: condensed > 0 ? c.stackTemperatureC : null,
    condensed_mol_per_kg: condensed,
    condensedFraction: m.H2O > 0 ? condensed / m.H2O : 0,
    condensate_kg_per_kg: condensed * WATER_kg_per_mol,
    wetLeaving_mol_per_kg: flue.wet_mol_per_kg - condensed,
    oxidizer_mol_per_kg: nOx,
    unburntCarbon_kg_per_kg: unburntC,
    terms_kJ_per_kg: terms,
    gross: balance("gross", hhv, usefulGross),
    net: balance("net", lhv, usefulNet),
    siegertDefinitionLossPercent: (100 * (dryVsAir + m.H2O * sensible(SPECIES.H2O, Ts, Ta))) / lhv,
    balanceResidual_kJ_per_kg: (usefulDirect - usefulNet) / 1e3,
  };
}

/**
 * The same balance with another radiation and casing share (% of the net heat input): the loss
 * is a constant heat flow, so its share changes with the firing rate while every per-kg term
 * stays. Arithmetic only.
 */
export function withRadiationShare(r: EfficiencyResult, radiationPercentNet: number): EfficiencyResult {
  if (!(radiationPercentNet >= 0 && radiationPercentNet < 100))
    throw new InputError("radiationLossPercent", "must be ≥ 0 % and < 100 % of the heat input");
  const lhv = r.net.input_kJ_per_kg;
  const radiation = (radiationPercentNet / 100) * lhv;
  const dUseful = r.terms_kJ_per_kg.radiation - radiation;
  const basis = (b: BasisBalance): BasisBalance => {
    const useful = b.useful_kJ_per_kg + dUseful;
    return {
      ...b,
      useful_kJ_per_kg: useful,
      efficiency: useful / b.input_kJ_per_kg,
      percent: { ...b.percent, radiation: (100 * radiation) / b.input_kJ_per_kg },
      totalLossPercent: 100 - (100 * useful) / b.input_kJ_per_kg,
    };
  };
  return { ...r, terms_kJ_per_kg: { ...r.terms_kJ_per_kg, radiation }, gross: basis(r.gross), net: basis(r.net) };
}
