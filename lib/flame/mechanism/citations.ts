/** The published source of each mechanism Stoke carries (written into its JSON data file). */
export const MECHANISM_CITATIONS: Readonly<Record<string, string>> = {
  gri30:
    "G. P. Smith, D. M. Golden, M. Frenklach, N. W. Moriarty, B. Eiteneer, M. Goldenberg, C. T. Bowman, " +
    "R. K. Hanson, S. Song, W. C. Gardiner Jr., V. V. Lissianski, Z. Qin, GRI-Mech 3.0 (1999), " +
    "http://combustion.berkeley.edu/gri-mech/ (CHEMKIN-II files grimech30.dat, thermo30.dat, transport.dat).",
};
