import { describe, expect, it } from 'vitest';
import { foldCoefficient } from '../../src/detect/foldCoefficient.js';
import type { System } from '../../src/types.js';
import { makeSystem } from '../helpers/handSystem.js';
import { linearChange } from './detectSystems.js';

/** x' = r + c x², parameter r: fold at r = 0, x = 0. */
function scalarFold(c: number): System {
  return makeSystem({
    n: 1,
    parameters: { r: 0 },
    rhs: (x, p, out) => out.set([p[0]! + c * x[0]! ** 2]),
    jacobian: (x, _p, out) => out.set([2 * c * x[0]!]),
    paramDerivative: (_x, _p, _k, out) => out.set([1]),
    secondDerivative: (_x, _p, u, v, out) => out.set([2 * c * u[0]! * v[0]!]),
  });
}

/** x' = r + c x² + e y, y' = −y + d x²: fold at r = 0, origin. */
function planarFold(c: number, d: number, e: number): System {
  return makeSystem({
    n: 2,
    parameters: { r: 0 },
    rhs: (x, p, out) => out.set([p[0]! + c * x[0]! ** 2 + e * x[1]!, -x[1]! + d * x[0]! ** 2]),
    jacobian: (x, _p, out) => out.set([2 * c * x[0]!, e, 2 * d * x[0]!, -1]),
    paramDerivative: (_x, _p, _k, out) => out.set([1, 0]),
    secondDerivative: (_x, _p, u, v, out) => out.set([2 * c * u[0]! * v[0]!, 2 * d * u[0]! * v[0]!]),
  });
}

const zero1 = new Float64Array(1);
const zero2 = new Float64Array(2);

describe('foldCoefficient', () => {
  it('gives a = c for x\' = r + c x² at r = 0', () => {
    // Analytic: A = 0, q = p = 1, a = ½·p·B(q,q) = ½·2c = c (Kuznetsov 3rd ed. §3.2).
    for (const c of [1, -2.5, 0.01]) {
      const r = foldCoefficient(scalarFold(c), zero1, zero1, { parameterIndex: 0 });
      expect(r.status).toBe('ok');
      expect(Math.abs(r.a - c)).toBeLessThan(1e-14 * (1 + Math.abs(c)));
      expect(r.q[0]).toBe(1);
      // Analytic: ⟨p, ∂f/∂r⟩ = 1·1.
      expect(Math.abs(r.transversality! - 1)).toBeLessThan(1e-14);
    }
  });

  it('gives a = c with a decoupled stable direction (x\' = r + c x², y\' = −y)', () => {
    // Analytic: q = p = (1, 0), a = ½⟨p, B(q,q)⟩ = c.
    const r = foldCoefficient(planarFold(-0.8, 0, 0), zero2, zero1);
    expect(r.status).toBe('ok');
    expect(Math.abs(r.a - -0.8)).toBeLessThan(1e-14);
    expect(Math.abs(r.q[0]! - 1)).toBeLessThan(1e-14);
    expect(Math.abs(r.q[1]!)).toBeLessThan(1e-14);
    expect(r.diagnostics.residual).toBeLessThan(1e-14);
  });

  it('gives a = c + e·d when the stable direction feeds back (non-normal Jacobian, p ≠ q)', () => {
    // Analytic: A = [[0, e], [0, −1]], q = (1, 0), Aᵀp = 0 gives p = (1, e). Centre manifold y = d x² + O(x³)
    // (from −y + d x² = y' = O(x³)), so x' = r + (c + e d) x², and ½⟨p, B(q,q)⟩ = ½(2c + e·2d) agrees.
    const r = foldCoefficient(planarFold(1.5, 0.7, -2), zero2, zero1, { parameterIndex: 0 });
    expect(r.status).toBe('ok');
    expect(Math.abs(r.a - (1.5 + -2 * 0.7))).toBeLessThan(1e-14);
    expect(Math.abs(r.pLeft[0]! - 1)).toBeLessThan(1e-14);
    expect(Math.abs(r.pLeft[1]! - -2)).toBeLessThan(1e-14);
    expect(r.diagnostics.normalisationError).toBeLessThan(1e-14);
    expect(r.diagnostics.adjointResidual).toBeLessThan(1e-14);
  });

  it('scales as a_x = σ·c/‖T e1‖ in coordinates x = T z (σ = sign of the largest entry of T e1)', () => {
    // Analytic: q_x = σ T e1/‖T e1‖ by the sign convention, so q_z = T⁻¹q_x = σ e1/‖T e1‖, and a scales
    // linearly with q (p scales with 1/q): a_x = c·σ/‖T e1‖.
    const c = 0.6;
    for (const t of [[2, 0.5, -0.7, 1.2], [-3, 1, 1, 1], [0.5, 0, 0, 4]]) {
      const r = foldCoefficient(linearChange(planarFold(c, 0, 0), t), zero2, zero1);
      const col = [t[0]!, t[2]!];
      const sigma = Math.sign(Math.abs(col[0]!) >= Math.abs(col[1]!) ? col[0]! : col[1]!);
      expect(r.status).toBe('ok');
      expect(Math.abs(r.a - (sigma * c) / Math.hypot(col[0]!, col[1]!))).toBeLessThan(1e-13);
      const big = Math.abs(r.q[0]!) >= Math.abs(r.q[1]!) ? r.q[0]! : r.q[1]!;
      expect(big).toBeGreaterThan(0);
    }
  });

  it('gives zero transversality and a = −1 at the transcritical point of x\' = r x − x²', () => {
    // Analytic: A = r − 2x = 0 at the origin, ∂f/∂r = x = 0, B(q,q) = −2.
    const system = makeSystem({
      n: 1,
      parameters: { r: 0 },
      rhs: (x, p, out) => out.set([p[0]! * x[0]! - x[0]! ** 2]),
      jacobian: (x, p, out) => out.set([p[0]! - 2 * x[0]!]),
      paramDerivative: (x, _p, _k, out) => out.set([x[0]!]),
      secondDerivative: (_x, _p, u, v, out) => out.set([-2 * u[0]! * v[0]!]),
    });
    const r = foldCoefficient(system, zero1, zero1, { parameterIndex: 0 });
    expect(Math.abs(r.a - -1)).toBeLessThan(1e-14);
    expect(r.transversality).toBe(0);
  });

  it('uses the eigenvalue closest to zero when the point is only approximately a fold', () => {
    // x' = r + x² at x = 1e-9: A = 2e-9; the vectors are still exact and a = 1 (analytic).
    const r = foldCoefficient(scalarFold(1), Float64Array.of(1e-9), zero1);
    expect(Math.abs(r.diagnostics.eigenvalue - 2e-9)).toBeLessThan(1e-22);
    expect(Math.abs(r.a - 1)).toBeLessThan(1e-14);
  });

  it('returns "non-finite" for a NaN state and "no-critical-eigenvalue" when all eigenvalues are complex', () => {
    expect(foldCoefficient(scalarFold(1), Float64Array.of(NaN), zero1).status).toBe('non-finite');
    const rotation = makeSystem({
      n: 2,
      rhs: (x, _p, out) => out.set([-x[1]!, x[0]!]),
      jacobian: (_x, _p, out) => out.set([0, -1, 1, 0]),
    });
    const r = foldCoefficient(rotation, zero2, new Float64Array(0));
    expect(r.status).toBe('no-critical-eigenvalue');
    expect(Number.isNaN(r.a)).toBe(true);
  });
});
