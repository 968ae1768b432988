"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";

/** Copies the study with all its scenarios and opens the copy. */
export function DuplicateButton({ id }: { id: number }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  async function onClick() {
    setBusy(true);
    setError(null);
    const res = await fetch(`/api/studies/${id}/duplicate`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: "{}",
    });
    const out = await res.json().catch(() => ({}));
    setBusy(false);
    if (!res.ok) {
      setError(out.error ?? `Could not duplicate (HTTP ${res.status}).`);
      return;
    }
    router.push(`/studies/${out.id}/edit`);
    router.refresh();
  }
  return (
    <span>
      <button type="button" className="secondary" onClick={onClick} disabled={busy}>
        {busy ? "Copying…" : "Duplicate"}
      </button>
      {error && (
        <span role="alert" className="field-error" style={{ display: "block" }}>
          {error}
        </span>
      )}
    </span>
  );
}
