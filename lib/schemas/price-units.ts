/** The units and energy bases a price quote may be stated in (the vocabulary; the factors live in lib/units/energy.ts). */
export const PRICE_UNITS = ["MWh", "GJ", "kWh", "MMBtu", "therm", "t", "kg", "L", "USgal", "m3"] as const;
export type PriceUnit = (typeof PRICE_UNITS)[number];
export const ENERGY_BASES = ["gross", "net"] as const;
export type EnergyBasis = (typeof ENERGY_BASES)[number];
