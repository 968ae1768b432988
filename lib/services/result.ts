/**
 * What a service answers: a value, or a problem of one of four kinds with a message and the
 * per-field messages (dotted field paths as the user wrote them). The kinds say what went wrong,
 * not how a transport reports it: `app/api/_http.ts` turns them into HTTP statuses in one place.
 *
 * - `invalid`: the input cannot be used (a field is wrong or missing);
 * - `not-found`: no such record;
 * - `conflict`: the input clashes with what is stored (a name taken, a record in use);
 * - `unprocessable`: well-formed, but it cannot be computed (infeasible charge, a solver that did
 *   not converge, a stored record that cannot be evaluated);
 * - `unauthorized`: a sign-in with a wrong e-mail or password (team mode);
 * - `throttled`: too many failed sign-ins; `retryAfterS` says when to try again.
 */
import { InfeasibleChargeError, InputError, NotConvergedError, StokeError } from "../errors";
import { FuelDefinitionError } from "../fuels/resolve";
import { StudyInputError } from "../study/errors";
import { EquilibriumInfeasibleError, EquilibriumNotConvergedError } from "../combustion/equilibrium";
import { PriceNormalisationError } from "../economics/prices";

export type ProblemKind = "invalid" | "not-found" | "conflict" | "unprocessable" | "unauthorized" | "throttled";

export type FieldErrors = Record<string, string>;

export interface Problem {
  ok: false;
  kind: ProblemKind;
  message: string;
  fieldErrors: FieldErrors;
  /** Warnings that stopped the write until the user confirms (implausible prices). */
  warnings?: string[];
  /** Throttled: seconds until another try is accepted. */
  retryAfterS?: number;
}

export type Result<T> = { ok: true; value: T } | Problem;

export function ok<T>(value: T): { ok: true; value: T } {
  return { ok: true, value };
}

export function problem(kind: ProblemKind, message: string, fieldErrors: FieldErrors = {}): Problem {
  return { ok: false, kind, message, fieldErrors };
}

/**
 * The error as one of lib/errors.ts, or undefined when it is none of the errors lib/ throws on
 * purpose (then it is a bug and must propagate). Errors of the older kinds that some modules still
 * throw are translated here, in one place, until those modules throw lib/errors.ts errors themselves.
 */
export function asStokeError(e: unknown): StokeError | undefined {
  if (e instanceof StokeError) return e;
  if (e instanceof FuelDefinitionError) {
    const prefix = `${e.field}: `;
    return new InputError(e.field, e.message.startsWith(prefix) ? e.message.slice(prefix.length) : e.message);
  }
  if (e instanceof StudyInputError) return new InputError(e.field, e.detail);
  if (e instanceof PriceNormalisationError) {
    const [only] = e.issues;
    return e.issues.length === 1 && only ? new InputError(only.field, only.message) : new InputError("", e.message);
  }
  if (e instanceof EquilibriumInfeasibleError) return new InfeasibleChargeError("", e.message, "soot");
  if (e instanceof EquilibriumNotConvergedError) {
    return new NotConvergedError("equilibrium", e.message, { iterations: e.iterations, lastResidual: e.lastResidual });
  }
  return undefined;
}

/** The error kind's problem kind: bad input is invalid; a charge or solver that fails is unprocessable. */
export function problemKindOf(e: StokeError): ProblemKind {
  return e.kind === "input" ? "invalid" : "unprocessable";
}

/** Says what a lib/ error means in a sentence (a solver that did not converge says so). */
export function explain(e: StokeError): string {
  if (e instanceof NotConvergedError) return `the ${e.solver} solver did not converge: ${e.detail}`;
  return e.detail;
}

export interface ProblemOptions {
  /** Where the error's field sits in what the caller sent (default: unchanged). "" when none does. */
  fieldOf?: (path: string) => string;
  /** The kind for every error (e.g. `unprocessable` for a stored record); default by the error's kind. */
  kind?: ProblemKind;
  /** Frames the sentence (e.g. "The study cannot be evaluated: …"); `field` is the error's own path. */
  message?: (sentence: string, field: string) => string;
}

/**
 * The problem a lib/ error stands for, with its field named. Anything that is not one of the errors
 * lib/ throws on purpose is rethrown unchanged (a bug stays a bug).
 */
export function problemFromError(e: unknown, opts: ProblemOptions = {}): Problem {
  const se = asStokeError(e);
  if (!se) throw e;
  const sentence = explain(se);
  const field = (opts.fieldOf ?? ((p: string) => p))(se.field) || "_";
  const message = opts.message ? opts.message(sentence, se.field) : se.field ? `${se.field}: ${sentence}` : sentence;
  return problem(opts.kind ?? problemKindOf(se), message, { [field]: sentence });
}

/** The message of a lib/ error for a figure that could not be computed; a bug is rethrown. */
export function reasonOf(e: unknown): string {
  const se = asStokeError(e);
  if (!se) throw e;
  return se.field ? `${se.field}: ${explain(se)}` : explain(se);
}
