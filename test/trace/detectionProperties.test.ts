/**
 * Property tests (fast-check, fixed run numbers) over families whose special points are known in closed
 * form, chosen where detection is delicate: crossings closer than one step, frequencies that move
 * and nearly meet, lightly damped modes beside crossing ones, neutral saddles, and the same
 * eigenvalues mixed into every state by a random rotation.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { traceBranches } from '../../src/trace/traceBranches.js';
import { traceSettings } from '../../src/trace/traceSettings.js';
import type { System } from '../../src/types.js';
import { expectClose } from '../helpers/close.js';
import { textSystem as system } from './modelFile.js';
import { repeatable } from '../helpers/repeatable.js';
import { bisect } from './bisect.js';

const num = (x: number): string => x.toPrecision(17);

/**
 * The model x' = Q·g(Qᵀx) in the states x0, x1, … with parameter lam: g is given as expressions in
 * y0, y1, … (y = Qᵀx, written as model definitions), Q as the rows of an orthogonal matrix.
 */
function rotatedSystem(g: readonly string[], q: readonly (readonly number[])[]): System {
  const n = g.length;
  const sum = (term: (k: number) => string): string => Array.from({ length: n }, (_, k) => term(k)).join(' + ');
  return system([
    'states:', ...Array.from({ length: n }, (_, i) => `  x${i}: 0`),
    'parameters: { lam: -1 }',
    'definitions:',
    ...Array.from({ length: n }, (_, k) => `  y${k}: ${sum((i) => `(${num(q[i]![k]!)})*x${i}`)}`),
    ...g.map((e, k) => `  g${k}: ${e}`),
    'equations:',
    ...Array.from({ length: n }, (_, i) => `  x${i}: ${sum((k) => `(${num(q[i]![k]!)})*g${k}`)}`),
  ].join('\n'));
}

describe('special points of random families', () => {
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
        oscillators.forEach((o, j) => {
          const [a, b] = [`a${j}`, `b${j}`];
          const mu = `(lam - ${num(o.c)})`;
          const om = `(${num(o.w)} + ${num(o.s)}*lam)`;
          states.push(a, b);
          lines.push(`  ${a}: ${mu}*${a} - ${om}*${b} - ${a}*(${a}^2 + ${b}^2)`, `  ${b}: ${om}*${a} + ${mu}*${b} - ${b}*(${a}^2 + ${b}^2)`);
        });
        modes.forEach((m, j) => {
          const [c, d] = [`c${j}`, `d${j}`];
          states.push(c, d);
          lines.push(`  ${c}: -${num(m.delta)}*${c} - ${num(m.nu)}*${d}`, `  ${d}: ${num(m.nu)}*${c} - ${num(m.delta)}*${d}`);
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
    ), repeatable(27_182, 40));
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
    ), repeatable(16_180, 30));
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
        const y = (k: number) => `y${k}`;
        const g: string[] = [];
        oscillators.forEach((o, j) => {
          const [a, b] = [y(2 * j), y(2 * j + 1)];
          const cubic = `${o.sub ? '+' : '-'} ${num(o.k)}`;
          g.push(`(lam - ${num(o.c)})*${a} - ${num(o.w)}*${b} ${cubic}*${a}*(${a}^2 + ${b}^2)`);
          g.push(`${num(o.w)}*${a} + (lam - ${num(o.c)})*${b} ${cubic}*${b}*(${a}^2 + ${b}^2)`);
        });
        g.push(`-${num(delta)}*${y(n - 2)} - 2*${y(n - 1)}`, `2*${y(n - 2)} - ${num(delta)}*${y(n - 1)}`);
        const trace = traceBranches(rotatedSystem(g, q), Float64Array.of(-1), traceSettings(0, -1, 1), [new Float64Array(n)]);
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
    ), repeatable(14_142, 25));
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
        const g = [`lam - ${num(c)} + ${num(a)}*y0^2`, ...damping.map((d, j) => `-${num(d)}*y${j + 1}`)];
        // The start at λ = −1: y0 = √((c + 1)/a), the other y_j = 0, in x = Q·y.
        const y0 = Math.sqrt((c + 1) / a);
        const start = Float64Array.from({ length: n }, (_, i) => q[i]![0]! * y0);
        const trace = traceBranches(rotatedSystem(g, q), Float64Array.of(-1), traceSettings(0, -1, 1), [start]);
        expect(trace.events.map((e) => e.type)).toEqual(['fold']);
        expectClose(trace.events[0]!.parameter, c, { abs: 1e-10 }, 'fold at λ = c (analytic)');
        expectClose(Math.abs(trace.events[0]!.foldCoefficient!), a, { rel: 1e-6 }, '|fold coefficient| = a (analytic)');
        expect(trace.branches[0]!.stopped).toBe('left range');
      },
    ), repeatable(69_314, 25));
  });

  it('finds both Hopf points of a random bubble of oscillations narrower than a step, beside a damped mode', () => {
    // Analytic: r' = (eps − (λ − c)²)r − r³ with frequency w has supercritical Hopf points at λ = c ± sqrt(eps);
    // a third state decays at rate d. Windows from 2e-4 to 0.06 of the range: most are shorter than one step.
    fc.assert(fc.property(
      fc.double({ min: 0.15, max: 0.85, noNaN: true }), fc.double({ min: -8, max: -3, noNaN: true }),
      fc.double({ min: 0.5, max: 3, noNaN: true }), fc.double({ min: 0.05, max: 2, noNaN: true }), fc.boolean(),
      (c, logEps, w, d, reverse) => {
        const eps = 10 ** logEps;
        const mu = `(${num(eps)} - (lam - ${num(c)})^2)`;
        const bubble = system([
          'states: { a: 0, b: 0, z: 0 }', 'parameters: { lam: 0 }', 'equations:',
          `  a: ${mu}*a - ${num(w)}*b - a*(a^2 + b^2)`, `  b: ${num(w)}*a + ${mu}*b - b*(a^2 + b^2)`, `  z: -${num(d)}*z`,
        ].join('\n'));
        const [from, to] = reverse ? [1, 0] : [0, 1];
        const trace = traceBranches(bubble, Float64Array.of(from), traceSettings(0, from, to), [new Float64Array(3)]);
        const at = trace.events.filter((e) => e.type === 'hopf').map((e) => e.parameter).sort((x, y) => x - y);
        expect(at).toHaveLength(2);
        expectClose(at[0]!, c - Math.sqrt(eps), { rel: 1e-9 }, 'Hopf at c − sqrt(eps) (analytic)');
        expectClose(at[1]!, c + Math.sqrt(eps), { rel: 1e-9 }, 'Hopf at c + sqrt(eps) (analytic)');
        for (const e of trace.events) expect(e.criticality).toBe('supercritical');
      },
    ), repeatable(31_415, 20));
  });

  it('on x\' = y, y\' = λ + b·x + x² + s·x·y finds the fold, and the Hopf point for b < 0 but not the neutral saddle for b > 0', () => {
    // Analytic: equilibria y = 0, x² + b·x + λ = 0 fold at λ = b²/4 (x = −b/2). The Jacobian
    // [[0, 1], [b + 2x, s·x]] has trace s·x and determinant −(b + 2x): at x = 0 (λ = 0) the trace
    // vanishes; for b < 0 the determinant −b is positive (a Hopf point, ω = √−b), for b > 0 negative
    // (a neutral saddle, real eigenvalues ±√b: not a Hopf point). Near b = 0 (a Bogdanov–Takens point)
    // the pair that crosses at the Hopf point turns real just before the fold, all within a stretch
    // shorter than a step. First Lyapunov coefficient at the Hopf point: with u = x, v = −y/ω the system
    // is u' = −ωv, v' = ωu + g, g = −u²/ω + s·u·v, and the planar formula of Guckenheimer & Holmes
    // (1983, §3.4; equation number from memory) gives 16a = −g_uv(g_uu + g_vv)/ω = 2s/ω²: sub-
    // critical for s = 1, supercritical for s = −1.
    fc.assert(fc.property(
      fc.double({ min: -3, max: 0, noNaN: true }), fc.boolean(), fc.constantFrom(-1, 1),
      (decades, negative, sign) => {
        const b = (negative ? -1 : 1) * 10 ** decades;
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
          expect(events[0]!.criticality).toBe(sign > 0 ? 'subcritical' : 'supercritical');
        }
        expect(trace.warnings).toEqual([]);
      },
    ), repeatable(11_235, 40));
  });

  it('turns every V-shaped corner of x\' = λ − a|x| − b·x − c·x³, reports it as a fold there, and finds the smooth fold', () => {
    // Analytic: equilibria λ = a|x| + b·x + c·x³ (|b| < a): a corner at (0, 0) where the branch turns
    // back (slopes a + b > 0 and b − a < 0), and for x < 0 a smooth fold at x_f = −√((a − b)/(3c)),
    // λ_f = (2/3)(a − b)|x_f|. A damped state y' = x − d·y (y = x/d) makes it two-dimensional.
    fc.assert(fc.property(
      fc.double({ min: 0.2, max: 5, noNaN: true }), fc.double({ min: -0.95, max: 0.95, noNaN: true }),
      fc.double({ min: 0.05, max: 2, noNaN: true }), fc.double({ min: 0.3, max: 3, noNaN: true }),
      (a, share, c, d) => {
        const b = share * a;
        const model = system(`states: { x: 1, y: 0 }\nparameters: { lam: 1 }\nequations:
  x: lam - ${num(a)}*abs(x) - (${num(b)})*x - ${num(c)}*x^3
  y: x - ${num(d)}*y`);
        const x2 = bisect((x) => (a + b) * x + c * x ** 3 - 2, 0, 10); // the start at λ = 2, x > 0
        const trace = traceBranches(model, Float64Array.of(-1), traceSettings(0, -1, 2), [{ state: Float64Array.of(x2, x2 / d), parameter: 2 }]);
        expect(trace.warnings).toEqual([]);
        const corners = trace.events.filter((e) => e.corner === true);
        expect(corners.map((e) => e.type)).toEqual(['fold']);
        // Found on the old tangent's ray by bisection, so to the corrector's accuracy: 1e-10 of the range.
        expectClose(corners[0]!.parameter, 0, { abs: 1e-10 }, 'corner at λ = 0 (analytic)');
        expect(corners[0]!.foldCoefficient).toBeUndefined();
        const smooth = trace.events.filter((e) => e.corner !== true);
        const xf = -Math.sqrt((a - b) / (3 * c));
        const lf = (2 / 3) * (a - b) * Math.abs(xf);
        expect(smooth.map((e) => e.type)).toEqual(lf < 2 ? ['fold'] : []);
        if (lf < 2) expectClose(smooth[0]!.parameter, lf, { abs: 1e-9 * (1 + lf) }, 'λ_f = (2/3)(a − b)|x_f| (analytic)');
        const xs = trace.branches[0]!.points.map((q) => q.state[0]!);
        expect(Math.min(...xs)).toBeLessThan(-0.1); // through the corner onto the other piece, not back
        for (const q of trace.branches[0]!.points) {
          const x = q.state[0]!;
          expectClose(q.parameter, a * Math.abs(x) + b * x + c * x ** 3, { abs: 1e-8 * (1 + Math.abs(q.parameter)) }, 'λ = a|x| + bx + cx³ (analytic)');
        }
      },
    ), repeatable(31_415, 30));
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