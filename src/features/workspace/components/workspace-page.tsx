import { memo, useEffect, useLayoutEffect, useMemo, useRef } from 'react';
import { Link, useParams, useSearchParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { ApiError } from '../../../lib/api-client';
import { Panel } from '../../../components/ui/panel';
import { ExportHoldContext } from '../../../components/export/chart-export-control';
import { TimeAxisProvider, makeTimeAxis, niceCycleEnd } from '../../../components/charts/time-axis';
import { useElementWidth } from '../../../hooks/use-element-width';
import { revisionParam, studyQueryOptions, useStudy, type WorkspaceStudy } from '../api/get-study';
import { RevisionBanner } from './revision-banner';
import { cycleEndMin, cycleSpans } from '../model/cycle-geometry';
import { useLiveSolve } from '../hooks/use-live-solve';
import { useUndoKeys } from '../hooks/use-undo-keys';
import { measurePainted, measureRendered } from '../perf/input-latency';
import { resultsStore, selectQuickLook, selectResultEndMin, useResults } from '../stores/results-store';
import { selectDirty, studyEditorStore, useStudyEditor } from '../stores/study-editor-store';
import { AssumptionsNote } from './assumptions-note';
import { CycleEditor } from './cycle/cycle-editor';
import { SegmentTable } from './cycle/segment-table';
import { HistoryLanes } from './results/history-lanes';
import { KeyFigures, SolveCounter } from './results/key-figures';
import { LimitsVerdicts } from './results/limits-verdicts';
import { WorkspacePlyStress } from './results/ply-stress-chart';
import { ScrubControl } from './results/scrub-control';
import { ThroughThickness } from './results/through-thickness';
import { WarpView } from './results/warp-view';
import { MaterialPanel } from './setup/material-panel';
import { LayupPanel } from './setup/layup-panel';
import { GeometryPanel, HeatTransferPanel, LimitsSetupPanel, ToolPanel } from './setup/process-panels';
import { WorkspaceToolbar } from './workspace-toolbar';

function loadIntoEditor(study: WorkspaceStudy) {
  resultsStore.getState().reset();
  studyEditorStore
    .getState()
    .load(
      {
        studyId: study.id,
        name: study.title,
        baseRevision: study.viewingRevision ?? study.latestRevisionNumber,
        readOnly: study.viewingRevision !== null,
      },
      study.params,
    );
}

/** One time axis for the editor and every lane: the longer of the drawn cycle and the solved one, held while dragging. */
function useWorkspaceTimeAxis(width: number) {
  const nominalEnd = useStudyEditor((s) =>
    s.shown?.cycle.kind === 'segments' ? cycleEndMin(cycleSpans(s.shown.cycle.startC, s.shown.cycle.segments)) : 0,
  );
  const resultEnd = useResults(selectResultEndMin);
  const dragging = useResults((s) => s.dragging);
  const held = useRef(0);
  let end = niceCycleEnd(Math.max(nominalEnd, resultEnd, 1));
  if (dragging) end = Math.max(end, held.current);
  held.current = end;
  return useMemo(() => makeTimeAxis([0, end], width), [end, width]);
}

/** Records the input-to-paint measure once the charts have committed a result. */
function PaintProbe() {
  const tag = useResults((s) => s.resultTag);
  const result = useResults((s) => s.result);
  const accuracy = useResults((s) => s.accuracy);
  useLayoutEffect(() => {
    if (!result) return;
    measureRendered();
    measurePainted(tag, accuracy);
  }, [result, tag, accuracy]);
  return null;
}

// Memoised so that a re-render of the column above them (a new time axis end) reaches them only through context.
const Editor = memo(function Editor() {
  return <CycleEditor />;
});
const Segments = memo(function Segments() {
  return (
    <details open className="border-t border-rule">
      <summary className="cursor-pointer px-3 py-1 text-[11px] font-semibold uppercase tracking-[0.08em] text-ink-soft">
        Segments, exact entry
      </summary>
      <SegmentTable />
    </details>
  );
});
const Lanes = memo(HistoryLanes);

/** The middle column: the cycle editor and the result lanes on one time axis. */
function TimeColumn() {
  const [ref, width] = useElementWidth<HTMLDivElement>(900);
  const axis = useWorkspaceTimeAxis(width);
  return (
    <div ref={ref} className="border-t border-rule">
      <TimeAxisProvider axis={axis}>
        <Editor />
        <Segments />
        <Lanes />
      </TimeAxisProvider>
    </div>
  );
}

const SetupColumn = memo(function SetupColumn() {
  return (
    <aside aria-label="Study setup" className="paint-island border-r border-rule bg-paper-raised/60 lg:max-h-[calc(100vh-7rem)] lg:overflow-y-auto">
      <MaterialPanel />
      <LayupPanel />
      <ToolPanel />
      <HeatTransferPanel />
      <GeometryPanel />
      <LimitsSetupPanel />
    </aside>
  );
});

/** The browser asks before leaving a study with unsaved changes. */
function useLeaveGuard() {
  useEffect(() => {
    const onBeforeUnload = (e: BeforeUnloadEvent) => {
      if (selectDirty(studyEditorStore.getState())) e.preventDefault();
    };
    window.addEventListener('beforeunload', onBeforeUnload);
    return () => window.removeEventListener('beforeunload', onBeforeUnload);
  }, []);
}

/** Chart exports never carry a quick look: while one is on screen they say so instead. */
const holdQuickLookExports = () =>
  selectQuickLook(resultsStore.getState()) ? 'The chart shows a quick look while you drag; export once the full solve is on screen.' : null;

function Workspace({ study, onReload }: { study: WorkspaceStudy; onReload: () => void }) {
  useLiveSolve();
  useUndoKeys();
  useLeaveGuard();
  const canWrite = study.role === 'engineer' || study.role === 'lead';
  const viewing = study.viewingRevision;

  return (
    <ExportHoldContext.Provider value={holdQuickLookExports}>
      <div className="flex min-h-full flex-col" data-testid="workspace">
        {viewing !== null && study.latestRevisionNumber !== null && (
          <RevisionBanner studyId={study.id} revision={viewing} latest={study.latestRevisionNumber} canWrite={canWrite} />
        )}
        <WorkspaceToolbar offline={study.offline} canWrite={canWrite && viewing === null} onReload={onReload} />
        <div className="grid flex-1 grid-cols-1 lg:grid-cols-[20rem_minmax(0,1fr)] 2xl:grid-cols-[20rem_minmax(0,1fr)_22rem]">
          <SetupColumn />
          <section aria-label="Cure cycle and results over time" className="min-w-0">
            <KeyFigures />
            <TimeColumn />
            <PaintProbe />
            <SolveCounter />
          </section>
          <aside aria-label="Verdicts and the part after cure" className="border-l border-rule bg-paper-raised/60 lg:col-span-2 2xl:col-span-1">
            <div className="grid grid-cols-1 lg:grid-cols-2 2xl:grid-cols-1">
              <Panel title="Process limits, verdict">
                <LimitsVerdicts />
              </Panel>
              <Panel title="Through the thickness">
                <ScrubControl />
                <ThroughThickness />
              </Panel>
              <Panel title="Ply stresses after demould">
                <WorkspacePlyStress />
              </Panel>
              <Panel title="Shape after demould">
                <WarpView />
              </Panel>
            </div>
            <AssumptionsNote />
          </aside>
        </div>
      </div>
    </ExportHoldContext.Provider>
  );
}

/** The study workspace at /studies/:studyId. */
export function WorkspacePage() {
  const { studyId = '' } = useParams();
  const [search] = useSearchParams();
  const revision = revisionParam(search.get('r'));
  const query = useStudy(studyId, revision);
  const queryClient = useQueryClient();
  const loadedFor = useStudyEditor((s) => s.meta?.studyId ?? null);
  const loadedRevision = useStudyEditor((s) => s.meta?.baseRevision ?? null);
  const loadedReadOnly = useStudyEditor((s) => !!s.meta?.readOnly);

  useEffect(() => {
    if (query.data) loadIntoEditor(query.data);
  }, [query.data]);

  async function reload() {
    const fresh = await queryClient.fetchQuery({ ...studyQueryOptions(studyId, revision), staleTime: 0 });
    loadIntoEditor(fresh);
  }

  if (query.isPending) return <p className="p-6 text-ink-soft">Opening the study…</p>;
  if (query.isError) {
    const err = query.error;
    if (err instanceof ApiError && err.status === 401) {
      return (
        <div className="p-6">
          <p className="mb-2">Sign in to open this study.</p>
          <a className="text-slate underline" href={`/api/auth/github?next=${encodeURIComponent(`/studies/${studyId}${revision ? `?r=${revision}` : ''}`)}`}>
            Sign in
          </a>
          <p className="mt-4 text-sm text-ink-soft">
            Or try the <Link className="text-slate underline" to="/studies/demo">offline reference study</Link>.
          </p>
        </div>
      );
    }
    return (
      <p role="alert" className="p-6 text-fault">
        This study could not be opened: {err.message}
      </p>
    );
  }
  // Wait until the editor holds what the URL names (a read-only revision, or the latest for editing).
  const viewing = query.data.viewingRevision;
  const loaded = loadedFor === query.data.id && (viewing === null ? !loadedReadOnly : loadedReadOnly && loadedRevision === viewing);
  if (!loaded) return <p className="p-6 text-ink-soft">Opening the study…</p>;
  return <Workspace study={query.data} onReload={() => void reload()} />;
}
