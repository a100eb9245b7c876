import { Link } from 'react-router-dom';
import { CsvDownloadButton } from '../../../components/export/csv-download-button';
import { selectQuickLook, useResults } from '../stores/results-store';
import { selectDirty, studyEditorStore, useStudyEditor } from '../stores/study-editor-store';

const link = 'rounded border border-rule bg-paper-raised px-2 py-1 text-sm hover:bg-rule/40';

/** What the CSV says it holds, read when it is asked for: the params change with every edit, the button need not. */
function csvMeta() {
  const s = studyEditorStore.getState();
  return { study: s.meta!.name, revision: selectDirty(s) ? null : s.meta!.baseRevision, params: s.params! };
}

/**
 * Hand the results on: the CSV of what is on screen (unsaved edits included, and labelled so), and for a
 * saved revision the comparison with the part's baseline and the printable report. The CSV is always of a
 * full solve: while a drag's quick look is on screen it waits for the full one.
 */
export function WorkspaceExports() {
  const meta = useStudyEditor((s) => s.meta);
  const hasParams = useStudyEditor((s) => s.params !== null);
  const fullResult = useResults((s) => (s.accuracy === 'full' ? s.fullResult : null));
  const quickLook = useResults(selectQuickLook);
  const saved = meta && meta.baseRevision !== null && /^\d+$/.test(meta.studyId) ? `s${meta.studyId}r${meta.baseRevision}` : null;
  return (
    <>
      {meta && hasParams && (
        <CsvDownloadButton
          result={fullResult}
          label="CSV"
          className={`${link} disabled:opacity-40`}
          title={quickLook ? 'Waiting for the full solve: the CSV never holds a quick look' : undefined}
          meta={csvMeta}
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
