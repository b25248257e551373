import { expect } from 'vitest';

/** Asserts |actual - expected| <= tolerance, with a message naming the quantity. */
export function expectClose(actual: number, expected: number, tolerance: number, what = 'value'): void {
  const error = Math.abs(actual - expected);
  expect(Number.isFinite(actual), `${what} must be finite, got ${actual}`).toBe(true);
  expect(error, `${what}: got ${actual}, expected ${expected} +- ${tolerance}`).toBeLessThanOrEqual(tolerance);
}

/** Asserts a relative error bound. */
export function expectRelative(actual: number, expected: number, relative: number, what = 'value'): void {
  expectClose(actual, expected, Math.abs(expected) * relative, what);
}
