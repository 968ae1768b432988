"use client";

import { useRouter } from "next/navigation";
import { useEffect, useRef, useState } from "react";

interface Progress {
  needed: number;
  solved: number;
  failed: number;
  pending: number;
  job: { running: boolean; enabled: boolean; problem: string | null };
}

/**
 * While flame solves of the study run in the background, shows how far they are and refreshes the
 * page's figures each time one more is done; the page stays usable meanwhile.
 */
export function FlameProgress({
  id,
  initial,
  sweep = true,
}: {
  id: number;
  initial: { needed: number; solved: number; failed: number; pending: number };
  /** Count the hydrogen sweep's solves too (the pages that show it). */
  sweep?: boolean;
}) {
  const router = useRouter();
  const [p, setP] = useState<Progress | null>(null);
  const seen = useRef(initial.solved + initial.failed);
  const pending = p ? p.pending : initial.pending;
  useEffect(() => {
    if (pending === 0) return;
    let stop = false;
    const tick = async () => {
      const res = await fetch(`/api/studies/${id}/flames${sweep ? "" : "?sweep=0"}`, { cache: "no-store" }).catch(() => null);
      if (stop || !res?.ok) return;
      const next = (await res.json()) as Progress;
      setP(next);
      if (next.solved + next.failed !== seen.current) {
        seen.current = next.solved + next.failed;
        router.refresh();
      }
    };
    const t = setInterval(tick, 2000);
    void tick();
    return () => {
      stop = true;
      clearInterval(t);
    };
  }, [id, pending, router, sweep]);
  const cur = p ?? { ...initial, job: { running: false, enabled: true, problem: null } };
  if (cur.needed === 0) return null;
  const done = cur.solved + cur.failed;
  return (
    <div className={`note${cur.pending ? "" : " ok"}`} role="status" data-testid="flame-progress">
      {cur.pending > 0 ? (
        <>
          <progress max={cur.needed} value={done} aria-label="flame solves done" /> Flame solves: {done} of {cur.needed} done
          {cur.job.enabled ? "" : " (background solves are switched off on this server)"}. Burning velocity, flashback and NOx figures fill
          in as each finishes; the rest of the page is ready to use.
        </>
      ) : (
        <>
          Flame solves: all {cur.needed} done{cur.failed ? `, ${cur.failed} without a result (named where they apply)` : ""}.
        </>
      )}
      {cur.job.problem && <span className="error"> {cur.job.problem}</span>}
    </div>
  );
}
