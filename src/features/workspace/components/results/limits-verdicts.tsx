import { memo } from 'react';
import type { StudySummary } from '../../model/simulation-result';
import { resultsStore, useResults } from '../../stores/results-store';

type Check = StudySummary['limits'][number];

function fmt(v: number): string {
  if (v === 0) return '0';
  const a = Math.abs(v);
  return a >= 100 ? v.toFixed(0) : a >= 10 ? v.toFixed(1) : a >= 1 ? v.toFixed(2) : v.toFixed(3);
}

const unitOf = (c: Check) => (c.unit ? ` ${c.unit}` : '');
const relation = (c: Check) => (c.key === 'minFinalCure' ? '≥' : '≤');

/** Pass or fail per process limit, with the worst value and where and when; a row moves the scrubber there. */
export const LimitsVerdicts = memo(function LimitsVerdicts() {
  const summary = useResults((s) => s.result?.summary);
  if (!summary) return <p className="text-sm text-ink-faint">No verdicts yet.</p>;
  const failed = summary.limits.filter((c) => !c.pass).length;
  return (
    <div data-testid="limits-verdicts">
      <p className={`mb-1 text-sm font-medium ${failed ? 'text-fault' : 'text-verdigris'}`}>
        {failed ? `${failed} of ${summary.limits.length} limits exceeded` : `All ${summary.limits.length} limits met`}
      </p>
      <ul className="divide-y divide-rule/70">
        {summary.limits.map((c) => (
          <li key={c.key}>
            <button
              type="button"
              className="grid w-full grid-cols-[1.25rem_1fr_auto] items-baseline gap-x-1.5 py-1 text-left hover:bg-rule/30"
              data-testid={`limit-${c.key}`}
              onClick={() => c.atTimeMin !== null && resultsStore.getState().scrubTo(c.atTimeMin, c.atZMm)}
              disabled={c.atTimeMin === null}
              aria-label={`${c.label}: ${c.pass ? 'within limit' : 'exceeds limit'}, ${fmt(c.value)}${unitOf(c)} against ${relation(c)} ${fmt(c.limit)}${unitOf(c)}. Show when and where.`}
            >
              <span aria-hidden className={`text-center text-xs font-bold ${c.pass ? 'text-verdigris' : 'text-fault'}`}>
                {c.pass ? '✓' : '✕'}
              </span>
              <span className="text-xs text-ink">{c.label}</span>
              <span className={`num text-xs ${c.pass ? 'text-ink' : 'font-semibold text-fault'}`}>
                {fmt(c.value)}
                {unitOf(c)}
              </span>
              <span />
              <span className="num text-[11px] text-ink-faint">
                {c.atTimeMin !== null && `at ${fmt(c.atTimeMin)} min`}
                {c.atZMm !== null && `, z ${fmt(c.atZMm)} mm`}
              </span>
              <span className="num text-[11px] text-ink-faint">
                {relation(c)} {fmt(c.limit)}
                {unitOf(c)}
              </span>
            </button>
          </li>
        ))}
      </ul>
      {summary.warnings.length > 0 && (
        <ul className="mt-1 text-xs text-saffron">
          {summary.warnings.map((w) => (
            <li key={w}>⚠ {w}</li>
          ))}
        </ul>
      )}
    </div>
  );
});
