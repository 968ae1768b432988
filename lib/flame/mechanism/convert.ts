/**
 * Converts a reaction mechanism in the YAML layout of `gri30.yaml` (elements, species with NASA-7
 * thermo and Lennard-Jones transport data, reactions) into Stoke's own JSON data file, in SI units.
 * Used once per mechanism by `convert-cli.ts`; the app reads only the JSON (see ../mechanism.ts).
 *
 * Unit conversion (done here, nowhere else):
 * - pre-exponential factor A: given in (cm³/mol)^(n−1)/s for a rate of order n in concentrations
 *   (n = sum of reactant orders, +1 for a three-body reaction and for the low-pressure limit of a
 *   fall-off reaction); stored in (m³/mol)^(n−1)/s, i.e. multiplied by (1e-6)^(n−1).
 * - activation energy Ea: given in cal/mol (thermochemical calorie, 4.184 J); stored in J/mol.
 * - NASA-7 coefficients, Troe parameters, temperatures and transport data are unit-free or in K,
 *   Å, Debye, Å³ and are copied digit for digit.
 * Anything this converter does not know (other rate forms, specific colliders "(+AR)", other units)
 * is refused with an error, so a new mechanism cannot be converted half-way.
 */
import { parse } from "yaml";

export const CAL_J = 4.184;
const CM3_M3 = 1e-6;

export interface RawRate {
  A: number;
  b: number;
  Ea_J_per_mol: number;
}
export interface RawReaction {
  equation: string;
  type: "elementary" | "three-body" | "falloff";
  reversible: boolean;
  duplicate: boolean;
  reactants: Record<string, number>;
  products: Record<string, number>;
  /** Non-stoichiometric reactant orders (forward direction), or null. */
  orders: Record<string, number> | null;
  /** Elementary and three-body: the rate constant; fall-off: the high-pressure limit. */
  rate: RawRate;
  /** Fall-off only: the low-pressure limit. */
  lowRate: RawRate | null;
  /** Troe parameters [A, T3, T1, T2]; T2 is null when absent (its term is then dropped). */
  troe: [number, number, number, number | null] | null;
  /** Collision efficiencies of third bodies (three-body and fall-off), or null. */
  efficiencies: Record<string, number> | null;
  defaultEfficiency: number;
}
export interface RawSpecies {
  name: string;
  composition: Record<string, number>;
  thermo: { rangesK: [number, number, number]; low: number[]; high: number[]; note: string };
  transport: {
    geometry: "atom" | "linear" | "nonlinear";
    wellDepthK: number;
    diameterAngstrom: number;
    dipoleDebye: number;
    polarizabilityAngstrom3: number;
    rotationalRelaxation: number;
  };
}
export interface RawMechanism {
  name: string;
  citation: string;
  conversion: string;
  description: string;
  elements: string[];
  species: RawSpecies[];
  reactions: RawReaction[];
}

type Y = Record<string, unknown>;

function fail(msg: string): never {
  throw new Error(`mechanism conversion: ${msg}`);
}

function parseSide(side: string, where: string): { species: Record<string, number>; thirdBody: "none" | "M" | "(+M)" } {
  let s = side.trim();
  let thirdBody: "none" | "M" | "(+M)" = "none";
  const fo = s.match(/\s*\(\+\s*([^)]+)\)\s*$/);
  if (fo) {
    if (fo[1].trim() !== "M") fail(`${where}: fall-off with a specific collider "(+${fo[1]})" is not supported`);
    thirdBody = "(+M)";
    s = s.slice(0, fo.index).trim();
  }
  const out: Record<string, number> = {};
  for (const tokRaw of s.split(/\s+\+\s+/)) {
    const tok = tokRaw.trim();
    if (tok === "M") {
      if (thirdBody !== "none") fail(`${where}: two third bodies`);
      thirdBody = "M";
      continue;
    }
    const m = tok.match(/^(\d+(?:\.\d*)?)\s+(\S+)$/);
    const coeff = m ? Number(m[1]) : 1;
    const name = m ? m[2] : tok;
    if (!name || /\s/.test(name)) fail(`${where}: cannot read "${tok}"`);
    out[name] = (out[name] ?? 0) + coeff;
  }
  return { species: out, thirdBody };
}

function rate(r: unknown, order: number, where: string): RawRate {
  const o = r as Y;
  if (!o || typeof o.A !== "number" || typeof o.b !== "number" || typeof o.Ea !== "number") fail(`${where}: rate needs numeric A, b, Ea`);
  // 12 significant digits: the products carry no more information than the input, and the file stays readable.
  const A = Number(((o.A as number) * CM3_M3 ** (order - 1)).toPrecision(12));
  return { A, b: o.b as number, Ea_J_per_mol: Number(((o.Ea as number) * CAL_J).toPrecision(12)) };
}

function num(v: unknown, dflt: number): number {
  return typeof v === "number" ? v : dflt;
}

const KNOWN_REACTION_KEYS = new Set([
  "equation",
  "type",
  "rate-constant",
  "low-P-rate-constant",
  "high-P-rate-constant",
  "Troe",
  "efficiencies",
  "duplicate",
  "orders",
  "default-efficiency",
  "note",
]);

/** The JSON text of a converted mechanism: one species or reaction per line, so that diffs stay readable. */
export function mechanismJsonText(raw: RawMechanism): string {
  const { species, reactions, ...head } = raw;
  const headText = JSON.stringify(head, null, 1).replace(/\n}$/, "");
  const list = (xs: unknown[]) => `[\n${xs.map((x) => JSON.stringify(x)).join(",\n")}\n]`;
  return `${headText},\n"species": ${list(species)},\n"reactions": ${list(reactions)}\n}\n`;
}

export function convertMechanismYaml(text: string, name: string, citation: string): RawMechanism {
  const doc = parse(text) as Y;
  const units = doc.units as Y;
  if (units?.length !== "cm" || units.time !== "s" || units.quantity !== "mol" || units["activation-energy"] !== "cal/mol") {
    fail(`units must be {length: cm, time: s, quantity: mol, activation-energy: cal/mol}, got ${JSON.stringify(units)}`);
  }
  const phase = (doc.phases as Y[])[0];
  const elements = phase.elements as string[];
  const phaseSpecies = phase.species as string[];
  const byName = new Map<string, Y>();
  for (const sp of doc.species as Y[]) byName.set(sp.name as string, sp);
  const species: RawSpecies[] = phaseSpecies.map((n) => {
    const sp = byName.get(n) ?? fail(`species ${n} listed in the phase but not defined`);
    const th = sp.thermo as Y;
    if (th.model !== "NASA7") fail(`species ${n}: thermo model ${String(th.model)} not supported`);
    const ranges = th["temperature-ranges"] as number[];
    const data = th.data as number[][];
    if (ranges.length !== 3 || data.length !== 2 || data[0].length !== 7 || data[1].length !== 7)
      fail(`species ${n}: NASA7 needs two ranges of 7 coefficients`);
    if (th["reference-pressure"] !== undefined)
      fail(`species ${n}: a reference-pressure other than the mechanism default is not supported`);
    const tr = sp.transport as Y;
    if (tr?.model !== "gas") fail(`species ${n}: gas transport data missing`);
    const geometry = tr.geometry as string;
    if (geometry !== "atom" && geometry !== "linear" && geometry !== "nonlinear") fail(`species ${n}: geometry ${geometry}`);
    const composition = sp.composition as Record<string, number>;
    for (const e of Object.keys(composition)) if (!elements.includes(e)) fail(`species ${n}: element ${e} not in the phase`);
    return {
      name: n,
      composition,
      thermo: { rangesK: [ranges[0], ranges[1], ranges[2]], low: data[0], high: data[1], note: String(th.note ?? "").trim() },
      transport: {
        geometry,
        wellDepthK: num(tr["well-depth"], Number.NaN),
        diameterAngstrom: num(tr.diameter, Number.NaN),
        dipoleDebye: num(tr.dipole, 0),
        polarizabilityAngstrom3: num(tr.polarizability, 0),
        rotationalRelaxation: num(tr["rotational-relaxation"], 0),
      },
    };
  });
  const known = new Set(phaseSpecies);
  const reactions: RawReaction[] = (doc.reactions as Y[]).map((r, i) => {
    const equation = r.equation as string;
    const where = `reaction ${i + 1} (${equation})`;
    for (const k of Object.keys(r)) if (!KNOWN_REACTION_KEYS.has(k)) fail(`${where}: key "${k}" not supported`);
    const reversible = equation.includes("<=>");
    const parts = equation.split(reversible ? "<=>" : "=>");
    if (parts.length !== 2 || (!reversible && equation.includes("<="))) fail(`${where}: cannot split the equation`);
    const lhs = parseSide(parts[0], where);
    const rhs = parseSide(parts[1], where);
    const type = r.type === undefined ? "elementary" : (r.type as string);
    if (type !== "elementary" && type !== "three-body" && type !== "falloff") fail(`${where}: type ${type} not supported`);
    const tb = type === "three-body" ? "M" : type === "falloff" ? "(+M)" : "none";
    if (lhs.thirdBody !== tb || rhs.thirdBody !== tb) fail(`${where}: third body does not match the type ${type}`);
    for (const n of [...Object.keys(lhs.species), ...Object.keys(rhs.species)]) if (!known.has(n)) fail(`${where}: unknown species ${n}`);
    const orders = (r.orders as Record<string, number> | undefined) ?? null;
    if (orders) for (const n of Object.keys(orders)) if (!known.has(n)) fail(`${where}: order for unknown species ${n}`);
    let n = 0;
    for (const [sp, c] of Object.entries(lhs.species)) n += orders && orders[sp] !== undefined ? orders[sp] : c;
    if (orders) for (const [sp, o] of Object.entries(orders)) if (lhs.species[sp] === undefined) n += o;
    let rateHigh: RawRate;
    let lowRate: RawRate | null = null;
    if (type === "falloff") {
      rateHigh = rate(r["high-P-rate-constant"], n, where);
      lowRate = rate(r["low-P-rate-constant"], n + 1, where);
    } else {
      rateHigh = rate(r["rate-constant"], type === "three-body" ? n + 1 : n, where);
    }
    let troe: RawReaction["troe"] = null;
    if (r.Troe !== undefined) {
      if (type !== "falloff") fail(`${where}: Troe on a non-fall-off reaction`);
      const t = r.Troe as Y;
      troe = [t.A as number, t.T3 as number, t.T1 as number, typeof t.T2 === "number" ? t.T2 : null];
    }
    const eff = (r.efficiencies as Record<string, number> | undefined) ?? null;
    if (eff && type === "elementary") fail(`${where}: efficiencies on an elementary reaction`);
    const efficiencies: Record<string, number> | null = eff ? {} : null;
    if (eff && efficiencies) {
      for (const [sp, v] of Object.entries(eff)) {
        if (!known.has(sp)) fail(`${where}: efficiency for unknown species ${sp}`);
        efficiencies[sp] = v;
      }
    }
    return {
      equation,
      type,
      reversible,
      duplicate: r.duplicate === true,
      reactants: lhs.species,
      products: rhs.species,
      orders,
      rate: rateHigh,
      lowRate,
      troe,
      efficiencies,
      defaultEfficiency: num(r["default-efficiency"], 1),
    };
  });
  return {
    name,
    citation,
    conversion:
      "Converted from the mechanism's YAML form (itself a conversion of the CHEMKIN-II files) by lib/flame/mechanism/convert-cli.ts: " +
      "A from (cm^3/mol)^(n-1)/s to (m^3/mol)^(n-1)/s (n = reaction order in concentrations, +1 for three-body reactions and low-pressure limits), " +
      "Ea from cal/mol to J/mol (1 cal = 4.184 J); NASA-7 coefficients (standard-state pressure 1 atm, the CHEMKIN convention), " +
      "Troe parameters, efficiencies and Lennard-Jones data copied unchanged.",
    description: String(doc.description ?? "").trim(),
    elements,
    species,
    reactions,
  };
}
