"use client";

/** Restore (editor) and delete-for-good (admin) buttons of one trash item; the server's reason shows when it refuses. */
import { useRouter } from "next/navigation";
import { useState } from "react";

export function TrashActions({
  kind,
  id,
  name,
  canRestore,
  canPurge,
}: {
  kind: string;
  id: number;
  name: string;
  canRestore: boolean;
  canPurge: boolean;
}) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  async function act(action: "restore" | "purge") {
    if (action === "purge" && !window.confirm(`Delete "${name}" for good? This cannot be undone.`)) return;
    setBusy(true);
    setError(null);
    const res = await fetch(`/api/trash/${kind}/${id}/${action}`, { method: "POST" });
    setBusy(false);
    if (res.ok) {
      router.refresh();
      return;
    }
    const body = await res.json().catch(() => ({}));
    setError(body.error ?? `Refused (HTTP ${res.status}).`);
  }
  return (
    <span>
      {canRestore && (
        <button type="button" onClick={() => act("restore")} disabled={busy}>
          Restore
        </button>
      )}{" "}
      {canPurge && (
        <button type="button" className="danger" onClick={() => act("purge")} disabled={busy}>
          Delete for good
        </button>
      )}
      {error && (
        <span role="alert" className="field-error" style={{ display: "block", maxWidth: "44ch" }}>
          {error}
        </span>
      )}
    </span>
  );
}
