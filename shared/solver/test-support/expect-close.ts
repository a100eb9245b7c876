import { expect } from 'vitest';

/**
 * Float comparison for the numeric tests: passes when |actual − expected| ≤ max(relTol·|expected|, absTol).
 * The message names both values and the tolerance so a failing check reads like the reference it cites.
 */
export function expectClose(actual: number, expected: number, relTol: number, absTol = 0): void {
  const allowed = Math.max(relTol * Math.abs(expected), absTol);
  const diff = Math.abs(actual - expected);
  expect(
    Number.isFinite(actual) && diff <= allowed,
    `expected ${actual} to be within ${allowed.toExponential(2)} of ${expected} (off by ${diff.toExponential(3)})`,
  ).toBe(true);
}
