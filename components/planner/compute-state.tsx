/** Progress, stale and error notes of a computed panel. */
export function ComputeState({ slow, stale, error }: { slow: boolean; stale: boolean; error: string | null }) {
  return (
    <div aria-live="polite" className="min-h-5 text-xs">
      {error ? (
        <p className="text-danger" data-testid="compute-error">Could not compute: {error}</p>
      ) : slow ? (
        <p className="flex items-center gap-2 text-ink-soft" data-testid="computing">
          <span className="inline-block h-3 w-3 animate-spin rounded-full border-2 border-moss border-t-transparent" aria-hidden="true" />
          Computing…{stale ? " The chart below shows the previous inputs (stale)." : ""}
        </p>
      ) : stale ? (
        <p className="text-caution" data-testid="stale">Stale: showing the previous inputs while the new result comes.</p>
      ) : null}
    </div>
  );
}
