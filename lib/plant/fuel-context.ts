/**
 * Per-fuel figures a plant evaluation needs, computed once per fuel state and cached:
 * the resolved fuel, heating values at 25 °C, CO2 factors, and (gases) Wobbe index and real-gas
 * density at the requested references. Two definitions that resolve to the same state (e.g. a
 * stored 20 % hydrogen blend and the 20 % point of a sweep) share one entry.
 */
import type { FuelDefinition } from "../schemas/fuel";
import { resolveFuel, type ResolvedFuel } from "../fuels/resolve";
import { heatingValues, type HeatingValues } from "../combustion/heating-values";
import { co2Factors, type Co2Factors } from "../combustion/co2";
import { realDensity_kg_per_m3, volumetricFigures } from "../combustion/iso6976";
import type { FuelEnergyContent } from "../combustion/energy-content";
import { HEAT_BALANCE_REFERENCE_C } from "./efficiency";

export interface WobbeFigures {
  combustionReferenceC: number;
  meteringReferenceC: number;
  gross_MJ_per_m3: number;
  net_MJ_per_m3: number;
  relativeDensity: number;
}

export interface FuelContext {
  /** Key of the fuel's state (composition / elements / enthalpy), shared by identical fuels. */
  key: string;
  label: string;
  fuel: ResolvedFuel;
  /** Heating values at 25 °C (the heat balance's reference). */
  hv: HeatingValues;
  co2: Co2Factors;
  /** Hydrogen share of a gas, vol % (0 otherwise). */
  h2SharePercent: number;
  /** Wobbe figures at a combustion and metering reference (gases; null otherwise). */
  wobbe(combustionReferenceC: number, meteringReferenceC: number): WobbeFigures | null;
  /** Real-gas density at a metering temperature (gases), kg/m³. */
  gasDensity_kg_per_m3(meteringReferenceC: number): number;
  /** What price normalisation needs. */
  energyContent: FuelEnergyContent;
}

const fmt = (v: number) => (v === 0 ? "0" : v.toPrecision(12));

/**
 * A key that is equal for fuels in the same state. A gas is fully described by its composition
 * (elements and formation enthalpy follow from it); other fuels by elements, moisture, ash and
 * formation enthalpy (which carries the heating value).
 */
export function fuelStateKey(f: ResolvedFuel): string {
  const attrs = [
    fmt(f.biogenicCarbonShare),
    f.upstreamCo2e_kg_per_GJ === undefined ? "-" : fmt(f.upstreamCo2e_kg_per_GJ),
    f.density_kg_per_m3 === undefined ? "-" : fmt(f.density_kg_per_m3),
    f.kinematicViscosity ? f.kinematicViscosity.map((p) => `${fmt(p.temperatureC)}:${fmt(p.mm2_per_s)}`).join(";") : "-",
  ].join("|");
  if (f.kind === "gas" && f.gasComposition) {
    let comp = "";
    for (const k of Object.keys(f.gasComposition).sort()) {
      const x = f.gasComposition[k];
      if (x > 1e-14) comp += `${k}:${fmt(x)},`;
    }
    return `gas|${comp}|${attrs}`;
  }
  const el = f.elements_mol_per_kg;
  return [
    f.kind,
    fmt(el.C),
    fmt(el.H),
    fmt(el.O),
    fmt(el.N),
    fmt(el.S),
    fmt(el.Ar),
    fmt(f.moisture_kg_per_kg),
    fmt(f.ash_kg_per_kg),
    fmt(f.formationEnthalpy_J_per_kg),
    attrs,
  ].join("|");
}

function buildContext(fuel: ResolvedFuel, key: string): FuelContext {
  const hv = heatingValues(fuel, HEAT_BALANCE_REFERENCE_C);
  const co2 = co2Factors(fuel, hv);
  const wobbeMemo = new Map<number, WobbeFigures | null>();
  const densityMemo = new Map<number, number>();
  const isGas = fuel.kind === "gas" && fuel.gasComposition !== undefined && fuel.molarMass_g_per_mol !== undefined;
  const gasDensity = (tm: number): number => {
    if (!isGas) throw new RangeError(`${fuel.label || "this fuel"} is not a gas: no gas density`);
    let d = densityMemo.get(tm);
    if (d === undefined) {
      d = realDensity_kg_per_m3(fuel.gasComposition!, fuel.molarMass_g_per_mol!, tm);
      densityMemo.set(tm, d);
    }
    return d;
  };
  return {
    key,
    label: fuel.label,
    fuel,
    hv,
    co2,
    h2SharePercent: 100 * fuel.h2MoleFraction,
    wobbe(tc, tm) {
      if (!isGas) return null;
      const k = tc * 1000 + tm; // references are a handful of small numbers
      let w = wobbeMemo.get(k);
      if (w === undefined) {
        // Wobbe index and relative density per ISO 6976:2016, by the same function as the property sheet.
        const hvT = tc === HEAT_BALANCE_REFERENCE_C ? hv : heatingValues(fuel, tc);
        const v = volumetricFigures(
          fuel.gasComposition!,
          fuel.molarMass_g_per_mol!,
          { hhv_kJ_per_mol: hvT.hhv_kJ_per_mol!, lhv_kJ_per_mol: hvT.lhv_kJ_per_mol!, combustionReferenceC: tc },
          tm,
        );
        w = {
          combustionReferenceC: tc,
          meteringReferenceC: tm,
          gross_MJ_per_m3: v.wobbe.gross_MJ_per_m3,
          net_MJ_per_m3: v.wobbe.net_MJ_per_m3,
          relativeDensity: v.relativeDensity,
        };
        wobbeMemo.set(k, w);
      }
      return w;
    },
    gasDensity_kg_per_m3: gasDensity,
    energyContent: {
      kind: fuel.kind,
      hhv_MJ_per_kg: hv.hhv_MJ_per_kg,
      lhv_MJ_per_kg: hv.lhv_MJ_per_kg,
      density_kg_per_m3: fuel.density_kg_per_m3 ?? null,
      ...(isGas ? { gasDensity_kg_per_m3: gasDensity } : {}),
    },
  };
}

/** Cache of fuel contexts for one evaluation (or longer: entries never go stale). */
export class FuelContextCache {
  private readonly byState = new Map<string, FuelContext>();
  private readonly byDefinition = new Map<string, FuelContext>();

  /** Resolves a definition (throws FuelDefinitionError naming `field`) and returns its context. */
  fromDefinition(def: FuelDefinition, field = "fuel"): FuelContext {
    const dk = JSON.stringify(def);
    const hit = this.byDefinition.get(dk);
    if (hit) return hit;
    const ctx = this.fromResolved(resolveFuel(def, field));
    this.byDefinition.set(dk, ctx);
    return ctx;
  }

  /**
   * A fuel the caller resolves itself (e.g. a sweep's blend of resolved components), keyed by the
   * caller's string (e.g. "h2-sweep:…:20") so that on a hit nothing is built or serialised again.
   */
  fromKeyedResolved(cacheKey: string, resolve: () => ResolvedFuel): FuelContext {
    const dk = `#${cacheKey}`;
    const hit = this.byDefinition.get(dk);
    if (hit) return hit;
    const ctx = this.fromResolved(resolve());
    this.byDefinition.set(dk, ctx);
    return ctx;
  }

  fromResolved(fuel: ResolvedFuel): FuelContext {
    const key = fuelStateKey(fuel);
    let ctx = this.byState.get(key);
    if (!ctx) {
      ctx = buildContext(fuel, key);
      this.byState.set(key, ctx);
    }
    return ctx;
  }

  get size(): number {
    return this.byState.size;
  }
}
