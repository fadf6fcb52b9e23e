/**
 * Locates the zero of a test function g between two consecutive branch points a and b.
 * Parameterisation: σ ∈ [0, σ_b] along a's tangent, σ_b = t_aᵀ(z_b − z_a); each trial σ is
 * predicted on the cubic Hermite curve through a and b (close to the branch, which matters next
 * to a branch point, where the corrector's matrix is nearly singular and a poor prediction can
 * jump to the crossing branch) and corrected onto the branch on the hyperplane
 * t_aᵀ(z − z_a − σ t_a) = 0 (correctPoint.ts), the
 * tangent is recomputed there, and g is evaluated; the scalar root is found by Brent's method
 * (locateRoot.ts). For a fold, g = t_λ; its zero is quadratic in λ, so the parameter is found to
 * about the square of the arclength tolerance (the bracketing approach of Allgower & Georg 1990,
 * §9.1 applied to the test functions of Kuznetsov, 3rd ed., §10.2). Branch points use this only
 * to narrow the bracket, then finish with Newton on an augmented system (locateBranchPoint.ts):
 * the corrected points themselves become ill-determined next to a branch point.
 */
import { locateRoot, type RootStatus } from '../detect/locateRoot.js';
import { correctPoint } from './correctPoint.js';
import type { ExtendedSystem } from './extendedSystem.js';
import { hermite } from './hermite.js';
import type { OnBranch } from './rawPoint.js';
import { tangentAt, type TangentOutcome } from './tangentAt.js';
import { dot } from '../linalg/vector.js';
import type { Workspace } from './workspace.js';

/** Test function at a corrected point z with unit tangent t (`ext.jx` holds f_x at z). */
export type BranchTest = (z: Float64Array, t: Float64Array, tangent: TangentOutcome) => number;

export interface Located {
  status: RootStatus | 'not-corrected';
  z: Float64Array;
  t: Float64Array;
  tangent: TangentOutcome;
  /** ‖F‖∞ at z. */
  residual: number;
  /** Arclength σ of the root estimate along a's tangent (from a). */
  s: number;
  /** Test-function evaluations of the root finder. */
  iterations: number;
  g: number;
}

export function locateOnBranch(
  ext: ExtendedSystem, work: Workspace, a: OnBranch, b: OnBranch, test: BranchTest,
  gA: number, gB: number, opts: { absTol: number; maxIter: number; tol: number; rootMaxIter: number },
): Located {
  const { m } = ext;
  const z = new Float64Array(m);
  const zHat = new Float64Array(m);
  const t = new Float64Array(m);
  const zb = new Float64Array(m);
  for (let j = 0; j < m; j++) zb[j] = b.z[j]! - a.z[j]!;
  const sigmaB = dot(a.t, zb);
  // Through a branch point the hyperplane meets the branch in a double root: Newton converges only
  // linearly there (the step halves), hence the generous iteration count and a step tolerance of
  // 100·tol, which still leaves the located parameter accurate to about 1e-9 relative at worst.
  const correction = {
    absTol: opts.absTol, maxIter: 6 * opts.maxIter, maxDistance: 2 * Math.abs(sigmaB) + 1e-300, stepTol: 100 * opts.tol,
  };
  let residual = NaN;
  let tangent: TangentOutcome = { ok: false, singular: false, detSign: 0, detLog: -Infinity };
  // Exactly at a branch point the corrector's matrix is singular to rounding and its step blows up;
  // the test function is then taken a little to the side (it is continuous and zero at the point).
  const nudge = 10 * opts.tol;
  const evaluate = (sigma: number): number => {
    const g = evaluateAt(sigma);
    if (!Number.isNaN(g)) return g;
    const side = sigma + nudge <= sigmaB ? sigma + nudge : sigma - nudge;
    return evaluateAt(side);
  };
  const evaluateAt = (sigma: number): number => {
    // Prediction on the cubic Hermite curve through a and b, moved along t_a onto the hyperplane;
    // if that does not correct, the plain Euler prediction z_a + σ t_a.
    predictOnBranch(a, b, sigma, z);
    let c = correctPoint(ext, z, zHat, a.t, correction, work);
    if (c.status !== 'converged') {
      for (let j = 0; j < m; j++) z[j] = a.z[j]! + sigma * a.t[j]!;
      c = correctPoint(ext, z, zHat, a.t, correction, work);
    }
    residual = c.residual;
    if (c.status !== 'converged') return NaN;
    tangent = tangentAt(ext, z, a.t, t, work);
    return test(z, t, tangent);
  };
  const root = locateRoot(evaluate, 0, sigmaB, gA, gB, { tol: opts.tol, maxIter: opts.rootMaxIter });
  const g = evaluate(root.s);
  const status = Number.isNaN(g) ? 'not-corrected' : root.status;
  return { status, z, t, tangent, residual, s: root.s, iterations: root.iterations, g };
}

/**
 * The prediction of the point at arclength σ along a's tangent: the cubic Hermite curve through a
 * and b, moved along t_a onto the hyperplane t_aᵀ(z − z_a) = σ. Writes into `out`.
 */
export function predictOnBranch(a: OnBranch, b: OnBranch, sigma: number, out: Float64Array): Float64Array {
  const m = out.length;
  let sigmaB = 0;
  let chord = 0;
  for (let j = 0; j < m; j++) {
    const d = b.z[j]! - a.z[j]!;
    sigmaB += a.t[j]! * d;
    chord += d * d;
  }
  hermite(a, b, Math.sqrt(chord), sigmaB === 0 ? 0 : sigma / sigmaB, out);
  let off = sigma;
  for (let j = 0; j < m; j++) off -= a.t[j]! * (out[j]! - a.z[j]!);
  for (let j = 0; j < m; j++) out[j] = out[j]! + off * a.t[j]!;
  return out;
}

