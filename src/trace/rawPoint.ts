/**
 * A corrected point as the walker keeps it: scaled unknown, unit tangent, branch-point test value
 * and eigenvalues. Converted to a `TracePoint` once the branch is finished.
 */
import { eigenvalues } from '../linalg/eig.js';
import type { Eigenvalue, TracePoint } from '../types.js';
import type { ExtendedSystem } from './extendedSystem.js';
import { stabilityOf } from './stabilityOf.js';
import type { TangentOutcome } from './tangentAt.js';

export interface RawPoint {
  /** Scaled unknown (w ⊙ x, λ). */
  z: Float64Array;
  /** Unit tangent in the direction of travel. */
  t: Float64Array;
  /** det [F_z; tᵀ] as sign and log|·|. */
  detSign: number;
  detLog: number;
  eigenvalues: Eigenvalue[];
  residual: number;
  iterations: number;
  step: number;
  /** Scaled arclength along the walk. */
  s: number;
  /**
   * A corner of the model where the branch turns back (corner.ts: pastCorner), between this point and
   * the one it was reached from; kept through reversals, so detectEvents looks on either side.
   */
  corner?: Float64Array;
}

/** A point on a branch with its tangent: all a local model of the branch between two points needs (hermite.ts). */
export type OnBranch = Pick<RawPoint, 'z' | 't'>;

/**
 * Packs a point whose tangent solve just ran (so `ext.jx` holds f_x at z, finite).
 * `z` and `t` are copied.
 */
export function rawPoint(
  ext: ExtendedSystem, z: Float64Array, t: Float64Array, tangent: TangentOutcome,
  diag: { residual: number; iterations: number; step: number; s: number },
): RawPoint {
  return {
    z: z.slice(), t: t.slice(), detSign: tangent.detSign, detLog: tangent.detLog,
    eigenvalues: eigenvalues(ext.jx, ext.n), ...diag,
  };
}

/** The same point seen while travelling the other way (tangent and det [F_z; tᵀ] change sign). */
export function reversedPoint(q: RawPoint): RawPoint {
  const t = q.t.slice();
  for (let j = 0; j < t.length; j++) t[j] = -t[j]!;
  return { ...q, t, detSign: -q.detSign, s: -q.s };
}

export function tracePoint(ext: ExtendedSystem, q: RawPoint, index: number, stabilityTol: number): TracePoint {
  return {
    index, arclength: q.s, parameter: q.z[ext.n]!, state: ext.stateOf(q.z), eigenvalues: q.eigenvalues,
    ...stabilityOf(q.eigenvalues, stabilityTol), residual: q.residual, iterations: q.iterations, step: q.step,
  };
}
