/**
 * Exact Jacobians and parameter derivatives against central finite differences (a general-purpose
 * reference computation, error O(h²) with h = ε^(1/3)), and checkJacobian's own ability to fail.
 */
import { describe, expect, it } from 'vitest';
import { checkJacobian } from '../../src/compile/checkJacobian.js';
import { compileModel } from '../../src/compile/compileModel.js';
import type { System } from '../../src/types.js';
import { expectClose } from '../helpers/close.js';
import { ALL_MODELS, modelFromText } from './models.js';
import { startOf } from './modelFromText.js';

describe('exact Jacobian against finite differences', () => {
  for (const [name, text] of ALL_MODELS) {
    it(`the Jacobian of ${name} agrees with central differences to a relative 1e-6`, () => {
      const model = modelFromText(text);
      const system = compileModel(model);
      const { x, p } = startOf(model);
      const check = checkJacobian(system, x, p);
      expect(check.maxRelError).toBeLessThan(1e-6);
      expect(check.maxAbsError).toBeLessThan(1e-5);
    });

    it(`the parameter derivatives of ${name} agree with central differences`, () => {
      const model = modelFromText(text);
      const system = compileModel(model);
      const { x, p } = startOf(model);
      const exact = new Float64Array(system.n);
      const plus = new Float64Array(system.n);
      const minus = new Float64Array(system.n);
      for (let k = 0; k < system.np; k++) {
        system.paramDerivative(x, p, k, exact);
        const h = Math.cbrt(Number.EPSILON) * Math.max(1, Math.abs(p[k]!));
        const shifted = Float64Array.from(p);
        shifted[k] = p[k]! + h;
        system.rhs(x, shifted, plus);
        shifted[k] = p[k]! - h;
        system.rhs(x, shifted, minus);
        for (let i = 0; i < system.n; i++) {
          expectClose(exact[i]!, (plus[i]! - minus[i]!) / (2 * h), { abs: 1e-6, rel: 1e-6 }, `∂f${i}/∂p${k}`);
        }
      }
    });
  }

  it('the Jacobian of a linear system is its coefficient matrix exactly, zeros included', () => {
    // Analytic: f = A x with A = [[2, -3], [0, 0.5]].
    const system = compileModel(modelFromText({ states: { x: 0, y: 0 }, equations: { x: '2*x - 3*y', y: '0.5*y' } }));
    const out = new Float64Array(4).fill(99);
    system.jacobian(Float64Array.of(0.3, -4), new Float64Array(0), out);
    expect(Array.from(out)).toEqual([2, -3, 0, 0.5]);
  });

  it('an equation that only uses parameters has a Jacobian row of exact zeros', () => {
    const system = compileModel(modelFromText({ states: { x: 1 }, parameters: { a: 2 }, equations: { x: 'exp(a)*a^2' } }));
    const out = Float64Array.of(7);
    system.jacobian(Float64Array.of(1), Float64Array.of(2), out);
    expect(Object.is(out[0], 0)).toBe(true);
  });

  it('checkJacobian reports the entry of a deliberately wrong Jacobian', () => {
    const system = compileModel(modelFromText({ states: { x: 1, y: 2 }, equations: { x: 'x*y', y: 'x + y^2' } }));
    const wrong: System = {
      ...system,
      jacobian(x, p, out) {
        system.jacobian(x, p, out);
        out[3] = out[3]! * 1.01; // ∂f_y/∂y off by 1 %
      },
    };
    const check = checkJacobian(wrong, Float64Array.of(1, 2), new Float64Array(0));
    // Analytic: ∂(x + y²)/∂y = 2y = 4, reported as 4.04: error 0.04, relative to the reported 0.04/4.04.
    expectClose(check.maxAbsError, 0.04, { rel: 1e-6 }, 'absolute error');
    expectClose(check.maxRelError, 0.04 / 4.04, { rel: 1e-6 }, 'relative error');
    expect(check.worst).toEqual({ row: 1, col: 1 });
  });
});
