/**
 * The report's sources appendix: the short references that the computations' audit trail, notes and
 * check bases carry ("ISO 6976:2016", "NASA RP-1311") found and listed with their full citations,
 * numbered in the order the report first meets them; and the plain words that replace the bare
 * labels "common practice, no source" and "value from memory".
 */

export interface Citation {
  key: string;
  /** The full bibliographic citation. */
  text: string;
}

/** Full citations, each found by the short forms the computations use. */
const CITATIONS: readonly (Citation & { match: RegExp })[] = [
  {
    key: "nasa-tp-2002",
    match: /NASA\/TP-2002-211556|McBride, Zehe & Gordon|NASA polynomials|NASA 7-coefficient|NASA Glenn/,
    text: "McBride, B. J., Zehe, M. J., Gordon, S. NASA Glenn Coefficients for Calculating Thermodynamic Properties of Individual Species. NASA/TP-2002-211556. NASA Glenn Research Center, Cleveland, Ohio, 2002.",
  },
  {
    key: "gri-mech",
    match: /GRI-Mech 3\.0/,
    text: "Smith, G. P., Golden, D. M., Frenklach, M., Moriarty, N. W., Eiteneer, B., Goldenberg, M., et al. GRI-Mech 3.0 (thermodynamic data of the mechanism). Gas Research Institute, 1999.",
  },
  {
    key: "burcat",
    match: /Burcat/,
    text: "Burcat, A., Ruscic, B. Third Millennium Ideal Gas and Condensed Phase Thermochemical Database for Combustion with Updates from Active Thermochemical Tables. Report ANL-05/20 and TAE 960, Argonne National Laboratory and Technion, 2005.",
  },
  {
    key: "janaf",
    match: /NIST-JANAF|Chase 1998/,
    text: "Chase, M. W., Jr. NIST-JANAF Thermochemical Tables, 4th edition. Journal of Physical and Chemical Reference Data, Monograph 9, 1998.",
  },
  {
    key: "iso6976",
    match: /ISO 6976/,
    text: "ISO 6976:2016. Natural gas — Calculation of calorific values, density, relative density and Wobbe indices from composition. International Organization for Standardization, Geneva, 2016.",
  },
  {
    key: "channiwala",
    match: /Channiwala/,
    text: "Channiwala, S. A., Parikh, P. P. A unified correlation for estimating HHV of solid, liquid and gaseous fuels. Fuel 81 (8), 2002, 1051–1063.",
  },
  {
    key: "iapws",
    match: /IAPWS/,
    text: "IAPWS R7-97(2012). Revised Release on the IAPWS Industrial Formulation 1997 for the Thermodynamic Properties of Water and Steam. International Association for the Properties of Water and Steam, 2012.",
  },
  {
    key: "en12952",
    match: /EN 12952-15/,
    text: "EN 12952-15:2003. Water-tube boilers and auxiliary installations — Part 15: Acceptance tests. European Committee for Standardization (CEN), Brussels, 2003.",
  },
  {
    key: "asme-ptc4",
    match: /ASME PTC 4/,
    text: "ASME PTC 4-2013. Fired Steam Generators: Performance Test Codes. The American Society of Mechanical Engineers, New York, 2013.",
  },
  {
    key: "bimschv",
    match: /BImSchV/,
    text: "Verordnung über kleine und mittlere Feuerungsanlagen (1. BImSchV), Anlage III: Bestimmung der Abgasverluste (German ordinance on small and medium firing installations, annex III). Bundesgesetzblatt I, 2010, p. 38, as amended.",
  },
  {
    key: "nasa-rp1311",
    match: /RP-1311/,
    text: "Gordon, S., McBride, B. J. Computer Program for Calculation of Complex Chemical Equilibrium Compositions and Applications. I. Analysis. NASA Reference Publication 1311. NASA Lewis Research Center, Cleveland, Ohio, 1994.",
  },
  {
    key: "ipcc2006",
    match: /IPCC 2006/,
    text: "IPCC. 2006 IPCC Guidelines for National Greenhouse Gas Inventories, Volume 2: Energy, Chapter 1, Table 1.4. Eggleston, H. S., Buendia, L., Miwa, K., Ngara, T., Tanabe, K. (eds.). IGES, Hayama, Japan, 2006.",
  },
  {
    key: "epa-c1",
    match: /40 CFR 98/,
    text: "US Environmental Protection Agency. Mandatory Greenhouse Gas Reporting, 40 CFR Part 98, Subpart C, Table C-1: Default CO2 emission factors and high heat values for various types of fuel.",
  },
  {
    key: "nist-sp811",
    match: /NIST SP 811|SP 811/,
    text: "Thompson, A., Taylor, B. N. Guide for the Use of the International System of Units (SI). NIST Special Publication 811, 2008 edition. National Institute of Standards and Technology, Gaithersburg, 2008.",
  },
  {
    key: "verhoff",
    match: /Verhoff/,
    text: "Verhoff, F. H., Banchero, J. T. Predicting dew points of flue gases. Chemical Engineering Progress 70 (8), 1974, 71–72.",
  },
  {
    key: "premix",
    match: /SAND85-8240/,
    text: "Kee, R. J., Grcar, J. F., Smooke, M. D., Miller, J. A. A Fortran Program for Modeling Steady Laminar One-Dimensional Premixed Flames. Report SAND85-8240, Sandia National Laboratories, 1985.",
  },
  {
    key: "astm-d341",
    match: /ASTM D341/,
    text: "ASTM D341. Standard Practice for Viscosity-Temperature Equations and Charts for Liquid Petroleum or Hydrocarbon Products. ASTM International, West Conshohocken.",
  },
  {
    key: "ied",
    match: /2010\/75\/EU/,
    text: "Directive 2010/75/EU of the European Parliament and of the Council of 24 November 2010 on industrial emissions (integrated pollution prevention and control). Official Journal of the European Union L 334, 17.12.2010.",
  },
];

/** The full citations that these texts refer to, in the order of first mention. */
export function citationsIn(texts: readonly string[]): Citation[] {
  const found: { at: number; c: Citation }[] = [];
  const all = texts.join("\n");
  for (const c of CITATIONS) {
    const m = c.match.exec(all);
    if (m) found.push({ at: m.index, c: { key: c.key, text: c.text } });
  }
  return found.sort((a, b) => a.at - b.at).map((f) => f.c);
}

/** The numbers ([1], [2]) of the citations a text refers to. */
export function citationNumbers(text: string, list: readonly Citation[]): number[] {
  const out: number[] = [];
  list.forEach((c, i) => {
    const def = CITATIONS.find((x) => x.key === c.key);
    if (def?.match.test(text)) out.push(i + 1);
  });
  return out;
}

export const FROM_MEMORY_NOTE =
  "A figure marked “quoted from memory” is the value the named standard or handbook is known to use, written down without checking the printed edition; confirm it against the document before relying on the result it feeds.";
export const COMMON_PRACTICE_NOTE =
  "A method or default marked “usual engineering practice” is how practitioners commonly do it; no single published source defines it, so treat it as a reasonable convention rather than a requirement.";

/**
 * A source text with the bare labels put in words: "(common practice, no source)" → "usual
 * engineering practice; no single published source", "value from memory" → "quoted from memory".
 */
export function plainSource(text: string): { text: string; fromMemory: boolean; commonPractice: boolean } {
  const fromMemory = /value from memory/i.test(text);
  const commonPractice = /common practice/i.test(text);
  const out = text
    .replace(/\(?common practice, no source\)?/gi, "usual engineering practice; no single published source")
    .replace(/\(common practice\)/gi, "(usual engineering practice)")
    .replace(/\bcommon practice\b/gi, "usual engineering practice")
    .replace(/, value from memory\)/gi, "; quoted from memory, not checked against the printed edition)")
    .replace(/\(value from memory\)/gi, "(quoted from memory, not checked against the printed edition)")
    .replace(/value from memory/gi, "quoted from memory, not checked against the printed edition");
  return { text: out, fromMemory, commonPractice };
}
