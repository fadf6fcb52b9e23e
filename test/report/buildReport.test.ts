import { describe, expect, it } from 'vitest';
import { buildReport } from '../../src/report/buildReport.js';
import { CAUTION } from '../../src/report/caution.js';
import { eventMeaning } from '../../src/report/eventWords.js';
import { expectClose } from '../helpers/close.js';
import { FOLD_LAMBDA, FOLD_X, hopfTrace, info, sCurveTrace, transcriticalTrace } from './fixtures.js';

const opts = { parameter: 'lambda', version: '0.1.0', warnMargin: 0.1, failMargin: 0 };

describe('buildReport', () => {
  it('splits the S-shaped branch into stable, unstable and stable runs bounded by the two folds', () => {
    const report = buildReport(sCurveTrace(), info('S', 'lambda'), opts);
    const runs = report.branches[0]!.stability;
    expect(runs.map((r) => r.stable)).toEqual([true, false, true]);
    // Analytic: λ = x³ − x from x = −1.6 to 1.6, folds at λ = ±2/(3√3).
    expectClose(runs[0]!.from, (-1.6) ** 3 + 1.6, { abs: 1e-12 }, 'start');
    expectClose(runs[0]!.to, FOLD_LAMBDA, { abs: 1e-12 }, 'first fold');
    expectClose(runs[1]!.from, FOLD_LAMBDA, { abs: 1e-12 }, 'first fold');
    expectClose(runs[1]!.to, -FOLD_LAMBDA, { abs: 1e-12 }, 'second fold');
    expectClose(runs[2]!.to, 1.6 ** 3 - 1.6, { abs: 1e-12 }, 'end');
    // Analytic: on the middle sheet exactly one eigenvalue, 1 − 3x², is positive.
    expect(runs.map((r) => r.unstableCount)).toEqual([0, 1, 0]);
  });

  it('names states, keeps every point in arclength order and carries the fold coefficients', () => {
    const report = buildReport(sCurveTrace(), info('S', 'lambda'), opts);
    const pts = report.branches[0]!.points;
    expect(pts).toHaveLength(33);
    expect(pts.map((p) => p.index)).toEqual(Array.from({ length: 33 }, (_, k) => k));
    expectClose(pts[6]!.state.x!, -1, { abs: 1e-12 }, 'x at point 6');
    expect(Object.keys(pts[0]!.state)).toEqual(['x', 'y']);
    // Analytic: a = ½ f_xx = −3x at x = ∓1/√3, so a = ±√3.
    expectClose(report.events[0]!.foldCoefficient!, Math.sqrt(3), { rel: 1e-12 }, 'a at the first fold');
    expectClose(report.events[1]!.foldCoefficient!, -Math.sqrt(3), { rel: 1e-12 }, 'a at the second fold');
    expectClose(report.events[0]!.state.x!, -FOLD_X, { abs: 1e-12 }, 'fold state');
  });

  it('explains each kind of special point in plain words', () => {
    const fold = buildReport(sCurveTrace(), info('S', 'lambda'), opts).events[0]!;
    expect(fold.meaning).toMatch(/disappears.*jump.*hysteresis/);
    const supercritical = buildReport(hopfTrace(-1), info('H', 'mu'), { ...opts, parameter: 'mu' }).events[0]!;
    expect(supercritical.meaning).toMatch(/oscillations start with small amplitude/);
    expect(supercritical.criticality).toBe('supercritical');
    const subcritical = buildReport(hopfTrace(1), info('H', 'mu'), { ...opts, parameter: 'mu' }).events[0]!;
    expect(subcritical.meaning).toMatch(/abruptly.*dangerous/);
    const degenerate = buildReport(hopfTrace(0), info('H', 'mu'), { ...opts, parameter: 'mu' }).events[0]!;
    expect(degenerate.meaning).toMatch(/undecided at this order/);
    const crossing = buildReport(transcriticalTrace(), info('T', 'lambda'), opts).events[0]!;
    expect(crossing.meaning).toMatch(/exchange stability/);
    expect(eventMeaning('pitchfork')).toMatch(/symmetric pair/);
  });

  it('keeps the Hopf frequency and period and the first Lyapunov coefficient', () => {
    const event = buildReport(hopfTrace(-1), info('H', 'mu'), { ...opts, parameter: 'mu' }).events[0]!;
    // Analytic: eigenvalues μ ± i, so ω = 1 and the period is 2π; l1 = s = −1 for this normal form.
    expect(event.lyapunov).toBe(-1);
    expectClose(event.frequency!, 1, { abs: 0 }, 'frequency');
    expectClose(event.period!, 2 * Math.PI, { rel: 1e-15 }, 'period');
  });

  it('records where a switched branch came from and the exchange of stability on both branches', () => {
    const report = buildReport(transcriticalTrace(), info('T', 'lambda'), opts);
    expect(report.branches[1]!.origin).toEqual({ kind: 'switch', branch: 0, event: 0 });
    expect(report.events[0]!.newBranches).toEqual([1]);
    // Analytic: x = 0 has eigenvalue λ (stable below 0), x = λ has −λ (stable above 0).
    expect(report.branches[0]!.stability.map((r) => r.stable)).toEqual([true, false]);
    expect(report.branches[1]!.stability.map((r) => r.stable)).toEqual([false, true]);
    expectClose(report.branches[0]!.stability[0]!.to, 0, { abs: 0 }, 'boundary at the located point');
  });

  it('fills the header: tool, version, unit, range, settings with the margins, warnings and caution', () => {
    const report = buildReport(transcriticalTrace(), info('T', 'lambda', 'mol/L'), opts);
    expect(report.tool).toBe('branchtrace');
    expect(report.unit).toBe('mol/L');
    expect(report.range).toEqual({ from: -1, to: 1 });
    expect(report.settings.warnMargin).toBe(0.1);
    expect(report.settings.maxPoints).toBe(2000);
    expect(report.warnings).toEqual(['step at its smallest near λ = 0']);
    expect(report.caution).toBe(CAUTION);
    expect(CAUTION).toMatch(/verify.*plant or laboratory data/);
    expect(CAUTION).toMatch(/licensed engineers/);
  });
});
