import { describe, expect, it } from 'vitest';
import { referenceStudy } from '../../../../shared/solver/demo-cards';
import type { StudyParams } from '../../../../shared/schemas/study';
import { createStudyEditorStore, selectDirty } from './study-editor-store';

const meta = { studyId: '7', name: 'Panel', baseRevision: 3 };

function loaded(clock = { t: 0 }) {
  const store = createStudyEditorStore(() => clock.t);
  store.getState().load(meta, referenceStudy());
  return store;
}

const snapshot = (p: StudyParams | null) => structuredClone(p);
const segs = (p: StudyParams | null) => (p!.cycle.kind === 'segments' ? p!.cycle.segments : []);

describe('study editor store', () => {
  it('undo walks back through every edit to the exact loaded state, and redo walks forward again', () => {
    const store = loaded();
    const states = [snapshot(store.getState().params)];
    const { edit } = store.getState();
    edit('ramp', (d) => {
      if (d.cycle.kind === 'segments' && d.cycle.segments[0].kind === 'ramp') d.cycle.segments[0].rateCPerMin = 1.5;
    });
    states.push(snapshot(store.getState().params));
    edit('plies', (d) => void d.layup.plies.splice(0, 2));
    states.push(snapshot(store.getState().params));
    edit('limit', (d) => void (d.limits.maxWarpageMm = 0.4));
    states.push(snapshot(store.getState().params));
    edit('tool', (d) => void (d.tool = { kind: 'none' }));
    states.push(snapshot(store.getState().params));

    for (let i = states.length - 2; i >= 0; i--) {
      store.getState().undo();
      expect(store.getState().params).toEqual(states[i]);
    }
    // Nothing left to undo: another undo changes nothing.
    store.getState().undo();
    expect(store.getState().params).toEqual(states[0]);
    for (let i = 1; i < states.length; i++) {
      store.getState().redo();
      expect(store.getState().params).toEqual(states[i]);
    }
  });

  it('never mutates a state it has handed out', () => {
    const store = loaded();
    const before = store.getState().params!;
    const copy = snapshot(before);
    store.getState().edit('hold', (d) => {
      const s = d.cycle.kind === 'segments' ? d.cycle.segments[1] : null;
      if (s?.kind === 'hold') s.holdMin = 45;
    });
    store.getState().undo();
    expect(before).toEqual(copy);
  });

  it('folds a drag gesture into one undo step', () => {
    const store = loaded();
    const start = snapshot(store.getState().params);
    for (const minutes of [61, 65, 70, 90]) {
      store.getState().edit(
        `Dwell 1 length ${minutes} min`,
        (d) => {
          const s = d.cycle.kind === 'segments' ? d.cycle.segments[1] : null;
          if (s?.kind === 'hold') s.holdMin = minutes;
        },
        { coalesceKey: 'drag-1', gesture: true },
      );
    }
    expect(store.getState().past).toHaveLength(1);
    expect(segs(store.getState().params)[1]).toMatchObject({ holdMin: 90 });
    store.getState().undo();
    expect(store.getState().params).toEqual(start);
  });

  it('folds typing into one field only within a second of the last keystroke', () => {
    const clock = { t: 0 };
    const store = loaded(clock);
    const type = (v: number) =>
      store.getState().edit('span', (d) => void (d.geometry.stripSpanMm = v), { coalesceKey: 'geometry.stripSpanMm' });
    type(3);
    clock.t = 300;
    type(30);
    clock.t = 2000;
    type(300);
    expect(store.getState().past).toHaveLength(2);
  });

  it('a new edit after undo drops the redo branch', () => {
    const store = loaded();
    store.getState().edit('a', (d) => void (d.geometry.cornerAngleDeg = 80));
    store.getState().undo();
    store.getState().edit('b', (d) => void (d.geometry.cornerAngleDeg = 100));
    expect(store.getState().future).toHaveLength(0);
    store.getState().redo();
    expect(store.getState().params!.geometry.cornerAngleDeg).toBe(100);
  });

  it('marks unsaved changes, clears them on save, and is clean again when undo returns to the saved state', () => {
    const store = loaded();
    expect(selectDirty(store.getState())).toBe(false);
    store.getState().edit('a', (d) => void (d.geometry.cornerAngleDeg = 80));
    expect(selectDirty(store.getState())).toBe(true);
    store.getState().undo();
    expect(selectDirty(store.getState())).toBe(false);
    store.getState().edit('b', (d) => void (d.geometry.cornerAngleDeg = 75), { coalesceKey: 'corner' });
    store.getState().markSaved(4);
    expect(selectDirty(store.getState())).toBe(false);
    expect(store.getState().meta?.baseRevision).toBe(4);
    // Typing on in the same field after a save is a new step: one undo returns to exactly what was saved.
    store.getState().edit('c', (d) => void (d.geometry.cornerAngleDeg = 70), { coalesceKey: 'corner' });
    expect(selectDirty(store.getState())).toBe(true);
    store.getState().undo();
    expect(store.getState().params!.geometry.cornerAngleDeg).toBe(75);
    expect(selectDirty(store.getState())).toBe(false);
  });

  it('an edit that changes nothing leaves no undo step', () => {
    const store = loaded();
    const angle = store.getState().params!.geometry.cornerAngleDeg;
    store.getState().edit('same', (d) => void (d.geometry.cornerAngleDeg = angle));
    expect(store.getState().past).toHaveLength(0);
  });

  it('refuses every edit of an earlier revision opened read-only', () => {
    const store = createStudyEditorStore();
    store.getState().load({ studyId: 's', name: 'n', baseRevision: 2, readOnly: true }, referenceStudy());
    const before = store.getState().params;
    store.getState().edit('a', (d) => void (d.geometry.cornerAngleDeg = 80));
    expect(store.getState().params).toBe(before);
    expect(store.getState().past).toHaveLength(0);
  });

  it('an edit its check refuses changes nothing and says why; an accepted one is kept', () => {
    const store = loaded();
    const before = store.getState().params;
    const seen: number[] = [];
    const refusal = store.getState().edit('limit', (d) => void (d.limits.maxWarpageMm = -1), {
      refuse: (next, current) => {
        seen.push(next.limits.maxWarpageMm, current.limits.maxWarpageMm);
        return 'no negative warpage';
      },
    });
    expect(refusal).toBe('no negative warpage');
    expect(seen).toEqual([-1, before!.limits.maxWarpageMm]);
    expect(store.getState().params).toBe(before);
    expect(store.getState().past).toHaveLength(0);
    expect(selectDirty(store.getState())).toBe(false);

    expect(store.getState().edit('limit', (d) => void (d.limits.maxWarpageMm = 0.4), { refuse: () => null })).toBeNull();
    expect(store.getState().params!.limits.maxWarpageMm).toBe(0.4);
    expect(store.getState().past).toHaveLength(1);
  });

  it('the drawn study follows every edit, undo and redo, except while held, and catches up when shown or released', () => {
    const store = loaded();
    const { edit } = store.getState();
    const widen = (deg: number) => edit('corner', (d) => void (d.geometry.cornerAngleDeg = deg));
    widen(80);
    expect(store.getState().shown).toBe(store.getState().params);

    store.getState().setHoldShown(true);
    const drawn = store.getState().shown;
    widen(70);
    store.getState().undo();
    store.getState().redo();
    expect(store.getState().params!.geometry.cornerAngleDeg).toBe(70);
    expect(store.getState().shown).toBe(drawn);
    expect(store.getState().shown!.geometry.cornerAngleDeg).toBe(80);

    store.getState().showLatest();
    expect(store.getState().shown).toBe(store.getState().params);
    widen(60);
    expect(store.getState().shown!.geometry.cornerAngleDeg).toBe(70);
    store.getState().setHoldShown(false);
    expect(store.getState().shown).toBe(store.getState().params);
    widen(50);
    expect(store.getState().shown!.geometry.cornerAngleDeg).toBe(50);

    // Loading another study draws it at once and lets go of any hold.
    store.getState().setHoldShown(true);
    store.getState().load(meta, referenceStudy());
    expect(store.getState().holdShown).toBe(false);
    expect(store.getState().shown).toBe(store.getState().params);
  });
});
