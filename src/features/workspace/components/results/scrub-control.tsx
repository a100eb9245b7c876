import { selectFullResultEndMin, useResults } from '../../stores/results-store';

/**
 * The scrubber as a keyboard control: the time the through-thickness views show. Its range is the last full
 * solve's, as those views are (a quick look records no profiles).
 */
export function ScrubControl() {
  const scrubMin = useResults((s) => s.scrubMin);
  const scrubTo = useResults((s) => s.scrubTo);
  const endMin = useResults(selectFullResultEndMin);
  return (
    <label className="flex items-center gap-2 text-xs text-ink-soft">
      Time shown
      <input
        type="range"
        min={0}
        max={Math.max(1, Math.ceil(endMin))}
        step={1}
        value={Math.min(scrubMin, Math.ceil(endMin))}
        onChange={(e) => scrubTo(Number(e.target.value))}
        className="flex-1 accent-ink"
        aria-valuetext={`${scrubMin.toFixed(0)} minutes`}
        data-testid="scrub"
      />
      <span className="num w-16 text-right">{scrubMin.toFixed(0)} min</span>
    </label>
  );
}
