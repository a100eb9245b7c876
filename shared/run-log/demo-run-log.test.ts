import { describe, expect, it } from 'vitest';
import { referenceStudy } from '../solver/demo-cards';
import { DEMO_RUN_LOG_EXCURSION, demoRunLogCsv } from './demo-run-log';
import { checkHygiene } from './hygiene';
import { inspectRunLog, parseRunLog } from './parse-run-log';
import { checkSpec } from './spec-check';

function checkDemo(secondHoldMin?: number) {
  const params = referenceStudy();
  const csv = demoRunLogCsv(params, { secondHoldMin });
  const inspection = inspectRunLog(csv);
  const log = parseRunLog(csv, inspection.mapping);
  const hygiene = checkHygiene(log);
  return { inspection, log, hygiene, spec: checkSpec(log, params, { excluded: hygiene.excluded }) };
}

describe('the demo run log', () => {
  it('maps without edits: time stamps, air, tool, three part TCs, psi, inHg and a text column ignored', () => {
    const { inspection } = checkDemo();
    expect(inspection.proposal.map((c) => c.role)).toEqual(['time', 'air', 'tool', 'part', 'part', 'part', 'pressure', 'vacuum', 'ignore']);
    expect(inspection.proposal.every((c) => c.confident)).toBe(true);
  });

  it('is clean data with exactly one excursion: hold 2 ran long', () => {
    const { hygiene, spec } = checkDemo();
    expect(hygiene.findings).toEqual([]);
    expect(spec.findings.map((f) => f.rule)).toEqual(['spec.hold-long']);
    const f = spec.findings[0];
    expect(f.message).toMatch(/^hold 2 at 180 °C lasted/);
    expect(Math.abs(f.value! - DEMO_RUN_LOG_EXCURSION.ranMin)).toBeLessThanOrEqual(1);
    expect(spec.leadingTc).toBe('TC1 leading bag-side');
    expect(spec.laggingTc).toBe('TC3 lagging tool-side');
  });

  it('passes the spec check when the hold runs its 120 min', () => {
    expect(checkDemo(120).spec.findings).toEqual([]);
  });
});
