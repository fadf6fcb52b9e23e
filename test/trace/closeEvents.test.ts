/**
 * Special points closer together than one continuation step: two simple crossings inside one step
 * leave every sign-change test unchanged, so the walker must see them in the count of unstable
 * eigenvalues and shorten the step until each sits in a bracket of its own.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { compileModel } from '../../src/compile/compileModel.js';
import { loadModel } from '../../src/model/loadModel.js';
import { traceBranches } from '../../src/trace/traceBranches.js';
import { traceSettings } from '../../src/trace/traceSettings.js';
import { expectClose } from '../helpers/close.js';

function system(text: string) {
  return compileModel(loadModel(text, 'close.yaml'));
}

/** Traced over λ from −1 to 1 from the origin (four states): exactly one special point, a supercritical Hopf point at λ = 0 with ω = 1. */
function expectOneHopfAtZero(s: ReturnType<typeof system>): void {
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
  a: lam*a - b - a*(a^2 + b^2)
  b: a + lam*b - b*(a^2 + b^2)
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
  a: lam*a - b - a*(a^2 + b^2)
  b: a + lam*b - b*(a^2 + b^2)
  c: -0.001*c - 2*d
  d: 2*c - 0.001*d
`);
    expectOneHopfAtZero(s);
  });

  it('finds a Hopf point that shares its step with a neutral saddle', () => {
    // Analytic: on the origin the eigenvalues are λ ± i (Hopf at λ = 0, ω = 1, supercritical as above)
    // and the real pair 1, λ − 1.005, whose sum crosses 0 at λ = 0.005 (a neutral saddle, not a Hopf
    // point). Both flip the sign of the bialternate product: within one step the flips cancel.
    const s = system(`
states: { a: 0, b: 0, x: 0, y: 0 }
parameters: { lam: -1 }
equations:
  a: lam*a - b - a*(a^2 + b^2)
  b: a + lam*b - b*(a^2 + b^2)
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
    }), { seed: 57_721, numRuns: 25 });
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

  it('finds every Hopf point of a random set of oscillators beside lightly damped modes, each at its value and frequency', () => {
    // Analytic: oscillator j, r' = (λ − c_j)r − r³ in polar form with frequency w_j + s_j·λ, has a
    // supercritical Hopf point at λ = c_j with ω = w_j + s_j·c_j; a damped mode −δ ± iν never crosses.
    // Frequencies move with λ and lie close to each other, and damped modes sit near the axis: the cases
    // in which matching eigenvalues across a step matters.
    const oscillator = fc.record({
      c: fc.double({ min: -0.8, max: 0.8, noNaN: true }),
      w: fc.double({ min: 1.2, max: 3, noNaN: true }),
      s: fc.double({ min: -1, max: 1, noNaN: true }),
    });
    const damped = fc.record({ delta: fc.double({ min: 5e-4, max: 0.5, noNaN: true }), nu: fc.double({ min: 0.5, max: 3, noNaN: true }) });
    fc.assert(fc.property(
      fc.array(oscillator, { minLength: 1, maxLength: 3 }), fc.array(damped, { maxLength: 2 }), fc.boolean(),
      (oscillators, modes, reverse) => {
        const cs = oscillators.map((o) => o.c).sort((a, b) => a - b);
        fc.pre(cs.every((c, k) => k === 0 || c - cs[k - 1]! > 1e-3)); // distinct crossings
        const lines: string[] = [];
        const states: string[] = [];
        const n = (x: number) => x.toPrecision(17);
        oscillators.forEach((o, j) => {
          const [a, b] = [`a${j}`, `b${j}`];
          const mu = `(lam - ${n(o.c)})`;
          const om = `(${n(o.w)} + ${n(o.s)}*lam)`;
          states.push(a, b);
          lines.push(`  ${a}: ${mu}*${a} - ${om}*${b} - ${a}*(${a}^2 + ${b}^2)`, `  ${b}: ${om}*${a} + ${mu}*${b} - ${b}*(${a}^2 + ${b}^2)`);
        });
        modes.forEach((m, j) => {
          const [c, d] = [`c${j}`, `d${j}`];
          states.push(c, d);
          lines.push(`  ${c}: -${n(m.delta)}*${c} - ${n(m.nu)}*${d}`, `  ${d}: ${n(m.nu)}*${c} - ${n(m.delta)}*${d}`);
        });
        const model = system(['states:', ...states.map((x) => `  ${x}: 0`), 'parameters: { lam: -1 }', 'equations:', ...lines].join('\n'));
        const [from, to] = reverse ? [1, -1] : [-1, 1];
        const trace = traceBranches(model, Float64Array.of(from), traceSettings(0, from, to), [new Float64Array(states.length)]);
        const found = trace.events.map((e) => {
          expect(e.type).toBe('hopf');
          expect(e.criticality).toBe('supercritical');
          return e;
        }).sort((a, b) => a.parameter - b.parameter);
        const expected = [...oscillators].sort((a, b) => a.c - b.c);
        expect(found).toHaveLength(expected.length);
        found.forEach((e, k) => {
          const o = expected[k]!;
          expectClose(e.parameter, o.c, { abs: 1e-9 }, 'Hopf at λ = c (analytic)');
          expectClose(e.frequency!, o.w + o.s * o.c, { rel: 1e-7 }, 'ω = w + s·c (analytic)');
        });
      },
    ), { seed: 27_182, numRuns: 40 });
  });

  it('finds every branch point of random uncoupled modes on the trivial branch, each of its kind at its value', () => {
    // Analytic: mode j, x' = (λ − d_j)x − x³ (pitchfork at λ = d_j) or x' = (λ − d_j)x − x² (transcritical
    // at λ = d_j); on the trivial branch x = 0 the eigenvalues are λ − d_j, one crossing per mode.
    // Crossings a little apart, often closer than one step (the largest step here is 0.04).
    const gap = fc.double({ min: 2e-3, max: 0.06, noNaN: true });
    fc.assert(fc.property(
      fc.double({ min: -0.7, max: 0.5, noNaN: true }), fc.array(gap, { maxLength: 2 }), fc.array(fc.boolean(), { minLength: 3, maxLength: 3 }), fc.boolean(),
      (first, gaps, cubic, reverse) => {
        const modes = [first, ...gaps.map((_, k) => first + gaps.slice(0, k + 1).reduce((a, b) => a + b, 0))]
          .map((d, j) => ({ d, cubic: cubic[j]! }));
        const states = modes.map((_, j) => `x${j}`);
        const model = system([
          'states:', ...states.map((x) => `  ${x}: 0`), 'parameters: { lam: -1 }', 'equations:',
          ...modes.map((m, j) => `  x${j}: (lam - ${m.d.toPrecision(17)})*x${j} - x${j}^${m.cubic ? 3 : 2}`),
        ].join('\n'));
        const [from, to] = reverse ? [1, -1] : [-1, 1];
        const trace = traceBranches(model, Float64Array.of(from), traceSettings(0, from, to), [new Float64Array(states.length)]);
        const onTrivial = trace.events.filter((e) => e.branch === 1).sort((a, b) => a.parameter - b.parameter);
        const expected = [...modes].sort((a, b) => a.d - b.d);
        expect(onTrivial.map((e) => e.type)).toEqual(expected.map((m) => (m.cubic ? 'pitchfork' : 'transcritical')));
        onTrivial.forEach((e, k) => expectClose(e.parameter, expected[k]!.d, { abs: 1e-9 }, 'branch point at λ = d (analytic)'));
      },
    ), { seed: 16_180, numRuns: 30 });
  });

  it('finds the Hopf points of oscillators mixed by a random rotation of the state, at their values and frequencies', () => {
    // Analytic: with x = Q·y (Q orthogonal), x' = Q·g(Qᵀx) has the eigenvalues and normal forms of
    // y' = g(y): oscillators r' = (λ − c)r ∓ k·r³ (super- or subcritical) and a damped mode, now
    // coupled in every state of x.
    fc.assert(fc.property(
      fc.array(fc.record({
        c: fc.double({ min: -0.8, max: 0.8, noNaN: true }), w: fc.double({ min: 1.2, max: 3, noNaN: true }),
        k: fc.double({ min: 0.2, max: 3, noNaN: true }), sub: fc.boolean(),
      }), { minLength: 1, maxLength: 2 }),
      fc.double({ min: 1e-3, max: 0.3, noNaN: true }),
      fc.array(fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }), { minLength: 15, maxLength: 15 }),
      (oscillators, delta, angles) => {
        fc.pre(oscillators.length < 2 || Math.abs(oscillators[0]!.c - oscillators[1]!.c) > 1e-3);
        const n = 2 * oscillators.length + 2;
        const q = rotation(angles, n);
        const num = (x: number) => x.toPrecision(17);
        const y = (k: number) => `y${k}`;
        const g: string[] = [];
        oscillators.forEach((o, j) => {
          const [a, b] = [y(2 * j), y(2 * j + 1)];
          const cubic = `${o.sub ? '+' : '-'} ${num(o.k)}`;
          g.push(`(lam - ${num(o.c)})*${a} - ${num(o.w)}*${b} ${cubic}*${a}*(${a}^2 + ${b}^2)`);
          g.push(`${num(o.w)}*${a} + (lam - ${num(o.c)})*${b} ${cubic}*${b}*(${a}^2 + ${b}^2)`);
        });
        g.push(`-${num(delta)}*${y(n - 2)} - 2*${y(n - 1)}`, `2*${y(n - 2)} - ${num(delta)}*${y(n - 1)}`);
        const text = [
          'states:', ...Array.from({ length: n }, (_, i) => `  x${i}: 0`),
          'parameters: { lam: -1 }',
          'definitions:',
          ...Array.from({ length: n }, (_, k) => `  ${y(k)}: ${Array.from({ length: n }, (_, i) => `(${num(q[i]![k]!)})*x${i}`).join(' + ')}`),
          ...g.map((e, k) => `  g${k}: ${e}`),
          'equations:',
          ...Array.from({ length: n }, (_, i) => `  x${i}: ${Array.from({ length: n }, (_, k) => `(${num(q[i]![k]!)})*g${k}`).join(' + ')}`),
        ].join('\n');
        const trace = traceBranches(system(text), Float64Array.of(-1), traceSettings(0, -1, 1), [new Float64Array(n)]);
        const found = [...trace.events].sort((a, b) => a.parameter - b.parameter);
        const expected = [...oscillators].sort((a, b) => a.c - b.c);
        expect(found.map((e) => e.type)).toEqual(expected.map(() => 'hopf'));
        found.forEach((e, k) => {
          expectClose(e.parameter, expected[k]!.c, { abs: 1e-9 }, 'Hopf at λ = c (analytic)');
          expectClose(e.frequency!, expected[k]!.w, { rel: 1e-7 }, 'ω = w (analytic)');
          // ζ' = (μ + iω)ζ ∓ k·ζ|ζ|² in ζ = a + ib: l1 = ∓2k/ω with ⟨q, q⟩ = 1 in Kuznetsov's §3.5 formula
          // (analytic, as for the normal form of test/detect/hopfCoefficient.test.ts), whatever the rotation.
          expect(e.criticality).toBe(expected[k]!.sub ? 'subcritical' : 'supercritical');
          expectClose(e.lyapunov!, ((expected[k]!.sub ? 2 : -2) * expected[k]!.k) / expected[k]!.w, { rel: 1e-5 }, 'l1 = ∓2k/ω (analytic)');
        });
      },
    ), { seed: 14_142, numRuns: 25 });
  });

  it('finds the fold of y1\' = λ − c + a·y1² mixed by a random rotation with stable modes, with |fold coefficient| = a', () => {
    // Analytic: equilibria λ = c − a·y1² (other y_j = 0) fold at λ = c; the coefficient ½⟨p, B(q, q)⟩ with
    // ‖q‖ = 1 is ±a (sign by the orientation convention of src/detect/foldCoefficient.ts) and does not
    // change under an orthogonal change of coordinates x = Q·y.
    fc.assert(fc.property(
      fc.double({ min: -0.8, max: 0.8, noNaN: true }), fc.double({ min: 0.2, max: 4, noNaN: true }),
      fc.array(fc.double({ min: 0.1, max: 2, noNaN: true }), { minLength: 1, maxLength: 3 }),
      fc.array(fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }), { minLength: 6, maxLength: 6 }),
      (c, a, damping, angles) => {
        const n = damping.length + 1;
        const q = rotation(angles, n);
        const num = (x: number) => x.toPrecision(17);
        const g = [`lam - ${num(c)} + ${num(a)}*y0^2`, ...damping.map((d, j) => `-${num(d)}*y${j + 1}`)];
        const text = [
          'states:', ...Array.from({ length: n }, (_, i) => `  x${i}: 0`),
          'parameters: { lam: -1 }',
          'definitions:',
          ...Array.from({ length: n }, (_, k) => `  y${k}: ${Array.from({ length: n }, (_, i) => `(${num(q[i]![k]!)})*x${i}`).join(' + ')}`),
          ...g.map((e, k) => `  g${k}: ${e}`),
          'equations:',
          ...Array.from({ length: n }, (_, i) => `  x${i}: ${Array.from({ length: n }, (_, k) => `(${num(q[i]![k]!)})*g${k}`).join(' + ')}`),
        ].join('\n');
        // The start at λ = −1: y0 = √((c + 1)/a), the other y_j = 0, in x = Q·y.
        const y0 = Math.sqrt((c + 1) / a);
        const start = Float64Array.from({ length: n }, (_, i) => q[i]![0]! * y0);
        const trace = traceBranches(system(text), Float64Array.of(-1), traceSettings(0, -1, 1), [start]);
        expect(trace.events.map((e) => e.type)).toEqual(['fold']);
        expectClose(trace.events[0]!.parameter, c, { abs: 1e-10 }, 'fold at λ = c (analytic)');
        expectClose(Math.abs(trace.events[0]!.foldCoefficient!), a, { rel: 1e-6 }, '|fold coefficient| = a (analytic)');
        expect(trace.branches[0]!.stopped).toBe('left range');
      },
    ), { seed: 69_314, numRuns: 25 });
  });

  it('on x\' = y, y\' = λ + b·x + x² + s·x·y finds the fold, and the Hopf point for b < 0 but not the neutral saddle for b > 0', () => {
    // Analytic: equilibria y = 0, x² + b·x + λ = 0 fold at λ = b²/4 (x = −b/2). The Jacobian
    // [[0, 1], [b + 2x, s·x]] has trace s·x and determinant −(b + 2x): at x = 0 (λ = 0) the trace
    // vanishes; for b < 0 the determinant −b is positive (a Hopf point, ω = √−b), for b > 0 negative
    // (a neutral saddle, real eigenvalues ±√b: not a Hopf point).
    fc.assert(fc.property(
      fc.double({ min: 0.1, max: 1, noNaN: true }), fc.boolean(), fc.constantFrom(-1, 1),
      (size, negative, sign) => {
        const b = negative ? -size : size;
        const model = system(`
states: { x: 0, y: 0 }
parameters: { lam: -1 }
equations:
  x: y
  y: lam + (${b.toPrecision(17)})*x + x^2 + (${sign})*x*y
`);
        // Both equilibria at λ = −1 (x² + b·x − 1 = 0); they lie on one branch through the fold.
        const root = (pm: number) => (-b + pm * Math.sqrt(b * b + 4)) / 2;
        const trace = traceBranches(model, Float64Array.of(-1), traceSettings(0, -1, 1), [Float64Array.of(root(1), 0), Float64Array.of(root(-1), 0)]);
        expect(trace.branches).toHaveLength(1);
        const events = [...trace.events].sort((p, q) => p.parameter - q.parameter);
        expect(events.map((e) => e.type)).toEqual(negative ? ['hopf', 'fold'] : ['fold']);
        const fold = events.at(-1)!;
        expectClose(fold.parameter, (b * b) / 4, { abs: 1e-10 }, 'fold at λ = b²/4 (analytic)');
        if (negative) {
          expectClose(events[0]!.parameter, 0, { abs: 1e-10 }, 'Hopf at λ = 0 (analytic)');
          expectClose(events[0]!.frequency!, Math.sqrt(-b), { rel: 1e-8 }, 'ω = √−b (analytic)');
        }
      },
    ), { seed: 11_235, numRuns: 30 });
  });
});


/** The product of the Givens rotations by angles[0], angles[1], … in the planes (0,1), (0,2), …, (n−2,n−1). */
function rotation(angles: readonly number[], n: number): number[][] {
  const q: number[][] = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? 1 : 0)));
  let k = 0;
  for (let a = 0; a < n; a++) {
    for (let b = a + 1; b < n; b++) {
      const [c, s] = [Math.cos(angles[k]!), Math.sin(angles[k]!)];
      k++;
      for (const row of q) {
        const [x, y] = [row[a]!, row[b]!];
        row[a] = c * x - s * y;
        row[b] = s * x + c * y;
      }
    }
  }
  return q;
}