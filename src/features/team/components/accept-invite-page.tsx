import { Link, useParams } from 'react-router-dom';
import { ApiError } from '../../../lib/api-client';
import { useAcceptInvite, useInvitePreview } from '../api/accept-invite';
import { QueryError } from '../../../components/ui/query-state';

/** Where the invitation mail's link lands: see the team and role, sign in if needed, accept. */
export function AcceptInvitePage({ signedIn }: { signedIn: boolean | null }) {
  const { token = '' } = useParams();
  const preview = useInvitePreview(token);
  const accept = useAcceptInvite();
  if (accept.isSuccess) {
    return (
      <section className="mx-auto max-w-lg px-4 py-10">
        <h1 className="text-xl font-semibold">Welcome to {accept.data.teamName}</h1>
        <p className="mt-4">
          You are in as <strong>{accept.data.role}</strong>.{' '}
          <Link className="text-slate underline" to={`/teams/${accept.data.teamId}`}>Open {accept.data.teamName}</Link>
        </p>
      </section>
    );
  }
  if (preview.isPending) return <p className="p-6 text-ink-faint">Checking the invitation…</p>;
  if (preview.isError) {
    const gone = preview.error instanceof ApiError && (preview.error.status === 410 || preview.error.status === 404);
    return (
      <section className="mx-auto max-w-lg px-4 py-10">
        <h1 className="text-xl font-semibold">Invitation</h1>
        {gone ? <p role="alert" className="mt-3 text-fault">{preview.error.message}</p> : <QueryError error={preview.error} what="the invitation" />}
      </section>
    );
  }
  const inv = preview.data;
  return (
    <section className="mx-auto max-w-lg px-4 py-10">
      <h1 className="text-xl font-semibold">Join {inv.teamName}</h1>
      <p className="mt-2 text-ink-soft">You are invited as <strong>{inv.role}</strong> (sent to {inv.email}).</p>
      {signedIn ? (
        <button type="button" className="mt-4 rounded bg-ink px-4 py-2 text-paper" disabled={accept.isPending} onClick={() => accept.mutate(token)}>
          Accept the invitation
        </button>
      ) : (
        <a className="mt-4 inline-block rounded bg-ink px-4 py-2 text-paper" href={`/api/auth/github?next=${encodeURIComponent(`/invite/${token}`)}`}>
          Sign in to accept
        </a>
      )}
      {accept.isError && <p role="alert" className="mt-3 text-fault">{accept.error.message}</p>}
    </section>
  );
}
