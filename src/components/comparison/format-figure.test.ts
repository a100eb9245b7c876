import { describe, expect, it } from 'vitest';
import { changeShows, formatChange, formatChangeBetween, formatFigure, formatLimit, formatNumber } from './format-figure';

describe('figure formatting', () => {
  it('shows figures with the decimals of their unit', () => {
    expect(formatFigure(182.44, '°C')).toBe('182.4 °C');
    expect(formatFigure(0.91234, '')).toBe('0.912');
    expect(formatFigure(1.234, '°')).toBe('1.23°');
    expect(formatFigure(-0.5, 'mm')).toBe('−0.500 mm');
    expect(formatFigure(null, 'min')).toBe('not reached');
    expect(formatNumber(-2.219, '°C/min')).toBe('−2.22');
  });

  it('signs changes and calls a change too small to show ±0', () => {
    expect(formatChange(3.14, '°C')).toBe('+3.1 °C');
    expect(formatChange(-0.0123, '')).toBe('−0.012');
    expect(formatChange(0.2, 'min')).toBe('±0 min');
    expect(formatChange(null, 'min')).toBe('—');
  });

  it('takes a change from the figures as written, so A, B and B − A agree on screen', () => {
    // Written 0.948 and 0.950: the reader subtracts 0.002, though the unrounded change is 0.00102 ("+0.001").
    expect(formatFigure(0.94849, '')).toBe('0.948');
    expect(formatFigure(0.94951, '')).toBe('0.950');
    expect(formatChange(0.94951 - 0.94849, '')).toBe('+0.001');
    expect(formatChangeBetween(0.94849, 0.94951, '')).toBe('+0.002');
    expect(formatChangeBetween(0.95, 0.948, '')).toBe('−0.002');
    // both written 182.4 °C: no change shows
    expect(formatChangeBetween(182.44, 182.36, '°C')).toBe('±0.0 °C');
    expect(changeShows(182.44, 182.36, '°C')).toBe(false);
    expect(formatChangeBetween(null, 3, 'min')).toBe('—');
  });

  it('writes a limit with its direction and the precision of its unit', () => {
    expect(formatLimit('minFinalCure', 0.9, '')).toBe('≥ 0.900');
    expect(formatLimit('maxOvershootC', 10, '°C')).toBe('≤ 10.0 °C');
    expect(formatLimit('maxSpringInDeg', 1.5, '°')).toBe('≤ 1.50°');
  });
});
