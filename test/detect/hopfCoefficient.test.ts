import { describe, expect, it } from 'vitest';
import { lyapunovCoefficient } from '../../src/detect/hopfCoefficient.js';
import type { System } from '../../src/types.js';
import { makeSystem } from '../helpers/handSystem.js';
import { brusselator, coupledHopf, hopfNormalForm, linearChange, lorenz } from './detectSystems.js';

const origin2 = new Float64Array(2);
const atZero = Float64Array.of(0);

function expectHealthy(r: ReturnType<typeof lyapunovCoefficient>): void {
  expect(r.status).toBe('ok');
  expect(r.diagnostics.eigenResidual).toBeLessThan(1e-12);
  expect(r.diagnostics.adjointResidual).toBeLessThan(1e-12);
  expect(r.diagnostics.normalisationError).toBeLessThan(1e-12);
}

/**
 * Reference for planar systems (implemented only here): Guckenheimer & Holmes 1983, eq. (3.4.11),
 * for u' = −ωv + f(u, v), v' = ωu + g(u, v):
 *   a = (f_uuu + f_uvv + g_uuv + g_vvv)/16 + (f_uv(f_uu + f_vv) − g_uv(g_uu + g_vv) − f_uu g_uu + f_vv g_vv)/(16ω),
 * the coefficient of r³ in r' for r = |u + iv|. With q_uv = (1, −i)/√2, u + iv = √2 z, so Re c1 = 2a and
 * l1 = 2a/ω in these coordinates (as for the normal form below).
 * The system is brought to that form by x = x0 + T(u, v) with T = [Re q, −Im q] for A q = iω q
 * (then A Re q = −ω Im q and A Im q = ω Re q, so T⁻¹AT = [[0, −ω], [ω, 0]]), and l1 in the original
 * coordinates is (2a/ω) · 2/(|Re q|² + |Im q|²), since T q_uv = q/√2 (the scaling law l1_x = l1_uv/‖T q_uv‖²
 * is verified by the sheared-coordinates test below).
 */
function planarReference(system: System, x0: Float64Array, params: Float64Array, omega: number, q: [number, number, number, number]): number {
  const [q1re, q1im, q2re, q2im] = q;
  const t1 = Float64Array.of(q1re, q2re);
  const t2 = Float64Array.of(-q1im, -q2im);
  const det = t1[0]! * t2[1]! - t2[0]! * t1[1]!;
  const back = (w: Float64Array): [number, number] => [(t2[1]! * w[0]! - t2[0]! * w[1]!) / det, (-t1[1]! * w[0]! + t1[0]! * w[1]!) / det];
  const out = new Float64Array(2);
  const b = (u: Float64Array, v: Float64Array): [number, number] => (system.secondDerivative(x0, params, u, v, out), back(out));
  const c = (u: Float64Array, v: Float64Array, w: Float64Array): [number, number] =>
    (system.thirdDerivative(x0, params, u, v, w, out), back(out));
  const [fuu, guu] = b(t1, t1);
  const [fuv, guv] = b(t1, t2);
  const [fvv, gvv] = b(t2, t2);
  const [fuuu] = c(t1, t1, t1);
  const [fuvv] = c(t1, t2, t2);
  const [, guuv] = c(t1, t1, t2);
  const [, gvvv] = c(t2, t2, t2);
  const a = (fuuu + fuvv + guuv + gvvv) / 16 + (fuv * (fuu + fvv) - guv * (guu + gvv) - fuu * guu + fvv * gvv) / (16 * omega);
  return ((2 * a) / omega) * 2 / (q1re ** 2 + q1im ** 2 + q2re ** 2 + q2im ** 2);
}

/*
 * Normalisation used throughout (Kuznetsov 3rd ed. §3.5): ‖q‖ = 1 and x = x0 + z q + z̄ q̄ + O(|z|²),
 * l1 = Re(c1)/ω for ż = iωz + c1 z|z|². Analytic consequence for the Cartesian normal form
 * x' = −ωy + s·x r², y' = ωx + s·y r² (ζ = x + iy, ζ' = iωζ + s ζ|ζ|²): q = (1, −i)/√2, so
 * ζ = x1 + i x2 = √2 z, hence ż = iωz + 2s z|z|², c1 = 2s and l1 = 2s/ω (the sign is s's).
 */
describe('lyapunovCoefficient on the Hopf normal form', () => {
  it('gives l1 = 2s = −2 (supercritical) for ζ\' = iζ − ζ|ζ|²', () => {
    // Analytic (see the comment above): l1 = 2s/ω with s = −1, ω = 1.
    const r = lyapunovCoefficient(hopfNormalForm(-1), origin2, atZero);
    expectHealthy(r);
    expect(Math.abs(r.l1 - -2)).toBeLessThan(1e-12);
    expect(r.criticality).toBe('supercritical');
    expect(Math.abs(r.omega - 1)).toBeLessThan(1e-14);
    expect(Math.abs(r.period - 2 * Math.PI)).toBeLessThan(1e-13);
  });

  it('gives l1 = 2s = +2 (subcritical) for ζ\' = iζ + ζ|ζ|²', () => {
    // Analytic, as above.
    const r = lyapunovCoefficient(hopfNormalForm(1), origin2, atZero);
    expectHealthy(r);
    expect(Math.abs(r.l1 - 2)).toBeLessThan(1e-12);
    expect(r.criticality).toBe('subcritical');
  });

  it('gives l1 = 2s/ω when the frequency is ω = 2.5', () => {
    // Analytic: l1 = 2s/ω = 2·(−0.7)/2.5.
    const r = lyapunovCoefficient(hopfNormalForm(-0.7, 2.5), origin2, atZero);
    expectHealthy(r);
    expect(Math.abs(r.l1 - (2 * -0.7) / 2.5)).toBeLessThan(1e-12);
    expect(Math.abs(r.omega - 2.5)).toBeLessThan(1e-12);
    expect(r.diagnostics.residual).toBeLessThan(1e-12);
  });

  it('reports "degenerate" when the cubic term vanishes (s = 0)', () => {
    // Analytic: the linear centre has c1 = 0, so l1 = 0.
    const r = lyapunovCoefficient(hopfNormalForm(0), origin2, atZero);
    expect(r.l1).toBe(0);
    expect(r.criticality).toBe('degenerate');
  });

  it('gives l1 = 4s/(ω‖T‖_F²) in coordinates x = T z for a rotation, a scaling and a shear', () => {
    // Analytic: in x = Tz the null vectors are T q_z (normalised) and T⁻ᵀ p_z, and B_x(Tu, Tv) = T B_z(u, v),
    // so every term of eq. (3.20) equals the z-term computed with q_z/‖T q_z‖. l1 scales with |q|², hence
    // l1_x = l1_z / ‖T q_z‖² with l1_z = 2s/ω, and for q_z = (1, −i)/√2, ‖T q_z‖² = ‖T‖_F²/2.
    const s = -1.3;
    const omega = 0.8;
    const c = Math.cos(0.7);
    const sn = Math.sin(0.7);
    for (const t of [[c, -sn, sn, c], [3 * c, -3 * sn, 3 * sn, 3 * c], [2, 0.5, -0.7, 1.2]]) {
      const r = lyapunovCoefficient(linearChange(hopfNormalForm(s, omega), t), origin2, atZero);
      const frobenius2 = t.reduce((sum, v) => sum + v * v, 0);
      expectHealthy(r);
      expect(Math.abs(r.l1 - (4 * s) / (omega * frobenius2))).toBeLessThan(1e-12);
      expect(r.criticality).toBe('supercritical');
    }
  });
});

describe('lyapunovCoefficient in three dimensions', () => {
  it('gives l1 = 2s/ω with an extra decoupled stable direction', () => {
    // Analytic: α = γ = 0 leaves the planar normal form plus w' = −κw, so l1 = 2s/ω as in two dimensions.
    const r = lyapunovCoefficient(coupledHopf(1.7, 0, 0, 3, 0.9), new Float64Array(3), new Float64Array(0));
    expectHealthy(r);
    expect(Math.abs(r.omega - 1.7)).toBeLessThan(1e-12);
    expect(Math.abs(r.l1 - (2 * 0.9) / 1.7)).toBeLessThan(1e-12);
    expect(r.criticality).toBe('subcritical');
  });

  it('gives l1 = 2(s + αγ/κ)/ω when the stable direction is coupled quadratically', () => {
    // Analytic (centre-manifold reduction, see coupledHopf): ζ' = iωζ + (s + αγ/κ)ζ|ζ|², so l1 = 2(s + αγ/κ)/ω.
    // Exercises the A⁻¹B(q, q̄) term of eq. (3.20); the last case has s and αγ/κ of opposite signs.
    const cases = [[1.5, 0.8, -1.2, 2, 0], [2, 1, 1, 0.5, 0], [0.7, -2, 0.3, 4, 0], [1.1, 1, 2, 1, -0.5]] as const;
    for (const [omega, alpha, gamma, kappa, s] of cases) {
      const r = lyapunovCoefficient(coupledHopf(omega, alpha, gamma, kappa, s), new Float64Array(3), new Float64Array(0));
      const expected = (2 * (s + (alpha * gamma) / kappa)) / omega;
      expectHealthy(r);
      expect(Math.abs(r.l1 - expected)).toBeLessThan(1e-12);
      expect(r.criticality).toBe(expected < 0 ? 'supercritical' : 'subcritical');
    }
  });
});

describe('lyapunovCoefficient on published systems', () => {
  it('agrees with the planar formula of Guckenheimer & Holmes for the Brusselator at b = 1 + a²', () => {
    // Prigogine & Lefever 1968: equilibrium (a, b/a), Hopf at b = 1 + a², ω = a (analytic: trace 0,
    // determinant a²). Eigenvector (analytic, first row of (A − iaI)q = 0 with A = [[a², a²], [−1 − a², −a²]]):
    // q = (a², −a² + ia). Supercritical for every a > 0 (from memory; confirmed by the reference here).
    for (const a of [0.5, 1, 2, 3.7]) {
      const b = 1 + a * a;
      const system = brusselator(a, b);
      const x0 = Float64Array.of(a, b / a);
      const params = Float64Array.of(b);
      const r = lyapunovCoefficient(system, x0, params);
      expectHealthy(r);
      expect(Math.abs(r.omega - a)).toBeLessThan(1e-12 * (1 + a));
      const reference = planarReference(system, x0, params, a, [a * a, 0, -a * a, a]);
      expect(Math.abs(r.l1 - reference)).toBeLessThan(1e-11 * Math.abs(reference));
      expect(r.criticality).toBe('supercritical');
    }
  });

  it('checks the planar reference itself on the normal form (a = s, so l1 = 2s/ω)', () => {
    // Analytic: for ζ' = iωζ + s ζ|ζ|², (3.4.11) gives a = (6s + 2s + 2s + 6s)/16 = s, and l1 = 2s/ω (see above).
    const r = planarReference(hopfNormalForm(-0.6, 1.9), origin2, atZero, 1.9, [Math.SQRT1_2, 0, 0, -Math.SQRT1_2]);
    expect(Math.abs(r - (2 * -0.6) / 1.9)).toBeLessThan(1e-14);
  });

  it('finds the Lorenz Hopf point at ρ_H = σ(σ + b + 3)/(σ − b − 1) subcritical', () => {
    // Lorenz 1963, σ = 10, b = 8/3: at C+ = (√(b(ρ−1)), √(b(ρ−1)), ρ − 1) the characteristic polynomial is
    // λ³ + (σ + b + 1)λ² + b(σ + ρ)λ + 2σb(ρ − 1) (analytic); it has roots ±iω with ω² = b(σ + ρ) exactly when
    // (σ + b + 1)(σ + ρ) = 2σ(ρ − 1), i.e. at ρ_H = 470/19 ≈ 24.7368. Subcritical (l1 > 0): from memory
    // (Lorenz 1963 notes that the periodic orbits near C± are unstable).
    const sigma = 10;
    const beta = 8 / 3;
    const rho = (sigma * (sigma + beta + 3)) / (sigma - beta - 1);
    expect(Math.abs(rho - 470 / 19)).toBeLessThan(1e-12);
    const c = Math.sqrt(beta * (rho - 1));
    const r = lyapunovCoefficient(lorenz(sigma, beta, rho), Float64Array.of(c, c, rho - 1), Float64Array.of(rho));
    expectHealthy(r);
    expect(Math.abs(r.omega - Math.sqrt(beta * (sigma + rho)))).toBeLessThan(1e-11);
    expect(Math.abs(r.diagnostics.realPart)).toBeLessThan(1e-11);
    expect(r.l1).toBeGreaterThan(0);
    expect(r.criticality).toBe('subcritical');
  });

  it('gives the same Lorenz l1 sign and size when ρ is a little off ρ_H (vectors at the nearby eigenvalue)', () => {
    // Common practice: a point located to 1e-9 in ρ should change l1 by far less than 1e-6 relative.
    const sigma = 10;
    const beta = 8 / 3;
    const rhoH = 470 / 19;
    const at = (rho: number) => {
      const c = Math.sqrt(beta * (rho - 1));
      return lyapunovCoefficient(lorenz(sigma, beta, rho), Float64Array.of(c, c, rho - 1), Float64Array.of(rho));
    };
    const exact = at(rhoH);
    const near = at(rhoH + 1e-9);
    expect(near.status).toBe('ok');
    expect(Math.abs(near.l1 - exact.l1)).toBeLessThan(1e-6 * Math.abs(exact.l1));
    expect(Math.abs(near.diagnostics.realPart)).toBeGreaterThan(0);
  });
});

describe('lyapunovCoefficient statuses', () => {
  it('returns "no-critical-eigenvalue" when all eigenvalues are real', () => {
    const system = makeSystem({
      n: 2,
      rhs: (x, _p, out) => out.set([-x[0]!, -2 * x[1]!]),
      jacobian: (_x, _p, out) => out.set([-1, 0, 0, -2]),
      secondDerivative: (_x, _p, _u, _v, out) => out.fill(0),
      thirdDerivative: (_x, _p, _u, _v, _w, out) => out.fill(0),
    });
    const r = lyapunovCoefficient(system, origin2, new Float64Array(0));
    expect(r.status).toBe('no-critical-eigenvalue');
    expect(Number.isNaN(r.l1)).toBe(true);
  });

  it('returns "singular" at a zero eigenvalue next to the imaginary pair (A⁻¹ does not exist)', () => {
    // x' = −y, y' = x, w' = w²: eigenvalues ±i and 0, a fold-Hopf point.
    const system = makeSystem({
      n: 3,
      rhs: (x, _p, out) => out.set([-x[1]!, x[0]!, x[2]! ** 2]),
      jacobian: (x, _p, out) => out.set([0, -1, 0, 1, 0, 0, 0, 0, 2 * x[2]!]),
      secondDerivative: (_x, _p, u, v, out) => out.set([0, 0, 2 * u[2]! * v[2]!]),
      thirdDerivative: (_x, _p, _u, _v, _w, out) => out.fill(0),
    });
    const r = lyapunovCoefficient(system, new Float64Array(3), new Float64Array(0));
    expect(r.status).toBe('singular');
    expect(r.criticality).toBe('degenerate');
  });

  it('returns "non-finite" without calling the eigenvalue routine when the Jacobian has NaN', () => {
    const system = makeSystem({
      n: 2,
      rhs: (_x, _p, out) => out.fill(NaN),
      jacobian: (_x, _p, out) => out.set([0, -1, 1, NaN]),
    });
    expect(lyapunovCoefficient(system, origin2, new Float64Array(0)).status).toBe('non-finite');
  });
});
