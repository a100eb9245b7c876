import { ReportPage } from '../../features/report/components/report-page';

/** Lazy route module: /report?r=<ref>[&against=<ref>], outside the app shell so it prints as a document. */
export function Component() {
  return <ReportPage />;
}
