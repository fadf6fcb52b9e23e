/**
 * Property tests (fast-check, fixed run number) over families with closed-form special points:
 * every traced point is corrected to absTol, the special points sit at their analytic values
 * whichever way the range is swept.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { traceBranches } from '../../src/trace/traceBranches.js';
import { traceSettings } from '../../src/trace/traceSettings.js';
import type { Trace } from '../../src/types.js';
import { bisect } from './bisect.js';
import { expectClose } from '../helpers/close.js';
import { expectAllConverged } from './expectTraced.js';
import { makeSystem } from '../helpers/handSystem.js';
import { hopfNormalForm, withStableDirection } from './traceSystems.js';
import { repeatable } from '../helpers/repeatable.js';

/** fast-check run number, fixed so failures reproduce. */
const RUN = 31_415;

const sorted = (trace: Trace): [string, number][] =>
  trace.events.map((e) => [e.type, e.parameter] as [string, number]).sort((p, q) => p[1] - q[1]);

describe('traceBranches properties', () => {
  it('finds both folds of x\' = λ − λ0 + a·x − x³ at their analytic values, swept either way', () => {
    // Analytic: λ = λ0 + x³ − a·x turns where 3x² = a: x = ∓√(a/3), λ = λ0 ± (2a/3)√(a/3).
    fc.assert(fc.property(
      fc.double({ min: 0.2, max: 3, noNaN: true }), fc.double({ min: -5, max: 5, noNaN: true }),
      fc.double({ min: 1.2, max: 3, noNaN: true }), fc.boolean(),
      (a, l0, widen, reverse) => {
        const system = withStableDirection((x, l) => l - l0 + a * x - x ** 3, (x) => a - 3 * x * x, () => 1);
        const lf = (2 * a / 3) * Math.sqrt(a / 3);
        const [lo, hi] = [l0 - widen * lf, l0 + widen * lf];
        const [from, to] = reverse ? [hi, lo] : [lo, hi];
        // The one equilibrium at λ = from, on the outer part of the S (analytic: x³ − a x = from − λ0).
        const c = from - l0;
        const x0 = c < 0 ? bisect((x) => x ** 3 - a * x - c, -10, -Math.sqrt(a)) : bisect((x) => x ** 3 - a * x - c, Math.sqrt(a), 10);
        const trace = traceBranches(system, Float64Array.of(0), traceSettings(0, from, to), [Float64Array.of(x0, 0)]);
        expectAllConverged(trace);
        expect(trace.branches[0]!.stopped).toBe('left range');
        const events = sorted(trace);
        expect(events.map((e) => e[0])).toEqual(['fold', 'fold']);
        expectClose(events[0]![1], l0 - lf, { abs: 1e-10 * (1 + Math.abs(l0)) }, 'lower fold (analytic)');
        expectClose(events[1]![1], l0 + lf, { abs: 1e-10 * (1 + Math.abs(l0)) }, 'upper fold (analytic)');
      },
    ), repeatable(RUN, 30));
  });

  it('finds the Hopf point of the shifted normal form with l1 = 2s/ω, swept either way', () => {
    // Analytic (see normalForms.test.ts): eigenvalues μ − μ0 ± iω, Hopf at μ0, l1 = 2s/ω.
    fc.assert(fc.property(
      fc.double({ min: 0.2, max: 5, noNaN: true }), fc.double({ min: 0.1, max: 3, noNaN: true }),
      fc.boolean(), fc.double({ min: -4, max: 4, noNaN: true }), fc.double({ min: 0.1, max: 3, noNaN: true }),
      fc.boolean(),
      (omega, size, negative, mu0, half, reverse) => {
        const s = negative ? -size : size;
        const base = hopfNormalForm(s, omega);
        // Shift the parameter: μ ↦ μ − μ0 (∂/∂μ is unchanged).
        const shifted = { ...base, rhs: (x: Float64Array, p: Float64Array, out: Float64Array) => base.rhs(x, Float64Array.of(p[0]! - mu0), out),
          jacobian: (x: Float64Array, p: Float64Array, out: Float64Array) => base.jacobian(x, Float64Array.of(p[0]! - mu0), out) };
        const [from, to] = reverse ? [mu0 + half, mu0 - half] : [mu0 - half, mu0 + half];
        const trace = traceBranches(shifted, Float64Array.of(0), traceSettings(0, from, to), [new Float64Array(2)]);
        expectAllConverged(trace);
        expect(trace.events.map((e) => e.type)).toEqual(['hopf']);
        const hopf = trace.events[0]!;
        expectClose(hopf.parameter, mu0, { abs: 1e-10 * (1 + Math.abs(mu0)) }, 'Hopf μ0 (analytic)');
        expectClose(hopf.frequency!, omega, { rel: 1e-10 }, 'ω (analytic)');
        expectClose(hopf.lyapunov!, (2 * s) / omega, { rel: 1e-6 }, 'l1 = 2s/ω (analytic)');
        expect(hopf.criticality).toBe(s < 0 ? 'supercritical' : 'subcritical');
      },
    ), repeatable(RUN, 30));
  });

  it('finds the transcritical point of x\' = k(λ − λ0)x − x² and the crossing branch x = k(λ − λ0)', () => {
    // Analytic: branches x = 0 and x = k(λ − λ0) cross at λ0 with different slopes.
    fc.assert(fc.property(
      fc.double({ min: 0.1, max: 10, noNaN: true }), fc.double({ min: -3, max: 3, noNaN: true }),
      fc.double({ min: 0.2, max: 2, noNaN: true }), fc.boolean(),
      (k, l0, half, reverse) => {
        const system = withStableDirection((x, l) => k * (l - l0) * x - x * x, (x, l) => k * (l - l0) - 2 * x, (x) => k * x);
        const [from, to] = reverse ? [l0 + half, l0 - half] : [l0 - half, l0 + half];
        const trace = traceBranches(system, Float64Array.of(0), traceSettings(0, from, to), [new Float64Array(2)]);
        expectAllConverged(trace);
        expect(trace.events.map((e) => e.type)).toEqual(['transcritical']);
        expectClose(trace.events[0]!.parameter, l0, { abs: 1e-10 * (1 + Math.abs(l0)) }, 'λ0 (analytic)');
        expect(trace.branches).toHaveLength(2);
        for (const q of trace.branches[1]!.points) {
          expectClose(q.state[0]!, k * (q.parameter - l0), { abs: 1e-8 * (1 + k) }, 'on x = k(λ − λ0) (analytic)');
        }
        expect(trace.warnings).toEqual([]);
      },
    ), repeatable(RUN, 30));
  });

  /**
   * Offsets of the trivial branch: 0 or of order one, and half-branches of size at most 2. (A state
   * that is 0 at the start while another is 1e-5, say, and a branch of size one: the start-size
   * weights of src/trace/stateWeights.ts then make the branch longer than the default point budget.)
   */
  const offset = fc.oneof(fc.constant(0), fc.double({ min: 1, max: 3, noNaN: true }), fc.double({ min: -3, max: -1, noNaN: true }));

  it('finds the pitchfork of a rotated and shifted x\' = k(λ − λ0)x − c·x³ and both halves of the new branch', () => {
    // Analytic: in coordinates (u, v) = Qᵀ(y − y0), Q a rotation by θ, the system is
    // u' = k(λ − λ0)u − c·u³, v' = −v: the branch u = 0 (y = y0) and, for λ > λ0, u = ±√(k(λ − λ0)/c),
    // which turns at (y0, λ0): a pitchfork.
    fc.assert(fc.property(
      fc.double({ min: 0.2, max: 2, noNaN: true }), fc.double({ min: 0.5, max: 5, noNaN: true }),
      fc.double({ min: -2, max: 2, noNaN: true }), fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }),
      offset, offset, fc.boolean(),
      (k, c, l0, theta, y1, y2, reverse) => {
        const [co, si] = [Math.cos(theta), Math.sin(theta)];
        const local = (y: Float64Array): [number, number] => {
          const [d1, d2] = [y[0]! - y1, y[1]! - y2];
          return [co * d1 + si * d2, -si * d1 + co * d2];
        };
        const system = makeSystem({
          n: 2,
          parameters: { lambda: 0 },
          rhs: (y, p, out) => {
            const [u, v] = local(y);
            const [gu, gv] = [k * (p[0]! - l0) * u - c * u ** 3, -v];
            out[0] = co * gu - si * gv;
            out[1] = si * gu + co * gv;
          },
          jacobian: (y, p, out) => {
            const [u] = local(y);
            const d = k * (p[0]! - l0) - 3 * c * u * u; // J = Q diag(d, −1) Qᵀ
            out.set([d * co * co - si * si, (d + 1) * co * si, (d + 1) * co * si, d * si * si - co * co]);
          },
          paramDerivative: (y, _p, _k, out) => {
            const [u] = local(y);
            out[0] = co * k * u;
            out[1] = si * k * u;
          },
        });
        const [from, to] = reverse ? [l0 + 1, l0 - 1] : [l0 - 1, l0 + 1];
        const trace = traceBranches(system, Float64Array.of(0), traceSettings(0, from, to), [Float64Array.of(y1, y2)]);
        expectAllConverged(trace);
        expect(trace.events.map((e) => e.type)).toEqual(['pitchfork']);
        expectClose(trace.events[0]!.parameter, l0, { abs: 1e-10 * (1 + Math.abs(l0)) }, 'λ0 (analytic)');
        expect(trace.events[0]!.newBranches).toEqual([2]);
        const halves = trace.branches[1]!.points.map((q) => local(q.state)[0]);
        for (const q of trace.branches[1]!.points) {
          const [u, v] = local(q.state);
          // The residual u·(k(λ − λ0) − c·u²) ≤ absTol bounds the distance to the branch only by
          // absTol/|u|, so the distance is checked away from the branch point.
          if (Math.abs(u) >= 0.05) expectClose(c * u * u, k * (q.parameter - l0), { abs: 1e-8 * (1 + k) }, 'on c·u² = k(λ − λ0) (analytic)');
          expectClose(v, 0, { abs: 1e-8 }, 'v = 0 (analytic)');
        }
        expect(Math.min(...halves)).toBeLessThan(0);
        expect(Math.max(...halves)).toBeGreaterThan(0);
        expect(trace.warnings).toEqual([]);
      },
    ), repeatable(RUN, 30));
  });
});
