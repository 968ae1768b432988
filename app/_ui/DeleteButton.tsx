"use client";

/** A delete button that asks first, calls the API and goes to `after`; shows the server's reason when it refuses. */
import { useRouter } from "next/navigation";
import { useState } from "react";

export function DeleteButton({ url, after, label, confirmText }: { url: string; after: string; label: string; confirmText: string }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  async function onClick() {
    if (!window.confirm(confirmText)) return;
    setBusy(true);
    setError(null);
    const res = await fetch(url, { method: "DELETE" });
    setBusy(false);
    if (res.ok) {
      router.push(after);
      router.refresh();
      return;
    }
    const body = await res.json().catch(() => ({}));
    setError(body.error ?? `Could not delete (HTTP ${res.status}).`);
  }
  return (
    <span>
      <button type="button" className="danger" onClick={onClick} disabled={busy}>
        {busy ? "Deleting…" : label}
      </button>
      {error && (
        <span role="alert" className="field-error" style={{ display: "block", maxWidth: "44ch" }}>
          {error}
        </span>
      )}
    </span>
  );
}
