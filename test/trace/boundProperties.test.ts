/**
 * Property test (fast-check, fixed run numbers) of branches that end on a state bound where they meet
 * the branch the bound belongs to: random transcritical points on x = 0 with x ≥ 0, in random units,
 * with a second state driven by the first.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { loadModel } from '../../src/model/loadModel.js';
import { sweep } from '../../src/sweep.js';
import { repeatable } from '../helpers/repeatable.js';

const num = (x: number): string => x.toPrecision(17);

/**
 * Analytic: x' = x(λ − a) − (b/s)x², y' = c·x − k·y has the branch x = 0, y = 0 for every λ and the
 * branch x = s(λ − a)/b, y = c·x/k for λ > a, which meets the first at the transcritical point λ = a.
 * With x ≥ 0 the second ends there; nothing with x < 0 is traced, and each branch is traced once.
 */
function checkTranscritical(
  a: number, b: number, logScale: number, c: number, k: number, below: number, above: number, reverse: boolean,
): void {
  const s = 10 ** logScale;
  const model = loadModel([
    `states: { x: { start: ${num(s)}, min: 0 }, y: 0 }`,
    `parameters: { lam: ${num(a + above / 2)} }`,
    'equations:',
    `  x: x*(lam - ${num(a)}) - ${num(b / s)}*x^2`,
    `  y: ${num(c)}*x - ${num(k)}*y`, '',
  ].join('\n'), 'transcritical.yaml');
  const [from, to] = reverse ? [a + above, a - below] : [a - below, a + above];
  const { report, trace } = sweep(model, { vary: 'lam', from, to });
  expect(trace.warnings).toEqual([]);
  // Nothing beyond the bound but rounding (a branch on x = 0 may carry −1e-38).
  for (const branch of report.branches) for (const q of branch.points) expect(q.state.x!).toBeGreaterThanOrEqual(-1e-12 * s);
  const tc = report.events.filter((e) => e.type === 'transcritical');
  expect(tc).toHaveLength(1);
  expect(Math.abs(tc[0]!.parameter - a)).toBeLessThan(1e-9 * Math.max(1, Math.abs(a)));
  const ending = report.branches.filter((br) => br.stopped === 'state bound');
  expect(ending).toHaveLength(1);
  const pts = ending[0]!.points;
  const end = [pts[0]!, pts[pts.length - 1]!].reduce((p, q) => (q.state.x! < p.state.x! ? q : p));
  expect(end.state.x).toBe(0);
  expect(Math.abs(end.parameter - a)).toBeLessThan(1e-8 * Math.max(1, Math.abs(a)));
  for (const q of pts) expect(Math.abs(q.state.x! - (s * (q.parameter - a)) / b)).toBeLessThan(1e-8 * s);
}

describe('branches ending on a state bound', () => {
  it('end a random transcritical branch exactly where it meets x = 0, never beyond it', () => {
    fc.assert(fc.property(
      fc.double({ min: -2, max: 2, noNaN: true }), fc.double({ min: 0.2, max: 5, noNaN: true }),
      fc.double({ min: -3, max: 3, noNaN: true }), fc.double({ min: -2, max: 2, noNaN: true }),
      fc.double({ min: 0.1, max: 3, noNaN: true }), fc.double({ min: 0.3, max: 3, noNaN: true }),
      fc.double({ min: 0.3, max: 3, noNaN: true }), fc.boolean(),
      checkTranscritical,
    ), repeatable(41, 15));
  });

  it('traces the branch once when it is found both from a start and by switching at the point on the bound', () => {
    // Found by a shifted property run: the end point's tangent, solved next to the branch point, pointed
    // 10° off the branch, and the switched branch was not recognised as the one already traced.
    checkTranscritical(0, 2.46999654013662, 0, 0, 0.1, 0.3, 0.3000000000000004, false);
    checkTranscritical(0, 0.2, 0, 0, 0.1, 0.30000000000000016, 0.30000000000000054, true);
  });
});
