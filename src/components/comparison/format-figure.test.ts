import { describe, expect, it } from 'vitest';
import { formatChange, formatFigure, formatNumber } from './format-figure';

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
});
