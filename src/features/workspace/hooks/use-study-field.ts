import { useCallback } from 'react';
import type { Draft } from 'immer';
import type { StudyParams } from '../../../../shared/schemas/study';
import { issueAt, issuesUnder } from '../model/study-validation';
import { useStudyEditor } from '../stores/study-editor-store';

/** The schema's reason the field at `path` is not accepted, if any. */
export function useIssue(path: string): string | undefined {
  return useStudyEditor((s) => (s.params ? issueAt(s.params, path) : undefined));
}

export function useIssueCount(prefix: string): number {
  return useStudyEditor((s) => (s.params ? issuesUnder(s.params, prefix).length : 0));
}

/** An edit function for one field; typing into the same field folds into one undo step. */
export function useFieldEdit(path: string, label: string) {
  const edit = useStudyEditor((s) => s.edit);
  return useCallback(
    (recipe: (draft: Draft<StudyParams>) => void) => edit(label, recipe, { coalesceKey: path }),
    [edit, label, path],
  );
}
