/**
 * Oxidiser demand and the four ways of stating how much oxidiser is supplied:
 * equivalence ratio φ, air factor λ = 1/φ, excess air (λ − 1)·100 %, and the measured O2 in the
 * dry flue gas (complete combustion, λ ≥ 1).
 */
import type { ElementMoles, ResolvedFuel } from "../fuels/resolve";
import { InfeasibleChargeError, InputError } from "../errors";
import { MOLAR_MASS_g_per_mol } from "../thermo/species-data";
import { saturationPressurePa } from "../thermo/water";
import { atmospherePa, celsiusToKelvin } from "../units/constants";
import type { OxidizerComposition } from "../schemas/fuel";

/** Stoichiometric O2 for complete combustion (C→CO2, H→H2O, S→SO2), mol per kg (or per any amount of `el`). */
export function stoichiometricO2_mol_per_kg(el: ElementMoles): number {
  return el.C + el.H / 4 + el.S - el.O / 2;
}

/**
 * Refuses a "fuel" that needs no oxygen (pure N2, O2, CO2, …): nothing in it burns. `field` names the
 * fuel as the user wrote it; the message names the fuel by its label. Returns the stoichiometric O2.
 */
export function assertCombustible(fuel: ResolvedFuel, field = "fuel"): number {
  const nO2 = stoichiometricO2_mol_per_kg(fuel.elements_mol_per_kg);
  if (!(nO2 > 0)) {
    const name = fuel.label ? `"${fuel.label}"` : "this fuel";
    throw new InfeasibleChargeError(
      field,
      nO2 < 0
        ? `${name} holds more oxygen than its combustible part needs: it is an oxidiser, not a fuel`
        : `${name} contains nothing that burns: any carbon, hydrogen or sulfur in it is already fully oxidised`,
      "no-combustible",
    );
  }
  return nO2;
}

export type OxidizerSpecies = "O2" | "N2" | "Ar" | "CO2" | "H2O";
export const OXIDIZER_SPECIES: readonly OxidizerSpecies[] = ["O2", "N2", "Ar", "CO2", "H2O"];
export type Oxidizer = Partial<Record<OxidizerSpecies, number>>;

/** Dry air by mole fractions (US Standard Atmosphere 1976, CO2 rounded; common practice). */
export const DRY_AIR: Oxidizer = { N2: 0.78084, O2: 0.20946, Ar: 0.00934, CO2: 0.00036 };

/** O2-enriched air: dry air with O2 raised to `o2MoleFraction`, the rest scaled. */
export function enrichedAir(o2MoleFraction: number): Oxidizer {
  const rest = 1 - (DRY_AIR.O2 ?? 0);
  const k = (1 - o2MoleFraction) / rest;
  return { O2: o2MoleFraction, N2: DRY_AIR.N2! * k, Ar: DRY_AIR.Ar! * k, CO2: DRY_AIR.CO2! * k };
}

/** Humid air at a relative humidity (0–1) and temperature, total pressure p (IAPWS-IF97 saturation). */
export function humidAir(relativeHumidity: number, temperatureC: number, pressurePa = atmospherePa): Oxidizer {
  const xw = (relativeHumidity * saturationPressurePa(celsiusToKelvin(temperatureC))) / pressurePa;
  const out: Oxidizer = { H2O: xw };
  for (const s of ["N2", "O2", "Ar", "CO2"] as const) out[s] = DRY_AIR[s]! * (1 - xw);
  return out;
}

export function normaliseOxidizer(ox: OxidizerComposition | Oxidizer | undefined): Oxidizer {
  const src = ox ?? DRY_AIR;
  const total = OXIDIZER_SPECIES.reduce((s, k) => s + (src[k] ?? 0), 0);
  const out: Oxidizer = {};
  for (const k of OXIDIZER_SPECIES) if (src[k]) out[k] = src[k]! / total;
  return out;
}

export function oxidizerMolarMass_g_per_mol(ox: Oxidizer): number {
  return OXIDIZER_SPECIES.reduce((s, k) => s + (ox[k] ?? 0) * MOLAR_MASS_g_per_mol[k], 0);
}

export interface OxidizerDemand {
  O2_mol_per_kg: number;
  O2_kg_per_kg: number;
  oxidizer_mol_per_kg: number;
  oxidizer_kg_per_kg: number;
  /** Gases and pure compounds: moles of oxidiser per mole of fuel. */
  oxidizer_mol_per_mol?: number;
  O2_mol_per_mol?: number;
}

/** Stoichiometric oxidiser demand (complete combustion: C→CO2, H→H2O, S→SO2). */
export function oxidizerDemand(fuel: ResolvedFuel, oxidizer: Oxidizer = DRY_AIR): OxidizerDemand {
  const nO2 = assertCombustible(fuel);
  const xO2 = oxidizer.O2 ?? 0;
  const nOx = nO2 / xO2;
  const out: OxidizerDemand = {
    O2_mol_per_kg: nO2,
    O2_kg_per_kg: (nO2 * MOLAR_MASS_g_per_mol.O2) / 1000,
    oxidizer_mol_per_kg: nOx,
    oxidizer_kg_per_kg: (nOx * oxidizerMolarMass_g_per_mol(oxidizer)) / 1000,
  };
  if (fuel.molarMass_g_per_mol) {
    out.oxidizer_mol_per_mol = (nOx * fuel.molarMass_g_per_mol) / 1000;
    out.O2_mol_per_mol = (nO2 * fuel.molarMass_g_per_mol) / 1000;
  }
  return out;
}

export const phiFromLambda = (lambda: number) => 1 / lambda;
export const lambdaFromPhi = (phi: number) => 1 / phi;
export const excessAirPercentFromLambda = (lambda: number) => (lambda - 1) * 100;
export const lambdaFromExcessAirPercent = (excessAirPercent: number) => 1 + excessAirPercent / 100;

/**
 * Dry flue-gas moles per kg fuel as a linear function of λ: dry(λ) = a + b·λ
 * (complete combustion, λ ≥ 1). Returns [a, b, nO2stoich].
 */
function dryLinear(fuel: ResolvedFuel, ox: Oxidizer): [number, number, number] {
  const el = fuel.elements_mol_per_kg;
  const nO2 = stoichiometricO2_mol_per_kg(el);
  const perLambdaOx = nO2 / (ox.O2 ?? 0); // oxidiser moles per unit λ
  const dryFracOx = 1 - (ox.H2O ?? 0);
  // dry = C + S + N/2 + Ar_fuel + λ·ox·(1 − xH2O) − O2 consumed (nO2, since O2 in products is λ·nO2 − nO2)
  const a = el.C + el.S + el.N / 2 + el.Ar - nO2;
  const b = perLambdaOx * dryFracOx;
  return [a, b, nO2];
}

/** O2 in the dry flue gas, vol % (complete combustion). */
export function flueO2DryFromLambda(fuel: ResolvedFuel, lambda: number, oxidizer: Oxidizer = DRY_AIR): number {
  const [a, b, nO2] = dryLinear(fuel, oxidizer);
  return (100 * (lambda - 1) * nO2) / (a + b * lambda);
}

/** λ from the measured O2 in the dry flue gas (vol %), complete combustion. */
export function lambdaFromFlueO2Dry(fuel: ResolvedFuel, o2DryPercent: number, oxidizer: Oxidizer = DRY_AIR): number {
  const [a, b, nO2] = dryLinear(fuel, oxidizer);
  const y = o2DryPercent / 100;
  const yMax = nO2 / b; // O2 share of the dry oxidiser
  if (!(y >= 0 && y < yMax)) {
    throw new InputError(
      "flueO2DryPercent",
      `must be ≥ 0 and below the oxidiser's ${(100 * yMax).toFixed(1)} % O2 (dry), got ${o2DryPercent}`,
    );
  }
  return (y * a + nO2) / (nO2 - y * b);
}
