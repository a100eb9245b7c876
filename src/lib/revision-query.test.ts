import { describe, expect, it } from 'vitest';
import { formatRevisionRef, parseRevisionRef } from './revision-query';

describe('revision references', () => {
  it('reads a library reference as study and revision number, and writes it back the same', () => {
    expect(parseRevisionRef('s12r3')).toEqual({ source: 'library', studyId: 12, number: 3 });
    expect(formatRevisionRef({ source: 'library', studyId: 12, number: 3 })).toBe('s12r3');
  });

  it('reads a demo reference', () => {
    expect(parseRevisionRef('demo2')).toEqual({ source: 'demo', index: 2 });
    expect(formatRevisionRef({ source: 'demo', index: 2 })).toBe('demo2');
  });

  it('refuses anything else', () => {
    for (const bad of ['', '12', 's12', 'r3', 's-1r2', 's1r2x', 'demo', 'demo123', null, undefined]) {
      expect(parseRevisionRef(bad)).toBeNull();
    }
  });
});
