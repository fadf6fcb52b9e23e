import { describe, expect, it } from 'vitest';
import { integrate } from '../../src/portrait/integrate.js';

const last = <T>(a: T[]): T => a[a.length - 1]!;

describe('integrate (Dormand–Prince 5(4))', () => {
  it('follows exponential decay y = exp(−t) to t = 20 within a few tolerances, forward and backward', () => {
    // Analytic: y' = −y, y(0) = 1 ⇒ y(t) = exp(−t).
    const f = (_t: number, y: Float64Array, dy: Float64Array): void => { dy[0] = -y[0]!; };
    const fwd = integrate(f, Float64Array.of(1), 0, 20, { relTol: 1e-9, absTol: 1e-12, maxSteps: 10_000 });
    expect(fwd.status).toBe('done');
    expect(last(fwd.t)).toBe(20);
    for (let i = 0; i < fwd.t.length; i++) {
      const exact = Math.exp(-fwd.t[i]!);
      expect(Math.abs(fwd.y[i]![0]! - exact)).toBeLessThan(1e-8 * exact + 1e-11);
    }
    // Backward: from y(5) = exp(−5) to t = 0 must return to 1.
    const back = integrate(f, Float64Array.of(Math.exp(-5)), 5, 0, { relTol: 1e-10, absTol: 1e-14, maxSteps: 10_000 });
    expect(back.status).toBe('done');
    expect(last(back.t)).toBe(0);
    expect(Math.abs(last(back.y)[0]! - 1)).toBeLessThan(1e-8);
  });

  it('keeps the harmonic oscillator on cos t, −sin t over 50 periods, the error shrinking with the tolerance', () => {
    // Analytic: x' = v, v' = −x, (x, v)(0) = (1, 0) ⇒ x = cos t, v = −sin t.
    const f = (_t: number, y: Float64Array, dy: Float64Array): void => { dy[0] = y[1]!; dy[1] = -y[0]!; };
    const T = 100 * Math.PI;
    const errorAt = (tol: number): { err: number; steps: number } => {
      const r = integrate(f, Float64Array.of(1, 0), 0, T, { relTol: tol, absTol: tol, maxSteps: 1_000_000 });
      expect(r.status).toBe('done');
      let err = 0;
      for (let i = 0; i < r.t.length; i++) {
        const t = r.t[i]!;
        err = Math.max(err, Math.abs(r.y[i]![0]! - Math.cos(t)), Math.abs(r.y[i]![1]! + Math.sin(t)));
      }
      return { err, steps: r.steps };
    };
    const coarse = errorAt(1e-6);
    const fine = errorAt(1e-10);
    // Global error grows about linearly over 50 periods; a generous factor 1e3 over the tolerance.
    expect(coarse.err).toBeLessThan(1e-3);
    expect(fine.err).toBeLessThan(1e-7);
    // Tolerance down by 1e4: for a fifth-order method the error must fall by well over 100.
    expect(fine.err).toBeLessThan(coarse.err / 100);
    // Steps grow roughly like tol^(−1/5): 1e4^(1/5) ≈ 6.3, so between 3 and 12 times more.
    expect(fine.steps / coarse.steps).toBeGreaterThan(3);
    expect(fine.steps / coarse.steps).toBeLessThan(12);
  });

  it('matches the logistic solution y = K / (1 + (K/y0 − 1) exp(−r t))', () => {
    // Analytic (Verhulst 1838): y' = r y (1 − y/K).
    const r = 1.5, K = 10, y0 = 0.1;
    const f = (_t: number, y: Float64Array, dy: Float64Array): void => { dy[0] = r * y[0]! * (1 - y[0]! / K); };
    const res = integrate(f, Float64Array.of(y0), 0, 15, { relTol: 1e-10, absTol: 1e-12, maxSteps: 10_000 });
    expect(res.status).toBe('done');
    for (let i = 0; i < res.t.length; i++) {
      const exact = K / (1 + (K / y0 - 1) * Math.exp(-r * res.t[i]!));
      expect(Math.abs(res.y[i]![0]! - exact)).toBeLessThan(1e-8 * exact);
    }
  });

  it('finishes a stiff-ish linear problem within its step budget, or reports max-steps when the budget is too small', () => {
    // y' = −500 (y − cos t): explicit methods are limited by stability, |h λ| ≲ 3.3 for this pair,
    // so about 500 · 10 / 3.3 ≈ 1500 steps on [0, 10]. Analytic: after the transient e^(−500t) has
    // died out, y = (a² cos t + a sin t) / (a² + 1) with a = 500 (insert A cos t + B sin t and match).
    const f = (t: number, y: Float64Array, dy: Float64Array): void => { dy[0] = -500 * (y[0]! - Math.cos(t)); };
    const ok = integrate(f, Float64Array.of(1), 0, 10, { relTol: 1e-6, absTol: 1e-8, maxSteps: 20_000 });
    expect(ok.status).toBe('done');
    expect(ok.steps + ok.rejected).toBeLessThan(20_000);
    expect(ok.steps).toBeGreaterThan(1000);
    const a = 500;
    const slow = (a * a * Math.cos(10) + a * Math.sin(10)) / (a * a + 1);
    expect(Math.abs(last(ok.y)[0]! - slow)).toBeLessThan(1e-5);
    const short = integrate(f, Float64Array.of(1), 0, 10, { relTol: 1e-6, absTol: 1e-8, maxSteps: 100 });
    expect(short.status).toBe('max-steps');
    expect(short.steps + short.rejected).toBe(100);
  });

  it('stops when stopWhen says so and reports non-finite right-hand sides', () => {
    // y' = 1: crosses y = 2.5 at t = 2.5 (analytic); stop after the first step past it.
    const one = (_t: number, _y: Float64Array, dy: Float64Array): void => { dy[0] = 1; };
    const s = integrate(one, Float64Array.of(0), 0, 10, { relTol: 1e-8, absTol: 1e-8, maxSteps: 1000, hMax: 0.1, stopWhen: (y) => y[0]! > 2.5 });
    expect(s.status).toBe('stopped');
    expect(last(s.y)[0]!).toBeGreaterThan(2.5);
    expect(last(s.y)[0]!).toBeLessThanOrEqual(2.6 + 1e-12);
    // y' = 1/√(1 − t) is finite only for t < 1 (NaN past it): the run must end there, never past t = 1.
    const blow = (t: number, _y: Float64Array, dy: Float64Array): void => { dy[0] = 1 / Math.sqrt(1 - t); };
    const b = integrate(blow, Float64Array.of(0), 0, 2, { relTol: 1e-8, absTol: 1e-8, maxSteps: 100_000 });
    expect(['non-finite', 'step too small']).toContain(b.status);
    expect(last(b.t)).toBeLessThanOrEqual(1);
    for (const y of b.y) expect(Number.isFinite(y[0]!)).toBe(true);
  });
});
