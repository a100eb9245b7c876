import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { BusyIndicator } from '../../../components/ui/busy-indicator';
import { useForkRevision } from '../api/fork-revision';
import { StaleRevisionError, saveRevision, useSaveRevision } from '../api/save-revision';
import { validationOf } from '../model/study-validation';
import { selectQuickLook, useResults } from '../stores/results-store';
import { WorkspaceExports } from './workspace-exports';
import {
  selectCanRedo,
  selectCanUndo,
  selectDirty,
  selectRedoLabel,
  selectUndoLabel,
  studyEditorStore,
  useStudyEditor,
} from '../stores/study-editor-store';

const buttonBase = 'rounded border px-2 py-1 text-sm disabled:cursor-not-allowed disabled:opacity-40';
const button = `${buttonBase} border-rule bg-paper-raised hover:bg-rule/40`;
const primaryButton = `${buttonBase} border-ink bg-ink text-paper hover:bg-ink-soft`;

export function WorkspaceToolbar({ offline, canWrite, onReload }: { offline: boolean; canWrite: boolean; onReload: () => void }) {
  const meta = useStudyEditor((s) => s.meta);
  const dirty = useStudyEditor(selectDirty);
  const canUndo = useStudyEditor(selectCanUndo);
  const canRedo = useStudyEditor(selectCanRedo);
  const undoLabel = useStudyEditor(selectUndoLabel);
  const redoLabel = useStudyEditor(selectRedoLabel);
  const issueCount = useStudyEditor((s) => {
    const v = s.params ? validationOf(s.params) : null;
    return v && !v.ok ? v.issues.length : 0;
  });
  const solveError = useResults((s) => s.error);
  const [saving, setSaving] = useState(false);

  return (
    <div className="sticky top-0 z-10 border-b border-rule bg-paper-raised">
      <div className="flex flex-wrap items-center gap-2 px-3 py-1.5">
        <h1 className="text-base font-semibold tracking-tight">{meta?.name ?? 'Study'}</h1>
        <span className="num text-xs text-ink-faint">
          {meta?.baseRevision ? `revision ${meta.baseRevision}` : offline ? 'not in the library' : 'no revision'}
        </span>
        <span
          className={`rounded-full px-2 py-0.5 text-xs ${dirty ? 'bg-saffron-soft text-ink' : 'text-ink-faint'}`}
          data-testid="unsaved-marker"
          aria-live="polite"
        >
          {dirty ? '● unsaved changes' : 'saved'}
        </span>
        <a href="#model-cautions" className="text-xs text-saffron underline decoration-dotted" title="What the model assumes, and what predictions are for">
          model and cautions
        </a>
        {issueCount > 0 && (
          <span className="rounded-full bg-fault-soft px-2 py-0.5 text-xs text-fault" role="status" data-testid="invalid-marker">
            {issueCount} {issueCount === 1 ? 'entry needs' : 'entries need'} attention; results show the last valid study
          </span>
        )}
        {solveError && (
          <span className="rounded-full bg-fault-soft px-2 py-0.5 text-xs text-fault" role="alert">
            Solver: {solveError}
          </span>
        )}
        <div className="ml-auto flex items-center gap-2">
          <SolveAccuracyNote />
          <SolveBusy />
          <WorkspaceExports />
          <button
            type="button"
            className={button}
            disabled={!canUndo}
            onClick={() => studyEditorStore.getState().undo()}
            title={undoLabel ? `Undo: ${undoLabel} (Ctrl+Z)` : 'Nothing to undo'}
            aria-keyshortcuts="Control+Z"
          >
            Undo
          </button>
          <button
            type="button"
            className={button}
            disabled={!canRedo}
            onClick={() => studyEditorStore.getState().redo()}
            title={redoLabel ? `Redo: ${redoLabel} (Ctrl+Shift+Z)` : 'Nothing to redo'}
            aria-keyshortcuts="Control+Shift+Z"
          >
            Redo
          </button>
          <button
            type="button"
            className={primaryButton}
            disabled={offline || !canWrite || !dirty || issueCount > 0}
            title={
              offline
                ? 'The offline demo is not in the library'
                : !canWrite
                  ? 'Saving needs the engineer or lead role'
                  : issueCount > 0
                    ? 'Fix the marked entries first'
                    : 'Save a new revision'
            }
            onClick={() => setSaving(true)}
          >
            Save revision…
          </button>
        </div>
      </div>
      {saving && <SaveForm onClose={() => setSaving(false)} onReload={onReload} />}
    </div>
  );
}

/** Its own component: a solve's busy flag flips twice per drag step, and only this needs to follow it. */
function SolveBusy() {
  const busy = useResults((s) => s.busy);
  return <BusyIndicator busy={busy} />;
}

/**
 * Says when the figures and charts are a quick look (preview solves while a handle is dragged) and, to screen
 * readers, when the full solve has replaced them. `data-accuracy` tells tests and the bench which is on screen.
 */
function SolveAccuracyNote() {
  const quickLook = useResults(selectQuickLook);
  const hasResult = useResults((s) => s.result !== null);
  return (
    <span
      role="status"
      aria-live="polite"
      data-testid="solve-accuracy"
      data-accuracy={quickLook ? 'preview' : 'full'}
      className={quickLook ? 'rounded-full bg-saffron-soft px-2 py-0.5 text-xs text-ink' : 'sr-only'}
      title={
        quickLook
          ? 'While you drag, the study is solved with coarser time steps for speed. When you let go it is solved in full; the verdicts, the profiles and every export come from that full solve.'
          : undefined
      }
    >
      {quickLook ? 'Quick look while dragging · full solve on release' : hasResult ? 'Results from the full solve' : ''}
    </span>
  );
}

function SaveForm({ onClose, onReload }: { onClose: () => void; onReload: () => void }) {
  const save = useSaveRevision();
  const fork = useForkRevision();
  const navigate = useNavigate();
  const [message, setMessage] = useState('');
  const [conflict, setConflict] = useState<StaleRevisionError | null>(null);
  const [failure, setFailure] = useState<string | null>(null);

  async function submit() {
    const { meta, params } = studyEditorStore.getState();
    if (!meta || !params || meta.baseRevision === null) return;
    setFailure(null);
    try {
      const saved = await save.mutateAsync({ studyId: meta.studyId, baseRevision: meta.baseRevision, message, params });
      studyEditorStore.getState().markSaved(saved.number);
      onClose();
    } catch (error) {
      if (error instanceof StaleRevisionError) setConflict(error);
      else setFailure(error instanceof Error ? error.message : String(error));
    }
  }

  async function keepAsNewStudy() {
    const { meta, params } = studyEditorStore.getState();
    if (!meta || !params || meta.baseRevision === null) return;
    try {
      const forked = await fork.mutateAsync({ studyId: meta.studyId, revision: meta.baseRevision, title: `${meta.name} (my changes)` });
      await saveRevision({ studyId: String(forked.id), baseRevision: forked.latestRevisionNumber, message: message || 'My changes', params });
      onClose();
      navigate(`/studies/${forked.id}`);
    } catch (error) {
      setFailure(error instanceof Error ? error.message : String(error));
    }
  }

  return (
    <form
      data-own-undo
      className="flex flex-wrap items-start gap-2 border-t border-rule bg-paper px-3 py-2"
      onSubmit={(e) => {
        e.preventDefault();
        void submit();
      }}
      aria-label="Save a new revision"
    >
      <label className="flex min-w-72 flex-1 flex-col text-xs text-ink-soft">
        What changed and why
        <input
          autoFocus
          value={message}
          maxLength={500}
          onChange={(e) => setMessage(e.target.value)}
          className="rounded border border-rule bg-paper-raised px-2 py-1 text-sm text-ink"
          placeholder="e.g. second dwell 20 min shorter; cure still above 0.9"
        />
      </label>
      <button type="submit" className={`${primaryButton} mt-4`} disabled={save.isPending}>
        {save.isPending ? 'Saving…' : 'Save'}
      </button>
      <button type="button" className={`${button} mt-4`} onClick={onClose}>
        Cancel
      </button>
      {conflict && (
        <div role="alert" className="w-full rounded border border-saffron bg-saffron-soft/60 p-2 text-sm">
          <p>
            A newer revision{conflict.latestRevision ? ` (${conflict.latestRevision})` : ''} was saved while you were editing, so
            yours was not saved. {conflict.message}
          </p>
          <div className="mt-1 flex gap-2">
            <button type="button" className={button} onClick={onReload}>
              Open the newer revision (drops your changes)
            </button>
            <button type="button" className={button} onClick={() => void keepAsNewStudy()} disabled={fork.isPending}>
              Keep my changes as a new study
            </button>
          </div>
        </div>
      )}
      {failure && (
        <p role="alert" className="w-full text-sm text-fault">
          Not saved: {failure}
        </p>
      )}
    </form>
  );
}
