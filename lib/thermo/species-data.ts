/**
 * Species thermochemistry for Stoke: NASA 7-coefficient polynomials (see ./nasa7 for the form).
 *
 * Where the coefficients come from
 * - Gases and liquid water: the NASA thermodynamic data set in 7-coefficient form as distributed in
 *   the public data files "nasa_gas" and "nasa_condensed" of the open-source Cantera project. Those
 *   files name as original sources S. Gordon & B.J. McBride, NASA SP-273 (1971) and
 *   B.J. McBride, S. Gordon & M.A. Reno, "Coefficients for Calculating Thermodynamic and Transport
 *   Properties of Individual Species", NASA TM-4513 (1993). Records with the range 200–1000–6000 K
 *   carry the later NASA Glenn data (McBride, Zehe & Gordon, NASA/TP-2002-211556): their enthalpies
 *   and entropies agree with that database's 9-coefficient records (checked in the unit test for
 *   N2, O2, CO2, H2O and OH; methane's ΔfH° is the Glenn value −74.60 kJ/mol). The OH record is the
 *   exception: it carried an older ΔfH°, moved here to the Glenn value (see the record). Records with 300–1000–5000 K
 *   or 298.15–1000–5000 K (H2S, SO2, n-pentane) are older fits of the same data set.
 *   Coefficients are copied digit for digit. Standard state 1 bar; enthalpies include the enthalpy of
 *   formation at 298.15 K (NASA convention), so h(298.15 K) = ΔfH°(298.15 K).
 * - n-hexane: that data set has no n-hexane record. Its coefficients here are a conversion, made
 *   for Stoke, of the NASA Glenn 9-coefficient record "C6H14,n-hexane"
 *   (McBride, Zehe & Gordon 2002): cp/R fitted on each interval (200–1000 K, 1000–6000 K) for the
 *   least maximum relative error, with cp continuous at 1000 K, h and s exact at 298.15 K and
 *   1000 K. Deviation from the 9-coefficient record: cp within 0.55 % over 200–6000 K, h within
 *   1.9 kJ/mol, s within 0.6 J/(mol·K). The unit test tests/unit/thermo.test.ts checks it against
 *   the 9-coefficient record.
 *
 * The NASA Glenn ΔfH°(298.15) values differ slightly from NIST-JANAF for some species
 * (methane −74.60 kJ/mol against JANAF's −74.873 kJ/mol). Reaction enthalpies from these records
 * reproduce the ISO 6976:2016 gross calorific values within 0.01 % (H2S 0.03 %; see the unit test);
 * where a heating value is published in ISO 6976, that standard remains the reference.
 */
import { InputError } from "../errors";
import { molarMass_g_per_mol } from "./elements";
import { standardPressurePa } from "../units/constants";
import type { Nasa7Species } from "./nasa7";

const NASA_SET =
  'NASA thermodynamic data, 7-coefficient form (Gordon & McBride NASA SP-273; McBride, Gordon & Reno NASA TM-4513, 1993; 200–6000 K records after McBride, Zehe & Gordon NASA/TP-2002-211556), as in the public "nasa_gas" data file of the Cantera project';

function nasaGas(record: string): string {
  return `${NASA_SET}, record "${record}"; standard state 1 bar`;
}

const species: Nasa7Species[] = [
  {
    key: "CH4",
    name: "methane",
    elements: { C: 1, H: 4 },
    phase: "gas",
    rangesK: [200.0, 1000.0, 6000.0],
    lowCoeffs: [5.14987613, -0.0136709788, 4.91800599e-5, -4.84743026e-8, 1.66693956e-11, -1.02466476e4, -4.64130376],
    highCoeffs: [1.63552643, 0.0100842795, -3.36916254e-6, 5.34958667e-10, -3.15518833e-14, -1.00056455e4, 9.99313326],
    standardPressurePa,
    source: nasaGas("CH4"),
  },
  {
    key: "C2H6",
    name: "ethane",
    elements: { C: 2, H: 6 },
    phase: "gas",
    rangesK: [200.0, 1000.0, 6000.0],
    lowCoeffs: [4.29142492, -5.5015427e-3, 5.99438288e-5, -7.08466285e-8, 2.68685771e-11, -1.15222055e4, 2.66682316],
    highCoeffs: [4.04666674, 0.0153538766, -5.47039321e-6, 8.77826228e-10, -5.23167305e-14, -1.24473512e4, -0.968683607],
    standardPressurePa,
    source: nasaGas("C2H6"),
  },
  {
    key: "C3H8",
    name: "propane",
    elements: { C: 3, H: 8 },
    phase: "gas",
    rangesK: [200.0, 1000.0, 6000.0],
    lowCoeffs: [4.2110262, 1.71599803e-3, 7.06183472e-5, -9.19594116e-8, 3.64421372e-11, -1.43812106e4, 5.60930491],
    highCoeffs: [6.66789363, 0.0206120214, -7.36553027e-6, 1.18440761e-9, -7.0695321e-14, -1.62748521e4, -13.1859503],
    standardPressurePa,
    source: nasaGas("C3H8"),
  },
  {
    key: "nC4H10",
    name: "n-butane",
    elements: { C: 4, H: 10 },
    phase: "gas",
    rangesK: [200.0, 1000.0, 6000.0],
    lowCoeffs: [6.14746806, 1.55947389e-4, 9.67913517e-5, -1.2548391e-7, 4.97816555e-11, -1.75994402e4, -1.09409879],
    highCoeffs: [9.44535834, 0.0257858073, -9.23619122e-6, 1.48632755e-9, -8.87897158e-14, -2.01382165e4, -26.3470076],
    standardPressurePa,
    source: nasaGas("C4H10,n-butane"),
  },
  {
    key: "iC4H10",
    name: "isobutane",
    elements: { C: 4, H: 10 },
    phase: "gas",
    rangesK: [200.0, 1000.0, 6000.0],
    lowCoeffs: [4.45479276, 8.26057985e-3, 8.29886664e-5, -1.14647642e-7, 4.64570101e-11, -1.84593931e4, 4.92743175],
    highCoeffs: [9.76991245, 0.025499721, -9.14142932e-6, 1.47328271e-9, -8.80800188e-14, -2.14052647e4, -30.0329101],
    standardPressurePa,
    source: nasaGas("C4H10,isobutane"),
  },
  {
    key: "nC5H12",
    name: "n-pentane",
    elements: { C: 5, H: 12 },
    phase: "gas",
    rangesK: [298.15, 1000.0, 5000.0],
    lowCoeffs: [1.8983679, 0.041203037, 1.2312175e-5, -3.6589501e-8, 1.5042509e-11, -2.00915e4, 18.679082],
    highCoeffs: [13.546998, 0.028421786, -9.4174648e-6, 1.3893589e-9, -7.4212609e-14, -2.457768e4, -47.021175],
    standardPressurePa,
    source: `${nasaGas("C5H12,n-pentane")} (older fit, 298.15–5000 K)`,
  },
  {
    key: "nC6H14",
    name: "n-hexane",
    elements: { C: 6, H: 14 },
    phase: "gas",
    rangesK: [200.0, 1000.0, 6000.0],
    lowCoeffs: [9.637854212, -0.006967279893, 0.0001629300378, -2.068710849e-7, 8.112534672e-11, -23708.5603, -11.64203383],
    highCoeffs: [18.11291679, 0.02926335493, -8.941434483e-6, 1.519872152e-9, -9.983545877e-14, -28861.15236, -69.63794756],
    standardPressurePa,
    source:
      'NASA Glenn thermodynamic database (McBride, Zehe & Gordon 2002, NASA/TP-2002-211556), 9-coefficient record "C6H14,n-hexane", converted by Stoke to the 7-coefficient form by a constrained minimax fit (cp within 0.55 % over 200–6000 K, h and s exact at 298.15 K and 1000 K); standard state 1 bar',
  },
  {
    key: "H2",
    name: "hydrogen",
    elements: { H: 2 },
    phase: "gas",
    rangesK: [200.0, 1000.0, 6000.0],
    lowCoeffs: [2.34433112, 7.98052075e-3, -1.9478151e-5, 2.01572094e-8, -7.37611761e-12, -917.935173, 0.683010238],
    highCoeffs: [2.93286579, 8.26607967e-4, -1.46402335e-7, 1.54100359e-11, -6.88804432e-16, -813.065597, -1.02432887],
    standardPressurePa,
    source: nasaGas("H2"),
  },
  {
    key: "CO",
    name: "carbon monoxide",
    elements: { C: 1, O: 1 },
    phase: "gas",
    rangesK: [200.0, 1000.0, 6000.0],
    lowCoeffs: [3.57953347, -6.1035368e-4, 1.01681433e-6, 9.07005884e-10, -9.04424499e-13, -1.4344086e4, 3.50840928],
    highCoeffs: [3.04848583, 1.35172818e-3, -4.85794075e-7, 7.88536486e-11, -4.69807489e-15, -1.42661171e4, 6.0170979],
    standardPressurePa,
    source: nasaGas("CO"),
  },
  {
    key: "CO2",
    name: "carbon dioxide",
    elements: { C: 1, O: 2 },
    phase: "gas",
    rangesK: [200.0, 1000.0, 6000.0],
    lowCoeffs: [2.35677352, 8.98459677e-3, -7.12356269e-6, 2.45919022e-9, -1.43699548e-13, -4.83719697e4, 9.90105222],
    highCoeffs: [4.63659493, 2.74131991e-3, -9.95828531e-7, 1.60373011e-10, -9.16103468e-15, -4.90249341e4, -1.93534855],
    standardPressurePa,
    source: nasaGas("CO2"),
  },
  {
    key: "H2O",
    name: "water vapour",
    elements: { H: 2, O: 1 },
    phase: "gas",
    rangesK: [200.0, 1000.0, 6000.0],
    lowCoeffs: [4.19864056, -2.0364341e-3, 6.52040211e-6, -5.48797062e-9, 1.77197817e-12, -3.02937267e4, -0.849032208],
    highCoeffs: [2.67703787, 2.97318329e-3, -7.7376969e-7, 9.44336689e-11, -4.26900959e-15, -2.98858938e4, 6.88255571],
    standardPressurePa,
    source: nasaGas("H2O"),
  },
  {
    key: "N2",
    name: "nitrogen",
    elements: { N: 2 },
    phase: "gas",
    rangesK: [200.0, 1000.0, 6000.0],
    lowCoeffs: [3.53100528, -1.23660987e-4, -5.02999437e-7, 2.43530612e-9, -1.40881235e-12, -1046.97628, 2.96747468],
    highCoeffs: [2.95257626, 1.39690057e-3, -4.92631691e-7, 7.86010367e-11, -4.60755321e-15, -923.948645, 5.87189252],
    standardPressurePa,
    source: nasaGas("N2"),
  },
  {
    key: "O2",
    name: "oxygen",
    elements: { O: 2 },
    phase: "gas",
    rangesK: [200.0, 1000.0, 6000.0],
    lowCoeffs: [3.78245636, -2.99673415e-3, 9.847302e-6, -9.68129508e-9, 3.24372836e-12, -1063.94356, 3.65767573],
    highCoeffs: [3.66096083, 6.56365523e-4, -1.41149485e-7, 2.05797658e-11, -1.29913248e-15, -1215.97725, 3.41536184],
    standardPressurePa,
    source: nasaGas("O2"),
  },
  {
    key: "Ar",
    name: "argon",
    elements: { Ar: 1 },
    phase: "gas",
    rangesK: [200.0, 1000.0, 6000.0],
    lowCoeffs: [2.5, 0.0, 0.0, 0.0, 0.0, -745.375, 4.37967491],
    highCoeffs: [2.5, 0.0, 0.0, 0.0, 0.0, -745.375, 4.37967491],
    standardPressurePa,
    source: nasaGas("Ar"),
  },
  {
    key: "H2S",
    name: "hydrogen sulfide",
    elements: { H: 2, S: 1 },
    phase: "gas",
    rangesK: [300.0, 1000.0, 5000.0],
    lowCoeffs: [3.9323476, -5.0260905e-4, 4.5928473e-6, -3.1807214e-9, 6.6497561e-13, -3650.5359, 2.3157905],
    highCoeffs: [2.7452199, 4.0434607e-3, -1.538451e-6, 2.7520249e-10, -1.8592095e-14, -3419.9444, 8.0546745],
    standardPressurePa,
    source: `${nasaGas("H2S")} (older fit, 300–5000 K)`,
  },
  {
    key: "SO2",
    name: "sulfur dioxide",
    elements: { S: 1, O: 2 },
    phase: "gas",
    rangesK: [300.0, 1000.0, 5000.0],
    lowCoeffs: [3.2665338, 5.3237902e-3, 6.8437552e-7, -5.2810047e-9, 2.5590454e-12, -3.6908148e4, 9.66465108],
    highCoeffs: [5.2451364, 1.9704204e-3, -8.0375769e-7, 1.5149969e-10, -1.0558004e-14, -3.7558227e4, -1.07404892],
    standardPressurePa,
    source: `${nasaGas("SO2")} (older fit, 300–5000 K)`,
  },
  {
    key: "NH3",
    name: "ammonia",
    elements: { N: 1, H: 3 },
    phase: "gas",
    rangesK: [200.0, 1000.0, 6000.0],
    lowCoeffs: [4.30177808, -4.7712733e-3, 2.19341619e-5, -2.29856489e-8, 8.28992268e-12, -6748.06394, -0.690644393],
    highCoeffs: [2.71709692, 5.56856338e-3, -1.76886396e-6, 2.6741726e-10, -1.52731419e-14, -6584.51989, 6.09289837],
    standardPressurePa,
    source: nasaGas("NH3"),
  },
  {
    key: "NO",
    name: "nitric oxide",
    elements: { N: 1, O: 1 },
    phase: "gas",
    rangesK: [200.0, 1000.0, 6000.0],
    lowCoeffs: [4.21859896, -4.63988124e-3, 1.10443049e-5, -9.34055507e-9, 2.80554874e-12, 9845.09964, 2.28061001],
    highCoeffs: [3.26071234, 1.19101135e-3, -4.29122646e-7, 6.94481463e-11, -4.03295681e-15, 9921.43132, 6.36900518],
    standardPressurePa,
    source: nasaGas("NO"),
  },
  {
    key: "NO2",
    name: "nitrogen dioxide",
    elements: { N: 1, O: 2 },
    phase: "gas",
    rangesK: [200.0, 1000.0, 6000.0],
    lowCoeffs: [3.94403907, -1.58547444e-3, 1.66578984e-5, -2.04754478e-8, 7.83503265e-12, 2896.59865, 6.31196225],
    highCoeffs: [4.88474429, 2.17241639e-3, -8.2807902e-7, 1.57477293e-10, -1.05110549e-14, 2316.48462, -0.117357075],
    standardPressurePa,
    source: nasaGas("NO2"),
  },
  {
    key: "N2O",
    name: "nitrous oxide",
    elements: { N: 2, O: 1 },
    phase: "gas",
    rangesK: [200.0, 1000.0, 6000.0],
    lowCoeffs: [2.2571686, 0.0113046338, -1.3671035e-5, 9.68162098e-9, -2.93055583e-12, 8741.77146, 10.7579154],
    highCoeffs: [4.82318873, 2.62685279e-3, -9.58426058e-7, 1.59991296e-10, -9.77416939e-15, 8073.35662, -2.202366],
    standardPressurePa,
    source: nasaGas("N2O"),
  },
  {
    key: "OH",
    name: "hydroxyl radical",
    elements: { O: 1, H: 1 },
    phase: "gas",
    rangesK: [200.0, 1000.0, 6000.0],
    // The data-file record carries ΔfH°(298.15 K) = 39.347 kJ/mol, an older value; the NASA Glenn
    // database (McBride, Zehe & Gordon 2002; record "OH", g 4/02, after Ruscic et al. 2002) gives
    // 37.278206 kJ/mol, and its cp, H − H298 and S° agree with this record within 0.3 %, 34 J/mol and
    // 0.03 J/(mol·K) over 300–6000 K. So a6 is lowered in both ranges by (39346.882 − 37278.206) / R
    // = 248.804 K, which moves only ΔfH°. Without it equilibrium OH came out 7–11 % below NASA's
    // published example (tests/unit/equilibrium.test.ts).
    lowCoeffs: [3.99201543, -2.40131752e-3, 4.61793841e-6, -3.88113333e-9, 1.3641147e-12, 3366.27652, -0.103925458],
    highCoeffs: [2.83864607, 1.10725586e-3, -2.93914978e-7, 4.20524247e-11, -2.42169092e-15, 3695.15448, 5.84452662],
    standardPressurePa,
    source: `${nasaGas("OH")}; ΔfH° moved to the NASA Glenn value 37.278 kJ/mol (McBride, Zehe & Gordon, NASA/TP-2002-211556, record "OH" after Ruscic et al. 2002)`,
  },
  {
    key: "H",
    name: "hydrogen atom",
    elements: { H: 1 },
    phase: "gas",
    rangesK: [200.0, 1000.0, 6000.0],
    lowCoeffs: [2.5, 0.0, 0.0, 0.0, 0.0, 2.54736599e4, -0.446682853],
    highCoeffs: [2.50000286, -5.65334214e-9, 3.63251723e-12, -9.1994972e-16, 7.95260746e-20, 2.54736589e4, -0.446698494],
    standardPressurePa,
    source: nasaGas("H"),
  },
  {
    key: "O",
    name: "oxygen atom",
    elements: { O: 1 },
    phase: "gas",
    rangesK: [200.0, 1000.0, 6000.0],
    lowCoeffs: [3.1682671, -3.27931884e-3, 6.64306396e-6, -6.12806624e-9, 2.11265971e-12, 2.91222592e4, 2.05193346],
    highCoeffs: [2.54363697, -2.73162486e-5, -4.1902952e-9, 4.95481845e-12, -4.79553694e-16, 2.9226012e4, 4.92229457],
    standardPressurePa,
    source: nasaGas("O"),
  },
  {
    key: "CH3OH",
    name: "methanol (vapour)",
    elements: { C: 1, H: 4, O: 1 },
    phase: "gas",
    rangesK: [200.0, 1000.0, 6000.0],
    lowCoeffs: [5.71539582, -0.0152309129, 6.52441155e-5, -7.10806889e-8, 2.61352698e-11, -2.56427656e4, -1.50409823],
    highCoeffs: [3.60134486, 0.0102430954, -3.59985517e-6, 5.72505986e-10, -3.3911764e-14, -2.5997191e4, 4.70512253],
    standardPressurePa,
    source: nasaGas("CH3OH"),
  },
  {
    key: "C2H5OH",
    name: "ethanol (vapour)",
    elements: { C: 2, H: 6, O: 1 },
    phase: "gas",
    rangesK: [200.0, 1000.0, 6000.0],
    lowCoeffs: [4.85868178, -3.7400674e-3, 6.95550267e-5, -8.86541147e-8, 3.5168443e-11, -2.99961309e4, 4.80192294],
    highCoeffs: [6.5628977, 0.0152034264, -5.38922247e-6, 8.62150224e-10, -5.12824683e-14, -3.15257984e4, -9.47557644],
    standardPressurePa,
    source: nasaGas("C2H5OH"),
  },
  {
    // The record is a single polynomial on 273.15–600 K; both sets below are that polynomial.
    // Liquid water at 1 bar exists only up to 373.15 K: use it for condensed-water heating values
    // near 0–100 °C only.
    key: "H2O(L)",
    name: "liquid water",
    elements: { H: 2, O: 1 },
    phase: "liquid",
    rangesK: [273.15, 600.0, 600.0],
    lowCoeffs: [72.5575005, -0.662445402, 2.56198746e-3, -4.36591923e-6, 2.78178981e-9, -4.18865499e4, -288.280137],
    highCoeffs: [72.5575005, -0.662445402, 2.56198746e-3, -4.36591923e-6, 2.78178981e-9, -4.18865499e4, -288.280137],
    standardPressurePa,
    source:
      'NASA thermodynamic data, 7-coefficient form (Gordon & McBride NASA SP-273; McBride, Gordon & Reno NASA TM-4513, 1993), as in the public "nasa_condensed" data file of the Cantera project, record "H2O(L)" (single interval 273.15–600 K); standard state 1 bar',
  },
];

/** All species by key. */
export const SPECIES: Readonly<Record<string, Nasa7Species>> = Object.freeze(Object.fromEntries(species.map((sp) => [sp.key, sp])));

/** Molar mass of every species, g/mol, computed once from its atoms (hot paths use this table). */
export const MOLAR_MASS_g_per_mol: Readonly<Record<string, number>> = Object.freeze(
  Object.fromEntries(species.map((sp) => [sp.key, molarMass_g_per_mol(sp.elements)])),
);

/** Species keys in a fixed order (fuel gases first, then oxidiser/products, minor species, liquid water). */
export const SPECIES_KEYS: readonly string[] = Object.freeze(species.map((sp) => sp.key));

/** The species with this key; throws InputError `species: unknown species "X"` for a key Stoke does not carry. */
export function speciesByKey(key: string): Nasa7Species {
  const sp = Object.hasOwn(SPECIES, key) ? SPECIES[key] : undefined;
  if (!sp) throw new InputError("species", `unknown species "${key}"`);
  return sp;
}
