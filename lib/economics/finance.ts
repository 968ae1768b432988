/**
 * Discounting arithmetic for switching decisions: present-value factors, net present value,
 * simple and discounted payback, capital recovery factor.
 *
 * Conventions (common practice in engineering economics, e.g. any textbook treatment of
 * discounted cash flow): the investment is spent at t = 0; annual cash flows arrive at the end
 * of years 1 … N; a cash flow that escalates at rate g is C·(1+g)^(t−1) in year t; rates are
 * given in percent per year.
 */

/** Present value of 1 per year for N years, escalating at g, discounted at r (both in % per year). */
export function presentValueFactor(discountRatePercent: number, years: number, escalationPercent = 0): number {
  const r = discountRatePercent / 100;
  const g = escalationPercent / 100;
  if (!Number.isInteger(years) || years < 0) throw new RangeError(`years must be a whole number ≥ 0, got ${years}`);
  if (r <= -1) throw new RangeError(`discount rate must be > −100 %, got ${discountRatePercent} %`);
  // Closed form Σ_{t=1..N} (1+g)^(t−1)/(1+r)^t = (1 − ((1+g)/(1+r))^N)/(r − g); the limit r = g is N/(1+r).
  if (Math.abs(r - g) < 1e-12) return years / (1 + r);
  return (1 - ((1 + g) / (1 + r)) ** years) / (r - g);
}

/** Capital recovery factor: the annual payment that repays 1 over N years at r (% per year). */
export function capitalRecoveryFactor(discountRatePercent: number, years: number): number {
  if (years <= 0) throw new RangeError(`years must be ≥ 1, got ${years}`);
  return 1 / presentValueFactor(discountRatePercent, years, 0);
}

export interface CashFlowProfile {
  /** Investment at t = 0 (positive = spent). */
  capex: number;
  /** Year-1 value of the part of the annual cash flow that escalates (e.g. fuel and carbon saving). */
  escalatingAnnual: number;
  /** Part of the annual cash flow that stays constant (e.g. a fixed operating-cost change, as a saving). */
  constantAnnual: number;
  discountRatePercent: number;
  years: number;
  escalationPercent: number;
}

/** Net present value of −capex + Σ cash flows (end-of-year). */
export function netPresentValue(p: CashFlowProfile): number {
  return (
    -p.capex +
    p.escalatingAnnual * presentValueFactor(p.discountRatePercent, p.years, p.escalationPercent) +
    p.constantAnnual * presentValueFactor(p.discountRatePercent, p.years, 0)
  );
}

/** Cash flow of year t (1-based) of a profile. */
export function cashFlowInYear(p: CashFlowProfile, year: number): number {
  return p.escalatingAnnual * (1 + p.escalationPercent / 100) ** (year - 1) + p.constantAnnual;
}

/**
 * Simple payback: capex divided by the first year's net saving. `null` when the switch never
 * pays back (no saving, or a loss every year); 0 when nothing is invested and nothing is lost.
 */
export function simplePaybackYears(capex: number, firstYearNetSaving: number): number | null {
  if (capex <= 0) return firstYearNetSaving >= 0 ? 0 : null;
  if (!(firstYearNetSaving > 0)) return null;
  return capex / firstYearNetSaving;
}

/**
 * Discounted payback: the (fractional) year in which the cumulative discounted cash flow turns
 * non-negative, interpolating linearly within the year; `null` if not within the horizon.
 */
export function discountedPaybackYears(p: CashFlowProfile): number | null {
  if (p.capex <= 0) return cashFlowInYear(p, 1) >= 0 ? 0 : null;
  const r = p.discountRatePercent / 100;
  let cumulative = -p.capex;
  for (let t = 1; t <= p.years; t++) {
    const pv = cashFlowInYear(p, t) / (1 + r) ** t;
    if (cumulative + pv >= 0 && pv > 0) return t - 1 + -cumulative / pv;
    cumulative += pv;
  }
  return null;
}
