/**
 * Stoke's demo data. EVERYTHING HERE IS INVENTED: the creamery, its boilers, its people and
 * every price. Fuel compositions and properties are typical values for illustration.
 *
 * The story: Quenby Marsh Creamery runs two gas-fired steam boilers. Its energy engineer is
 * looking at hydrogen blending in the natural-gas supply, at biomethane, and at a liquid
 * biofuel for the back-up oil burner of Boiler 2.
 */

export const DEMO_SITE = "Quenby Marsh Creamery (invented)";
const INVENTED = "Invented demo price — not a market quote.";
const TYPICAL = "Typical composition for illustration (demo data).";

export interface DemoPrice {
  amount: number;
  currency: string;
  unit: string;
  energyBasis?: "gross" | "net";
  meteringReference?: "0C" | "15C" | "20C" | "60F";
  transportAdder?: number;
  handlingAdder?: number;
  validFrom: string;
  sourceNote?: string;
}

export interface DemoFuel {
  name: string;
  definition?: Record<string, unknown>;
  blend?: { basis: "volume" | "mass" | "energy"; components: { fuel: string; share: number }[] };
  densityKgPerM3?: number;
  biogenicCarbonShare?: number;
  upstreamCo2e_kg_per_GJ?: number;
  notes: string;
  source?: string;
  prices: DemoPrice[];
}

const NG = "Pipeline natural gas";
const H2 = "Hydrogen";

export const DEMO_FUELS: DemoFuel[] = [
  {
    name: NG,
    definition: {
      composition: { CH4: 0.9, C2H6: 0.05, C3H8: 0.01, nC4H10: 0.002, iC4H10: 0.002, nC5H12: 0.0005, nC6H14: 0.0005, CO2: 0.01, N2: 0.025 },
    },
    upstreamCo2e_kg_per_GJ: 9,
    notes: "The creamery's present fuel for both boilers (grid gas, high-calorific group).",
    source: TYPICAL,
    prices: [
      {
        amount: 13.2,
        currency: "EUR",
        unit: "MMBtu",
        energyBasis: "gross",
        transportAdder: 1.9,
        validFrom: "2024-07-01",
        sourceNote: "Invented demo price — an older offer quoted per MMBtu.",
      },
      { amount: 38.5, currency: "EUR", unit: "MWh", energyBasis: "gross", transportAdder: 6.2, validFrom: "2025-01-01" },
    ],
  },
  {
    name: H2,
    definition: { composition: { H2: 1 } },
    upstreamCo2e_kg_per_GJ: 5,
    notes: "Electrolytic hydrogen delivered by pipeline from a neighbouring electrolyser (invented).",
    source: "Pure substance.",
    prices: [{ amount: 6.5, currency: "EUR", unit: "kg", transportAdder: 0.8, validFrom: "2025-01-01" }],
  },
  {
    name: "Natural gas + 10 % H2",
    blend: {
      basis: "volume",
      components: [
        { fuel: NG, share: 0.9 },
        { fuel: H2, share: 0.1 },
      ],
    },
    notes: "Blend of the pipeline gas with 10 vol % hydrogen.",
    prices: [],
  },
  {
    name: "Natural gas + 20 % H2",
    blend: {
      basis: "volume",
      components: [
        { fuel: NG, share: 0.8 },
        { fuel: H2, share: 0.2 },
      ],
    },
    notes: "Blend of the pipeline gas with 20 vol % hydrogen.",
    prices: [
      {
        amount: 52.0,
        currency: "EUR",
        unit: "MWh",
        energyBasis: "gross",
        transportAdder: 6.2,
        validFrom: "2025-03-01",
        sourceNote: "Invented demo price — blended-gas supply offer.",
      },
    ],
  },
  {
    name: "Natural gas + 30 % H2",
    blend: {
      basis: "volume",
      components: [
        { fuel: NG, share: 0.7 },
        { fuel: H2, share: 0.3 },
      ],
    },
    notes: "Blend of the pipeline gas with 30 vol % hydrogen.",
    prices: [],
  },
  {
    name: "Biomethane",
    definition: { composition: { CH4: 0.97, CO2: 0.02, N2: 0.01 } },
    biogenicCarbonShare: 1,
    upstreamCo2e_kg_per_GJ: 12,
    notes: "Upgraded biogas injected into the grid, bought with guarantees of origin.",
    source: TYPICAL,
    prices: [{ amount: 0.085, currency: "EUR", unit: "kWh", energyBasis: "gross", transportAdder: 0.0062, validFrom: "2025-01-01" }],
  },
  {
    name: "Biogas 60/40",
    definition: { composition: { CH4: 0.598, CO2: 0.4, H2S: 0.002 } },
    biogenicCarbonShare: 1,
    notes: "Raw biogas from a digester (60 % methane, 40 % CO2, traces of H2S), before upgrading.",
    source: TYPICAL,
    prices: [{ amount: 0.26, currency: "EUR", unit: "m3", meteringReference: "0C", handlingAdder: 0.02, validFrom: "2025-01-01" }],
  },
  {
    name: "Landfill gas",
    definition: { composition: { CH4: 0.5, CO2: 0.38, N2: 0.1, O2: 0.02 } },
    biogenicCarbonShare: 1,
    notes: "Collected landfill gas with some air ingress.",
    source: TYPICAL,
    prices: [{ amount: 5.0, currency: "EUR", unit: "GJ", energyBasis: "net", transportAdder: 1.5, validFrom: "2025-01-01" }],
  },
  {
    name: "LPG (propane)",
    definition: { composition: { C3H8: 0.95, nC4H10: 0.03, iC4H10: 0.02 } },
    notes: "Commercial propane, delivered liquid by road tanker and vaporised on site.",
    source: TYPICAL,
    prices: [{ amount: 720, currency: "EUR", unit: "t", transportAdder: 45, handlingAdder: 12, validFrom: "2025-01-01" }],
  },
  {
    name: "Methanol",
    definition: { compound: "CH3OH", phase: "liquid" },
    notes: "Fuel-grade methanol (fossil).",
    source: "Pure substance.",
    prices: [{ amount: 420, currency: "EUR", unit: "t", transportAdder: 30, validFrom: "2025-01-01" }],
  },
  {
    name: "Ethanol",
    definition: { compound: "C2H5OH", phase: "liquid" },
    biogenicCarbonShare: 1,
    notes: "Anhydrous bio-ethanol.",
    source: "Pure substance.",
    prices: [{ amount: 0.78, currency: "EUR", unit: "L", transportAdder: 0.05, validFrom: "2025-01-01" }],
  },
  {
    name: "FAME biodiesel",
    definition: {
      compound: "C19H36O2",
      phase: "liquid",
      kinematicViscosity: [
        { temperatureC: 20, mm2_per_s: 7.5 },
        { temperatureC: 40, mm2_per_s: 4.5 },
      ],
    },
    densityKgPerM3: 883,
    biogenicCarbonShare: 1,
    upstreamCo2e_kg_per_GJ: 30,
    notes: "Fatty-acid methyl ester; methyl oleate stands in for the ester mixture.",
    source: "Methyl oleate surrogate; density typical of EN 14214 FAME.",
    prices: [{ amount: 1.25, currency: "EUR", unit: "L", transportAdder: 0.04, handlingAdder: 0.02, validFrom: "2025-01-01" }],
  },
  {
    name: "HVO",
    definition: {
      compound: "C16H34",
      phase: "liquid",
      kinematicViscosity: [
        { temperatureC: 20, mm2_per_s: 4.4 },
        { temperatureC: 40, mm2_per_s: 2.9 },
      ],
    },
    densityKgPerM3: 780,
    biogenicCarbonShare: 1,
    upstreamCo2e_kg_per_GJ: 15,
    notes: "Hydrotreated vegetable oil, paraffinic; n-hexadecane stands in for it. Candidate for the back-up burner.",
    source: "n-Hexadecane surrogate; density typical of EN 15940 paraffinic fuel.",
    prices: [{ amount: 2150, currency: "EUR", unit: "t", transportAdder: 40, validFrom: "2025-01-01" }],
  },
  {
    name: "Gas oil",
    definition: {
      ultimate: { C: 0.8655, H: 0.133, O: 0, N: 0.0005, S: 0.001, moisture: 0, ash: 0 },
      kind: "liquid",
      lhv_MJ_per_kg: 42.9,
      kinematicViscosity: [
        { temperatureC: 20, mm2_per_s: 5 },
        { temperatureC: 40, mm2_per_s: 3 },
      ],
    },
    densityKgPerM3: 845,
    upstreamCo2e_kg_per_GJ: 14,
    notes: "Heating gas oil, the present back-up fuel of Boiler 2.",
    source: TYPICAL,
    prices: [
      { amount: 0.88, currency: "EUR", unit: "L", transportAdder: 0.04, handlingAdder: 0.01, validFrom: "2024-07-01" },
      { amount: 0.92, currency: "EUR", unit: "L", transportAdder: 0.04, handlingAdder: 0.01, validFrom: "2025-01-01" },
    ],
  },
  {
    name: "Heavy fuel oil",
    definition: {
      ultimate: { C: 0.8645, H: 0.11, O: 0.005, N: 0.005, S: 0.01, moisture: 0.005, ash: 0.0005 },
      kind: "liquid",
      lhv_MJ_per_kg: 40.4,
      kinematicViscosity: [
        { temperatureC: 50, mm2_per_s: 380 },
        { temperatureC: 100, mm2_per_s: 35 },
      ],
    },
    densityKgPerM3: 980,
    notes: "Residual fuel oil, 1 % sulfur; needs heated storage and atomisation.",
    source: TYPICAL,
    prices: [{ amount: 540, currency: "EUR", unit: "t", transportAdder: 25, handlingAdder: 10, validFrom: "2025-01-01" }],
  },
  {
    name: "Ammonia",
    definition: { composition: { NH3: 1 } },
    notes: "Anhydrous ammonia, delivered liquid and fired as vapour.",
    source: "Pure substance.",
    prices: [{ amount: 590, currency: "EUR", unit: "t", transportAdder: 35, validFrom: "2025-01-01" }],
  },
  {
    name: "Wood pellets",
    definition: {
      ultimate: { C: 0.4646, H: 0.0561, O: 0.3911, N: 0.003, S: 0.0002, moisture: 0.08, ash: 0.005 },
      kind: "solid",
      lhv_MJ_per_kg: 17.0,
    },
    densityKgPerM3: 650,
    biogenicCarbonShare: 1,
    upstreamCo2e_kg_per_GJ: 8,
    notes: "Softwood pellets, 8 % moisture as received; bulk density given.",
    source: TYPICAL,
    prices: [{ amount: 285, currency: "EUR", unit: "t", transportAdder: 20, handlingAdder: 8, validFrom: "2025-01-01" }],
  },
];

export interface DemoPlant {
  name: string;
  baselineFuel: string;
  fields: Record<string, unknown>;
}

const boilerCommon = {
  site: DEMO_SITE,
  equipmentType: "steam-boiler",
  ratedInput_kW: 8500,
  ratedInputBasis: "net",
  stackTemperatureC: 140,
  flueO2DryPercent: 3,
  combustionAirC: 25,
  radiationLossPercent: 0.8,
  condensing: false,
  returnWaterC: null,
  wobbeTolerancePercent: 5,
  maxFlameTempRiseK: 60,
  flueGasCapacity_m3_per_h: 17000,
  flueGasCapacityBasis: "actual",
  airCapacity_m3_per_h: 11500,
  airCapacityBasis: "actual",
  fuelSupplyCapacity_m3_per_h: 1050,
  fuelSupplyMeteringReference: "0C",
  maxH2SharePercent: 20,
};

/** The gas burner of Boilers 1 and 2 and its permit (invented): a partially premixed burner on a fixed linkage. */
const gasBurner = {
  burner: {
    type: "partially-premixed",
    airControl: "fixed-linkage",
    flashbackWarnRatio: 1.2,
    flashbackFailRatio: 1.5,
    regulatedSupply: true,
  },
  noxLimit_mg_per_m3: 100,
  noxReferenceO2Percent: 3,
  noxMeasuredBaseline_mg_per_m3: 70,
  gasBurnerPressure_kPa: 2.2,
  gasSupplyPressure_kPa: 3,
};

const gasOil = () => {
  const f = DEMO_FUELS.find((x) => x.name === "Gas oil");
  if (!f?.definition) throw new Error("the demo lacks its gas oil");
  return { ...f.definition, densityKgPerM3: f.densityKgPerM3, name: f.name };
};

export const DEMO_PLANTS: DemoPlant[] = [
  {
    name: "Boiler 1 (gas)",
    baselineFuel: NG,
    fields: {
      ...boilerCommon,
      ...gasBurner,
      operatingHours: 7800,
      averageLoadFraction: 0.65,
      notes:
        "Fire-tube steam boiler, 12 bar, economiser fitted. The burner maker states 20 vol % hydrogen as the limit without a burner change (invented).",
    },
  },
  {
    name: "Boiler 2 (gas)",
    baselineFuel: NG,
    fields: {
      ...boilerCommon,
      ...gasBurner,
      operatingHours: 6200,
      averageLoadFraction: 0.55,
      // The oil lance of the dual-fuel burner: pump 1,200 L/h, pressure-jet atomiser for 1.6–6 mm²/s at 20 °C (invented).
      liquidTrain: {
        flowCapacity: 1200,
        flowUnit: "L/h",
        viscosityMin_mm2_per_s: 1.6,
        viscosityMax_mm2_per_s: 6,
        firingTemperatureC: 20,
        flueO2DryPercent: 3.5,
        referenceFuel: gasOil(),
      },
      notes:
        "Twin of Boiler 1 with a dual-fuel burner; fires gas normally, gas oil on its liquid train when the gas supply is interrupted.",
    },
  },
  {
    name: "Boiler 2 (back-up oil firing)",
    baselineFuel: "Gas oil",
    fields: {
      ...boilerCommon,
      stackTemperatureC: 175,
      flueO2DryPercent: 3.5,
      wobbeTolerancePercent: null,
      maxH2SharePercent: null,
      fuelSupplyCapacity_m3_per_h: 1.2,
      fuelSupplyMeteringReference: "15C",
      operatingHours: 350,
      averageLoadFraction: 0.7,
      notes: "Boiler 2 on its back-up oil lance, used when the gas supply is interrupted. Oil pump capacity 1.2 m³/h (invented).",
    },
  },
];

export interface DemoScenario {
  name: string;
  fuel: string;
  isBaseline?: boolean;
  capex?: number;
  fixedOpexChange?: number;
  overrides?: Record<string, unknown>;
}

export interface DemoStudy {
  plant: string;
  name: string;
  /** The library fuel the hydrogen sweep blends (by name). */
  hydrogenFuel?: string;
  fields: Record<string, unknown>;
  scenarios: DemoScenario[];
}

export const DEMO_STUDIES: DemoStudy[] = [
  {
    plant: "Boiler 1 (gas)",
    name: "Hydrogen blending and biomethane",
    hydrogenFuel: H2,
    fields: {
      carbonPrice_per_t: 80,
      currency: "EUR",
      discountRatePercent: 8,
      horizonYears: 15,
      priceEscalationPercent: 2,
      rankingMetric: "cost-per-useful-MWh",
      notes:
        "Can Boiler 1 take hydrogen from the planned local electrolyser, and is biomethane cheaper per tonne of CO2 avoided? All costs invented.",
    },
    scenarios: [
      { name: "Natural gas (today)", fuel: NG, isBaseline: true },
      { name: "10 % hydrogen", fuel: "Natural gas + 10 % H2", capex: 60000, fixedOpexChange: 4000 },
      { name: "20 % hydrogen", fuel: "Natural gas + 20 % H2", capex: 180000, fixedOpexChange: 6000 },
      // The new burner is rated for 30 % H2 by its (invented) maker; the existing gas train's Wobbe band still applies.
      {
        name: "30 % hydrogen, new burner",
        fuel: "Natural gas + 30 % H2",
        capex: 420000,
        fixedOpexChange: 8000,
        overrides: { maxH2SharePercent: 30 },
      },
      { name: "Biomethane", fuel: "Biomethane" },
    ],
  },
  {
    plant: "Boiler 2 (back-up oil firing)",
    name: "Back-up burner: liquid biofuel",
    fields: {
      carbonPrice_per_t: 80,
      currency: "EUR",
      discountRatePercent: 8,
      horizonYears: 10,
      priceEscalationPercent: 2,
      rankingMetric: "abatement-cost",
      notes: "Replace the gas oil of the back-up burner with HVO or FAME. All costs invented.",
    },
    scenarios: [
      { name: "Gas oil (today)", fuel: "Gas oil", isBaseline: true },
      { name: "HVO", fuel: "HVO", capex: 15000 },
      { name: "FAME biodiesel", fuel: "FAME biodiesel", capex: 40000, fixedOpexChange: 1500 },
    ],
  },
];

export const INVENTED_PRICE_NOTE = INVENTED;
