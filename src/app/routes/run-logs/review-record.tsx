import { ReviewRecordPage } from '../../../features/run-logs/components/review-record-page';

/** Lazy route module: /run-logs/:runLogId/record */
export function Component() {
  return <ReviewRecordPage />;
}
