import type { StudyParams } from '../schemas/study';
import type { SimulateOptions, SimulationResult } from './simulation-result';

export type { SimulationResult, SimulationHistory, SimulateOptions, StepLimits, StudySummary, LimitCheck } from './simulation-result';
export { DEFAULT_STEP_LIMITS } from './simulation-result';

export const MODEL_VERSION = 'dwellform-solver 0.1.0';

/** Placeholder until the thermo-chemical and mechanical modules land (same signature as the final loop). */
export function simulate(params: StudyParams, options: SimulateOptions = {}): SimulationResult {
  void params;
  void options;
  throw new Error('simulate: not wired yet');
}
