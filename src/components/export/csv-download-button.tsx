import { csvFileName, resultsToCsv, type CsvMeta, type CsvResult } from '../../../shared/export/results-csv';
import { downloadText } from '../../lib/chart-export';

/** Downloads a run's histories, final ply stresses and limit verdicts as one CSV file. */
export function CsvDownloadButton({
  result,
  meta,
  label = 'Download CSV',
  className,
}: {
  result: CsvResult | null | undefined;
  meta: Omit<CsvMeta, 'exportedAt'>;
  label?: string;
  className?: string;
}) {
  return (
    <button
      type="button"
      disabled={!result}
      className={
        className ??
        'rounded border border-rule bg-paper-raised px-2 py-1 text-xs font-medium text-ink hover:bg-rule/40 disabled:opacity-50 print:hidden'
      }
      onClick={() => {
        if (!result) return;
        const csv = resultsToCsv(result, { ...meta, exportedAt: new Date() });
        downloadText(csv, csvFileName(meta.study, meta.revision, meta.revisionLabel ? 'demo' : 'unsaved'), 'text/csv;charset=utf-8');
      }}
    >
      {label}
    </button>
  );
}
