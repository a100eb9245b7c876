import { useEffect } from 'react';
import { studyEditorStore } from '../stores/study-editor-store';

/**
 * Ctrl+Z undoes, Ctrl+Shift+Z (or Ctrl+Y) redoes, anywhere in the workspace.
 * Every field commits into the study store as it is typed, so the store's
 * history is the one to walk; free-text fields (the save message) keep their own.
 */
export function useUndoKeys(): void {
  useEffect(() => {
    const onKeyDown = (e: KeyboardEvent) => {
      if (!(e.ctrlKey || e.metaKey) || e.altKey) return;
      const target = e.target as HTMLElement | null;
      if (target?.closest('[data-own-undo]')) return;
      const key = e.key.toLowerCase();
      if (key === 'z' && !e.shiftKey) {
        e.preventDefault();
        studyEditorStore.getState().undo();
      } else if ((key === 'z' && e.shiftKey) || key === 'y') {
        e.preventDefault();
        studyEditorStore.getState().redo();
      }
    };
    window.addEventListener('keydown', onKeyDown);
    return () => window.removeEventListener('keydown', onKeyDown);
  }, []);
}
