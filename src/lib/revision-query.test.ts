import { describe, expect, it } from 'vitest';
import { ApiError } from './api-client';
import { formatRevisionRef, needsSignIn, parseRevisionRef, revisionErrorText } from './revision-query';

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

describe('revision errors', () => {
  it('say what to do for a missing session, a foreign team and a missing revision, and offer sign-in only for the first', () => {
    const unauthorised = new ApiError(401, 'unauthorised', null);
    expect(revisionErrorText(unauthorised)).toBe('Sign in to read revisions from the team library.');
    expect(needsSignIn(unauthorised)).toBe(true);
    const forbidden = new ApiError(403, 'forbidden', null);
    expect(revisionErrorText(forbidden)).toBe('You are not a member of the team that owns this study.');
    expect(needsSignIn(forbidden)).toBe(false);
    expect(revisionErrorText(new ApiError(404, 'revision 9 of study 3', null))).toBe('Not found: revision 9 of study 3');
    expect(revisionErrorText(new Error('worker stopped'))).toBe('worker stopped');
  });
});
