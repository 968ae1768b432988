/** `stoke properties` and `stoke flame`: the combustion engine, one input at a time. */
import { computeFuelProperties, type FuelProperties } from "../combustion/properties";
import { flameTemperature, type FlameResult } from "../combustion/flame";
import { flameRequestSchema, propertiesRequestSchema, type FlameRequest } from "../schemas/combustion";
import { normaliseOxidizer } from "../combustion/stoichiometry";
import { kelvinToCelsius } from "../units/constants";
import { defineCommand, type CsvTable } from "./command";
import { validate } from "./io";

/** Property-sheet columns for CSV: header (with unit and basis) and the figure it holds. */
const PROPERTY_COLUMNS: readonly [string, (p: FuelProperties) => unknown][] = [
  ["fuel", (p) => p.label],
  ["kind", (p) => p.kind],
  ["combustion reference °C", (p) => p.reference.combustionReferenceC],
  ["metering reference °C", (p) => p.reference.meteringReferenceC],
  ["molar mass g/mol", (p) => p.molarMass_g_per_mol],
  ["HHV MJ/kg", (p) => p.hhv.MJ_per_kg],
  ["LHV MJ/kg", (p) => p.lhv.MJ_per_kg],
  ["HHV kJ/mol", (p) => p.hhv.kJ_per_mol],
  ["LHV kJ/mol", (p) => p.lhv.kJ_per_mol],
  ["HHV MJ/m3 (metering reference)", (p) => p.hhv.MJ_per_m3],
  ["LHV MJ/m3 (metering reference)", (p) => p.lhv.MJ_per_m3],
  ["HHV MJ/L", (p) => p.hhv.MJ_per_L],
  ["LHV MJ/L", (p) => p.lhv.MJ_per_L],
  ["Wobbe gross MJ/m3 (metering reference)", (p) => p.wobbe?.gross_MJ_per_m3],
  ["Wobbe net MJ/m3 (metering reference)", (p) => p.wobbe?.net_MJ_per_m3],
  ["relative density (-)", (p) => p.relativeDensity],
  ["compression factor (-)", (p) => p.compressionFactor],
  ["gas density kg/m3 (metering reference)", (p) => p.gasDensity_kg_per_m3],
  ["density kg/m3 (liquid, 15 °C)", (p) => p.density_kg_per_m3],
  ["stoichiometric air kg/kg", (p) => p.stoichiometricAir.kg_per_kg],
  ["stoichiometric air m3/m3 (metering reference)", (p) => p.stoichiometricAir.m3_per_m3],
  ["stoichiometric air m3/kg (metering reference)", (p) => p.stoichiometricAir.m3_per_kg],
  ["stoichiometric O2 kg/kg", (p) => p.stoichiometricO2.kg_per_kg],
  ["CO2 kg/kg", (p) => p.co2.kg_per_kg],
  ["CO2 kg/GJ HHV", (p) => p.co2.kg_per_GJ_hhv],
  ["CO2 kg/GJ LHV", (p) => p.co2.kg_per_GJ_lhv],
  ["fossil CO2 kg/GJ LHV", (p) => p.co2.fossil_kg_per_GJ_lhv],
  ["biogenic CO2 kg/GJ LHV", (p) => p.co2.biogenic_kg_per_GJ_lhv],
  ["upstream CO2e kg/GJ LHV", (p) => p.co2.upstreamCo2e_kg_per_GJ_lhv],
  ["flue gas wet m3/MJ LHV (0 °C, 101.325 kPa)", (p) => p.flueGas.wet_m3_per_MJ_lhv],
  ["flue gas dry m3/MJ LHV (0 °C, 101.325 kPa)", (p) => p.flueGas.dry_m3_per_MJ_lhv],
  ["flue gas kg/MJ LHV", (p) => p.flueGas.mass_kg_per_MJ_lhv],
  ["CO2max dry %", (p) => p.flueGas.co2max_dry_percent],
  ["flue water wet %", (p) => p.flueGas.water_wet_percent],
  ["water dew point °C", (p) => p.flueGas.dewPoint_C],
  ["acid dew point °C", (p) => p.flueGas.acidDewPoint_C],
  ["H2 mol %", (p) => 100 * p.h2MoleFraction],
  ["biogenic carbon share (-)", (p) => p.biogenicCarbonShare],
  ["heating value origin", (p) => p.heatingValueOrigin],
];

export const propertiesCommand = defineCommand({
  compute(input) {
    const req = validate(propertiesRequestSchema, input);
    return computeFuelProperties(req.fuel, { combustionReferenceC: req.combustionReferenceC, meteringReferenceC: req.meteringReferenceC });
  },
  csv(p: FuelProperties): CsvTable {
    return { header: PROPERTY_COLUMNS.map(([h]) => h), rows: [PROPERTY_COLUMNS.map(([, get]) => get(p))] };
  },
});

type FlameOutput = ReturnType<typeof flameOutput>;

function flameOutput(req: FlameRequest, r: FlameResult) {
  return {
    temperatureK: r.temperatureK,
    temperatureC: kelvinToCelsius(r.temperatureK),
    method: r.method,
    methodLabel: r.methodLabel,
    phi: r.phi,
    lambda: r.lambda,
    excessAirPercent: (r.lambda - 1) * 100,
    pressurePa: r.pressurePa,
    fuelTemperatureK: req.fuelTemperatureK,
    oxidizerTemperatureK: req.oxidizerTemperatureK,
    products: r.products,
    ...(r.equilibrium
      ? {
          iterations: r.equilibrium.iterations,
          elementBalanceRelError: r.equilibrium.elementBalanceRelError,
          enthalpyBalanceRelError: r.equilibrium.enthalpyBalanceRelError,
        }
      : {}),
  };
}

export const flameCommand = defineCommand({
  compute(input) {
    const req = validate(flameRequestSchema, input);
    return flameOutput(req, flameTemperature({ ...req, oxidizer: req.oxidizer ? normaliseOxidizer(req.oxidizer) : undefined }));
  },
  /** One row per charge; one column per product species (mole fraction in the wet products). */
  csv(f: FlameOutput): CsvTable {
    const species = Object.keys(f.products);
    return {
      header: [
        "method",
        "flame temperature K",
        "flame temperature °C",
        "phi (-)",
        "lambda (-)",
        "excess air %",
        "pressure Pa",
        "fuel temperature K",
        "oxidiser temperature K",
        ...species.map((k) => `${k} mole fraction (wet products)`),
      ],
      rows: [
        [
          f.method,
          f.temperatureK,
          f.temperatureC,
          f.phi,
          f.lambda,
          f.excessAirPercent,
          f.pressurePa,
          f.fuelTemperatureK,
          f.oxidizerTemperatureK,
          ...species.map((k) => f.products[k]),
        ],
      ],
    };
  },
});
