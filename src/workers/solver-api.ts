/**
 * The one typed API object the solver worker exposes. Kept free of worker
 * globals so the client bridge can import its type and tests can call it
 * directly.
 */
import { transfer } from 'comlink';
import { convert, type Quantity, type UnitOf } from '../../shared/units';
import type { StudyParams } from '../../shared/schemas/study';
import { PREVIEW_OPTIONS, simulate, type SimulationResult } from '../../shared/solver/simulate';

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

/** 'full': what stays on screen, is checked and exported; 'preview': a quick look while a handle is dragged. */
export type SolveAccuracy = 'full' | 'preview';

/** A solve's answer, with what it cost inside the worker (the page's round trip adds messaging and waiting). */
export type Solved = { result: SimulationResult; accuracy: SolveAccuracy; workerMs: number };

export const solverApi = {
  /** Unit conversion through the shared units module (the worker's smoke check). */
  convert(quantity: Quantity, value: number, from: string, to: string): number {
    return convert(quantity, value, from as UnitOf<Quantity>, to as UnitOf<Quantity>);
  },

  /**
   * One simulation; the result's typed arrays are transferred, not copied. 'full' (the default) solves with
   * the solver's default step limits and records the through-thickness profiles: what stays on screen, is
   * checked against the limits and exported. 'preview' is the quick look while a handle is dragged: the
   * coarser PREVIEW_OPTIONS (half the steps, a looser cure tolerance, nodes on the ply faces only) and no
   * profiles.
   */
  simulate(params: StudyParams, accuracy: SolveAccuracy = 'full'): Solved {
    const t0 = performance.now();
    const result =
      accuracy === 'preview' ? simulate(params, PREVIEW_OPTIONS) : simulate(params, { recordProfiles: true });
    const solved: Solved = { result, accuracy, workerMs: performance.now() - t0 };
    return transfer(solved, resultBuffers(result));
  },
};

export type SolverApi = typeof solverApi;
