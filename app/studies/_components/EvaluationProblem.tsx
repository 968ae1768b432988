import Link from "next/link";
import { pageActions } from "@/app/_auth/page-user";

/** Shown instead of results when a stored study cannot be evaluated: what is wrong and where to fix it. */
export async function EvaluationProblem({
  id,
  message,
  fieldErrors,
}: {
  id: number;
  message: string;
  fieldErrors: Record<string, string>;
}) {
  const entries = Object.entries(fieldErrors);
  const can = await pageActions();
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
        {can.editStudy ? (
          <>
            <Link href={`/studies/${id}/edit`}>Edit the study</Link> or the fuels and prices it uses.
          </>
        ) : (
          "An editor can correct the study or the fuels and prices it uses."
        )}
      </p>
    </div>
  );
}
