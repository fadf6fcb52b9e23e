/**
 * Hand-made systems with closed-form Jacobian, B and C for the detection tests
 * (the derivatives are checked against finite differences in detectSystems.test.ts).
 */
import type { System } from '../../src/types.js';
import { makeSystem } from '../helpers/handSystem.js';

type Vec = Float64Array;

/**
 * Hopf normal form in Cartesian coordinates (Kuznetsov 3rd ed. §3.4):
 *   x' = βx − ωy + s·x(x² + y²),   y' = ωx + βy + s·y(x² + y²),   i.e. ż = (β + iω)z + s z|z|².
 * Parameter β. Analytic: with the eigenvector normalised as in src/detect/hopfCoefficient.ts,
 * q = (1, −i)/√2, the complex coordinate is z = w/√2 (w = x + iy), so ż = (β + iω)z + 2s z|z|²:
 * c1 = 2s and l1 = Re(c1)/ω = 2s/ω at β = 0 (see hopfCoefficient.test.ts).
 */
export function hopfNormalForm(s: number, omega = 1): System {
  return makeSystem({
    n: 2,
    parameters: { beta: 0 },
    rhs: (x, p, out) => {
      const r2 = x[0]! ** 2 + x[1]! ** 2;
      out[0] = p[0]! * x[0]! - omega * x[1]! + s * x[0]! * r2;
      out[1] = omega * x[0]! + p[0]! * x[1]! + s * x[1]! * r2;
    },
    jacobian: (x, p, out) => {
      const [u, v] = [x[0]!, x[1]!];
      out.set([p[0]! + s * (3 * u * u + v * v), -omega + 2 * s * u * v, omega + 2 * s * u * v, p[0]! + s * (u * u + 3 * v * v)]);
    },
    paramDerivative: (x, _p, _k, out) => { out[0] = x[0]!; out[1] = x[1]!; },
    mixedDerivative: (_x, _p, _k, v, out) => { out[0] = v[0]!; out[1] = v[1]!; },
    secondDerivative: (x, _p, a, b, out) => {
      // Hessians: f1 = s(x³ + xy²): (6sx, 2sy; 2sy, 2sx); f2 = s(x²y + y³): (2sy, 2sx; 2sx, 6sy).
      const [u, v] = [x[0]!, x[1]!];
      const cross = a[0]! * b[1]! + a[1]! * b[0]!;
      out[0] = s * (6 * u * a[0]! * b[0]! + 2 * v * cross + 2 * u * a[1]! * b[1]!);
      out[1] = s * (2 * v * a[0]! * b[0]! + 2 * u * cross + 6 * v * a[1]! * b[1]!);
    },
    thirdDerivative: (_x, _p, a, b, c, out) => {
      // f1: ∂xxx = 6s, ∂xyy = 2s; f2: ∂yyy = 6s, ∂xxy = 2s.
      const xyy = a[0]! * b[1]! * c[1]! + a[1]! * b[0]! * c[1]! + a[1]! * b[1]! * c[0]!;
      const xxy = a[0]! * b[0]! * c[1]! + a[0]! * b[1]! * c[0]! + a[1]! * b[0]! * c[0]!;
      out[0] = s * (6 * a[0]! * b[0]! * c[0]! + 2 * xyy);
      out[1] = s * (6 * a[1]! * b[1]! * c[1]! + 2 * xxy);
    },
  });
}

/** A 2×2 matrix [[t00, t01], [t10, t11]] applied to v. */
function apply2(t: readonly number[], v: Vec): Vec {
  return Float64Array.of(t[0]! * v[0]! + t[1]! * v[1]!, t[2]! * v[0]! + t[3]! * v[1]!);
}

function inverse2(t: readonly number[]): number[] {
  const det = t[0]! * t[3]! - t[1]! * t[2]!;
  return [t[3]! / det, -t[1]! / det, -t[2]! / det, t[0]! / det];
}

/**
 * The planar system z' = f(z) in coordinates x = T z (T a 2×2 matrix, row-major):
 * g(x) = T f(T⁻¹x), J_g = T J_f T⁻¹, B_g(u, v) = T B_f(T⁻¹u, T⁻¹v), C_g likewise.
 */
export function linearChange(f: System, t: readonly number[]): System {
  const ti = inverse2(t);
  const tmp = new Float64Array(2);
  const jac = new Float64Array(4);
  return makeSystem({
    n: 2,
    parameters: Object.fromEntries(f.info.parameters.map((q) => [q.name, q.value])),
    rhs: (x, p, out) => {
      f.rhs(apply2(ti, x), p, tmp);
      out.set(apply2(t, tmp));
    },
    jacobian: (x, p, out) => {
      f.jacobian(apply2(ti, x), p, jac);
      // (T J T⁻¹)_ij = Σ_kl T_ik J_kl Ti_lj.
      for (let i = 0; i < 2; i++) {
        for (let j = 0; j < 2; j++) {
          let sum = 0;
          for (let k = 0; k < 2; k++) for (let l = 0; l < 2; l++) sum += t[i * 2 + k]! * jac[k * 2 + l]! * ti[l * 2 + j]!;
          out[i * 2 + j] = sum;
        }
      }
    },
    secondDerivative: (x, p, a, b, out) => {
      f.secondDerivative(apply2(ti, x), p, apply2(ti, a), apply2(ti, b), tmp);
      out.set(apply2(t, tmp));
    },
    thirdDerivative: (x, p, a, b, c, out) => {
      f.thirdDerivative(apply2(ti, x), p, apply2(ti, a), apply2(ti, b), apply2(ti, c), tmp);
      out.set(apply2(t, tmp));
    },
  });
}

/**
 * Hopf normal form with a third, stable direction coupled quadratically:
 *   x' = −ωy + α x w + s·x(x² + y²),   y' = ωx + α y w + s·y(x² + y²),   w' = −κ w + γ (x² + y²).
 * Analytic: the centre manifold is w = (γ/κ)(x² + y²) + O(r⁴) (w' = 0 to order r², since r² is
 * conserved by the rotation to that order), so on it ζ = x + iy obeys ζ' = iωζ + (s + αγ/κ) ζ|ζ|².
 * With α = 0 or γ = 0 the third direction is decoupled.
 */
export function coupledHopf(omega: number, alpha: number, gamma: number, kappa: number, s = 0): System {
  const planar = hopfNormalForm(s, omega);
  const xy = new Float64Array(2);
  const two = (v: Vec): Vec => (xy.set([v[0]!, v[1]!]), xy);
  const tmp = new Float64Array(2);
  const jac2 = new Float64Array(4);
  const beta0 = Float64Array.of(0);
  return makeSystem({
    n: 3,
    rhs: (x, _p, out) => {
      planar.rhs(two(x), beta0, tmp);
      out[0] = tmp[0]! + alpha * x[0]! * x[2]!;
      out[1] = tmp[1]! + alpha * x[1]! * x[2]!;
      out[2] = -kappa * x[2]! + gamma * (x[0]! ** 2 + x[1]! ** 2);
    },
    jacobian: (x, _p, out) => {
      planar.jacobian(two(x), beta0, jac2);
      out.set([
        jac2[0]! + alpha * x[2]!, jac2[1]!, alpha * x[0]!,
        jac2[2]!, jac2[3]! + alpha * x[2]!, alpha * x[1]!,
        2 * gamma * x[0]!, 2 * gamma * x[1]!, -kappa,
      ]);
    },
    secondDerivative: (x, _p, a, b, out) => {
      planar.secondDerivative(two(x).slice(), beta0, a.slice(0, 2), b.slice(0, 2), tmp);
      out[0] = tmp[0]! + alpha * (a[0]! * b[2]! + a[2]! * b[0]!);
      out[1] = tmp[1]! + alpha * (a[1]! * b[2]! + a[2]! * b[1]!);
      out[2] = 2 * gamma * (a[0]! * b[0]! + a[1]! * b[1]!);
    },
    thirdDerivative: (x, _p, a, b, c, out) => {
      planar.thirdDerivative(two(x).slice(), beta0, a.slice(0, 2), b.slice(0, 2), c.slice(0, 2), tmp);
      out.set([tmp[0]!, tmp[1]!, 0]);
    },
  });
}

/**
 * Brusselator (Prigogine & Lefever 1968): x' = a − (b + 1)x + x²y, y' = bx − x²y, parameter b.
 * Equilibrium (a, b/a); Hopf at b = 1 + a² with ω = a (trace 0, determinant a²).
 */
export function brusselator(a: number, b: number): System {
  // The cubic x²y: ∂xx = 2y, ∂xy = 2x; ∂xxy = 2. f2 has the opposite nonlinear terms.
  const second = (x: Vec, u: Vec, v: Vec): number => 2 * x[1]! * u[0]! * v[0]! + 2 * x[0]! * (u[0]! * v[1]! + u[1]! * v[0]!);
  const third = (u: Vec, v: Vec, w: Vec): number => 2 * (u[0]! * v[0]! * w[1]! + u[0]! * v[1]! * w[0]! + u[1]! * v[0]! * w[0]!);
  return makeSystem({
    n: 2,
    parameters: { b },
    rhs: (x, p, out) => {
      const x2y = x[0]! ** 2 * x[1]!;
      out[0] = a - (p[0]! + 1) * x[0]! + x2y;
      out[1] = p[0]! * x[0]! - x2y;
    },
    jacobian: (x, p, out) => {
      const [u, v] = [x[0]!, x[1]!];
      out.set([-(p[0]! + 1) + 2 * u * v, u * u, p[0]! - 2 * u * v, -u * u]);
    },
    secondDerivative: (x, _p, u, v, out) => {
      out[0] = second(x, u, v);
      out[1] = -out[0];
    },
    thirdDerivative: (_x, _p, u, v, w, out) => {
      out[0] = third(u, v, w);
      out[1] = -out[0];
    },
  });
}

/** Lorenz (1963): x' = σ(y − x), y' = ρx − y − xz, z' = xy − βz, parameter ρ. */
export function lorenz(sigma: number, beta: number, rho: number): System {
  return makeSystem({
    n: 3,
    parameters: { rho },
    rhs: (x, p, out) => {
      out[0] = sigma * (x[1]! - x[0]!);
      out[1] = p[0]! * x[0]! - x[1]! - x[0]! * x[2]!;
      out[2] = x[0]! * x[1]! - beta * x[2]!;
    },
    jacobian: (x, p, out) => {
      out.set([-sigma, sigma, 0, p[0]! - x[2]!, -1, -x[0]!, x[1]!, x[0]!, -beta]);
    },
    secondDerivative: (_x, _p, u, v, out) => {
      out[0] = 0;
      out[1] = -(u[0]! * v[2]! + u[2]! * v[0]!);
      out[2] = u[0]! * v[1]! + u[1]! * v[0]!;
    },
    thirdDerivative: (_x, _p, _u, _v, _w, out) => out.fill(0),
  });
}
