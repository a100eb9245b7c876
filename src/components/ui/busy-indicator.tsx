/**
 * A small pulsing bar and "Solving…" while a solve has taken longer than a frame. The words keep their place
 * when hidden, so nothing beside them moves as a drag's slower steps turn the indicator on and off; screen
 * readers hear "Solving…" and, once it is done, "Results up to date".
 */
export function BusyIndicator({ busy, label = 'Solving' }: { busy: boolean; label?: string }) {
  return (
    <span role="status" aria-live="polite" className="inline-flex items-center gap-1.5 text-xs text-ink-soft">
      <span
        aria-hidden
        className={`inline-block h-1.5 w-6 rounded-full ${busy ? 'animate-pulse bg-ember' : 'bg-rule'}`}
      />
      <span className={busy ? '' : 'invisible'} data-testid="busy-words">
        {label}…
      </span>
      {!busy && <span className="sr-only">Results up to date</span>}
    </span>
  );
}
