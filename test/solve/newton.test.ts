import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { newton, type VectorFunction } from '../../src/solve/newton.js';
import { repeatable } from '../helpers/repeatable.js';

const opts = { absTol: 1e-12, maxIter: 50 };

/** F(x) = A x − b with its constant Jacobian. */
function linear(a: Float64Array, b: Float64Array, n: number): { F: VectorFunction; J: VectorFunction } {
  return {
    F: (x, out) => {
      for (let i = 0; i < n; i++) {
        let s = -b[i]!;
        for (let j = 0; j < n; j++) s += a[i * n + j]! * x[j]!;
        out[i] = s;
      }
    },
    J: (_x, out) => out.set(a),
  };
}

describe('newton', () => {
  it('solves a well-conditioned linear system in one step', () => {
    // Analytic: Newton's step on an affine F lands on A⁻¹b exactly up to rounding.
    // A = diag(4…) + small off-diagonal entries is strictly diagonally dominant, hence well conditioned.
    fc.assert(fc.property(
      fc.integer({ min: 1, max: 8 }).chain((n) => fc.record({
        n: fc.constant(n),
        off: fc.array(fc.double({ min: -0.5, max: 0.5, noNaN: true }), { minLength: n * n, maxLength: n * n }),
        b: fc.array(fc.double({ min: -10, max: 10, noNaN: true }), { minLength: n, maxLength: n }),
      })),
      ({ n, off, b }) => {
        const a = Float64Array.from(off, (v, k) => (k % (n + 1) === 0 ? 4 : v));
        const { F, J } = linear(a, Float64Array.from(b), n);
        const r = newton(F, J, new Float64Array(n), { absTol: 1e-10, maxIter: 5 });
        expect(r.status).toBe('converged');
        expect(r.iterations).toBeLessThanOrEqual(1);
        expect(r.residual).toBeLessThanOrEqual(1e-10);
      },
    ), repeatable(4711, 200));
  });

  it('converges quadratically to √2 on x² − 2 = 0', () => {
    // Analytic: for a simple root, e_{k+1} ≈ (f''/2f') e_k² = e_k²/(2√2) (Newton's error recursion).
    const errors: number[] = [];
    const F: VectorFunction = (x, out) => {
      errors.push(Math.abs(x[0]! - Math.SQRT2));
      out[0] = x[0]! * x[0]! - 2;
    };
    const J: VectorFunction = (x, out) => {
      out[0] = 2 * x[0]!;
    };
    const r = newton(F, J, Float64Array.of(1.5), opts);
    expect(r.status).toBe('converged');
    expect(Math.abs(r.x[0]! - Math.SQRT2)).toBeLessThan(1e-15);
    // Errors at accepted iterates: 0.0858, 2.5e-3, 2.1e-6, 1.6e-12. Ratio e_{k+1}/e_k² → 1/(2√2) ≈ 0.354.
    for (let k = 0; k + 1 < errors.length && errors[k + 1]! > 1e-14; k++) {
      expect(errors[k + 1]! / errors[k]! ** 2).toBeGreaterThan(0.3);
      expect(errors[k + 1]! / errors[k]! ** 2).toBeLessThan(0.45);
    }
    expect(r.iterations).toBeLessThanOrEqual(5);
  });

  it('returns "converged" after zero iterations at an exact root', () => {
    const r = newton((x, o) => { o[0] = x[0]! - 3; }, (_x, o) => { o[0] = 1; }, Float64Array.of(3), opts);
    expect(r.status).toBe('converged');
    expect(r.iterations).toBe(0);
    expect(r.residual).toBe(0);
  });

  it('takes minSteps steps before a small residual may stop it, except at an exact root', () => {
    // F(x) = 1e-12·(x − 1e-6): the residual at x = 0 is 1e-18, under absTol, yet x is 100 % off.
    // Linear, so one Newton step lands on the root x = 1e-6 (analytic).
    const F: VectorFunction = (x, o) => { o[0] = 1e-12 * (x[0]! - 1e-6); };
    const J: VectorFunction = (_x, o) => { o[0] = 1e-12; };
    expect(newton(F, J, Float64Array.of(0), opts).x[0]).toBe(0);
    const stepped = newton(F, J, Float64Array.of(0), { ...opts, minSteps: 1 });
    expect(stepped.status).toBe('converged');
    expect(stepped.iterations).toBe(1);
    expect(stepped.x[0]).toBeCloseTo(1e-6, 20);
    const exact = newton(F, J, Float64Array.of(1e-6), { ...opts, minSteps: 1 });
    expect(exact.iterations).toBe(0);
  });

  it('returns "singular" when the Jacobian is singular', () => {
    // F(x, y) = (x + y − 1, 2x + 2y − 3): rows of J are dependent (analytic: det J = 0), no solution.
    const F: VectorFunction = (x, out) => {
      out[0] = x[0]! + x[1]! - 1;
      out[1] = 2 * x[0]! + 2 * x[1]! - 3;
    };
    const J: VectorFunction = (_x, out) => out.set([1, 1, 2, 2]);
    const r = newton(F, J, Float64Array.of(0, 0), opts);
    expect(r.status).toBe('singular');
    expect(r.iterations).toBe(0);
    expect(r.residual).toBe(3);
  });

  it('returns "non-finite" when F is NaN at the start', () => {
    const r = newton((x, o) => { o[0] = Math.log(x[0]!); }, (x, o) => { o[0] = 1 / x[0]!; }, Float64Array.of(-1), opts);
    expect(r.status).toBe('non-finite');
    expect(r.iterations).toBe(0);
    expect(Number.isNaN(r.residual)).toBe(true);
  });

  it('returns "non-finite" when the Jacobian is not finite', () => {
    // √|x| has an infinite derivative at 0.
    const r = newton((x, o) => { o[0] = Math.sqrt(Math.abs(x[0]!)) + 1; }, (x, o) => { o[0] = 0.5 / Math.sqrt(Math.abs(x[0]!)); },
      Float64Array.of(0), opts);
    expect(r.status).toBe('non-finite');
  });

  it('backs off from a NaN trial point and still converges with the line search', () => {
    // log(x) = 0 from x0 = 3: the full step x1 = x0 − x0·ln x0 = −0.296 leaves the domain (analytic);
    // halving the step keeps x > 0, and the root is x = 1.
    const F: VectorFunction = (x, o) => { o[0] = Math.log(x[0]!); };
    const J: VectorFunction = (x, o) => { o[0] = 1 / x[0]!; };
    const damped = newton(F, J, Float64Array.of(3), opts);
    expect(damped.status).toBe('converged');
    expect(Math.abs(damped.x[0]! - 1)).toBeLessThan(1e-12);
    const undamped = newton(F, J, Float64Array.of(3), opts, { lineSearch: false, armijo: 1e-4, minFraction: 1 / 1024 });
    expect(undamped.status).toBe('non-finite');
  });

  it('converges from a far start on arctan where the undamped iteration diverges', () => {
    // Analytic: undamped Newton on atan(x) diverges for |x0| > 1.3917 (root of 2x = (1 + x²)·atan x).
    const F: VectorFunction = (x, o) => { o[0] = Math.atan(x[0]!); };
    const J: VectorFunction = (x, o) => { o[0] = 1 / (1 + x[0]! ** 2); };
    const damped = newton(F, J, Float64Array.of(10), opts);
    expect(damped.status).toBe('converged');
    expect(Math.abs(damped.x[0]!)).toBeLessThan(1e-12);
    const undamped = newton(F, J, Float64Array.of(10), opts, { lineSearch: false, armijo: 1e-4, minFraction: 1 / 1024 });
    expect(undamped.status).not.toBe('converged');
  });

  it('returns "max-iter" with the residual when the iteration budget is too small', () => {
    // x² = 0 has a double root: Newton halves the error each step (analytic), so 3 steps from 1 leave x = 1/8.
    const r = newton((x, o) => { o[0] = x[0]! * x[0]!; }, (x, o) => { o[0] = 2 * x[0]!; }, Float64Array.of(1), { absTol: 1e-12, maxIter: 3 });
    expect(r.status).toBe('max-iter');
    expect(r.iterations).toBe(3);
    expect(Math.abs(r.x[0]! - 0.125)).toBeLessThan(1e-15);
    expect(Math.abs(r.residual - 1 / 64)).toBeLessThan(1e-15);
    expect(Math.abs(r.lastStep - 0.125)).toBeLessThan(1e-15);
  });

  it('returns "stalled" when no step reduces the residual (a local minimum of |F| that is not a root)', () => {
    // F(x) = x² + 1 has no real root; from x0 = 1e-3 (near the minimum of |F| at 0) the Newton step
    // jumps to x ≈ −500 and halving never brings |F| below its start value by the Armijo margin.
    const r = newton((x, o) => { o[0] = x[0]! * x[0]! + 1; }, (x, o) => { o[0] = 2 * x[0]!; }, Float64Array.of(1e-3), opts);
    expect(r.status).toBe('stalled');
    expect(r.residual).toBeGreaterThan(1);
  });
});
