import { describe, expect, it } from 'vitest';
import { referenceStudy } from '../../../../shared/solver/demo-cards';
import { describeCycleSteps, describeLayup, processRows, resinRows } from './describe-study';

describe('report inputs in words', () => {
  it('summarises the reference layup: 24 plies × 0.19 mm = 4.56 mm (hand arithmetic)', () => {
    const { summary, sequence } = describeLayup(referenceStudy());
    expect(summary).toBe('24 plies × 0.19 mm, laminate 4.56 mm');
    expect(sequence.startsWith('0° / 45° / −45° / 90°')).toBe(true);
    expect(sequence.split(' / ')).toHaveLength(24);
  });

  it('lists the cycle with the segment names of the cycle editor, with units', () => {
    expect(describeCycleSteps(referenceStudy())).toEqual([
      'Start at 20 °C',
      'Ramp 1: 2 °C/min to 120 °C, 7 bar',
      'Dwell 1: 90 min, 7 bar, starts when the coldest point is in band (±5 °C)',
      'Ramp 2: 1.5 °C/min to 180 °C, 7 bar',
      'Dwell 2: 120 min, 7 bar, starts when the coldest point is in band (±5 °C)',
      'Cool 1: 2 °C/min to 60 °C, 7 bar',
    ]);
  });

  it('names the kinetics form by its published name, not the card’s code key', () => {
    const kinetics = Object.fromEntries(resinRows(referenceStudy()))['Kinetics'];
    expect(kinetics).toMatch(/^(nth order|Kamal–Sourour|Lee–Loos–Springer): /);
    expect(kinetics).not.toMatch(/kamal-sourour|nth-order|lee-loos-springer/);
  });

  it('names the tool and the constraint', () => {
    const rows = Object.fromEntries(processRows(referenceStudy()));
    expect(rows['Tool']).toBe('Aluminium plate, 10 mm, CTE 23.6 µ/K, conductivity 167 W/(m·K)');
    expect(rows['Part constraint']).toBe('held flat on the tool until demould, then released');
  });
});
