import Link from "next/link";

/** Shown instead of results when a stored study cannot be evaluated: what is wrong and where to fix it. */
export function EvaluationProblem({ id, message, fieldErrors }: { id: number; message: string; fieldErrors: Record<string, string> }) {
  const entries = Object.entries(fieldErrors);
  return (
    <div className="form-errors" role="alert">
      <strong>{message}</strong>
      {entries.length > 0 && (
        <ul>
          {entries.map(([k, v]) => (
            <li key={k}>
              <code>{k}</code> {v}
            </li>
          ))}
        </ul>
      )}
      <p style={{ marginTop: "0.5rem" }}>
        <Link href={`/studies/${id}/edit`}>Edit the study</Link> or the fuels and prices it uses.
      </p>
    </div>
  );
}
