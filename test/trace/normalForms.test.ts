/**
 * The four codimension-one normal forms, where every branch and special point is known in closed
 * form (derivations beside each test).
 */
import { describe, expect, it } from 'vitest';
import { traceBranches } from '../../src/trace/traceBranches.js';
import { traceSettings } from '../../src/trace/traceSettings.js';
import { expectClose } from '../helpers/close.js';
import { expectAllConverged } from './expectTraced.js';
import { hopfNormalForm, scalarSystem } from './traceSystems.js';

const at = (l: number): Float64Array => Float64Array.of(l);
const x = (v: number): Float64Array => Float64Array.of(v);

/** traceBranches, plus the checks every trace here must pass: no warnings, every point converged. */
function run(...args: Parameters<typeof traceBranches>): ReturnType<typeof traceBranches> {
  const trace = traceBranches(...args);
  expect(trace.warnings).toEqual([]);
  expectAllConverged(trace);
  return trace;
}

describe('traceBranches on normal forms', () => {
  it('finds the fold of x\' = λ + x² at λ = 0 with the fold coefficient a = 1', () => {
    // Analytic: equilibria x = ±√(−λ) meet at (x, λ) = (0, 0), where g_x = 2x = 0 and g_λ = 1 ≠ 0.
    // Fold coefficient per src/detect/foldCoefficient.ts: A = g_x = 0, q = 1 (largest component
    // positive), p = 1, B(q, q) = g_xx = 2, so a = ½·p·B(q,q) = 1.
    const system = scalarSystem((u, l) => l + u * u, (u) => 2 * u, () => 1, () => 2, () => 0);
    const trace = run(system, at(0), traceSettings(0, -1, 1), [x(-1), x(1)]);
    expect(trace.branches).toHaveLength(1); // the start x = +1 lies on the branch traced from x = −1
    expect(trace.events.map((e) => e.type)).toEqual(['fold']);
    const fold = trace.events[0]!;
    expectClose(fold.parameter, 0, { abs: 1e-12 }, 'fold parameter (analytic 0)');
    expectClose(fold.state[0]!, 0, { abs: 1e-6 }, 'fold state (analytic 0)');
    expectClose(fold.foldCoefficient!, 1, { rel: 1e-6 }, 'fold coefficient (analytic 1)');
    expect(fold.residual).toBeLessThanOrEqual(1e-10);
    expect(fold.iterations).toBeGreaterThan(0);
    const branch = trace.branches[0]!;
    expect(branch.stopped).toBe('left range');
    // Both ends at λ = −1 (x = ±1): the branch turns at the fold and comes back.
    expect(branch.points[0]!.parameter).toBe(-1);
    expect(branch.points[branch.points.length - 1]!.parameter).toBe(-1);
  });

  it('classifies x\' = λx − x² at λ = 0 as transcritical and finds the branch x = λ by switching', () => {
    // Analytic: branches x = 0 and x = λ cross at (0, 0) with different slopes, neither turns there.
    const system = scalarSystem((u, l) => l * u - u * u, (u, l) => l - 2 * u, (u) => u, () => -2, () => 1);
    const trace = run(system, at(0), traceSettings(0, -1, 1), [x(0)]);
    expect(trace.events.map((e) => e.type)).toEqual(['transcritical']);
    const bp = trace.events[0]!;
    expectClose(bp.parameter, 0, { abs: 1e-12 }, 'branch point parameter (analytic 0)');
    expect(bp.branch).toBe(1);
    expect(bp.newBranches).toEqual([2]);
    expect(trace.branches).toHaveLength(2);
    const other = trace.branches[1]!;
    expect(other.origin).toEqual({ kind: 'switch', branch: 1, event: 1 });
    expect(other.stopped).toBe('left range');
    for (const q of other.points) expectClose(q.state[0]!, q.parameter, { abs: 1e-9 }, 'on x = λ (analytic)');
    const ends = [other.points[0]!.parameter, other.points[other.points.length - 1]!.parameter].sort();
    expect(ends).toEqual([-1, 1]);
  });

  it('classifies x\' = λx − x³ at λ = 0 as a pitchfork and follows both half-branches x = ±√λ', () => {
    // Analytic: x = 0 for all λ, and x² = λ, which turns at (0, 0) (λ = x² has dλ/dx = 0 there).
    const system = scalarSystem((u, l) => l * u - u ** 3, (u, l) => l - 3 * u * u, (u) => u, (u) => -6 * u, () => 1);
    const trace = run(system, at(0), traceSettings(0, -1, 1), [x(0)]);
    expect(trace.events.map((e) => e.type)).toEqual(['pitchfork']);
    expectClose(trace.events[0]!.parameter, 0, { abs: 1e-12 }, 'pitchfork parameter (analytic 0)');
    expect(trace.events[0]!.newBranches).toEqual([2]);
    const other = trace.branches[1]!;
    expect(other.stopped).toBe('left range');
    for (const q of other.points) expectClose(q.state[0]! ** 2, q.parameter, { abs: 1e-9 }, 'on x² = λ (analytic)');
    const first = other.points[0]!;
    const last = other.points[other.points.length - 1]!;
    // Both half-branches, each out to λ = 1 where x = ±1.
    expect([first.parameter, last.parameter]).toEqual([1, 1]);
    expectClose(Math.min(first.state[0]!, last.state[0]!), -1, { abs: 1e-10 }, 'lower end (analytic −1)');
    expectClose(Math.max(first.state[0]!, last.state[0]!), 1, { abs: 1e-10 }, 'upper end (analytic 1)');
  });

  it('finds the pitchfork of x\' = λx − x³ from the turning branch x² = λ and switches to x = 0', () => {
    // Analytic: started at (x, λ) = (1, 1) and swept down to −1, the branch x² = λ turns at (0, 0)
    // (where it crosses x = 0); the new branch is x = 0 for all λ. On x² = λ the state is only
    // determined to about the square root of the parameter accuracy.
    const system = scalarSystem((u, l) => l * u - u ** 3, (u, l) => l - 3 * u * u, (u) => u, (u) => -6 * u, () => 1);
    const trace = run(system, at(0), traceSettings(0, 1, -1), [x(1)]);
    expect(trace.events.map((e) => e.type)).toEqual(['pitchfork']);
    // Bound: the sweep's 1e-10 relative to the range (here 2). Along the turning branch the test
    // function changes sign linearly in arclength s while λ = x² moves like s², and the corrector
    // converges slowly next to the singular point, so this is the hardest case for the locator.
    expectClose(trace.events[0]!.parameter, 0, { abs: 2e-10 }, 'pitchfork parameter (analytic 0)');
    expectClose(trace.events[0]!.state[0]!, 0, { abs: 2e-5 }, 'pitchfork state (analytic 0)');
    expect(trace.events[0]!.newBranches).toEqual([2]);
    for (const q of trace.branches[1]!.points) expect(Math.abs(q.state[0]!)).toBeLessThanOrEqual(1e-9);
    const ends = trace.branches[1]!.points.map((q) => q.parameter);
    expect([Math.min(...ends), Math.max(...ends)]).toEqual([-1, 1]);
  });

  it('does not trace a branch twice when several starts lie on it', () => {
    // Analytic: at λ = 1 the equilibria are x = 0 and x = ±1; ±1 lie on one branch x² = λ.
    const system = scalarSystem((u, l) => l * u - u ** 3, (u, l) => l - 3 * u * u, (u) => u, (u) => -6 * u, () => 1);
    const trace = run(system, at(0), traceSettings(0, 1, -1), [x(1), x(-1), x(0)]);
    expect(trace.branches.map((b) => b.origin.kind)).toEqual(['start', 'start']);
    expect(trace.events.map((e) => e.type)).toEqual(['pitchfork']); // seen from both branches, reported once
    expect(trace.events[0]!.newBranches).toEqual([]); // the other branch was already traced from a start
  });

  for (const [s, criticality] of [[-1, 'supercritical'], [1, 'subcritical']] as const) {
    it(`finds the ${criticality} Hopf point of the normal form with s = ${s}, l1 = 2s/ω`, () => {
      // Analytic: w = x + iy obeys w' = (μ + iω)w + s·w|w|², so the origin has eigenvalues μ ± iω:
      // a Hopf point at μ = 0 with frequency ω and period 2π/ω. With the eigenvector normalised as
      // in src/detect/hopfCoefficient.ts, q = (1, −i)/√2 (A q = iωq), x = z q + z̄ q̄ gives
      // w = √2 z, hence z' = (μ + iω)z + 2s·z|z|²: c1 = 2s and l1 = Re c1 / ω = 2s/ω.
      const omega = 1.7;
      const trace = run(hopfNormalForm(s, omega), at(0), traceSettings(0, -1, 1), [new Float64Array(2)]);
      expect(trace.events.map((e) => e.type)).toEqual(['hopf']);
      const hopf = trace.events[0]!;
      expectClose(hopf.parameter, 0, { abs: 1e-12 }, 'Hopf parameter (analytic 0)');
      expectClose(hopf.frequency!, omega, { rel: 1e-12 }, 'frequency (analytic ω)');
      expectClose(hopf.period!, (2 * Math.PI) / omega, { rel: 1e-12 }, 'period (analytic 2π/ω)');
      expectClose(hopf.lyapunov!, (2 * s) / omega, { rel: 1e-6 }, 'l1 (analytic 2s/ω)');
      expect(hopf.criticality).toBe(criticality);
      expect(hopf.residual).toBeLessThanOrEqual(1e-10);
    });
  }
});
