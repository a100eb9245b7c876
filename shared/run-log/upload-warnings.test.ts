import { describe, expect, it } from 'vitest';
import { inspectRunLog } from './parse-run-log';
import { analyseRunLog } from './analyse';
import { referenceStudy } from '../solver/demo-cards';
import { uploadWarnings } from './upload-warnings';

// The thresholds (30 min, 20 rows) are common practice, no source: a cure cycle's ramps and holds take hours.

function csv(header: string, rows: number, step: number): string {
  const lines = [`${header},Air (°C),TC1 (°C)`];
  for (let i = 0; i < rows; i++) lines.push(`${i * step},${20 + i},${19 + i}`);
  return lines.join('\n');
}

describe('uploadWarnings', () => {
  it('says when the time unit was inferred from the values, which unit and why', () => {
    const inspection = inspectRunLog(csv('Elapsed', 400, 1));
    const warnings = uploadWarnings(inspection, inspection.mapping);
    // the first 200 rows read for the proposal span 0…199: minutes by the value-range rule (31…2000)
    expect(warnings).toEqual(['The time column “Elapsed” names no unit; it is read as minutes (span 199 reads as minutes): a wrong unit stretches or squeezes every rate and hold.']);
    // the user sets seconds: the warning says it is their choice, and 399 s is a short log
    const asSeconds = { columns: inspection.mapping.columns.map((c) => (c.role === 'time' ? { ...c, unit: 's' as const } : c)) };
    const again = uploadWarnings(inspection, asSeconds);
    expect(again[0]).toContain('read as seconds (as set in the mapping)');
    expect(again[1]).toBe('The log covers only 6.65 min (less than 30 min): too short for a cure cycle; check the time unit or that the whole record was exported.');
  });

  it('says nothing about a labelled, long log', () => {
    const inspection = inspectRunLog(csv('Time (min)', 400, 1));
    expect(uploadWarnings(inspection, inspection.mapping)).toEqual([]);
  });

  it('warns about a log with fewer than 20 rows, and one shorter than 30 min', () => {
    const few = inspectRunLog(csv('Time (min)', 12, 5));
    expect(uploadWarnings(few, few.mapping)).toEqual(['Only 12 data rows (fewer than 20): too few to show a cure cycle\'s ramps and holds.']);
    const brief = inspectRunLog(csv('Time (s)', 300, 5));
    expect(uploadWarnings(brief, brief.mapping)).toEqual([
      'The log covers only 24.9 min (less than 30 min): too short for a cure cycle; check the time unit or that the whole record was exported.',
    ]);
  });

  it('reads the end of a long file from its tail', () => {
    const big = inspectRunLog(csv('Time (s)', 5000, 1)); // 4999 s = 83.3 min, past the rows the head reads
    expect(big.wholeFile).toBe(false);
    expect(big.lastRow?.[0]).toBe('4999');
    expect(uploadWarnings(big, big.mapping)).toEqual([]);
  });
});

describe('the stored record', () => {
  it('keeps the warnings as findings once the uploader confirmed them', () => {
    const text = csv('Elapsed', 15, 1);
    const { record } = analyseRunLog({ text, fileName: 'x.csv', mapping: inspectRunLog(text).mapping, params: referenceStudy(), checkedAgainst: { studyId: 1, revisionId: 1, number: 1 }, baseline: null });
    const rules = record.hygiene.findings.map((f) => f.rule);
    expect(rules.slice(0, 2)).toEqual(['hygiene.time-unit-inferred', 'hygiene.short-log']);
    expect(record.hygiene.findings[1]).toMatchObject({ value: 15, limit: 20, unit: 'rows', severity: 'warning' });
  });
});
