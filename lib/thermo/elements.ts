/**
 * Atomic weights and molar masses.
 *
 * Atomic weights, g/mol: IUPAC standard atomic weights of 2005 (single values, before IUPAC
 * turned H, C, N, O and S into intervals in 2009), which are the values ISO 6976:2016 uses for
 * its component molar masses — e.g. methane 12.0107 + 4 × 1.00794 = 16.04246 g/mol, nitrogen
 * 2 × 14.0067 = 28.0134 g/mol, carbon dioxide 44.0095 g/mol, exactly as in the ISO 6976:2016
 * component table.
 */
import { InputError } from "../errors";
import { ELEMENTS, type Element } from "./nasa7";

/** Atomic weights, g/mol (IUPAC 2005 standard atomic weights, as used in ISO 6976:2016). */
export const ATOMIC_WEIGHT_g_per_mol: Readonly<Record<Element, number>> = {
  C: 12.0107,
  H: 1.00794,
  O: 15.9994,
  N: 14.0067,
  S: 32.065,
  Ar: 39.948,
};

function isElement(symbol: string): symbol is Element {
  return (ELEMENTS as readonly string[]).includes(symbol);
}

/**
 * Molar mass, g/mol, of a molecule given as atoms per molecule, e.g. { C: 1, H: 4 } → 16.04246.
 * Throws for an unknown element symbol or a negative / non-finite atom count, naming the field.
 */
export function molarMass_g_per_mol(elements: Partial<Record<Element, number>>): number {
  let sum = 0;
  for (const [symbol, count] of Object.entries(elements)) {
    if (count === undefined) continue;
    if (!isElement(symbol)) {
      throw new InputError(`elements.${symbol}`, `unknown element "${symbol}" (known: ${ELEMENTS.join(", ")})`);
    }
    if (!Number.isFinite(count) || count < 0) {
      throw new InputError(`elements.${symbol}`, `atom count must be a finite number ≥ 0, got ${count}`);
    }
    sum += count * ATOMIC_WEIGHT_g_per_mol[symbol];
  }
  return sum;
}
