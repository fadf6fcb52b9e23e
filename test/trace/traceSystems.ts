/**
 * Small systems with closed-form equilibrium branches for the continuation tests, written out by
 * hand (rhs, Jacobian, ∂f/∂λ and the second derivative exact; the rest by the central
 * differences of test/helpers/handSystem.ts). The varied parameter is always index 0.
 */
import type { System } from '../../src/types.js';
import { makeSystem } from '../helpers/handSystem.js';

/** One state: x' = g(x, λ) with g, g_x, g_λ and g_xx. */
export function scalarSystem(
  g: (x: number, l: number) => number, gx: (x: number, l: number) => number,
  gl: (x: number, l: number) => number, gxx: (x: number, l: number) => number, gxl: (x: number, l: number) => number,
): System {
  return makeSystem({
    n: 1,
    parameters: { lambda: 0 },
    rhs: (x, p, out) => { out[0] = g(x[0]!, p[0]!); },
    jacobian: (x, p, out) => { out[0] = gx(x[0]!, p[0]!); },
    paramDerivative: (x, p, _k, out) => { out[0] = gl(x[0]!, p[0]!); },
    secondDerivative: (x, p, u, v, out) => { out[0] = gxx(x[0]!, p[0]!) * u[0]! * v[0]!; },
    mixedDerivative: (x, p, _k, v, out) => { out[0] = gxl(x[0]!, p[0]!) * v[0]!; },
  });
}

/** x' = g(x, λ), y' = −y: the same branches, with a stable direction added. */
export function withStableDirection(
  g: (x: number, l: number) => number, gx: (x: number, l: number) => number, gl: (x: number, l: number) => number,
): System {
  return makeSystem({
    n: 2,
    parameters: { lambda: 0 },
    rhs: (x, p, out) => { out[0] = g(x[0]!, p[0]!); out[1] = -x[1]!; },
    jacobian: (x, p, out) => { out.set([gx(x[0]!, p[0]!), 0, 0, -1]); },
    paramDerivative: (x, p, _k, out) => { out[0] = gl(x[0]!, p[0]!); out[1] = 0; },
  });
}

/**
 * Hopf normal form x' = μx − ωy + s·x(x²+y²), y' = ωx + μy + s·y(x²+y²), parameter μ.
 * In w = x + iy: w' = (μ + iω)w + s·w|w|².
 */
export function hopfNormalForm(s: number, omega: number): System {
  return makeSystem({
    n: 2,
    parameters: { mu: 0 },
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
    secondDerivative: (x, _p, a, b, out) => {
      const [u, v] = [x[0]!, x[1]!];
      const cross = a[0]! * b[1]! + a[1]! * b[0]!;
      out[0] = s * (6 * u * a[0]! * b[0]! + 2 * v * cross + 2 * u * a[1]! * b[1]!);
      out[1] = s * (2 * v * a[0]! * b[0]! + 2 * u * cross + 6 * v * a[1]! * b[1]!);
    },
    thirdDerivative: (_x, _p, a, b, c, out) => {
      const xyy = a[0]! * b[1]! * c[1]! + a[1]! * b[0]! * c[1]! + a[1]! * b[1]! * c[0]!;
      const xxy = a[0]! * b[0]! * c[1]! + a[0]! * b[1]! * c[0]! + a[1]! * b[0]! * c[0]!;
      out[0] = s * (6 * a[0]! * b[0]! * c[0]! + 2 * xyy);
      out[1] = s * (6 * a[1]! * b[1]! * c[1]! + 2 * xxy);
    },
    mixedDerivative: (_x, _p, _k, v, out) => { out[0] = v[0]!; out[1] = v[1]!; },
  });
}
