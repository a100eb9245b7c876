import { describe, expect, it } from 'vitest';
import { auditSentence } from './audit-sentence';

describe('audit sentences', () => {
  it('say what a pin replaced, by name', () => {
    const text = auditSentence({
      action: 'baseline.pin',
      details: { studyTitle: 'Study X', number: 2, partNumber: 'TB-1', partName: 'Part Y', previous: { revisionId: 4, studyTitle: 'Study Z', number: 1 } },
    });
    expect(text).toBe('pinned “Study X” r2 as baseline of TB-1 · Part Y (was “Study Z” r1)');
  });

  it('say a first pin replaced nothing', () => {
    expect(auditSentence({ action: 'baseline.pin', details: { studyTitle: 'S', number: 1, partName: 'P', previous: { revisionId: null } } })).toBe(
      'pinned “S” r1 as baseline of P (none pinned before)',
    );
  });

  it('name the member whose role changed', () => {
    expect(auditSentence({ action: 'member.role', details: { userName: 'Nell Hire', from: 'viewer', to: 'engineer' } })).toBe(
      "changed Nell Hire's role from viewer to engineer",
    );
  });

  it('look up a study title when the writer stored only its id', () => {
    const text = auditSentence({ action: 'review.decide', details: { runLogId: 7, studyId: 3, decision: 'use-as-is' } }, { studyTitle: (id) => (id === 3 ? 'Panel cycle' : undefined) });
    expect(text).toBe('decided use as is on run log 7 of “Panel cycle”');
  });

  it('fall back to the id when no name is known', () => {
    expect(auditSentence({ action: 'revision.save', details: { studyId: 9, number: 4 } })).toBe('saved study 9 r4');
  });
});
