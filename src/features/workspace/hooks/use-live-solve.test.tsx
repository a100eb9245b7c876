// @vitest-environment jsdom
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { render, waitFor } from '@testing-library/react';
import { referenceStudy } from '../../../../shared/solver/demo-cards';
import type { StudyParams } from '../../../../shared/schemas/study';
import { solverApi, type SolveAccuracy } from '../../../workers/solver-api';
import { resultsStore } from '../stores/results-store';
import { studyEditorStore } from '../stores/study-editor-store';
import { useLiveSolve } from './use-live-solve';

// The real worker API, called in this thread instead of through the worker: every solve it was asked for is logged.
const asked: { params: StudyParams; accuracy: SolveAccuracy }[] = [];
vi.mock('../../../lib/solver-client', () => ({
  solver: () => ({
    simulate: async (params: StudyParams, accuracy: SolveAccuracy) => {
      asked.push({ params, accuracy });
      return solverApi.simulate(params, accuracy);
    },
  }),
  restartSolver: () => undefined,
}));

function LiveSolve() {
  useLiveSolve();
  return null;
}

const lengthenDwell2 = (minutes: number) =>
  studyEditorStore.getState().edit('longer', (d) => {
    if (d.cycle.kind === 'segments') (d.cycle.segments[3] as { holdMin: number }).holdMin += minutes;
  });

describe('live solve during a drag', () => {
  beforeEach(() => {
    asked.length = 0;
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
});
