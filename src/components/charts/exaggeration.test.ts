import { describe, expect, it } from 'vitest';
import { defaultExaggeration, niceFactorBelow } from './exaggeration';

describe('exaggeration', () => {
  it('rounds down to 1, 2 or 5 times a power of ten', () => {
    expect(niceFactorBelow(0.5)).toBe(1);
    expect(niceFactorBelow(3.9)).toBe(2);
    expect(niceFactorBelow(27)).toBe(20);
    expect(niceFactorBelow(620)).toBe(500);
  });

  it('lets the shape that needs less exaggeration decide, so neither is drawn past sense', () => {
    // Spring-in 1° wants ×25 for a 25° closure; a 0.07 mm bow at 1 px/mm would want ×357.
    expect(defaultExaggeration(0.07, 1, 1)).toBe(20);
    // A flat part with a sharp spring-in: the corner decides.
    expect(defaultExaggeration(0, 5, 1)).toBe(5);
    // Nothing to show: drawn true to scale.
    expect(defaultExaggeration(0, 0, 1)).toBe(1);
  });
});
