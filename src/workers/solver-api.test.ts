import { describe, expect, it } from 'vitest';
import { referenceStudy } from '../../shared/solver/demo-cards';
import { resultBuffers, solverApi } from './solver-api';

describe('solver worker API', () => {
  it('hands every typed array of a simulation to the transfer list, each buffer once', () => {
    const result = solverApi.simulate(referenceStudy());
    const groups = [result.history, result.profiles, result.nodes, result.plyStresses, { segmentBoundsS: result.segmentBoundsS }];
    const views = groups.flatMap((g) => Object.values(g).filter((v) => ArrayBuffer.isView(v)));
    const buffers = resultBuffers(result);
    expect(new Set(buffers).size).toBe(buffers.length);
    for (const view of views) expect(buffers).toContain((view as Float64Array).buffer);
    // Profiles were asked for: one row of temperatures per recorded step.
    expect(result.profiles.temperatureK.length).toBe(result.history.timeS.length * result.profiles.zM.length);
  });
});
