/**
 * The one-dimensional Bratu problem u_t = u_xx + λ e^u on (0, 1), u(0) = u(1) = 0, discretised by
 * central differences on N interior points (h = 1/(N + 1)):
 *   u_i' = (u_{i−1} − 2u_i + u_{i+1})/h² + λ e^{u_i}.
 *
 * Analytic fold of the continuous problem: u = −2 ln( cosh(θ(x − ½)/2) / cosh(θ/4) ) solves
 * u'' + λe^u = 0 with u(0) = u(1) = 0 exactly when θ = √(2λ) cosh(θ/4) (differentiate twice:
 * u'' = −(θ²/2) sech²(θ(x − ½)/2) and λe^u = λ cosh²(θ/4) sech²(θ(x − ½)/2)). So
 * λ(θ) = θ² / (2 cosh²(θ/4)); it is largest where dλ/dθ = 0, i.e. θ tanh(θ/4) = 4, which gives the
 * fold λ* ≈ 3.51383071912516. The central-difference error is O(h²), so the discrete fold λ_N
 * approaches λ* at second order.
 */
import { describe, expect, it } from 'vitest';
import type { System } from '../../src/types.js';
import { traceBranches } from '../../src/trace/traceBranches.js';
import { traceSettings } from '../../src/trace/traceSettings.js';
import { makeSystem } from '../helpers/handSystem.js';
import { bisect } from './bisect.js';
import { expectClose } from '../helpers/close.js';

function bratu(n: number): System {
  const h2 = (n + 1) ** 2;
  return makeSystem({
    n,
    parameters: { lambda: 0 },
    rhs: (u, p, out) => {
      for (let i = 0; i < n; i++) {
        const left = i > 0 ? u[i - 1]! : 0;
        const right = i < n - 1 ? u[i + 1]! : 0;
        out[i] = (left - 2 * u[i]! + right) * h2 + p[0]! * Math.exp(u[i]!);
      }
    },
    jacobian: (u, p, out) => {
      out.fill(0);
      for (let i = 0; i < n; i++) {
        out[i * n + i] = -2 * h2 + p[0]! * Math.exp(u[i]!);
        if (i > 0) out[i * n + i - 1] = h2;
        if (i < n - 1) out[i * n + i + 1] = h2;
      }
    },
    paramDerivative: (u, _p, _k, out) => { for (let i = 0; i < n; i++) out[i] = Math.exp(u[i]!); },
    secondDerivative: (u, p, a, b, out) => {
      for (let i = 0; i < n; i++) out[i] = p[0]! * Math.exp(u[i]!) * a[i]! * b[i]!;
    },
    mixedDerivative: (u, _p, _k, v, out) => { for (let i = 0; i < n; i++) out[i] = Math.exp(u[i]!) * v[i]!; },
  });
}

function discreteFold(n: number): number {
  // The upper branch runs off to u → ∞ as λ → 0 and never leaves [0, 4]: a small point budget ends it.
  const settings = traceSettings(0, 0, 4, { maxPoints: 300 });
  const trace = traceBranches(bratu(n), Float64Array.of(0), settings, [new Float64Array(n)]);
  const folds = trace.events.filter((e) => e.type === 'fold');
  expect(folds).toHaveLength(1);
  expect(trace.branches[0]!.stopped).toBe('point budget');
  expect(trace.branches[0]!.points[0]!.parameter).toBe(0);
  return folds[0]!.parameter;
}

/**
 * Reference fold of the discrete problem by shooting, independent of the continuation: with
 * u_0 = 0 and u_1 = s the scheme marches u_{i+1} = 2u_i − u_{i−1} − h²λe^{u_i}; λ(s) is the root
 * of u_{N+1}(s, λ) = 0 (bisection; u_{N+1} falls as λ grows), and the fold is max_s λ(s), found by
 * golden-section search (the maximum value is insensitive to the error in s, quadratically).
 */
function shootingFold(n: number): number {
  const h2 = 1 / (n + 1) ** 2;
  const endValue = (s: number, l: number): number => {
    let prev = 0;
    let cur = s;
    for (let i = 1; i <= n; i++) {
      const next = 2 * cur - prev - h2 * l * Math.exp(cur);
      prev = cur;
      cur = next;
      if (!Number.isFinite(cur) || cur < -50) return -1; // diverged downward: λ too large
    }
    return cur;
  };
  const lambdaOf = (s: number): number => bisect((l) => endValue(s, l), 0, 10);
  const g = (Math.sqrt(5) - 1) / 2;
  let a = 0.01;
  let b = 1;
  for (let i = 0; i < 80; i++) {
    const c = b - g * (b - a);
    const d = a + g * (b - a);
    if (lambdaOf(c) > lambdaOf(d)) b = d;
    else a = c;
  }
  return lambdaOf(0.5 * (a + b));
}

describe('traceBranches on the discretised Bratu problem', () => {
  it('locates the fold of the discrete problem to 1e-10 relative (reference by shooting, N = 10)', () => {
    expectClose(discreteFold(10), shootingFold(10), { rel: 1e-10 }, 'discrete fold (shooting reference)');
  });

  it('finds a fold that converges to the analytic λ* at second order as N grows', () => {
    const theta = bisect((t) => t * Math.tanh(t / 4) - 4, 1, 10);
    const lambdaStar = theta ** 2 / (2 * Math.cosh(theta / 4) ** 2);
    // Cross-check of the root find against the commonly quoted value (from memory).
    expectClose(lambdaStar, 3.51383071912516, { rel: 1e-13 }, 'λ* (analytic, from memory 3.51383071912516)');
    const ns = [10, 20, 40];
    const errors = ns.map((n) => Math.abs(discreteFold(n) - lambdaStar));
    for (let i = 0; i + 1 < ns.length; i++) {
      const order = Math.log(errors[i]! / errors[i + 1]!) / Math.log((ns[i + 1]! + 1) / (ns[i]! + 1));
      expectClose(order, 2, { abs: 0.1 }, `observed order N = ${ns[i]} → ${ns[i + 1]} (analytic 2, central differences)`);
    }
    expect(errors[2]!).toBeLessThan(2e-3); // about C·h² with h = 1/41
  });
});
