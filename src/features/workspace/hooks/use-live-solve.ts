import { useEffect } from 'react';
import type { StudyParams } from '../../../../shared/schemas/study';
import { createSolveScheduler, type SolveAccuracy } from '../../../lib/solve-scheduler';
import { restartSolver, solver } from '../../../lib/solver-client';
import type { SimulationResult } from '../model/simulation-result';
import { validationOf } from '../model/study-validation';
import { SOLVE_MEASURE, discardInputs, markResultArrived } from '../perf/input-latency';
import { resultsStore } from '../stores/results-store';
import { studyEditorStore } from '../stores/study-editor-store';

type Timed = { result: SimulationResult; ms: number };

/**
 * While dragging, the drawn cycle waits for the quick look of the same edit so both change in one frame, but
 * never longer than this: a slow solve must not leave the handle behind the pointer.
 */
export const SHOW_WITHIN_MS = 16;

function messageOf(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}

/**
 * Keeps the results following the edited study: every valid edit asks the
 * worker for a solve (latest wins, one per frame); invalid studies are never
 * sent, the last valid results stay on screen. While a handle is dragged the
 * solves are previews (coarser steps, no profiles); when the drag ends the
 * last params are solved once more at full accuracy.
 *
 * During a drag the cycle views draw an edit together with its quick look (see `shown` in the editor store):
 * one frame of rendering per step instead of two, and the set point never drawn over curves solved for
 * another. An edit whose quick look has not landed within SHOW_WITHIN_MS is drawn on its own.
 */
export function useLiveSolve({ showWithinMs = SHOW_WITHIN_MS }: { showWithinMs?: number } = {}): void {
  useEffect(() => {
    const results = resultsStore.getState();
    let showTimer: ReturnType<typeof setTimeout> | null = null;
    const cancelShowTimer = () => {
      if (showTimer !== null) clearTimeout(showTimer);
      showTimer = null;
    };
    const showLatest = () => {
      cancelShowTimer();
      studyEditorStore.getState().showLatest();
    };
    // Armed by the first edit not yet drawn; later edits do not push it back, so a fast drag still moves the handle.
    const showSoon = () => {
      showTimer ??= setTimeout(showLatest, showWithinMs);
    };
    const scheduler = createSolveScheduler<StudyParams, Timed>({
      solve: async (params, accuracy) => {
        resultsStore.getState().countSolve();
        const t0 = performance.now();
        const { result, workerMs } = await solver().simulate(params, accuracy);
        const t1 = performance.now();
        // The solve's share of the input-to-paint time: the round trip, and inside it the worker's own time.
        performance.measure?.(SOLVE_MEASURE, { start: t0, end: t1, detail: { accuracy, workerMs } });
        return { result, ms: t1 - t0 };
      },
      onResult: ({ result, ms }, _params, tag, accuracy) => {
        markResultArrived();
        // Both stores change in this one task: React draws the edit and its answer in one commit.
        showLatest();
        resultsStore.getState().setResult(result, tag, ms, accuracy);
      },
      onError: (error) => {
        showLatest();
        resultsStore.getState().setError(messageOf(error));
      },
      onBusy: (busy) => resultsStore.getState().setBusy(busy),
      cancel: restartSolver,
      // Pointer events already arrive once per frame: an idle worker starts on the event itself.
      leading: true,
    });

    const accuracy = (): SolveAccuracy => (resultsStore.getState().dragging ? 'preview' : 'full');
    const consider = (params: StudyParams | null, tag: number) => {
      if (!params) return;
      const v = validationOf(params);
      if (v.ok) {
        scheduler.request(v.params, tag, accuracy());
        if (studyEditorStore.getState().holdShown) showSoon();
      } else {
        discardInputs(tag);
        showLatest();
      }
    };

    results.setError(null);
    consider(studyEditorStore.getState().params, studyEditorStore.getState().inputSeq);
    const unsubscribeEdits = studyEditorStore.subscribe((state, prev) => {
      if (state.params !== prev.params) consider(state.params, state.inputSeq);
    });
    const unsubscribeDrag = resultsStore.subscribe((state, prev) => {
      if (!prev.dragging && state.dragging) studyEditorStore.getState().setHoldShown(true);
      if (prev.dragging && !state.dragging) {
        cancelShowTimer();
        studyEditorStore.getState().setHoldShown(false);
        scheduler.endPreview();
      }
    });
    return () => {
      unsubscribeEdits();
      unsubscribeDrag();
      cancelShowTimer();
      studyEditorStore.getState().setHoldShown(false);
      scheduler.dispose();
    };
  }, [showWithinMs]);
}
