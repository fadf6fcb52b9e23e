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
import { dot } from './workspace.js';

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
      const h = chord(a.z, b.z);
      const limit = tol(h);
      if (chord(z, a.z) > 2 * h + limit) continue;
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

function chord(u: Float64Array, v: Float64Array): number {
  let s = 0;
  for (let j = 0; j < u.length; j++) s += (u[j]! - v[j]!) ** 2;
  return Math.sqrt(s);
}


/** Distance from z to the segment [u, v]. */
function segmentDistance(z: Float64Array, u: Float64Array, v: Float64Array): number {
  let uv = 0;
  let uz = 0;
  for (let j = 0; j < z.length; j++) {
    const d = v[j]! - u[j]!;
    uv += d * d;
    uz += d * (z[j]! - u[j]!);
  }
  const s = uv > 0 ? Math.min(1, Math.max(0, uz / uv)) : 0;
  let r = 0;
  for (let j = 0; j < z.length; j++) r += (z[j]! - u[j]! - s * (v[j]! - u[j]!)) ** 2;
  return Math.sqrt(r);
}
