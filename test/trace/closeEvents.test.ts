/**
 * Special points that share a continuation step with other changes of the eigenvalues: two simple
 * crossings inside one step leave every sign-change test unchanged, so the walker must see them in
 * the count of unstable eigenvalues and shorten the step; a Hopf pair must be told apart from other
 * pairs (moving frequencies, lightly damped modes, a neutral saddle) and a fold from a branch point.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { traceBranches } from '../../src/trace/traceBranches.js';
import { traceSettings } from '../../src/trace/traceSettings.js';
import type { System } from '../../src/types.js';
import { expectClose } from '../helpers/close.js';
import { textSystem as system } from './modelFile.js';
import { repeatable } from '../helpers/repeatable.js';

/** Hopf normal form r' = λr − r³, θ' = 1 in the states a, b (model equations). */
const UNIT_OSCILLATOR = '  a: lam*a - b - a*(a^2 + b^2)\n  b: a + lam*b - b*(a^2 + b^2)';

/** Traced over λ from −1 to 1 from the origin (four states): exactly one special point, a supercritical Hopf point at λ = 0 with ω = 1. */
function expectOneHopfAtZero(s: System): void {
  const trace = traceBranches(s, Float64Array.of(-1), traceSettings(0, -1, 1), [new Float64Array(4)]);
  expect(trace.events.map((e) => e.type)).toEqual(['hopf']);
  expectClose(trace.events[0]!.parameter, 0, { abs: 1e-10 }, 'Hopf at λ = 0 (analytic)');
  expectClose(trace.events[0]!.frequency!, 1, { rel: 1e-8 }, 'ω = 1 (analytic)');
  expect(trace.events[0]!.criticality).toBe('supercritical');
}

describe('special points inside one step', () => {
  it('finds two pitchforks 0.001 apart on a branch traced with steps 40 times longer', () => {
    // Analytic: x' = λx − x³, y' = (λ − ε)y − y³ with ε = 0.001. On (0, 0) the eigenvalues are λ and
    // λ − ε: pitchforks at λ = 0 (new branch x = ±√λ) and at λ = ε (y = ±√(λ − ε)), both turning there.
    const s = system(`
states: { x: 0, y: 0 }
parameters: { lam: -1, eps: 0.001 }
equations:
  x: lam*x - x^3
  y: (lam - eps)*y - y^3
`);
    const settings = traceSettings(0, -1, 1);
    expect(settings.dsMax).toBeGreaterThanOrEqual(0.001 * 40);
    const trace = traceBranches(s, Float64Array.of(-1, 0.001), settings, [Float64Array.of(0, 0)]);
    const points = trace.events.filter((e) => e.branch === 1).map((e) => [e.type, e.parameter] as const);
    expect(points.map((p) => p[0])).toEqual(['pitchfork', 'pitchfork']);
    expectClose(points[0]![1], 0, { abs: 1e-10 }, 'pitchfork at λ = 0 (analytic)');
    expectClose(points[1]![1], 0.001, { rel: 1e-8 }, 'pitchfork at λ = ε (analytic)');
    // Analytic: every equilibrium has x ∈ {0, ±√λ} and y ∈ {0, ±√(λ − ε)}. Branches: (0, 0); x = ±√λ
    // (one branch through λ = 0, followed both ways); y = ±√(λ − ε); and, from the pitchforks at λ = ε
    // on x = +√λ and on x = −√λ, the branches with both x and y non-zero.
    expect(trace.branches).toHaveLength(5);
    const onX = trace.events.filter((e) => e.branch === 2);
    expect(onX.map((e) => e.type)).toEqual(['pitchfork', 'pitchfork']);
    for (const e of onX) expectClose(e.parameter, 0.001, { rel: 1e-8 }, 'pitchfork at λ = ε on x = ±√λ (analytic)');
    for (const b of trace.branches) {
      for (const q of b.points) {
        const [x, y] = [q.state[0]!, q.state[1]!];
        if (Math.abs(x) > 1e-6) expectClose(x * x, q.parameter, { abs: 1e-9 }, 'x² = λ (analytic)');
        if (Math.abs(y) > 1e-6) expectClose(y * y, q.parameter - 0.001, { abs: 1e-9 }, 'y² = λ − ε (analytic)');
      }
    }
    expect(trace.warnings).toEqual([]);
  });

  it('finds two Hopf points 0.001 apart, each with its own frequency', () => {
    // Analytic: two uncoupled oscillators, each in polar form r' = (λ − c)r − r³, θ' = ω (Hopf normal
    // form, supercritical): on (0, 0, 0, 0) the eigenvalues are λ ± i and λ − ε ± 2i, so Hopf points
    // at λ = 0 (ω = 1) and λ = ε (ω = 2).
    const s = system(`
states: { a: 0, b: 0, c: 0, d: 0 }
parameters: { lam: -1, eps: 0.001 }
equations:
${UNIT_OSCILLATOR}
  c: (lam - eps)*c - 2*d - c*(c^2 + d^2)
  d: 2*c + (lam - eps)*d - d*(c^2 + d^2)
`);
    const trace = traceBranches(s, Float64Array.of(-1, 0.001), traceSettings(0, -1, 1), [new Float64Array(4)]);
    const hopf = trace.events.filter((e) => e.type === 'hopf');
    expect(hopf).toHaveLength(2);
    expectClose(hopf[0]!.parameter, 0, { abs: 1e-10 }, 'Hopf at λ = 0 (analytic)');
    expectClose(hopf[1]!.parameter, 0.001, { rel: 1e-8 }, 'Hopf at λ = ε (analytic)');
    expectClose(hopf[0]!.frequency!, 1, { rel: 1e-8 }, 'ω = 1 (analytic)');
    expectClose(hopf[1]!.frequency!, 2, { rel: 1e-8 }, 'ω = 2 (analytic)');
    // r' = μr − r³: the cubic term damps, so both are supercritical (Kuznetsov, 3rd ed., §3.4, section from memory).
    expect(hopf.map((e) => e.criticality)).toEqual(['supercritical', 'supercritical']);
  });

  it('follows the crossing pair, not a pair further from the axis whose frequency comes closer, across a long step', () => {
    // Analytic: on the origin the eigenvalues are λ ± i(1 + 2λ) and −0.3 ± i(1 − λ/2): the first pair
    // crosses at λ = 0 with ω = 1 (Hopf normal form r' = λr − r³: supercritical, Kuznetsov 3rd ed.
    // §3.4, section from memory). Across a step from λa < 0 to λb > 0 the second pair's frequency at λb is nearer 1 + 2λa
    // than the first pair's own: |−λb/2 − 2λa| < |2λb − 2λa|.
    const s = system(`
states: { a: 0, b: 0, c: 0, d: 0 }
parameters: { lam: -1 }
equations:
  a: lam*a - (1 + 2*lam)*b - a*(a^2 + b^2)
  b: (1 + 2*lam)*a + lam*b - b*(a^2 + b^2)
  c: -0.3*c - (1 - lam/2)*d
  d: (1 - lam/2)*c - 0.3*d
`);
    expectOneHopfAtZero(s);
  });

  it('locates the pair that crosses, not a pair that stays nearer the axis without crossing', () => {
    // Analytic: on the origin the eigenvalues are λ ± i and −0.001 ± 2i. Only the first pair crosses
    // (at λ = 0, ω = 1; r' = λr − r³: supercritical); the second stays at real part −0.001, nearer
    // the axis than the first at the start of the step across λ = 0.
    const s = system(`
states: { a: 0, b: 0, c: 0, d: 0 }
parameters: { lam: -1 }
equations:
${UNIT_OSCILLATOR}
  c: -0.001*c - 2*d
  d: 2*c - 0.001*d
`);
    expectOneHopfAtZero(s);
  });

  it('follows the crossing eigenvalue over its step when a damped mode lies as near the point iω on the axis', () => {
    // Analytic: on the origin the eigenvalues are λ ± 1.2i and −0.0005 ± 1.1672038111970313i; only the
    // first pair crosses (λ = 0, ω = 1.2, supercritical). One step ends at λ = ±0.0328, where both
    // pairs lie 0.0328 from 1.2i (a case a random property run met, either sweep direction); the
    // crossing eigenvalue is followed from its value at one end of the step to the other.
    const s = system(`
states: { a: 0, b: 0, c: 0, d: 0 }
parameters: { lam: -1 }
equations:
  a: lam*a - 1.2*b - a*(a^2 + b^2)
  b: 1.2*a + lam*b - b*(a^2 + b^2)
  c: -0.0005*c - 1.1672038111970313*d
  d: 1.1672038111970313*c - 0.0005*d
`);
    for (const [from, to] of [[-1, 1], [1, -1]] as const) {
      const trace = traceBranches(s, Float64Array.of(from), traceSettings(0, from, to), [new Float64Array(4)]);
      expect(trace.events.map((e) => e.type), `${from} → ${to}`).toEqual(['hopf']);
      expectClose(trace.events[0]!.parameter, 0, { abs: 1e-10 }, 'Hopf at λ = 0 (analytic)');
      expectClose(trace.events[0]!.frequency!, 1.2, { rel: 1e-8 }, 'ω = 1.2 (analytic)');
      expect(trace.events[0]!.criticality).toBe('supercritical');
    }
  });

  it('shortens the step where two pairs lie closer together than a step moves them, and follows the right one', () => {
    // Analytic: on the origin the eigenvalues are (λ − c) ± 1.2i with c = −0.002284733397991219 and
    // λ ± (1.2 + λ)i: Hopf points at λ = c (ω = 1.2) and λ = 0 (ω = 1.2), both supercritical. Near
    // λ = c the pairs lie 0.003 apart while a step moves them by 0.005 (a case a random property run
    // met), so the eigenvalue nearest the crossing one before the step is the other pair after it.
    const c = -0.002284733397991219;
    const s = system(`
states: { a: 0, b: 0, p: 0, q: 0 }
parameters: { lam: -1 }
equations:
  a: (lam - (${c}))*a - 1.2*b - a*(a^2 + b^2)
  b: 1.2*a + (lam - (${c}))*b - b*(a^2 + b^2)
  p: lam*p - (1.2 + lam)*q - p*(p^2 + q^2)
  q: (1.2 + lam)*p + lam*q - q*(p^2 + q^2)
`);
    const trace = traceBranches(s, Float64Array.of(-1), traceSettings(0, -1, 1), [new Float64Array(4)]);
    const events = [...trace.events].sort((x, y) => x.parameter - y.parameter);
    expect(events.map((e) => e.type)).toEqual(['hopf', 'hopf']);
    expectClose(events[0]!.parameter, c, { abs: 1e-12 }, 'Hopf at λ = c (analytic)');
    expectClose(events[1]!.parameter, 0, { abs: 1e-12 }, 'Hopf at λ = 0 (analytic)');
    for (const e of events) {
      expectClose(e.frequency!, 1.2, { rel: 1e-9 }, 'ω = 1.2 (analytic)');
      expect(e.criticality).toBe('supercritical');
    }
  });

  it('finds a Hopf point that shares its step with a neutral saddle', () => {
    // Analytic: on the origin the eigenvalues are λ ± i (Hopf at λ = 0, ω = 1, supercritical as above)
    // and the real pair 1, λ − 1.005, whose sum crosses 0 at λ = 0.005 (a neutral saddle, not a Hopf
    // point). Both flip the sign of the bialternate product: within one step the flips cancel.
    const s = system(`
states: { a: 0, b: 0, x: 0, y: 0 }
parameters: { lam: -1 }
equations:
${UNIT_OSCILLATOR}
  x: x
  y: (lam - 1.005)*y
`);
    expectOneHopfAtZero(s);
  });

  it('finds a fold that shares its step with a branch point, and no fold where a new branch turns at one', () => {
    // Analytic: x' = λ − x², y' = (x − x0)·y − y³. On y = 0 the branch λ = x² folds at (λ, x) = (0, 0)
    // and has a pitchfork where x = x0 (λ = x0²), 0.002 to 0.01 from the fold along the branch, well
    // inside one step (0.04). The new branch y² = x − x0, λ = x², turns at its pitchfork (dλ/dy = 0)
    // and, for x0 < 0, folds again at x = 0 (λ = 0) with y = ±√(−x0).
    const check = (x0: number): void => {
      const s = system(`
states: { x: 1, y: 0 }
parameters: { lam: 1 }
equations:
  x: lam - x^2
  y: (x - (${x0.toPrecision(17)}))*y - y^3
`);
      const trace = traceBranches(s, Float64Array.of(1), traceSettings(0, 1, -1), [Float64Array.of(1, 0)]);
      const onFirst = trace.events.filter((e) => e.branch === 1).sort((a, b) => a.parameter - b.parameter);
      expect(onFirst.map((e) => e.type)).toEqual(['fold', 'pitchfork']);
      expectClose(onFirst[0]!.parameter, 0, { abs: 1e-12 }, 'fold at λ = 0 (analytic)');
      expectClose(onFirst[1]!.parameter, x0 * x0, { abs: 1e-12 }, 'pitchfork at λ = x0² (analytic)');
      const onNew = trace.events.filter((e) => e.branch === 2);
      expect(onNew.map((e) => e.type)).toEqual(x0 < 0 ? ['fold', 'fold'] : []);
      for (const e of onNew) expectClose(e.parameter, 0, { abs: 1e-12 }, 'fold of the new branch at λ = 0 (analytic)');
    };
    for (const x0 of [-0.005, 0.002, 0.01]) check(x0);
    // And anywhere within a few steps of the fold.
    fc.assert(fc.property(fc.double({ min: -0.1, max: 0.1, noNaN: true }), (x0) => {
      fc.pre(Math.abs(x0) > 1e-3);
      check(x0);
    }), repeatable(57_721, 25));
  });

  it('says so when two crossings coincide and no step can part them, and still reaches the range end', () => {
    // Analytic: with ε = 0 both eigenvalues of (0, 0) are λ: a double zero eigenvalue at λ = 0.
    const s = system(`
states: { x: 0, y: 0 }
parameters: { lam: -1 }
equations:
  x: lam*x - x^3
  y: lam*y - y^3
`);
    const trace = traceBranches(s, Float64Array.of(-1), traceSettings(0, -1, 1), [Float64Array.of(0, 0)]);
    expect(trace.branches[0]!.stopped).toBe('left range');
    expect(trace.warnings).toHaveLength(1);
    expect(trace.warnings[0]).toMatch(/^between lam = -?\d\.\d+(e-\d+)? and -?\d\.\d+(e-\d+)? several eigenvalues cross/);
    const [a, b] = trace.warnings[0]!.match(/-?\d\.\d+(e-\d+)?/g)!.map(Number);
    expect(a! <= 0 && b! >= 0).toBe(true);
  });
});
