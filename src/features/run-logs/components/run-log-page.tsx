import { Link, useParams } from 'react-router-dom';
import { useRunLog } from '../api/run-logs-api';
import { FindingsTable } from './findings-table';
import { FlaggedChannels } from './flagged-channels';
import { GaugesChart, ReplayChart } from './replay-chart';
import { SpecSummary } from './spec-summary';
import { ReplayResults } from './replay-results';
import { ReviewSection } from './review-form';
import { fmtStamp, fmtTime } from '../../../lib/format-time';
import { CAUTIONS, LoadError, Loading } from './status';

const panel = 'mt-5 rounded border border-rule bg-paper-raised p-4';
const heading = 'text-sm font-semibold uppercase tracking-wide text-ink-soft';

/** /run-logs/:runLogId — findings, holds, replay against the baseline, and the decision. */
export function RunLogPage() {
  const { runLogId = '' } = useParams();
  const query = useRunLog(runLogId);
  if (query.isPending) return <Loading what="the run log" />;
  if (query.isError) return <LoadError error={query.error} what="the run log" />;
  const r = query.data;
  const rec = r.record;
  return (
    <section className="mx-auto max-w-5xl px-4 py-6">
      <p className="text-sm">
        {r.part && <Link className="text-slate underline" to={`/parts/${r.part.id}/run-logs`}>← {r.part.partNumber} run history</Link>}
        {r.study && <> · <Link className="text-slate underline" to={`/studies/${r.study.id}/run-logs`}>{r.study.title}</Link></>}
      </p>
      <h1 className="mt-1 text-2xl font-semibold">{r.fileName}</h1>
      <p className="mt-1 text-sm text-ink-soft">
        {rec.rows.toLocaleString()} rows over {rec.durationMin} min{rec.startedAt ? `, started ${fmtStamp(rec.startedAt)}` : ''} · uploaded by{' '}
        {r.uploadedBy?.name ?? 'unknown'}, {fmtTime(r.uploadedAt)} · checked against revision {rec.checkedAgainst.number} ·{' '}
        <a className="text-slate underline" href={`/api/run-logs/${r.id}/file`}>raw file</a> <span className="num text-xs">sha256 {r.checksumSha256.slice(0, 12)}…</span> ·{' '}
        <Link className="text-slate underline" to={`/run-logs/${r.id}/record`}>printable review record</Link>
      </p>

      <div className={panel}>
        <h2 className={heading}>Data hygiene</h2>
        <FindingsTable findings={rec.hygiene.findings} empty="Every channel reads plausibly: none dead, flat, noisy or out of range, and no gaps." testId="hygiene-findings" />
        <FlaggedChannels hygiene={rec.hygiene} />
      </div>

      <div className={panel}>
        <h2 className={heading}>Against the specification</h2>
        <p className="mt-1 text-sm text-ink-soft">Leading TC: {rec.spec.leadingTc ?? '—'} · lagging TC: {rec.spec.laggingTc ?? '—'} · hottest part reading {rec.spec.maxPartC ?? '—'} °C</p>
        <FindingsTable findings={rec.spec.findings} empty="The run stayed within the study’s process limits and cycle." testId="spec-findings" />
        <h3 className="mt-4 text-sm font-medium">Every check against its limit</h3>
        <SpecSummary spec={rec.spec} />
      </div>

      <div className={panel} id="replay">
        <h2 className={heading}>Replay through the model</h2>
        <p className="mt-1 text-sm text-ink-soft">The study re-run with this run’s measured air{rec.channels.some((c) => c.role === 'tool') ? ', tool' : ''} and pressure in place of its cycle.</p>
        <ReplayChart record={rec} />
        <GaugesChart record={rec} />
        <ReplayResults record={rec} baseline={r.baseline} />
      </div>

      <div className={panel}>
        <h2 className={heading}>Decision</h2>
        <ReviewSection runLog={r} />
        <ul className="mt-3 list-disc pl-5 text-xs text-ink-faint">{CAUTIONS.map((c) => <li key={c}>{c}</li>)}</ul>
      </div>
    </section>
  );
}
