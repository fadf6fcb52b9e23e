/**
 * Newton's method on a regular augmented system for a simple branch point z* of F: R^{n+1} → R^n,
 * started near it. Unknowns Y = (z ∈ R^{n+1}, β ∈ R, ψ ∈ R^n), 2n + 2 equations:
 *
 *   F(z) + β ψ = 0,   F_z(z)ᵀ ψ = 0,   (ψᵀψ − 1)/2 = 0,
 *
 * with the Jacobian (H(ψ)_{jl} = Σ_i ψ_i ∂²F_i/∂z_j∂z_l)
 *
 *   [ F_z   ψ   βI   ]
 *   [ H(ψ)  0   F_zᵀ ]
 *   [ 0     0   ψᵀ   ].
 *
 * At a simple branch point (rank F_z = n − 1, null space span{t, φ}, left null vector ψ*, and the
 * 2×2 form Q = [ψ*ᵀF_zz[u, v]] on that null space nonsingular, i.e. the two branches cross
 * transversally) (z*, 0, ψ*) solves the system and the Jacobian is nonsingular. Derivation: let
 * (dz, dβ, dψ) be in its kernel. Row block 1 times ψ*ᵀ gives dβ = 0, so F_z dz = 0 and
 * dz = α t + γ φ. Row block 2 says F_zᵀ dψ = −H dz; the range of F_zᵀ is {t, φ}^⊥, so
 * Q (α, γ) = 0 and α = γ = 0. Then F_zᵀ dψ = 0 gives dψ ∥ ψ*, and the last row gives dψ = 0.
 * So Newton converges quadratically near z*, unlike a corrector on the branch, whose hyperplane
 * meets both branches there in a double root and whose point is determined only to about
 * rounding / |σ − σ*| (σ the arclength from z*).
 *
 * H(ψ) is formed column by column from central differences of the gradient F_zᵀψ (2(n+1)
 * Jacobian evaluations per step): an approximate Jacobian slows Newton only by a factor of the
 * difference error per step; the residual, and so the located point, is exact.
 *
 * Stops when the Newton step ‖dY‖∞ ≤ `stepTol` with ‖F(z)‖∞ ≤ absTol ('converged'), or fails with
 * 'singular', 'non-finite', 'stalled' (a step grew, or z left the ball of radius `maxDistance`
 * around the start) or 'max-iter'.
 */
import { luFactor, luSolve, type LuFactors } from '../linalg/lu.js';
import { normInf } from '../linalg/norm.js';
import type { SolveStatus } from '../types.js';
import type { ExtendedSystem } from './extendedSystem.js';
import { distance } from '../linalg/vector.js';

export interface RefinedBranchPoint {
  status: SolveStatus;
  /** The branch point (scaled unknown). */
  z: Float64Array;
  /** Unit left null vector of F_z at z. */
  psi: Float64Array;
  /** ‖F(z)‖∞. */
  residual: number;
  iterations: number;
  lastStep: number;
}

export interface RefineOptions {
  absTol: number;
  maxIter: number;
  stepTol: number;
  maxDistance: number;
}

/** `z0` is a point near the branch point, `psi0` an approximate left null vector of F_z there. */
export function refineBranchPoint(
  ext: ExtendedSystem, z0: Float64Array, psi0: Float64Array, opts: RefineOptions,
): RefinedBranchPoint {
  const { n, m } = ext;
  const size = 2 * n + 2;
  const z = Float64Array.from(z0);
  const psi = Float64Array.from(psi0.subarray(0, n));
  normaliseInPlace(psi);
  const f = new Float64Array(n);
  const jac = new Float64Array(m * m);
  const jPlus = new Float64Array(m * m);
  const jMinus = new Float64Array(m * m);
  const big = new Float64Array(size * size);
  const rhs = new Float64Array(size);
  const step = new Float64Array(size);
  const zShift = new Float64Array(m);
  const lu: LuFactors = { n: size, lu: new Float64Array(size * size), perm: new Int32Array(size), permSign: 1, singular: false };
  if (!ext.residual(z, f)) return failed('non-finite', 0, Infinity, Infinity);
  let beta = -dotN(psi, f, n);
  let lastStep = Infinity;
  let previousStep = Infinity;
  for (let it = 0; ; it++) {
    if (!ext.residual(z, f)) return failed('non-finite', it, Infinity, lastStep);
    const residual = normInf(f);
    if (lastStep <= opts.stepTol && residual <= opts.absTol) {
      return { status: 'converged', z, psi, residual, iterations: it, lastStep };
    }
    if (it >= opts.maxIter) return failed('max-iter', it, residual, lastStep);
    if (!ext.jacobian(z, jac)) return failed('non-finite', it, residual, lastStep);
    // Residual: rows 0..n−1 F + βψ; rows n..2n F_zᵀψ; row 2n+1 (ψᵀψ − 1)/2.
    for (let i = 0; i < n; i++) rhs[i] = f[i]! + beta * psi[i]!;
    for (let j = 0; j < m; j++) {
      let s = 0;
      for (let i = 0; i < n; i++) s += jac[i * m + j]! * psi[i]!;
      rhs[n + j] = s;
    }
    rhs[size - 1] = 0.5 * (dotN(psi, psi, n) - 1);
    big.fill(0);
    // Block rows 0..n−1: [F_z | ψ | βI].
    for (let i = 0; i < n; i++) {
      const row = i * size;
      for (let j = 0; j < m; j++) big[row + j] = jac[i * m + j]!;
      big[row + m] = psi[i]!;
      big[row + m + 1 + i] = beta;
    }
    // Block rows n..2n: [H(ψ) | 0 | F_zᵀ]; column l of H by central differences of F_zᵀψ.
    for (let l = 0; l < m; l++) {
      const h = 1e-6 * Math.max(1, Math.abs(z[l]!));
      zShift.set(z);
      zShift[l] = z[l]! + h;
      if (!ext.jacobian(zShift, jPlus)) return failed('non-finite', it, residual, lastStep);
      zShift[l] = z[l]! - h;
      if (!ext.jacobian(zShift, jMinus)) return failed('non-finite', it, residual, lastStep);
      for (let j = 0; j < m; j++) {
        let s = 0;
        for (let i = 0; i < n; i++) s += (jPlus[i * m + j]! - jMinus[i * m + j]!) * psi[i]!;
        big[(n + j) * size + l] = s / (2 * h);
      }
    }
    for (let j = 0; j < m; j++) {
      const row = (n + j) * size;
      for (let i = 0; i < n; i++) big[row + m + 1 + i] = jac[i * m + j]!;
    }
    // Last row: [0 | 0 | ψᵀ].
    for (let i = 0; i < n; i++) big[(size - 1) * size + m + 1 + i] = psi[i]!;
    luFactor(big, size, lu);
    if (lu.singular) return failed('singular', it, residual, lastStep);
    luSolve(lu, rhs, step);
    for (let j = 0; j < m; j++) z[j] = z[j]! - step[j]!;
    beta -= step[m]!;
    for (let i = 0; i < n; i++) psi[i] = psi[i]! - step[m + 1 + i]!;
    previousStep = lastStep;
    lastStep = normInf(step);
    if (!Number.isFinite(lastStep)) return failed('non-finite', it + 1, residual, lastStep);
    if ((it > 1 && lastStep > previousStep && lastStep > opts.stepTol) || distance(z, z0) > opts.maxDistance) {
      return failed('stalled', it + 1, residual, lastStep);
    }
  }

  function failed(status: SolveStatus, iterations: number, residual: number, last: number): RefinedBranchPoint {
    return { status, z, psi, residual, iterations, lastStep: last };
  }
}

function dotN(u: Float64Array, v: Float64Array, n: number): number {
  let s = 0;
  for (let i = 0; i < n; i++) s += u[i]! * v[i]!;
  return s;
}

function normaliseInPlace(v: Float64Array): void {
  const r = Math.sqrt(dotN(v, v, v.length));
  if (r > 0 && Number.isFinite(r)) for (let i = 0; i < v.length; i++) v[i] = v[i]! / r;
}
