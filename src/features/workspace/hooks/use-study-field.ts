import { issueAt, issuesUnder } from '../model/study-validation';
import { useStudyEditor } from '../stores/study-editor-store';

/** The schema's reason the field at `path` is not accepted, if any. */
export function useIssue(path: string): string | undefined {
  return useStudyEditor((s) => (s.params ? issueAt(s.params, path) : undefined));
}

export function useIssueCount(prefix: string): number {
  return useStudyEditor((s) => (s.params ? issuesUnder(s.params, prefix).length : 0));
}
