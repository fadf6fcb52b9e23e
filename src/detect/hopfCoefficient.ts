/**
 * First Lyapunov coefficient at a Hopf point, by the invariant n-dimensional formula of
 * Kuznetsov, Elements of Applied Bifurcation Theory, 3rd ed., §3.5, eq. (3.20):
 *
 *   A q = iω q,   Aᵀ p = −iω p,   ⟨p, q⟩ = p̄ᵀq = 1,   ‖q‖₂ = 1,
 *   l1 = 1/(2ω) · Re[ ⟨p, C(q,q,q̄)⟩ − 2⟨p, B(q, A⁻¹B(q,q̄))⟩ + ⟨p, B(q̄, (2iωI − A)⁻¹B(q,q))⟩ ].
 *
 * With ‖q‖ = 1, l1 = Re(c1)/ω for ż = iωz + c1 z|z|² on the centre manifold x = x0 + zq + z̄q̄ + …
 * (Kuznetsov 3rd ed. §3.5). l1 < 0: supercritical (a stable cycle is born on the side where the
 * equilibrium is unstable); l1 > 0: subcritical. Multiplying q by κ (and p by 1/κ̄) multiplies l1
 * by |κ|², so only the sign is coordinate-free. Example: x' = −ωy + s·x(x²+y²), y' = ωx + s·y(x²+y²)
 * has q = (1, −i)/√2, x1 + ix2 = √2 z, so c1 = 2s and l1 = 2s/ω (not s/ω).
 *
 * ω is |Im| of the critical pair: the complex eigenvalue closest to the imaginary axis. The null
 * vectors come from inverse iteration at that eigenvalue (./criticalVectors.ts), so a point located
 * to within a small Re λ = μ still gives accurate vectors; μ is reported as `realPart`.
 */
import { DEGENERATE_TOL, IMAG_TOL } from '../defaults.js';
import { eigenvalues } from '../linalg/eig.js';
import type { Criticality, System } from '../types.js';
import {
  type Complex, type ComplexVector, complexSecond, complexThird, conjugate, innerProduct, maxModulus, solveComplex,
} from './complexAlgebra.js';
import { criticalVectors } from './criticalVectors.js';
import { criticalPair } from './hopfTest.js';

export type CoefficientStatus = 'ok' | 'max-iter' | 'no-critical-eigenvalue' | 'singular' | 'non-finite';

export interface LyapunovOptions {
  /** |Im λ| above this (times 1 + ‖λ‖max) makes λ complex. Default IMAG_TOL (src/defaults.ts). */
  imagTol?: number;
  /** 'degenerate' when |l1| ≤ degenerateTol · termScale. Default DEGENERATE_TOL (src/defaults.ts). */
  degenerateTol?: number;
}

export interface LyapunovDiagnostics {
  /** ‖A q − iω q‖∞ (≈ |realPart| plus the error of q). */
  residual: number;
  /** ‖A q − λ q‖∞ for the critical eigenvalue λ = realPart + iω (the error of q alone). */
  eigenResidual: number;
  /** ‖Aᵀ p − λ̄ p‖∞ / ‖p‖∞. */
  adjointResidual: number;
  /** |⟨p, q⟩ − 1|. */
  normalisationError: number;
  /** Inverse-iteration steps for q and p. */
  iterations: number;
  /** Re λ of the critical pair (0 at an exact Hopf point). */
  realPart: number;
  /** (|⟨p,C(q,q,q̄)⟩| + 2|⟨p,B(q,h11)⟩| + |⟨p,B(q̄,h20)⟩|) / (2ω): the size l1 is compared with. */
  termScale: number;
}

export interface LyapunovResult {
  /** NaN unless status is 'ok' or 'max-iter' (vectors usable but not to full accuracy). */
  l1: number;
  omega: number;
  period: number;
  criticality: Criticality;
  q: ComplexVector;
  p: ComplexVector;
  status: CoefficientStatus;
  diagnostics: LyapunovDiagnostics;
}

/** l1 at the equilibrium x of `system` at parameters `params` (see the file comment). */
export function lyapunovCoefficient(
  system: System, x: Float64Array, params: Float64Array, opts: LyapunovOptions = {},
): LyapunovResult {
  const n = system.n;
  const a = new Float64Array(n * n);
  system.jacobian(x, params, a);
  const empty = { re: new Float64Array(n), im: new Float64Array(n) };
  const failed = (status: CoefficientStatus, omega = NaN): LyapunovResult => ({
    l1: NaN, omega, period: 2 * Math.PI / omega, criticality: 'degenerate', q: empty, p: empty, status,
    diagnostics: {
      residual: NaN, eigenResidual: NaN, adjointResidual: NaN, normalisationError: NaN, iterations: 0,
      realPart: NaN, termScale: NaN,
    },
  });
  if (!a.every(Number.isFinite) || !x.every(Number.isFinite)) return failed('non-finite');
  const eigs = eigenvalues(a, n);
  const big = eigs.reduce((m, e) => Math.max(m, Math.hypot(e.re, e.im)), 0);
  const lambda = criticalPair(eigs, (opts.imagTol ?? IMAG_TOL) * (1 + big));
  if (lambda === null) return failed('no-critical-eigenvalue');
  const omega = lambda.im;
  const v = criticalVectors(a, n, lambda);
  if (v.status === 'singular' || v.status === 'non-finite') return failed(v.status, omega);
  const { q, p } = v;
  const qBar = conjugate(q);
  const zero = new Float64Array(n * n);
  // h11 = A⁻¹ B(q, q̄) and h20 = (2iωI − A)⁻¹ B(q, q).
  const h11 = solveComplex(a, zero, n, complexSecond(system, x, params, q, qBar));
  const shiftedRe = a.map((t) => -t);
  const shiftedIm = new Float64Array(n * n);
  for (let i = 0; i < n; i++) shiftedIm[i * n + i] = 2 * omega;
  const h20 = solveComplex(shiftedRe, shiftedIm, n, complexSecond(system, x, params, q, q));
  if (h11 === null || h20 === null) return failed('singular', omega);
  const cubic = innerProduct(p, complexThird(system, x, params, q, q, qBar));
  const fromH11 = innerProduct(p, complexSecond(system, x, params, q, h11));
  const fromH20 = innerProduct(p, complexSecond(system, x, params, qBar, h20));
  const l1 = (cubic.re - 2 * fromH11.re + fromH20.re) / (2 * omega);
  const size = (c: Complex): number => Math.hypot(c.re, c.im);
  const termScale = (size(cubic) + 2 * size(fromH11) + size(fromH20)) / (2 * omega);
  if (!Number.isFinite(l1)) return failed('non-finite', omega);
  const degenerate = Math.abs(l1) <= (opts.degenerateTol ?? DEGENERATE_TOL) * termScale;
  return {
    l1,
    omega,
    period: 2 * Math.PI / omega,
    criticality: degenerate ? 'degenerate' : l1 < 0 ? 'supercritical' : 'subcritical',
    q,
    p,
    status: v.status === 'converged' ? 'ok' : 'max-iter',
    diagnostics: {
      residual: hopfResidual(a, n, omega, q),
      eigenResidual: v.residual,
      adjointResidual: v.adjointResidual,
      normalisationError: v.normalisationError,
      iterations: v.iterations,
      realPart: lambda.re,
      termScale,
    },
  };
}

/** ‖A q − iω q‖∞. */
function hopfResidual(a: Float64Array, n: number, omega: number, q: ComplexVector): number {
  const r = { re: new Float64Array(n), im: new Float64Array(n) };
  for (let i = 0; i < n; i++) {
    let re = omega * q.im[i]!;
    let im = -omega * q.re[i]!;
    for (let j = 0; j < n; j++) {
      re += a[i * n + j]! * q.re[j]!;
      im += a[i * n + j]! * q.im[j]!;
    }
    r.re[i] = re;
    r.im[i] = im;
  }
  return maxModulus(r);
}
