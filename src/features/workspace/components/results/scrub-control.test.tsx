// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { act, render, screen } from '@testing-library/react';
import { referenceStudy } from '../../../../../shared/solver/demo-cards';
import { PREVIEW_OPTIONS, simulate } from '../../../../../shared/solver/simulate';
import { resultsStore } from '../../stores/results-store';
import { ScrubControl } from './scrub-control';

describe('scrub control', () => {
  it('keeps the range of the last full solve during a quick look, whose profiles it scrubs', () => {
    resultsStore.getState().reset();
    const full = simulate(referenceStudy());
    resultsStore.getState().setResult(full, 1, 10, 'full');
    render(<ScrubControl />);
    const slider = screen.getByTestId('scrub');
    const fullEnd = String(Math.ceil(full.history.timeS[full.history.timeS.length - 1] / 60));
    expect(slider.getAttribute('max')).toBe(fullEnd);
    // a quick look of a cycle 80 min shorter
    const shorter = structuredClone(referenceStudy());
    const dwell = shorter.cycle.kind === 'segments' ? shorter.cycle.segments[3] : undefined;
    if (dwell?.kind === 'hold') dwell.holdMin = 40;
    act(() => resultsStore.getState().setResult(simulate(shorter, PREVIEW_OPTIONS), 2, 5, 'preview'));
    expect(slider.getAttribute('max')).toBe(fullEnd);
    const released = simulate(shorter);
    act(() => resultsStore.getState().setResult(released, 3, 10, 'full'));
    expect(Number(slider.getAttribute('max'))).toBe(Math.ceil(released.history.timeS[released.history.timeS.length - 1] / 60));
    expect(Number(slider.getAttribute('max'))).toBeLessThan(Number(fullEnd) - 60);
  });
});
