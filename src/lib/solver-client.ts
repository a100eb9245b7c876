/**
 * The only door to the solver worker. The worker starts lazily on first use;
 * `restartSolver()` terminates it (cancelling whatever it was doing) and the
 * next call starts a fresh one.
 */
import { wrap, type Remote } from 'comlink';
import type { SolverApi } from '../workers/solver-api';

let worker: Worker | null = null;
let remote: Remote<SolverApi> | null = null;

export function solver(): Remote<SolverApi> {
  if (!remote) {
    worker = new Worker(new URL('../workers/solver.worker.ts', import.meta.url), { type: 'module' });
    remote = wrap<SolverApi>(worker);
  }
  return remote;
}

export function restartSolver(): void {
  worker?.terminate();
  worker = null;
  remote = null;
}
