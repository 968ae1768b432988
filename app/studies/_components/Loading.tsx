/** The loading state shown while a study page computes (route segments' loading.tsx). */
export function LoadingState({ what }: { what: string }) {
  return (
    <div className="loading-state" role="status" aria-live="polite">
      <span className="spinner" aria-hidden="true" />
      <span>{what}</span>
    </div>
  );
}
