/**
 * Energy, mass and volume units used in price quotes and displays. One place for each
 * conversion factor; each factor is an exact definition or carries its source.
 */

/** 1 kWh = 3.6 MJ (exact: 1 W·h = 3600 J). */
export const MJ_per_kWh = 3.6;
/** 1 MWh = 3600 MJ (exact). */
export const MJ_per_MWh = 3600;
/** 1 GJ = 1000 MJ (exact). */
export const MJ_per_GJ = 1000;
/** 1 TJ = 10^6 MJ (exact). */
export const MJ_per_TJ = 1e6;

/**
 * International Table British thermal unit: 1 Btu_IT = 1055.05585262 J (exact: defined via
 * 1 Btu_IT/lb = 2.326 kJ/kg and 1 lb = 0.45359237 kg; NIST SP 811 (2008), App. B.8 lists
 * 1.055 056 E+03 J).
 */
export const J_per_Btu = 1055.05585262;
/** 1 MMBtu = 10^6 Btu_IT = 1055.05585262 MJ. */
export const MJ_per_MMBtu = J_per_Btu; // 10^6 Btu × J/Btu ÷ 10^6 J/MJ
/**
 * Therm (EC) = 100 000 Btu_IT = 105.505585262 MJ (NIST SP 811 (2008), App. B.8: therm (EC)
 * 1.055 06 E+08 J). The US therm (based on the 59 °F Btu) is 105.4804 MJ; Stoke's "therm" is
 * the EC/UK therm.
 */
export const MJ_per_therm = (100_000 * J_per_Btu) / 1e6;

/** 1 t (tonne) = 1000 kg (exact). */
export const kg_per_t = 1000;
/** 1 lb (avoirdupois) = 0.45359237 kg (exact, NIST SP 811 (2008), App. B.8). */
export const kg_per_lb = 0.45359237;

/** 1 L = 10^-3 m³ (exact). */
export const m3_per_L = 1e-3;
/** US gallon = 231 in³ = 3.785411784 L (exact; NIST SP 811 (2008), App. B.8: 3.785 412 E-03 m³). */
export const L_per_USgal = 3.785411784;
/** Cubic foot = (0.3048 m)³ = 0.028316846592 m³ (exact; NIST SP 811 (2008), App. B.8: 2.831 685 E-02 m³). */
export const m3_per_ft3 = 0.3048 ** 3;

/** Energy units a price or figure can be stated in, with their size in MJ. */
export const ENERGY_UNITS_MJ = {
  MWh: MJ_per_MWh,
  GJ: MJ_per_GJ,
  kWh: MJ_per_kWh,
  MMBtu: MJ_per_MMBtu,
  therm: MJ_per_therm,
} as const;
export type EnergyUnit = keyof typeof ENERGY_UNITS_MJ;

/** Mass units, with their size in kg. */
export const MASS_UNITS_KG = { t: kg_per_t, kg: 1 } as const;
export type MassUnit = keyof typeof MASS_UNITS_KG;

/** Volume units, with their size in m³. */
export const VOLUME_UNITS_M3 = { m3: 1, L: m3_per_L, USgal: L_per_USgal * m3_per_L } as const;
export type VolumeUnit = keyof typeof VOLUME_UNITS_M3;

export function convertEnergy(value: number, from: EnergyUnit, to: EnergyUnit): number {
  return (value * ENERGY_UNITS_MJ[from]) / ENERGY_UNITS_MJ[to];
}

/** Human labels for units (display only). */
export const UNIT_LABELS: Record<EnergyUnit | MassUnit | VolumeUnit, string> = {
  MWh: "MWh",
  GJ: "GJ",
  kWh: "kWh",
  MMBtu: "MMBtu",
  therm: "therm",
  t: "t",
  kg: "kg",
  m3: "m³",
  L: "L",
  USgal: "US gal",
};
