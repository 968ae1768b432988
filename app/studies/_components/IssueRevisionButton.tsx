"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";

/** Issues the next revision of the study (a frozen copy of its inputs and results). */
export function IssueRevisionButton({ id }: { id: number }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  async function onClick() {
    setBusy(true);
    setError(null);
    const res = await fetch(`/api/studies/${id}/revisions`, { method: "POST" });
    const out = await res.json().catch(() => ({}));
    setBusy(false);
    if (!res.ok) {
      setError(out.error ?? `Could not issue a revision (HTTP ${res.status}).`);
      return;
    }
    setMessage(`Revision ${out.revision} issued (SHA-256 ${String(out.hash).slice(0, 12)}…).`);
    router.refresh();
  }
  return (
    <span>
      <button type="button" onClick={onClick} disabled={busy}>
        {busy ? "Issuing…" : "Issue revision"}
      </button>
      {message && (
        <span role="status" className="note">
          {" "}
          {message}
        </span>
      )}
      {error && (
        <span role="alert" className="field-error" style={{ display: "block" }}>
          {error}
        </span>
      )}
    </span>
  );
}
