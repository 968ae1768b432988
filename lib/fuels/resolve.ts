/**
 * Resolves a fuel definition (gas composition, compound, ultimate analysis, blend) into one
 * uniform description per kg of fuel as fired: elements, formation enthalpy, sensible enthalpy,
 * and, for gases, the species mole fractions that ISO 6976 volumetric figures need.
 */
import type { Element } from "../thermo/nasa7";
import { ELEMENTS, h_J_per_mol, sensibleH_J_per_mol } from "../thermo/nasa7";
import { completeProductsEnthalpy_J, waterLatentHeat_J_per_mol } from "../thermo/combustion-products";
import { InputError, joinPath } from "../errors";
import { MOLAR_MASS_g_per_mol, SPECIES } from "../thermo/species-data";
import { ATOMIC_WEIGHT_g_per_mol, molarMass_g_per_mol } from "../thermo/elements";
import { kelvinToCelsius, T298K } from "../units/constants";
import { MAX_BLEND_NESTING, type BlendFuelDefinition, type FuelDefinition } from "../schemas/fuel";
import { compoundVapourPressurePa, LIQUID_COMPOUNDS, LIQUID_FUEL_CP_J_per_kgK, SOLID_FUEL_CP_J_per_kgK } from "./compounds";

export type FuelKind = "gas" | "liquid" | "solid";
export type HeatingValueOrigin = "thermochemistry" | "measured-hhv" | "measured-lhv" | "channiwala-parikh-2002" | "blend";

export type ElementMoles = Record<Element, number>;

export interface ResolvedFuel {
  kind: FuelKind;
  label: string;
  /** Moles of each element per kg of fuel as fired (moisture included). */
  elements_mol_per_kg: ElementMoles;
  moisture_kg_per_kg: number;
  ash_kg_per_kg: number;
  /** Gases only: species mole fractions (keys of species-data), summing to 1. */
  gasComposition?: Record<string, number>;
  /** Gases and pure compounds: molar mass, g/mol. */
  molarMass_g_per_mol?: number;
  /** Liquids: density at 15 °C, kg/m³ (given, or from the compound data). */
  density_kg_per_m3?: number;
  /** Liquids: kinematic viscosity as stated, mm²/s at one or two temperatures (°C). */
  kinematicViscosity?: readonly { temperatureC: number; mm2_per_s: number }[];
  biogenicCarbonShare: number;
  upstreamCo2e_kg_per_GJ?: number;
  /** Standard enthalpy of formation at 298.15 K of the fuel as fed, J/kg. */
  formationEnthalpy_J_per_kg: number;
  /** Sensible enthalpy h(T) − h(298.15 K) of the fuel as fed, J/kg. */
  sensibleEnthalpy_J_per_kg: (temperatureK: number) => number;
  heatingValueOrigin: HeatingValueOrigin;
  /**
   * Liquids whose boiling data are known (compounds and blends of compounds): vapour pressure of
   * the liquid as fed at a temperature (ideal solution, Raoult's law for blends), Pa.
   */
  vapourPressurePa?: (temperatureK: number) => number;
  /** Blends: mass fraction of each component, in the order of the definition (the one blend rule). */
  componentMassFractions?: number[];
  /** Hydrogen mole fraction of a gas (0 for other fuels). */
  h2MoleFraction: number;
  /** Methods and sources behind this description (audit trail). */
  notes: string[];
}

/**
 * Former name of the error a bad fuel definition raises; it is now the common InputError (field path
 * as the user wrote it, e.g. `fuel.composition.CH4`). Kept so that existing imports keep working.
 */
export const FuelDefinitionError = InputError;
export type FuelDefinitionError = InputError;

export { MAX_BLEND_NESTING };

const ZERO = (): ElementMoles => ({ C: 0, H: 0, O: 0, N: 0, S: 0, Ar: 0 });

/** Channiwala & Parikh (2002), Fuel 81, 1051–1063, eq. (HHV, dry basis, mass %): MJ/kg. */
export function channiwalaParikhHHV_MJ_per_kg(dryMassPercent: {
  C: number;
  H: number;
  O: number;
  N: number;
  S: number;
  ash: number;
}): number {
  const { C, H, O, N, S, ash } = dryMassPercent;
  return 0.3491 * C + 1.1783 * H + 0.1005 * S - 0.1034 * O - 0.0151 * N - 0.0211 * ash;
}

/** `fieldOf(key)` names the field to blame; it is only built when the key is refused. */
function speciesOrThrow(key: string, fieldOf: (key: string) => string) {
  const sp = SPECIES[key];
  if (sp?.phase !== "gas") {
    throw new InputError(fieldOf(key), `unknown species "${key}" (known: ${gasSpeciesKeys().join(", ")})`);
  }
  return sp;
}

export function gasSpeciesKeys(): string[] {
  return Object.values(SPECIES)
    .filter((s) => s.phase === "gas")
    .map((s) => s.key);
}

/** `speciesField(key)`: the field to blame for an unknown species key. */
function resolveGas(composition: Record<string, number>, label: string, speciesField: (key: string) => string): ResolvedFuel {
  const total = Object.values(composition).reduce((a, b) => a + b, 0);
  const x: Record<string, number> = {};
  for (const [k, v] of Object.entries(composition)) {
    speciesOrThrow(k, speciesField);
    if (v > 0) x[k] = v / total; // normalise within the accepted ±0.001
  }
  const perMol = ZERO();
  let M = 0;
  let hf = 0;
  for (const [k, xi] of Object.entries(x)) {
    const sp = SPECIES[k];
    for (const e of ELEMENTS) perMol[e] += xi * (sp.elements[e] ?? 0);
    M += xi * MOLAR_MASS_g_per_mol[k];
    hf += xi * h_J_per_mol(sp, T298K);
  }
  const molPerKg = 1000 / M;
  const el = ZERO();
  for (const e of ELEMENTS) el[e] = perMol[e] * molPerKg;
  const keys = Object.keys(x);
  let lastT = Number.NaN;
  let lastH = 0;
  return {
    kind: "gas",
    label,
    elements_mol_per_kg: el,
    moisture_kg_per_kg: 0,
    ash_kg_per_kg: 0,
    gasComposition: x,
    molarMass_g_per_mol: M,
    biogenicCarbonShare: 0,
    formationEnthalpy_J_per_kg: hf * molPerKg,
    // The last temperature's value is kept: a gas is asked again and again at the same few
    // temperatures (25 °C references, the burner inlet), e.g. as a component of every sweep blend.
    sensibleEnthalpy_J_per_kg: (T) => {
      if (T === lastT) return lastH;
      let s = 0;
      for (const k of keys) s += x[k] * sensibleH_J_per_mol(SPECIES[k], T);
      lastT = T;
      lastH = s * molPerKg;
      return lastH;
    },
    heatingValueOrigin: "thermochemistry",
    h2MoleFraction: x.H2 ?? 0,
    notes: ["gas by mole fractions; species enthalpies from NASA 7-coefficient polynomials"],
  };
}

function resolveLiquidCompound(key: string, field: string): ResolvedFuel {
  const c = LIQUID_COMPOUNDS[key];
  if (!c) throw new InputError(field, `unknown liquid compound "${key}" (known: ${Object.keys(LIQUID_COMPOUNDS).join(", ")})`);
  const M = molarMass_g_per_mol(c.elements);
  const molPerKg = 1000 / M;
  const el = ZERO();
  for (const e of ELEMENTS) el[e] = (c.elements[e] ?? 0) * molPerKg;
  return {
    kind: "liquid",
    label: c.name,
    elements_mol_per_kg: el,
    moisture_kg_per_kg: 0,
    ash_kg_per_kg: 0,
    molarMass_g_per_mol: M,
    density_kg_per_m3: c.density15C_kg_per_m3,
    biogenicCarbonShare: 0,
    formationEnthalpy_J_per_kg: c.formationEnthalpyLiquid_J_per_mol * molPerKg,
    sensibleEnthalpy_J_per_kg: (T) => c.cpLiquid_J_per_molK * (T - T298K) * molPerKg,
    vapourPressurePa: (T) => compoundVapourPressurePa(c, T),
    heatingValueOrigin: "thermochemistry",
    h2MoleFraction: 0,
    notes: [`liquid ${c.name} (${c.role}): ${c.source}`, "liquid feed sensible heat with cp at 25 °C (small term)"],
  };
}

function resolveUltimate(def: Extract<FuelDefinition, { ultimate: unknown }>, label: string, field: string): ResolvedFuel {
  const given = def.ultimate;
  const u = {
    C: given.C,
    H: given.H,
    O: given.O ?? 0,
    N: given.N ?? 0,
    S: given.S ?? 0,
    moisture: given.moisture ?? 0,
    ash: given.ash ?? 0,
  };
  const W = ATOMIC_WEIGHT_g_per_mol;
  const Mw = 2 * W.H + W.O;
  const moistMol = (u.moisture * 1000) / Mw;
  const el = ZERO();
  el.C = (u.C * 1000) / W.C;
  el.H = (u.H * 1000) / W.H + 2 * moistMol;
  el.O = (u.O * 1000) / W.O + moistMol;
  el.N = (u.N * 1000) / W.N;
  el.S = (u.S * 1000) / W.S;
  const notes: string[] = ["ultimate analysis as received (mass fractions; H and O exclude moisture)"];
  let hhv_MJ_per_kg: number;
  let origin: HeatingValueOrigin;
  const latent_MJ_per_kg = ((el.H / 2) * waterLatentHeat_J_per_mol(T298K)) / 1e6;
  if (def.hhv_MJ_per_kg !== undefined) {
    hhv_MJ_per_kg = def.hhv_MJ_per_kg;
    origin = "measured-hhv";
    notes.push("measured gross heating value as received at 25 °C");
  } else if (def.lhv_MJ_per_kg !== undefined) {
    hhv_MJ_per_kg = def.lhv_MJ_per_kg + latent_MJ_per_kg;
    origin = "measured-lhv";
    notes.push("measured net heating value as received at 25 °C; gross = net + latent heat of all product water");
  } else {
    const dry = 1 - u.moisture;
    if (dry <= 0) throw new InputError(joinPath(field, "ultimate", "moisture"), "must be < 1 for a correlation");
    const pct = (v: number) => (100 * v) / dry;
    hhv_MJ_per_kg =
      channiwalaParikhHHV_MJ_per_kg({ C: pct(u.C), H: pct(u.H), O: pct(u.O), N: pct(u.N), S: pct(u.S), ash: pct(u.ash) }) * dry;
    origin = "channiwala-parikh-2002";
    notes.push("gross heating value by the Channiwala & Parikh (2002) correlation, Fuel 81:1051–1063, on dry basis, scaled to as received");
  }
  if (!(hhv_MJ_per_kg > latent_MJ_per_kg)) {
    throw new InputError(
      joinPath(field, def.hhv_MJ_per_kg !== undefined ? "hhv_MJ_per_kg" : def.lhv_MJ_per_kg !== undefined ? "lhv_MJ_per_kg" : "ultimate"),
      `gross heating value ${hhv_MJ_per_kg.toFixed(2)} MJ/kg leaves no net heating value for this composition`,
    );
  }
  const cp = (def.kind ?? "solid") === "liquid" ? LIQUID_FUEL_CP_J_per_kgK : SOLID_FUEL_CP_J_per_kgK;
  return {
    kind: def.kind ?? "solid",
    label,
    elements_mol_per_kg: el,
    moisture_kg_per_kg: u.moisture,
    ash_kg_per_kg: u.ash,
    biogenicCarbonShare: 0,
    // Hess's law: h_fuel = HHV + Σ h_products (at 298.15 K, water liquid); O2 has zero formation enthalpy.
    formationEnthalpy_J_per_kg: hhv_MJ_per_kg * 1e6 + completeProductsEnthalpy_J(el, T298K, "liquid"),
    sensibleEnthalpy_J_per_kg: (T) => cp * (T - T298K),
    heatingValueOrigin: origin,
    h2MoleFraction: 0,
    notes:
      (def.kind ?? "solid") === "liquid"
        ? [...notes, "no boiling data for a liquid by ultimate analysis: it is taken as liquid at the feed temperature given"]
        : notes,
  };
}

/**
 * Energy per kg that the energy-share blend rule weighs components by: the standard net enthalpy of
 * complete combustion at 298.15 K (fuel as fed at 298.15 K; O2 in its reference state has h = 0),
 * MJ/kg. It equals the net heating value at a 25 °C combustion reference.
 */
function energyShareWeight_MJ_per_kg(f: ResolvedFuel): number {
  return (f.formationEnthalpy_J_per_kg - completeProductsEnthalpy_J(f.elements_mol_per_kg, T298K, "vapour")) / 1e6;
}

function resolveBlend(def: BlendFuelDefinition, label: string, field: string, depth: number): ResolvedFuel {
  if (depth > MAX_BLEND_NESTING) {
    throw new InputError(joinPath(field, "blend"), `blends nest at most ${MAX_BLEND_NESTING} levels deep`);
  }
  const parts = def.blend.map((c, i) => ({ f: resolveFuelAt(c.fuel, `${field}.blend.${i}.fuel`, depth), share: c.share }));
  return blendOfResolved(parts, def.basis, label, field);
}

/**
 * A blend of already resolved components (shares on `basis`), exactly as `resolveFuel` blends a
 * blend definition's components: a caller that blends the same components at many shares (a
 * hydrogen sweep) resolves each component once. `field` is the blend's field (errors name
 * `field.blend.N…`).
 */
export function blendOfResolved(
  parts: readonly { f: ResolvedFuel; share: number }[],
  basis: BlendFuelDefinition["basis"],
  label: string,
  field: string,
): ResolvedFuel {
  const kinds = new Set(parts.map((p) => p.f.kind));
  if (kinds.size !== 1) throw new InputError(`${field}.blend`, "blend components must all be gases, all liquids or all solids");
  const kind = parts[0].f.kind;
  // Mass of each component per unit of the basis share.
  let massPerShare: number[];
  if (basis === "mass") massPerShare = parts.map(() => 1);
  else if (basis === "energy") {
    massPerShare = parts.map((p, i) => {
      const e = energyShareWeight_MJ_per_kg(p.f);
      if (!(e > 0))
        throw new InputError(
          `${field}.blend.${i}.share`,
          "this component releases no heat, so it cannot carry a share of the energy; blend it by volume or mass",
        );
      return 1 / e;
    });
  } else {
    if (kind === "gas") massPerShare = parts.map((p) => p.f.molarMass_g_per_mol! / 1000);
    else if (kind === "liquid") {
      massPerShare = parts.map((p, i) => {
        const rho = p.f.density_kg_per_m3;
        if (!rho)
          throw new InputError(`${field}.blend.${i}.fuel.densityKgPerM3`, "a volume blend of liquids needs each component's density");
        return rho;
      });
    } else throw new InputError(`${field}.basis`, "solids blend by mass or energy, not by volume");
  }
  const masses = parts.map((p, i) => p.share * massPerShare[i]);
  const totalMass = masses.reduce((a, b) => a + b, 0);
  const w = masses.map((m) => m / totalMass);
  const el = ZERO();
  let hf = 0,
    moist = 0,
    ash = 0,
    carbon = 0,
    bioCarbon = 0;
  parts.forEach((p, i) => {
    for (const e of ELEMENTS) el[e] += w[i] * p.f.elements_mol_per_kg[e];
    hf += w[i] * p.f.formationEnthalpy_J_per_kg;
    moist += w[i] * p.f.moisture_kg_per_kg;
    ash += w[i] * p.f.ash_kg_per_kg;
    carbon += w[i] * p.f.elements_mol_per_kg.C;
    bioCarbon += w[i] * p.f.elements_mol_per_kg.C * p.f.biogenicCarbonShare;
  });
  const out: ResolvedFuel = {
    kind,
    label,
    elements_mol_per_kg: el,
    moisture_kg_per_kg: moist,
    ash_kg_per_kg: ash,
    biogenicCarbonShare: carbon > 0 ? bioCarbon / carbon : 0,
    formationEnthalpy_J_per_kg: hf,
    sensibleEnthalpy_J_per_kg: (T) => parts.reduce((s, p, i) => s + w[i] * p.f.sensibleEnthalpy_J_per_kg(T), 0),
    heatingValueOrigin: parts.every((p) => p.f.heatingValueOrigin === "thermochemistry") ? "thermochemistry" : "blend",
    h2MoleFraction: 0,
    componentMassFractions: w,
    notes: [`blend by ${basis} share of ${parts.length} components; mass fractions ${w.map((v) => v.toFixed(4)).join(" / ")}`],
  };
  // Upstream CO2e of the blend: energy-weighted over the components, known only when every component
  // states one (a component without a stated factor makes the blend's figure unknown, never 0).
  const upstream = parts.map((p) => p.f.upstreamCo2e_kg_per_GJ);
  const missing = upstream.flatMap((u, i) => (u === undefined ? [i] : []));
  if (missing.length === 0) {
    const energy = parts.map((p, i) => w[i] * energyShareWeight_MJ_per_kg(p.f));
    const e = energy.reduce((a, b) => a + b, 0);
    out.upstreamCo2e_kg_per_GJ = parts.reduce((s, _p, i) => s + (energy[i] / e) * (upstream[i] as number), 0);
  } else if (missing.length < parts.length) {
    out.notes.push(
      `upstream CO2e unknown: component${missing.length > 1 ? "s" : ""} ${missing.join(", ")} state${missing.length > 1 ? "" : "s"} no factor`,
    );
  }
  if (kind === "gas") {
    const molesPerKg = parts.map((p, i) => (w[i] * 1000) / p.f.molarMass_g_per_mol!);
    const nTot = molesPerKg.reduce((a, b) => a + b, 0);
    const comp: Record<string, number> = {};
    parts.forEach((p, i) => {
      for (const [k, xi] of Object.entries(p.f.gasComposition!)) comp[k] = (comp[k] ?? 0) + (xi * molesPerKg[i]) / nTot;
    });
    out.gasComposition = comp;
    out.molarMass_g_per_mol = 1000 / nTot;
    out.h2MoleFraction = comp.H2 ?? 0;
  }
  if (kind === "liquid" && parts.every((p) => p.f.vapourPressurePa && p.f.molarMass_g_per_mol)) {
    // Raoult's law over the components: mole fractions from the mass fractions.
    const n = parts.map((p, i) => w[i] / p.f.molarMass_g_per_mol!);
    const nTot = n.reduce((a, b) => a + b, 0);
    out.vapourPressurePa = (T) => parts.reduce((sum, p, i) => sum + (n[i] / nTot) * p.f.vapourPressurePa!(T), 0);
  }
  if (kind === "liquid" && parts.every((p) => p.f.density_kg_per_m3)) {
    out.density_kg_per_m3 = 1 / parts.reduce((s, p, i) => s + w[i] / p.f.density_kg_per_m3!, 0);
  }
  return out;
}

function resolveFuelAt(def: FuelDefinition, field: string, depth: number): ResolvedFuel {
  const label = def.name ?? "";
  let f: ResolvedFuel;
  if ("composition" in def)
    f = resolveGas(def.composition, label || describeComposition(def.composition), (k) => joinPath(field, "composition", k));
  else if ("compound" in def) {
    if (def.phase === "liquid") f = resolveLiquidCompound(def.compound, `${field}.compound`);
    else {
      if (SPECIES[def.compound]?.phase !== "gas") {
        const hint = LIQUID_COMPOUNDS[def.compound]
          ? ` — ${def.compound} is known as a liquid: set phase "liquid"`
          : ` (known gases: ${gasSpeciesKeys().join(", ")})`;
        throw new InputError(`${field}.compound`, `unknown species "${def.compound}"${hint}`);
      }
      f = resolveGas({ [def.compound]: 1 }, label || def.compound, () => joinPath(field, "compound"));
    }
    if (label) f.label = label;
  } else if ("ultimate" in def) f = resolveUltimate(def, label || `${def.kind ?? "solid"} fuel by ultimate analysis`, field);
  else f = resolveBlend(def, label || "blend", field, depth + 1);
  if (def.biogenicCarbonShare !== undefined) f.biogenicCarbonShare = def.biogenicCarbonShare;
  if (def.upstreamCo2e_kg_per_GJ !== undefined) f.upstreamCo2e_kg_per_GJ = def.upstreamCo2e_kg_per_GJ;
  if (def.densityKgPerM3 !== undefined) f.density_kg_per_m3 = def.densityKgPerM3;
  if (def.kinematicViscosity !== undefined) f.kinematicViscosity = def.kinematicViscosity;
  return f;
}

function describeComposition(c: Record<string, number>): string {
  return Object.entries(c)
    .filter(([, v]) => v > 0)
    .sort((a, b) => b[1] - a[1])
    .map(([k, v]) => `${k} ${(100 * v).toFixed(v < 0.1 ? 1 : 0)}%`)
    .join(" / ");
}

/** Resolves a (validated) fuel definition. Throws InputError naming the field under `field`. */
export function resolveFuel(def: FuelDefinition, field = "fuel"): ResolvedFuel {
  return resolveFuelAt(def, field, 0);
}

/** Bubble point of a liquid at pressure p, K: p^sat(T) = p, by bisection (p^sat rises with T). */
export function bubblePointK(vapourPressurePa: (temperatureK: number) => number, pressurePa: number): number {
  let lo = 150;
  let hi = 1500;
  for (let i = 0; i < 80 && hi - lo > 1e-6; i++) {
    const mid = 0.5 * (lo + hi);
    if (vapourPressurePa(mid) > pressurePa) hi = mid;
    else lo = mid;
  }
  return 0.5 * (lo + hi);
}

/**
 * A liquid fuel must be fed below its boiling point at the stated pressure: otherwise it would be
 * vapour, and treating it as liquid would be silently wrong. Throws InputError naming `field`.
 * Liquids without boiling data (ultimate analyses) are taken as liquid at the temperature given
 * (their resolved notes say so).
 */
export function checkLiquidFeed(fuel: ResolvedFuel, temperatureK: number, pressurePa: number, field = "fuelTemperatureK"): void {
  if (fuel.kind !== "liquid" || !fuel.vapourPressurePa) return;
  const tb = bubblePointK(fuel.vapourPressurePa, pressurePa);
  if (temperatureK >= tb) {
    throw new InputError(
      field,
      `${fuel.label || "the liquid fuel"} boils at ${tb.toFixed(1)} K (${kelvinToCelsius(tb).toFixed(1)} °C) at ${(pressurePa / 1000).toFixed(1)} kPa: fed at ${temperatureK.toFixed(1)} K it would be vapour, not liquid — feed it colder, or describe it as a gas (compound with phase "gas")`,
    );
  }
}
