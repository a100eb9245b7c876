import { csvFileName, resultsToCsv, type CsvMeta, type CsvResult } from '../../../shared/export/results-csv';
import { downloadText } from '../../lib/chart-export';

type Meta = Omit<CsvMeta, 'exportedAt'>;

/** Downloads a run's histories, final ply stresses and limit verdicts as one CSV file. */
export function CsvDownloadButton({
  result,
  meta,
  label = 'Download CSV',
  title,
  className,
}: {
  result: CsvResult | null | undefined;
  /** what the file says it is; a function is read when the button is pressed (a live editor's params) */
  meta: Meta | (() => Meta);
  label?: string;
  title?: string;
  className?: string;
}) {
  return (
    <button
      type="button"
      disabled={!result}
      title={title}
      className={
        className ??
        'rounded border border-rule bg-paper-raised px-2 py-1 text-xs font-medium text-ink hover:bg-rule/40 disabled:opacity-50 print:hidden'
      }
      onClick={() => {
        if (!result) return;
        const m = typeof meta === 'function' ? meta() : meta;
        const csv = resultsToCsv(result, { ...m, exportedAt: new Date() });
        downloadText(csv, csvFileName(m.study, m.revision, m.revisionLabel ? 'demo' : 'unsaved'), 'text/csv;charset=utf-8');
      }}
    >
      {label}
    </button>
  );
}
