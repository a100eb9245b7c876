/**
 * The one typed API object the solver worker exposes. Kept free of worker
 * globals so the client bridge can import its type and tests can call it
 * directly.
 */
import { convert, type Quantity, type UnitOf } from '../../shared/units';

export const solverApi = {
  /** Unit conversion through the shared units module (the worker's smoke check). */
  convert(quantity: Quantity, value: number, from: string, to: string): number {
    return convert(quantity, value, from as UnitOf<Quantity>, to as UnitOf<Quantity>);
  },
};

export type SolverApi = typeof solverApi;
