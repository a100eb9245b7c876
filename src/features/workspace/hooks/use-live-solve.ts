import { useEffect } from 'react';
import type { StudyParams } from '../../../../shared/schemas/study';
import { createSolveScheduler } from '../../../lib/solve-scheduler';
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
 * sent, the last valid results stay on screen.
 */
export function useLiveSolve(): void {
  useEffect(() => {
    const results = resultsStore.getState();
    const scheduler = createSolveScheduler<StudyParams, Timed>({
      solve: async (params) => {
        resultsStore.getState().countSolve();
        const t0 = performance.now();
        const result = await solver().simulate(params);
        const t1 = performance.now();
        // The worker's share of the input-to-paint time (the bench reports both).
        performance.measure?.(SOLVE_MEASURE, { start: t0, end: t1 });
        return { result, ms: t1 - t0 };
      },
      onResult: ({ result, ms }, _params, tag) => {
        markResultArrived();
        resultsStore.getState().setResult(result, tag, ms);
      },
      onError: (error) => resultsStore.getState().setError(messageOf(error)),
      onBusy: (busy) => resultsStore.getState().setBusy(busy),
      cancel: restartSolver,
      // Pointer events already arrive once per frame: an idle worker starts on the event itself.
      leading: true,
    });

    const consider = (params: StudyParams | null, tag: number) => {
      if (!params) return;
      const v = validationOf(params);
      if (v.ok) scheduler.request(v.params, tag);
      else discardInputs(tag);
    };

    results.setError(null);
    consider(studyEditorStore.getState().params, studyEditorStore.getState().inputSeq);
    const unsubscribe = studyEditorStore.subscribe((state, prev) => {
      if (state.params !== prev.params) consider(state.params, state.inputSeq);
    });
    return () => {
      unsubscribe();
      scheduler.dispose();
    };
  }, []);
}
