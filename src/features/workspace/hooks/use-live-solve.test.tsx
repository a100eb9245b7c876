// @vitest-environment jsdom
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { render, waitFor } from '@testing-library/react';
import { referenceStudy } from '../../../../shared/solver/demo-cards';
import type { StudyParams } from '../../../../shared/schemas/study';
import { solverApi, type SolveAccuracy } from '../../../workers/solver-api';
import { resultsStore } from '../stores/results-store';
import { studyEditorStore } from '../stores/study-editor-store';
import { SHOW_WITHIN_MS, useLiveSolve } from './use-live-solve';

// The real worker API, called in this thread instead of through the worker: every solve it was asked for is logged.
const asked: { params: StudyParams; accuracy: SolveAccuracy }[] = [];
/** extra wait before a solve answers, ms (a slow study) */
let solveDelayMs = 0;
vi.mock('../../../lib/solver-client', () => ({
  solver: () => ({
    simulate: async (params: StudyParams, accuracy: SolveAccuracy) => {
      asked.push({ params, accuracy });
      if (solveDelayMs > 0) await new Promise((r) => setTimeout(r, solveDelayMs));
      return solverApi.simulate(params, accuracy);
    },
  }),
  restartSolver: () => undefined,
}));

function LiveSolve({ showWithinMs }: { showWithinMs?: number }) {
  useLiveSolve({ showWithinMs });
  return null;
}

const lengthenDwell2 = (minutes: number) =>
  studyEditorStore.getState().edit('longer', (d) => {
    if (d.cycle.kind === 'segments') (d.cycle.segments[3] as { holdMin: number }).holdMin += minutes;
  });

describe('live solve during a drag', () => {
  beforeEach(() => {
    asked.length = 0;
    solveDelayMs = 0;
    resultsStore.getState().reset();
    studyEditorStore.getState().load({ studyId: 'test', name: 'test', baseRevision: 1 }, referenceStudy());
  });
  afterEach(() => resultsStore.getState().setDragging(false));

  it('shows previews while dragging, keeps verdicts on the last full solve, and solves the end state in full on release', async () => {
    const cycle = referenceStudy().cycle;
    expect(cycle.kind === 'segments' ? cycle.segments[3].kind : null).toBe('hold');
    render(<LiveSolve />);
    await waitFor(() => expect(resultsStore.getState().fullResult).not.toBeNull());
    const before = resultsStore.getState().fullResult!;
    expect(resultsStore.getState().accuracy).toBe('full');

    resultsStore.getState().setDragging(true);
    lengthenDwell2(30);
    await waitFor(() => expect(resultsStore.getState().accuracy).toBe('preview'));
    const shown = resultsStore.getState();
    // The charts follow the drag; the verdicts and profiles stay on the full solve from before it.
    expect(shown.result).not.toBe(before);
    expect(shown.result!.profiles.temperatureK.length).toBe(0);
    expect(shown.result!.steps).toBeLessThan(before.steps);
    expect(shown.fullResult).toBe(before);

    resultsStore.getState().setDragging(false);
    await waitFor(() => expect(resultsStore.getState().accuracy).toBe('full'));
    const after = resultsStore.getState();
    expect(after.fullResult).toBe(after.result);
    expect(after.result!.profiles.temperatureK.length).toBeGreaterThan(0);
    expect(after.result!.summary.cycleMin).toBeCloseTo(before.summary.cycleMin + 30, 0);
    // The release solved the params the last preview showed, once, in full.
    expect(asked.map((a) => a.accuracy)).toEqual(['full', 'preview', 'full']);
    expect(asked[2].params).toBe(asked[1].params);
  });

  it('an edit outside a drag is solved in full at once, and a release with nothing previewed solves nothing more', async () => {
    render(<LiveSolve />);
    await waitFor(() => expect(resultsStore.getState().fullResult).not.toBeNull());
    lengthenDwell2(10);
    await waitFor(() => expect(asked).toHaveLength(2));
    resultsStore.getState().setDragging(true);
    resultsStore.getState().setDragging(false);
    await new Promise((r) => setTimeout(r, 50));
    expect(asked.map((a) => a.accuracy)).toEqual(['full', 'full']);
  });

  it('while dragging, an edit is drawn in the same store update as its quick look, not before', async () => {
    // The frame's fallback out of play: on a busy machine it could draw the edit first and leave nothing to check.
    render(<LiveSolve showWithinMs={60_000} />);
    await waitFor(() => expect(resultsStore.getState().fullResult).not.toBeNull());
    // What the cycle views draw at the moment each new result reaches the charts.
    const drawnWithResult: boolean[] = [];
    const unsubscribe = resultsStore.subscribe((state, prev) => {
      if (state.result !== prev.result) drawnWithResult.push(studyEditorStore.getState().shown === studyEditorStore.getState().params);
    });
    resultsStore.getState().setDragging(true);
    const before = studyEditorStore.getState().shown;
    lengthenDwell2(30);
    // Edited, not yet drawn: the quick look is still being solved.
    expect(studyEditorStore.getState().params).not.toBe(before);
    expect(studyEditorStore.getState().shown).toBe(before);
    await waitFor(() => expect(resultsStore.getState().accuracy).toBe('preview'));
    expect(drawnWithResult).toEqual([true]);
    unsubscribe();
  });

  it('a quick look slower than a frame does not hold the handle back: the edit is drawn on its own', async () => {
    render(<LiveSolve />);
    await waitFor(() => expect(resultsStore.getState().fullResult).not.toBeNull());
    solveDelayMs = 400;
    resultsStore.getState().setDragging(true);
    const before = studyEditorStore.getState().shown;
    const full = resultsStore.getState().result;
    lengthenDwell2(30);
    expect(studyEditorStore.getState().shown).toBe(before);
    await new Promise((r) => setTimeout(r, SHOW_WITHIN_MS + 50));
    expect(studyEditorStore.getState().shown).toBe(studyEditorStore.getState().params);
    // …while the charts still show the answer from before the edit.
    expect(resultsStore.getState().result).toBe(full);
  });

  it('an edit the solver is never asked about (invalid) is drawn at once, even mid-drag', async () => {
    render(<LiveSolve />);
    await waitFor(() => expect(resultsStore.getState().fullResult).not.toBeNull());
    resultsStore.getState().setDragging(true);
    studyEditorStore.getState().edit('bad', (d) => void (d.fibreVolumeFraction = 2));
    expect(studyEditorStore.getState().shown).toBe(studyEditorStore.getState().params);
    expect(asked).toHaveLength(1);
  });
});
