import { Link, useParams } from 'react-router-dom';
import { useRunLog } from '../api/run-logs-api';
import { FindingsTable } from './findings-table';
import { MappingTable } from './mapping-table';
import { FlaggedChannels } from './flagged-channels';
import { GaugesChart, ReplayChart } from './replay-chart';
import { SpecSummary } from './spec-summary';
import { ReplayResults } from './replay-results';
import { fmtStamp, fmtTime } from '../../../lib/format-time';
import { CAUTIONS, LoadError, Loading } from './status';

const DECISION_LABEL = { 'use-as-is': 'Use as is', rework: 'Rework', scrap: 'Scrap' } as const;

/** /run-logs/:runLogId/record — the review record on paper: run, findings, replay, decision, cautions. */
export function ReviewRecordPage() {
  const { runLogId = '' } = useParams();
  const query = useRunLog(runLogId);
  if (query.isPending) return <Loading what="the review record" />;
  if (query.isError) return <LoadError error={query.error} what="the review record" />;
  const r = query.data;
  const rec = r.record;
  return (
    <article className="mx-auto max-w-4xl bg-white px-8 py-6 text-ink print:p-0" data-testid="review-record">
      <p className="text-sm print:hidden">
        <Link className="text-slate underline" to={`/run-logs/${r.id}`}>← Back</Link> ·{' '}
        <button type="button" className="text-slate underline" onClick={() => window.print()}>Print</button>
      </p>
      <h1 className="mt-2 text-xl font-semibold">Run review record</h1>
      {!r.review && (
        <p className="mt-2 rounded border-2 border-fault px-3 py-2 text-lg font-semibold text-fault" data-testid="record-draft">
          No decision yet — draft. This record is not a disposition of the part.
        </p>
      )}
      <dl className="mt-3 grid grid-cols-[12rem_1fr] gap-x-3 gap-y-1 text-sm">
        <dt className="text-ink-soft">Part</dt><dd>{r.part ? `${r.part.partNumber} · ${r.part.name}` : '—'}</dd>
        <dt className="text-ink-soft">Study</dt><dd>{r.study?.title ?? '—'}, revision {rec.checkedAgainst.number}</dd>
        <dt className="text-ink-soft">Run log</dt><dd>{r.fileName} ({rec.rows.toLocaleString()} rows, {rec.durationMin} min{rec.startedAt ? `, started ${fmtStamp(rec.startedAt)}` : ''})</dd>
        <dt className="text-ink-soft">SHA-256</dt><dd className="num break-all text-xs">{r.checksumSha256}</dd>
        <dt className="text-ink-soft">Uploaded</dt><dd>{r.uploadedBy?.name ?? 'unknown'}, {fmtTime(r.uploadedAt)}</dd>
      </dl>
      <h2 className="mt-5 font-semibold">Column mapping</h2>
      <MappingTable mapping={rec.mapping} />
      <h2 className="mt-5 font-semibold">Data hygiene</h2>
      <FindingsTable findings={rec.hygiene.findings} empty="No hygiene findings." testId="record-hygiene" />
      <FlaggedChannels hygiene={rec.hygiene} />
      <h2 className="mt-5 font-semibold">Findings against the specification</h2>
      <FindingsTable findings={rec.spec.findings} empty="No findings." testId="record-spec" />
      <SpecSummary spec={rec.spec} testId="record-spec-summary" />
      <h2 className="mt-5 font-semibold">Replay</h2>
      <ReplayChart record={rec} />
      <GaugesChart record={rec} />
      <ReplayResults record={rec} baseline={r.baseline} />
      <h2 className="mt-5 font-semibold">Decision</h2>
      {r.review ? (
        <div data-testid="record-decision" className="text-sm">
          <p className="mt-1"><strong>{DECISION_LABEL[r.review.decision]}</strong> — {r.review.decidedBy?.name ?? 'unknown'}, {fmtTime(r.review.decidedAt)}</p>
          <p className="mt-1 whitespace-pre-wrap">{r.review.rationale}</p>
        </div>
      ) : (
        <p className="mt-1 text-sm font-semibold text-fault">No decision yet — draft.</p>
      )}
      <h2 className="mt-5 font-semibold">Cautions</h2>
      <ul className="mt-1 list-disc pl-5 text-sm" data-testid="record-cautions">{CAUTIONS.map((c) => <li key={c}>{c}</li>)}</ul>
    </article>
  );
}
