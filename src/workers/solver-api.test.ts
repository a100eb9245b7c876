import { describe, expect, it } from 'vitest';
import { referenceStudy } from '../../shared/solver/demo-cards';
import { resultBuffers, solverApi } from './solver-api';

describe('solver worker API', () => {
  it('hands every typed array of a simulation to the transfer list, each buffer once', () => {
    const { result, accuracy } = solverApi.simulate(referenceStudy());
    expect(accuracy).toBe('full');
    const groups = [result.history, result.profiles, result.nodes, result.plyStresses, { segmentBoundsS: result.segmentBoundsS }];
    const views = groups.flatMap((g) => Object.values(g).filter((v) => ArrayBuffer.isView(v)));
    const buffers = resultBuffers(result);
    expect(new Set(buffers).size).toBe(buffers.length);
    for (const view of views) expect(buffers).toContain((view as Float64Array).buffer);
    // Profiles were asked for: one row of temperatures per recorded step.
    expect(result.profiles.temperatureK.length).toBe(result.history.timeS.length * result.profiles.zM.length);
  });

  it('a preview solves with about half the steps and no profiles, close to the full answer', () => {
    const full = solverApi.simulate(referenceStudy()).result;
    const preview = solverApi.simulate(referenceStudy(), 'preview');
    expect(preview.accuracy).toBe('preview');
    expect(preview.workerMs).toBeGreaterThan(0);
    expect(preview.result.profiles.temperatureK.length).toBe(0);
    expect(preview.result.steps).toBeLessThan(0.7 * full.steps);
    // shared/solver/README.md, "Time step": within a few hundredths of a kelvin of the default solution.
    expect(Math.abs(preview.result.summary.peakPartC - full.summary.peakPartC)).toBeLessThan(0.2);
    expect(Math.abs(preview.result.summary.finalCureMin - full.summary.finalCureMin)).toBeLessThan(1e-3);
  });
});
