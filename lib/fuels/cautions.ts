/**
 * Safety cautions that apply to a fuel, derived from what it contains. Stoke is a screening tool:
 * every caution defers to local codes, the equipment maker and licensed engineers.
 */
import type { FuelDefinition } from "../schemas/fuel";

export type HazardKey =
  | "hydrogen"
  | "biogas"
  | "ammonia"
  | "methanol"
  | "lpg"
  | "carbon-monoxide"
  | "solid-biomass"
  | "liquid-fuel"
  | "burner-change";

export interface Caution {
  hazard: HazardKey;
  title: string;
  text: string;
}

export const DEFER = "Stoke is a screening and feasibility tool: local codes, the equipment maker and licensed engineers decide.";

const TEXT: Record<HazardKey, Omit<Caution, "hazard">> = {
  hydrogen: {
    title: "Hydrogen",
    text: "Wide flammability range (about 4–75 % in air), very low ignition energy, a nearly invisible flame, higher flame speed with risk of flashback, embrittlement of some steels, and leaks that are hard to detect. Fuel train, leak detection, flame supervision and hazardous-area zoning must be reviewed for hydrogen service.",
  },
  biogas: {
    title: "Biogas and landfill gas",
    text: "Raw biogas can carry hydrogen sulfide (toxic even at low concentrations, corrosive, forms SO2 and acid condensate) and siloxanes (silica deposits on burners and heat-transfer surfaces). Gas clean-up, H2S monitoring and material compatibility need review.",
  },
  ammonia: {
    title: "Ammonia",
    text: "Toxic and corrosive; narrow flammability range and slow flame, hard to stabilise; fuel nitrogen raises NOx. Storage and handling fall under toxic-substance rules.",
  },
  methanol: {
    title: "Methanol",
    text: "Toxic by ingestion, inhalation and skin contact; burns with a nearly invisible flame; low flash point. Needs compatible seals and fire-detection that sees its flame.",
  },
  lpg: {
    title: "LPG (propane/butane)",
    text: "Heavier than air: leaks collect in pits, drains and basements. Storage under pressure; vaporiser and regulator design per local LPG rules.",
  },
  "carbon-monoxide": {
    title: "Carbon monoxide in the fuel",
    text: "Syngas and similar fuels contain CO, which is toxic and odourless: gas detection and ventilation are essential.",
  },
  "solid-biomass": {
    title: "Solid biomass",
    text: "Stored pellets can give off carbon monoxide; dust is explosive. Storage ventilation, dust control and fire protection need review.",
  },
  "liquid-fuel": {
    title: "Liquid fuel",
    text: "Storage, bunding, spill control and atomisation must suit the fuel's flash point, viscosity and material compatibility (biofuels attack some elastomers).",
  },
  "burner-change": {
    title: "Burner and fuel-train changes",
    text: "Any change of fuel or blend needs the burner maker's approval, re-commissioning of the combustion controls and acceptance by the local gas-safety authority.",
  },
};

interface Found {
  species: Set<string>;
  compounds: Set<string>;
  ultimate: { kind: string } | null;
  co2Rich: boolean;
}

function walk(def: FuelDefinition, f: Found): void {
  if ("composition" in def) {
    for (const [k, v] of Object.entries(def.composition)) if (v > 0) f.species.add(k);
    if ((def.composition.CO2 ?? 0) >= 0.2) f.co2Rich = true;
  } else if ("compound" in def) {
    (def.phase === "liquid" ? f.compounds : f.species).add(def.compound);
    if (def.phase === "liquid") f.compounds.add("liquid");
  } else if ("ultimate" in def) f.ultimate = { kind: def.kind ?? "solid" };
  else for (const c of def.blend) walk(c.fuel, f);
}

/** The cautions for a fuel definition (always ends with the burner-change caution). */
export function cautionsFor(def: FuelDefinition): Caution[] {
  const f: Found = { species: new Set(), compounds: new Set(), ultimate: null, co2Rich: false };
  walk(def, f);
  const keys: HazardKey[] = [];
  if (f.species.has("H2")) keys.push("hydrogen");
  // Raw biogas or landfill gas (H2S, or CH4 with ≥ 20 % CO2); upgraded biomethane is not flagged.
  if (f.species.has("H2S") || (f.co2Rich && f.species.has("CH4"))) keys.push("biogas");
  if (f.species.has("NH3")) keys.push("ammonia");
  if (f.species.has("CH3OH") || f.compounds.has("CH3OH")) keys.push("methanol");
  if (f.species.has("C3H8") || f.species.has("nC4H10") || f.species.has("iC4H10")) {
    if (
      !f.species.has("CH4") ||
      ("composition" in def && (def.composition.C3H8 ?? 0) + (def.composition.nC4H10 ?? 0) + (def.composition.iC4H10 ?? 0) > 0.5)
    )
      keys.push("lpg");
  }
  if (f.species.has("CO")) keys.push("carbon-monoxide");
  if (f.ultimate?.kind === "solid") keys.push("solid-biomass");
  if (f.compounds.has("liquid") || f.ultimate?.kind === "liquid") keys.push("liquid-fuel");
  keys.push("burner-change");
  return keys.map((hazard) => ({ hazard, ...TEXT[hazard] }));
}
