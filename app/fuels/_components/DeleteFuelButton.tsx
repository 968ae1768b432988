"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";

export function DeleteFuelButton({ id, name }: { id: number; name: string }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  async function onClick() {
    if (!window.confirm(`Delete “${name}” and its price history? This cannot be undone.`)) return;
    setBusy(true);
    setError(null);
    const res = await fetch(`/api/fuels/${id}`, { method: "DELETE" });
    setBusy(false);
    if (res.ok) {
      router.push("/fuels");
      router.refresh();
      return;
    }
    const body = await res.json().catch(() => ({}));
    setError(body.error ?? `Could not delete (HTTP ${res.status}).`);
  }
  return (
    <span>
      <button type="button" className="danger" onClick={onClick} disabled={busy}>
        {busy ? "Deleting…" : "Delete fuel"}
      </button>
      {error && (
        <span role="alert" className="field-error" style={{ display: "block", maxWidth: "40ch" }}>
          {error}
        </span>
      )}
    </span>
  );
}
