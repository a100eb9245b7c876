import { useState, type FormEvent } from 'react';
import { Link, useParams } from 'react-router-dom';
import { useMembers, type Member } from '../api/get-members';
import { useTeamHome } from '../api/get-team-home';
import { useChangeRole } from '../api/change-role';
import { useRemoveMember } from '../api/remove-member';
import { useTeams } from '../api/get-teams';
import { useCreateInvite, useInvites, useResendInvite } from '../api/invites';
import { useAudit } from '../api/get-audit';
import { fmtTime } from '../../../lib/format-time';
import { Loading, QueryError } from '../../../components/ui/query-state';

const ROLES: Member['role'][] = ['viewer', 'engineer', 'lead'];

function InviteForm({ teamId }: { teamId: string }) {
  const [email, setEmail] = useState('');
  const [role, setRole] = useState<Member['role']>('engineer');
  const create = useCreateInvite();
  const submit = (e: FormEvent) => {
    e.preventDefault();
    create.mutate({ teamId, email, role }, { onSuccess: (inv) => inv.mailStatus !== 'failed' && setEmail('') });
  };
  return (
    <form onSubmit={submit} className="mt-2 flex flex-wrap items-end gap-2 text-sm" aria-label="Invite a member">
      <label className="flex flex-col">
        E-mail
        <input required type="email" value={email} onChange={(e) => setEmail(e.target.value)} className="rounded border border-rule bg-paper-raised px-2 py-1" />
      </label>
      <label className="flex flex-col">
        Role
        <select aria-label="Invited role" value={role} onChange={(e) => setRole(e.target.value as Member['role'])} className="rounded border border-rule bg-paper-raised px-2 py-1">
          {ROLES.map((r) => <option key={r} value={r}>{r}</option>)}
        </select>
      </label>
      <button type="submit" disabled={create.isPending} className="rounded bg-ink px-3 py-1 text-paper">Send invitation</button>
      {create.isError && <p role="alert" className="w-full text-fault">{create.error.message}</p>}
      {create.data?.mailStatus === 'sent' && <p className="w-full text-verdigris">Invitation mailed to {create.data.email}.</p>}
      {create.data?.mailStatus === 'failed' && (
        <p role="alert" className="w-full text-fault">
          The invitation was saved but the mail could not be sent ({create.data.mailError}). Check the mail server, then use Resend below.
        </p>
      )}
    </form>
  );
}

/**
 * A team's members. Leads, and site admins (who manage every team's members
 * without reading its studies), change roles, remove members, invite, and
 * read the audit trail.
 */
export function MembersPage({ isAdmin = false }: { isAdmin?: boolean }) {
  const { teamId = '' } = useParams();
  const home = useTeamHome(teamId);
  const teams = useTeams();
  const members = useMembers(teamId);
  const role = home.data?.role ?? teams.data?.find((t) => String(t.id) === teamId)?.role ?? null;
  const isLead = role === 'lead' || isAdmin;
  const teamName = home.data?.team.name ?? teams.data?.find((t) => String(t.id) === teamId)?.name ?? 'Team';
  const invites = useInvites(teamId, isLead);
  const audit = useAudit(teamId, isLead);
  const changeRole = useChangeRole();
  const remove = useRemoveMember();
  const resend = useResendInvite();

  if (members.isPending) return <div className="p-6"><Loading what="members" /></div>;
  if (members.isError) return <div className="p-6"><QueryError error={members.error} what="the members" /></div>;
  return (
    <section className="mx-auto max-w-5xl px-4 py-6">
      <p className="text-sm">
        {role ? <Link className="text-slate underline" to={`/teams/${teamId}`}>← {teamName}</Link> : <Link className="text-slate underline" to="/admin">← Site administration</Link>}
      </p>
      <h1 className="mt-1 text-2xl font-semibold">Members{role ? '' : ` of ${teamName}`}</h1>
      {members.data.length === 0 && <p className="mt-2 text-ink-soft">No members yet. Invite a lead below; the link in the mail brings them in.</p>}
      <table className="mt-3 w-full text-sm">
        <thead className="text-left text-ink-faint"><tr><th>Name</th><th>Login</th><th>E-mail</th><th>Role</th><th>Since</th>{isLead && <th />}</tr></thead>
        <tbody>
          {members.data.map((m) => (
            <tr key={m.userId} className="border-t border-rule">
              <td className="py-1.5">{m.name}</td>
              <td className="text-ink-soft">{m.login}</td>
              <td className="text-ink-soft">{m.email ?? '—'}</td>
              <td>
                {isLead ? (
                  <select
                    aria-label={`Role of ${m.name}`}
                    value={m.role}
                    onChange={(e) => changeRole.mutate({ teamId, userId: m.userId, role: e.target.value as Member['role'] })}
                    className="rounded border border-rule bg-paper-raised px-1"
                  >
                    {ROLES.map((r) => <option key={r} value={r}>{r}</option>)}
                  </select>
                ) : (
                  m.role
                )}
              </td>
              <td className="text-ink-faint">{fmtTime(m.since)}</td>
              {isLead && (
                <td className="text-right">
                  <button
                    type="button"
                    className="text-fault underline disabled:opacity-50"
                    disabled={remove.isPending}
                    onClick={() => window.confirm(`Remove ${m.name} from ${teamName}? They lose access to its studies at once.`) && remove.mutate({ teamId, userId: m.userId })}
                  >
                    Remove
                  </button>
                </td>
              )}
            </tr>
          ))}
        </tbody>
      </table>
      {changeRole.isError && <p role="alert" className="mt-2 text-sm text-fault">{changeRole.error.message}</p>}
      {remove.isError && <p role="alert" className="mt-2 text-sm text-fault">Not removed: {remove.error.message}</p>}

      {isLead && (
        <>
          <h2 className="mt-8 text-sm font-semibold uppercase tracking-wide text-ink-soft">Invite someone</h2>
          <InviteForm teamId={teamId} />
          <h2 className="mt-8 text-sm font-semibold uppercase tracking-wide text-ink-soft">Invitations</h2>
          {invites.isError && <QueryError error={invites.error} what="invitations" />}
          {invites.data?.length === 0 && <p className="mt-2 text-sm text-ink-soft">No invitations sent yet.</p>}
          {!!invites.data?.length && (
            <table className="mt-2 w-full text-sm">
              <thead className="text-left text-ink-faint"><tr><th>E-mail</th><th>Role</th><th>Status</th><th>Mail</th><th>Expires</th><th /></tr></thead>
              <tbody>
                {invites.data.map((inv) => (
                  <tr key={inv.id} className="border-t border-rule">
                    <td className="py-1.5">{inv.email}</td>
                    <td>{inv.role}</td>
                    <td>{inv.status}</td>
                    <td className={inv.mailStatus === 'failed' ? 'text-fault' : ''} title={inv.mailError ?? ''}>{inv.mailStatus}</td>
                    <td className="text-ink-faint">{fmtTime(inv.expiresAt)}</td>
                    <td>
                      {inv.status !== 'accepted' && (
                        <button type="button" className="text-slate underline" onClick={() => resend.mutate({ teamId, inviteId: inv.id })}>Resend</button>
                      )}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
          <h2 className="mt-8 text-sm font-semibold uppercase tracking-wide text-ink-soft">Audit trail</h2>
          {audit.isError && <QueryError error={audit.error} what="the audit trail" />}
          <ol className="mt-2 space-y-1 text-sm" data-testid="audit-trail">
            {audit.data?.map((e) => (
              <li key={e.id}>
                <span className="text-ink-faint">{fmtTime(e.createdAt)}</span> <span className="font-medium">{e.actor?.name ?? 'system'}</span> {e.sentence}
              </li>
            ))}
          </ol>
        </>
      )}
    </section>
  );
}
