import { describe, expect, it } from 'vitest';
import { chartIndices, chartSeries } from './record';
import { makeLog, minutes } from './test-support/make-log';

describe('chartIndices', () => {
  it('keeps every row of a short log', () => {
    expect(chartIndices(5, 10)).toEqual([0, 1, 2, 3, 4]);
  });

  it('thins a long log evenly, first and last row included', () => {
    const idx = chartIndices(1_000_001, 600);
    expect(idx).toHaveLength(600);
    expect(idx[0]).toBe(0);
    expect(idx[599]).toBe(1_000_000);
    // 1 000 000 / 599 = 1669.4 rows apart, rounded to whole rows
    for (let k = 1; k < idx.length; k++) expect(idx[k] - idx[k - 1]).toBeGreaterThanOrEqual(1669);
  });
});

describe('chartSeries', () => {
  it('shows channels in °C, bar and kPa, with gaps where readings are missing', () => {
    const T = minutes(3);
    const log = makeLog({
      timeMin: T,
      channels: [
        { role: 'air', label: 'Air', values: [20, 60, NaN, 120] },
        { role: 'pressure', label: 'Pressure', values: [0, 3.5, 7, 7] },
        { role: 'vacuum', label: 'Vacuum', values: [95, 95, 94.5, 95] },
      ],
    });
    const chart = chartSeries(log);
    expect(chart.timeMin).toEqual([0, 1, 2, 3]);
    expect(chart.channels.air).toEqual([20, 60, null, 120]);
    expect(chart.channels.pressure).toEqual([0, 3.5, 7, 7]);
    expect(chart.channels.vacuum).toEqual([95, 95, 94.5, 95]);
  });
});
