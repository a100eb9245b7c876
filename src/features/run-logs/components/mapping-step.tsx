import { PRESSURE_UNITS, TEMPERATURE_UNITS, TIME_UNITS, VACUUM_REFERENCES, VACUUM_UNITS } from '../../../../shared/run-log/units';
import { COLUMN_ROLES, PART_POSITIONS, runLogMappingSchema, type ColumnMapping, type ColumnRole, type RunLogMapping } from '../../../../shared/run-log/column-mapping';
import type { RunLogInspection } from '../../../../shared/run-log/index';

// The mapping step: every column with its proposed role and unit (and why), editable before the upload.
// The same schema the server applies checks the mapping here, so a broken one is named before sending.
// (Imports name the shared modules directly so the page does not pull in the parser or the solver.)

const ROLE_LABEL: Record<ColumnRole, string> = {
  time: 'Time',
  air: 'Air',
  tool: 'Tool',
  part: 'Part thermocouple',
  pressure: 'Vessel pressure',
  vacuum: 'Bag vacuum',
  ignore: 'Ignore',
};

const unitsFor = (role: ColumnRole): readonly string[] =>
  role === 'time' ? TIME_UNITS : role === 'pressure' ? PRESSURE_UNITS : role === 'vacuum' ? VACUUM_UNITS : role === 'ignore' ? [] : TEMPERATURE_UNITS;

/** A column re-read for a new role: keeps its label, takes the role's first unit. */
export function withRole(c: ColumnMapping, role: ColumnRole): ColumnMapping {
  const base = { column: c.column, header: c.header };
  const label = 'label' in c ? c.label : c.header;
  switch (role) {
    case 'time':
      return { ...base, role, unit: 's' };
    case 'ignore':
      return { ...base, role };
    case 'pressure':
      return { ...base, role, label, unit: 'bar' };
    case 'vacuum':
      return { ...base, role, label, unit: 'kPa', reference: 'gauge' };
    case 'part':
      return { ...base, role, label, unit: '°C', position: 'unknown' };
    default:
      return { ...base, role, label, unit: '°C' };
  }
}

export function mappingProblems(mapping: RunLogMapping): string[] {
  const r = runLogMappingSchema.safeParse(mapping);
  return r.success ? [] : r.error.issues.map((i) => i.message);
}

const select = 'rounded border border-rule bg-paper px-1 py-0.5 text-sm';

export function MappingStep({
  inspection,
  mapping,
  onChange,
}: {
  inspection: RunLogInspection;
  mapping: RunLogMapping;
  onChange: (m: RunLogMapping) => void;
}) {
  const update = (i: number, next: ColumnMapping) => onChange({ columns: mapping.columns.map((c, k) => (k === i ? next : c)) });
  const problems = mappingProblems(mapping);
  return (
    <div data-testid="mapping-step">
      <table className="mt-2 w-full border-collapse text-sm">
        <thead>
          <tr className="border-b border-rule text-left text-ink-soft">
            <th className="py-1 pr-2 font-medium">Column</th>
            <th className="py-1 pr-2 font-medium">First values</th>
            <th className="py-1 pr-2 font-medium">Role</th>
            <th className="py-1 pr-2 font-medium">Label</th>
            <th className="py-1 pr-2 font-medium">Unit</th>
            <th className="py-1 pr-2 font-medium">Position / reference</th>
            <th className="py-1 pr-2 font-medium" title="A channel the data-hygiene check flags (dead, flat, noisy, a part TC leading the air) is left out of the spec check and the replay unless kept here">
              Keep if flagged
            </th>
          </tr>
        </thead>
        <tbody>
          {mapping.columns.map((c, i) => {
            const proposal = inspection.proposal.find((p) => p.column === c.column);
            return (
              <tr key={c.column} className="border-b border-rule/60 align-top" data-testid={`mapping-row-${c.column}`}>
                <td className="py-1 pr-2">
                  <span className="font-medium">{c.header}</span>
                  {proposal && (
                    <span className={`block text-xs ${proposal.confident ? 'text-ink-faint' : 'text-saffron'}`}>
                      {proposal.confident ? '' : 'check: '}
                      {proposal.reason}
                    </span>
                  )}
                </td>
                <td className="num py-1 pr-2 text-xs text-ink-soft">{inspection.previewRows.slice(0, 3).map((r) => r[c.column]).join(' · ')}</td>
                <td className="py-1 pr-2">
                  <select aria-label={`Role of ${c.header}`} className={select} value={c.role} onChange={(e) => update(i, withRole(c, e.target.value as ColumnRole))}>
                    {COLUMN_ROLES.map((r) => <option key={r} value={r}>{ROLE_LABEL[r]}</option>)}
                  </select>
                </td>
                <td className="py-1 pr-2">
                  {'label' in c && (
                    <input aria-label={`Label of ${c.header}`} className={`${select} w-44`} value={c.label} onChange={(e) => update(i, { ...c, label: e.target.value })} />
                  )}
                </td>
                <td className="py-1 pr-2">
                  {'unit' in c && (
                    <select aria-label={`Unit of ${c.header}`} className={select} value={c.unit} onChange={(e) => update(i, { ...c, unit: e.target.value } as ColumnMapping)}>
                      {unitsFor(c.role).map((u) => <option key={u} value={u}>{u}</option>)}
                    </select>
                  )}
                </td>
                <td className="py-1 pr-2">
                  {c.role === 'part' && (
                    <select aria-label={`Position of ${c.header}`} className={select} value={c.position} onChange={(e) => update(i, { ...c, position: e.target.value as typeof c.position })}>
                      {PART_POSITIONS.map((p) => <option key={p} value={p}>{p}</option>)}
                    </select>
                  )}
                  {c.role === 'vacuum' && (
                    <select aria-label={`Reference of ${c.header}`} className={select} value={c.reference} onChange={(e) => update(i, { ...c, reference: e.target.value as typeof c.reference })}>
                      {VACUUM_REFERENCES.map((p) => <option key={p} value={p}>{p}</option>)}
                    </select>
                  )}
                </td>
                <td className="py-1 pr-2">
                  {'label' in c && (
                    <input
                      type="checkbox"
                      aria-label={`Keep ${c.header} if flagged`}
                      checked={c.keepIfFlagged === true}
                      onChange={(e) => {
                        const { keepIfFlagged: _keep, ...rest } = c;
                        update(i, (e.target.checked ? { ...rest, keepIfFlagged: true } : rest) as ColumnMapping);
                      }}
                    />
                  )}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      <p className="mt-1 text-xs text-ink-faint">
        Channels the data-hygiene check flags (dead, flat, noisy, a part TC leading the air) are left out of the spec check and the replay; tick
        “Keep if flagged” to use one anyway (recorded with the upload).
      </p>
      {problems.length > 0 && (
        <ul role="alert" className="mt-2 list-disc pl-5 text-sm text-fault">
          {problems.map((p) => <li key={p}>{p}</li>)}
        </ul>
      )}
    </div>
  );
}
