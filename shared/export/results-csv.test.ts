import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { referenceStudy } from '../solver/demo-cards';
import { expectClose } from '../solver/test-support/expect-close';
import { csvFileName, CSV_SECTION, CSV_TITLE, HISTORY_COLUMNS, resultsToCsv, type CsvResult } from './results-csv';

// A small hand-made result (SI typed arrays, as the solver returns them) written to CSV and read back with
// papaparse, a general-purpose CSV library. Expected engineering values are converted here by hand:
// °C = K − 273.15 (ITS-90 definition), min = s / 60, bar = Pa / 1e5, MPa = Pa / 1e6, mm = m × 1000.

function history(n: number) {
  const arr = (f: (i: number) => number) => Float64Array.from({ length: n }, (_, i) => f(i));
  return {
    timeS: arr((i) => i * 90),
    airK: arr((i) => 293.15 + i * 3),
    pressurePa: arr(() => 7e5),
    toolK: arr((i) => 293.15 + i * 2.9),
    bagSurfaceK: arr((i) => 293.15 + i * 2.8),
    midPlaneK: arr((i) => 293.15 + i * 2.7 + 1 / 3),
    toolSideSurfaceK: arr((i) => 293.15 + i * 2.75),
    alphaMin: arr((i) => i / (n + 1)),
    alphaMax: arr((i) => (i + 0.5) / (n + 1)),
    tgMidK: arr((i) => 258.15 + i),
    resinModulusMidPa: arr((i) => 1e6 + i * 1.234567e8),
    setpointK: arr((i) => 293.15 + i * 3),
  };
}

function result(): CsvResult {
  // Two plies, two points each (bottom then top, bottom ply first).
  return {
    modelVersion: 'test-model 0.0.1',
    history: history(37),
    plyStresses: {
      zM: Float64Array.from([0, 0.19e-3, 0.19e-3, 0.38e-3]),
      plyIndex: Int32Array.from([0, 0, 1, 1]) as unknown as CsvResult['plyStresses']['plyIndex'],
      sigma1Pa: Float64Array.from([-12.5e6, -11e6, 20e6, 21.25e6]),
      sigma2Pa: Float64Array.from([8e6, 7.5e6, -3e6, -2.5e6]),
      tau12Pa: Float64Array.from([0, 0.1e6, -0.1e6, 0]),
    },
    summary: {
      warnings: ['hold 2 clock started late: the lagging point entered the band after 35 min'],
      limits: [
        { key: 'overshoot', label: 'Exotherm overshoot', value: 4.2, limit: 10, unit: '°C', pass: true, atTimeMin: 210, atZMm: 2.28 },
        { key: 'cure', label: 'Final degree of cure', value: 0.87, limit: 0.9, unit: '', pass: false, atTimeMin: null, atZMm: 0 },
      ],
    } as unknown as CsvResult['summary'],
  };
}

function parse(csv: string): string[][] {
  const parsed = Papa.parse<string[]>(csv, { skipEmptyLines: false });
  expect(parsed.errors).toEqual([]);
  return parsed.data;
}

function section(rows: string[][], name: string): { header: string[]; body: string[][] } {
  const start = rows.findIndex((r) => r[0] === CSV_SECTION && r[1] === name);
  expect(start, `section ${name}`).toBeGreaterThan(0);
  const end = rows.findIndex((r, k) => k > start && (r.length === 1 && r[0] === ''));
  return { header: rows[start + 1], body: rows.slice(start + 2, end === -1 ? undefined : end) };
}

const meta = {
  study: 'Two-dwell cycle, "24 plies"',
  revision: 3,
  part: 'TB-2407 Tailcone access panel',
  params: referenceStudy(),
  exportedAt: new Date('2026-12-01T10:00:00Z'),
};

describe('resultsToCsv', () => {
  it('opens with a header block naming study, revision, material cards, model version and units', () => {
    const rows = parse(resultsToCsv(result(), meta));
    expect(rows[0][0]).toBe(CSV_TITLE);
    const header = new Map(rows.slice(1, rows.findIndex((r) => r.length === 1 && r[0] === '')).map((r) => [r[0], r[1]]));
    expect(header.get('study')).toBe('Two-dwell cycle, "24 plies"'); // comma and quotes survive
    expect(header.get('revision')).toBe('3');
    expect(header.get('part')).toBe('TB-2407 Tailcone access panel');
    expect(header.get('resin card')).toBe(`DF-E180 demo epoxy (source: ${referenceStudy().resin.provenance.source})`);
    expect(header.get('fibre card')).toContain('DF-C230 demo carbon fibre');
    expect(header.get('model version')).toBe('test-model 0.0.1');
    expect(header.get('exported at')).toBe('2026-12-01T10:00:00.000Z');
    expect(header.get('units')).toContain('temperatures in °C');
    expect(header.get('units')).toContain('stresses and modulus in MPa');
    expect(header.get('time history rows')).toBe('37');
    expect(header.get('ply stress rows')).toBe('4');
    expect(header.get('caution')).toMatch(/never replace/);
    expect(header.get('solver note')).toBe('hold 2 clock started late: the lagging point entered the band after 35 min');
  });

  it('lists the cycle in the header block with the segment names of the cycle editor', () => {
    const params = structuredClone(referenceStudy());
    params.cycle = {
      kind: 'segments',
      startC: 20,
      segments: [
        { kind: 'ramp', rateCPerMin: 2, targetC: 120, pressureBar: 7 },
        { kind: 'hold', holdMin: 60, pressureBar: 7, start: 'lagging-part', bandC: 5 },
        { kind: 'ramp', rateCPerMin: 1.5, targetC: 180, pressureBar: 7 },
        { kind: 'hold', holdMin: 120, pressureBar: 7, start: 'clock', bandC: 5 },
        { kind: 'cool', rateCPerMin: 3, targetC: 60, pressureBar: 7 },
      ],
    };
    const rows = parse(resultsToCsv(result(), { ...meta, params }));
    const header = new Map(rows.slice(1, rows.findIndex((r) => r.length === 1 && r[0] === '')).map((r) => [r[0], r[1]]));
    expect(header.get('cycle start')).toBe('20 °C');
    expect(header.get('Ramp 1')).toBe('2 °C/min to 120 °C, 7 bar');
    expect(header.get('Dwell 1')).toBe('60 min, 7 bar, starts when the coldest point is in band (±5 °C)');
    expect(header.get('Ramp 2')).toBe('1.5 °C/min to 180 °C, 7 bar');
    expect(header.get('Dwell 2')).toBe('120 min, 7 bar, starts on the clock');
    expect(header.get('Cool 1')).toBe('3 °C/min to 60 °C, 7 bar');
  });

  it('writes every history step in engineering units, the unit in each column header', () => {
    const r = result();
    const rows = parse(resultsToCsv(r, meta));
    const { header, body } = section(rows, 'time histories');
    expect(header).toEqual(HISTORY_COLUMNS.map((c) => c.header));
    expect(header).toContain('time [min]');
    expect(header).toContain('part mid-plane [°C]');
    expect(header).toContain('pressure [bar]');
    expect(header).toContain('resin modulus mid-plane [MPa]');
    expect(body).toHaveLength(r.history.timeS.length);
    const col = (name: string) => header.indexOf(name);
    for (let i = 0; i < body.length; i++) {
      const row = body[i].map(Number);
      expectClose(row[col('time [min]')], r.history.timeS[i] / 60, 1e-8, 1e-12);
      expectClose(row[col('air [°C]')], r.history.airK[i] - 273.15, 1e-8, 1e-9);
      expectClose(row[col('part mid-plane [°C]')], r.history.midPlaneK[i] - 273.15, 1e-8, 1e-9);
      expectClose(row[col('pressure [bar]')], 7, 1e-12);
      expectClose(row[col('degree of cure min [-]')], r.history.alphaMin[i], 1e-8, 1e-12);
      expectClose(row[col('Tg mid-plane [°C]')], r.history.tgMidK[i] - 273.15, 1e-8, 1e-9);
      expectClose(row[col('resin modulus mid-plane [MPa]')], r.history.resinModulusMidPa[i] / 1e6, 1e-8);
    }
  });

  it('writes two stress points per ply with ply number, position, angle, z in mm and stresses in MPa', () => {
    const r = result();
    const { header, body } = section(parse(resultsToCsv(r, meta)), 'final ply stresses');
    expect(header).toEqual(['ply', 'position', 'angle [°]', 'z from tool side [mm]', 'sigma1 [MPa]', 'sigma2 [MPa]', 'tau12 [MPa]']);
    // Reference layup [0/45/−45/90]3s: ply 1 is 0°, ply 2 is 45° (demo-cards quasiIsotropic).
    expect(body).toEqual([
      ['1', 'bottom', '0', '0', '-12.5', '8', '0'],
      ['1', 'top', '0', '0.19', '-11', '7.5', '0.1'],
      ['2', 'bottom', '45', '0.19', '20', '-3', '-0.1'],
      ['2', 'top', '45', '0.38', '21.25', '-2.5', '0'],
    ]);
  });

  it('writes each limit verdict with its value, limit and unit', () => {
    const { body } = section(parse(resultsToCsv(result(), meta)), 'limits');
    expect(body).toEqual([
      ['Exotherm overshoot', '4.2', '10', '°C', 'pass', '210', '2.28'],
      ['Final degree of cure', '0.87', '0.9', '', 'fail', '', '0'],
    ]);
  });

  it('says "unsaved edits" when there is no revision, and names files by study and revision', () => {
    const rows = parse(resultsToCsv(result(), { ...meta, revision: null }));
    expect(rows.find((r) => r[0] === 'revision')?.[1]).toBe('unsaved edits');
    expect(csvFileName('Two-dwell cycle, "24 plies"', 3)).toBe('dwellform-two-dwell-cycle-24-plies-r3.csv');
    expect(csvFileName('Ölsumpf — Probe', null)).toBe('dwellform-olsumpf-probe-unsaved.csv');
    expect(csvFileName('Skin panel', null, 'demo')).toBe('dwellform-skin-panel-demo.csv');
    const demo = parse(resultsToCsv(result(), { ...meta, revision: null, revisionLabel: 'demo study (not in the team library)' }));
    expect(demo.find((r) => r[0] === 'revision')?.[1]).toBe('demo study (not in the team library)');
  });
});
