import { Link, Navigate } from 'react-router-dom';
import { useTeams } from '../api/get-teams';
import { Loading, QueryError } from '../../../components/ui/query-state';

/** /team: straight to the only team, or a list when there are several. */
export function TeamPicker() {
  const teams = useTeams();
  if (teams.isPending) return <div className="p-6"><Loading what="your teams" /></div>;
  if (teams.isError) return <div className="p-6"><QueryError error={teams.error} what="your teams" /></div>;
  if (teams.data.length === 1) return <Navigate to={`/teams/${teams.data[0].id}`} replace />;
  return (
    <section className="mx-auto max-w-3xl px-4 py-8">
      <h1 className="text-2xl font-semibold">Teams</h1>
      {teams.data.length === 0 ? (
        <p className="mt-4 text-ink-soft">You are not in a team yet. Ask a team lead for an invitation; the link in the mail brings you in.</p>
      ) : (
        <ul className="mt-4 divide-y divide-rule rounded border border-rule bg-paper-raised">
          {teams.data.map((t) => (
            <li key={t.id} className="p-3">
              <Link className="font-medium text-slate underline" to={`/teams/${t.id}`}>{t.name}</Link>
              <span className="ml-2 text-sm text-ink-faint">{t.role ?? 'site admin'}</span>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
