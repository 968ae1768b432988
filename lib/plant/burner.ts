/**
 * The burner on the day the gas changes, before anyone retunes it, beside the retuned burner.
 *
 * Model (stated in every result's notes):
 * - Heat input at a fixed gas orifice and a regulated supply pressure: the gas volume flow varies as
 *   1/√(relative density) (orifice equation at a fixed pressure drop), so the heat input varies with
 *   the Wobbe index (net, at the same metering reference). Without a regulated supply the change is
 *   not predictable from the gas alone and the result says so.
 * - Air: with a fixed mechanical linkage the air volume flow stays as set on the baseline gas; with
 *   pneumatic gas/air ratio control the air follows the gas volume (the volume ratio stays); with O2
 *   trim the flue O2 set-point is restored (λ as retuned).
 * - Air demand per m³ of gas from the stoichiometric oxidiser per mole of gas (ideal-gas molar volumes,
 *   the same for air and gas at the same reference).
 * - Liquids (the liquid train of a dual-fuel plant, pressure-jet atomiser at a fixed pump pressure):
 *   the volume flow varies as 1/√(density), so the heat input varies with LHV per litre / √density,
 *   the liquid counterpart of the Wobbe index, taken against the train's reference liquid.
 * - Retuned: the heat input restored and the flue O2 held at the plant's value (today's evaluation).
 */
import type { ResolvedFuel } from "../fuels/resolve";
import { flueO2DryFromLambda, lambdaFromFlueO2Dry, oxidizerDemand, type Oxidizer } from "../combustion/stoichiometry";
import { flameTemperature } from "../combustion/flame";
import { InfeasibleChargeError, InputError, NotConvergedError } from "../errors";
import type { AirControl } from "../schemas/burner";

export interface BurnerGas {
  fuel: ResolvedFuel;
  /**
   * Heat per metered volume divided by √(density): the net Wobbe index of a gas (MJ/m³, relative
   * density), or LHV per litre / √(density in kg/L) of a liquid; only ratios between fuels of one
   * train are used.
   */
  wobbeNet_MJ_per_m3: number;
  /** Relative density (gas) or density in kg/L (liquid): the fixed orifice passes volume ∝ 1/√ of it. */
  relativeDensity: number;
}

/** The burner view of a fuel: a gas by its net Wobbe index, a liquid by its pressure-jet counterpart. */
export function burnerFuel(
  fuel: ResolvedFuel,
  wobbe: { net_MJ_per_m3: number; relativeDensity: number } | null,
  lhv_MJ_per_kg: number,
): BurnerGas | null {
  if (fuel.kind === "gas") return wobbe ? { fuel, wobbeNet_MJ_per_m3: wobbe.net_MJ_per_m3, relativeDensity: wobbe.relativeDensity } : null;
  if (fuel.kind === "liquid" && fuel.density_kg_per_m3) {
    const rho_kg_per_L = fuel.density_kg_per_m3 / 1000;
    return { fuel, wobbeNet_MJ_per_m3: (lhv_MJ_per_kg * rho_kg_per_L) / Math.sqrt(rho_kg_per_L), relativeDensity: rho_kg_per_L };
  }
  return null;
}

export interface BurnerState {
  lambda: number;
  flueO2DryPercent: number;
  heatInputChangePercent: number | null;
  /** Equilibrium adiabatic flame temperature at this λ; null where it cannot be computed (see flameProblem). */
  adiabaticFlameTemperatureK: number | null;
  flameProblem?: string;
}

export interface BurnerShift {
  untuned: BurnerState;
  retuned: BurnerState;
  /** Gas volume flow through the fixed orifice, candidate / baseline. */
  gasVolumeRatio: number;
  /** Stoichiometric air per m³ of gas, candidate / baseline. */
  airDemandRatio: number;
  notes: string[];
}

export interface BurnerShiftInput {
  baseline: BurnerGas;
  candidate: BurnerGas;
  airControl: AirControl;
  regulatedSupply: boolean;
  /** Flue O2 (dry, vol %) at which the burner was set up on the baseline gas. */
  setupFlueO2DryPercent: number;
  oxidizer: Oxidizer;
  oxidizerTemperatureK: number;
  fuelTemperatureK?: number;
  pressurePa?: number;
  /** Compute the adiabatic flame temperatures (default true; sweeps that need only λ and heat input skip them). */
  flameTemperatures?: boolean;
}

/** Stoichiometric oxidiser per metered volume: per mole (= per m³, ideal gas) of a gas, per litre of a liquid. */
function airPerMol(g: BurnerGas, oxidizer: Oxidizer): number {
  const demand = oxidizerDemand(g.fuel, oxidizer);
  if (g.fuel.kind === "liquid") return demand.oxidizer_mol_per_kg * g.relativeDensity;
  const d = demand.oxidizer_mol_per_mol;
  if (d === undefined) throw new InputError("fuel", "the burner shift is computed for gases and liquids only");
  return d;
}

function flameAt(g: BurnerGas, lambda: number, input: BurnerShiftInput): Pick<BurnerState, "adiabaticFlameTemperatureK" | "flameProblem"> {
  if (input.flameTemperatures === false) return { adiabaticFlameTemperatureK: null, flameProblem: "not computed" };
  try {
    const r = flameTemperature({
      fuel: g.fuel,
      oxidizer: input.oxidizer,
      phi: 1 / lambda,
      method: "equilibrium",
      oxidizerTemperatureK: input.oxidizerTemperatureK,
      fuelTemperatureK: input.fuelTemperatureK,
      pressurePa: input.pressurePa,
    });
    return { adiabaticFlameTemperatureK: r.temperatureK };
  } catch (e) {
    if (e instanceof NotConvergedError || e instanceof InfeasibleChargeError)
      return { adiabaticFlameTemperatureK: null, flameProblem: e.detail };
    throw e;
  }
}

export function burnerShift(input: BurnerShiftInput): BurnerShift {
  const { baseline: b, candidate: c, oxidizer } = input;
  const notes: string[] = [];
  const lambda0 = lambdaFromFlueO2Dry(b.fuel, input.setupFlueO2DryPercent, oxidizer);
  const gasVolumeRatio = Math.sqrt(b.relativeDensity / c.relativeDensity);
  const airDemandRatio = airPerMol(c, oxidizer) / airPerMol(b, oxidizer);
  const heatInputChangePercent = input.regulatedSupply ? 100 * (c.wobbeNet_MJ_per_m3 / b.wobbeNet_MJ_per_m3 - 1) : null;
  notes.push(
    input.regulatedSupply
      ? "untuned heat input follows the net Wobbe index (fixed orifice, regulated supply pressure)"
      : "the gas supply pressure is not regulated: the untuned heat input cannot be predicted from the gas alone",
  );
  let lambdaUntuned: number;
  switch (input.airControl) {
    case "fixed-linkage":
      // Air volume flow as set on the baseline gas; the gas volume flow changes through the orifice.
      lambdaUntuned = lambda0 / (airDemandRatio * (input.regulatedSupply ? gasVolumeRatio : 1));
      notes.push("fixed linkage: the air volume flow stays as set on the baseline gas");
      break;
    case "pneumatic-ratio":
      lambdaUntuned = lambda0 / airDemandRatio;
      notes.push("pneumatic ratio control: the gas-to-air volume ratio stays as set on the baseline gas");
      break;
    case "o2-trim":
      lambdaUntuned = lambdaFromFlueO2Dry(c.fuel, input.setupFlueO2DryPercent, oxidizer);
      notes.push("O2 trim: the flue O2 set-point is restored, so the air factor is as retuned");
      break;
  }
  const lambdaRetuned = lambdaFromFlueO2Dry(c.fuel, input.setupFlueO2DryPercent, oxidizer);
  const flueUntuned = lambdaUntuned >= 1 ? flueO2DryFromLambda(c.fuel, lambdaUntuned, oxidizer) : 0;
  return {
    untuned: { lambda: lambdaUntuned, flueO2DryPercent: flueUntuned, heatInputChangePercent, ...flameAt(c, lambdaUntuned, input) },
    retuned: {
      lambda: lambdaRetuned,
      flueO2DryPercent: input.setupFlueO2DryPercent,
      heatInputChangePercent: 0,
      ...flameAt(c, lambdaRetuned, input),
    },
    gasVolumeRatio,
    airDemandRatio,
    notes,
  };
}

/** The rules of thumb of `burnerRisks` (common practice, no source). */
export const UNTUNED_RULES = Object.freeze({ coLambda: 1.05, leanBlowOffFactor: 1.2, heatInputPercent: 5 });

export type BurnerRisk = "lean-blow-off" | "co-formation" | "sub-stoichiometric" | "derating" | "overfiring";

/**
 * What an untuned state means (rules of thumb, common practice, no source): λ below 1 burns
 * sub-stoichiometric; below 1.05 CO rises; an air factor 20 % above its set-up value risks lean
 * blow-off on premixed burners; a heat input 5 % below (above) rated derates (overfires) the unit.
 */
export function burnerRisks(shift: BurnerShift, setupLambda: number): { risk: BurnerRisk; text: string }[] {
  const out: { risk: BurnerRisk; text: string }[] = [];
  const u = shift.untuned;
  if (u.lambda < 1)
    out.push({ risk: "sub-stoichiometric", text: `λ ${u.lambda.toFixed(3)} < 1: sub-stoichiometric combustion, CO and unburnt fuel` });
  else if (u.lambda < UNTUNED_RULES.coLambda)
    out.push({ risk: "co-formation", text: `λ ${u.lambda.toFixed(3)} close to 1: CO formation likely` });
  if (u.lambda > UNTUNED_RULES.leanBlowOffFactor * setupLambda)
    out.push({
      risk: "lean-blow-off",
      text: `λ ${u.lambda.toFixed(2)} is ${(100 * (u.lambda / setupLambda - 1)).toFixed(0)} % above its set-up value: lean blow-off and flame instability risk`,
    });
  if (u.heatInputChangePercent !== null && u.heatInputChangePercent < -UNTUNED_RULES.heatInputPercent)
    out.push({ risk: "derating", text: `heat input ${u.heatInputChangePercent.toFixed(1)} %: the unit is derated until retuned` });
  if (u.heatInputChangePercent !== null && u.heatInputChangePercent > UNTUNED_RULES.heatInputPercent)
    out.push({ risk: "overfiring", text: `heat input +${u.heatInputChangePercent.toFixed(1)} %: the unit is overfired until retuned` });
  return out;
}
