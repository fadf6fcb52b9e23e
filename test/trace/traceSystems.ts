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

/** The Hopf normal form with parameter index 0 (shared with the detection tests). */
export { hopfNormalForm } from '../detect/detectSystems.js';
