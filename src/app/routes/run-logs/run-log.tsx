import { RunLogPage } from '../../../features/run-logs/components/run-log-page';

/** Lazy route module: /run-logs/:runLogId */
export function Component() {
  return <RunLogPage />;
}
