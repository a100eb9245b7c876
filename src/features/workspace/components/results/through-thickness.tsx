import { memo, useMemo } from 'react';
import type { ResultRun } from '../../../../components/charts/history-chart';
import { profileAt, stepAt, ThroughThicknessCharts } from '../../../../components/charts/through-thickness-chart';
import { selectQuickLook, useResults } from '../../stores/results-store';

/**
 * Profiles at the scrubbed time: the laminate stands upright, tool side at the bottom. Only a full solve
 * records profiles: during a drag's quick look these stay on the cycle before the drag, and say so.
 */
export const ThroughThickness = memo(function ThroughThickness() {
  const result = useResults((s) => s.fullResult);
  const quickLook = useResults(selectQuickLook);
  const scrubMin = useResults((s) => s.scrubMin);
  const focusZMm = useResults((s) => s.focusZMm);
  const runs = useMemo<ResultRun[]>(() => (result ? [{ label: 'this study', result }] : []), [result]);
  const step = result ? stepAt(result, scrubMin) : 0;
  const profile = useMemo(() => (result && result.profiles.temperatureK.length ? profileAt(result, step) : null), [result, step]);
  if (!result || !profile) return <p className="text-sm text-ink-faint">No profiles yet.</p>;
  const temps = profile.temperatureC.values;
  const tMin = Math.min(...temps);
  const tMax = Math.max(...temps);
  const mid = Math.floor(temps.length / 2);
  return (
    <div data-testid="through-thickness">
      <p className="num mb-1 text-xs text-ink-soft">
        at {(result.history.timeS[step] / 60).toFixed(1)} min · ΔT {(tMax - tMin).toFixed(1)} °C · mid-plane{' '}
        {temps[mid].toFixed(1)} °C, α {profile.alpha.values[mid].toFixed(3)}
        {quickLook && <span className="text-ink-faint"> · cycle before this drag, updated on release</span>}
      </p>
      <ThroughThicknessCharts runs={runs} minutes={scrubMin} focusZMm={focusZMm} fileBase="dwellform-through-thickness" />
      <p className="text-[10px] text-ink-faint">z in mm from the tool face (blue rule) upward to the bag.</p>
    </div>
  );
});
