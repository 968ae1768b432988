/**
 * Reaction mechanisms for the flame engine: species, NASA-7 thermo, Lennard-Jones transport data and
 * reactions, read from the project's own JSON data files (made once from the published mechanism by
 * ./mechanism/convert-cli.ts, SI units, see the `conversion` note in each file). No YAML at run time.
 *
 * Mechanism thermo vs Stoke's species data: the flame engine (kinetics, flame, post-flame) uses the
 * mechanism's own NASA-7 records (standard-state pressure 1 atm, the CHEMKIN convention), so that
 * reverse rates and the flame's energy balance are those the mechanism was built with. Stoke's
 * equilibrium solver and the plant model use lib/thermo/species-data.ts (NASA Glenn, 1 bar); the two
 * differ slightly (e.g. enthalpies of formation by a few hundred J/mol for some species).
 */
import { ATOMIC_WEIGHT_g_per_mol } from "../thermo/elements";
import type { Element } from "../thermo/nasa7";
import { atmospherePa } from "../units/constants";
import type { RawMechanism, RawRate } from "./mechanism/convert";
import gri30Json from "./mechanism/gri30.json";

export type ReactionType = "elementary" | "three-body" | "falloff";

export interface ReactionData {
  readonly equation: string;
  readonly type: ReactionType;
  readonly reversible: boolean;
  readonly duplicate: boolean;
  /** Species indices and stoichiometric coefficients of the reactants (left side, without M). */
  readonly reactantIndex: readonly number[];
  readonly reactantCoeff: readonly number[];
  readonly productIndex: readonly number[];
  readonly productCoeff: readonly number[];
  /**
   * Orders of the forward rate in the concentrations: equal to the reactant coefficients unless the
   * mechanism gives non-standard `orders`. The reverse rate always uses the product coefficients.
   */
  readonly forwardOrderIndex: readonly number[];
  readonly forwardOrder: readonly number[];
  readonly hasNonStandardOrders: boolean;
  /** Rate constant k = A T^b exp(−Ea/RT), SI ((m³/mol)^(n−1)/s, J/mol). Fall-off: the high-pressure limit. */
  readonly rate: RawRate;
  /** Fall-off only: low-pressure limit k0 (one order higher). */
  readonly lowRate: RawRate | null;
  /** Troe parameters [A, T3, T1, T2] (T2 null when the mechanism omits it), fall-off only; null = Lindemann. */
  readonly troe: readonly [number, number, number, number | null] | null;
  /** Third-body efficiencies for every species (default efficiency where none is given); null for elementary reactions. */
  readonly efficiencies: Float64Array | null;
}

export interface Mechanism {
  readonly name: string;
  readonly citation: string;
  /** How the data file was made from the published mechanism (units converted, what was copied). */
  readonly conversion: string;
  readonly nSpecies: number;
  readonly speciesNames: readonly string[];
  readonly speciesIndex: ReadonlyMap<string, number>;
  readonly elementNames: readonly string[];
  /** atoms of element e in species k at [e * nSpecies + k] */
  readonly elementMatrix: Float64Array;
  readonly molarMass_kg_per_mol: Float64Array;
  /** NASA-7 per species: [Tlow, Tmid, Thigh, low a1..a7, high a1..a7] at [k * 17 ...] */
  readonly nasa7: Float64Array;
  /** Standard-state pressure of the NASA-7 data, Pa (1 atm for CHEMKIN-format mechanisms). */
  readonly standardPressurePa: number;
  /** transport data per species (Float64Array of length nSpecies each) */
  readonly transport: {
    geometry: Uint8Array; // 0 atom, 1 linear, 2 nonlinear
    wellDepthK: Float64Array; // ε/k_B
    diameterAngstrom: Float64Array; // σ
    dipoleDebye: Float64Array;
    polarizabilityAngstrom3: Float64Array;
    rotationalRelaxation: Float64Array; // Z_rot at 298 K
  };
  readonly reactions: readonly ReactionData[];
}

export type MechanismName = "gri30";

/** The data files Stoke carries. To add a mechanism: see DEVELOPERS.md (flame engine). */
const DATA: Readonly<Record<MechanismName, unknown>> = { gri30: gri30Json };

const cache = new Map<string, Mechanism>();

/** Builds the typed mechanism from its converted JSON form. Exported for tests (fresh conversions). */
export function buildMechanism(raw: RawMechanism): Mechanism {
  const nS = raw.species.length;
  const speciesNames = raw.species.map((s) => s.name);
  const speciesIndex = new Map<string, number>(speciesNames.map((n, i) => [n, i]));
  const elementNames = raw.elements;
  const elementMatrix = new Float64Array(elementNames.length * nS);
  const molarMass = new Float64Array(nS);
  const nasa7 = new Float64Array(nS * 17);
  const geometry = new Uint8Array(nS);
  const wellDepthK = new Float64Array(nS);
  const diameterAngstrom = new Float64Array(nS);
  const dipoleDebye = new Float64Array(nS);
  const polarizabilityAngstrom3 = new Float64Array(nS);
  const rotationalRelaxation = new Float64Array(nS);
  raw.species.forEach((sp, k) => {
    let m = 0;
    for (const [el, count] of Object.entries(sp.composition)) {
      const e = elementNames.indexOf(el);
      if (e < 0) throw new Error(`mechanism ${raw.name}: species ${sp.name} has element ${el} outside the element list`);
      elementMatrix[e * nS + k] = count;
      const w = ATOMIC_WEIGHT_g_per_mol[el as Element];
      if (w === undefined) throw new Error(`mechanism ${raw.name}: no atomic weight for element ${el}`);
      m += count * w;
    }
    molarMass[k] = m / 1000;
    nasa7.set(sp.thermo.rangesK, k * 17);
    nasa7.set(sp.thermo.low, k * 17 + 3);
    nasa7.set(sp.thermo.high, k * 17 + 10);
    const t = sp.transport;
    geometry[k] = t.geometry === "atom" ? 0 : t.geometry === "linear" ? 1 : 2;
    wellDepthK[k] = t.wellDepthK;
    diameterAngstrom[k] = t.diameterAngstrom;
    dipoleDebye[k] = t.dipoleDebye;
    polarizabilityAngstrom3[k] = t.polarizabilityAngstrom3;
    rotationalRelaxation[k] = t.rotationalRelaxation;
  });
  const idx = (n: string) => {
    const i = speciesIndex.get(n);
    if (i === undefined) throw new Error(`mechanism ${raw.name}: unknown species ${n}`);
    return i;
  };
  const reactions: ReactionData[] = raw.reactions.map((r) => {
    const rs = Object.entries(r.reactants);
    const ps = Object.entries(r.products);
    let forwardOrderIndex = rs.map(([n]) => idx(n));
    let forwardOrder = rs.map(([, c]) => c);
    if (r.orders) {
      const o = new Map<number, number>(rs.map(([n, c]) => [idx(n), c]));
      for (const [n, v] of Object.entries(r.orders)) o.set(idx(n), v);
      forwardOrderIndex = [...o.keys()];
      forwardOrder = [...o.values()];
    }
    let efficiencies: Float64Array | null = null;
    if (r.type !== "elementary") {
      efficiencies = new Float64Array(nS).fill(r.defaultEfficiency);
      if (r.efficiencies) for (const [n, v] of Object.entries(r.efficiencies)) efficiencies[idx(n)] = v;
    }
    return {
      equation: r.equation,
      type: r.type,
      reversible: r.reversible,
      duplicate: r.duplicate,
      reactantIndex: rs.map(([n]) => idx(n)),
      reactantCoeff: rs.map(([, c]) => c),
      productIndex: ps.map(([n]) => idx(n)),
      productCoeff: ps.map(([, c]) => c),
      forwardOrderIndex,
      forwardOrder,
      hasNonStandardOrders: r.orders !== null,
      rate: r.rate,
      lowRate: r.lowRate,
      troe: r.troe,
      efficiencies,
    };
  });
  return {
    name: raw.name,
    citation: raw.citation,
    conversion: raw.conversion,
    nSpecies: nS,
    speciesNames,
    speciesIndex,
    elementNames,
    elementMatrix,
    molarMass_kg_per_mol: molarMass,
    nasa7,
    // CHEMKIN-format thermo data (and so the mechanism's equilibrium constants) refer to 1 atm.
    standardPressurePa: atmospherePa,
    transport: { geometry, wellDepthK, diameterAngstrom, dipoleDebye, polarizabilityAngstrom3, rotationalRelaxation },
    reactions,
  };
}

/** The mechanism, parsed once and cached (the returned object is shared: do not modify its arrays). */
export function loadMechanism(name: MechanismName = "gri30"): Mechanism {
  let m = cache.get(name);
  if (!m) {
    m = buildMechanism(DATA[name] as RawMechanism);
    cache.set(name, m);
  }
  return m;
}
