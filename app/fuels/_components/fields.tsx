"use client";

/** Form pieces shared by the fuel and price forms: labelled fields with their error message. */
import type { ChangeEvent, CSSProperties, ReactNode } from "react";
import { capitalised, labelOfPath } from "@/lib/schemas/labels";
import { decimalSeparatorOf, parseNumberEntry, type DecimalSeparator } from "@/lib/units/number-entry";

export type Errors = Record<string, string>;

export function FieldError({ errors, name, id }: { errors: Errors; name: string; id?: string }) {
  const msg = errors[name];
  if (!msg) return null;
  return (
    <span className="field-error" id={id ?? `err-${name}`} role="alert">
      {msg}
    </span>
  );
}

export function Field({
  label,
  name,
  errors,
  hint,
  children,
  htmlFor,
}: {
  label: ReactNode;
  name: string;
  errors: Errors;
  hint?: ReactNode;
  children: ReactNode;
  htmlFor?: string;
}) {
  return (
    <div className="field">
      <label htmlFor={htmlFor ?? `f-${name}`}>{label}</label>
      {children}
      {hint && <span className="hint">{hint}</span>}
      <FieldError errors={errors} name={name} />
    </div>
  );
}

/**
 * A labelled number entry (text input, numeric keyboard, id `f-NAME`, name NAME) tied to its message; the
 * text is read by `toNumber` when the form is sent.
 */
export function NumberField({
  label,
  name,
  errors,
  hint,
  value,
  onChange,
  integer,
  placeholder,
  style,
}: {
  label: ReactNode;
  name: string;
  errors: Errors;
  hint?: ReactNode;
  value: string;
  onChange: (e: ChangeEvent<HTMLInputElement>) => void;
  integer?: boolean;
  placeholder?: string;
  style?: CSSProperties;
}) {
  return (
    <Field label={label} name={name} errors={errors} hint={hint}>
      <input
        id={`f-${name}`}
        name={name}
        className="num"
        inputMode={integer ? "numeric" : "decimal"}
        value={value}
        onChange={onChange}
        placeholder={placeholder}
        style={style}
        {...invalid(errors, name)}
      />
    </Field>
  );
}

/** Props that mark an input invalid and tie it to its message. */
export function invalid(errors: Errors, name: string) {
  return errors[name] ? { "aria-invalid": true as const, "aria-describedby": `err-${name}` } : {};
}

/** The decimal separator of this browser's locale (CLDR data through Intl). */
function browserDecimalSeparator(): DecimalSeparator {
  return decimalSeparatorOf(typeof navigator === "undefined" ? undefined : navigator.language);
}

/**
 * Text from an input → number for the API, read with the browser locale's separators ("0,92",
 * "8,500", "5 000"); unparseable text is sent as is, so the server names the field.
 */
export function toNumber(text: string): number | string | null {
  const t = text.trim();
  if (t === "") return null;
  const r = parseNumberEntry(t, browserDecimalSeparator());
  return r.ok ? r.value : t;
}

/** Messages whose field has no place in the form (shown in the summary). */
export function unplaced(errors: Errors, placed: (key: string) => boolean): [string, string][] {
  return Object.entries(errors).filter(([k]) => !placed(k));
}

export function ErrorSummary({ message, errors, placed }: { message: string | null; errors: Errors; placed: (key: string) => boolean }) {
  if (!message && Object.keys(errors).length === 0) return null;
  const extra = unplaced(errors, placed);
  const n = Object.keys(errors).length;
  return (
    <div className="form-errors" role="alert" aria-live="assertive">
      <strong>{message ?? "Nothing was saved."}</strong>
      {n > 0 && <span> {n === 1 ? "One field needs attention" : `${n} fields need attention`}; see the messages below each field.</span>}
      {extra.length > 0 && (
        <ul>
          {extra.map(([k, v]) => (
            <li key={k}>
              {k === "_" ? "" : <b>{capitalised(labelOfPath(k))}:</b>} {v}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
