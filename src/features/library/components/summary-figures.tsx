import type { RevisionSummary } from '../api/get-part';

const fmt = (x: number | undefined, digits: number, unit: string) => (typeof x === 'number' && Number.isFinite(x) ? `${x.toFixed(digits)} ${unit}` : '—');

/** The server-computed figures of a revision, in a compact row. */
export function SummaryFigures({ summary }: { summary: RevisionSummary | null }) {
  if (!summary) return <span className="text-ink-faint">no summary</span>;
  const failed = summary.limits?.filter((l) => !l.pass) ?? [];
  return (
    <span className="num inline-flex flex-wrap gap-x-3 text-xs">
      <span title="lowest final degree of cure">cure {fmt(summary.finalCureMin !== undefined ? summary.finalCureMin * 100 : undefined, 1, '%')}</span>
      <span title="peak exotherm overshoot">overshoot {fmt(summary.peakOvershootC, 1, '°C')}</span>
      <span title="warpage of the strip">warpage {fmt(summary.warpageMm, 2, 'mm')}</span>
      <span title="spring-in of the corner">spring-in {fmt(summary.springInDeg, 2, '°')}</span>
      <span title="cycle time">cycle {fmt(summary.cycleMin, 0, 'min')}</span>
      {summary.limits && (
        <span className={failed.length ? 'text-fault' : 'text-verdigris'}>
          {failed.length ? `${failed.length} limit${failed.length > 1 ? 's' : ''} not met` : 'all limits met'}
        </span>
      )}
    </span>
  );
}
