import { describe, expect, it } from 'vitest';
import { referenceStudy } from '../solver/demo-cards';
import { expectClose } from '../solver/test-support/expect-close';
import { replayInput, ReplayInputError } from './replay';
import { makeLog, minutes, profile } from './test-support/make-log';

const T = minutes(600);
const AIR = profile(T, [
  [0, 20],
  [80, 180],
  [500, 180],
  [553, 20],
]);

function log(air = AIR, extra: { role: 'tool' | 'pressure'; label: string; values: number[] }[] = []) {
  return makeLog({ timeMin: T, channels: [{ role: 'air', label: 'Air', values: air }, ...extra] });
}

describe('replayInput', () => {
  it('puts the measured air, tool and pressure in place of the cycle', () => {
    const params = replayInput(
      log(AIR, [
        { role: 'tool', label: 'Tool', values: AIR.map((v) => v - 3) },
        { role: 'pressure', label: 'Pressure', values: T.map(() => 7) },
      ]),
      referenceStudy(),
    );
    expect(params.cycle.kind).toBe('record');
    if (params.cycle.kind !== 'record') return;
    expect(params.cycle.points).toHaveLength(T.length);
    expect(params.cycle.points[40]).toEqual({ timeMin: 40, airC: 100, toolC: 97, pressureBar: 7 });
    // everything else is the study's
    expect(params.layup).toEqual(referenceStudy().layup);
  });

  it('resamples a long log onto a uniform grid without losing the shape', () => {
    const params = replayInput(log(), referenceStudy(), { maxPoints: 101 });
    if (params.cycle.kind !== 'record') throw new Error('expected a record cycle');
    expect(params.cycle.points).toHaveLength(101);
    expect(params.cycle.points[100].timeMin).toBe(600);
    // 600/100 = 6 min per point; at 48 min the air is 20 + 2·48 = 116 °C
    expectClose(params.cycle.points[8].airC, 116, 1e-9);
  });

  it('bridges missing air readings by interpolation', () => {
    const air = AIR.map((v, i) => (i >= 30 && i <= 50 ? NaN : v));
    const params = replayInput(log(air), referenceStudy());
    if (params.cycle.kind !== 'record') throw new Error('expected a record cycle');
    expectClose(params.cycle.points[40].airC, 100, 1e-9);
  });

  it('refuses to replay without a usable air channel', () => {
    expect(() => replayInput(log(), referenceStudy(), { excluded: ['air'] })).toThrow(ReplayInputError);
    expect(() => replayInput(log(AIR.map(() => NaN)), referenceStudy())).toThrow('the air channel has no usable reading');
  });
});
