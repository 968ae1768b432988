"use client";

export default function ErrorPage({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <>
      <h1>Something went wrong</h1>
      <p className="note bad">{error.message || "The page could not be shown."}</p>
      <button type="button" onClick={reset}>
        Try again
      </button>
    </>
  );
}
