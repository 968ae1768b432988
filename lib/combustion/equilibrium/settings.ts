/**
 * Numerical settings of the equilibrium solver (RP-1311 ch. 3 tests and Stoke's verification limits)
 * and the element indices it uses.
 */
import { ELEMENTS } from "../../thermo/nasa7";

/** Number of elements Stoke knows (ELEMENTS). */
export const NE_ALL = ELEMENTS.length;
export const E_C = ELEMENTS.indexOf("C");
export const E_H = ELEMENTS.indexOf("H");
export const E_O = ELEMENTS.indexOf("O");
export const E_N = ELEMENTS.indexOf("N");
export const E_S = ELEMENTS.indexOf("S");
export const E_AR = ELEMENTS.indexOf("Ar");
/** RP-1311 size threshold: ln(1e-8). */
export const SIZE = 18.420681;
/** RP-1311 λ2 target: ln(1e-4). */
export const LN_1E4 = 9.2103404;
/** Floor for ln(n_j/n): species are held at e^-300 of the total at least (lower for trace elements). */
export const LN_FLOOR = 300;
/** RP-1311 convergence tolerances. */
export const TOL_MOLES = 0.5e-5;
export const TOL_LNT = 1e-4;
export const TOL_ELEMENT_RP1311 = 1e-6;
/**
 * After the RP-1311 tests pass, Newton steps continue until the last full step changed no ln n_j, ln n
 * or ln T by more than this; Newton's quadratic convergence leaves errors of its square (~1e-14).
 */
export const TOL_FINAL_STEP = 1e-7;
/** The RP-1311 tests weigh species by amount; trace elements may need further steps. */
export const MAX_POLISH_ITERATIONS = 60;
/** Verification limits: element balance (relative, per element) and enthalpy balance (relative). */
export const LIMIT_ELEMENT_BALANCE = 1e-10;
export const LIMIT_ENTHALPY_BALANCE = 1e-6;
export const MAX_ITERATIONS = 300;
/** Element amounts below this fraction of the largest are refused (give 0 instead). */
export const MIN_ELEMENT_RATIO = 1e-200;
/** Temperature bounds during the iteration, K. */
export const T_ITER_MIN = 150;
export const T_ITER_MAX = 7000;
/**
 * Species whose data start at 298.15 K or 300 K (older fits: H2S, SO2, n-pentane) are used down to this
 * temperature, K; their polynomials are smooth there. Otherwise no extrapolation beyond the data ranges.
 */
export const T_EXTRAPOLATE_DOWN_TO = 200;
/** Cold-start temperature estimate is capped here, K (dissociation keeps real flames below it). */
export const T_GUESS_MAX = 3000;
export const T_GUESS_MIN = 200;
/** Cold start: amount of every non-major species relative to the total, just below the size threshold. */
export const TRACE_START = Math.exp(-SIZE - 1);
/** Cold start near φ = 1: O2, CO and H2 seeded at this fraction of (C + H/2). */
export const SEED_NEAR_STOICH = 0.02;
/** ... only when the temperature estimate is at least this, K. */
export const T_SEED_MIN = 1500;
