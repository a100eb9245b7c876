import { Link, Navigate } from 'react-router-dom';
import { useTeams } from '../api/get-teams';
import { Loading, QueryError } from '../../../components/ui/query-state';

/**
 * /team: straight to the only team the user belongs to, or a list. A site
 * admin sees every team but reads only those they belong to; the others
 * lead to their members page (what an admin may manage), never into a team
 * home that would answer 403.
 */
export function TeamPicker({ isAdmin = false }: { isAdmin?: boolean }) {
  const teams = useTeams();
  if (teams.isPending) return <div className="p-6"><Loading what="your teams" /></div>;
  if (teams.isError) return <div className="p-6"><QueryError error={teams.error} what="your teams" /></div>;
  const mine = teams.data.filter((t) => t.role !== null);
  if (!isAdmin && mine.length === 1) return <Navigate to={`/teams/${mine[0].id}`} replace />;
  return (
    <section className="mx-auto max-w-3xl px-4 py-8">
      <h1 className="text-2xl font-semibold">Teams</h1>
      {isAdmin && (
        <p className="mt-2 text-sm">
          <Link className="text-slate underline" to="/admin">Site administration</Link> — create a team and invite its first lead.
        </p>
      )}
      {teams.data.length === 0 ? (
        <p className="mt-4 text-ink-soft">
          {isAdmin ? 'There are no teams yet; create one in site administration.' : 'You are not in a team yet. Ask a team lead for an invitation; the link in the mail brings you in.'}
        </p>
      ) : (
        <ul className="mt-4 divide-y divide-rule rounded border border-rule bg-paper-raised">
          {teams.data.map((t) => (
            <li key={t.id} className="p-3">
              <Link className="font-medium text-slate underline" to={t.role ? `/teams/${t.id}` : `/teams/${t.id}/members`}>{t.name}</Link>
              <span className="ml-2 text-sm text-ink-faint">{t.role ?? 'site admin: members and invitations'}</span>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
