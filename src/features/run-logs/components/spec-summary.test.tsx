// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { render, screen } from '@testing-library/react';
import type { SpecReport } from '../../../../shared/run-log/index';
import { SpecSummary, specRows } from './spec-summary';

const spec: SpecReport = {
  findings: [],
  leadingTc: 'TC1',
  laggingTc: 'TC2',
  holds: [{ hold: 1, targetC: 180, bandC: 5, specifiedMin: 120, allowanceMin: 6, startMin: 89, endMin: 215, measuredMin: 126.5, minC: 176, maxC: 181 }],
  rates: [{ channel: 'TC1', maxHeatCPerMin: 1.9, maxCoolCPerMin: 3.4 }],
  maxPartC: 181,
  durationMin: 300,
  limits: { maxHeatCPerMin: 3, maxCoolCPerMin: 3, maxTemperatureC: 185, maxCycleMin: 480 },
  pressure: { channel: 'Pressure', min: 6.6, max: 7.1, low: 6.5, high: 7.5, unit: 'bar', reached: true },
  vacuum: null,
};

describe('SpecSummary', () => {
  it('shows each figure against its limit, the passes as well as the failures', () => {
    const rows = Object.fromEntries(specRows(spec).map((r) => [r.key, r]));
    expect(rows['heat-TC1']).toMatchObject({ measured: '1.9 °C/min', limit: '≤ 3 °C/min', pass: true });
    expect(rows['cool-TC1']).toMatchObject({ measured: '3.4 °C/min', pass: false });
    // 126.5 min against 120 ± 6: outside by half a minute
    expect(rows['hold-time-1']).toMatchObject({ limit: '120 ± 6 min', pass: false });
    expect(rows['hold-band-1']).toMatchObject({ measured: '176 – 181 °C', limit: '175 – 185 °C', pass: true });
    expect(rows['max-temperature']).toMatchObject({ measured: '181 °C', limit: '≤ 185 °C', pass: true });
    expect(rows.pressure).toMatchObject({ check: 'Vessel pressure until demould, Pressure', measured: '6.6 – 7.1 bar', limit: '6.5 – 7.5 bar', pass: true });
    expect(rows.vacuum).toMatchObject({ measured: 'not checked', pass: null });
    render(<SpecSummary spec={spec} />);
    expect(screen.getByTestId('spec-summary').querySelectorAll('tr[data-pass="true"]').length).toBe(5);
    expect(screen.getByTestId('spec-summary').querySelectorAll('tr[data-pass="false"]').length).toBe(2);
  });

  it('shows dashes for a record made before the limits were kept', () => {
    const { limits: _limits, pressure: _p, vacuum: _v, ...old } = spec;
    const rows = specRows(old);
    expect(rows.find((r) => r.key === 'heat-TC1')).toMatchObject({ limit: '—', pass: null });
    expect(rows.some((r) => r.key === 'pressure')).toBe(false);
  });
});
