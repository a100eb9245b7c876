import { useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { useStudyOverview, useStudyRevisions, type RevisionEntry } from '../api/get-study-history';
import { useForkFromRevision, useRestoreRevision } from '../api/revision-actions';
import { usePinBaseline } from '../api/pin-baseline';
import { SummaryFigures } from './summary-figures';
import { fmtTime } from '../../../lib/format-time';
import { formatRevisionRef } from '../../../lib/revision-query';
import { Loading, QueryError } from '../../../components/ui/query-state';

function PinForm({ partId, revision, onDone }: { partId: number; revision: RevisionEntry; onDone: () => void }) {
  const [note, setNote] = useState('');
  const pin = usePinBaseline();
  return (
    <form
      className="mt-2 flex flex-wrap items-center gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        pin.mutate({ partId, revisionId: revision.id, note }, { onSuccess: onDone });
      }}
    >
      <label className="flex items-center gap-1 text-sm">
        Why this baseline
        <input required value={note} onChange={(e) => setNote(e.target.value)} maxLength={500} className="w-72 rounded border border-rule bg-paper px-2 py-0.5" />
      </label>
      <button type="submit" className="rounded bg-ink px-2 py-0.5 text-sm text-paper" disabled={pin.isPending}>Pin r{revision.number}</button>
      {pin.isError && <span role="alert" className="text-sm text-fault">{pin.error.message}</span>}
    </form>
  );
}

/**
 * Links that name this one revision, so they can be shared: open it (read-only unless it is the latest), its
 * printable report, and the comparison with the revision before it and with the part's pinned baseline.
 */
function RevisionLinks({ studyId, number, latest, baseline }: { studyId: number; number: number; latest: number; baseline: boolean }) {
  const ref = formatRevisionRef({ source: 'library', studyId, number });
  const previous = formatRevisionRef({ source: 'library', studyId, number: number - 1 });
  const link = 'text-slate underline';
  return (
    <>
      <Link className={link} to={number === latest ? `/studies/${studyId}` : `/studies/${studyId}?r=${number}`}>
        Open r{number}
      </Link>
      <Link className={link} to={`/report?r=${ref}`}>
        Report
      </Link>
      {number > 1 && (
        <Link className={link} to={`/compare?a=${previous}&b=${ref}`}>
          Compare with r{number - 1}
        </Link>
      )}
      {/* With B alone the compare view takes the part's pinned baseline as A. */}
      {baseline && (
        <Link className={link} to={`/compare?b=${ref}`}>
          Compare with baseline
        </Link>
      )}
    </>
  );
}

export function StudyHistoryPage() {
  const { studyId = '' } = useParams();
  const navigate = useNavigate();
  const overview = useStudyOverview(studyId);
  const revisions = useStudyRevisions(studyId);
  const restore = useRestoreRevision();
  const fork = useForkFromRevision();
  const [pinning, setPinning] = useState<number | null>(null);

  if (overview.isPending || revisions.isPending) return <div className="p-6"><Loading what="the study history" /></div>;
  if (overview.isError) return <div className="p-6"><QueryError error={overview.error} what="the study" /></div>;
  if (revisions.isError) return <div className="p-6"><QueryError error={revisions.error} what="the revisions" /></div>;
  const s = overview.data;
  const canWrite = s.role === 'engineer' || s.role === 'lead';
  return (
    <section className="mx-auto max-w-5xl px-4 py-6">
      <p className="text-sm">
        {s.part && <Link className="text-slate underline" to={`/parts/${s.part.id}`}>← {s.part.partNumber} · {s.part.name}</Link>}
      </p>
      <h1 className="mt-1 text-2xl font-semibold">{s.title}</h1>
      <p className="text-sm text-ink-soft">
        Owner {s.owner?.name} · latest revision <span className="num">{s.latestRevisionNumber}</span> ·{' '}
        <Link className="text-slate underline" to={`/studies/${s.id}`}>Open in workspace</Link> ·{' '}
        <Link className="text-slate underline" to={`/studies/${s.id}/run-logs`}>Run logs</Link>
      </p>
      {s.forkedFrom && (
        <p className="mt-1 text-sm" data-testid="forked-from">
          Forked from <Link className="text-slate underline" to={`/studies/${s.forkedFrom.studyId}/history`}>{s.forkedFrom.studyTitle ?? `study ${s.forkedFrom.studyId}`}</Link> revision {s.forkedFrom.number}
        </p>
      )}
      {(restore.isError || fork.isError) && <p role="alert" className="mt-2 text-sm text-fault">{(restore.error ?? fork.error)?.message}</p>}
      <ol className="mt-5 space-y-2">
        {revisions.data.map((r) => (
          <li key={r.id} className="rounded border border-rule bg-paper-raised p-3" data-testid={`revision-${r.number}`}>
            <div className="flex flex-wrap items-baseline gap-2">
              <span className="num font-semibold">r{r.number}</span>
              <span>{r.message || <em className="text-ink-faint">no message</em>}</span>
              {r.restoredFromNumber && <span className="text-xs text-ink-faint">(restores r{r.restoredFromNumber})</span>}
              {s.part?.baselineRevisionId === r.id && <span className="rounded bg-verdigris-soft px-1.5 text-xs">baseline</span>}
              <span className="ml-auto text-sm text-ink-faint">{r.author?.name} · {fmtTime(r.createdAt)}</span>
            </div>
            <div className="mt-1"><SummaryFigures summary={r.summary} /></div>
            <div className="mt-2 flex flex-wrap gap-3 text-sm">
              <RevisionLinks studyId={s.id} number={r.number} latest={s.latestRevisionNumber} baseline={!!s.part?.baselineRevisionId && s.part.baselineRevisionId !== r.id} />
              {canWrite && (
                <button
                  type="button"
                  className="text-slate underline"
                  onClick={() => fork.mutate({ studyId: s.id, number: r.number }, { onSuccess: (f) => navigate(`/studies/${f.id}`) })}
                >
                  Fork r{r.number}
                </button>
              )}
              {canWrite && r.number !== s.latestRevisionNumber && (
                <button type="button" className="text-slate underline" onClick={() => restore.mutate({ studyId: s.id, number: r.number, baseRevision: s.latestRevisionNumber })}>
                  Restore as new revision
                </button>
              )}
              {s.role === 'lead' && s.part && (
                <button type="button" className="text-slate underline" onClick={() => setPinning(pinning === r.id ? null : r.id)}>
                  Pin as baseline…
                </button>
              )}
            </div>
            {pinning === r.id && s.part && <PinForm partId={s.part.id} revision={r} onDone={() => setPinning(null)} />}
          </li>
        ))}
      </ol>
    </section>
  );
}
