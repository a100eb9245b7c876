import { Link, useParams } from 'react-router-dom';
import { usePart } from '../api/get-part';
import { SummaryFigures } from './summary-figures';
import { NewStudyForm } from './new-study-form';
import { fmtTime } from '../../../lib/format-time';
import { Loading, QueryError } from '../../../components/ui/query-state';

export function PartPage() {
  const { partId = '' } = useParams();
  const part = usePart(partId);
  if (part.isPending) return <div className="p-6"><Loading what="the part" /></div>;
  if (part.isError) return <div className="p-6"><QueryError error={part.error} what="the part" /></div>;
  const p = part.data;
  const canWrite = p.role === 'engineer' || p.role === 'lead';
  return (
    <section className="mx-auto max-w-5xl px-4 py-6">
      <p className="text-sm"><Link className="text-slate underline" to={`/teams/${p.teamId}`}>← Team</Link></p>
      <h1 className="mt-1 text-2xl font-semibold">{p.partNumber} · {p.name}</h1>
      {p.description && <p className="mt-1 text-ink-soft">{p.description}</p>}
      <p className="mt-1 text-sm"><Link className="text-slate underline" to={`/parts/${p.id}/run-logs`}>Run history and reviews</Link></p>

      <div className="mt-5 rounded border border-rule bg-paper-raised p-4" data-testid="baseline">
        <h2 className="text-sm font-semibold uppercase tracking-wide text-ink-soft">Baseline</h2>
        {p.baseline ? (
          <>
            <p className="mt-1">
              <Link className="text-slate underline" to={`/studies/${p.baseline.studyId}/history`}>{p.baseline.studyTitle}</Link>{' '}
              revision <span className="num">{p.baseline.number}</span>
            </p>
            <p className="mt-1 text-sm">“{p.baseline.note}” — {p.baseline.pinnedBy?.name ?? 'unknown'}, {fmtTime(p.baseline.pinnedAt)}</p>
            <p className="mt-2"><SummaryFigures summary={p.baseline.summary} /></p>
          </>
        ) : (
          <p className="mt-1 text-ink-soft">No baseline pinned yet. A lead pins one from a study's history; comparisons then default to it.</p>
        )}
      </div>

      <h2 className="mt-6 text-sm font-semibold uppercase tracking-wide text-ink-soft">Studies</h2>
      {p.studies.length === 0 ? (
        <p className="mt-2 text-ink-soft">No studies on this part yet.{canWrite ? ' Start the first one below.' : ''}</p>
      ) : (
        <ul className="mt-2 divide-y divide-rule rounded border border-rule bg-paper-raised text-sm">
          {p.studies.map((s) => (
            <li key={s.id} className="flex flex-wrap items-baseline gap-2 p-3">
              <Link className="font-medium text-slate underline" to={`/studies/${s.id}/history`}>{s.title}</Link>
              <span className="text-ink-faint">r{s.latestRevisionNumber} · {s.owner?.name} · {fmtTime(s.updatedAt)}</span>
              {s.forkedFrom && (
                <span className="w-full text-ink-soft" data-testid="fork-origin">
                  forked from <Link className="text-slate underline" to={`/studies/${s.forkedFrom.studyId}/history`}>{s.forkedFrom.studyTitle} r{s.forkedFrom.number}</Link>
                  {s.forkedFrom.author && <> by {s.forkedFrom.author.name}</>}
                </span>
              )}
              <Link className="ml-auto text-slate underline" to={`/studies/${s.id}`}>Open in workspace</Link>
            </li>
          ))}
        </ul>
      )}
      {canWrite && (
        <>
          <h2 className="mt-6 text-sm font-semibold uppercase tracking-wide text-ink-soft">New study</h2>
          <NewStudyForm part={p} />
        </>
      )}

      <h2 className="mt-8 text-sm font-semibold uppercase tracking-wide text-ink-soft">History of this part</h2>
      {p.history.length === 0 ? (
        <p className="mt-2 text-ink-soft">Nothing recorded yet: baseline pins, new studies, run logs and review decisions show here.</p>
      ) : (
        <ol className="mt-2 space-y-1 text-sm" data-testid="part-history">
          {p.history.map((e) => (
            <li key={e.id}>
              <span className="text-ink-faint">{fmtTime(e.createdAt)}</span> <span className="font-medium">{e.actor?.name ?? 'system'}</span> {e.sentence}
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}
