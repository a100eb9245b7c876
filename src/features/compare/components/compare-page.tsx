import { useMemo, useState, type FormEvent } from 'react';
import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { metricDeltas } from '../../../../shared/compare/metric-deltas';
import { paramDiff } from '../../../../shared/compare/param-diff';
import { CsvDownloadButton } from '../../../components/export/csv-download-button';
import { RunKey } from '../../../components/charts/chart-figure';
import { ResultChartSet } from '../../../components/charts/result-chart-set';
import { useElementWidth } from '../../../hooks/use-element-width';
import { fileSlug } from '../../../lib/chart-export';
import { csvMetaOf, needsSignIn, revisionErrorText, demoRevisionChoices, partRevisionChoicesQueryOptions, revisionQueryOptions, signInHref, type RevisionChoice, type RevisionData } from '../../../lib/revision-query';
import { solvedRevisionQueryOptions } from '../../../lib/solve-query';
import { useComparePair } from '../hooks/use-compare-pair';
import { MetricsTable } from '../../../components/comparison/metrics-table';
import { ParamDiffList } from '../../../components/comparison/param-diff-list';

function Problem({ title, error }: { title: string; error: unknown }) {
  return (
    <div role="alert" className="rounded border border-fault bg-fault-soft p-3 text-sm">
      <p className="font-semibold">{title}</p>
      <p>{revisionErrorText(error)}</p>
      {needsSignIn(error) && (
        <p className="mt-1">
          <a className="font-medium underline" href={signInHref()}>
            Sign in
          </a>{' '}
          and this comparison opens again.
        </p>
      )}
      <p className="mt-1 text-ink-soft">
        Check the link, or <Link className="underline" to="/compare?a=demo0&b=demo2">open the demo comparison</Link>.
      </p>
    </div>
  );
}

export function ComparePage() {
  const pair = useComparePair();
  return (
    <section className="mx-auto flex max-w-[1200px] flex-col gap-4 px-4 py-6" aria-labelledby="compare-title">
      <h1 id="compare-title" className="text-2xl font-semibold tracking-tight">
        Compare
      </h1>
      {pair.error ? (
        <Problem title="Nothing to compare yet" error={pair.error} />
      ) : !pair.a || !pair.b ? (
        <p className="text-sm text-ink-soft">Finding the part's baseline…</p>
      ) : (
        <Comparison a={pair.a} b={pair.b} onChoose={pair.choose} />
      )}
    </section>
  );
}

function RunHeader({ index, revision, role }: { index: number; revision: RevisionData | undefined; role: string }) {
  return (
    <div className="flex min-w-0 flex-1 flex-col gap-0.5 rounded border border-rule bg-paper-raised p-2" data-testid={`run-${index === 0 ? 'a' : 'b'}`}>
      <span className="flex items-center gap-2 text-xs text-ink-soft">
        <RunKey index={index} />
        <span className="font-semibold text-ink">{index === 0 ? 'A' : 'B'}</span>
        <span>{role}</span>
        {revision?.isBaseline && <span className="rounded bg-saffron-soft px-1 text-[10px] font-semibold uppercase text-ink">baseline</span>}
      </span>
      <span className="truncate font-medium" title={revision?.label}>
        {revision?.label ?? '…'}
      </span>
      {revision && (
        <span className="truncate text-xs text-ink-soft">
          {revision.part?.label}
          {revision.author ? ` · ${revision.author}` : ''}
          {revision.message ? ` · “${revision.message}”` : ''}
        </span>
      )}
    </div>
  );
}

function Choose({ a, b, partId, onChoose }: { a: string; b: string; partId: number | null; onChoose: (a: string, b: string) => void }) {
  const [draftA, setDraftA] = useState(a);
  const [draftB, setDraftB] = useState(b);
  const library = useQuery(partRevisionChoicesQueryOptions(partId));
  const demos = demoRevisionChoices();
  // Revisions of the part being compared when signed in; the demo studies otherwise. Any reference can be typed.
  const choices: RevisionChoice[] = library.data ?? (partId === 0 || partId === null ? demos : []);
  function submit(e: FormEvent) {
    e.preventDefault();
    onChoose(draftA.trim(), draftB.trim());
  }
  const field = (label: string, value: string, set: (v: string) => void) => (
    <label className="flex min-w-60 flex-1 flex-col">
      {label}
      {choices.some((c) => c.ref === value) ? (
        <select className="rounded border border-rule bg-paper-raised px-1 py-0.5" value={value} onChange={(e) => set(e.target.value)}>
          {choices.map((c) => (
            <option key={c.ref} value={c.ref}>
              {c.label}
            </option>
          ))}
        </select>
      ) : (
        <input className="num rounded border border-rule bg-paper-raised px-1 py-0.5" value={value} onChange={(e) => set(e.target.value)} />
      )}
    </label>
  );
  return (
    <form onSubmit={submit} className="flex flex-wrap items-end gap-2 text-xs print:hidden" aria-label="Choose revisions">
      {field('A (reference)', draftA, setDraftA)}
      {field('B (candidate)', draftB, setDraftB)}
      <button type="submit" className="rounded border border-rule px-2 py-1 hover:bg-rule/40">
        Compare
      </button>
      <button type="button" className="rounded border border-rule px-2 py-1 hover:bg-rule/40" onClick={() => onChoose(b, a)}>
        Swap A and B
      </button>
    </form>
  );
}

function ShareLink() {
  const url = typeof window === 'undefined' ? '' : window.location.href;
  const [copied, setCopied] = useState(false);
  return (
    <span className="flex items-center gap-1 text-xs print:hidden">
      <label className="sr-only" htmlFor="compare-link">
        Link to this comparison
      </label>
      <input id="compare-link" readOnly value={url} className="num w-72 rounded border border-rule bg-paper-raised px-1 py-0.5 text-ink-soft" onFocus={(e) => e.currentTarget.select()} />
      <button
        type="button"
        className="rounded border border-rule px-2 py-1 hover:bg-rule/40"
        onClick={async () => {
          try {
            await navigator.clipboard.writeText(url);
            setCopied(true);
          } catch {
            setCopied(false);
          }
        }}
      >
        {copied ? 'Copied' : 'Copy link'}
      </button>
    </span>
  );
}

function Comparison({ a, b, onChoose }: { a: string; b: string; onChoose: (a: string, b: string) => void }) {
  const revA = useQuery(revisionQueryOptions(a));
  const revB = useQuery(revisionQueryOptions(b));
  const solvedA = useQuery(solvedRevisionQueryOptions(a, revA.data?.params));
  const solvedB = useQuery(solvedRevisionQueryOptions(b, revB.data?.params));
  const [chartBox, width] = useElementWidth<HTMLDivElement>(900);

  // First paint from the summaries the server stored; the worker's own answers replace them as they come.
  const summaryA = solvedA.data?.summary ?? revA.data?.summary ?? null;
  const summaryB = solvedB.data?.summary ?? revB.data?.summary ?? null;
  const comparison = useMemo(() => (summaryA && summaryB ? metricDeltas(summaryA, summaryB) : null), [summaryA, summaryB]);
  const changes = useMemo(() => (revA.data && revB.data ? paramDiff(revA.data.params, revB.data.params) : null), [revA.data, revB.data]);
  const fromWorker = !!solvedA.data && !!solvedB.data;

  const revisionError = revA.error ?? revB.error;
  if (revisionError) return <Problem title="A revision could not be opened" error={revisionError} />;

  const labelA = revA.data?.label ?? a;
  const labelB = revB.data?.label ?? b;
  const solveError = solvedA.error ?? solvedB.error;

  return (
    <>
      <div className="flex flex-col gap-2">
        <div className="flex flex-wrap gap-2">
          <RunHeader index={0} revision={revA.data} role="reference" />
          <RunHeader index={1} revision={revB.data} role="candidate" />
        </div>
        <Choose key={`${a}|${b}`} a={a} b={b} partId={revB.data?.part?.id ?? null} onChoose={onChoose} />
        <div className="flex flex-wrap items-center gap-2 print:hidden">
          <ShareLink />
          <Link className="rounded border border-rule bg-paper-raised px-2 py-1 text-xs font-medium hover:bg-rule/40" to={`/report?r=${encodeURIComponent(b)}&against=${encodeURIComponent(a)}`}>
            Printable report of B
          </Link>
          {revA.data && (
            <CsvDownloadButton result={solvedA.data} label="CSV of A" meta={csvMetaOf(revA.data)} />
          )}
          {revB.data && (
            <CsvDownloadButton result={solvedB.data} label="CSV of B" meta={csvMetaOf(revB.data)} />
          )}
        </div>
      </div>

      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
        <section aria-labelledby="figures-title" className="flex flex-col gap-2">
          <h2 id="figures-title" className="text-lg font-semibold">
            Figures and limits
          </h2>
          {comparison ? (
            <>
              <p className="text-sm" data-testid="flip-headline">
                {comparison.nowFail + comparison.nowPass === 0
                  ? 'No process limit changes its verdict.'
                  : `${comparison.nowFail + comparison.nowPass} limit${comparison.nowFail + comparison.nowPass === 1 ? '' : 's'} change verdict: ${comparison.nowFail} now fail${comparison.nowFail === 1 ? 's' : ''}, ${comparison.nowPass} now pass${comparison.nowPass === 1 ? 'es' : ''}.`}
              </p>
              <MetricsTable comparison={comparison} labelA={labelA} labelB={labelB} />
              <p className="text-xs text-ink-faint" data-testid="figures-source">
                {fromWorker
                  ? `Recomputed in this browser by ${solvedB.data!.modelVersion}.`
                  : 'From the summaries saved with each revision; recomputing in this browser…'}
              </p>
            </>
          ) : solveError ? (
            <Problem title="The solver could not run one of the studies" error={solveError} />
          ) : (
            <p className="text-sm text-ink-soft">Solving both studies…</p>
          )}
        </section>

        <section aria-labelledby="inputs-title" className="flex flex-col gap-2">
          <h2 id="inputs-title" className="text-lg font-semibold">
            What differs in the inputs
          </h2>
          {changes ? <ParamDiffList changes={changes} /> : <p className="text-sm text-ink-soft">Reading both revisions…</p>}
        </section>
      </div>

      <section aria-labelledby="charts-title" className="flex flex-col gap-2">
        <h2 id="charts-title" className="text-lg font-semibold">
          Results overlaid
        </h2>
        <div ref={chartBox}>
          {solvedA.data && solvedB.data ? (
            <ResultChartSet
              runs={[
                { label: labelA, result: solvedA.data, gelPoint: revA.data?.params.resin.gelPoint },
                { label: labelB, result: solvedB.data, gelPoint: revB.data?.params.resin.gelPoint },
              ]}
              geometries={revA.data && revB.data ? [revA.data.params.geometry, revB.data.params.geometry] : undefined}
              width={width}
              fileBase={`dwellform-compare-${fileSlug(labelA)}-vs-${fileSlug(labelB)}`}
            />
          ) : solveError ? (
            <Problem title="The solver could not run one of the studies" error={solveError} />
          ) : (
            <p className="text-sm text-ink-soft">Solving both studies in the worker…</p>
          )}
        </div>
      </section>
    </>
  );
}
