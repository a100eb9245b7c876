import { describe, expect, it } from 'vitest';
import { formatSignificant } from './format';

describe('formatSignificant', () => {
  it('keeps three significant digits for small and large values', () => {
    expect(formatSignificant(0.073124)).toBe('0.0731');
    expect(formatSignificant(0.98)).toBe('0.980');
    expect(formatSignificant(12.345)).toBe('12.3');
    expect(formatSignificant(1234.5)).toBe('1235');
  });
  it('shows no minus sign on a value that rounds to zero and a dash for non-numbers', () => {
    expect(formatSignificant(-0.00001, 1)).toBe('-0.00001');
    expect(formatSignificant(-1e-12)).toBe('0.00000000');
    expect(formatSignificant(0)).toBe('0');
    expect(formatSignificant(Number.NaN)).toBe('–');
  });
});
