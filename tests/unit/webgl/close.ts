import { expect } from 'vitest';

/** Tolerance check for floats (never exact equality). */
export function expectClose(actual: number, expected: number, tolerance: number, label = ''): void {
  expect(Number.isFinite(actual), `${label} finite`).toBe(true);
  expect(Math.abs(actual - expected), `${label}: ${actual} vs ${expected}`).toBeLessThanOrEqual(tolerance);
}
