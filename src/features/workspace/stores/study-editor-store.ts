/**
 * The study being edited, with undo/redo of every edit.
 *
 * Each edit is an immer recipe; `produceWithPatches` gives the forward and
 * inverse patches, which are all the history keeps. Consecutive edits with the
 * same coalesce key (one drag, one field being typed into) fold into a single
 * undo step. Results never live here: they carry typed arrays, which immer does
 * not draft (see results-store.ts).
 */
import { applyPatches, enablePatches, produceWithPatches, type Draft, type Patch } from 'immer';
import { createStore, useStore } from 'zustand';
import type { StudyParams } from '../../../../shared/schemas/study';
import { markInput } from '../perf/input-latency';

enablePatches();

type HistoryEntry = {
  id: number;
  label: string;
  coalesceKey: string | null;
  at: number;
  patches: Patch[];
  inverse: Patch[];
};

export type StudyMeta = {
  studyId: string;
  name: string;
  /** the revision this edit session started from; the base of the next save (null: never saved) */
  baseRevision: number | null;
  /** an earlier revision opened to look at: edits are refused (restore it as a new revision to change it) */
  readOnly?: boolean;
};

export type EditOptions = {
  /** edits with the same key in a row fold into one undo step (within `coalesceMs`, or always for drags) */
  coalesceKey?: string;
  /** fold regardless of elapsed time (a drag gesture) */
  gesture?: boolean;
  /** why the edited study must not be kept (null: keep it); asked before anything changes */
  refuse?: (next: StudyParams, current: StudyParams) => string | null;
  /** when the input behind the edit happened (its event's timeStamp), for the input-to-paint measure; default now */
  inputAt?: number;
};

export type StudyEditorState = {
  meta: StudyMeta | null;
  params: StudyParams | null;
  past: HistoryEntry[];
  future: HistoryEntry[];
  /** id of the history entry the current params correspond to (0: as loaded) */
  headId: number;
  /** headId when last loaded or saved; differing means unsaved changes */
  savedId: number;
  /** sequence number of the last input, for the input-to-paint measure */
  inputSeq: number;
  /**
   * The study as the cycle views draw it (the line editor, the segment table, the time axis): `params`, except
   * while `holdShown` is set. A drag sets it: each step's edit then waits for `showLatest()`, which the live
   * solve calls when the quick look of that edit lands (or a frame has passed without one), so the drawn set
   * point and the curves solved for it change in the same frame. Edits, undo and history read `params`.
   */
  shown: StudyParams | null;
  holdShown: boolean;
};

export type StudyEditorActions = {
  load: (meta: StudyMeta, params: StudyParams) => void;
  /** Applies the edit; returns why it was refused (options.refuse), else null. */
  edit: (label: string, recipe: (draft: Draft<StudyParams>) => void, options?: EditOptions) => string | null;
  undo: () => void;
  redo: () => void;
  markSaved: (revision: number) => void;
  /** Hold `shown` back from later edits (true), or let it follow them again, catching up at once (false). */
  setHoldShown: (hold: boolean) => void;
  /** Draw the latest edit now. */
  showLatest: () => void;
};

export type StudyEditorStore = ReturnType<typeof createStudyEditorStore>;

const COALESCE_MS = 1000;

/** New params, and the drawn study with them unless it is held. */
const withParams = (s: StudyEditorState, params: StudyParams) => (s.holdShown ? { params } : { params, shown: params });

export function createStudyEditorStore(now: () => number = () => Date.now()) {
  let nextId = 1;
  return createStore<StudyEditorState & StudyEditorActions>()((set, get) => ({
    meta: null,
    params: null,
    past: [],
    future: [],
    headId: 0,
    savedId: 0,
    inputSeq: 0,
    shown: null,
    holdShown: false,

    load(meta, params) {
      set({ meta, params, shown: params, holdShown: false, past: [], future: [], headId: 0, savedId: 0 });
    },

    edit(label, recipe, options = {}) {
      const inputAt = options.inputAt ?? (typeof performance === 'undefined' ? undefined : performance.now());
      const state = get();
      const { meta, params, past, savedId } = state;
      if (!params || meta?.readOnly) return null;
      const [next, patches, inverse] = produceWithPatches(params, recipe);
      if (patches.length === 0) return null;
      const refusal = options.refuse?.(next, params) ?? null;
      if (refusal !== null) return refusal;
      const inputSeq = markInput(inputAt);
      const top = past[past.length - 1];
      const key = options.coalesceKey ?? null;
      const t = now();
      const fold =
        key !== null &&
        top !== undefined &&
        top.coalesceKey === key &&
        top.id !== savedId &&
        (options.gesture || t - top.at < COALESCE_MS);
      if (fold) {
        const merged: HistoryEntry = {
          ...top,
          id: nextId++,
          at: t,
          patches: [...top.patches, ...patches],
          inverse: [...inverse, ...top.inverse],
        };
        set({ ...withParams(state, next), past: [...past.slice(0, -1), merged], future: [], headId: merged.id, inputSeq });
      } else {
        const entry: HistoryEntry = { id: nextId++, label, coalesceKey: key, at: t, patches, inverse };
        set({ ...withParams(state, next), past: [...past, entry], future: [], headId: entry.id, inputSeq });
      }
      return null;
    },

    undo() {
      const state = get();
      const { params, past, future } = state;
      const top = past[past.length - 1];
      if (!params || !top) return;
      const rest = past.slice(0, -1);
      set({
        ...withParams(state, applyPatches(params, top.inverse)),
        past: rest,
        future: [top, ...future],
        headId: rest.length ? rest[rest.length - 1].id : 0,
        inputSeq: markInput(),
      });
    },

    redo() {
      const state = get();
      const { params, past, future } = state;
      const first = future[0];
      if (!params || !first) return;
      set({
        ...withParams(state, applyPatches(params, first.patches)),
        past: [...past, { ...first, coalesceKey: null }],
        future: future.slice(1),
        headId: first.id,
        inputSeq: markInput(),
      });
    },

    markSaved(revision) {
      const { meta, headId } = get();
      set({ savedId: headId, meta: meta ? { ...meta, baseRevision: revision } : meta });
    },

    setHoldShown(hold) {
      set(hold ? { holdShown: true } : { holdShown: false, shown: get().params });
    },

    showLatest() {
      const { params, shown } = get();
      if (shown !== params) set({ shown: params });
    },
  }));
}

/** The workspace's editor (one study open at a time). */
export const studyEditorStore = createStudyEditorStore();

export function useStudyEditor<T>(selector: (state: StudyEditorState & StudyEditorActions) => T): T {
  return useStore(studyEditorStore, selector);
}

export const selectDirty = (s: StudyEditorState) => s.headId !== s.savedId;
export const selectCanUndo = (s: StudyEditorState) => s.past.length > 0;
export const selectCanRedo = (s: StudyEditorState) => s.future.length > 0;
export const selectUndoLabel = (s: StudyEditorState) => s.past[s.past.length - 1]?.label ?? null;
export const selectRedoLabel = (s: StudyEditorState) => s.future[0]?.label ?? null;
