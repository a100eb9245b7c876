// @vitest-environment jsdom
import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { metricDeltas, type SummaryForCompare } from '../../../shared/compare/metric-deltas';
import { MetricsTable } from './metrics-table';
import { ParamDiffList } from './param-diff-list';

type Limit = SummaryForCompare['limits'][number];

function summary(heatRate: number, pass: boolean): SummaryForCompare {
  const limit: Limit = { key: 'maxHeatRateCPerMin', label: 'Heat-up rate seen by the part', value: heatRate, limit: 3, unit: '°C/min', pass, atTimeMin: 30, atZMm: 1 };
  return {
    finalCureMin: 0.95, finalTgC: 190, peakPartC: 183, peakOvershootC: 3, maxGradientC: 4, maxHeatRateCPerMin: heatRate,
    maxCoolRateCPerMin: 3, warpageMm: 0.07, springInDeg: 0.98, cycleMin: 306, adiabaticRiseC: 186, gelTimeMin: 149,
    vitrificationTimeMin: 235, limits: [limit],
  };
}

describe('MetricsTable', () => {
  it('says in words which limit now fails, so the flip does not rest on colour', () => {
    render(<MetricsTable comparison={metricDeltas(summary(2.2, true), summary(5.15, false))} labelA="A" labelB="B" />);
    const row = screen.getByRole('row', { name: /Heat-up rate seen by the part/ });
    expect(row.getAttribute('data-flip')).toBe('now-fails');
    expect(within(row).getByText('✕ now fails')).toBeTruthy();
    expect(within(row).getByText('pass')).toBeTruthy();
    expect(within(row).getByText('FAIL')).toBeTruthy();
    // 5.15 − 2.2 = 2.95 °C/min (hand arithmetic)
    expect(screen.getByTestId('delta-maxHeatRateCPerMin').textContent).toBe('+2.95 °C/min');
  });
});

describe('ParamDiffList', () => {
  it('groups changes by area and marks each kind in words', () => {
    render(
      <ParamDiffList
        changes={[
          { area: 'layup', kind: 'added', path: 'layup.plies.24', text: 'Ply 25 added: 60°, 0.3 mm' },
          { area: 'cycle', kind: 'changed', path: 'cycle.segments.0.rateCPerMin', text: 'Cycle segment 1 (ramp): rate 2 °C/min → 5 °C/min (+3 °C/min)' },
        ]}
      />,
    );
    const cycle = screen.getByRole('region', { name: 'Cure cycle' });
    expect(within(cycle).getByText('~ changed')).toBeTruthy();
    const layup = screen.getByRole('region', { name: 'Layup' });
    expect(within(layup).getByText('+ added')).toBeTruthy();
    // The cycle is listed before the layup.
    expect(cycle.compareDocumentPosition(layup) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
  });

  it('says so when nothing differs', () => {
    render(<ParamDiffList changes={[]} />);
    expect(screen.getByTestId('param-diff').textContent).toBe('The two revisions have the same inputs.');
  });
});
