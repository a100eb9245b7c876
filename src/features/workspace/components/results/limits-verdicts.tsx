import { memo } from 'react';
import { resultsStore, selectQuickLook, useResults } from '../../stores/results-store';
import { formatFigure, formatLimit } from '../../../../components/comparison/format-figure';

/**
 * Pass or fail per process limit, with the worst value and where and when; a row moves the scrubber there.
 * Always of a full solve: during a drag's quick look it stays on the cycle before the drag, and says so.
 */
export const LimitsVerdicts = memo(function LimitsVerdicts() {
  const summary = useResults((s) => s.fullResult?.summary);
  const quickLook = useResults(selectQuickLook);
  if (!summary) return <p className="text-sm text-ink-faint">No verdicts yet.</p>;
  const failed = summary.limits.filter((c) => !c.pass).length;
  return (
    <div data-testid="limits-verdicts" data-accuracy="full">
      <p className={`mb-1 text-sm font-medium ${failed ? 'text-fault' : 'text-verdigris'}`}>
        {failed ? `${failed} of ${summary.limits.length} limits exceeded` : `All ${summary.limits.length} limits met`}
        {quickLook && <span className="ml-1 text-xs font-normal text-ink-soft">(cycle before this drag; checked again on release)</span>}
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
              aria-label={`${c.label}: ${c.pass ? 'within limit' : 'exceeds limit'}, ${formatFigure(c.value, c.unit)} against ${formatLimit(c.key, c.limit, c.unit)}. Show when and where.`}
            >
              <span aria-hidden className={`text-center text-xs font-bold ${c.pass ? 'text-verdigris' : 'text-fault'}`}>
                {c.pass ? '✓' : '✕'}
              </span>
              <span className="text-xs text-ink">{c.label}</span>
              <span className={`num text-xs ${c.pass ? 'text-ink' : 'font-semibold text-fault'}`}>
                {formatFigure(c.value, c.unit)}
              </span>
              <span />
              <span className="num text-[11px] text-ink-faint">
                {c.atTimeMin !== null && `at ${formatFigure(c.atTimeMin, 'min')}`}
                {c.atZMm !== null && `, z ${formatFigure(c.atZMm, 'mm')}`}
              </span>
              <span className="num text-[11px] text-ink-faint">
                {formatLimit(c.key, c.limit, c.unit)}
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
