/**
 * The Siegert formula of the German small-firing-installations ordinance (1. BImSchV, Annex III):
 * a rule of thumb for the flue-gas loss,
 *   qA = (t_flue − t_air) · (A2 / (21 − O2) + B)   [% of the net heat input]
 * with O2 in vol % of the dry flue gas. Stoke uses it only as a cross-check of the heat-loss
 * method, never for a result.
 *
 * Constants (value from memory, medium-high confidence; some sources give A2 = 0.65 for gas):
 * fuel oil A2 0.68, B 0.007; natural gas A2 0.66, B 0.009; LPG A2 0.63, B 0.008.
 */
import type { ResolvedFuel } from "../fuels/resolve";
import { InputError } from "../errors";

export const SIEGERT_FUEL_CLASSES = ["natural-gas", "fuel-oil", "lpg"] as const;
export type SiegertFuelClass = (typeof SIEGERT_FUEL_CLASSES)[number];

export const SIEGERT_CONSTANTS: Record<SiegertFuelClass, { A2: number; B: number; label: string }> = {
  "fuel-oil": { A2: 0.68, B: 0.007, label: "fuel oil" },
  "natural-gas": { A2: 0.66, B: 0.009, label: "natural gas" },
  lpg: { A2: 0.63, B: 0.008, label: "LPG" },
};

export const SIEGERT_SOURCE =
  "Siegert formula, German 1. BImSchV (small firing installations ordinance), Annex III; constants A2/B as commonly quoted (value from memory)";

/**
 * What the heat-loss figure set beside the Siegert result is: the regulation's definition of the
 * flue-gas loss, computed separately from the efficiency terms.
 */
export const SIEGERT_COMPARISON_DEFINITION =
  "flue-gas loss as 1. BImSchV defines it: sensible heat of the dry flue gas and of all its water as vapour, from the combustion-air to the flue-gas temperature, % of the net heat input; no latent heat, no condensate credit, no unburnt or radiation loss";

/** Flue-gas loss by the Siegert formula, % of net heat input. */
export function siegertLossPercent(fuelClass: SiegertFuelClass, flueC: number, airC: number, o2DryPercent: number): number {
  if (!(o2DryPercent < 21)) throw new InputError("flueO2DryPercent", "must be below 21 vol %");
  const { A2, B } = SIEGERT_CONSTANTS[fuelClass];
  return (flueC - airC) * (A2 / (21 - o2DryPercent) + B);
}

/**
 * The Siegert class a fuel falls in, or null when the formula's constants do not apply
 * (hydrogen blends, biogas, alcohols, solids …).
 */
export function siegertClassOf(fuel: ResolvedFuel): SiegertFuelClass | null {
  if (fuel.kind === "gas" && fuel.gasComposition) {
    const x = fuel.gasComposition;
    const ch4 = x.CH4 ?? 0;
    const lpg = (x.C3H8 ?? 0) + (x.nC4H10 ?? 0) + (x.iC4H10 ?? 0);
    const inert = (x.CO2 ?? 0) + (x.N2 ?? 0);
    if (ch4 >= 0.8 && (x.H2 ?? 0) <= 0.02 && inert <= 0.15) return "natural-gas";
    if (lpg >= 0.9) return "lpg";
    return null;
  }
  if (fuel.kind === "liquid") {
    const el = fuel.elements_mol_per_kg;
    // Mineral oils: no oxygen, H/C atom ratio about 1.5–2.2.
    const hc = el.C > 0 ? el.H / el.C : 0;
    if (el.O < 0.05 * el.C && hc > 1.4 && hc < 2.3 && fuel.moisture_kg_per_kg < 0.01) return "fuel-oil";
  }
  return null;
}
