import { describe, expect, it } from 'vitest';
import { referenceStudy } from '../../../../shared/solver/demo-cards';
import { describeCycleSteps, describeLayup, processRows } from './describe-study';

describe('report inputs in words', () => {
  it('summarises the reference layup: 24 plies × 0.19 mm = 4.56 mm (hand arithmetic)', () => {
    const { summary, sequence } = describeLayup(referenceStudy());
    expect(summary).toBe('24 plies × 0.19 mm, laminate 4.56 mm');
    expect(sequence.startsWith('0° / 45° / −45° / 90°')).toBe(true);
    expect(sequence.split(' / ')).toHaveLength(24);
  });

  it('lists the cycle as numbered steps with units', () => {
    expect(describeCycleSteps(referenceStudy())).toEqual([
      'Start at 20 °C',
      '1. ramp at 2 °C/min to 120 °C, 7 bar',
      '2. hold 90 min, 7 bar, clock starts when the lagging part point is within ±5 °C',
      '3. ramp at 1.5 °C/min to 180 °C, 7 bar',
      '4. hold 120 min, 7 bar, clock starts when the lagging part point is within ±5 °C',
      '5. cool at 2 °C/min to 60 °C, 7 bar',
    ]);
  });

  it('names the tool and the constraint', () => {
    const rows = Object.fromEntries(processRows(referenceStudy()));
    expect(rows['Tool']).toBe('Aluminium plate, 10 mm, CTE 23.6 µ/K, conductivity 167 W/(m·K)');
    expect(rows['Part constraint']).toBe('held flat on the tool until demould, then released');
  });
});
