/**
 * Audit trail of a study evaluation: the methods behind every figure with their sources, the
 * assumptions the evaluation makes, and (per scenario) the inputs it used.
 */
import { SIEGERT_SOURCE } from "../plant/siegert";
import { DEFAULT_CONDENSING_APPROACH_K } from "../schemas/plant";
import { coHeatOfCombustion_MJ_per_m3, UNBURNT_CARBON_HEATING_VALUE_J_per_kg } from "../plant/efficiency";

export interface AuditMethod {
  /** What is computed. */
  quantity: string;
  /** How (the method's published name). */
  method: string;
  /** Where the method and its data come from. */
  source: string;
}

export interface AuditTrail {
  methods: AuditMethod[];
  assumptions: string[];
  /** Free-form notes (fuel descriptions, price conversions, warnings). */
  notes: string[];
}

export const STUDY_METHODS: readonly AuditMethod[] = [
  {
    quantity: "species enthalpy, heat capacity, entropy",
    method: "NASA 7-coefficient polynomials, two temperature ranges; standard state 1 bar",
    source:
      "McBride, Zehe & Gordon, NASA/TP-2002-211556 (2002); GRI-Mech 3.0 / Burcat tables where stated per species; checked against NIST-JANAF (Chase 1998)",
  },
  {
    quantity: "gross and net heating value (HHV, LHV) at 25 °C",
    method: "Hess's law from formation enthalpies (measured value or Channiwala & Parikh 2002 correlation for ultimate analyses)",
    source: "NASA polynomials as above; ISO 6976:2016 for the gas checks; Channiwala & Parikh, Fuel 81 (2002) 1051–1063",
  },
  {
    quantity: "Wobbe index, relative density, gas density, fuel volume",
    method: "real gas by summation factors, Z = 1 − (Σ xᵢ sᵢ)²",
    source: "ISO 6976:2016",
  },
  {
    quantity: "air factor λ from the measured flue O2, air and flue-gas amounts",
    method: "complete-combustion stoichiometry (C→CO2, H→H2O, S→SO2) in humid air",
    source: "combustion textbooks (common practice)",
  },
  {
    quantity: "water dew point and condensed water",
    method:
      "saturation pressure / temperature of water; below its dew point the flue gas leaves saturated at the stack temperature, the rest of its water condensed",
    source: "IAPWS-IF97, IAPWS R7-97(2012), region 4",
  },
  {
    quantity: "efficiency on gross and net basis",
    method:
      "heat-loss (indirect) method: dry flue-gas loss, moisture loss (sensible + latent), CO and unburnt-carbon losses, condensate recovery, radiation/casing loss, combustion-air credit; reference 25 °C",
    source:
      "concepts of EN 12952-15 and ASME PTC 4; species enthalpies from the NASA polynomials; unburnt carbon at 14 500 Btu/lbm (ASME PTC 4, value from memory)",
  },
  {
    quantity: "CO and unburnt-carbon losses",
    method:
      "CO: moles in the dry flue gas × heat of combustion of CO at 25 °C; carbon: residue carbon share → kg unburnt carbon per kg fuel × heating value of carbon in residue; flue gas and air of the carbon burnt",
    source:
      "loss terms of ASME PTC 4 and EN 12952-15; CO heat of combustion from the NASA polynomials (NIST-JANAF formation enthalpies); carbon in residue 14 500 Btu/lbm (ASME PTC 4, value from memory)",
  },
  {
    quantity: "radiation and casing loss at part load",
    method:
      "constant heat flow = rated-load % × the baseline's rated net input; share of a fuel's input = Q_rad·η₀/(U + Q_rad) at useful heat U",
    source: "rated-load radiation loss as boiler makers and ABMA-type charts state it (common practice, no source)",
  },
  {
    quantity: "flue-gas loss cross-check",
    method:
      "Siegert formula (rule of thumb), shown where its constants apply beside the flue-gas loss computed by the regulation's definition (sensible heat of the dry and wet flue gas from combustion-air to flue-gas temperature, net basis, no latent heat) — not beside the efficiency's loss terms",
    source: SIEGERT_SOURCE,
  },
  {
    quantity: "adiabatic flame temperature and its shift versus the baseline",
    method: "chemical equilibrium at constant enthalpy and pressure, Gibbs energy minimisation by element potentials",
    source: "Gordon & McBride, NASA RP-1311 (1994)",
  },
  {
    quantity: "CO2 per GJ of fuel and per useful MJ",
    method: "carbon content × 44.0095/12.0107, split by the biogenic carbon share, divided by the efficiency",
    source: "checked against IPCC 2006 Guidelines Vol. 2 Table 1.4 and US EPA 40 CFR 98 Table C-1",
  },
  {
    quantity: "delivered fuel price per MWh (gross, net) and per kg",
    method:
      "commodity + transport + handling per quoted unit, converted through cost per kg with the fuel's own heating values and density",
    source: "unit factors exact or from NIST SP 811 (2008) App. B.8",
  },
  {
    quantity: "NPV, payback, abatement cost, break-even prices, tornado",
    method:
      "end-of-year discounted cash flows; levelised abatement cost = present cost without carbon price ÷ present tonnes avoided; break-even by the exact linearity of cost in price; one-at-a-time sensitivity",
    source: "engineering-economics practice (common practice, no source)",
  },
  {
    quantity: "untuned burner (heat input and air factor before retuning)",
    method:
      "fixed orifice at a regulated pressure: heat input follows the net Wobbe index (liquids: LHV per litre / √density); air factor from the stoichiometric air per m³ and the air-ratio control (fixed linkage keeps the air flow, pneumatic ratio the volume ratio, O2 trim the flue O2)",
    source: "orifice equation and stoichiometry (common practice, no source)",
  },
  {
    quantity: "laminar burning velocity (flashback screening)",
    method:
      "freely propagating adiabatic 1D premixed flame, mixture-averaged transport, adaptive grid; at the lower of the untuned and retuned air factors, as a ratio to the reference fuel",
    source: "GRI-Mech 3.0 (Smith et al. 1999); PREMIX equations (Kee et al. 1985, SAND85-8240)",
  },
  {
    quantity: "NOx indicator and SO2",
    method:
      "post-flame NO + NO2 of the flame's burnt gas after 20 ms (adiabatic plug flow), scaled from a measured baseline NOx when entered; SO2 from all fuel sulfur; mg/m³ dry at 0 °C, 101.325 kPa and the reference O2",
    source: "GRI-Mech 3.0; reference conditions and O2 correction of Directive 2010/75/EU, Annexes V and VI",
  },
  {
    quantity: "liquid viscosity at the atomiser",
    method: "Walther equation through two stated points",
    source: "ASTM D341",
  },
];

export function studyAssumptions(): string[] {
  return [
    "Every scenario delivers the same useful heat as the baseline; fuel demand = useful heat ÷ that fuel's efficiency.",
    "Flows at rated duty: the baseline fires its rated input; a candidate fires the same useful heat ÷ its own efficiency.",
    `Unburnt losses only as stated: CO in the dry flue gas charged at its heat of combustion (${coHeatOfCombustion_MJ_per_m3().toFixed(2)} MJ per m³ of CO at 0 °C), its effect on the flue-gas amount neglected; unburnt carbon stated as % of the residue (ash + carbon), charged at ${(UNBURNT_CARBON_HEATING_VALUE_J_per_kg / 1e6).toFixed(2)} MJ/kg, with the flue gas and air of the carbon actually burnt; sensible heat of the residue neglected. Fuel enters at 25 °C.`,
    "Radiation and casing loss is a constant heat flow: the plant's figure (% of the net input at rated load) times the baseline's rated net input, so its share of the input grows about as 1/load; rated flows use the efficiency at rated duty, the annual fuel demand, costs and CO2 the efficiency at the average load.",
    "Flue gas at atmospheric pressure (101.325 kPa); air and flue-gas volumes as ideal gas.",
    `Condensing: the flue gas leaves at the stack temperature, saturated when that is below its dew point (the water condensed is what saturation at the stack temperature leaves behind; condensate drains at the stack temperature); the sensible loss is charged at the same temperature. A condensing unit's stack cannot be set below the return water plus the approach (plant field, default ${DEFAULT_CONDENSING_APPROACH_K} K, common practice, no source).`,
    "Combustion air carries the ambient absolute humidity through any preheater.",
    "The same stack temperature and flue O2 as the plant unless a scenario overrides them.",
    "Carbon is priced on fossil CO2 only (upstream CO2e too when the study includes it); biogenic CO2 is reported, not priced.",
    "Price escalation applies to fuel and carbon costs; fixed operating-cost changes stay constant; capex is spent at the start.",
    "The abatement cost excludes the carbon price itself (the cost of avoiding a tonne before any carbon price).",
  ];
}
