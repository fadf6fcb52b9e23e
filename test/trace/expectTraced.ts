import { expect } from 'vitest';
import type { Trace } from '../../src/types.js';

/** Every traced point was corrected to the Newton tolerance, and every event carries diagnostics. */
export function expectAllConverged(trace: Trace): void {
  let worst = 0;
  for (const b of trace.branches) for (const q of b.points) worst = Math.max(worst, q.residual);
  expect(worst).toBeLessThanOrEqual(trace.settings.absTol);
  for (const e of trace.events) {
    expect(e.residual).toBeLessThanOrEqual(trace.settings.absTol);
    expect(Number.isInteger(e.iterations)).toBe(true);
  }
}
