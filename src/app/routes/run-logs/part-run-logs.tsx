import { PartRunLogsPage } from '../../../features/run-logs/components/part-run-logs-page';

/** Lazy route module: /parts/:partId/run-logs */
export function Component() {
  return <PartRunLogsPage />;
}
