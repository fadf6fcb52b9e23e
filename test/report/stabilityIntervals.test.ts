import { describe, expect, it } from 'vitest';
import { stabilityIntervals } from '../../src/report/stabilityIntervals.js';
import type { Branch, SpecialPoint } from '../../src/types.js';
import { point } from './fixtures.js';

/**
 * A switched branch that turns at its pitchfork: x' = λx − x³ has the branch λ = x² (analytic),
 * stable on both halves (eigenvalue λ − 3x² = −2x² < 0), switched from the trivial branch at the
 * pitchfork λ = 0. Traced in arclength order from x = 1 through x = 0 to x = −1 (λ 1 → 0 → 1),
 * with the turn placed off the grid: the points are x = 1, 0.8, …, 0.2, −0.1, −0.3, … −0.9.
 */
function turningBranch(): { branch: Branch; events: SpecialPoint[] } {
  const xs = [1, 0.8, 0.6, 0.4, 0.2, -0.1, -0.3, -0.5, -0.7, -0.9];
  const points = xs.map((x, i) => point(i, x * x, [x], [{ re: -2 * x * x, im: 0 }]));
  const pitchfork: SpecialPoint = {
    id: 1, type: 'pitchfork', branch: 1, parameter: 0, state: Float64Array.of(0), eigenvalues: [{ re: 0, im: 0 }],
    between: [3, 4], testBefore: -1, testAfter: 1, residual: 0, iterations: 2, newBranches: [2],
  };
  return {
    branch: { id: 2, origin: { kind: 'switch', branch: 1, event: 1 }, stopped: 'left range', points },
    events: [pitchfork],
  };
}

describe('stabilityIntervals', () => {
  it('ends a run where a switched branch turns, at the pitchfork it started from', () => {
    const { branch, events } = turningBranch();
    const runs = stabilityIntervals(branch, events);
    // Analytic: λ runs 1 → 0 (the pitchfork) and back 0 → 0.81 (x = −0.9), stable throughout.
    expect(runs).toEqual([
      { stable: true, from: 1, to: 0, unstableCount: 0 },
      { stable: true, from: 0, to: 0.81, unstableCount: 0 },
    ]);
  });
});
