import { useState, type FormEvent } from 'react';
import { Link, useParams } from 'react-router-dom';
import { useTeamHome, type TeamHome } from '../api/get-team-home';
import { useCreatePart } from '../api/create-part';
import { fmtTime } from '../../../lib/format-time';
import { Loading, QueryError } from '../../../components/ui/query-state';

const pct = (x?: number) => (typeof x === 'number' ? `${(x * 100).toFixed(1)} %` : '—');

const input = 'rounded border border-rule bg-paper-raised px-2 py-1';

function NewPartForm({ teamId }: { teamId: string }) {
  const [partNumber, setPartNumber] = useState('');
  const [name, setName] = useState('');
  const create = useCreatePart();
  const submit = (e: FormEvent) => {
    e.preventDefault();
    create.mutate({ teamId, partNumber, name }, { onSuccess: () => { setPartNumber(''); setName(''); } });
  };
  return (
    <form onSubmit={submit} aria-label="Add a part" className="mt-3 flex flex-wrap items-end gap-2 text-sm">
      <label className="flex flex-col">Part number<input required maxLength={40} value={partNumber} onChange={(e) => setPartNumber(e.target.value)} className={input} /></label>
      <label className="flex flex-col">Name<input required maxLength={160} value={name} onChange={(e) => setName(e.target.value)} className={input} placeholder="e.g. rib cap, 12 plies" /></label>
      <button type="submit" disabled={create.isPending} className="rounded bg-ink px-3 py-1 text-paper">Add part</button>
      {create.isError && <p role="alert" className="w-full text-fault">Not added: {create.error.message}</p>}
      {create.data && <p role="status" className="w-full text-verdigris">Added <Link className="underline" to={`/parts/${create.data.id}`}>{create.data.partNumber}</Link>; open it to start a study.</p>}
    </form>
  );
}

function ForkNote({ s }: { s: TeamHome['recentStudies'][number] }) {
  if (!s.forkedFrom) return null;
  return (
    <span className="text-ink-faint">
      {' '}· forked from <Link className="underline" to={`/studies/${s.forkedFrom.studyId}/history`}>{s.forkedFrom.studyTitle} r{s.forkedFrom.number}</Link>
      {s.forkedFrom.author && <> by {s.forkedFrom.author.name}</>}
    </span>
  );
}

export function TeamHomePage() {
  const { teamId = '' } = useParams();
  const home = useTeamHome(teamId);
  if (home.isPending) return <div className="p-6"><Loading what="the team" /></div>;
  if (home.isError) return <div className="p-6"><QueryError error={home.error} what="the team" /></div>;
  const { team, role, parts, recentStudies, activity } = home.data;
  const canWrite = role === 'engineer' || role === 'lead';
  return (
    <section className="mx-auto max-w-6xl px-4 py-6">
      <header className="flex flex-wrap items-baseline gap-3">
        <h1 className="text-2xl font-semibold">{team.name}</h1>
        <span className="rounded bg-slate-soft px-2 py-0.5 text-xs">{role ?? 'not a member'}</span>
        <nav className="ml-auto flex gap-3 text-sm">
          <Link className="text-slate underline" to={`/teams/${team.id}/members`}>Members{role === 'lead' ? ' & activity' : ''}</Link>
        </nav>
      </header>
      {team.description && <p className="mt-1 text-ink-soft">{team.description}</p>}

      <h2 className="mt-6 text-sm font-semibold uppercase tracking-wide text-ink-soft">Parts and their baselines</h2>
      {parts.length === 0 ? (
        <p className="mt-2 text-ink-soft">No parts yet. {canWrite ? 'Add the first part below, then start a study on it.' : 'An engineer or lead can add the first part and start a study on it.'}</p>
      ) : (
        <table className="mt-2 w-full border-collapse text-sm">
          <thead className="text-left text-ink-faint">
            <tr><th className="py-1">Part</th><th>Baseline</th><th>Final cure</th><th>Note</th><th className="text-right">Studies</th></tr>
          </thead>
          <tbody>
            {parts.map((p) => (
              <tr key={p.id} className="border-t border-rule">
                <td className="py-2"><Link className="text-slate underline" to={`/parts/${p.id}`}>{p.partNumber} · {p.name}</Link></td>
                <td>
                  {p.baseline ? (
                    <Link className="underline" to={`/studies/${p.baseline.studyId}/history`}>{p.baseline.studyTitle} · r{p.baseline.number}</Link>
                  ) : (
                    <span className="text-ink-faint">none pinned</span>
                  )}
                </td>
                <td className="num">{pct(p.baseline?.summary?.finalCureMin)}</td>
                <td className="max-w-xs truncate text-ink-soft" title={p.baseline?.note ?? ''}>{p.baseline?.note ?? ''}</td>
                <td className="num text-right">{p.studyCount}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {canWrite && <NewPartForm teamId={String(team.id)} />}

      <div className="mt-8 grid gap-8 md:grid-cols-2">
        <div>
          <h2 className="text-sm font-semibold uppercase tracking-wide text-ink-soft">Recent studies</h2>
          {recentStudies.length === 0 ? (
            <p className="mt-2 text-ink-soft">No studies yet.</p>
          ) : (
            <ul className="mt-2 space-y-1 text-sm">
              {recentStudies.map((s) => (
                <li key={s.id}>
                  <Link className="text-slate underline" to={`/studies/${s.id}/history`}>{s.title}</Link>{' '}
                  <span className="text-ink-faint">r{s.latestRevisionNumber} · {s.owner?.name} · {s.part?.partNumber}</span>
                  <ForkNote s={s} />
                </li>
              ))}
            </ul>
          )}
        </div>
        <div>
          <h2 className="text-sm font-semibold uppercase tracking-wide text-ink-soft">Who changed what</h2>
          {activity.length === 0 ? (
            <p className="mt-2 text-ink-soft">No changes yet: saves, forks, pins, role changes, invitations, run-log uploads and review decisions show here.</p>
          ) : (
            <ul className="mt-2 space-y-1 text-sm" data-testid="team-activity">
              {activity.map((e) => (
                <li key={e.id}>
                  <span className="font-medium">{e.actor?.name ?? 'system'}</span> {e.sentence}
                  {e.studyId !== null && <> · <Link className="text-slate underline" to={`/studies/${e.studyId}/history`}>history</Link></>}
                  <span className="ml-1 text-ink-faint">{fmtTime(e.createdAt)}</span>
                </li>
              ))}
            </ul>
          )}
        </div>
      </div>
    </section>
  );
}
