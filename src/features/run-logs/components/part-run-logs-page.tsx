import { Link, useParams } from 'react-router-dom';
import { usePartRunLogs } from '../api/run-logs-api';
import { RunLogList } from './run-log-list';
import { LoadError, Loading } from './status';

/** /parts/:partId/run-logs — the part's run history with every decision. */
export function PartRunLogsPage() {
  const { partId = '' } = useParams();
  const list = usePartRunLogs(partId);
  if (list.isPending) return <Loading what="the run history" />;
  if (list.isError) return <LoadError error={list.error} what="the run history" />;
  return (
    <section className="mx-auto max-w-5xl px-4 py-6">
      <p className="text-sm"><Link className="text-slate underline" to={`/parts/${partId}`}>← Part</Link></p>
      <h1 className="mt-1 text-2xl font-semibold">Run history</h1>
      <RunLogList items={list.data} empty="No runs of this part have been uploaded yet." />
    </section>
  );
}
