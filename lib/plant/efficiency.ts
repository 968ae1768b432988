/**
 * Efficiency of a fired unit by the heat-loss (indirect) method, on the gross and on the net
 * basis, per kg of fuel as fired.
 *
 * Concepts of EN 12952-15 and ASME PTC 4: reference temperature 25 °C (the heating values'
 * combustion reference); losses are the sensible heat of the dry flue gas and of the water
 * vapour leaving at the stack temperature, the latent heat of the water formed from the fuel's
 * hydrogen and its moisture (gross basis only), and radiation/casing; credits are the sensible
 * heat the combustion air brings above 25 °C and the heat recovered from condensate. Species
 * enthalpies are the NASA polynomials of the actual flue species; the condensed fraction follows
 * from the IAPWS-IF97 saturation pressure. The same bookkeeping closes exactly:
 *   useful + Σ losses − Σ credits = fuel heat input (HHV or LHV at 25 °C).
 */
import type { ResolvedFuel } from "../fuels/resolve";
import { stoichiometricO2_mol_per_kg } from "../combustion/stoichiometry";
import type { HeatingValues } from "../combustion/heating-values";
import { flueGasPerKgFuel, waterDewPointC, FLUE_SPECIES, type FlueGas, type FlueSpecies } from "../combustion/flue-gas";
import { OXIDIZER_SPECIES, type Oxidizer } from "../combustion/stoichiometry";
import { h_J_per_mol, type Nasa7Species } from "../thermo/nasa7";
import { SPECIES } from "../thermo/species-data";
import { saturationPressurePa } from "../thermo/water";
import { atmospherePa, celsiusToKelvin, T298K } from "../units/constants";
import { ATOMIC_WEIGHT_g_per_mol } from "../thermo/elements";

/** Combustion reference temperature of the heat balance, °C (the heating values' reference). */
export const HEAT_BALANCE_REFERENCE_C = 25;

export interface EfficiencyConditions {
  /** Air factor λ ≥ 1 (complete combustion). */
  lambda: number;
  /** Oxidiser composition (humid air). */
  oxidizer: Oxidizer;
  combustionAirC: number;
  stackTemperatureC: number;
  /** Radiation and casing loss, % of the net heat input. */
  radiationLossPercent: number;
  /**
   * Temperature at which water condenses out of the flue gas (coldest heat-exchange surface),
   * °C; the vapour leaving is limited to the saturation pressure there. null = no condensing
   * surface below the stack temperature (then the stack temperature itself applies).
   */
  condensingSurfaceC: number | null;
  /** Flue-gas pressure, Pa (atmospheric by default). */
  pressurePa?: number;
}

export interface LossTerms {
  /** Sensible heat of CO2, SO2, N2, O2, Ar from 25 °C to the stack temperature. */
  dryFlueGas: number;
  /** Sensible heat of all water vapour (before condensation) from 25 °C to the stack temperature. */
  moistureSensible: number;
  /** Latent heat at 25 °C of the water from the fuel's hydrogen and moisture (HHV − LHV); gross basis only. */
  latent: number;
  /** Radiation and casing loss. */
  radiation: number;
  /** Credit: heat recovered from water condensed at the condensing temperature. */
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
  flue: FlueGas;
  water: WaterSplit;
  /** Water dew point of the flue gas as formed, °C (null if below 0 °C). */
  dewPointC: number | null;
  /** Temperature used for condensation, °C, or null if no water condenses. */
  condensingTemperatureC: number | null;
  condensed_mol_per_kg: number;
  /** Fraction of all flue water condensed. */
  condensedFraction: number;
  condensate_kg_per_kg: number;
  /** Wet flue gas leaving after condensation, mol per kg fuel. */
  wetLeaving_mol_per_kg: number;
  /** Loss and credit terms, kJ per kg fuel. */
  terms_kJ_per_kg: LossTerms;
  gross: BasisBalance;
  net: BasisBalance;
  /**
   * Flue-gas sensible loss referred to the combustion-air temperature, % of net input: what the
   * Siegert rule of thumb (German 1. BImSchV) estimates; for cross-checks only.
   */
  flueLossVsAirNetPercent: number;
  /** Direct energy balance (absolute enthalpies in and out) minus the loss-method useful heat, kJ/kg. */
  balanceResidual_kJ_per_kg: number;
}

const hOf = (sp: Nasa7Species, T: number) => h_J_per_mol(sp, T);
const sensible = (sp: Nasa7Species, T: number, Tref: number) => hOf(sp, T) - hOf(sp, Tref);
const WATER_kg_per_mol = (2 * ATOMIC_WEIGHT_g_per_mol.H + ATOMIC_WEIGHT_g_per_mol.O) / 1000;

/** Moles of water vapour that a dry gas can carry at saturation at T (total pressure p). */
export function saturatedVapour_mol(dry_mol: number, temperatureC: number, pressurePa = atmospherePa): number {
  const T = celsiusToKelvin(temperatureC);
  if (T < 273.15) return 0;
  const x = Math.min(saturationPressurePa(T) / pressurePa, 0.999);
  return (dry_mol * x) / (1 - x);
}

/** Heat-loss (indirect) efficiency of a fuel at one operating condition. */
export function heatLossEfficiency(fuel: ResolvedFuel, hv: HeatingValues, c: EfficiencyConditions): EfficiencyResult {
  if (hv.combustionReferenceC !== HEAT_BALANCE_REFERENCE_C) {
    throw new RangeError(`the heat balance needs heating values at ${HEAT_BALANCE_REFERENCE_C} °C (got ${hv.combustionReferenceC} °C)`);
  }
  if (!(c.stackTemperatureC > -40)) throw new RangeError("stack temperature out of range");
  const p = c.pressurePa ?? atmospherePa;
  const T0 = T298K;
  const Ts = celsiusToKelvin(c.stackTemperatureC);
  const Ta = celsiusToKelvin(c.combustionAirC);
  const flue = flueGasPerKgFuel(fuel, { lambda: c.lambda, oxidizer: c.oxidizer });
  const m = flue.mol_per_kg;

  // Where the water comes from.
  const moist = fuel.moisture_kg_per_kg / WATER_kg_per_mol;
  const fuelWater = fuel.elements_mol_per_kg.H / 2; // hydrogen incl. moisture, as HHV − LHV counts it
  const water: WaterSplit = {
    fromHydrogen_mol_per_kg: fuelWater - moist,
    fromFuelMoisture_mol_per_kg: moist,
    fromAirHumidity_mol_per_kg: m.H2O - fuelWater,
  };

  // Condensation: the vapour leaving is limited to saturation at the condensing temperature.
  const dewPointC = waterDewPointC(flue.wetMoleFractions.H2O, p);
  const Tc_C = c.condensingSurfaceC === null ? c.stackTemperatureC : Math.min(c.condensingSurfaceC, c.stackTemperatureC);
  let condensed = 0;
  if (dewPointC !== null && Tc_C < dewPointC) {
    condensed = Math.max(0, m.H2O - saturatedVapour_mol(flue.dry_mol_per_kg, Tc_C, p));
  }
  const Tc = celsiusToKelvin(Tc_C);

  // Loss and credit terms, J/kg.
  let dry = 0;
  let dryVsAir = 0;
  for (const k of FLUE_SPECIES) {
    if (k === "H2O" || m[k] <= 0) continue;
    dry += m[k] * sensible(SPECIES[k], Ts, T0);
    dryVsAir += m[k] * sensible(SPECIES[k], Ts, Ta);
  }
  const moistSens = m.H2O * sensible(SPECIES.H2O, Ts, T0);
  const latent = (hv.hhv_MJ_per_kg - hv.lhv_MJ_per_kg) * 1e6;
  const lhv = hv.lhv_MJ_per_kg * 1e6;
  const hhv = hv.hhv_MJ_per_kg * 1e6;
  const radiation = (c.radiationLossPercent / 100) * lhv;
  const condensate = condensed > 0 ? condensed * (hOf(SPECIES.H2O, Ts) - hOf(SPECIES["H2O(L)"], Tc)) : 0;
  const nO2 = stoichiometricO2_mol_per_kg(fuel.elements_mol_per_kg);
  const nOx = (c.lambda * nO2) / (c.oxidizer.O2 ?? 0);
  let air = 0;
  for (const k of OXIDIZER_SPECIES) {
    const n = nOx * (c.oxidizer[k] ?? 0);
    if (n > 0) air += n * sensible(SPECIES[k], Ta, T0);
  }
  const terms: LossTerms = {
    dryFlueGas: dry / 1e3,
    moistureSensible: moistSens / 1e3,
    latent: latent / 1e3,
    radiation: radiation / 1e3,
    condensateRecovery: condensate / 1e3,
    airSensibleCredit: air / 1e3,
  };
  const usefulNet = lhv - dry - moistSens - radiation + condensate + air;
  const usefulGross = hhv - latent - dry - moistSens - radiation + condensate + air; // equal to usefulNet

  const balance = (basis: "gross" | "net", input: number, useful: number): BasisBalance => {
    const pc = (v: number) => (100 * v) / input;
    const percent: LossTerms = {
      dryFlueGas: pc(dry),
      moistureSensible: pc(moistSens),
      latent: basis === "gross" ? pc(latent) : 0,
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
      totalLossPercent:
        percent.dryFlueGas + percent.moistureSensible + percent.latent + percent.radiation - percent.condensateRecovery - percent.airSensibleCredit,
    };
  };

  // Independent check: absolute enthalpies (formation included) of everything in and out.
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
  if (condensed > 0) hOut += condensed * hOf(SPECIES["H2O(L)"], Tc);
  const usefulDirect = hIn - hOut - radiation;

  return {
    method: "heat-loss (indirect) method, concepts of EN 12952-15 / ASME PTC 4; NASA polynomial enthalpies; IAPWS-IF97 saturation",
    referenceC: HEAT_BALANCE_REFERENCE_C,
    lambda: c.lambda,
    flue,
    water,
    dewPointC,
    condensingTemperatureC: condensed > 0 ? Tc_C : null,
    condensed_mol_per_kg: condensed,
    condensedFraction: m.H2O > 0 ? condensed / m.H2O : 0,
    condensate_kg_per_kg: condensed * WATER_kg_per_mol,
    wetLeaving_mol_per_kg: flue.wet_mol_per_kg - condensed,
    terms_kJ_per_kg: terms,
    gross: balance("gross", hhv, usefulGross),
    net: balance("net", lhv, usefulNet),
    flueLossVsAirNetPercent: (100 * (dryVsAir + m.H2O * sensible(SPECIES.H2O, Ts, Ta))) / lhv,
    balanceResidual_kJ_per_kg: (usefulDirect - usefulNet) / 1e3,
  };
}
