import { memo } from 'react';
import { NumberField } from '../../../../components/ui/number-field';
import { getAt, setAt } from '../../model/field-path';
import { useIssue } from '../../hooks/use-study-field';
import { studyEditorStore, useStudyEditor } from '../../stores/study-editor-store';

export type FieldSpec = { path: string; label: string; unit: string; step?: number; digits?: number };

/**
 * A number field bound to one study path. It subscribes to its own value and
 * issue only, so a drag on the cycle does not re-render every setup field.
 */
export const StudyNumberField = memo(function StudyNumberField({ spec, compact }: { spec: FieldSpec; compact?: boolean }) {
  const value = useStudyEditor((s) => getAt(s.params, spec.path));
  const issue = useIssue(spec.path);
  if (typeof value !== 'number') return null;
  return (
    <NumberField
      label={spec.label}
      unit={spec.unit}
      step={spec.step}
      digits={spec.digits}
      value={value}
      issue={issue}
      compact={compact}
      testId={`field-${spec.path}`}
      onCommit={(v) =>
        studyEditorStore
          .getState()
          .edit(`${spec.label} ${v}${spec.unit ? ` ${spec.unit}` : ''}`, (d) => setAt(d, spec.path, v), { coalesceKey: spec.path })
      }
    />
  );
});

/** A grid of bound number fields; each shows the schema's issue for its path in place. */
export function StudyFields({ fields, columns = 2 }: { fields: readonly FieldSpec[]; columns?: 1 | 2 | 3 }) {
  const grid = columns === 1 ? 'grid-cols-1' : columns === 3 ? 'grid-cols-3' : 'grid-cols-2';
  return (
    <div className={`grid ${grid} gap-x-3 gap-y-2`}>
      {fields.map((f) => (
        <StudyNumberField key={f.path} spec={f} />
      ))}
    </div>
  );
}
