/**
 * Whether a point with tangent t already lies on a traced branch: within `tol` of the cubic
 * Hermite curve through two consecutive branch points (sampled at 8 sub-steps, which follows the
 * branch to about 1e-3 of the step even where the tangent turns by the largest allowed angle)
 * and moving along it (|cos| of the angle between the tangents above TRACE.sameDirection). The tangent test
 * keeps a crossing branch at a branch point from counting as the same branch.
 */
import { TRACE } from '../defaults.js';
import { hermite } from './hermite.js';
import type { RawPoint } from './rawPoint.js';
import { distance, dot, segmentDistance } from '../linalg/vector.js';

const SAMPLES = 8;

export function onTracedBranch(
  z: Float64Array, t: Float64Array, branches: readonly (readonly RawPoint[])[], tol: (step: number) => number,
): boolean {
  const m = z.length;
  const prev = new Float64Array(m);
  const next = new Float64Array(m);
  for (const points of branches) {
    for (let i = 0; i + 1 < points.length; i++) {
      const a = points[i]!;
      const b = points[i + 1]!;
      const h = distance(a.z, b.z);
      const limit = tol(h);
      if (distance(z, a.z) > 2 * h + limit) continue;
      if (Math.abs(dot(t, a.t)) < TRACE.sameDirection && Math.abs(dot(t, b.t)) < TRACE.sameDirection) continue;
      hermite(a, b, h, 0, prev);
      for (let s = 1; s <= SAMPLES; s++) {
        hermite(a, b, h, s / SAMPLES, next);
        if (segmentDistance(z, prev, next) <= limit) return true;
        prev.set(next);
      }
    }
  }
  return false;
}
