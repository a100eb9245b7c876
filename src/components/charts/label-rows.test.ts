import { describe, expect, it } from 'vitest';
import { labelRows, textWidthPx } from './label-rows';

describe('labelRows', () => {
  it('keeps labels far enough apart on one row', () => {
    expect(labelRows([{ x: 0, width: 50 }, { x: 100, width: 50 }, { x: 200, width: 50 }])).toEqual([0, 0, 0]);
  });

  it('moves a label that would overlap the one before it to the next row, and back up when there is room', () => {
    // gel of A at 100, gel of B at 120, vitrified of A at 300: B's label cannot sit beside A's
    expect(labelRows([{ x: 100, width: 60 }, { x: 120, width: 60 }, { x: 300, width: 60 }])).toEqual([0, 1, 0]);
  });

  it('works on labels given in any order', () => {
    expect(labelRows([{ x: 120, width: 60 }, { x: 100, width: 60 }, { x: 130, width: 60 }])).toEqual([1, 0, 2]);
  });

  it('estimates text width from its length and size', () => {
    expect(textWidthPx('gel 120 min', 10)).toBeCloseTo(11 * 5.8, 6);
  });
});
