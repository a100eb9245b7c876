import { useMemo } from 'react';
import { useQuery } from '@tanstack/react-query';
import { Link, useSearchParams } from 'react-router-dom';
import { metricDeltas } from '../../../../shared/compare/metric-deltas';
import { paramDiff } from '../../../../shared/compare/param-diff';
import type { SimulationResult } from '../../../../shared/solver/simulation-result';
import { formatFigure, formatLimit } from '../../../components/comparison/format-figure';
import { MetricsTable } from '../../../components/comparison/metrics-table';
import { ParamDiffList } from '../../../components/comparison/param-diff-list';
import { CsvDownloadButton } from '../../../components/export/csv-download-button';
import { ResultChartSet } from '../../../components/charts/result-chart-set';
import { fileSlug } from '../../../lib/chart-export';
import { csvMetaOf, needsSignIn, revisionErrorText, revisionQueryOptions, signInHref, type RevisionData } from '../../../lib/revision-query';
import { solvedRevisionQueryOptions } from '../../../lib/solve-query';
import { ASSUMPTIONS, CAUTIONS, exothermNote } from '../model/report-text';
import { describeCycleSteps, describeLayup, fibreRows, processRows, resinRows, type Row } from '../model/describe-study';
import './report.css';

/** Printed charts: the width of an A4 page inside its margins, at 96 CSS px per inch. */
const PRINT_CHART_WIDTH = 680;

function Rows({ rows, testId }: { rows: Row[]; testId?: string }) {
  return (
    <table className="w-full border-collapse text-sm" data-testid={testId}>
      <tbody>
        {rows.map(([label, value], i) => (
          <tr key={`${i}-${label}`} className="border-b border-rule/60 align-top">
            <th scope="row" className="w-56 py-0.5 pr-3 text-left font-normal text-ink-soft">
              {label}
            </th>
            <td className="py-0.5">{value}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

function Section({ title, children, id }: { title: string; children: React.ReactNode; id: string }) {
  return (
    <section aria-labelledby={id} className="report-section flex flex-col gap-2">
      <h2 id={id} className="border-b border-ink pb-0.5 text-base font-semibold uppercase tracking-[0.06em]">
        {title}
      </h2>
      {children}
    </section>
  );
}

function jobSummary(rev: RevisionData, result: SimulationResult): string {
  const p = rev.params;
  const s = result.summary;
  const layup = describeLayup(p).summary;
  const tool = p.tool.kind === 'none' ? 'with no tool plate' : `on ${p.tool.name} (${p.tool.thicknessMm} mm)`;
  const cycle = p.cycle.kind === 'segments' ? `a ${p.cycle.segments.length}-segment cure cycle` : 'a measured air-temperature record';
  const failing = s.limits.filter((l) => !l.pass);
  const verdict =
    failing.length === 0
      ? `All ${s.limits.length} process limits pass.`
      : `${failing.length} of ${s.limits.length} process limits fail: ${failing.map((l) => l.label.toLowerCase()).join('; ')}.`;
  return (
    `${layup} of ${p.fibre.name} in ${p.resin.name} (fibre volume fraction ${p.fibreVolumeFraction}), ${tool}, cured by ${cycle} ` +
    `of ${formatFigure(s.cycleMin, 'min')} to demould. Predicted: final degree of cure ${formatFigure(s.finalCureMin, '')} at its ` +
    `lowest point, final Tg ${formatFigure(s.finalTgC, '°C')}, peak part temperature ${formatFigure(s.peakPartC, '°C')} ` +
    `(exotherm overshoot ${formatFigure(s.peakOvershootC, '°C')}), warpage ${formatFigure(s.warpageMm, 'mm')} over ` +
    `${p.geometry.stripSpanMm} mm, corner spring-in ${formatFigure(s.springInDeg, '°')}. ${verdict}`
  );
}

/**
 * The printable report of one revision: `/report?r=<ref>` (optionally `&against=<ref>` to add what changed
 * since that revision). Laid out for A4 paper; the browser's print dialog saves it as PDF.
 */
export function ReportPage() {
  const [search] = useSearchParams();
  const ref = search.get('r') ?? 'demo0';
  const against = search.get('against');
  const revision = useQuery(revisionQueryOptions(ref));
  const solved = useQuery(solvedRevisionQueryOptions(ref, revision.data?.params));
  const base = useQuery({ ...revisionQueryOptions(against ?? ''), enabled: !!against });
  const baseSolved = useQuery(solvedRevisionQueryOptions(against ?? '', base.data?.params));

  const changes = useMemo(() => (base.data && revision.data ? paramDiff(base.data.params, revision.data.params) : null), [base.data, revision.data]);
  const deltas = useMemo(() => {
    const a = baseSolved.data?.summary ?? base.data?.summary;
    const b = solved.data?.summary ?? revision.data?.summary;
    return a && b ? metricDeltas(a, b) : null;
  }, [baseSolved.data, base.data, solved.data, revision.data]);

  const error = revision.error ?? solved.error;
  const rev = revision.data;
  const result = solved.data;
  const generatedAt = useMemo(() => new Date(), []);

  return (
    <div className="report mx-auto flex max-w-[820px] flex-col gap-5 bg-paper-raised px-8 py-6 text-ink print:max-w-none print:bg-white print:p-0">
      <nav className="flex flex-wrap items-center gap-2 print:hidden" aria-label="Report actions">
        <Link to={against ? `/compare?a=${encodeURIComponent(against)}&b=${encodeURIComponent(ref)}` : '/'} className="text-sm underline">
          ← Back
        </Link>
        <button
          type="button"
          onClick={() => window.print()}
          disabled={!result}
          className="ml-auto rounded bg-ink px-3 py-1 text-sm font-medium text-paper disabled:opacity-50"
        >
          Print or save as PDF
        </button>
        {rev && <CsvDownloadButton result={result} meta={csvMetaOf(rev)} />}
      </nav>

      <header className="flex flex-col gap-1 border-b-2 border-ink pb-2">
        <p className="text-xs uppercase tracking-[0.12em] text-ink-soft">Dwellform · cure-cycle prediction report</p>
        <h1 className="text-2xl font-semibold tracking-tight" data-testid="report-title">
          {rev?.label ?? ref}
        </h1>
        {rev && (
          <dl className="grid grid-cols-[auto_1fr] gap-x-3 text-xs text-ink-soft" data-testid="report-meta">
            <dt>Part</dt>
            <dd>{rev.part?.label ?? '—'}</dd>
            <dt>Revision</dt>
            <dd>
              {rev.number === null ? 'demo study (not saved in the library)' : `${rev.number}${rev.isBaseline ? ' — the part’s pinned baseline' : ''}`}
              {rev.message ? ` · “${rev.message}”` : ''}
            </dd>
            {rev.author && (
              <>
                <dt>Saved by</dt>
                <dd>
                  {rev.author}
                  {rev.createdAt ? `, ${new Date(rev.createdAt).toISOString().slice(0, 16).replace('T', ' ')} UTC` : ''}
                </dd>
              </>
            )}
            <dt>Model</dt>
            <dd>{result?.modelVersion ?? 'solving…'}</dd>
            <dt>Generated</dt>
            <dd>{generatedAt.toISOString().slice(0, 16).replace('T', ' ')} UTC</dd>
            <dt>Link</dt>
            <dd className="num break-all">{typeof window === 'undefined' ? '' : window.location.href}</dd>
          </dl>
        )}
      </header>

      {error ? (
        <p role="alert" className="rounded border border-fault bg-fault-soft p-3 text-sm">
          The report could not be made: {revisionErrorText(error)}
          {needsSignIn(error) && (
            <>
              {' '}
              <a className="font-medium underline" href={signInHref()}>
                Sign in
              </a>{' '}
              and it opens again.
            </>
          )}
        </p>
      ) : !rev || !result ? (
        <p className="text-sm text-ink-soft">Solving the study…</p>
      ) : (
        <>
          <Section title="Job summary" id="report-summary">
            <p className="text-sm leading-relaxed" data-testid="job-summary">
              {jobSummary(rev, result)}
            </p>
          </Section>

          <Section title="Process limits" id="report-limits">
            <table className="w-full border-collapse text-sm" data-testid="report-limits">
              <thead className="border-b border-rule text-left text-[11px] uppercase tracking-[0.06em] text-ink-soft">
                <tr>
                  <th className="py-1">Limit</th>
                  <th className="py-1 text-right">Predicted</th>
                  <th className="py-1 text-right">Allowed</th>
                  <th className="py-1 pl-3">Verdict</th>
                  <th className="py-1">Worst at</th>
                </tr>
              </thead>
              <tbody>
                {result.summary.limits.map((l) => (
                  <tr key={l.key} className="border-b border-rule/60" data-verdict={l.pass ? 'pass' : 'fail'}>
                    <th scope="row" className="py-0.5 text-left font-normal">
                      {l.label}
                    </th>
                    <td className="num py-0.5 text-right">{formatFigure(l.value, l.unit)}</td>
                    <td className="num py-0.5 text-right">
                      {formatLimit(l.key, l.limit, l.unit)}
                    </td>
                    <td className={`py-0.5 pl-3 font-semibold ${l.pass ? 'text-verdigris' : 'text-fault'}`}>{l.pass ? '✓ pass' : '✕ FAIL'}</td>
                    <td className="num py-0.5 text-xs text-ink-soft">
                      {[l.atTimeMin !== null ? `${l.atTimeMin.toFixed(0)} min` : null, l.atZMm !== null ? `z ${l.atZMm.toFixed(2)} mm` : null]
                        .filter(Boolean)
                        .join(', ') || '—'}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
            {result.summary.warnings.length > 0 && (
              <ul className="list-disc pl-5 text-sm" data-testid="solver-notes">
                {result.summary.warnings.map((w) => (
                  <li key={w}>Solver note: {w}</li>
                ))}
              </ul>
            )}
          </Section>

          {against && (
            <Section title={`Compared with ${base.data?.label ?? against}`} id="report-compare">
              {deltas && base.data ? <MetricsTable comparison={deltas} labelA={base.data.label} labelB={rev.label} /> : <p className="text-sm text-ink-soft">Solving the reference…</p>}
              {changes && <ParamDiffList changes={changes} />}
            </Section>
          )}

          <Section title="Inputs" id="report-inputs">
            <h3 className="text-sm font-semibold">Cure cycle</h3>
            <ol className="text-sm" data-testid="report-cycle">
              {describeCycleSteps(rev.params).map((line) => (
                <li key={line}>{line}</li>
              ))}
            </ol>
            <h3 className="text-sm font-semibold">Layup</h3>
            <p className="text-sm">
              {describeLayup(rev.params).summary}, from the tool side: <span className="num text-xs">{describeLayup(rev.params).sequence}</span>
            </p>
            <h3 className="text-sm font-semibold">Material</h3>
            <Rows rows={[...resinRows(rev.params), ...fibreRows(rev.params)]} testId="report-material" />
            <h3 className="text-sm font-semibold">Tool, boundaries and geometry</h3>
            <Rows rows={processRows(rev.params)} />
          </Section>

          <Section title="Predicted histories and stresses" id="report-charts">
            <ResultChartSet runs={[{ label: rev.label, result, gelPoint: rev.params.resin.gelPoint }]} geometries={[rev.params.geometry]} width={PRINT_CHART_WIDTH} fileBase={`dwellform-${fileSlug(rev.label)}`} />
          </Section>

          <Section title="Model assumptions" id="report-assumptions">
            <ul className="list-disc pl-5 text-sm" data-testid="report-assumptions">
              {ASSUMPTIONS.map((a) => (
                <li key={a}>{a}</li>
              ))}
            </ul>
          </Section>

          <Section title="Cautions" id="report-cautions">
            <ul className="list-disc pl-5 text-sm" data-testid="report-cautions">
              {CAUTIONS.map((c) => (
                <li key={c}>{c}</li>
              ))}
              <li>{exothermNote(result.summary)}</li>
            </ul>
          </Section>

          <Section title="Review" id="report-review">
            <div className="grid grid-cols-3 gap-6 pt-6 text-xs text-ink-soft">
              <span className="border-t border-ink pt-1">Reviewed by</span>
              <span className="border-t border-ink pt-1">Decision</span>
              <span className="border-t border-ink pt-1">Date</span>
            </div>
          </Section>
        </>
      )}
    </div>
  );
}
