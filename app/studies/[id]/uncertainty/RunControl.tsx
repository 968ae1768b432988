"use client";
/**
 * Runs the uncertainty ranking off the request path: posts the form's values, follows the job's
 * progress (a progress bar; the page stays usable), can cancel it, and opens the stored run when
 * it is done.
 */
import { useRouter } from "next/navigation";
import { useEffect, useRef, useState } from "react";

type Job = {
  id: string;
  state: "running" | "done" | "failed" | "cancelled";
  phase: string;
  done: number;
  total: number;
  runId: number | null;
  problem: { message: string; fieldErrors: Record<string, string> } | null;
};

const POLL_MS = 250;

export function RunControl({ studyId, formId }: { studyId: number; formId: string }) {
  const router = useRouter();
  const [job, setJob] = useState<Job | null>(null);
  const [error, setError] = useState<{ message: string; fields: Record<string, string> } | null>(null);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const query = useRef("");
  useEffect(
    () => () => {
      if (timer.current) clearTimeout(timer.current);
    },
    [],
  );

  const base = `/api/studies/${studyId}/uncertainty`;
  function follow(id: string) {
    timer.current = setTimeout(async () => {
      const res = await fetch(`${base}/jobs/${id}`, { cache: "no-store" });
      if (!res.ok) {
        setError({ message: "The run's progress is no longer available (the server restarted?). Run it again.", fields: {} });
        setJob(null);
        return;
      }
      const j = (await res.json()).job as Job;
      setJob(j);
      if (j.state === "running") follow(id);
      else if (j.state === "done" && j.runId !== null) {
        router.push(`/studies/${studyId}/uncertainty?${query.current}${query.current ? "&" : ""}run=${j.runId}`);
        router.refresh();
      } else if (j.state === "failed" && j.problem) setError({ message: j.problem.message, fields: j.problem.fieldErrors ?? {} });
    }, POLL_MS);
  }

  async function start(e: React.MouseEvent<HTMLButtonElement>) {
    const form = document.getElementById(formId) as HTMLFormElement | null;
    if (!form) return; // without the form the button submits it the plain way
    e.preventDefault();
    setError(null);
    const q = new URLSearchParams();
    for (const [k, v] of new FormData(form).entries()) if (typeof v === "string" && v.trim() !== "" && k !== "run") q.set(k, v.trim());
    query.current = q.toString();
    const res = await fetch(`${base}/runs?${query.current}`, { method: "POST" });
    const body = await res.json();
    if (!res.ok) {
      setError({ message: body.error ?? "The run could not start.", fields: body.fieldErrors ?? {} });
      return;
    }
    setJob(body.job as Job);
    follow((body.job as Job).id);
  }

  async function cancel() {
    if (!job) return;
    await fetch(`${base}/jobs/${job.id}`, { method: "DELETE" });
  }

  const running = job?.state === "running";
  return (
    <div className="field" style={{ flex: "1 1 260px" }}>
      <div className="row" style={{ alignItems: "center", gap: "0.5rem" }}>
        <button type="submit" className="secondary" onClick={start} disabled={running}>
          {running ? "Running…" : "Run and store"}
        </button>
        {running && (
          <button type="button" className="secondary" onClick={cancel}>
            Cancel
          </button>
        )}
      </div>
      {job && (job.state === "running" || job.state === "done") && (
        <div data-testid="run-progress" style={{ marginTop: "0.35rem" }}>
          <progress max={job.total} value={job.done} aria-label="Draws done" style={{ width: "100%" }} />
          <div className="unit">
            {job.phase === "queued" || job.phase === "setup"
              ? "evaluating the study once…"
              : job.phase === "storing"
                ? "storing the result…"
                : `${job.done.toLocaleString("en-GB")} of ${job.total.toLocaleString("en-GB")} draws`}
          </div>
        </div>
      )}
      {job?.state === "cancelled" && <p className="note">Cancelled: nothing was stored.</p>}
      {error && (
        <div className="form-errors" role="alert">
          <strong>{error.message}</strong>
          {Object.keys(error.fields).length > 0 && (
            <ul>
              {Object.entries(error.fields).map(([k, v]) => (
                <li key={k}>
                  <code>{k}</code> {v}
                </li>
              ))}
            </ul>
          )}
        </div>
      )}
    </div>
  );
}
