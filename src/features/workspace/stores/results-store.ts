/**
 * What the solver last answered, and view state that is not part of the study
 * (scrubbed time, exaggeration). Kept apart from the editor store: results hold
 * typed arrays, which immer does not draft, and view changes are not edits to undo.
 */
import { createStore, useStore } from 'zustand';
import type { SimulationResult } from '../model/simulation-result';
import type { SolveAccuracy } from '../../../lib/solve-scheduler';
import { defaultExaggeration } from '../../../components/charts/exaggeration';

export type ResultsState = {
  /** what the charts and key figures show: a quick look while a handle is dragged, else the full solve */
  result: SimulationResult | null;
  /** how `result` was solved */
  accuracy: SolveAccuracy;
  /**
   * The last full-accuracy result: the limit verdicts, the through-thickness profiles (a preview records
   * none) and every export read this one, never a preview.
   */
  fullResult: SimulationResult | null;
  /** input sequence number the result includes (for the paint measure) */
  resultTag: number;
  solveMs: number | null;
  busy: boolean;
  /** the last solve failed: why */
  error: string | null;
  /** scrubbed time, minutes from cycle start */
  scrubMin: number;
  /** where a limit's worst point is, to mark in the through-thickness view */
  focusZMm: number | null;
  /** factor the warped shape and spring-in are drawn at */
  exaggeration: number;
  /** number of solves the worker has been asked for (shown to the curious, counted by tests) */
  solveCount: number;
  /** a handle is being dragged (pointer, or a held arrow key): scales hold still, solves are previews */
  dragging: boolean;
};

export type ResultsActions = {
  setResult: (result: SimulationResult, tag: number, solveMs: number, accuracy?: SolveAccuracy) => void;
  setBusy: (busy: boolean) => void;
  setError: (error: string | null) => void;
  countSolve: () => void;
  scrubTo: (minutes: number, zMm?: number | null) => void;
  setExaggeration: (factor: number) => void;
  setDragging: (dragging: boolean) => void;
  reset: () => void;
};

const initial: ResultsState = {
  result: null,
  accuracy: 'full',
  fullResult: null,
  resultTag: 0,
  solveMs: null,
  busy: false,
  error: null,
  scrubMin: 0,
  focusZMm: null,
  exaggeration: 20,
  solveCount: 0,
  dragging: false,
};

export function createResultsStore() {
  return createStore<ResultsState & ResultsActions>()((set) => ({
    ...initial,
    // The first result of a study opens the profiles at the exotherm peak, the moment most worth a look.
    setResult: (result, tag, solveMs, accuracy = 'full') =>
      set((s) => ({
        result,
        accuracy,
        ...(accuracy === 'full' ? { fullResult: result } : {}),
        resultTag: tag,
        solveMs,
        error: null,
        ...(s.result === null && s.scrubMin === 0 ? { scrubMin: Math.max(0, result.summary.peakOvershootTimeMin) } : {}),
        // …and picks an exaggeration that makes the shape visible (the strip is drawn at about 1 px/mm).
        ...(s.result === null ? { exaggeration: defaultExaggeration(result.summary.warpageMm, result.summary.springInDeg, 1) } : {}),
      })),
    setBusy: (busy) => set({ busy }),
    setError: (error) => set({ error }),
    countSolve: () => set((s) => ({ solveCount: s.solveCount + 1 })),
    scrubTo: (minutes, zMm = null) => set({ scrubMin: Math.max(0, minutes), focusZMm: zMm }),
    setExaggeration: (factor) => set({ exaggeration: factor }),
    setDragging: (dragging) => set({ dragging }),
    reset: () => set({ ...initial }),
  }));
}

export const resultsStore = createResultsStore();

/** Minutes the last result runs to (0 before the first): where the scrubber and the time axis end. */
const endMin = (result: SimulationResult | null) => (result ? result.history.timeS[result.history.timeS.length - 1] / 60 : 0);
export const selectResultEndMin = (s: ResultsState) => endMin(s.result);
/** The end of the last full solve: the range of what only a full solve records (profiles). */
export const selectFullResultEndMin = (s: ResultsState) => endMin(s.fullResult);

/** The shown figures are a quick look (a preview solve while dragging); the full solve replaces them on release. */
export const selectQuickLook = (s: ResultsState) => s.accuracy === 'preview';

export function useResults<T>(selector: (state: ResultsState & ResultsActions) => T): T {
  return useStore(resultsStore, selector);
}
