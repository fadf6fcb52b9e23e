/**
 * Type of a planar equilibrium from the trace τ and determinant Δ of its Jacobian (the
 * trace–determinant plane; e.g. Strogatz, Nonlinear Dynamics and Chaos, 2nd ed., §5.2).
 * Eigenvalues λ = (τ ± √(τ² − 4Δ))/2.
 *
 * Tolerances are relative to `scale` (the size of the eigenvalues, see classify.ts): |Δ| and
 * |τ² − 4Δ| are compared with PLANAR_TOL·scale², |τ| with 2·PLANAR_TOL·scale (Re λ = τ/2 on a
 * focus, so this matches the eigenvalue test |Re λ| ≤ PLANAR_TOL·scale). Common practice.
 *
 *   |Δ| ≈ 0                → 'degenerate' (a zero eigenvalue; the linear test says nothing)
 *   Δ < 0                  → 'saddle'
 *   Δ > 0, τ ≈ 0           → 'centre-type' (purely imaginary pair; linear test inconclusive)
 *   Δ > 0, τ² − 4Δ < 0     → 'stable focus' (τ < 0) / 'unstable focus' (τ > 0)
 *   Δ > 0, τ² − 4Δ ≥ 0     → 'stable node' / 'unstable node' (τ² = 4Δ, a star or degenerate node, counts as node)
 */
import type { EquilibriumType } from '../types.js';

export const PLANAR_TOL = 1e-9;

export function classifyPlanar(trace: number, det: number, scale: number): EquilibriumType {
  const tol2 = PLANAR_TOL * scale * scale;
  if (Math.abs(det) <= tol2) return 'degenerate';
  if (det < 0) return 'saddle';
  if (Math.abs(trace) <= 2 * PLANAR_TOL * scale) return 'centre-type';
  const discriminant = trace * trace - 4 * det;
  if (discriminant < -tol2) return trace < 0 ? 'stable focus' : 'unstable focus';
  return trace < 0 ? 'stable node' : 'unstable node';
}
