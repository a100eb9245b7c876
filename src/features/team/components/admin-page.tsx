import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { useTeams } from '../api/get-teams';
import { useCreateTeam } from '../api/admin';
import { Loading, QueryError } from '../../../components/ui/query-state';

const input = 'rounded border border-rule bg-paper-raised px-2 py-1';

function CreateTeamForm() {
  const [name, setName] = useState('');
  const [slug, setSlug] = useState('');
  const [leadEmail, setLeadEmail] = useState('');
  const create = useCreateTeam();
  // the slug follows the name until the admin edits it
  const [slugEdited, setSlugEdited] = useState(false);
  const slugFrom = (n: string) => n.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 63);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    create.mutate(
      { name, slug, ...(leadEmail ? { leadEmail } : {}) },
      {
        onSuccess: () => {
          setName('');
          setSlug('');
          setLeadEmail('');
          setSlugEdited(false);
        },
      },
    );
  };
  const made = create.data;
  return (
    <form onSubmit={submit} aria-label="Create a team" className="mt-2 flex flex-wrap items-end gap-2 text-sm">
      <label className="flex flex-col">
        Team name
        <input required value={name} className={input} onChange={(e) => { setName(e.target.value); if (!slugEdited) setSlug(slugFrom(e.target.value)); }} />
      </label>
      <label className="flex flex-col">
        Short name (in links)
        <input required pattern="[a-z0-9][a-z0-9\-]{1,62}" value={slug} className={input} onChange={(e) => { setSlug(e.target.value); setSlugEdited(true); }} />
      </label>
      <label className="flex flex-col">
        First lead's e-mail
        <input type="email" value={leadEmail} className={input} onChange={(e) => setLeadEmail(e.target.value)} />
      </label>
      <button type="submit" disabled={create.isPending} className="rounded bg-ink px-3 py-1 text-paper">Create team</button>
      {create.isError && <p role="alert" className="w-full text-fault">{create.error.message}</p>}
      {made && (
        <p role="status" className="w-full text-verdigris">
          Created {made.name}.{' '}
          {made.leadInvite?.mailStatus === 'sent' && <>An invitation to lead it was mailed to {made.leadInvite.email}.</>}
          {made.leadInvite?.mailStatus === 'failed' && (
            <span className="text-fault">The lead invitation was saved but not mailed ({made.leadInvite.mailError}); resend it from the team's members page.</span>
          )}
          {!made.leadInvite && <>It has no members yet: invite a lead from its members page.</>}
        </p>
      )}
    </form>
  );
}

/** Site administration: every team, a new team with its first lead, and each team's members and invitations. */
export function AdminPage({ isAdmin }: { isAdmin: boolean | null }) {
  const teams = useTeams();
  if (isAdmin === false) {
    return <p role="alert" className="p-6 text-fault">Only a site admin manages teams. Ask your site admin for a new team.</p>;
  }
  return (
    <section className="mx-auto max-w-4xl px-4 py-6">
      <h1 className="text-2xl font-semibold">Site administration</h1>
      <h2 className="mt-6 text-sm font-semibold uppercase tracking-wide text-ink-soft">New team</h2>
      <CreateTeamForm />
      <h2 className="mt-8 text-sm font-semibold uppercase tracking-wide text-ink-soft">Teams</h2>
      {teams.isPending && <Loading what="the teams" />}
      {teams.isError && <QueryError error={teams.error} what="the teams" />}
      {teams.data?.length === 0 && <p className="mt-2 text-ink-soft">No teams yet. Create the first one above.</p>}
      {!!teams.data?.length && (
        <ul className="mt-2 divide-y divide-rule rounded border border-rule bg-paper-raised text-sm" data-testid="admin-teams">
          {teams.data.map((t) => (
            <li key={t.id} className="flex flex-wrap items-baseline gap-2 p-3">
              <span className="font-medium">{t.name}</span>
              <span className="text-ink-faint">{t.slug}{t.role ? ` · you are ${t.role}` : ''}</span>
              <span className="ml-auto flex gap-3">
                {t.role && <Link className="text-slate underline" to={`/teams/${t.id}`}>Team home</Link>}
                <Link className="text-slate underline" to={`/teams/${t.id}/members`}>Members and invitations</Link>
              </span>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
