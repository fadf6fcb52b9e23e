/**
 * refineBranchPoint: Newton's method on the augmented branch-point system
 * F(z) + βψ = 0, F_zᵀψ = 0, ψᵀψ = 1 (src/trace/refineBranchPoint.ts) on systems whose branch
 * points are known in closed form (derivations beside each test).
 */
import { describe, expect, it } from 'vitest';
import { makeExtendedSystem } from '../../src/trace/extendedSystem.js';
import { refineBranchPoint } from '../../src/trace/refineBranchPoint.js';
import { makeSystem } from '../helpers/handSystem.js';
import { expectClose } from '../helpers/close.js';
import { scalarSystem } from './traceSystems.js';

const options = { absTol: 1e-12, maxIter: 12, stepTol: 1e-13, maxDistance: 1 };

describe('refineBranchPoint', () => {
  it('converges to the transcritical point of x\' = (λ − 0.7)(x − 0.3) − (x − 0.3)² at (0.3, 0.7)', () => {
    // Analytic: the branches x = 0.3 and x = λ − 0.4 cross at (x, λ) = (0.3, 0.7), where
    // F_z = [λ − 0.7 − 2(x − 0.3), x − 0.3] = 0 and ψ = ±1; the form Q = ψ·[[−2, 1], [1, 0]] has
    // determinant −1 ≠ 0, so the augmented system is regular there and Newton converges fast.
    const g = (x: number, l: number): number => (l - 0.7) * (x - 0.3) - (x - 0.3) ** 2;
    const system = scalarSystem(g, (x, l) => l - 0.7 - 2 * (x - 0.3), (x) => x - 0.3, () => -2, () => 1);
    const ext = makeExtendedSystem(system, Float64Array.of(0), 0, Float64Array.of(1));
    const r = refineBranchPoint(ext, Float64Array.of(0.31, 0.72), Float64Array.of(1), options);
    expect(r.status).toBe('converged');
    expectClose(r.z[0]!, 0.3, { abs: 1e-14 }, 'x (analytic 0.3)');
    expectClose(r.z[1]!, 0.7, { abs: 1e-14 }, 'λ (analytic 0.7)');
    expect(r.residual).toBeLessThanOrEqual(1e-15);
    expect(r.iterations).toBeLessThanOrEqual(6);
    expectClose(Math.abs(r.psi[0]!), 1, { abs: 1e-14 }, '|ψ| (analytic 1)');
  });

  it('converges to the pitchfork of x\' = λx − x³, y\' = −y + x² at the origin', () => {
    // Analytic: branches x = y = 0 and λ = x², y = x² cross at the origin. There
    // F_z = [[λ − 3x², 0, x], [2x, −1, 0]] = [[0, 0, 0], [0, −1, 0]]: rank 1 = n − 1, null space
    // span{e_x, e_λ}, left null vector ψ = (1, 0). ψᵀF_zz on that null space is [[−6x, 1], [1, 0]]
    // = [[0, 1], [1, 0]], determinant −1 ≠ 0: regular.
    const system = makeSystem({
      n: 2,
      parameters: { lambda: 0 },
      rhs: (x, p, out) => { out[0] = p[0]! * x[0]! - x[0]! ** 3; out[1] = -x[1]! + x[0]! ** 2; },
      jacobian: (x, p, out) => { out.set([p[0]! - 3 * x[0]! ** 2, 0, 2 * x[0]!, -1]); },
      paramDerivative: (x, _p, _k, out) => { out[0] = x[0]!; out[1] = 0; },
    });
    const ext = makeExtendedSystem(system, Float64Array.of(0), 0, Float64Array.of(1, 1));
    const r = refineBranchPoint(ext, Float64Array.of(0.02, 0.01, -0.03), Float64Array.of(1, 0.3), options);
    expect(r.status).toBe('converged');
    for (const v of r.z) expectClose(v, 0, { abs: 1e-12 }, 'branch point (analytic origin)');
    expect(r.residual).toBeLessThanOrEqual(1e-15);
    expectClose(Math.abs(r.psi[0]!), 1, { abs: 1e-10 }, '|ψ_x| (analytic 1)');
    expectClose(r.psi[1]!, 0, { abs: 1e-10 }, 'ψ_y (analytic 0)');
  });
});
