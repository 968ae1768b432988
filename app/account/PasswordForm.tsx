"use client";

/** Changing one's own password; afterwards every session has ended, so it goes to sign-in. */
import { useState } from "react";

export function PasswordForm() {
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string | null>(null);
  async function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const f = new FormData(e.currentTarget);
    if (f.get("newPassword") !== f.get("again")) {
      setErrors({ again: "the two new passwords differ" });
      return;
    }
    const res = await fetch("/api/session/password", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ currentPassword: f.get("currentPassword"), newPassword: f.get("newPassword") }),
    });
    if (res.ok) {
      window.location.assign("/sign-in");
      return;
    }
    const body = await res.json().catch(() => ({}));
    setErrors(body.fieldErrors ?? {});
    setMessage(body.error ?? `Refused (HTTP ${res.status}).`);
  }
  const err = (k: string) => errors[k] && <span className="field-error">{errors[k]}</span>;
  return (
    <form onSubmit={onSubmit} className="panel" style={{ maxWidth: "28rem", display: "grid", gap: "0.75rem" }}>
      <label className="field">
        <span>Current password</span>
        <input name="currentPassword" type="password" autoComplete="current-password" required />
        {err("currentPassword")}
      </label>
      <label className="field">
        <span>New password (12 characters or more)</span>
        <input name="newPassword" type="password" autoComplete="new-password" minLength={12} required />
        {err("newPassword")}
      </label>
      <label className="field">
        <span>New password again</span>
        <input name="again" type="password" autoComplete="new-password" minLength={12} required />
        {err("again")}
      </label>
      {message && (
        <p role="alert" className="form-errors">
          {message}
        </p>
      )}
      <div>
        <button type="submit">Change password</button>
      </div>
    </form>
  );
}
