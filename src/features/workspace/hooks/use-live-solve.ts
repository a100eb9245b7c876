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

function messageOf(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}

/**
 * Keeps the results following the edited study: every valid edit asks the
 * worker for a solve (latest wins, one per frame); invalid studies are never
 * sent, the last valid results stay on screen. While a handle is dragged the
 * solves are previews (coarser steps, no profiles); when the drag ends the
 * last params are solved once more at full accuracy.
 */
export function useLiveSolve(): void {
  useEffect(() => {
    const results = resultsStore.getState();
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
        resultsStore.getState().setResult(result, tag, ms, accuracy);
      },
      onError: (error) => resultsStore.getState().setError(messageOf(error)),
      onBusy: (busy) => resultsStore.getState().setBusy(busy),
      cancel: restartSolver,
      // Pointer events already arrive once per frame: an idle worker starts on the event itself.
      leading: true,
    });

    const accuracy = (): SolveAccuracy => (resultsStore.getState().dragging ? 'preview' : 'full');
    const consider = (params: StudyParams | null, tag: number) => {
      if (!params) return;
      const v = validationOf(params);
      if (v.ok) scheduler.request(v.params, tag, accuracy());
      else discardInputs(tag);
    };

    results.setError(null);
    consider(studyEditorStore.getState().params, studyEditorStore.getState().inputSeq);
    const unsubscribeEdits = studyEditorStore.subscribe((state, prev) => {
      if (state.params !== prev.params) consider(state.params, state.inputSeq);
    });
    const unsubscribeDrag = resultsStore.subscribe((state, prev) => {
      if (prev.dragging && !state.dragging) scheduler.endPreview();
    });
    return () => {
      unsubscribeEdits();
      unsubscribeDrag();
      scheduler.dispose();
    };
  }, []);
}
