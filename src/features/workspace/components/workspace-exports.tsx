import { Link } from 'react-router-dom';
import { CsvDownloadButton } from '../../../components/export/csv-download-button';
import { useResults } from '../stores/results-store';
import { selectDirty, useStudyEditor } from '../stores/study-editor-store';

const link = 'rounded border border-rule bg-paper-raised px-2 py-1 text-sm hover:bg-rule/40';

/**
 * Hand the results on: the CSV of what is on screen (unsaved edits included, and labelled so), and for a
 * saved revision the comparison with the part's baseline and the printable report.
 */
export function WorkspaceExports() {
  const meta = useStudyEditor((s) => s.meta);
  const params = useStudyEditor((s) => s.params);
  const dirty = useStudyEditor(selectDirty);
  const result = useResults((s) => s.result);
  const saved = meta && meta.baseRevision !== null && /^\d+$/.test(meta.studyId) ? `s${meta.studyId}r${meta.baseRevision}` : null;
  return (
    <>
      {meta && params && (
        <CsvDownloadButton
          result={result}
          label="CSV"
          className={`${link} disabled:opacity-40`}
          meta={{ study: meta.name, revision: dirty ? null : meta.baseRevision, params }}
        />
      )}
      {saved && (
        <>
          <Link className={link} to={`/compare?b=${saved}`} title={`Compare revision ${meta!.baseRevision} with the part's baseline`}>
            Compare with baseline
          </Link>
          <Link className={link} to={`/report?r=${saved}`} title={`Printable report of revision ${meta!.baseRevision}`}>
            Report
          </Link>
        </>
      )}
    </>
  );
}
