/**
 * Quadratic normal-form coefficient at a fold (saddle-node) point, Kuznetsov, Elements of Applied
 * Bifurcation Theory, 3rd ed., §3.2 and §5.4 (the coefficient a(0) of the equation restricted to the
 * centre manifold; equation number not checked, formula from memory and verified by the tests):
 *
 *   A q = 0,   Aᵀ p = 0,   ⟨p, q⟩ = 1,   ‖q‖₂ = 1,   a = ½ ⟨p, B(q, q)⟩,
 *
 * so that the flow on the centre manifold x = x0 + ξ q + … is ξ' = β + a ξ² + O(ξ³, …).
 * Sign convention: q's largest-magnitude component is positive (the first on ties), which makes
 * the sign of a reproducible; replacing q by −q (and p by −p) flips it. Multiplying q by κ > 0
 * (and p by 1/κ) multiplies a by κ.
 *
 * With `parameterIndex` k, also ⟨p, ∂f/∂p_k⟩, the transversality term: nonzero at a fold, zero at
 * a branch point (where the branch does not turn back but meets another one).
 *
 * The null vectors come from inverse iteration at the real eigenvalue closest to 0
 * (./criticalVectors.ts); that eigenvalue is reported, so a point located only approximately
 * still gives accurate vectors.
 */
import { IMAG_TOL } from '../defaults.js';
import { eigenvalues } from '../linalg/eig.js';
import type { System } from '../types.js';
import { complexSecond, innerProduct } from './complexAlgebra.js';
import { criticalVectors } from './criticalVectors.js';

export type FoldStatus = 'ok' | 'max-iter' | 'no-critical-eigenvalue' | 'singular' | 'non-finite';

export interface FoldOptions {
  /** Also compute ⟨p, ∂f/∂p_k⟩ for this parameter index. */
  parameterIndex?: number;
  /** |Im λ| at most this (times 1 + max |λ|) makes λ real. Default IMAG_TOL (src/defaults.ts). */
  imagTol?: number;
}

export interface FoldDiagnostics {
  /** ‖A q‖∞ with ‖q‖₂ = 1 (≈ |eigenvalue| plus the error of q). */
  residual: number;
  /** ‖Aᵀ p − λ p‖∞ / ‖p‖∞ for the critical eigenvalue λ. */
  adjointResidual: number;
  /** |⟨p, q⟩ − 1|. */
  normalisationError: number;
  iterations: number;
  /** The real eigenvalue closest to 0 (0 at an exact fold). */
  eigenvalue: number;
  /** max_i |Im q_i|: how far the computed q is from real (rounding level when all is well). */
  imaginaryPart: number;
}

export interface FoldResult {
  /** NaN unless status is 'ok' or 'max-iter'. */
  a: number;
  q: Float64Array;
  /** The left null vector p (Aᵀ p = 0, ⟨p, q⟩ = 1). */
  pLeft: Float64Array;
  /** ⟨p, ∂f/∂p_k⟩ when `parameterIndex` was given. */
  transversality?: number;
  status: FoldStatus;
  diagnostics: FoldDiagnostics;
}

/** a = ½⟨p, B(q,q)⟩ at the equilibrium x of `system` at parameters `params`. */
export function foldCoefficient(
  system: System, x: Float64Array, params: Float64Array, opts: FoldOptions = {},
): FoldResult {
  const n = system.n;
  const jac = new Float64Array(n * n);
  system.jacobian(x, params, jac);
  const failed = (status: FoldStatus): FoldResult => ({
    a: NaN, q: new Float64Array(n), pLeft: new Float64Array(n), status,
    diagnostics: {
      residual: NaN, adjointResidual: NaN, normalisationError: NaN, iterations: 0, eigenvalue: NaN, imaginaryPart: NaN,
    },
  });
  if (!jac.every(Number.isFinite) || !x.every(Number.isFinite)) return failed('non-finite');
  const eigs = eigenvalues(jac, n);
  const big = eigs.reduce((m, e) => Math.max(m, Math.hypot(e.re, e.im)), 0);
  const tol = (opts.imagTol ?? IMAG_TOL) * (1 + big);
  let lambda = NaN;
  for (const e of eigs) if (Math.abs(e.im) <= tol && !(Math.abs(e.re) >= Math.abs(lambda))) lambda = e.re;
  if (Number.isNaN(lambda)) return failed('no-critical-eigenvalue');
  const v = criticalVectors(jac, n, { re: lambda, im: 0 });
  if (v.status === 'singular' || v.status === 'non-finite') return failed(v.status);
  const a = 0.5 * innerProduct(v.p, complexSecond(system, x, params, v.q, v.q)).re;
  let imaginaryPart = 0;
  for (let i = 0; i < n; i++) imaginaryPart = Math.max(imaginaryPart, Math.abs(v.q.im[i]!));
  const q = v.q.re;
  const pLeft = v.p.re;
  let residual = 0;
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let j = 0; j < n; j++) s += jac[i * n + j]! * q[j]!;
    residual = Math.max(residual, Math.abs(s));
  }
  const result: FoldResult = {
    a,
    q,
    pLeft,
    status: v.status === 'converged' ? 'ok' : 'max-iter',
    diagnostics: {
      residual,
      adjointResidual: v.adjointResidual,
      normalisationError: v.normalisationError,
      iterations: v.iterations,
      eigenvalue: lambda,
      imaginaryPart,
    },
  };
  if (opts.parameterIndex !== undefined) {
    const fp = new Float64Array(n);
    system.paramDerivative(x, params, opts.parameterIndex, fp);
    let s = 0;
    for (let i = 0; i < n; i++) s += pLeft[i]! * fp[i]!;
    result.transversality = s;
  }
  return result;
}
