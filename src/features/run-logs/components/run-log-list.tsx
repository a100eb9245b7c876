import { Link } from 'react-router-dom';
import type { RunLogListItem } from '../api/run-logs-api';
import { fmtTime } from '../../../lib/format-time';

const DECISION_LABEL = { 'use-as-is': 'Use as is', rework: 'Rework', scrap: 'Scrap' } as const;

/** Run logs with their findings count and decision: a study's runs, or a part's run history. */
export function RunLogList({ items, empty }: { items: RunLogListItem[]; empty: string }) {
  if (items.length === 0) return <p className="mt-2 text-sm text-ink-soft">{empty}</p>;
  return (
    <ul className="mt-2 divide-y divide-rule rounded border border-rule bg-paper-raised text-sm" data-testid="run-log-list">
      {items.map((r) => (
        <li key={r.id} className="flex flex-wrap items-baseline gap-2 p-3">
          <Link className="font-medium text-slate underline" to={`/run-logs/${r.id}`}>{r.fileName}</Link>
          <span className="text-ink-faint">
            {r.rows.toLocaleString()} rows · {Math.round(r.durationMin)} min · {r.uploadedBy?.name ?? 'unknown'} · {fmtTime(r.uploadedAt)}
          </span>
          <span className={r.findings.violations ? 'text-fault' : 'text-verdigris'}>
            {r.findings.violations} violation{r.findings.violations === 1 ? '' : 's'}, {r.findings.warnings} warning{r.findings.warnings === 1 ? '' : 's'}
          </span>
          <span className="ml-auto">{r.review ? `Decided: ${DECISION_LABEL[r.review.decision]}` : 'Awaiting decision'}</span>
        </li>
      ))}
    </ul>
  );
}
