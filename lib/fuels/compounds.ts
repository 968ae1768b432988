/**
 * Condensed-phase fuel compounds: what a liquid fed cold needs beyond the gas-phase polynomials.
 * Each record gives the liquid's standard enthalpy of formation at 298.15 K (from which its
 * heating value follows by Hess's law), its liquid heat capacity near 25 °C (used only for the
 * small sensible heat of a preheated liquid feed) and its density at 15 °C.
 */
import type { Element } from "../thermo/nasa7";
import { atmospherePa, R_J_per_molK } from "../units/constants";

export interface LiquidCompound {
  key: string;
  name: string;
  elements: Partial<Record<Element, number>>;
  /** Standard enthalpy of formation of the liquid at 298.15 K, J/mol. */
  formationEnthalpyLiquid_J_per_mol: number;
  /** Key of the gas-phase species in species-data, when the vapour has polynomials. */
  gasSpeciesKey?: string;
  /** Liquid heat capacity near 25 °C, J/(mol·K). */
  cpLiquid_J_per_molK: number;
  /** Liquid density at 15 °C, kg/m³. */
  density15C_kg_per_m3: number;
  /** Normal boiling point (101.325 kPa), K. */
  normalBoilingPointK: number;
  /** Enthalpy of vaporisation at the normal boiling point, J/mol; absent: Trouton's rule. */
  vaporizationEnthalpy_J_per_mol?: number;
  /** Role in Stoke's fuel library (surrogate for ...). */
  role: string;
  source: string;
}

/**
 * Heats of formation derived from heats of combustion use CO2(g) −393.51 and H2O(l) −285.83 kJ/mol
 * (CODATA key values, Cox, Wagman & Medvedev 1989).
 */
export const LIQUID_COMPOUNDS: Record<string, LiquidCompound> = {
  CH3OH: {
    key: "CH3OH",
    name: "methanol",
    elements: { C: 1, H: 4, O: 1 },
    formationEnthalpyLiquid_J_per_mol: -239.2e3,
    gasSpeciesKey: "CH3OH",
    cpLiquid_J_per_molK: 81.1,
    density15C_kg_per_m3: 796,
    normalBoilingPointK: 337.8,
    vaporizationEnthalpy_J_per_mol: 35.2e3,
    role: "pure compound",
    source:
      "ΔfH°(l) −239.2 kJ/mol (value from memory), within the NIST Chemistry WebBook's determinations for liquid methanol, −238.4 to −239.5 kJ/mol (Chao & Rossini 1965: −239.5 ± 0.2; Green 1960: −238.9; Baroody & Carpenter 1972: −238.4); cp(l) 81.1 J/(mol·K): NIST Chemistry WebBook, methanol (value from memory); density: common practice, no source; Tb 337.8 K, ΔvapH(Tb) 35.2 kJ/mol: NIST Chemistry WebBook, methanol (value from memory)",
  },
  C2H5OH: {
    key: "C2H5OH",
    name: "ethanol",
    elements: { C: 2, H: 6, O: 1 },
    formationEnthalpyLiquid_J_per_mol: -277.0e3,
    gasSpeciesKey: "C2H5OH",
    cpLiquid_J_per_molK: 112.3,
    density15C_kg_per_m3: 794,
    normalBoilingPointK: 351.4,
    vaporizationEnthalpy_J_per_mol: 38.6e3,
    role: "pure compound",
    source:
      "ΔfH°(l) −277.0 kJ/mol, cp(l) 112.3 J/(mol·K): NIST Chemistry WebBook, ethanol (value from memory); density: common practice, no source; Tb 351.4 K, ΔvapH(Tb) 38.6 kJ/mol: NIST Chemistry WebBook, ethanol (value from memory)",
  },
  C12H26: {
    key: "C12H26",
    name: "n-dodecane",
    elements: { C: 12, H: 26 },
    formationEnthalpyLiquid_J_per_mol: -350.9e3,
    cpLiquid_J_per_molK: 375.8,
    density15C_kg_per_m3: 753,
    normalBoilingPointK: 489.5,
    role: "n-alkane surrogate for gas oil",
    source:
      "ΔfH°(l) −350.9 kJ/mol, cp(l) 375.8 J/(mol·K): NIST Chemistry WebBook, dodecane (value from memory); Tb 489.5 K: NIST Chemistry WebBook, dodecane (value from memory)",
  },
  C16H34: {
    key: "C16H34",
    name: "n-hexadecane",
    elements: { C: 16, H: 34 },
    formationEnthalpyLiquid_J_per_mol: -456.1e3,
    cpLiquid_J_per_molK: 501.6,
    density15C_kg_per_m3: 777,
    normalBoilingPointK: 560.0,
    role: "n-alkane surrogate for hydrotreated vegetable oil (HVO)",
    source:
      "ΔfH°(l) −456.1 kJ/mol, cp(l) 501.6 J/(mol·K): NIST Chemistry WebBook, hexadecane (value from memory); Tb 560 K: NIST Chemistry WebBook, hexadecane (value from memory)",
  },
  C19H36O2: {
    key: "C19H36O2",
    name: "methyl oleate",
    elements: { C: 19, H: 36, O: 2 },
    // From a gross heat of combustion of about 11 890 kJ/mol (40.1 MJ/kg).
    formationEnthalpyLiquid_J_per_mol: -(19 * 393.51 + 18 * 285.83 - 11890) * 1e3,
    cpLiquid_J_per_molK: 590,
    density15C_kg_per_m3: 877,
    normalBoilingPointK: 617,
    role: "methyl ester (FAME biodiesel) component",
    source:
      "from gross heat of combustion ≈ 40.1 MJ/kg of methyl oleate (value from memory); cp(l) ≈ 2.0 kJ/(kg·K) (value from memory); Tb ≈ 617 K (value from memory)",
  },
  C17H34O2: {
    key: "C17H34O2",
    name: "methyl palmitate",
    elements: { C: 17, H: 34, O: 2 },
    formationEnthalpyLiquid_J_per_mol: -(17 * 393.51 + 17 * 285.83 - 10670) * 1e3,
    cpLiquid_J_per_molK: 540,
    density15C_kg_per_m3: 865,
    normalBoilingPointK: 611,
    role: "methyl ester (FAME biodiesel) component",
    source:
      "from gross heat of combustion ≈ 39.45 MJ/kg of methyl palmitate (value from memory); cp(l) ≈ 2.0 kJ/(kg·K) (value from memory); Tb ≈ 611 K (value from memory)",
  },
  C19H34O2: {
    key: "C19H34O2",
    name: "methyl linoleate",
    elements: { C: 19, H: 34, O: 2 },
    formationEnthalpyLiquid_J_per_mol: -(19 * 393.51 + 17 * 285.83 - 11690) * 1e3,
    cpLiquid_J_per_molK: 590,
    density15C_kg_per_m3: 892,
    normalBoilingPointK: 639,
    role: "methyl ester (FAME biodiesel) component",
    source:
      "from gross heat of combustion ≈ 39.7 MJ/kg of methyl linoleate (value from memory); cp(l) ≈ 2.0 kJ/(kg·K) (value from memory); Tb ≈ 639 K (value from memory)",
  },
};

/** Heat capacity of solid fuel as fired (wood, pellets) for sensible heat of the feed, J/(kg·K). */
export const SOLID_FUEL_CP_J_per_kgK = 1500; // common practice, no source (dry wood 1.2–1.6 kJ/(kg·K))
/** Heat capacity of a liquid fuel given by ultimate analysis (oils), J/(kg·K). */
export const LIQUID_FUEL_CP_J_per_kgK = 1900; // common practice, no source (fuel oils 1.8–2.1 kJ/(kg·K))

/** Trouton's rule: entropy of vaporisation at the normal boiling point of a non-associated liquid, J/(mol·K) (common practice, no source). */
export const TROUTON_ENTROPY_J_per_molK = 88;

/**
 * Saturation pressure of a liquid compound at T, Pa: Clausius–Clapeyron through the normal
 * boiling point with a constant enthalpy of vaporisation (its value at Tb, or Trouton's rule).
 * Good to a few kelvin in boiling point between about 0.3 and 10 bar.
 */
export function compoundVapourPressurePa(c: LiquidCompound, temperatureK: number): number {
  const dH = c.vaporizationEnthalpy_J_per_mol ?? TROUTON_ENTROPY_J_per_molK * c.normalBoilingPointK;
  return atmospherePa * Math.exp((-dH / R_J_per_molK) * (1 / temperatureK - 1 / c.normalBoilingPointK));
}
