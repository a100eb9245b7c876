import { StudyHistoryPage } from '../../../features/library/components/study-history-page';

/** Lazy route module: /studies/:studyId/history */
export function Component() {
  return <StudyHistoryPage />;
}
