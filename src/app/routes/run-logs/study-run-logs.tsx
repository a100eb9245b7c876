import { StudyRunLogsPage } from '../../../features/run-logs/components/study-run-logs-page';

/** Lazy route module: /studies/:studyId/run-logs */
export function Component() {
  return <StudyRunLogsPage />;
}
