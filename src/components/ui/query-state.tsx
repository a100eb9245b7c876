import { ApiError } from '../../lib/api-client';

/** What to tell the user when a request for team data fails, and what they can do about it. */
export function QueryError({ error, what }: { error: Error; what: string }) {
  const status = error instanceof ApiError ? error.status : 0;
  const hint =
    status === 401 ? (
      <a className="text-slate underline" href={`/api/auth/github?next=${encodeURIComponent(location.pathname)}`}>Sign in to see it.</a>
    ) : status === 403 ? (
      'Your role in this team does not allow this; ask a lead.'
    ) : status === 404 ? (
      'It does not exist, or belongs to a team you are not in.'
    ) : (
      'Check that the server is running, then reload the page.'
    );
  return (
    <div role="alert" className="rounded border border-fault-soft bg-fault-soft/40 p-3 text-sm">
      <p className="font-medium text-fault">Could not load {what}: {error.message}</p>
      <p className="mt-1 text-ink-soft">{hint}</p>
    </div>
  );
}

export const Loading = ({ what }: { what: string }) => <p className="text-sm text-ink-faint">Loading {what}…</p>;
