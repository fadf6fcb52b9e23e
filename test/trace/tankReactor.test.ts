/**
 * The cooled exothermic tank of Uppal, Ray & Poore (1974), Chem. Eng. Sci. 29:967, in the
 * dimensionless form of models/cooled-tank-reactor.yaml (B = 14, β = 2, coolant 0):
 *
 *   x1' = −x1 + r,   x2' = −x2 + B r − β x2,   r = Da (1 − x1) e^{x2}.
 *
 * Reference values computed here independently of the continuation (analytic parametrisation of
 * the equilibrium curve by x2): at an equilibrium r = x1 and x1 = c x2 with c = (1 + β)/B, so
 *   Da(x2) = c x2 e^{−x2} / (1 − c x2).
 * With ∂r/∂x1 = −Da e^{x2} = −x1/(1 − x1) and ∂r/∂x2 = r = x1 the Jacobian is
 *   J = [[−1/(1 − x1), x1], [−B x1/(1 − x1), −1 − β + B x1]],
 *   trace = −1/(1 − x1) − 1 − β + B x1,   det = (1 + β − B x1 + B x1²)/(1 − x1).
 * Folds: d ln Da/dx2 = 1/x2 − 1 + c/(1 − c x2) = 0. Hopf points: trace = 0 with det > 0; trace = 0
 * with det < 0 is a neutral saddle (real pair μ, −μ), which must not be reported.
 */
import { describe, expect, it } from 'vitest';
import { traceBranches } from '../../src/trace/traceBranches.js';
import { traceSettings } from '../../src/trace/traceSettings.js';
import { expectClose } from '../helpers/close.js';
import { bisect } from './bisect.js';
import { expectAllConverged } from './expectTraced.js';
import { modelSystem, parameterIndex } from './modelFile.js';

const B = 14;
const beta = 2;
const c = (1 + beta) / B;
const top = 1 / c; // x1 = 1 at x2 = 1/c
const da = (x2: number): number => (c * x2 * Math.exp(-x2)) / (1 - c * x2);
const slope = (x2: number): number => 1 / x2 - 1 + c / (1 - c * x2);
const trace2 = (x2: number): number => -1 / (1 - c * x2) - 1 - beta + B * c * x2;
const det2 = (x2: number): number => (1 + beta - B * c * x2 + B * (c * x2) ** 2) / (1 - c * x2);

/** Sign changes of g on a fine grid over (0, 1/c), each polished by bisection. */
function roots(g: (x: number) => number): number[] {
  const found: number[] = [];
  const steps = 4000;
  for (let i = 1; i < steps - 1; i++) {
    const a = (top * i) / steps;
    const b = (top * (i + 1)) / steps;
    if (g(a) * g(b) < 0) found.push(bisect(g, a, b));
  }
  return found;
}

describe('traceBranches on the cooled tank reactor (Uppal, Ray & Poore 1974)', () => {
  it('finds both folds and the Hopf point at the analytic values to 1e-10, and no Hopf at the neutral saddle', () => {
    const { system, params } = modelSystem('cooled-tank-reactor.yaml');
    const k = parameterIndex(system, 'Da');
    const from = 0.05;
    const to = 0.2;
    const folds = roots(slope); // dDa/dx2 = 0
    const hopfs = roots(trace2).filter((x2) => det2(x2) > 0);
    const saddles = roots(trace2).filter((x2) => det2(x2) < 0);
    expect(folds).toHaveLength(2);
    expect(hopfs).toHaveLength(1);
    expect(saddles).toHaveLength(1); // the neutral saddle lies inside the range
    expect(da(saddles[0]!)).toBeGreaterThan(from);
    // The one start at Da = 0.05: the low-temperature root of Da(x2) = 0.05 below the first fold.
    const x2 = bisect((t) => da(t) - from, 1e-9, folds[0]!);
    const trace = traceBranches(system, params, traceSettings(k, from, to), [Float64Array.of(c * x2, x2)]);
    expect(trace.branches).toHaveLength(1);
    expect(trace.branches[0]!.stopped).toBe('left range');
    expect(trace.events.map((e) => e.type)).toEqual(['fold', 'fold', 'hopf']);
    const [f1, f2, h] = trace.events as [typeof trace.events[0], typeof trace.events[0], typeof trace.events[0]];
    expectClose(f1.parameter, da(folds[0]!), { rel: 1e-10 }, 'first fold Da (analytic, dDa/dx2 = 0)');
    expectClose(f1.state[1]!, folds[0]!, { rel: 1e-6 }, 'first fold x2 (analytic)');
    expectClose(f2.parameter, da(folds[1]!), { rel: 1e-10 }, 'second fold Da (analytic, dDa/dx2 = 0)');
    expectClose(f2.state[1]!, folds[1]!, { rel: 1e-6 }, 'second fold x2 (analytic)');
    expectClose(h.parameter, da(hopfs[0]!), { rel: 1e-10 }, 'Hopf Da (analytic, trace = 0, det > 0)');
    expectClose(h.state[1]!, hopfs[0]!, { rel: 1e-8 }, 'Hopf x2 (analytic)');
    expectClose(h.frequency!, Math.sqrt(det2(hopfs[0]!)), { rel: 1e-8 }, 'Hopf ω = √det (analytic)');
    for (const e of trace.events) expect(e.iterations).toBeGreaterThan(0);
    expect(trace.warnings).toEqual([]);
    expectAllConverged(trace);

    // The same sweep from high to low, started on the hot branch: the same special points.
    const x2High = bisect((t) => da(t) - to, folds[1]!, top - 1e-9);
    const reversed = traceBranches(system, params, traceSettings(k, to, from), [Float64Array.of(c * x2High, x2High)]);
    const key = (t: typeof trace): [string, number][] =>
      t.events.map((e) => [e.type, e.parameter] as [string, number]).sort((p, q) => p[1] - q[1]);
    const a = key(trace);
    const b = key(reversed);
    expect(b.map((e) => e[0])).toEqual(a.map((e) => e[0]));
    a.forEach((e, i) => expectClose(b[i]![1], e[1], { rel: 1e-10 }, `reversed sweep, event ${i}`));
    expectAllConverged(reversed);
  });
});
