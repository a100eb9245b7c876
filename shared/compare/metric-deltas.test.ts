import { describe, expect, it } from 'vitest';
import { metricDeltas, METRICS, type SummaryForCompare } from './metric-deltas';

// Two hand-written summaries (engineering units, as stored with each revision); the expected deltas are
// hand arithmetic on the numbers written here.

type Limit = SummaryForCompare['limits'][number];

function limit(key: Limit['key'], value: number, limitValue: number, pass: boolean, unit = '°C'): Limit {
  return { key, label: key, value, limit: limitValue, unit, pass, atTimeMin: 100, atZMm: 2 };
}

function summary(over: Partial<SummaryForCompare> = {}): SummaryForCompare {
  return {
    finalCureMin: 0.91,
    finalTgC: 190,
    peakPartC: 183,
    peakOvershootC: 3,
    maxGradientC: 6,
    maxHeatRateCPerMin: 2.1,
    maxCoolRateCPerMin: 2.9,
    warpageMm: 0.4,
    springInDeg: 1.1,
    cycleMin: 400,
    adiabaticRiseC: 397,
    gelTimeMin: 150,
    vitrificationTimeMin: 230,
    limits: [limit('maxOvershootC', 3, 10, true), limit('minFinalCure', 0.91, 0.9, true, ''), limit('maxCycleMin', 400, 420, true, 'min')],
    ...over,
  };
}

describe('metricDeltas', () => {
  it('gives B − A and the relative change for every figure', () => {
    const cmp = metricDeltas(summary(), summary({ peakOvershootC: 12.5, cycleMin: 360 }));
    expect(cmp.metrics.map((m) => m.key)).toEqual(METRICS.map((m) => m.key));
    const overshoot = cmp.metrics.find((m) => m.key === 'peakOvershootC')!;
    expect(overshoot).toMatchObject({ a: 3, b: 12.5, delta: 9.5, unit: '°C' });
    expect(overshoot.relative).toBeCloseTo(9.5 / 3, 12);
    const cycle = cmp.metrics.find((m) => m.key === 'cycleMin')!;
    expect(cycle).toMatchObject({ a: 400, b: 360, delta: -40, relative: -0.1 });
    const same = cmp.metrics.find((m) => m.key === 'finalTgC')!;
    expect(same.delta).toBe(0);
  });

  it('treats a negative gel or vitrification time as never reached, with no delta', () => {
    const cmp = metricDeltas(summary(), summary({ vitrificationTimeMin: -1 }));
    const vit = cmp.metrics.find((m) => m.key === 'vitrificationTimeMin')!;
    expect(vit).toMatchObject({ a: 230, b: null, delta: null, relative: null });
  });

  it('has no relative change when A is zero', () => {
    const cmp = metricDeltas(summary({ peakOvershootC: 0 }), summary({ peakOvershootC: 2 }));
    expect(cmp.metrics.find((m) => m.key === 'peakOvershootC')).toMatchObject({ delta: 2, relative: null });
  });

  it('marks limits that flip from pass to fail and from fail to pass, and counts them', () => {
    const a = summary({ limits: [limit('maxOvershootC', 3, 10, true), limit('minFinalCure', 0.88, 0.9, false, ''), limit('maxCycleMin', 400, 420, true, 'min')] });
    const b = summary({ limits: [limit('maxOvershootC', 12.5, 10, false), limit('minFinalCure', 0.93, 0.9, true, ''), limit('maxCycleMin', 410, 420, true, 'min')] });
    const cmp = metricDeltas(a, b);
    expect(cmp.limits.map((l) => [l.key, l.flip])).toEqual([
      ['maxOvershootC', 'now-fails'],
      ['minFinalCure', 'now-passes'],
      ['maxCycleMin', null],
    ]);
    expect(cmp.nowFail).toBe(1);
    expect(cmp.nowPass).toBe(1);
  });

  it('notes a limit whose own value changed, and keeps a limit only one side has without a flip', () => {
    const a = summary({ limits: [limit('maxOvershootC', 3, 10, true)] });
    const b = summary({ limits: [limit('maxOvershootC', 3, 2, false), limit('maxSpringInDeg', 1.1, 1.5, true, '°')] });
    const cmp = metricDeltas(a, b);
    expect(cmp.limits[0]).toMatchObject({ key: 'maxOvershootC', flip: 'now-fails', limitChanged: true });
    expect(cmp.limits[1]).toMatchObject({ key: 'maxSpringInDeg', a: null, flip: null, limitChanged: false });
  });
});
