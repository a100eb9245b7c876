import { Link, useParams } from 'react-router-dom';
import { useStudyRole, useStudyRunLogs } from '../api/run-logs-api';
import { RunLogList } from './run-log-list';
import { LoadError, Loading } from './status';
import { UploadPanel } from './upload-panel';

/** /studies/:studyId/run-logs — the runs checked against this study, and the upload. */
export function StudyRunLogsPage() {
  const { studyId = '' } = useParams();
  const list = useStudyRunLogs(studyId);
  // The upload is for engineers and leads; a viewer is not walked through it only to be refused at the end
  // (the server refuses it anyway).
  const role = useStudyRole(studyId).data ?? null;
  const canUpload = role === 'engineer' || role === 'lead';
  if (list.isPending) return <Loading what="the run logs" />;
  if (list.isError) return <LoadError error={list.error} what="the run logs" />;
  return (
    <section className="mx-auto max-w-5xl px-4 py-6">
      <p className="text-sm"><Link className="text-slate underline" to={`/studies/${studyId}/history`}>← Study history</Link></p>
      <h1 className="mt-1 text-2xl font-semibold">Run logs</h1>
      <p className="mt-1 text-ink-soft">Autoclave and oven records checked against this study’s latest revision and replayed through its model.</p>
      {canUpload ? (
        <div className="mt-4"><UploadPanel studyId={studyId} /></div>
      ) : (
        role && <p className="mt-4 text-sm text-ink-soft" data-testid="upload-not-allowed">Engineers and leads of the team upload run logs (your role: {role}).</p>
      )}
      <h2 className="mt-6 text-sm font-semibold uppercase tracking-wide text-ink-soft">Runs</h2>
      <RunLogList items={list.data} empty="No run logs yet." />
    </section>
  );
}
