"use client";

/** Adds one dated exchange rate (1 unit of one currency buys `rate` units of another from a date on). */
import { useRouter } from "next/navigation";
import { useState } from "react";
import { ErrorSummary, Field, invalid, toNumber, type Errors } from "./fields";

const FIELDS = ["fromCurrency", "toCurrency", "rate", "validFrom", "source"] as const;

export function ExchangeRateForm() {
  const router = useRouter();
  const [v, setV] = useState<Record<(typeof FIELDS)[number], string>>({
    fromCurrency: "",
    toCurrency: "",
    rate: "",
    validFrom: "",
    source: "",
  });
  const [errors, setErrors] = useState<Errors>({});
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const set = (k: (typeof FIELDS)[number]) => (e: React.ChangeEvent<HTMLInputElement>) => setV((s) => ({ ...s, [k]: e.target.value }));

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setBusy(true);
    setMessage(null);
    const res = await fetch("/api/exchange-rates", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ ...v, rate: toNumber(v.rate) }),
    });
    const out = await res.json().catch(() => ({}));
    setBusy(false);
    if (!res.ok) {
      setErrors(out.fieldErrors ?? {});
      setMessage(out.error ?? `The server answered ${res.status}.`);
      return;
    }
    setErrors({});
    setV({ fromCurrency: "", toCurrency: "", rate: "", validFrom: "", source: "" });
    router.refresh();
  }

  return (
    <form className="stack" onSubmit={submit} noValidate aria-label="Add an exchange rate">
      <ErrorSummary message={message} errors={errors} placed={(k) => (FIELDS as readonly string[]).includes(k)} />
      <div className="row">
        <Field label="1 unit of (ISO 4217)" name="fromCurrency" errors={errors}>
          <input
            id="f-fromCurrency"
            value={v.fromCurrency}
            onChange={set("fromCurrency")}
            maxLength={3}
            placeholder="USD"
            {...invalid(errors, "fromCurrency")}
          />
        </Field>
        <Field label="buys" name="rate" errors={errors}>
          <input id="f-rate" className="num" inputMode="decimal" value={v.rate} onChange={set("rate")} {...invalid(errors, "rate")} />
        </Field>
        <Field label="units of (ISO 4217)" name="toCurrency" errors={errors}>
          <input
            id="f-toCurrency"
            value={v.toCurrency}
            onChange={set("toCurrency")}
            maxLength={3}
            placeholder="EUR"
            {...invalid(errors, "toCurrency")}
          />
        </Field>
        <Field label="from" name="validFrom" errors={errors}>
          <input id="f-validFrom" type="date" value={v.validFrom} onChange={set("validFrom")} {...invalid(errors, "validFrom")} />
        </Field>
        <Field label="Source" name="source" errors={errors}>
          <input id="f-source" value={v.source} onChange={set("source")} maxLength={1000} {...invalid(errors, "source")} />
        </Field>
      </div>
      <div className="row">
        <button type="submit" disabled={busy}>
          {busy ? "Adding…" : "Add rate"}
        </button>
      </div>
    </form>
  );
}
