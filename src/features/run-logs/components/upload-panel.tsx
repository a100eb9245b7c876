import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import type { RunLogInspection, RunLogMapping } from '../../../../shared/run-log/index';
import { MAX_RUN_LOG_BYTES } from '../../../../shared/run-log/limits';
import { inspectRunLogLocally, refusalOf, runLogKeys, uploadRunLog, type Refusal } from '../api/run-logs-api';
import { RunLogParseError } from '../../../../shared/run-log/run-log-error';
import { MappingStep, mappingProblems } from './mapping-step';
import { uploadWarnings } from '../../../../shared/run-log/upload-warnings';

type Stage =
  | { kind: 'pick' }
  | { kind: 'inspecting' }
  | { kind: 'mapping'; inspection: RunLogInspection; mapping: RunLogMapping; confirmed: boolean }
  | { kind: 'uploading'; sent: number }
  | { kind: 'analysing' };

/** Upload: pick a file, confirm the column mapping, send it with progress; refusals name line and column. */
export function UploadPanel({ studyId }: { studyId: string }) {
  const [file, setFile] = useState<File | null>(null);
  const [stage, setStage] = useState<Stage>({ kind: 'pick' });
  const [problem, setProblem] = useState<{ message: string; refusal: Refusal | null } | null>(null);
  const navigate = useNavigate();
  const queryClient = useQueryClient();

  async function pick(f: File | null) {
    setFile(f);
    setProblem(null);
    if (!f) return setStage({ kind: 'pick' });
    if (f.size > MAX_RUN_LOG_BYTES) {
      setStage({ kind: 'pick' });
      return setProblem({ message: `The file is ${(f.size / 1048576).toFixed(1)} MB: allowed ≤ 50 MB.`, refusal: null });
    }
    setStage({ kind: 'inspecting' });
    try {
      const inspection = await inspectRunLogLocally(f);
      setStage({ kind: 'mapping', inspection, mapping: inspection.mapping, confirmed: false });
    } catch (e) {
      setStage({ kind: 'pick' });
      setProblem(
        e instanceof RunLogParseError
          ? { message: `The run log was refused: ${e.message}`, refusal: { error: e.message, line: e.line, column: e.column, reason: e.reason } }
          : { message: (e as Error).message, refusal: refusalOf(e) },
      );
    }
  }

  async function send(mapping: RunLogMapping) {
    if (!file) return;
    setProblem(null);
    setStage({ kind: 'uploading', sent: 0 });
    try {
      const created = await uploadRunLog(studyId, file, mapping, (sent) => setStage(sent >= 1 ? { kind: 'analysing' } : { kind: 'uploading', sent }));
      await queryClient.invalidateQueries({ queryKey: runLogKeys.all });
      navigate(`/run-logs/${created.id}`);
    } catch (e) {
      const inspection = stage.kind === 'mapping' ? stage.inspection : null;
      setStage(inspection ? { kind: 'mapping', inspection, mapping, confirmed: true } : { kind: 'pick' });
      setProblem({ message: (e as Error).message, refusal: refusalOf(e) });
    }
  }

  const warnings = stage.kind === 'mapping' ? uploadWarnings(stage.inspection, stage.mapping) : [];
  return (
    <section className="rounded border border-rule bg-paper-raised p-4" data-testid="upload-panel">
      <h2 className="text-sm font-semibold uppercase tracking-wide text-ink-soft">Upload a run log</h2>
      <p className="mt-1 text-sm text-ink-soft">A CSV, TSV or text export of the autoclave or oven record, up to 50 MB and one million rows.</p>
      <input
        className="mt-2 block text-sm"
        type="file"
        accept=".csv,.tsv,.txt,.log,.dat,text/csv,text/plain"
        aria-label="Run log file"
        onChange={(e) => void pick(e.target.files?.[0] ?? null)}
      />
      {stage.kind === 'inspecting' && <p className="mt-2 text-sm text-ink-faint">Reading the columns…</p>}
      {stage.kind === 'mapping' && (
        <>
          <h3 className="mt-4 font-medium">Confirm what each column is</h3>
          <p className="text-sm text-ink-soft">
            Fields separated by {stage.inspection.delimiter === '\t' ? 'tabs' : stage.inspection.delimiter === ';' ? 'semicolons' : 'commas'}
            {stage.inspection.decimalComma ? ', decimal commas' : ''}
            {stage.inspection.firstLine > 1 ? `; lines 1–${stage.inspection.firstLine - 1} above the table are skipped` : ''}
            {stage.inspection.hasHeader ? '' : '; no header row, so columns are numbered'}.
          </p>
          <MappingStep inspection={stage.inspection} mapping={stage.mapping} onChange={(mapping) => setStage({ ...stage, mapping, confirmed: false })} />
          {warnings.length > 0 && (
            <div className="mt-3 rounded border border-saffron-soft bg-saffron-soft/40 p-3 text-sm" data-testid="upload-warnings">
              <p className="font-medium">Check before uploading</p>
              <ul className="mt-1 list-disc pl-5">{warnings.map((w) => <li key={w}>{w}</li>)}</ul>
              <label className="mt-2 flex items-center gap-2">
                <input type="checkbox" checked={stage.confirmed} onChange={(e) => setStage({ ...stage, confirmed: e.target.checked })} />
                I have checked these and want to upload the log as mapped
              </label>
            </div>
          )}
          <button
            type="button"
            className="mt-3 rounded bg-slate px-3 py-1.5 text-sm font-medium text-paper disabled:opacity-50"
            disabled={mappingProblems(stage.mapping).length > 0 || (warnings.length > 0 && !stage.confirmed)}
            onClick={() => void send(stage.mapping)}
          >
            Upload and check
          </button>
        </>
      )}
      {stage.kind === 'uploading' && (
        <div className="mt-3" data-testid="upload-progress">
          <progress className="w-full" max={1} value={stage.sent} aria-label="Upload progress" />
          <p className="text-sm text-ink-faint">Sending… {Math.round(stage.sent * 100)} %</p>
        </div>
      )}
      {stage.kind === 'analysing' && (
        <p className="mt-3 text-sm text-ink-faint" data-testid="upload-progress">Sent. Reading every row, checking it and replaying the run through the model…</p>
      )}
      {problem && (
        <div role="alert" className="mt-3 rounded border border-fault-soft bg-fault-soft/40 p-3 text-sm" data-testid="upload-refusal">
          <p className="font-medium text-fault">{problem.message}</p>
          {problem.refusal && (
            <p className="mt-1 text-ink-soft">
              {problem.refusal.line !== null && <>Line <span className="num">{problem.refusal.line}</span>. </>}
              {problem.refusal.column !== null && <>Column “{problem.refusal.column}”. </>}
              Nothing was stored; fix the file or the mapping and upload again.
            </p>
          )}
        </div>
      )}
    </section>
  );
}
