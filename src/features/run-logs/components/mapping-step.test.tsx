// @vitest-environment jsdom
import { useState } from 'react';
import { describe, expect, it } from 'vitest';
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { inspectRunLog } from '../../../../shared/run-log/parse-run-log';
import type { RunLogMapping } from '../../../../shared/run-log/column-mapping';
import { MappingStep, mappingProblems, withRole } from './mapping-step';

const CSV = 'Time (min),Oven air (°F),TC1 (°F),Vac (inHg)\n0,68,68,28\n1,72,70,28\n2,76,72,28\n';

function Harness({ onMapping }: { onMapping: (m: RunLogMapping) => void }) {
  const inspection = inspectRunLog(CSV);
  const [mapping, setMapping] = useState(inspection.mapping);
  return (
    <MappingStep
      inspection={inspection}
      mapping={mapping}
      onChange={(m) => {
        setMapping(m);
        onMapping(m);
      }}
    />
  );
}

describe('MappingStep', () => {
  it('shows each proposed role and unit, and names a broken mapping before it is sent', async () => {
    let latest: RunLogMapping | null = null;
    render(<Harness onMapping={(m) => (latest = m)} />);
    expect((screen.getByLabelText('Role of Oven air (°F)') as HTMLSelectElement).value).toBe('air');
    expect((screen.getByLabelText('Unit of Oven air (°F)') as HTMLSelectElement).value).toBe('°F');
    expect((screen.getByLabelText('Unit of Vac (inHg)') as HTMLSelectElement).value).toBe('inHg');
    expect(screen.queryByRole('alert')).toBeNull();

    await userEvent.selectOptions(screen.getByLabelText('Role of Oven air (°F)'), 'ignore');
    expect(latest!.columns[1]).toEqual({ column: 1, header: 'Oven air (°F)', role: 'ignore' });
    expect(screen.getByRole('alert').textContent).toContain('no column mapped as air');

    await userEvent.selectOptions(screen.getByLabelText('Role of TC1 (°F)'), 'air');
    expect(screen.queryByRole('alert')).toBeNull();
    // a new role starts from that role's first unit; the user sets the real one
    expect((screen.getByLabelText('Unit of TC1 (°F)') as HTMLSelectElement).value).toBe('°C');
  });

  it('lets the user keep a channel the hygiene check might flag, stored with the mapping', async () => {
    let latest: RunLogMapping | null = null;
    render(<Harness onMapping={(m) => (latest = m)} />);
    const keep = screen.getByLabelText('Keep Vac (inHg) if flagged') as HTMLInputElement;
    expect(keep.checked).toBe(false);
    await userEvent.click(keep);
    expect(latest!.columns[3]).toMatchObject({ role: 'vacuum', keepIfFlagged: true });
    await userEvent.click(keep);
    expect(latest!.columns[3]).not.toHaveProperty('keepIfFlagged');
    // the time column has no such choice
    expect(screen.queryByLabelText('Keep Time (min) if flagged')).toBeNull();
  });
});

describe('withRole', () => {
  it('keeps the label and gives the role its own fields', () => {
    const part = withRole({ column: 2, header: 'TC1', role: 'air', label: 'TC one', unit: '°F' }, 'part');
    expect(part).toEqual({ column: 2, header: 'TC1', role: 'part', label: 'TC one', unit: '°C', position: 'unknown' });
    expect(withRole(part, 'vacuum')).toEqual({ column: 2, header: 'TC1', role: 'vacuum', label: 'TC one', unit: 'kPa', reference: 'gauge' });
    expect(mappingProblems({ columns: [withRole(part, 'time')] }).join()).toContain('no column mapped as air');
  });
});
