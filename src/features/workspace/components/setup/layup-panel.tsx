import { useMemo, useState, type DragEvent, type KeyboardEvent } from 'react';
import { Panel } from '../../../../components/ui/panel';
import { NumberField } from '../../../../components/ui/number-field';
import { issuesUnder } from '../../model/study-validation';
import { isSymmetric, MAX_PLIES, mirrored, mirroredToolSideHalf, presetLabels, presetPlies, presetPlyCount, stackCode, totalThicknessMm, type LayupPreset } from '../../model/layup';
import { useIssueCount } from '../../hooks/use-study-field';
import { studyEditorStore, useStudyEditor } from '../../stores/study-editor-store';

const btn = 'rounded border border-rule px-1.5 py-0.5 text-xs hover:bg-rule/40 disabled:opacity-40';

function movePly(from: number, to: number) {
  const n = studyEditorStore.getState().params?.layup.plies.length ?? 0;
  if (to < 0 || to >= n || from === to) return;
  studyEditorStore.getState().edit(`Move ply ${from + 1} to ${to + 1}`, (d) => {
    const [ply] = d.layup.plies.splice(from, 1);
    d.layup.plies.splice(to, 0, ply);
  });
}

/**
 * The ply stack drawn the way it lies on the tool: the bag-side ply on top of
 * the list, ply 1 (on the tool) at the bottom. Reorder by dragging a row's grip
 * or, with focus in a row, Alt+↑ / Alt+↓.
 */
export function LayupPanel() {
  const plies = useStudyEditor((s) => s.params?.layup.plies);
  // Issues as one string so a cycle edit (new params, same layup issues) does not re-render the ply list.
  const issueText = useStudyEditor((s) =>
    s.params ? issuesUnder(s.params, 'layup').map((i) => `${i.path}\u0000${i.message}`).join('\u0001') : '',
  );
  const issueMap = useMemo(
    () => new Map(issueText ? issueText.split('\u0001').map((line) => line.split('\u0000') as [string, string]) : []),
    [issueText],
  );
  const edit = useStudyEditor((s) => s.edit);
  const issues = useIssueCount('layup');
  const [preset, setPreset] = useState<LayupPreset>('quasi-isotropic');
  const [dragFrom, setDragFrom] = useState<number | null>(null);
  if (!plies) return null;
  const n = plies.length;
  const symmetric = isSymmetric(plies);
  const thickness = plies[0]?.thicknessMm ?? 0.19;
  const layupIssue = issueMap.get('layup.plies');

  function onRowKeyDown(e: KeyboardEvent<HTMLLIElement>, i: number) {
    if (!e.altKey || (e.key !== 'ArrowUp' && e.key !== 'ArrowDown')) return;
    e.preventDefault();
    // The list shows the bag side on top: "up" moves a ply toward the bag (a higher ply number).
    const to = e.key === 'ArrowUp' ? i + 1 : i - 1;
    movePly(i, to);
    requestAnimationFrame(() => document.querySelector<HTMLElement>(`[data-ply-row="${to}"] input`)?.focus());
  }

  function onDrop(e: DragEvent<HTMLLIElement>, i: number) {
    e.preventDefault();
    if (dragFrom !== null) movePly(dragFrom, i);
    setDragFrom(null);
  }

  return (
    <Panel title="Layup" foldable issueCount={issues} testId="panel-layup">
      <div className="mb-2 flex flex-wrap items-center gap-x-3 gap-y-1 text-xs text-ink-soft">
        <span className="num">{n} plies</span>
        <span className="num">{totalThicknessMm(plies).toFixed(2)} mm</span>
        <span className={symmetric ? 'text-verdigris' : 'text-saffron'} data-testid="layup-symmetry">
          {symmetric ? 'symmetric' : 'unsymmetric: expect warp'}
        </span>
      </div>
      <div className="mb-2 flex flex-wrap items-end gap-1.5">
        <label className="flex flex-col text-xs text-ink-soft">
          Preset
          <select
            value={preset}
            onChange={(e) => setPreset(e.target.value as LayupPreset)}
            className="rounded border border-rule bg-paper-raised px-1 py-0.5 text-sm text-ink"
          >
            {Object.entries(presetLabels).map(([k, v]) => (
              <option key={k} value={k}>
                {v}
              </option>
            ))}
          </select>
        </label>
        <button
          type="button"
          className={btn}
          onClick={() =>
            edit(`Layup preset: ${presetLabels[preset]}`, (d) => void (d.layup.plies = presetPlies(preset, n, thickness)))
          }
        >
          Apply ({presetPlyCount(preset, n)} plies)
        </button>
        {/* Both say what they make: mirroring the whole stack doubles it, which is easy to miss. */}
        <button
          type="button"
          className={btn}
          disabled={n * 2 > MAX_PLIES}
          title={n * 2 > MAX_PLIES ? `${n * 2} plies would exceed the ${MAX_PLIES}-ply limit` : `Append the stack's mirror image: ${n} → ${n * 2} plies, symmetric`}
          onClick={() => edit(`Mirror the stack (${n} → ${n * 2} plies)`, (d) => void (d.layup.plies = mirrored(plies)))}
        >
          Mirror → {n * 2} plies
        </button>
        <button
          type="button"
          className={btn}
          disabled={n < 2 || isSymmetric(plies)}
          title={`Keep the ${Math.ceil(n / 2)} tool-side plies and mirror them onto the bag side: still ${n} plies, symmetric about the mid-plane`}
          onClick={() => edit('Mirror the tool-side half', (d) => void (d.layup.plies = mirroredToolSideHalf(plies)))}
        >
          Mirror the tool-side half ({n} plies)
        </button>
      </div>
      <p className="mb-1 truncate font-mono text-[11px] text-ink-faint" title={stackCode(plies)}>
        [{stackCode(plies)}] tool side first
      </p>
      {layupIssue && (
        <p role="alert" className="text-xs text-fault">
          {layupIssue}
        </p>
      )}
      <p className="text-[10px] uppercase tracking-wide text-ink-faint">bag side</p>
      <ol className="max-h-72 overflow-y-auto border-y border-rule" aria-label="Plies, bag side first" data-testid="ply-list">
        {plies
          .map((p, i) => ({ p, i }))
          .reverse()
          .map(({ p, i }) => (
            <li
              key={i}
              data-ply-row={i}
              onKeyDown={(e) => onRowKeyDown(e, i)}
              onDragOver={(e) => e.preventDefault()}
              onDrop={(e) => onDrop(e, i)}
              className={`flex items-start gap-1.5 border-b border-rule/60 py-0.5 last:border-b-0 ${dragFrom === i ? 'opacity-50' : ''}`}
            >
              <span
                draggable
                onDragStart={(e) => {
                  e.dataTransfer.effectAllowed = 'move';
                  e.dataTransfer.setData('text/plain', String(i));
                  setDragFrom(i);
                }}
                onDragEnd={() => setDragFrom(null)}
                className="cursor-grab select-none px-0.5 pt-1 text-ink-faint"
                aria-hidden
                title="Drag to reorder"
              >
                ⠿
              </span>
              <span className="num w-7 pt-1 text-right text-xs text-ink-soft">{i + 1}</span>
              <div className="w-24">
                <NumberField
                  compact
                  label={`Ply ${i + 1} angle`}
                  unit="°"
                  step={15}
                  value={p.angleDeg}
                  issue={issueMap.get(`layup.plies.${i}.angleDeg`)}
                  onCommit={(v) => edit(`Ply ${i + 1} angle ${v}°`, (d) => void (d.layup.plies[i].angleDeg = v), { coalesceKey: `layup.plies.${i}.angleDeg` })}
                />
              </div>
              <div className="w-24">
                <NumberField
                  compact
                  label={`Ply ${i + 1} thickness`}
                  unit="mm"
                  step={0.01}
                  value={p.thicknessMm}
                  issue={issueMap.get(`layup.plies.${i}.thicknessMm`)}
                  onCommit={(v) =>
                    edit(`Ply ${i + 1} thickness ${v} mm`, (d) => void (d.layup.plies[i].thicknessMm = v), { coalesceKey: `layup.plies.${i}.thicknessMm` })
                  }
                />
              </div>
              <div className="ml-auto flex gap-0.5">
                <button type="button" className={btn} aria-label={`Move ply ${i + 1} toward the bag`} disabled={i === n - 1} onClick={() => movePly(i, i + 1)}>
                  ↑
                </button>
                <button type="button" className={btn} aria-label={`Move ply ${i + 1} toward the tool`} disabled={i === 0} onClick={() => movePly(i, i - 1)}>
                  ↓
                </button>
                <button
                  type="button"
                  className={btn}
                  aria-label={`Insert a ply above ply ${i + 1}`}
                  disabled={n >= MAX_PLIES}
                  onClick={() => edit(`Insert ply above ${i + 1}`, (d) => void d.layup.plies.splice(i + 1, 0, { ...p }))}
                >
                  +
                </button>
                <button
                  type="button"
                  className={btn}
                  aria-label={`Remove ply ${i + 1}`}
                  disabled={n <= 1}
                  onClick={() => edit(`Remove ply ${i + 1}`, (d) => void d.layup.plies.splice(i, 1))}
                >
                  ✕
                </button>
              </div>
            </li>
          ))}
      </ol>
      <p className="text-[10px] uppercase tracking-wide text-ink-faint">tool side</p>
      <p className="mt-1 text-[11px] text-ink-faint">Alt+↑ / Alt+↓ in a row moves that ply; drag ⠿ to move with the mouse.</p>
    </Panel>
  );
}
