import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { referenceStudy } from '../solver/demo-cards';
import { simulate } from '../solver/simulate';
import { expectClose } from '../solver/test-support/expect-close';
import { analyseRunLog } from './analyse';
import { inspectRunLog } from './parse-run-log';
import { interpolate } from './series';

// Replay consistency: a run log written from the model's own prediction of the reference cycle (its air,
// pressure and predicted bag-side, mid-plane and tool-side temperatures, sampled every 30 s like a shop
// logger at 0.1 °C resolution) must replay to the same predictions. The expected values are the first
// simulation's; the replay runs the solver on a different input (a resampled record instead of segments),
// so agreement checks the whole chain: CSV writing, parsing, units, resampling and the record cycle.

const STEP_S = 30;

function logFromModel() {
  const params = referenceStudy();
  const first = simulate(params);
  const h = first.history;
  const end = h.timeS[h.timeS.length - 1];
  const at = (a: Float64Array, t: number) => interpolate(h.timeS, a, t);
  const data: string[][] = [];
  for (let t = 0; t <= end; t += STEP_S) {
    const c = (k: number) => (k - 273.15).toFixed(1);
    data.push([(t / 60).toFixed(3), c(at(h.airK, t)), c(at(h.bagSurfaceK, t)), c(at(h.midPlaneK, t)), c(at(h.toolSideSurfaceK, t)), (at(h.pressurePa, t) / 1e5).toFixed(2)]);
  }
  const csv = Papa.unparse({ fields: ['Time (min)', 'Air (°C)', 'TC1 bag-side (°C)', 'TC2 mid (°C)', 'TC3 tool-side (°C)', 'Pressure (bar)'], data });
  return { params, first, csv };
}

describe('replay consistency', () => {
  it("replays a log written from the model's own cycle to the same predictions", () => {
    const { params, first, csv } = logFromModel();
    const inspection = inspectRunLog(csv);
    expect(inspection.proposal.map((c) => c.role)).toEqual(['time', 'air', 'part', 'part', 'part', 'pressure']);
    const { record } = analyseRunLog({
      text: csv,
      fileName: 'model.csv',
      mapping: inspection.mapping,
      params,
      checkedAgainst: { studyId: 1, revisionId: 1, number: 1 },
      baseline: null,
    });
    expect(record.replayError).toBeNull();
    const replay = record.replay!;
    const a = first.summary;
    const b = replay.summary;
    // Tolerances: the air is re-read at 0.1 °C resolution and resampled every 30 s, and the record ends at
    // its last sample rather than exactly at the demould set point. Cure and Tg are insensitive to that, the
    // peak to a few tenths of a degree; warpage and spring-in are held to 2 % of their acceptance limits
    // (the scale a reviewer reads them on; both are small numbers for this flat, tool-held panel).
    expectClose(b.finalCureMin, a.finalCureMin, 0.005);
    expectClose(b.finalTgC, a.finalTgC, 0, 1.0);
    expectClose(b.peakPartC, a.peakPartC, 0, 0.5);
    expectClose(b.warpageMm, a.warpageMm, 0, 0.02 * params.limits.maxWarpageMm);
    expectClose(b.springInDeg, a.springInDeg, 0, 0.02 * params.limits.maxSpringInDeg);
    // The measured "TCs" are the model's own temperatures: measured − predicted stays within the logger's
    // 0.1 °C rounding plus the interpolation between samples.
    for (const tc of replay.atTcs) {
      expect(tc.rmsDifferenceC).not.toBeNull();
      expect(tc.rmsDifferenceC!).toBeLessThan(0.3);
      expect(Math.abs(tc.maxDifferenceC!)).toBeLessThan(1.0);
      expectClose(tc.finalCure!, a.finalCureMin, 0.01);
    }
    // and the spec check finds the model's own cycle within its own limits
    expect(record.spec.findings.filter((f) => f.severity === 'violation')).toEqual([]);
  });
});
