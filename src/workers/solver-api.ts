/**
 * The one typed API object the solver worker exposes. Kept free of worker
 * globals so the client bridge can import its type and tests can call it
 * directly.
 */
import { transfer } from 'comlink';
import { convert, type Quantity, type UnitOf } from '../../shared/units';
import type { StudyParams } from '../../shared/schemas/study';
import { simulate, type SimulationResult } from '../../shared/solver/simulate';

/** Every typed-array buffer in a result, so the answer moves to the page instead of being copied. */
export function resultBuffers(result: SimulationResult): ArrayBuffer[] {
  const buffers = new Set<ArrayBuffer>();
  const collect = (group: object) => {
    for (const value of Object.values(group)) {
      if (ArrayBuffer.isView(value) && value.buffer instanceof ArrayBuffer) buffers.add(value.buffer);
    }
  };
  collect(result.history);
  collect(result.profiles);
  collect(result.nodes);
  collect(result.plyStresses);
  if (ArrayBuffer.isView(result.segmentBoundsS) && result.segmentBoundsS.buffer instanceof ArrayBuffer) {
    buffers.add(result.segmentBoundsS.buffer);
  }
  return [...buffers];
}

export const solverApi = {
  /** Unit conversion through the shared units module (the worker's smoke check). */
  convert(quantity: Quantity, value: number, from: string, to: string): number {
    return convert(quantity, value, from as UnitOf<Quantity>, to as UnitOf<Quantity>);
  },

  /** One full simulation; the result's typed arrays are transferred, not copied. */
  simulate(params: StudyParams): SimulationResult {
    const result = simulate(params, { recordProfiles: true });
    return transfer(result, resultBuffers(result));
  },
};

export type SolverApi = typeof solverApi;
