// @vitest-environment jsdom
import { beforeAll, describe, expect, it } from 'vitest';
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { referenceStudy } from '../../../../../shared/solver/demo-cards';
import { simulate } from '../../../../../shared/solver/simulate';
import { resultsStore } from '../../stores/results-store';
import { LimitsVerdicts } from './limits-verdicts';

describe('limits verdicts', () => {
  beforeAll(() => {
    resultsStore.getState().reset();
    resultsStore.getState().setResult(simulate(referenceStudy(), { recordProfiles: true }), 1, 10);
  });

  it('lists every limit with its verdict, and a row moves the scrubber to that limit’s worst time and place', async () => {
    const user = userEvent.setup();
    render(<LimitsVerdicts />);
    const summary = resultsStore.getState().result!.summary;
    for (const check of summary.limits) {
      const row = screen.getByTestId(`limit-${check.key}`);
      expect(row.getAttribute('aria-label')).toContain(check.pass ? 'within limit' : 'exceeds limit');
    }
    await user.click(screen.getByTestId('limit-maxOvershootC'));
    expect(resultsStore.getState().scrubMin).toBe(summary.peakOvershootTimeMin);
    expect(resultsStore.getState().focusZMm).toBe(summary.peakOvershootZMm);
  });
});
