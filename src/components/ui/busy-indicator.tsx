/** A small pulsing bar shown while a solve has taken longer than a frame. */
export function BusyIndicator({ busy, label = 'Solving' }: { busy: boolean; label?: string }) {
  return (
    <span role="status" aria-live="polite" className="inline-flex items-center gap-1.5 text-xs text-ink-soft">
      <span
        aria-hidden
        className={`inline-block h-1.5 w-6 rounded-full ${busy ? 'animate-pulse bg-ember' : 'bg-rule'}`}
      />
      <span className={busy ? '' : 'sr-only'}>{busy ? `${label}…` : 'Results up to date'}</span>
    </span>
  );
}
