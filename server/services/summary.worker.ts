/**
 * Worker thread that runs the shared solver for revision summaries, so a
 * save's ~0.1 s of solver time never blocks the server's event loop.
 */
import { parentPort } from 'node:worker_threads';
import { simulate } from '../../shared/solver/simulate';
import type { StudyParams } from '../../shared/schemas/index';

parentPort!.on('message', ({ id, params }: { id: number; params: StudyParams }) => {
  try {
    const result = simulate(params);
    parentPort!.postMessage({ id, summary: { ...result.summary, modelVersion: result.modelVersion } });
  } catch (err) {
    parentPort!.postMessage({ id, error: (err as Error).message ?? String(err) });
  }
});
