/**
 * The library pipeline sweep(): model → equilibria at the start, nominal value and end → branches
 * → report with the design margin. Reference values are computed here from closed forms.
 */
import { describe, expect, it } from 'vitest';
import { message, NumericalError, UsageError } from '../src/errors.js';
import { loadModel, readModelFile } from '../src/model/loadModel.js';
import { cornerMeaning } from '../src/report/eventWords.js';
import { searchValues, sweep } from '../src/sweep.js';
import { STOP_WHY } from '../src/trace/reportStops.js';
import { bisect } from './trace/bisect.js';

/**
 * Toggle switch of Gardner, Cantor & Collins (2000), u' = α1/(1 + v²) − u, v' = 10/(1 + u²) − v
 * (models/genetic-toggle-switch.yaml). Equilibria parametrised by u: v = 10/(1 + u²),
 * α1 = u(1 + v²) (analytic). With J = [[−1, −2α1 v/(1+v²)²], [−20u/(1+u²)², −1]], folds are the
 * zeros of det J = 1 − (2α1 v/(1+v²)²)(20u/(1+u²)²) = 1 − (2uv/(1+v²))(20u/(1+u²)²).
 */
function toggleFold(uLo: number, uHi: number): number {
  const v = (u: number) => 10 / (1 + u * u);
  const det = (u: number) => 1 - ((2 * u * v(u)) / (1 + v(u) ** 2)) * ((20 * u) / (1 + u * u) ** 2);
  const u = bisect(det, uLo, uHi);
  return u * (1 + v(u) ** 2);
}

describe('sweep()', () => {
  it('reports a Hopf point that sits exactly on an end of the range', () => {
    // Brusselator (Prigogine & Lefever 1968): Hopf point at b = 1 + a² = 2 for a = 1 (models/brusselator.yaml).
    // A range that starts or ends there sees the pair on the axis at its end, with no sign change.
    const model = readModelFile('models/brusselator.yaml');
    for (const [from, to] of [[2, 4], [4, 2], [0.5, 2], [2, 0.5]] as const) {
      const { report } = sweep(model, { vary: 'b', from, to });
      expect(report.events.map((e) => e.type), `${from} → ${to}`).toEqual(['hopf']);
      expect(Math.abs(report.events[0]!.parameter - 2)).toBeLessThan(1e-12);
      expect(report.events[0]!.frequency).toBeCloseTo(1, 10); // ω = a = 1 (analytic: det J = a² at the Hopf point)
    }
  });

  it('follows the new branch of a pitchfork whatever the size of the states against the parameter range', () => {
    // Analytic: x' = (λ/c − 1)x − x³/s² has the pitchfork at λ = c and the new branch |x| = s·√(λ/c − 1).
    // The equilibria at λ = 2c (x = 0, ±s) give the state its size. x = s·u, λ = c·μ turn every (c, s)
    // into the same problem; where s is below a tenth of the range 2c (src/trace/stateWeights.ts) the
    // scaled problem is the same too, so those sweeps must take the same number of points.
    const counts: number[] = [];
    for (const [c, s] of [[1, 1], [30, 1], [1e3, 1], [1e5, 1], [1e-3, 1], [1, 1e-3], [0.5, 20]] as const) {
      const model = loadModel(`states: { x: 0 }\nparameters: { lam: ${c}, c: ${c}, s: ${s} }\nequations:\n  x: (lam/c - 1)*x - x^3/s^2`, 'pitchfork.yaml');
      const { trace } = sweep(model, { vary: 'lam', from: 0, to: 2 * c });
      const label = `c = ${c}, s = ${s}`;
      expect(trace.warnings, label).toEqual([]);
      expect(trace.events.map((e) => e.type), label).toEqual(['pitchfork']);
      expect(Math.abs(trace.events[0]!.parameter - c), label).toBeLessThan(1e-10 * c);
      expect(trace.branches, label).toHaveLength(2);
      const xs = trace.branches[1]!.points.map((q) => q.state[0]!);
      expect(Math.min(...xs), label).toBeCloseTo(-s, 8); // both halves, out to the range end
      expect(Math.max(...xs), label).toBeCloseTo(s, 8);
      for (const q of trace.branches[1]!.points) {
        // In u = x/s, μ = λ/c the branch is u² = μ − 1 (well conditioned at the tip too).
        expect(Math.abs((q.state[0]! / s) ** 2 - (q.parameter / c - 1)), label).toBeLessThan(1e-7);
      }
      if (s < 0.1 * 2 * c) counts.push(trace.branches.reduce((sum, b) => sum + b.points.length, 0));
    }
    expect(counts).toHaveLength(4);
    expect(Math.max(...counts) - Math.min(...counts)).toBeLessThanOrEqual(2);
  });

  it('finds the Brusselator\'s Hopf point whatever the units of its states', () => {
    // Brusselator (Prigogine & Lefever 1968) with x counted in units k1 and y in units k2 (x = k1·x₁,
    // y = k2·y₁): the steady state is (k1·a, k2·b/a) and the Hopf point stays at b = 1 + a² = 2 with
    // ω = a = 1 (analytic: det J = a² there); the sign of the first Lyapunov coefficient cannot
    // depend on units.
    for (const [k1, k2] of [[1e-9, 1e-9], [1e-3, 1e3], [1, 1], [1e6, 1e-2]] as const) {
      const model = loadModel([
        `states: { x: { start: ${k1} }, y: { start: ${2 * k2} } }`,
        `parameters: { b: 1.5, a: 1, k1: ${k1}, k2: ${k2} }`,
        'equations:',
        '  x: k1*(a - (b + 1)*(x/k1) + (x/k1)^2*(y/k2))',
        '  y: k2*(b*(x/k1) - (x/k1)^2*(y/k2))',
      ].join('\n'), 'brusselator-units.yaml');
      const { trace, report } = sweep(model, { vary: 'b', from: 0.5, to: 4.5 });
      const label = `k = ${k1}, ${k2}`;
      expect(trace.warnings, label).toEqual([]);
      expect(report.events.map((e) => [e.type, e.criticality]), label).toEqual([['hopf', 'supercritical']]);
      const hopf = trace.events[0]!;
      expect(Math.abs(hopf.parameter - 2), label).toBeLessThan(1e-10);
      expect(hopf.state[0]! / k1, label).toBeCloseTo(1, 8);
      expect(hopf.state[1]! / k2, label).toBeCloseTo(2, 8);
      expect(report.events[0]!.frequency, label).toBeCloseTo(1, 8);
    }
  });

  it('follows a state that grows far from its start values once a probe or the model shows its typical size', () => {
    // Analytic: x' = 16e6·(λ(1 − λ))² − x has the single branch x = 16e6·(λ(1 − λ))², 0 at both ends
    // and at the nominal λ = 0, 1e6 at λ = 1/2. With start value 0 and no probes nothing tells the sweep
    // that x is of size 1e6, the branch shoots up from the start and the warning says what to do.
    const text = (start: number) => `states: { x: { start: ${start} } }\nparameters: { lam: 0 }\nequations:\n  x: 16e6*(lam*(1 - lam))^2 - x`;
    const blind = sweep(loadModel(text(0), 'hump.yaml'), { vary: 'lam', from: 0, to: 1, probes: 0 });
    expect(blind.trace.warnings.some((w) => w.includes('give it a start value of that size'))).toBe(true);
    // The equilibria found at the probes inside the range show the size; so does a start value of that size.
    for (const [start, probes] of [[0, undefined], [1e6, 0]] as const) {
      const { trace } = sweep(loadModel(text(start), 'hump.yaml'), { vary: 'lam', from: 0, to: 1, ...(probes !== undefined && { probes }) });
      expect(trace.warnings).toEqual([]);
      expect(trace.branches).toHaveLength(1);
      const points = trace.branches[0]!.points;
      expect(points[0]!.parameter).toBe(0);
      expect(points[points.length - 1]!.parameter).toBe(1);
      for (const q of points) {
        const l = q.parameter;
        expect(Math.abs(q.state[0]! - 16e6 * (l * (1 - l)) ** 2)).toBeLessThan(1e-9 * 1e6);
      }
      expect(Math.max(...points.map((q) => q.state[0]!))).toBeGreaterThan(0.99e6); // through the top
    }
  });

  it('says in the report that a special point sits at a corner of the model and that no normal form applies', () => {
    // Analytic (test/trace/behaviour.test.ts): the stable focus turns into an unstable one at the corner
    // x = y = 1, λ = 1.1 of x' = −x + 1.5·max(x − 1, 0) + y, y' = λ − x − 0.1y.
    const model = loadModel('states: { x: 0, y: 0 }\nparameters: { lam: 0.5 }\nequations:\n  x: -x + 1.5*max(x - 1, 0) + y\n  y: lam - x - 0.1*y', 'corner.yaml');
    const { report } = sweep(model, { vary: 'lam', from: 0, to: 2 });
    expect(report.events).toHaveLength(1);
    expect(report.events[0]).toMatchObject({ type: 'hopf', corner: true, meaning: cornerMeaning('hopf') });
    expect(report.events[0]!.lyapunov).toBeUndefined();
    expect(report.margin?.above?.parameter).toBeCloseTo(1.1, 9); // the margin counts it
  });

  it('gives every point and special point its own diagnostics: residual, iterations, step, test-function values', () => {
    // Lorenz (1963) from rho = 0 to 30: the pitchfork at rho = 1 (det of the bordered Jacobian),
    // and two subcritical Hopf points at rho = 470/19 (real part of the critical pair) (analytic).
    const model = readModelFile('models/lorenz-convection.yaml');
    const { report } = sweep(model, { vary: 'rho', from: 0, to: 30 });
    for (const b of report.branches) {
      b.points.forEach((q, k) => {
        expect(q.residual).toBeLessThanOrEqual(report.settings.absTol);
        expect(q.iterations).toBeGreaterThanOrEqual(0);
        expect(q.iterations).toBeLessThanOrEqual(report.settings.maxIter);
        if (k === 0) return expect(q.step).toBe(0);
        // The step is scaled arclength: at least the parameter change, which is unscaled.
        expect(q.step).toBeGreaterThanOrEqual(Math.abs(q.parameter - b.points[k - 1]!.parameter) * (1 - 1e-12));
      });
    }
    expect(report.events.map((e) => e.type)).toEqual(['pitchfork', 'hopf', 'hopf']);
    for (const e of report.events) {
      // The located point lies where the test function changes sign between its two neighbours.
      expect(Math.sign(e.test.before) * Math.sign(e.test.after)).toBe(-1);
    }
    expect(report.events[0]!.test.quantity).toMatch(/^determinant of the bordered Jacobian/);
    expect(report.events[1]!.test.quantity).toBe('real part of the critical complex eigenvalue pair');
  });

  it('finds the far side of the toggle switch S-curve from the equilibria at the nominal value and the range end', () => {
    // From α1 = 1 only the low-u state exists, and its branch stays low up to α1 = 20; the upper
    // branch and its fold (analytic, toggleFold) are reached only from the other starts.
    const model = readModelFile('models/genetic-toggle-switch.yaml');
    const { report } = sweep(model, { vary: 'alpha1', from: 1, to: 20 });
    const folds = report.events.filter((e) => e.type === 'fold');
    expect(folds).toHaveLength(1);
    // The lower fold lies where the saddle and the high-u branch meet: u between 1 and 10 (bracket by hand).
    const expected = toggleFold(1.5, 9);
    expect(Math.abs(folds[0]!.parameter - expected)).toBeLessThan(1e-10 * expected);
    // Nominal α1 = 10 with the start guess u = 8 lies on the high-u branch; the fold below is the margin.
    expect(report.margin?.branch).toBe(folds[0]!.branch);
    expect(report.margin?.below?.parameter).toBe(folds[0]!.parameter);
    expect(report.margin?.below?.relative).toBeCloseTo((10 - expected) / 10, 12);
    expect(report.branches.map((b) => b.id)).toEqual(report.branches.map((_, i) => i + 1));
  });

  it('finds a closed branch (isola) that reaches neither end of the range nor the nominal value', () => {
    // Cubic autocatalysis A + 2B -> 3B with decay B -> C in a stirred tank (Gray & Scott 1983), feed of
    // A only, residence time t. Derived here from the equations: besides b = 0, equilibria satisfy
    // c b^2 - b + c/t = 0 with c = 1 + k t, so they exist where 2(1 + k t) <= sqrt(t): for k < 1/16 a
    // closed curve between two folds at sqrt(t) = (1 -+ sqrt(1 - 16k))/(4k) (a = 1/2 at both).
    const k = 0.05;
    const model = loadModel([
      'states:', '  a: 1', '  b: 0',
      'parameters:', '  t: 5', `  k: ${k}`,
      'equations:', '  a: (1 - a)/t - a*b^2', '  b: -b/t + a*b^2 - k*b', '',
    ].join('\n'), 'autocatalysis.yaml');
    const folds = [1, -1].map((sign) => ((1 - sign * Math.sqrt(1 - 16 * k)) / (4 * k)) ** 2);
    // Nominal t = 5 and both ends lie outside [7.64, 52.36]: only the probes inside the range reach the isola.
    const { report } = sweep(model, { vary: 't', from: 1, to: 60 });
    expect(report.branches).toHaveLength(2);
    expect(report.branches[1]!.stopped).toBe('closed loop');
    const found = report.events.filter((e) => e.type === 'fold').map((e) => e.parameter).sort((x, y) => x - y);
    expect(found).toHaveLength(2);
    for (const [i, t] of folds.entries()) expect(Math.abs(found[i]! - t)).toBeLessThan(1e-10 * t);
    expect(report.settings.searchedAt.slice(0, 3)).toEqual([1, 5, 60]);
    expect(report.settings.searchedAt).toHaveLength(3 + 7);
    // Without probes the same sweep sees only the trivial branch b = 0.
    const bare = sweep(model, { vary: 't', from: 1, to: 60, probes: 0 }).report;
    expect(bare.branches).toHaveLength(1);
    expect(bare.settings.searchedAt).toEqual([1, 5, 60]);
  });

  it('ends a branch where a state reaches a bound the model gives it: the chemostat\'s biomass at washout', () => {
    // Chemostat with Monod growth (Monod 1950): s' = D(s0 − s) − mu s x/((K + s) Y), x' = (mu s/(K + s) − D) x.
    // Analytic: the washout branch x = 0, s = s0 for every D, and the operating branch s = K D/(mu − D),
    // x = Y (s0 − s), which meets it at the transcritical point D* = mu s0/(K + s0) and runs off to
    // infinity as D → mu beyond it. With x ≥ 0 and s ≥ 0 the operating branch ends on x = 0 at D*.
    const text = (bounds: string) => [
      `states: { s: { start: 1${bounds} }, x: { start: 1${bounds} } }`,
      'parameters: { D: 0.3, s0: 10, mu: 0.5, K: 1, Y: 0.5 }',
      'equations:', '  s: D*(s0 - s) - mu*s/(K + s)*x/Y', '  x: (mu*s/(K + s) - D)*x', '',
    ].join('\n');
    const star = (0.5 * 10) / (1 + 10);
    const { report, trace } = sweep(loadModel(text(', min: 0'), 'chemostat.yaml'), { vary: 'D', from: 0.05, to: 0.6 });
    expect(trace.warnings).toEqual([]);
    expect(report.branches.map((b) => b.stopped)).toEqual(['state bound', 'left range']);
    const operating = report.branches[0]!.points;
    const end = operating[operating.length - 1]!;
    expect(Math.abs(end.parameter - star)).toBeLessThan(1e-9 * star);
    expect(Math.abs(end.state.x!)).toBeLessThan(1e-9);
    for (const q of operating) {
      expect(q.state.x!).toBeGreaterThan(-1e-9);
      expect(Math.abs(q.state.s! - q.parameter / (0.5 - q.parameter))).toBeLessThan(1e-7);
    }
    // The transcritical point, found on the washout branch, is the operating branch's margin too.
    expect(report.events.map((e) => [e.type, e.branch])).toEqual([['transcritical', 2]]);
    expect(Math.abs(report.events[0]!.parameter - star)).toBeLessThan(1e-10 * star);
    expect(report.margin?.branch).toBe(1);
    expect(report.margin?.above?.event).toBe(1);
    // Without bounds the same branch goes on to negative biomass.
    const free = sweep(loadModel(text(''), 'chemostat.yaml'), { vary: 'D', from: 0.05, to: 0.6, maxPoints: 200 }).report;
    expect(free.branches[0]!.points.some((q) => q.state.x! < -1)).toBe(true);
  });

  it('keeps an angle within the bounds it is given: one branch of a machine against an infinite bus', () => {
    // Swing equation (classical machine model): equilibria sin(delta) = P/Pmax, omega = 0, repeating every
    // 2 pi; within [-pi, pi] one branch from delta = 0 to delta = pi at P = 0 with its fold at P = Pmax (analytic).
    const model = loadModel([
      'states: { delta: { start: 0.3, min: -3.141592653589793, max: 3.141592653589793 }, omega: 0 }',
      'parameters: { P: 0.8, Pmax: 1.2, M: 0.1, Dmp: 0.05 }',
      'equations:', '  delta: omega', '  omega: (P - Pmax*sin(delta) - Dmp*omega)/M', '',
    ].join('\n'), 'machine.yaml');
    const { report } = sweep(model, { vary: 'P', from: 0, to: 1.5 });
    expect(report.branches).toHaveLength(1);
    expect(report.events.map((e) => e.type)).toEqual(['fold']);
    expect(Math.abs(report.events[0]!.parameter - 1.2)).toBeLessThan(1e-10);
    const points = report.branches[0]!.points;
    expect([points[0]!.state.delta, points[points.length - 1]!.state.delta].map((d) => Math.abs(d!)).sort())
      .toEqual([0, Math.PI]);
  });

  it('follows only the half of a pitchfork that lies within a bound', () => {
    // x' = lam x − x³ with x ≥ 0: besides x = 0, the branch x = sqrt(lam) only (analytic), which ends on
    // the bound at the pitchfork (0, 0). There the bound x = 0 is the other branch and the hyperplanes the
    // end is located on meet it along a line: the end point is found only to about the square of a step.
    const model = loadModel('states: { x: { start: 0, min: 0 } }\nparameters: { lam: -1 }\nequations:\n  x: lam*x - x^3\n', 'half.yaml');
    for (const probes of [0, 7]) {
      const { report, trace } = sweep(model, { vary: 'lam', from: -1, to: 1, probes });
      expect(trace.warnings).toEqual([]);
      expect(report.events.map((e) => e.type)).toEqual(['pitchfork']);
      expect(report.branches).toHaveLength(2);
      const half = report.branches[1]!.points;
      for (const q of half) expect(q.state.x!).toBeGreaterThanOrEqual(0);
      const ends = [half[0]!, half[half.length - 1]!].sort((a, b) => a.parameter - b.parameter);
      expect(ends[0]!.parameter).toBeLessThan(1e-4);
      expect(ends[1]!.parameter).toBe(1);
      for (const q of half.filter((p) => p.parameter > 1e-3)) expect(Math.abs(q.state.x! - Math.sqrt(q.parameter))).toBeLessThan(1e-8);
    }
  });

  it('drops a start where the model is not defined around it, and says why', () => {
    // x' = x^p − 1: at p = 2 the root x = −1 exists, but d/dp x^p = x^p ln x is not a number there
    // (analytic); the branch x = 1 is followed over the whole range.
    // The nominal value p = 2 is one of the values searched.
    const model = loadModel('states: { x: 1 }\nparameters: { p: 2 }\nequations:\n  x: x^p - 1\n', 'power.yaml');
    const { trace } = sweep(model, { vary: 'p', from: 1, to: 3, probes: 0 });
    expect(trace.branches).toHaveLength(1);
    expect(trace.warnings).toEqual([message.traceStartNotFinite('p', 2, 'x = -1')]);
    const bounded = loadModel('states: { x: { start: 1, min: 0 } }\nparameters: { p: 2 }\nequations:\n  x: x^p - 1\n', 'power.yaml');
    expect(sweep(bounded, { vary: 'p', from: 1, to: 3, probes: 0 }).trace.warnings).toEqual([]);
  });

  it('stops a branch that runs off to infinity after a few steps that grow with it, and says so', () => {
    // x' = 1/lam − x: the branch x = 1/lam runs off to ±infinity as lam → 0 from either side (analytic).
    const model = loadModel('states: { x: 1 }\nparameters: { lam: 1 }\nequations:\n  x: 1/lam - x\n', 'pole.yaml');
    const { report, trace } = sweep(model, { vary: 'lam', from: -1, to: 1 });
    expect(report.branches.map((b) => b.stopped)).toEqual(['unbounded', 'unbounded']);
    for (const b of report.branches) {
      expect(b.points.length).toBeLessThan(300); // the default point budget is 2000
      for (const q of b.points) expect(Math.abs(q.state.x! * q.parameter - 1)).toBeLessThan(1e-9);
      const near = b.points.reduce((a, q) => (Math.abs(q.parameter) < Math.abs(a.parameter) ? q : a));
      expect(Math.abs(near.parameter)).toBeLessThan(0.01);
    }
    expect(trace.warnings).toHaveLength(2);
    expect(trace.warnings[0]).toBe(message.traceBranchStopped(1, STOP_WHY.unbounded, 'lam', report.branches[0]!.points.at(-1)!.parameter));
  });

  it('puts the probes off the round values of the range, where special points often sit', () => {
    // A probe exactly on a branch point (x = 0 at lam = 0 in a range symmetric about 0) starts branches
    // with no unique direction; equal parts with the probe at the golden-section point avoid 0 and the middle.
    for (const [from, to] of [[-1, 1], [0, 1], [1, 0], [-3, 5]] as const) {
      const { main, probes } = searchValues(from, to, 99, 7);
      expect(main).toEqual([from, to]);
      expect(probes).toHaveLength(7);
      for (const v of probes) {
        const u = (v - from) / (to - from);
        for (const round of [0, 1 / 8, 1 / 4, 1 / 3, 3 / 8, 1 / 2, 5 / 8, 2 / 3, 3 / 4, 7 / 8, 1]) expect(Math.abs(u - round)).toBeGreaterThan(1e-4);
        if (from < 0 && to > 0) expect(Math.abs(v)).toBeGreaterThan(0.01 * (to - from));
      }
    }
    expect(searchValues(0, 1, 0.5, 3)).toEqual({ main: [0, 0.5, 1], probes: [0, 1, 2].map((i) => (i + (3 - Math.sqrt(5)) / 2) / 3) });
  });

  it('sweeps over decades with --log: the same special points, and points spread over every decade', () => {
    // The chemostat of the bound test above (Monod 1950): transcritical point at D* = mu s0/(K + s0),
    // branch s = K D/(mu − D) (analytic), swept from 1e-4 to 0.6.
    const model = loadModel([
      'states: { s: { start: 1, min: 0 }, x: { start: 1, min: 0 } }',
      'parameters: { D: 0.3, s0: 10, mu: 0.5, K: 1, Y: 0.5 }',
      'equations:', '  s: D*(s0 - s) - mu*s/(K + s)*x/Y', '  x: (mu*s/(K + s) - D)*x', '',
    ].join('\n'), 'chemostat.yaml');
    const star = (0.5 * 10) / (1 + 10);
    const linear = sweep(model, { vary: 'D', from: 1e-4, to: 0.6 }).report;
    const { report, trace } = sweep(model, { vary: 'D', from: 1e-4, to: 0.6, log: true });
    expect(trace.warnings).toEqual([]);
    expect(report.settings.parameterScale).toBe('log');
    expect(report.range).toEqual({ from: 1e-4, to: 0.6 });
    expect(report.settings.searchedAt.slice(0, 3)).toEqual([1e-4, 0.3, 0.6]);
    expect(report.events.map((e) => e.type)).toEqual(linear.events.map((e) => e.type));
    expect(Math.abs(report.events[0]!.parameter - star)).toBeLessThan(1e-10 * star);
    const operating = report.branches[0]!.points;
    expect(operating[0]!.parameter).toBe(1e-4);
    for (const q of operating) expect(Math.abs(q.state.s! - q.parameter / (0.5 - q.parameter))).toBeLessThan(1e-7);
    // Every decade from 1e-4 to 0.1 holds several points; the linear sweep crosses the lowest three in one step.
    for (let d = -4; d < -1; d++) {
      const inDecade = (b: typeof report) => b.branches[0]!.points.filter((q) => q.parameter >= 10 ** d && q.parameter < 10 ** (d + 1)).length;
      expect(inDecade(report), `decade 1e${d}`).toBeGreaterThanOrEqual(5);
      if (d < -2) expect(inDecade(linear), `decade 1e${d}`).toBeLessThanOrEqual(1);
    }
  });

  it('gives the same Hopf point and first Lyapunov coefficient stepping in the parameter or in its logarithm', () => {
    // Brusselator (Prigogine & Lefever 1968): Hopf at b = 1 + a² = 2, ω = a = 1; l1 involves derivatives in x only.
    const model = readModelFile('models/brusselator.yaml');
    const [lin, log] = [false, true].map((l) => sweep(model, { vary: 'b', from: 0.5, to: 4.5, log: l }).report.events[0]!);
    expect(Math.abs(log!.parameter - 2)).toBeLessThan(1e-10);
    expect(log!.lyapunov! / lin!.lyapunov!).toBeCloseTo(1, 9);
    expect(log!.frequency).toBeCloseTo(1, 9);
    expect(() => sweep(model, { vary: 'b', from: 0, to: 4.5, log: true })).toThrow(new UsageError(message.logRange(0, 4.5)));
  });

  it('words a fold by what is lost: the reactor\'s upper fold joins two unstable states', () => {
    // Uppal, Ray & Poore (1974) form with B = 14, beta = 2 (models/cooled-tank-reactor.yaml): along the
    // S-curve the lower sheet is stable up to the fold near Da = 0.1057; the middle sheet is a saddle and
    // the upper sheet is unstable (trace > 0) up to its Hopf point near Da = 0.1309, so the fold near
    // Da = 0.0889 joins two unstable states (analytic: the Jacobian along the x2 parametrisation).
    const { report } = sweep(readModelFile('models/cooled-tank-reactor.yaml'), { vary: 'Da', from: 0.02, to: 0.2 });
    const folds = report.events.filter((e) => e.type === 'fold').sort((a, b) => a.parameter - b.parameter);
    expect(folds).toHaveLength(2);
    expect(folds[0]!.meaning).toMatch(/^two unstable steady states meet and vanish/);
    expect(folds[1]!.meaning).toMatch(/^the steady state disappears: expect a jump/);
  });

  it('rejects from = to and an unknown parameter with the messages of src/errors.ts', () => {
    const model = readModelFile('models/brusselator.yaml');
    expect(() => sweep(model, { vary: 'b', from: 2, to: 2 })).toThrow(new UsageError(message.emptyRange(2, 2)));
    expect(() => sweep(model, { vary: 'bb', from: 0, to: 1 })).toThrow(UsageError);
  });

  it('reports a numerical error when there is no equilibrium at the start of the range', () => {
    // x' = p − x² has no real equilibrium for p < 0 (analytic).
    const model = loadModel('states:\n  x: 1\nparameters:\n  p: 1\nequations:\n  x: p - x^2\n', 'none.yaml');
    expect(() => sweep(model, { vary: 'p', from: -1, to: 1 })).toThrow(NumericalError);
  });
});
