import type { RunLogMapping } from '../../../../shared/run-log/index';

const ROLE_WORD: Record<string, string> = {
  time: 'time',
  air: 'air',
  tool: 'tool',
  part: 'part thermocouple',
  pressure: 'vessel pressure',
  vacuum: 'bag vacuum',
  ignore: 'ignored',
};

/** The confirmed column mapping as stored with the upload: which file column became which channel, in what unit. */
export function MappingTable({ mapping }: { mapping: RunLogMapping }) {
  return (
    <table className="mt-2 w-full border-collapse text-sm" data-testid="record-mapping">
      <thead>
        <tr className="border-b border-rule text-left text-ink-soft">
          <th className="py-1 pr-2 font-medium">Column</th>
          <th className="py-1 pr-2 font-medium">Header in the file</th>
          <th className="py-1 pr-2 font-medium">Role</th>
          <th className="py-1 pr-2 font-medium">Unit</th>
          <th className="py-1 pr-2 font-medium">Label</th>
          <th className="py-1 pr-2 font-medium">Notes</th>
        </tr>
      </thead>
      <tbody>
        {mapping.columns.map((c) => {
          const notes = [
            c.role === 'part' ? `position ${c.position}` : null,
            c.role === 'vacuum' ? `${c.reference} reading` : null,
            'keepIfFlagged' in c && c.keepIfFlagged ? 'kept even if flagged' : null,
          ].filter(Boolean);
          return (
            <tr key={c.column} className="border-b border-rule/60">
              <td className="num py-1 pr-2">{c.column + 1}</td>
              <td className="py-1 pr-2">{c.header}</td>
              <td className="py-1 pr-2">{ROLE_WORD[c.role] ?? c.role}</td>
              <td className="py-1 pr-2">{'unit' in c ? c.unit : '—'}</td>
              <td className="py-1 pr-2">{'label' in c ? c.label : '—'}</td>
              <td className="py-1 pr-2">{notes.join('; ') || '—'}</td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}
