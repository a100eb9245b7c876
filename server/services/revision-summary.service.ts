import type { StudyParams } from '../../shared/schemas/index';
import type { StudySummary } from '../../shared/solver/simulate';
import { createSummaryPool, type SummaryPool } from './summary-pool';

export type RevisionSummary = StudySummary & { modelVersion: string };

let pool: SummaryPool | null = null;

/**
 * The server never stores a client's numbers: it runs the shared solver on
 * the validated params (in a worker thread) and keeps the summary: final
 * cure, peak exotherm, warpage, spring-in, cycle time and the limit checks.
 * If the solver cannot finish a study, the revision is still saved (the
 * engineer's work is not lost) with no summary, and the reason is logged.
 */
export async function summarizeStudy(params: StudyParams, log: (msg: string) => void = console.warn): Promise<RevisionSummary | null> {
  pool ??= createSummaryPool();
  try {
    return (await pool.run(params)) as RevisionSummary;
  } catch (err) {
    log(`summary not computed: ${(err as Error).message}`);
    return null;
  }
}

/** Stops the worker threads (server shutdown, test teardown). */
export async function closeSummaryPool() {
  const p = pool;
  pool = null;
  await p?.close();
}
