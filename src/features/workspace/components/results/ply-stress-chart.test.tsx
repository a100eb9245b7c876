// @vitest-environment jsdom
import { beforeEach, describe, expect, it } from 'vitest';
import { act, render, screen } from '@testing-library/react';
import { referenceStudy } from '../../../../../shared/solver/demo-cards';
import { PREVIEW_OPTIONS, simulate } from '../../../../../shared/solver/simulate';
import { peakText } from '../../../../components/charts/ply-stress-chart';
import { resultsStore } from '../../stores/results-store';
import { WorkspacePlyStress } from './ply-stress-chart';

describe('workspace ply stresses', () => {
  const full = simulate(referenceStudy());
  // a quick look of another cycle: longer second dwell, so its stresses differ from the full solve's
  const other = structuredClone(referenceStudy());
  const dwell = other.cycle.kind === 'segments' ? other.cycle.segments[3] : undefined;
  if (dwell?.kind === 'hold') dwell.holdMin = 40;
  const quick = simulate(other, PREVIEW_OPTIONS);

  beforeEach(() => {
    resultsStore.getState().reset();
    resultsStore.getState().setResult(full, 1, 10, 'full');
  });

  it('stay on the last full solve during a quick look, say so, and follow the next full solve', () => {
    expect(peakText(quick.plyStresses.sigma2Pa)).not.toBe(peakText(full.plyStresses.sigma2Pa));
    render(<WorkspacePlyStress />);
    const panel = screen.getByTestId('ply-stresses');
    expect(panel.textContent).toContain(`peak ${peakText(full.plyStresses.sigma2Pa)} MPa`);
    act(() => resultsStore.getState().setResult(quick, 2, 5, 'preview'));
    expect(panel.textContent).toContain(`peak ${peakText(full.plyStresses.sigma2Pa)} MPa`);
    expect(panel.textContent).toContain('Cycle before this drag');
    const released = simulate(other);
    act(() => resultsStore.getState().setResult(released, 3, 10, 'full'));
    expect(screen.getByTestId('ply-stresses').textContent).toContain(`peak ${peakText(released.plyStresses.sigma2Pa)} MPa`);
    expect(screen.getByTestId('ply-stresses').textContent).not.toContain('Cycle before this drag');
  });
});
