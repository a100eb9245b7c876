import { Link, useNavigate } from 'react-router-dom';
import { useRestoreRevision } from '../api/restore-revision';

/**
 * Above an earlier revision opened by link (`?r=N`): which revision of how many, that it is read-only, the
 * way back to the latest, and for those who may write, restoring it as the study's newest revision.
 */
export function RevisionBanner({
  studyId,
  revision,
  latest,
  canWrite,
}: {
  studyId: string;
  revision: number;
  latest: number;
  canWrite: boolean;
}) {
  const restore = useRestoreRevision();
  const navigate = useNavigate();
  return (
    <div role="note" className="flex flex-wrap items-center gap-3 border-b border-saffron bg-saffron-soft px-3 py-1.5 text-sm" data-testid="revision-banner">
      <span className="font-semibold">
        Revision <span className="num">{revision}</span> of <span className="num">{latest}</span> — read only
      </span>
      <Link className="text-slate underline" to={`/studies/${studyId}`}>
        Open latest (revision {latest})
      </Link>
      <Link className="text-slate underline" to={`/studies/${studyId}/history`}>
        History
      </Link>
      {canWrite && (
        <button
          type="button"
          className="rounded border border-ink px-2 py-0.5 hover:bg-paper-raised disabled:opacity-50"
          disabled={restore.isPending}
          onClick={() =>
            restore.mutate({ studyId, revision, baseRevision: latest }, { onSuccess: () => navigate(`/studies/${studyId}`) })
          }
        >
          Restore as new revision
        </button>
      )}
      {restore.isError && (
        <span role="alert" className="text-fault">
          Not restored: {restore.error.message}
        </span>
      )}
    </div>
  );
}
