"use client";

/** The sign-in form: e-mail and password to POST /api/session, then on to the page asked for. */
import { useState } from "react";

export function SignInForm({ next }: { next: string }) {
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  async function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    setBusy(true);
    setError(null);
    const res = await fetch("/api/session", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ email: form.get("email"), password: form.get("password") }),
    });
    setBusy(false);
    if (res.ok) {
      window.location.assign(next);
      return;
    }
    const body = await res.json().catch(() => ({}));
    setError(body.error ?? `Sign-in failed (HTTP ${res.status}).`);
  }
  return (
    <form onSubmit={onSubmit} className="panel" style={{ maxWidth: "28rem", display: "grid", gap: "0.75rem" }}>
      <label className="field">
        <span>E-mail</span>
        <input name="email" type="email" autoComplete="username" required />
      </label>
      <label className="field">
        <span>Password</span>
        <input name="password" type="password" autoComplete="current-password" required />
      </label>
      {error && (
        <p role="alert" className="form-errors">
          {error}
        </p>
      )}
      <div>
        <button type="submit" disabled={busy}>
          {busy ? "Signing in…" : "Sign in"}
        </button>
      </div>
    </form>
  );
}
