import { memo } from 'react';
import type { CycleSegment, SegmentCycle, StudyParams } from '../../../../../shared/schemas/study';
import type { Draft } from 'immer';
import { NumberField } from '../../../../components/ui/number-field';
import { SelectField } from '../../../../components/ui/select-field';
import { cycleEndMin, cycleSpans, newSegment, splitSegment } from '../../model/cycle-geometry';
import { HOLD_START_WORDS, segmentNames } from '../../../../../shared/compare/segment-names';
import { useIssue } from '../../hooks/use-study-field';
import { studyEditorStore, useStudyEditor } from '../../stores/study-editor-store';

const edit = (label: string, recipe: (d: Draft<StudyParams>) => void, key?: string) =>
  studyEditorStore.getState().edit(label, recipe, key ? { coalesceKey: key } : undefined);
const segmentsOf = (d: Draft<StudyParams>) => (d.cycle as Draft<SegmentCycle>).segments;

const holdStarts = [
  { value: 'clock', label: HOLD_START_WORDS.clock },
  { value: 'lagging-part', label: HOLD_START_WORDS['lagging-part'] },
] as const;

const addChoices = [
  { value: '', label: 'Add after…' },
  { value: 'ramp', label: 'ramp' },
  { value: 'hold', label: 'dwell' },
  { value: 'cool', label: 'cool' },
] as const;

/**
 * Exact entry for the cycle the line editor draws: one row per segment. The table follows the cycle only;
 * a row re-renders when its own segment, name, start temperature or issues change, so a drag on one
 * handle redraws one row.
 */
export function SegmentTable() {
  const cycle = useStudyEditor((s) => s.shown?.cycle);
  const startIssue = useIssue('cycle.startC');
  if (!cycle || cycle.kind !== 'segments') return null;
  const names = segmentNames(cycle.segments);
  const spans = cycleSpans(cycle.startC, cycle.segments);

  return (
    <div className="paint-island px-2" data-testid="segment-table">
      <div className="mb-2 flex items-end gap-3">
        <div className="w-36">
          <NumberField
            label="Start temperature"
            unit="°C"
            value={cycle.startC}
            issue={startIssue}
            onCommit={(v) => edit(`Start temperature ${v} °C`, (d) => void ((d.cycle as Draft<SegmentCycle>).startC = v), 'cycle.startC')}
          />
        </div>
        <p className="num pb-1 text-xs text-ink-soft">
          cycle length {Math.round(cycleEndMin(spans))} min (clock holds)
        </p>
      </div>
      <table className="w-full border-collapse text-sm">
        <thead>
          <tr className="text-left text-[11px] uppercase tracking-wide text-ink-faint">
            <th className="py-1 pr-2 font-medium">Segment</th>
            <th className="pr-2 font-medium">Rate or length</th>
            <th className="pr-2 font-medium">Target or start</th>
            <th className="pr-2 font-medium">Band</th>
            <th className="pr-2 font-medium">Pressure</th>
            <th className="font-medium">
              <span className="sr-only">Actions</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {cycle.segments.map((s, i) => (
            <SegmentRow key={i} index={i} segment={s} name={names[i]} startC={spans[i].startC} count={cycle.segments.length} />
          ))}
        </tbody>
      </table>
    </div>
  );
}

const SegmentRow = memo(function SegmentRow({
  index: i,
  segment: s,
  name,
  startC,
  count,
}: {
  index: number;
  segment: CycleSegment;
  name: string;
  startC: number;
  count: number;
}) {
  const path = `cycle.segments.${i}`;
  const issues = {
    kind: useIssue(`${path}.kind`),
    holdMin: useIssue(`${path}.holdMin`),
    bandC: useIssue(`${path}.bandC`),
    rateCPerMin: useIssue(`${path}.rateCPerMin`),
    targetC: useIssue(`${path}.targetC`),
    pressureBar: useIssue(`${path}.pressureBar`),
  };
  const set = (field: string, label: string, v: number | string) =>
    edit(label, (d) => void ((segmentsOf(d)[i] as unknown as Record<string, number | string>)[field] = v), `${path}.${field}`);

  return (
    <tr className="border-t border-rule align-top" data-testid={`segment-row-${i}`}>
      <td className="py-1 pr-2">
        <div className="flex items-center gap-1.5">
          <span className="w-14 text-xs font-medium">{name}</span>
          <SelectField
            compact
            label={`${name} kind`}
            value={s.kind}
            issue={issues.kind}
            options={[
              { value: 'ramp', label: 'ramp' },
              { value: 'hold', label: 'dwell' },
              { value: 'cool', label: 'cool' },
            ]}
            onChange={(kind) =>
              edit(`${name} becomes ${kind}`, (d) => {
                segmentsOf(d)[i] = newSegment(kind, startC, s.pressureBar);
              })
            }
          />
        </div>
      </td>
      {s.kind === 'hold' ? (
        <>
          <td className="py-1 pr-2">
            <NumberField compact label={`${name} length`} unit="min" value={s.holdMin} issue={issues.holdMin} onCommit={(v) => set('holdMin', `${name} length ${v} min`, v)} />
          </td>
          <td className="py-1 pr-2">
            <SelectField
              compact
              label={`${name} starts`}
              value={s.start}
              options={holdStarts}
              onChange={(v) => set('start', `${name} starts ${v}`, v)}
            />
          </td>
          <td className="py-1 pr-2">
            <NumberField
              compact
              label={`${name} band`}
              unit="±°C"
              value={s.bandC}
              issue={issues.bandC}
              onCommit={(v) => set('bandC', `${name} band ${v} °C`, v)}
              // The band only decides when a lagging-part dwell starts; a clock-started dwell never reads it.
              disabledReason={s.start === 'clock' ? 'not used: this dwell starts on the clock' : undefined}
            />
          </td>
        </>
      ) : (
        <>
          <td className="py-1 pr-2">
            <NumberField
              compact
              label={`${name} rate`}
              unit="°C/min"
              step={0.1}
              value={s.rateCPerMin}
              issue={issues.rateCPerMin}
              testId={`segment-${i}-rate`}
              onCommit={(v) => set('rateCPerMin', `${name} rate ${v} °C/min`, v)}
            />
          </td>
          <td className="py-1 pr-2">
            <NumberField
              compact
              label={s.kind === 'cool' && i === count - 1 ? `${name} demould temperature` : `${name} target`}
              unit="°C"
              value={s.targetC}
              issue={issues.targetC}
              onCommit={(v) => set('targetC', `${name} target ${v} °C`, v)}
            />
          </td>
          <td className="py-1 pr-2 text-xs text-ink-faint">—</td>
        </>
      )}
      <td className="py-1 pr-2">
        <NumberField compact label={`${name} pressure`} unit="bar" step={0.5} value={s.pressureBar} issue={issues.pressureBar} onCommit={(v) => set('pressureBar', `${name} pressure ${v} bar`, v)} />
      </td>
      <td className="py-1">
        <div className="flex items-center gap-1">
          <button
            type="button"
            className="rounded border border-rule px-1.5 py-0.5 text-xs hover:bg-rule/40"
            aria-label={`Split ${name}`}
            title="Split into two halves"
            onClick={() =>
              edit(`Split ${name}`, (d) => {
                const segs = segmentsOf(d);
                segs.splice(i, 1, ...splitSegment(s, startC));
              })
            }
          >
            split
          </button>
          <button
            type="button"
            className="rounded border border-rule px-1.5 py-0.5 text-xs hover:bg-fault-soft disabled:opacity-40"
            aria-label={`Remove ${name}`}
            disabled={count <= 1}
            onClick={() => edit(`Remove ${name}`, (d) => void segmentsOf(d).splice(i, 1))}
          >
            remove
          </button>
          <select
            aria-label={`Add a segment after ${name}`}
            className="rounded border border-rule bg-paper-raised px-1 py-0.5 text-xs"
            value=""
            onChange={(e) => {
              const kind = e.target.value as CycleSegment['kind'] | '';
              if (!kind) return;
              const endC = s.kind === 'hold' ? startC : s.targetC;
              edit(`Add ${kind} after ${name}`, (d) =>
                void segmentsOf(d).splice(i + 1, 0, newSegment(kind, endC, s.pressureBar)),
              );
            }}
          >
            {addChoices.map((c) => (
              <option key={c.value} value={c.value}>
                {c.label}
              </option>
            ))}
          </select>
        </div>
      </td>
    </tr>
  );
});
