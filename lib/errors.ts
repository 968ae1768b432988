/**
 * Stoke's error model: the only errors `lib/` throws on purpose. Anything else that escapes is a bug.
 *
 * - `InputError`: the user gave something that cannot be used. Carries the field path as the user
 *   wrote it (`phi`, `fuel.composition.CH4`, `scenarios.2.fuelId`).
 * - `InfeasibleChargeError`: the input is well formed but the charge cannot be computed with the
 *   model (too little oxygen, soot would form, nothing combustible, …). Names the field when one
 *   field is to blame.
 * - `NotConvergedError`: a solver did not reach a verified answer. Carries the solver's name and its
 *   diagnostics; never accompanied by a number.
 *
 * The edges translate these in one place each: the command line (`lib/cli/io.ts`: exit 2 / 2 / 1)
 * and the HTTP layer (`app/api/_http.ts`: 400 / 422 / 422).
 */

export type ErrorKind = "input" | "infeasible" | "not-converged";

/** Joins path segments with dots, skipping empty ones: `joinPath("scenarios", 2, "fuel")` → `scenarios.2.fuel`. */
export function joinPath(...parts: ReadonlyArray<string | number | undefined>): string {
  return parts.filter((p) => p !== undefined && p !== "").join(".");
}

export abstract class StokeError extends Error {
  abstract readonly kind: ErrorKind;
  /** Dotted path of the field to blame, as the user wrote it; "" when no single field is. */
  readonly field: string;
  /** The message without the field. */
  readonly detail: string;
  constructor(field: string, detail: string) {
    super(field ? `${field}: ${detail}` : detail);
    this.field = field;
    this.detail = detail;
  }
  /** The same error with its field path placed under `prefix` (e.g. a fuel's path inside a study). */
  abstract under(prefix: string): StokeError;
}

export class InputError extends StokeError {
  readonly kind = "input" as const;
  constructor(field: string, detail: string) {
    super(field, detail);
    this.name = "InputError";
  }
  under(prefix: string): InputError {
    return new InputError(joinPath(prefix, this.field), this.detail);
  }
}

export type InfeasibleReason = "no-oxygen" | "too-little-oxygen" | "soot" | "no-combustible" | "out-of-range" | "other";

export class InfeasibleChargeError extends StokeError {
  readonly kind = "infeasible" as const;
  readonly reason: InfeasibleReason;
  constructor(field: string, detail: string, reason: InfeasibleReason = "other") {
    super(field, detail);
    this.name = "InfeasibleChargeError";
    this.reason = reason;
  }
  under(prefix: string): InfeasibleChargeError {
    return new InfeasibleChargeError(joinPath(prefix, this.field), this.detail, this.reason);
  }
}

export type Diagnostics = Readonly<Record<string, number | string | boolean>>;

export class NotConvergedError extends StokeError {
  readonly kind = "not-converged" as const;
  /** Which solver: "equilibrium", "flame-temperature", "premixed-flame", … */
  readonly solver: string;
  readonly diagnostics: Diagnostics;
  constructor(solver: string, detail: string, diagnostics: Diagnostics = {}, field = "") {
    super(field, detail);
    this.name = "NotConvergedError";
    this.solver = solver;
    this.diagnostics = diagnostics;
  }
  under(prefix: string): NotConvergedError {
    return new NotConvergedError(this.solver, this.detail, this.diagnostics, joinPath(prefix, this.field));
  }
}

export function isStokeError(e: unknown): e is StokeError {
  return e instanceof StokeError;
}

/** Rethrows a Stoke error with its field placed under `prefix`; anything else (a bug) unchanged. */
export function rethrowUnder(prefix: string, e: unknown): never {
  if (e instanceof StokeError) throw e.under(prefix);
  throw e;
}
