import { describe, expect, it } from 'vitest';
import { expectClose } from '../solver/test-support/expect-close';
import { inspectRunLog, parseRunLog } from './parse-run-log';
import { RunLogParseError } from './run-log-error';

const CLEAN = ['Time (min),Air (°C),TC1 (°C),Pressure (bar)', '0,20,20,0', '1,22,21,1', '2,24,22.5,2', '3,26,24,3'].join('\n');

function refusal(text: string, mapping?: unknown, options = {}): RunLogParseError {
  try {
    parseRunLog(text, mapping ?? inspectRunLog(text).mapping, options);
  } catch (e) {
    if (e instanceof RunLogParseError) return e;
    throw e;
  }
  throw new Error('expected the file to be refused');
}

describe('parseRunLog: reading good files', () => {
  it('reads a comma file in minutes and °C into SI series', () => {
    const log = parseRunLog(CLEAN, inspectRunLog(CLEAN).mapping);
    expect(log.rows).toBe(4);
    expect(Array.from(log.timeS)).toEqual([0, 60, 120, 180]);
    const [air, tc1, p] = log.channels;
    expect(air).toMatchObject({ key: 'air', role: 'air', label: 'Air', sourceUnit: '°C' });
    expect(tc1).toMatchObject({ key: 'part:TC1', role: 'part' });
    expectClose(tc1.values[2], 295.65, 1e-12); // 22.5 °C
    expect(Array.from(p.values)).toEqual([0, 1e5, 2e5, 3e5]);
  });

  it('reads semicolons with decimal commas, °F and psi', () => {
    const text = ['Zeit (s);Luft (°F);Druck (psi)', '0;68,0;0,0', '60;71,6;14,5'].join('\n');
    const ins = inspectRunLog(text);
    expect(ins.delimiter).toBe(';');
    expect(ins.decimalComma).toBe(true);
    const mapping = {
      columns: [
        { column: 0, header: 'Zeit (s)', role: 'time', unit: 's' },
        { column: 1, header: 'Luft (°F)', role: 'air', label: 'Luft', unit: '°F' },
        { column: 2, header: 'Druck (psi)', role: 'pressure', label: 'Druck', unit: 'psi' },
      ],
    };
    const log = parseRunLog(text, mapping);
    expectClose(log.channels[0].values[1], 295.15, 1e-9); // 71.6 °F = 22 °C
    expectClose(log.channels[1].values[1], 14.5 * 6894.757293168361, 1e-12);
  });

  it('reads tab-separated hours', () => {
    const text = 'Time (h)\tAir (°C)\n0\t20\n0.5\t80\n1\t120\n';
    const log = parseRunLog(text, inspectRunLog(text).mapping);
    expect(Array.from(log.timeS)).toEqual([0, 1800, 3600]);
  });

  it('reads date-time stamps as elapsed seconds from the first row and keeps the start', () => {
    const text = 'Date,Air (°C)\n2026-03-14 23:59:30,20\n2026-03-15 00:00:30,21\n2026-03-15T00:01:30,22\n';
    const log = parseRunLog(text, inspectRunLog(text).mapping);
    expect(Array.from(log.timeS)).toEqual([0, 60, 120]);
    expect(log.startedAt).toBe('2026-03-14T23:59:30.000Z');
  });

  it('carries clock-only times across midnight', () => {
    const text = 'Clock,Air (°C)\n23:58:00,20\n23:59:00,21\n00:00:00,22\n00:01:00,23\n';
    const log = parseRunLog(text, inspectRunLog(text).mapping);
    expect(Array.from(log.timeS)).toEqual([0, 60, 120, 180]);
  });

  it('keeps empty channel cells as missing readings and skips blank lines', () => {
    const text = 'Time (min),Air (°C),TC1 (°C)\n0,20,20\n\n1,22,\n2,24,22\n';
    const log = parseRunLog(text, inspectRunLog(text).mapping);
    expect(log.rows).toBe(3);
    expect(Number.isNaN(log.channels[1].values[1])).toBe(true);
  });

  it('ignores columns mapped as ignore, even with text in them', () => {
    const text = 'Time (min),Air (°C),Step\n0,20,ramp\n1,22,ramp\n';
    const ins = inspectRunLog(text);
    expect(ins.mapping.columns[2].role).toBe('ignore');
    expect(parseRunLog(text, ins.mapping).channels.map((c) => c.key)).toEqual(['air']);
  });

  it('reads a file with a byte-order mark and no header row', () => {
    const text = '\uFEFF0,20,20\n60,22,21\n120,24,22\n';
    const ins = inspectRunLog(text);
    expect(ins.hasHeader).toBe(false);
    expect(ins.headers).toEqual(['Column 1', 'Column 2', 'Column 3']);
    expect(parseRunLog(text, ins.mapping).rows).toBe(3);
  });

  it('skips a logger preamble above the table and still names physical lines', () => {
    const text = [
      'Autoclave 2 record',
      'Job 4471; operator: night shift',
      '',
      'Time (min),Air (°C),TC1 (°C)',
      '0,20,20',
      '1,22,21',
      '2,24,OPEN',
    ].join('\n');
    const ins = inspectRunLog(text);
    expect(ins).toMatchObject({ firstLine: 4, hasHeader: true, headers: ['Time (min)', 'Air (°C)', 'TC1 (°C)'] });
    expect(ins.previewRows[0]).toEqual(['0', '20', '20']);
    const e = refusal(text, ins.mapping);
    expect(e.line).toBe(7);
    expect(e.column).toBe('TC1 (°C)');
    const good = text.replace('OPEN', '23');
    expect(Array.from(parseRunLog(good, inspectRunLog(good).mapping).timeS)).toEqual([0, 60, 120]);
  });

  it('reports progress up to 1', () => {
    const seen: number[] = [];
    parseRunLog(CLEAN, inspectRunLog(CLEAN).mapping, { onProgress: (f) => seen.push(f) });
    expect(seen.at(-1)).toBe(1);
  });
});

describe('parseRunLog: refusing broken files with line, column and why', () => {
  it('refuses an empty file', () => {
    const e = refusal('', { columns: [] });
    expect(e.message).toBe('line 1: the file is empty');
  });

  it('refuses a file of blank lines', () => {
    expect(refusal('\n\n  \n', { columns: [] }).reason).toMatch(/empty/);
  });

  it('refuses a header with no data rows', () => {
    const e = refusal('Time (min),Air (°C)\n', { columns: [] });
    expect(e.line).toBe(2);
    expect(e.reason).toBe('no data rows under the header');
  });

  it('refuses a delimiter it does not read (pipes)', () => {
    const e = refusal('Time (min)|Air (°C)\n0|20\n1|22\n', { columns: [] });
    expect(e.line).toBe(1);
    expect(e.reason).toMatch(/no comma, semicolon or tab/);
  });

  it('refuses a row written with another delimiter', () => {
    const e = refusal('Time (min),Air (°C),TC1 (°C)\n0,20,20\n1;22;21\n2,24,22\n');
    expect(e.line).toBe(3);
    expect(e.reason).toMatch(/1 fields where the header has 3/);
    // so few rows that papaparse cannot guess the delimiter: the header decides, the broken row is named
    const mapping = { columns: [{ column: 0, header: 'Time (min)', role: 'time', unit: 'min' }, { column: 1, header: 'Air (°C)', role: 'air', label: 'Air', unit: '°C' }] };
    expect(refusal('Time (min),Air (°C)\n0,20\n1;22\n', mapping).message).toBe(
      'line 3: 1 fields where the header has 2: the fields must be separated by commas throughout (a different delimiter or a broken row)',
    );
  });

  it('refuses time that goes backwards, naming the row and the time column', () => {
    const e = refusal('Time (min),Air (°C)\n0,20\n1,22\n2,24\n1.5,25\n');
    expect(e.line).toBe(5);
    expect(e.column).toBe('Time (min)');
    expect(e.reason).toBe("time 1.5 min is not after the previous row's 2 min: times must increase row by row");
  });

  it('refuses a repeated time', () => {
    expect(refusal('Time (min),Air (°C)\n0,20\n1,22\n1,22\n').line).toBe(4);
  });

  it('refuses text in a numeric column', () => {
    const text = 'Time (min),Air (°C),TC1 (°C)\n0,20,20\n1,22,21\n2,24,OPEN\n3,26,23\n';
    const mapping = inspectRunLog(text).mapping;
    expect(mapping.columns[2]).toMatchObject({ role: 'part' });
    const e = refusal(text, mapping);
    expect(e.message).toBe('line 4, column "TC1 (°C)": "OPEN" is not a number: a part thermocouple column must hold numbers (or be empty where a reading is missing)');
  });

  it('names the column role with the right article', () => {
    const text = 'Time (min),Air (°C),TC1 (°C)\n0,20,20\n1,n/a,21\n';
    expect(refusal(text, inspectRunLog('Time (min),Air (°C),TC1 (°C)\n0,20,20\n1,22,21\n').mapping).reason).toBe(
      '"n/a" is not a number: an air column must hold numbers (or be empty where a reading is missing)',
    );
  });

  it('refuses a time stamp it cannot read', () => {
    const e = refusal('Timestamp,Air (°C)\n2026-03-14 08:00:00,20\n2026-03-14 25:00:00,20\n');
    expect(e.line).toBe(3);
    expect(e.column).toBe('Timestamp');
  });

  it('refuses an oversize file by bytes', () => {
    const e = refusal(CLEAN, undefined, { maxBytes: 20 });
    expect(e.reason).toMatch(/^the file is 0\.0 MB: allowed ≤ 0\.0 MB$/);
    const big = refusal(CLEAN, undefined, { byteLength: 60 * 1024 * 1024 });
    expect(big.reason).toBe('the file is 60.0 MB: allowed ≤ 50.0 MB');
  });

  it('refuses more rows than allowed, at the first row too many', () => {
    const e = refusal(CLEAN, undefined, { maxRows: 3 });
    expect(e.line).toBe(5);
    expect(e.reason).toBe('more than 3 data rows: allowed ≤ 3');
  });

  it('refuses a mapping that does not fit the file', () => {
    const e = refusal(CLEAN, { columns: [{ column: 0, header: 't', role: 'time', unit: 'min' }, { column: 9, header: 'x', role: 'air', label: 'Air', unit: '°C' }] });
    expect(e.reason).toBe('column mapping names column 10, but the file has 4 columns');
    expect(refusal(CLEAN, { columns: [{ column: 0, header: 't', role: 'time', unit: 'min' }] }).reason).toMatch(/^column mapping: columns/);
  });
});
