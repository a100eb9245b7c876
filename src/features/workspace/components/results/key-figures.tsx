import { memo } from 'react';
import { selectQuickLook, useResults } from '../../stores/results-store';
import { formatSignificant } from '../../model/format';

function Figure({ label, value, unit, testId, warn }: { label: string; value: string; unit: string; testId?: string; warn?: boolean }) {
  return (
    <div className="flex flex-col px-3 py-1.5">
      <dt className="text-[11px] text-ink-soft">{label}</dt>
      <dd className={`num text-lg leading-tight ${warn ? 'text-fault' : 'text-ink'}`}>
        <span data-testid={testId}>{value}</span>
        {unit && <span className="ml-1 text-xs text-ink-faint">{unit}</span>}
      </dd>
    </div>
  );
}

/** How many solves the worker was asked for; read by the end-to-end test that proves invalid input is never sent. */
export function SolveCounter() {
  const count = useResults((s) => s.solveCount);
  return (
    <span hidden data-testid="solve-count">
      {count}
    </span>
  );
}

/** The few numbers an engineer reads first, with the solve's own cost. */
export const KeyFigures = memo(function KeyFigures() {
  const result = useResults((s) => s.result);
  const solveMs = useResults((s) => s.solveMs);
  const quickLook = useResults(selectQuickLook);
  if (!result) return <div className="h-14" />;
  const s = result.summary;
  const fail = (key: string) => s.limits.some((c) => c.key === key && !c.pass);
  return (
    <dl className="paint-island flex flex-wrap divide-x divide-rule" aria-label={quickLook ? 'Key results, quick look' : 'Key results'} data-steps={s.steps}>
      <Figure label="Final cure, least cured point" value={s.finalCureMin.toFixed(3)} unit="α" testId="final-cure-figure" warn={fail('minFinalCure')} />
      <Figure label="Final Tg" value={s.finalTgC.toFixed(1)} unit="°C" />
      <Figure label="Peak part temperature" value={s.peakPartC.toFixed(1)} unit="°C" />
      <Figure label="Exotherm overshoot" value={s.peakOvershootC.toFixed(1)} unit="°C" warn={fail('maxOvershootC')} />
      <Figure label="Warpage" value={formatSignificant(s.warpageMm)} unit="mm" testId="warpage-key-figure" warn={fail('maxWarpageMm')} />
      <Figure label="Spring-in" value={formatSignificant(s.springInDeg)} unit="°" warn={fail('maxSpringInDeg')} />
      <Figure label="Cycle to demould" value={s.cycleMin.toFixed(0)} unit="min" warn={fail('maxCycleMin')} />
      <Figure label={quickLook ? 'Quick-look solve' : 'Solve'} value={solveMs === null ? '–' : solveMs.toFixed(0)} unit={`ms · ${s.steps} steps`} />
    </dl>
  );
});
