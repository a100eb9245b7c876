import { describe, expect, it } from 'vitest';
import { labelFromHeader, proposeMapping, roleFromHeader, runLogMappingSchema, type ColumnSample } from './column-mapping';

const sample = (header: string, numbers: number[], timestamps = 0): ColumnSample => ({
  header,
  numbers,
  timestamps,
  filled: timestamps || numbers.length,
});

describe('roles from headers', () => {
  it.each([
    ['Time (min)', 'time'],
    ['Timestamp', 'time'],
    ['Air (°C)', 'air'],
    ['Oven air', 'air'],
    ['Tool (°C)', 'tool'],
    ['TC3 lagging tool-side (°C)', 'part'],
    ['TC1 bag-side', 'part'],
    ['Part TC 4', 'part'],
    ['Vessel pressure (psi)', 'pressure'],
    ['Bag vacuum (inHg)', 'vacuum'],
    ['Vac', 'vacuum'],
    ['Comment', 'ignore'],
    ['Channel 9', null],
  ])('%s is %s', (header, role) => {
    expect(roleFromHeader(header)).toBe(role);
  });

  it('labels a channel by its header without the unit', () => {
    expect(labelFromHeader('TC3 lagging (°F)')).toBe('TC3 lagging');
    expect(labelFromHeader('Vessel pressure [psi]')).toBe('Vessel pressure');
    expect(labelFromHeader('(°C)')).toBe('(°C)');
  });
});

describe('proposeMapping', () => {
  it('maps a shop logger layout from its headers', () => {
    const p = proposeMapping([
      sample('Timestamp', [], 5),
      sample('Air (°F)', [68, 200, 356]),
      sample('TC1 leading bag-side (°F)', [68, 190, 350]),
      sample('TC2 mid', [20, 80, 176]),
      sample('Vessel pressure (psi)', [0, 50, 101]),
      sample('Bag vacuum (inHg)', [28, 28, 28]),
      { header: 'Step', numbers: [], timestamps: 0, filled: 3 },
    ]);
    expect(p.map((c) => c.role)).toEqual(['time', 'air', 'part', 'part', 'pressure', 'vacuum', 'ignore']);
    expect(p[0]).toMatchObject({ unit: 'timestamp' });
    expect(p[1]).toMatchObject({ unit: '°F', label: 'Air', confident: true });
    expect(p[2]).toMatchObject({ unit: '°F', position: 'bag-side', label: 'TC1 leading bag-side' });
    // No unit in the header: from the values (starts at 20, peaks at 176 → °C) and flagged for a look.
    expect(p[3]).toMatchObject({ unit: '°C', position: 'mid-plane', confident: false });
    expect(p[4]).toMatchObject({ unit: 'psi' });
    expect(p[5]).toMatchObject({ unit: 'inHg', reference: 'gauge' });
  });

  it('with no names at all takes the first column as time and the first temperature as air', () => {
    const p = proposeMapping([
      sample('Column 1', [0, 30, 60, 23_400]),
      sample('Column 2', [20, 60, 120, 180]),
      sample('Column 3', [20, 50, 110, 178]),
    ]);
    expect(p.map((c) => c.role)).toEqual(['time', 'air', 'part']);
    expect(p[0]).toMatchObject({ unit: 's', confident: false });
  });

  it('gives a second air column the part role instead of a second air', () => {
    const p = proposeMapping([sample('t (min)', [0, 1]), sample('Air 1', [20, 21]), sample('Air 2', [20, 21])]);
    expect(p.map((c) => c.role)).toEqual(['time', 'air', 'part']);
  });
});

describe('runLogMappingSchema', () => {
  const time = { column: 0, header: 't', role: 'time', unit: 'min' } as const;
  const air = { column: 1, header: 'Air', role: 'air', label: 'Air', unit: '°C' } as const;

  it('accepts a time and an air column', () => {
    expect(runLogMappingSchema.safeParse({ columns: [time, air] }).success).toBe(true);
  });

  it.each([
    ['no time', [air, { ...air, column: 2, role: 'part', label: 'TC1' }], 'no column mapped as time'],
    ['no air', [time, { ...air, role: 'part', label: 'TC1' }], 'no column mapped as air'],
    ['two air columns', [time, air, { ...air, column: 2, label: 'Air 2' }], '2 columns mapped as air'],
    ['a label twice', [time, air, { ...air, column: 2, role: 'part', label: 'air' }], 'label "air" is used twice'],
    ['a column twice', [time, air, { ...air, role: 'part', label: 'TC1' }], 'column 2 is mapped twice'],
    ['an unknown unit', [time, { ...air, unit: '°R' }], "unknown temperature unit \"°R\""],
    ['an empty label', [time, { ...air, label: ' ' }], 'a channel needs a label'],
  ])('refuses %s', (_name, columns, message) => {
    const r = runLogMappingSchema.safeParse({ columns });
    expect(r.success).toBe(false);
    expect(r.error!.issues.map((i) => i.message).join(' | ')).toContain(message);
  });
});
