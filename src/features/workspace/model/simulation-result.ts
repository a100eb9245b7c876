/**
 * The solver's result as the workspace draws it (the contract in
 * shared/solver/simulate.ts). Histories are SI typed arrays; the summary is in
 * engineering units.
 */
export type { SimulationResult, StudySummary } from '../../../../shared/solver/simulate';
