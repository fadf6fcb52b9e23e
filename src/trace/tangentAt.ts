/**
 * Unit tangent of the branch at a corrected point z (Keller 1977, §3; Allgower & Georg 1990, §2.1):
 * solve the bordered system [F_z(z); rᵀ] τ = e_{n+1} and set t = τ/‖τ‖, so F_z t = 0 and rᵀt > 0.
 * With r the previous tangent, t keeps the orientation of travel.
 *
 * The same factorisation gives the branch-point test function: for the unit null vector t,
 *   det [F_z; rᵀ] = (rᵀt)·det [F_z; tᵀ]
 * (the determinant is linear in the last row and vanishes for rows orthogonal to t), so
 *   τ_bp = det [F_z; tᵀ] changes sign at a simple branch point and not at a fold
 * (Allgower & Georg 1990, §8.1; Kuznetsov, Elements of Applied Bifurcation Theory, 3rd ed., §10.2).
 * It is returned as sign and log|·| so it never overflows.
 */
import { luDeterminant, luFactor, luSolve } from '../linalg/lu.js';
import type { ExtendedSystem } from './extendedSystem.js';
import { dot } from '../linalg/vector.js';
import type { Workspace } from './workspace.js';

export interface TangentOutcome {
  /** False when F_z is not finite or the bordered matrix is exactly singular. */
  ok: boolean;
  /** True when the bordered matrix has an exactly zero pivot (det [F_z; tᵀ] = 0). */
  singular: boolean;
  /** Sign (+1, −1, 0) and log|·| of det [F_z; tᵀ]. */
  detSign: number;
  detLog: number;
}

/** Writes the unit tangent into `t` (may not alias `row`); `ext.jx` then holds f_x at z. */
export function tangentAt(
  ext: ExtendedSystem, z: Float64Array, row: Float64Array, t: Float64Array, work: Workspace,
): TangentOutcome {
  const { n, m } = ext;
  const { a, lu, em } = work;
  if (!ext.jacobian(z, a)) return { ok: false, singular: false, detSign: 0, detLog: -Infinity };
  a.set(row, n * m);
  luFactor(a, m, lu);
  const det = luDeterminant(lu);
  if (lu.singular) return { ok: false, singular: true, detSign: 0, detLog: -Infinity };
  luSolve(lu, em, t);
  const norm = Math.sqrt(dot(t, t));
  if (!Number.isFinite(norm) || norm === 0) return { ok: false, singular: true, detSign: 0, detLog: -Infinity };
  for (let j = 0; j < m; j++) t[j] = t[j]! / norm;
  const along = dot(row, t);
  return { ok: true, singular: false, detSign: det.sign, detLog: det.logAbs - Math.log(Math.abs(along)) };
}
