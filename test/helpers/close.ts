import { expect } from 'vitest';

/** |actual − expected| ≤ abs + rel·|expected|. */
export function expectClose(actual: number, expected: number, tol: { abs?: number; rel?: number }, label = ''): void {
  const bound = (tol.abs ?? 0) + (tol.rel ?? 0) * Math.abs(expected);
  const err = Math.abs(actual - expected);
  expect(err <= bound, `${label}: ${actual} vs ${expected} (error ${err}, bound ${bound})`).toBe(true);
}
