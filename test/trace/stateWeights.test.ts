/**
 * The weights of the scaled arclength (src/trace/stateWeights.ts): each state's largest size at the
 * starts, scaled into [a R, R] with R = |to − from| and a = TRACE.smallestStateShare.
 */
import { describe, expect, it } from 'vitest';
import { TRACE } from '../../src/defaults.js';
import { stateWeights } from '../../src/trace/stateWeights.js';

describe('stateWeights', () => {
  it('shrinks a state larger than the range to it, enlarges a small one to a share of it, keeps the rest', () => {
    const a = TRACE.smallestStateShare;
    const w = stateWeights([Float64Array.of(2, -0.001, 400), Float64Array.of(-5, 0.0005, 100)], 3, 10, 0);
    expect(w[0]).toBe(1); // 5 lies in [a·10, 10]
    expect(w[1]).toBeCloseTo((a * 10) / 0.001, 9);
    expect(w[2]).toBeCloseTo(10 / 400, 15);
  });

  it('keeps the weight 1 for a state that is zero, up to rounding, at every start', () => {
    const w = stateWeights([Float64Array.of(0, 3e-17), Float64Array.of(-2e-16, 0)], 2, 0, 5);
    expect(Array.from(w)).toEqual([1, 1]);
  });

  it('ignores values that are not finite', () => {
    const w = stateWeights([Float64Array.of(Number.NaN, 4), Float64Array.of(Number.POSITIVE_INFINITY, 1)], 2, 0, 2);
    expect(Array.from(w)).toEqual([1, 0.5]);
  });
});
